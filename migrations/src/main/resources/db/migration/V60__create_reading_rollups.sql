-- Rollups for long trends: per series (sample point × parameter), per UTC hour and per UTC day, the good and
-- uncertain readings (quality < 2, as the bucketed series counts them) summed up. The ingest keeps them in step
-- in its own transaction (docs/ingest.md): new readings that follow a bucket's last one are added to its row,
-- other touched hours are recomputed from reading and other touched days from their hours
-- (update_reading_rollups). Rows outlive the raw readings' retention.
--
-- count    readings (quality < 2); 0 when a correction left the bucket without any (aggregates NULL)
-- sum      their sum, so that buckets combine into larger ones (mean = sum / count)
-- last     the value of the latest one (at last_time)
-- tw_sum   value × seconds held: each reading holds until the next one of the bucket, the last one until
--          the bucket's end (sample and hold)
-- held_seconds  from first_time to the bucket's end; time_weighted_mean = tw_sum / held_seconds
CREATE TABLE reading_rollup_hour (
    sample_point_id     text             NOT NULL,
    parameter           text             NOT NULL,
    bucket              timestamptz      NOT NULL,
    count               integer          NOT NULL,
    min                 double precision,
    max                 double precision,
    sum                 double precision,
    last                double precision,
    first_time          timestamptz,
    last_time           timestamptz,
    tw_sum              double precision,
    held_seconds        double precision,
    mean                double precision GENERATED ALWAYS AS (sum / nullif(count, 0)) STORED,
    time_weighted_mean  double precision GENERATED ALWAYS AS (tw_sum / nullif(held_seconds, 0)) STORED,
    PRIMARY KEY (sample_point_id, parameter, bucket)
);

CREATE TABLE reading_rollup_day (
    sample_point_id     text             NOT NULL,
    parameter           text             NOT NULL,
    bucket              timestamptz      NOT NULL,
    count               integer          NOT NULL,
    min                 double precision,
    max                 double precision,
    sum                 double precision,
    last                double precision,
    first_time          timestamptz,
    last_time           timestamptz,
    tw_sum              double precision,
    held_seconds        double precision,
    mean                double precision GENERATED ALWAYS AS (sum / nullif(count, 0)) STORED,
    time_weighted_mean  double precision GENERATED ALWAYS AS (tw_sum / nullif(held_seconds, 0)) STORED,
    PRIMARY KEY (sample_point_id, parameter, bucket)
);

-- Keeps the rollups in step with one ingest transaction, called once after its readings are written:
--   new_*   per hour, the aggregates of the readings new in this transaction (good or uncertain; summed up
--           by the service, columns as in reading_rollup_hour), added to the hour's row without reading the
--           hour again when they all lie after its last reading (live data); otherwise the hour is
--           recomputed (the service leaves out hours it recomputes anyway);
--   points, parameters, hours: hours recomputed from reading (corrections, readings of the plain path);
--   day_*   the same per day: added to the day's row likewise when none of its hours was recomputed;
-- then every other touched day is recomputed from its hours. After writing reading by hand, call
-- refresh_reading_rollups(from, to). The recomputed hours' overall range is written into the statement as
-- literals, so that the planner keeps only the daily partitions of reading in that range (a parameter of a
-- lateral subquery alone would leave every partition in the plan and prune them only when running).
CREATE FUNCTION update_reading_rollups(points text[], parameters text[], hours timestamptz[],
                                       new_points text[] DEFAULT '{}', new_parameters text[] DEFAULT '{}',
                                       new_hours timestamptz[] DEFAULT '{}', new_counts int[] DEFAULT '{}',
                                       new_mins float8[] DEFAULT '{}', new_maxs float8[] DEFAULT '{}',
                                       new_sums float8[] DEFAULT '{}', new_lasts float8[] DEFAULT '{}',
                                       new_first_times timestamptz[] DEFAULT '{}',
                                       new_last_times timestamptz[] DEFAULT '{}',
                                       new_tw_sums float8[] DEFAULT '{}',
                                       day_points text[] DEFAULT '{}', day_parameters text[] DEFAULT '{}',
                                       days timestamptz[] DEFAULT '{}', day_counts int[] DEFAULT '{}',
                                       day_mins float8[] DEFAULT '{}', day_maxs float8[] DEFAULT '{}',
                                       day_sums float8[] DEFAULT '{}', day_lasts float8[] DEFAULT '{}',
                                       day_first_times timestamptz[] DEFAULT '{}',
                                       day_last_times timestamptz[] DEFAULT '{}',
                                       day_tw_sums float8[] DEFAULT '{}')
RETURNS void LANGUAGE plpgsql AS $fn$
DECLARE
    lo timestamptz;
    hi timestamptz;
    rp text[];
    rq text[];
    rh timestamptz[];
    fp text[];
    fq text[];
    fd timestamptz[];
