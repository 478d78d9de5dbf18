-- Rollups for long trends of the derived series: per sample point, evaluation column (its API code, in
-- "parameter") and UTC hour or day, the column's non-null values summed up, as the bucketed series of a
-- derived parameter counts them (docs/ingest.md). The reading rollups of V60 hold the measured series; these
-- hold the eight value columns of evaluation:
--   specific_conductivity_25, cation_conductivity_25, degassed_cation_conductivity_25, calculated_ph_25,
--   ph_at_temperature, ph_at_temperature_low, ph_at_temperature_high, neutral_ph_at_temperature.
-- The ingest keeps them in step in its own transaction (update_evaluation_rollups): evaluations new in the
-- transaction that follow an hour's last one are added to its row, other touched hours are recomputed from
-- evaluation, and touched days from their hours. Rows outlive the evaluations' retention.
--
-- count    non-null values; 0 when a recomputation left the bucket without any (aggregates NULL)
-- sum      their sum, so that buckets combine into larger ones (mean = sum / count)
-- last     the value of the latest one (at last_time)
CREATE TABLE evaluation_rollup_hour (
    sample_point_id  text             NOT NULL,
    parameter        text             NOT NULL,
    bucket           timestamptz      NOT NULL,
    count            integer          NOT NULL,
    min              double precision,
    max              double precision,
    sum              double precision,
    last             double precision,
    first_time       timestamptz,
    last_time        timestamptz,
    PRIMARY KEY (sample_point_id, parameter, bucket)
);

CREATE TABLE evaluation_rollup_day (LIKE evaluation_rollup_hour INCLUDING ALL);

-- The eight value columns of evaluation rows as (parameter, value) pairs.
CREATE FUNCTION evaluation_values(e evaluation) RETURNS TABLE (parameter text, v double precision)
LANGUAGE sql IMMUTABLE AS $$
    VALUES ('specific_conductivity_25', e.specific_conductivity_25),
           ('cation_conductivity_25', e.cation_conductivity_25),
           ('degassed_cation_conductivity_25', e.degassed_cation_conductivity_25),
           ('calculated_ph_25', e.calculated_ph_25),
           ('ph_at_temperature', e.ph_at_temperature),
           ('ph_at_temperature_low', e.ph_at_temperature_low),
           ('ph_at_temperature_high', e.ph_at_temperature_high),
           ('neutral_ph_at_temperature', e.neutral_ph_at_temperature)
$$;

-- Keeps the rollups in step with one ingest transaction, called once after its evaluations are written:
--   points, hours, froms: per touched (point, UTC hour), the time from which the hour's evaluations are all
--   new in this transaction, or NULL when evaluations in it were recomputed. A column's row of an hour with
--   a time takes the values from that time on without the hour being read again when they all follow its
--   last value (live data); otherwise, and for NULL, the hour is recomputed from evaluation. Then every
--   touched day is recomputed from its hours. The overall range is written into the statements as
--   literals, so that the planner keeps only the daily partitions of evaluation in it.
CREATE FUNCTION update_evaluation_rollups(points text[], hours timestamptz[], froms timestamptz[])
RETURNS void LANGUAGE plpgsql AS $fn$
DECLARE
    lo timestamptz;
    hi timestamptz;
    rp text[];
    rh timestamptz[];
BEGIN
    SELECT min(h), max(h) + interval '1 hour' INTO lo, hi FROM unnest(hours) AS u(h);
    IF lo IS NULL THEN
        RETURN;
    END IF;
    -- the new values appended to their hours' rows where they follow the last one (or add nothing)
    EXECUTE format($sql$
    WITH a AS (
        SELECT t.p, x.parameter AS q, t.h, count(x.v)::int AS n, min(x.v) AS mn, max(x.v) AS mx, sum(x.v) AS s,
               (array_agg(x.v ORDER BY e.time DESC) FILTER (WHERE x.v IS NOT NULL))[1] AS l,
               min(e.time) FILTER (WHERE x.v IS NOT NULL) AS ft, max(e.time) FILTER (WHERE x.v IS NOT NULL) AS lt
        FROM unnest($1, $2, $3) AS t(p, h, f)
        JOIN evaluation e ON e.sample_point_id = t.p AND e.time >= t.f AND e.time < t.h + interval '1 hour'
                         AND e.time >= %L AND e.time < %L
        CROSS JOIN LATERAL evaluation_values(e) x
        WHERE t.f IS NOT NULL
        GROUP BY t.p, x.parameter, t.h
    ), done AS (
        INSERT INTO evaluation_rollup_hour AS o (sample_point_id, parameter, bucket, count, min, max, sum, last,
                                                 first_time, last_time)
        SELECT a.p, a.q, a.h, a.n, a.mn, a.mx, a.s, a.l, a.ft, a.lt FROM a
        ON CONFLICT (sample_point_id, parameter, bucket) DO UPDATE
            SET count = o.count + EXCLUDED.count,
                min = coalesce(least(o.min, EXCLUDED.min), o.min, EXCLUDED.min),
                max = coalesce(greatest(o.max, EXCLUDED.max), o.max, EXCLUDED.max),
                sum = CASE WHEN EXCLUDED.count = 0 THEN o.sum ELSE coalesce(o.sum, 0) + EXCLUDED.sum END,
                last = CASE WHEN EXCLUDED.count = 0 THEN o.last ELSE EXCLUDED.last END,
                first_time = coalesce(o.first_time, EXCLUDED.first_time),
                last_time = coalesce(EXCLUDED.last_time, o.last_time)
            WHERE EXCLUDED.count = 0 OR o.count = 0 OR o.last_time < EXCLUDED.first_time
        RETURNING sample_point_id, parameter, bucket
    )
    SELECT array_agg(r.p), array_agg(r.h) FROM (
        SELECT DISTINCT a.p, a.h FROM a
        WHERE NOT EXISTS (SELECT 1 FROM done d WHERE d.sample_point_id = a.p AND d.parameter = a.q
                                                AND d.bucket = a.h)) r
    $sql$, lo, hi) INTO rp, rh USING points, hours, froms;

    -- hours recomputed from evaluation: those with recomputed evaluations and those not appended
    SELECT coalesce(array_agg(u.p), '{}') || coalesce(rp, '{}'), coalesce(array_agg(u.h), '{}') || coalesce(rh, '{}')
    INTO rp, rh
    FROM unnest(points, hours, froms) AS u(p, h, f) WHERE u.f IS NULL;
    IF cardinality(rp) > 0 THEN
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
    $sql$, lo, hi) USING rp, rh;
    END IF;

    -- every touched day from its hours
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
-- per call of update_evaluation_rollups: after bulk loads or SQL by hand, which bypass the ingest.
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
        PERFORM update_evaluation_rollups(array_agg(p), array_agg(h), array_agg(NULL::timestamptz))
        FROM (SELECT DISTINCT sample_point_id, date_trunc('hour', time, 'UTC')
              FROM evaluation
              WHERE time >= greatest(d, date_trunc('hour', from_time, 'UTC'))
                AND time < least(d + interval '1 day', to_time)) AS r(p, h);
        d := d + interval '1 day';
    END LOOP;
END
$fn$;

-- the evaluations already stored
SELECT refresh_evaluation_rollups('-infinity', 'infinity');
