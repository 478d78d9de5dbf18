-- Evaluations keyed by the sample point's integer key (issue 19 item 1, evaluation side; docs/scaling.md,
-- "Storage and capacity"), as readings are since V62. The evaluation row carried the sample point's text id,
-- and its primary key (sample_point_id, time) entries were 36 bytes: wider than PostgreSQL's "split after
-- the new item" allows (at most two 8-byte words; nbtsplitloc.c), so every point's leaf pages split in the
-- middle as the ingest appended to them, and stayed about half full (71 bytes of index per evaluation). Now:
--   * `point_key integer` (reading_point, V62) instead of `sample_point_id text`; the primary key is
--     (point_key, time), a 24-byte entry whose pages the ingest's ascending inserts fill;
--   * the columns in an order without alignment padding: the 8-byte ones, the two integers, the flag, then
--     the variable-length ones;
--   * the derived series' rollups (V64) and their marks (V65) carry the key too, so that they stay on the
--     evaluations' shard when distributed (the settling reads evaluations and writes the rollups in one
--     statement), as V62 did for the readings' rollups.
-- Every row is converted value for value; the daily partitions keep their names and bounds. Rows are copied
-- partition by partition in key order (each point's evaluations together) and the key is built once per
-- partition from them, as V70 did. On a large database this takes about as long as a full copy of the table,
-- under its lock; the old partitions are dropped one by one as they are copied.

-- Keys for the points that have evaluations, rollups or marks but no key yet (a point known only from
-- evaluations written by hand, say): each distinct id found through the tables' keys, which start with it
-- (a skip scan, one index probe per point), not by reading every row.
DO $$
DECLARE
    t text;
    p text;
BEGIN
    FOREACH t IN ARRAY ARRAY['evaluation', 'evaluation_rollup_hour', 'evaluation_rollup_day',
                             'evaluation_rollup_pending'] LOOP
        EXECUTE format('SELECT min(sample_point_id) FROM %I', t) INTO p;
        WHILE p IS NOT NULL LOOP
            PERFORM reading_point_key(p);
            EXECUTE format('SELECT min(sample_point_id) FROM %I WHERE sample_point_id > $1', t) INTO p USING p;
        END LOOP;
    END LOOP;
END $$;

-- Evaluations. The new parent takes over the old one's partitions day by day.
ALTER TABLE evaluation DROP CONSTRAINT evaluation_pkey;
ALTER TABLE evaluation RENAME TO evaluation_before_v71;

CREATE TABLE evaluation (
    time                             timestamptz      NOT NULL,
    evaluated_at                     timestamptz      NOT NULL DEFAULT now(),
    specific_conductivity_25         double precision,
    cation_conductivity_25           double precision,
    degassed_cation_conductivity_25  double precision,
    calculated_ph_25                 double precision,
    ph_at_temperature                double precision,
    ph_at_temperature_low            double precision,
    ph_at_temperature_high           double precision,
    neutral_ph_at_temperature        double precision,
    point_key                        integer          NOT NULL,
    config_version                   integer          NOT NULL,
    instrument_in_doubt              boolean          NOT NULL,
    points_at                        text,
    detail_pack                      bytea,
    details                          text
) PARTITION BY RANGE (time);

DO $$
DECLARE
    p record;
BEGIN
    FOR p IN
        SELECT c.relname AS name, pg_get_expr(c.relpartbound, c.oid) AS bound
        FROM pg_inherits i JOIN pg_class c ON c.oid = i.inhrelid
        WHERE i.inhparent = 'evaluation_before_v71'::regclass
        ORDER BY 1
    LOOP
        EXECUTE format('ALTER TABLE evaluation_before_v71 DETACH PARTITION %I', p.name);
        EXECUTE format('ALTER TABLE %I RENAME TO %I', p.name, 'v71_' || p.name);
        EXECUTE format('CREATE TABLE %I PARTITION OF evaluation %s', p.name, p.bound);
        EXECUTE format(
            'INSERT INTO %I (time, evaluated_at, specific_conductivity_25, cation_conductivity_25,'
            ' degassed_cation_conductivity_25, calculated_ph_25, ph_at_temperature, ph_at_temperature_low,'
            ' ph_at_temperature_high, neutral_ph_at_temperature, point_key, config_version,'
            ' instrument_in_doubt, points_at, detail_pack, details)'
            ' SELECT e.time, e.evaluated_at, e.specific_conductivity_25, e.cation_conductivity_25,'
            ' e.degassed_cation_conductivity_25, e.calculated_ph_25, e.ph_at_temperature,'
            ' e.ph_at_temperature_low, e.ph_at_temperature_high, e.neutral_ph_at_temperature, k.point_key,'
            ' e.config_version, e.instrument_in_doubt, e.points_at, e.detail_pack, e.details'
            ' FROM %I e JOIN reading_point k ON k.sample_point_id = e.sample_point_id'
            ' ORDER BY k.point_key, e.time',
            p.name, 'v71_' || p.name);
        EXECUTE format('DROP TABLE %I', 'v71_' || p.name);
    END LOOP;
END $$;

-- V64's function over the row type, made again for the new table (the settling functions call it by name)
DROP FUNCTION evaluation_values(evaluation_before_v71);
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

DROP TABLE evaluation_before_v71;
ALTER TABLE evaluation ADD PRIMARY KEY (point_key, time);

-- The derived series' rollups (V64) and the marks of hours to settle (V65), keyed likewise; `parameter`
-- stays the evaluation column's API code.
CREATE TABLE evaluation_rollup_hour_keyed (
    bucket       timestamptz      NOT NULL,
    min          double precision,
    max          double precision,
    sum          double precision,
    last         double precision,
    first_time   timestamptz,
    last_time    timestamptz,
    point_key    integer          NOT NULL,
    count        integer          NOT NULL,
    parameter    text             NOT NULL,
    CONSTRAINT evaluation_rollup_hour_keyed_pkey PRIMARY KEY (point_key, parameter, bucket)
);

INSERT INTO evaluation_rollup_hour_keyed (bucket, min, max, sum, last, first_time, last_time, point_key, count,
                                          parameter)
SELECT r.bucket, r.min, r.max, r.sum, r.last, r.first_time, r.last_time, k.point_key, r.count, r.parameter
FROM evaluation_rollup_hour r JOIN reading_point k ON k.sample_point_id = r.sample_point_id
ORDER BY k.point_key, r.parameter, r.bucket;

DROP TABLE evaluation_rollup_hour;
ALTER TABLE evaluation_rollup_hour_keyed RENAME TO evaluation_rollup_hour;
ALTER INDEX evaluation_rollup_hour_keyed_pkey RENAME TO evaluation_rollup_hour_pkey;

CREATE TABLE evaluation_rollup_day_keyed (LIKE evaluation_rollup_hour INCLUDING ALL);

INSERT INTO evaluation_rollup_day_keyed (bucket, min, max, sum, last, first_time, last_time, point_key, count,
                                         parameter)
SELECT r.bucket, r.min, r.max, r.sum, r.last, r.first_time, r.last_time, k.point_key, r.count, r.parameter
FROM evaluation_rollup_day r JOIN reading_point k ON k.sample_point_id = r.sample_point_id
ORDER BY k.point_key, r.parameter, r.bucket;

DROP TABLE evaluation_rollup_day;
ALTER TABLE evaluation_rollup_day_keyed RENAME TO evaluation_rollup_day;
ALTER INDEX evaluation_rollup_day_keyed_pkey RENAME TO evaluation_rollup_day_pkey;

CREATE TABLE evaluation_rollup_pending_keyed (
    bucket     timestamptz NOT NULL,
    point_key  integer     NOT NULL,
    CONSTRAINT evaluation_rollup_pending_keyed_pkey PRIMARY KEY (point_key, bucket)
);

INSERT INTO evaluation_rollup_pending_keyed (bucket, point_key)
SELECT r.bucket, k.point_key
FROM evaluation_rollup_pending r JOIN reading_point k ON k.sample_point_id = r.sample_point_id
ORDER BY k.point_key, r.bucket;

DROP TABLE evaluation_rollup_pending;
ALTER TABLE evaluation_rollup_pending_keyed RENAME TO evaluation_rollup_pending;
ALTER INDEX evaluation_rollup_pending_keyed_pkey RENAME TO evaluation_rollup_pending_pkey;

-- V65's settling on the keys: settle_evaluation_rollups takes point keys.
DROP FUNCTION settle_evaluation_rollups(text[], timestamptz[]);

CREATE FUNCTION settle_evaluation_rollups(points int4[], hours timestamptz[])
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
    INSERT INTO evaluation_rollup_hour AS o (point_key, parameter, bucket, count, min, max, sum, last,
                                             first_time, last_time)
    SELECT t.p, x.parameter, t.h, count(x.v)::int, min(x.v), max(x.v), sum(x.v),
           (array_agg(x.v ORDER BY e.time DESC) FILTER (WHERE x.v IS NOT NULL))[1],
           min(e.time) FILTER (WHERE x.v IS NOT NULL), max(e.time) FILTER (WHERE x.v IS NOT NULL)
    FROM (SELECT DISTINCT * FROM unnest($1, $2)) AS t(p, h)
    JOIN evaluation e ON e.point_key = t.p AND e.time >= t.h AND e.time < t.h + interval '1 hour'
                     AND e.time >= %L AND e.time < %L
    CROSS JOIN LATERAL evaluation_values(e) x
    GROUP BY t.p, x.parameter, t.h
    ON CONFLICT (point_key, parameter, bucket) DO UPDATE
        SET count = EXCLUDED.count, min = EXCLUDED.min, max = EXCLUDED.max, sum = EXCLUDED.sum,
            last = EXCLUDED.last, first_time = EXCLUDED.first_time, last_time = EXCLUDED.last_time
    $sql$, lo, hi) USING points, hours;

    INSERT INTO evaluation_rollup_day AS o (point_key, parameter, bucket, count, min, max, sum, last,
                                            first_time, last_time)
    SELECT h.point_key, h.parameter, t.d, sum(h.count)::int, min(h.min), max(h.max), sum(h.sum),
           (array_agg(h.last ORDER BY h.last_time DESC) FILTER (WHERE h.count > 0))[1],
           min(h.first_time), max(h.last_time)
    FROM (SELECT DISTINCT u.p, date_trunc('day', u.h, 'UTC') FROM unnest(points, hours) AS u(p, h)) AS t(p, d)
    JOIN evaluation_rollup_hour h ON h.point_key = t.p AND h.bucket >= t.d AND h.bucket < t.d + interval '1 day'
    GROUP BY h.point_key, h.parameter, t.d
    ON CONFLICT (point_key, parameter, bucket) DO UPDATE
        SET count = EXCLUDED.count, min = EXCLUDED.min, max = EXCLUDED.max, sum = EXCLUDED.sum,
            last = EXCLUDED.last, first_time = EXCLUDED.first_time, last_time = EXCLUDED.last_time;
END
$fn$;

-- Recomputes the rollups of every point with evaluations in [from_time, to_time), whole hours, one UTC day
-- per call: after bulk loads or SQL by hand, which bypass the ingest's marks.
CREATE OR REPLACE FUNCTION refresh_evaluation_rollups(from_time timestamptz, to_time timestamptz)
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
        FROM (SELECT DISTINCT point_key, date_trunc('hour', time, 'UTC')
              FROM evaluation
              WHERE time >= greatest(d, date_trunc('hour', from_time, 'UTC'))
                AND time < least(d + interval '1 day', to_time)) AS r(p, h);
        d := d + interval '1 day';
    END LOOP;
END
$fn$;
