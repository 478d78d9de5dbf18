-- The derived series' rollups (V64) leave the ingest transaction: recomputing them there from the evaluations
-- just written cost about a third of the ingest rate. The ingest now only marks each (point, UTC hour) it wrote
-- evaluations in; EvaluationRollups.settle recomputes marked hours a few seconds later, off the ingest path,
-- deleting the marks in the same transaction (before it reads, so a mark made meanwhile stays for the next
-- round). Readers take a marked hour, and the day around it, from the evaluations themselves, so an answer
-- never depends on whether the hour has been settled yet.
CREATE TABLE evaluation_rollup_pending (
    sample_point_id  text         NOT NULL,
    bucket           timestamptz  NOT NULL,
    PRIMARY KEY (sample_point_id, bucket)
);

-- Settling always recomputes its hours from evaluation, so the append path of V64's update_evaluation_rollups
-- (hours taking in new values without being read again) has no caller any more: one function that recomputes
-- the given (point, hour) pairs and their days replaces it. The overall range is written into the statement
-- as literals, so that the planner keeps only the daily partitions of evaluation in it.
DROP FUNCTION refresh_evaluation_rollups(timestamptz, timestamptz);
DROP FUNCTION update_evaluation_rollups(text[], timestamptz[], timestamptz[]);

CREATE FUNCTION settle_evaluation_rollups(points text[], hours timestamptz[])
RETURNS void LANGUAGE plpgsql AS $fn$
DECLARE
    lo timestamptz;
    hi timestamptz;
BEGIN
    SELECT min(h), max(h) + interval '1 hour' INTO lo, hi FROM unnest(hours) AS u(h);
    IF lo IS NULL THEN
        RETURN;
    END IF;
    EXECUTE format($sql$
    INSERT INTO evaluation_rollup_hour AS o (sample_point_id, parameter, bucket, count, min, max, sum, last,
                                             first_time, last_time)
    SELECT t.p, x.parameter, t.h, count(x.v)::int, min(x.v), max(x.v), sum(x.v),
           (array_agg(x.v ORDER BY e.time DESC) FILTER (WHERE x.v IS NOT NULL))[1],
           min(e.time) FILTER (WHERE x.v IS NOT NULL), max(e.time) FILTER (WHERE x.v IS NOT NULL)
    FROM (SELECT DISTINCT * FROM unnest($1, $2)) AS t(p, h)
    JOIN evaluation e ON e.sample_point_id = t.p AND e.time >= t.h AND e.time < t.h + interval '1 hour'
                     AND e.time >= %L AND e.time < %L
    CROSS JOIN LATERAL evaluation_values(e) x
    GROUP BY t.p, x.parameter, t.h
    ON CONFLICT (sample_point_id, parameter, bucket) DO UPDATE
        SET count = EXCLUDED.count, min = EXCLUDED.min, max = EXCLUDED.max, sum = EXCLUDED.sum,
            last = EXCLUDED.last, first_time = EXCLUDED.first_time, last_time = EXCLUDED.last_time
    $sql$, lo, hi) USING points, hours;

    INSERT INTO evaluation_rollup_day AS o (sample_point_id, parameter, bucket, count, min, max, sum, last,
                                            first_time, last_time)
    SELECT h.sample_point_id, h.parameter, t.d, sum(h.count)::int, min(h.min), max(h.max), sum(h.sum),
           (array_agg(h.last ORDER BY h.last_time DESC) FILTER (WHERE h.count > 0))[1],
           min(h.first_time), max(h.last_time)
    FROM (SELECT DISTINCT u.p, date_trunc('day', u.h, 'UTC') FROM unnest(points, hours) AS u(p, h)) AS t(p, d)
    JOIN evaluation_rollup_hour h ON h.sample_point_id = t.p AND h.bucket >= t.d AND h.bucket < t.d + interval '1 day'
    GROUP BY h.sample_point_id, h.parameter, t.d
    ON CONFLICT (sample_point_id, parameter, bucket) DO UPDATE
        SET count = EXCLUDED.count, min = EXCLUDED.min, max = EXCLUDED.max, sum = EXCLUDED.sum,
            last = EXCLUDED.last, first_time = EXCLUDED.first_time, last_time = EXCLUDED.last_time;
END
$fn$;

-- Recomputes the rollups of every point with evaluations in [from_time, to_time), whole hours, one UTC day
-- per call: after bulk loads or SQL by hand, which bypass the ingest's marks.
CREATE FUNCTION refresh_evaluation_rollups(from_time timestamptz, to_time timestamptz)
RETURNS void LANGUAGE plpgsql AS $fn$
DECLARE
    lo timestamptz;
    hi timestamptz;
    d timestamptz;
BEGIN
    SELECT min(time), max(time) INTO lo, hi FROM evaluation
    WHERE time >= date_trunc('hour', from_time, 'UTC') AND time < to_time;
    d := date_trunc('day', lo, 'UTC');
    WHILE d <= hi LOOP
        PERFORM settle_evaluation_rollups(array_agg(p), array_agg(h))
        FROM (SELECT DISTINCT sample_point_id, date_trunc('hour', time, 'UTC')
              FROM evaluation
              WHERE time >= greatest(d, date_trunc('hour', from_time, 'UTC'))
                AND time < least(d + interval '1 day', to_time)) AS r(p, h);
        d := d + interval '1 day';
    END LOOP;
END
$fn$;