BEGIN
    -- new readings appended to their hours
    WITH a AS (
        SELECT * FROM unnest(new_points, new_parameters, new_hours, new_counts, new_mins, new_maxs, new_sums,
                             new_lasts, new_first_times, new_last_times, new_tw_sums)
            AS u(p, q, h, n, mn, mx, sm, l, ft, lt, tw)
    ), done AS (
        INSERT INTO reading_rollup_hour AS o (sample_point_id, parameter, bucket, count, min, max, sum, last,
                                              first_time, last_time, tw_sum, held_seconds)
        SELECT a.p, a.q, a.h, a.n, a.mn, a.mx, a.sm, a.l, a.ft, a.lt, a.tw,
               extract(epoch FROM a.h + interval '1 hour' - a.ft)::float8
        FROM a
        ON CONFLICT (sample_point_id, parameter, bucket) DO UPDATE
            SET count = o.count + EXCLUDED.count, min = least(o.min, EXCLUDED.min),
                max = greatest(o.max, EXCLUDED.max), sum = coalesce(o.sum, 0) + EXCLUDED.sum,
                last = EXCLUDED.last, first_time = coalesce(o.first_time, EXCLUDED.first_time),
                last_time = EXCLUDED.last_time,
                -- the old last value held until the first new reading instead of the hour's end
                tw_sum = CASE WHEN o.count = 0 THEN EXCLUDED.tw_sum
                              ELSE o.tw_sum + EXCLUDED.tw_sum - o.last * extract(epoch FROM
                                   o.bucket + interval '1 hour' - EXCLUDED.first_time)::float8 END,
                held_seconds = coalesce(o.held_seconds, EXCLUDED.held_seconds)
            WHERE o.count = 0 OR o.last_time < EXCLUDED.first_time
        RETURNING sample_point_id, parameter, bucket
    )
    SELECT array_agg(a.p) FILTER (WHERE d.bucket IS NULL), array_agg(a.q) FILTER (WHERE d.bucket IS NULL),
           array_agg(a.h) FILTER (WHERE d.bucket IS NULL)
    INTO rp, rq, rh
    FROM a LEFT JOIN done d ON d.sample_point_id = a.p AND d.parameter = a.q AND d.bucket = a.h;

    -- hours recomputed from reading: those asked for, and new readings' hours that were not appended
    points := coalesce(points, '{}') || coalesce(rp, '{}');
    parameters := coalesce(parameters, '{}') || coalesce(rq, '{}');
    hours := coalesce(hours, '{}') || coalesce(rh, '{}');
    SELECT min(h), max(h) + interval '1 hour' INTO lo, hi FROM unnest(hours) AS u(h);
    IF lo IS NOT NULL THEN
    EXECUTE format($sql$
    INSERT INTO reading_rollup_hour AS o (sample_point_id, parameter, bucket, count, min, max, sum, last,
                                          first_time, last_time, tw_sum, held_seconds)
    SELECT t.p, t.q, t.h, a.n, a.mn, a.mx, a.s, a.l, a.ft, a.lt, a.tw,
           extract(epoch FROM t.h + interval '1 hour' - a.ft)::float8
    FROM (SELECT DISTINCT * FROM unnest($1, $2, $3)) AS t(p, q, h)
    CROSS JOIN LATERAL (
        SELECT count(*)::int AS n, min(v) AS mn, max(v) AS mx, sum(v) AS s,
               max(v) FILTER (WHERE nt IS NULL) AS l, min(time) AS ft, max(time) AS lt,
               sum(v * extract(epoch FROM coalesce(nt, t.h + interval '1 hour') - time)::float8) AS tw
        FROM (SELECT time, value AS v, lead(time) OVER (ORDER BY time) AS nt
              FROM reading
              WHERE sample_point_id = t.p AND parameter = t.q
                AND time >= %L AND time < %L
                AND time >= t.h AND time < t.h + interval '1 hour' AND quality < 2) s
    ) a
    ON CONFLICT (sample_point_id, parameter, bucket) DO UPDATE
        SET count = EXCLUDED.count, min = EXCLUDED.min, max = EXCLUDED.max, sum = EXCLUDED.sum,
            last = EXCLUDED.last, first_time = EXCLUDED.first_time, last_time = EXCLUDED.last_time,
            tw_sum = EXCLUDED.tw_sum, held_seconds = EXCLUDED.held_seconds
    $sql$, lo, hi) USING points, parameters, hours;
    END IF;

    -- the new readings appended to their days likewise (days without a recomputed hour; the service sums
    -- them up per day)
    WITH rd AS (
        SELECT DISTINCT r.p, r.q, date_trunc('day', r.h, 'UTC') AS d
        FROM unnest(points, parameters, hours) AS r(p, q, h)
    ), a AS (
        SELECT u.* FROM unnest(day_points, day_parameters, days, day_counts, day_mins, day_maxs, day_sums,
                               day_lasts, day_first_times, day_last_times, day_tw_sums)
            AS u(p, q, d, n, mn, mx, sm, l, ft, lt, tw)
        WHERE NOT EXISTS (SELECT 1 FROM rd WHERE rd.p = u.p AND rd.q = u.q AND rd.d = u.d)
    ), done AS (
        INSERT INTO reading_rollup_day AS o (sample_point_id, parameter, bucket, count, min, max, sum, last,
                                             first_time, last_time, tw_sum, held_seconds)
        SELECT a.p, a.q, a.d, a.n, a.mn, a.mx, a.sm, a.l, a.ft, a.lt, a.tw,
               extract(epoch FROM a.d + interval '1 day' - a.ft)::float8
        FROM a
        ON CONFLICT (sample_point_id, parameter, bucket) DO UPDATE
            SET count = o.count + EXCLUDED.count, min = least(o.min, EXCLUDED.min),
                max = greatest(o.max, EXCLUDED.max), sum = coalesce(o.sum, 0) + EXCLUDED.sum,
                last = EXCLUDED.last, first_time = coalesce(o.first_time, EXCLUDED.first_time),
                last_time = EXCLUDED.last_time,
                tw_sum = CASE WHEN o.count = 0 THEN EXCLUDED.tw_sum
                              ELSE o.tw_sum + EXCLUDED.tw_sum - o.last * extract(epoch FROM
                                   o.bucket + interval '1 day' - EXCLUDED.first_time)::float8 END,
                held_seconds = coalesce(o.held_seconds, EXCLUDED.held_seconds)
            WHERE o.count = 0 OR o.last_time < EXCLUDED.first_time
        RETURNING sample_point_id, parameter, bucket
    )
    SELECT array_agg(a.p), array_agg(a.q), array_agg(a.d) INTO fp, fq, fd
    FROM a LEFT JOIN done dn ON dn.sample_point_id = a.p AND dn.parameter = a.q AND dn.bucket = a.d
    WHERE dn.bucket IS NULL;

    -- a day from its hours: between hours with readings, the previous hour's last value holds until the
    -- next reading (and after the last hour, until the day's end), as in the day's own sample and hold
    INSERT INTO reading_rollup_day AS o (sample_point_id, parameter, bucket, count, min, max, sum, last,
                                         first_time, last_time, tw_sum, held_seconds)
    SELECT d.p, d.q, d.d, coalesce(sum(x.count), 0)::int, min(x.min), max(x.max), sum(x.sum),
           max(x.last) FILTER (WHERE x.next_bucket IS NULL), min(x.first_time), max(x.last_time),
           sum(x.tw_sum + x.last * extract(epoch FROM
               coalesce(x.next_first, d.d + interval '1 day') - (x.bucket + interval '1 hour'))::float8),
           extract(epoch FROM d.d + interval '1 day' - min(x.first_time))::float8
    FROM (SELECT DISTINCT u.p, u.q, date_trunc('day', u.h, 'UTC')
          FROM unnest(points || coalesce(fp, '{}'), parameters || coalesce(fq, '{}'), hours || coalesce(fd, '{}'))
          AS u(p, q, h)) AS d(p, q, d)
    LEFT JOIN LATERAL (
        SELECT h.*, lead(h.bucket) OVER w AS next_bucket, lead(h.first_time) OVER w AS next_first
        FROM reading_rollup_hour h
        WHERE h.sample_point_id = d.p AND h.parameter = d.q
          AND h.bucket >= d.d AND h.bucket < d.d + interval '1 day' AND h.count > 0
        WINDOW w AS (ORDER BY h.bucket)
    ) x ON true
    GROUP BY d.p, d.q, d.d
    ON CONFLICT (sample_point_id, parameter, bucket) DO UPDATE
        SET count = EXCLUDED.count, min = EXCLUDED.min, max = EXCLUDED.max, sum = EXCLUDED.sum,
            last = EXCLUDED.last, first_time = EXCLUDED.first_time, last_time = EXCLUDED.last_time,
            tw_sum = EXCLUDED.tw_sum, held_seconds = EXCLUDED.held_seconds;
END
$fn$;

-- Recomputes the rollups of every series with readings in [from_time, to_time), whole hours, one UTC day per
-- call of update_reading_rollups: after bulk loads or SQL by hand, which bypass the ingest.
CREATE FUNCTION refresh_reading_rollups(from_time timestamptz, to_time timestamptz)
RETURNS void LANGUAGE plpgsql AS $fn$
DECLARE
    lo timestamptz;
    hi timestamptz;
    d timestamptz;
BEGIN
    SELECT min(time), max(time) INTO lo, hi FROM reading
    WHERE time >= date_trunc('hour', from_time, 'UTC') AND time < to_time;
    d := date_trunc('day', lo, 'UTC');
    WHILE d <= hi LOOP
        PERFORM update_reading_rollups(array_agg(p), array_agg(q), array_agg(h))
        FROM (SELECT DISTINCT sample_point_id, parameter, date_trunc('hour', time, 'UTC')
              FROM reading
              WHERE time >= greatest(d, date_trunc('hour', from_time, 'UTC'))
                AND time < least(d + interval '1 day', to_time)) AS r(p, q, h);
        d := d + interval '1 day';
    END LOOP;
END
$fn$;

-- the readings already stored
SELECT refresh_reading_rollups('-infinity', 'infinity');
