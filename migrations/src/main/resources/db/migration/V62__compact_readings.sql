-- Compact hot storage of readings (issue 19 item 1; docs/scaling.md, "Storage and capacity"). A reading row
-- held two text keys (sample point and parameter) and a primary key that carried the value and quality as well;
-- about 225-240 bytes per reading with its index. Now:
--   * the sample point is a 4-byte key (reading_point) and the parameter a 2-byte key (reading_parameter);
--     the text forms stay in those two small tables, the reading rows hold the integers only;
--   * columns ordered for alignment (8-byte ones first, then 4, 2 and 1), so no padding inside a row;
--   * received_at goes: nothing read it (a correction kept it in reading_revision.old_received_at, which keeps
--     the values stored before this migration and is NULL after it);
--   * the primary key is (point_key, parameter_key, time) without INCLUDE columns: a 24-byte index entry, which
--     also lets PostgreSQL pack the leaf pages (a series' new readings go to the end of its range; for entries
--     of at most two 8-byte words it splits a full page after the new entry instead of in the middle).
-- Sharding (item 5): reading, reading_revision and the rollups are distributed by point_key; reading_point and
-- reading_parameter are small and become reference tables. Every row of the old tables is converted, value
-- for value; the daily partitions keep their names and bounds.

-- Keys. A sample point gets its key when its readings are first written (the ingest) or when it is converted
-- here; keys are never reused. Parameter keys are fixed: the service's parameters in the order of its enum;
-- a code found in stored data and not among them (none is expected) gets a key after them.
CREATE TABLE reading_point (
    sample_point_id  text    PRIMARY KEY,
    point_key        integer GENERATED ALWAYS AS IDENTITY UNIQUE
);

CREATE TABLE reading_parameter (
    parameter_key  smallint PRIMARY KEY,
    code           text     NOT NULL UNIQUE
);

INSERT INTO reading_parameter (parameter_key, code) VALUES
    (1, 'specific_conductivity'),
    (2, 'cation_conductivity'),
    (3, 'degassed_cation_conductivity'),
    (4, 'ph'),
    (5, 'sodium'),
    (6, 'dissolved_oxygen'),
    (7, 'silica'),
    (8, 'chloride'),
    (9, 'sulfate'),
    (10, 'iron'),
    (11, 'copper'),
    (12, 'iron_dissolved'),
    (13, 'copper_dissolved'),
    (14, 'ammonia'),
    (15, 'amine'),
    (16, 'reducing_agent'),
    (17, 'toc'),
    (18, 'acetate'),
    (19, 'formate'),
    (20, 'orp'),
    (21, 'phosphate'),
    (22, 'sample_temperature'),
    (23, 'load'),
    (24, 'drum_pressure'),
    (25, 'feedwater_flow'),
    (26, 'steam_flow'),
    (27, 'make_up_flow'),
    (28, 'operating_state');

INSERT INTO reading_parameter (parameter_key, code)
SELECT (SELECT max(parameter_key) FROM reading_parameter) + row_number() OVER (ORDER BY code), code
FROM (SELECT parameter FROM reading UNION SELECT parameter FROM reading_revision
      UNION SELECT parameter FROM reading_rollup_hour UNION SELECT parameter FROM reading_rollup_day) AS c(code)
WHERE code NOT IN (SELECT code FROM reading_parameter);

INSERT INTO reading_point (sample_point_id)
SELECT id FROM (SELECT id FROM sample_point UNION SELECT sample_point_id FROM reading_head
                UNION SELECT sample_point_id FROM reading UNION SELECT sample_point_id FROM reading_revision
                UNION SELECT sample_point_id FROM reading_rollup_hour
                UNION SELECT sample_point_id FROM reading_rollup_day) AS p(id)
ORDER BY id;

-- For SQL by hand and bulk loads: the key of a sample point, made when it has none yet.
CREATE FUNCTION reading_point_key(point text) RETURNS integer LANGUAGE plpgsql AS $fn$
DECLARE
    k integer;
BEGIN
    SELECT point_key INTO k FROM reading_point WHERE sample_point_id = point;
    IF k IS NULL THEN
        INSERT INTO reading_point (sample_point_id) VALUES (point) ON CONFLICT DO NOTHING RETURNING point_key INTO k;
        IF k IS NULL THEN
            SELECT point_key INTO k FROM reading_point WHERE sample_point_id = point;
        END IF;
    END IF;
    RETURN k;
END
$fn$;

-- Readings. The new parent takes over the old one's partitions day by day (same names and bounds), each filled
-- in key order.
CREATE TABLE reading_compact (
    time                    timestamptz      NOT NULL,
    value                   double precision NOT NULL,
    sample_temperature_cel  double precision,
    point_key               integer          NOT NULL,
    parameter_key           smallint         NOT NULL,
    quality                 smallint         NOT NULL DEFAULT 0,   -- 0 good, 1 uncertain, 2 bad
    compensated             boolean          NOT NULL DEFAULT true,
    CONSTRAINT reading_compact_pkey PRIMARY KEY (point_key, parameter_key, time)
) PARTITION BY RANGE (time);

DO $$
DECLARE
    p record;
    ix text;
BEGIN
    FOR p IN SELECT c.relname AS name, pg_get_expr(c.relpartbound, c.oid) AS bound
             FROM pg_inherits i JOIN pg_class c ON c.oid = i.inhrelid
             WHERE i.inhparent = 'reading'::regclass ORDER BY c.relname LOOP
        EXECUTE format('CREATE TABLE %I PARTITION OF reading_compact %s', 'compact_' || p.name, p.bound);
        EXECUTE format($sql$
            INSERT INTO %I (time, value, sample_temperature_cel, point_key, parameter_key, quality, compensated)
            SELECT r.time, r.value, r.sample_temperature_cel, k.point_key, q.parameter_key, r.quality, r.compensated
            FROM %I r
            JOIN reading_point k ON k.sample_point_id = r.sample_point_id
            JOIN reading_parameter q ON q.code = r.parameter
            ORDER BY k.point_key, q.parameter_key, r.time$sql$, 'compact_' || p.name, p.name);
        EXECUTE format('DROP TABLE %I', p.name);
        EXECUTE format('ALTER TABLE %I RENAME TO %I', 'compact_' || p.name, p.name);
        SELECT i.indexrelid::regclass::text INTO ix FROM pg_index i
        WHERE i.indrelid = p.name::regclass AND i.indisprimary;
        EXECUTE format('ALTER INDEX %s RENAME TO %I', ix, p.name || '_pkey');
    END LOOP;
END
$$;

DROP TABLE reading;
ALTER TABLE reading_compact RENAME TO reading;
ALTER INDEX reading_compact_pkey RENAME TO reading_pkey;

-- as in V31: writes that bypass the ingest make every in-memory copy of readings stale
CREATE TRIGGER reading_written_outside_ingest
    AFTER INSERT OR UPDATE OR DELETE ON reading
    FOR EACH STATEMENT
    WHEN (coalesce(current_setting('kwanta.writer', true), '') <> 'ingest')
    EXECUTE FUNCTION reading_written_outside_ingest();

CREATE TRIGGER reading_truncated
    AFTER TRUNCATE ON reading
    FOR EACH STATEMENT
    EXECUTE FUNCTION reading_written_outside_ingest();

-- Replaced readings. old_received_at: when the replaced value had arrived, for revisions made before this
-- migration (NULL after it: readings no longer carry the time they arrived).
CREATE TABLE reading_revision_compact (
    id                          bigint           GENERATED ALWAYS AS IDENTITY,
    time                        timestamptz      NOT NULL,
    old_value                   double precision NOT NULL,
    old_sample_temperature_cel  double precision,
    new_value                   double precision NOT NULL,
    revised_at                  timestamptz      NOT NULL DEFAULT now(),
    old_received_at             timestamptz,
    point_key                   integer          NOT NULL,
    parameter_key               smallint         NOT NULL,
    old_quality                 smallint         NOT NULL,
    old_compensated             boolean          NOT NULL,
    CONSTRAINT reading_revision_compact_pkey PRIMARY KEY (point_key, id)
);

INSERT INTO reading_revision_compact (id, time, old_value, old_sample_temperature_cel, new_value, revised_at,
                                      old_received_at, point_key, parameter_key, old_quality, old_compensated)
OVERRIDING SYSTEM VALUE
SELECT r.id, r.time, r.old_value, r.old_sample_temperature_cel, r.new_value, r.revised_at, r.old_received_at,
       k.point_key, q.parameter_key, r.old_quality, r.old_compensated
FROM reading_revision r
JOIN reading_point k ON k.sample_point_id = r.sample_point_id
JOIN reading_parameter q ON q.code = r.parameter
ORDER BY r.id;

SELECT setval(pg_get_serial_sequence('reading_revision_compact', 'id'), coalesce(max(id), 0) + 1, false)
FROM reading_revision_compact;

DROP TABLE reading_revision;
ALTER TABLE reading_revision_compact RENAME TO reading_revision;
ALTER INDEX reading_revision_compact_pkey RENAME TO reading_revision_pkey;
ALTER SEQUENCE reading_revision_compact_id_seq RENAME TO reading_revision_id_seq;
CREATE INDEX reading_revision_point_idx ON reading_revision (point_key, parameter_key, time);

-- Rollups (V60), keyed likewise. One row per series and hour or day whatever the data rate, so the keys save
-- little per reading; they change so that the rollups stay on the readings' shard (recomputed from them).
CREATE TABLE reading_rollup_hour_compact (
    bucket              timestamptz      NOT NULL,
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
    point_key           integer          NOT NULL,
    count               integer          NOT NULL,
    parameter_key       smallint         NOT NULL,
    CONSTRAINT reading_rollup_hour_compact_pkey PRIMARY KEY (point_key, parameter_key, bucket)
);

INSERT INTO reading_rollup_hour_compact (bucket, min, max, sum, last, first_time, last_time, tw_sum, held_seconds,
                                 point_key, count, parameter_key)
SELECT r.bucket, r.min, r.max, r.sum, r.last, r.first_time, r.last_time, r.tw_sum, r.held_seconds,
       k.point_key, r.count, q.parameter_key
FROM reading_rollup_hour r
JOIN reading_point k ON k.sample_point_id = r.sample_point_id
JOIN reading_parameter q ON q.code = r.parameter
ORDER BY k.point_key, q.parameter_key, r.bucket;

DROP TABLE reading_rollup_hour;
ALTER TABLE reading_rollup_hour_compact RENAME TO reading_rollup_hour;
ALTER INDEX reading_rollup_hour_compact_pkey RENAME TO reading_rollup_hour_pkey;

CREATE TABLE reading_rollup_day_compact (
    bucket              timestamptz      NOT NULL,
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
    point_key           integer          NOT NULL,
    count               integer          NOT NULL,
    parameter_key       smallint         NOT NULL,
    CONSTRAINT reading_rollup_day_compact_pkey PRIMARY KEY (point_key, parameter_key, bucket)
);

INSERT INTO reading_rollup_day_compact (bucket, min, max, sum, last, first_time, last_time, tw_sum, held_seconds,
                                 point_key, count, parameter_key)
SELECT r.bucket, r.min, r.max, r.sum, r.last, r.first_time, r.last_time, r.tw_sum, r.held_seconds,
       k.point_key, r.count, q.parameter_key
FROM reading_rollup_day r
JOIN reading_point k ON k.sample_point_id = r.sample_point_id
JOIN reading_parameter q ON q.code = r.parameter
ORDER BY k.point_key, q.parameter_key, r.bucket;

DROP TABLE reading_rollup_day;
ALTER TABLE reading_rollup_day_compact RENAME TO reading_rollup_day;
ALTER INDEX reading_rollup_day_compact_pkey RENAME TO reading_rollup_day_pkey;

-- The rollup functions of V60 on the keys: update_reading_rollups takes point and parameter keys.
DROP FUNCTION update_reading_rollups;
DROP FUNCTION refresh_reading_rollups;

CREATE FUNCTION update_reading_rollups(points int4[], parameters int2[], hours timestamptz[],
                                       new_points int4[] DEFAULT '{}', new_parameters int2[] DEFAULT '{}',
                                       new_hours timestamptz[] DEFAULT '{}', new_counts int[] DEFAULT '{}',
                                       new_mins float8[] DEFAULT '{}', new_maxs float8[] DEFAULT '{}',
                                       new_sums float8[] DEFAULT '{}', new_lasts float8[] DEFAULT '{}',
                                       new_first_times timestamptz[] DEFAULT '{}',
                                       new_last_times timestamptz[] DEFAULT '{}',
                                       new_tw_sums float8[] DEFAULT '{}',
                                       day_points int4[] DEFAULT '{}', day_parameters int2[] DEFAULT '{}',
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
    rp int4[];
    rq int2[];
    rh timestamptz[];
    fp int4[];
    fq int2[];
    fd timestamptz[];
BEGIN
    -- new readings appended to their hours
    WITH a AS (
        SELECT * FROM unnest(new_points, new_parameters, new_hours, new_counts, new_mins, new_maxs, new_sums,
                             new_lasts, new_first_times, new_last_times, new_tw_sums)
            AS u(p, q, h, n, mn, mx, sm, l, ft, lt, tw)
    ), done AS (
        INSERT INTO reading_rollup_hour AS o (point_key, parameter_key, bucket, count, min, max, sum, last,
                                              first_time, last_time, tw_sum, held_seconds)
        SELECT a.p, a.q, a.h, a.n, a.mn, a.mx, a.sm, a.l, a.ft, a.lt, a.tw,
               extract(epoch FROM a.h + interval '1 hour' - a.ft)::float8
        FROM a
        ON CONFLICT (point_key, parameter_key, bucket) DO UPDATE
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
        RETURNING point_key, parameter_key, bucket
    )
    SELECT array_agg(a.p) FILTER (WHERE d.bucket IS NULL), array_agg(a.q) FILTER (WHERE d.bucket IS NULL),
           array_agg(a.h) FILTER (WHERE d.bucket IS NULL)
    INTO rp, rq, rh
    FROM a LEFT JOIN done d ON d.point_key = a.p AND d.parameter_key = a.q AND d.bucket = a.h;

    -- hours recomputed from reading: those asked for, and new readings' hours that were not appended
    points := coalesce(points, '{}') || coalesce(rp, '{}');
    parameters := coalesce(parameters, '{}') || coalesce(rq, '{}');
    hours := coalesce(hours, '{}') || coalesce(rh, '{}');
    SELECT min(h), max(h) + interval '1 hour' INTO lo, hi FROM unnest(hours) AS u(h);
    IF lo IS NOT NULL THEN
    EXECUTE format($sql$
    INSERT INTO reading_rollup_hour AS o (point_key, parameter_key, bucket, count, min, max, sum, last,
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
              WHERE point_key = t.p AND parameter_key = t.q
                AND time >= %L AND time < %L
                AND time >= t.h AND time < t.h + interval '1 hour' AND quality < 2) s
    ) a
    ON CONFLICT (point_key, parameter_key, bucket) DO UPDATE
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
        INSERT INTO reading_rollup_day AS o (point_key, parameter_key, bucket, count, min, max, sum, last,
                                             first_time, last_time, tw_sum, held_seconds)
        SELECT a.p, a.q, a.d, a.n, a.mn, a.mx, a.sm, a.l, a.ft, a.lt, a.tw,
               extract(epoch FROM a.d + interval '1 day' - a.ft)::float8
        FROM a
        ON CONFLICT (point_key, parameter_key, bucket) DO UPDATE
            SET count = o.count + EXCLUDED.count, min = least(o.min, EXCLUDED.min),
                max = greatest(o.max, EXCLUDED.max), sum = coalesce(o.sum, 0) + EXCLUDED.sum,
                last = EXCLUDED.last, first_time = coalesce(o.first_time, EXCLUDED.first_time),
                last_time = EXCLUDED.last_time,
                tw_sum = CASE WHEN o.count = 0 THEN EXCLUDED.tw_sum
                              ELSE o.tw_sum + EXCLUDED.tw_sum - o.last * extract(epoch FROM
                                   o.bucket + interval '1 day' - EXCLUDED.first_time)::float8 END,
                held_seconds = coalesce(o.held_seconds, EXCLUDED.held_seconds)
            WHERE o.count = 0 OR o.last_time < EXCLUDED.first_time
        RETURNING point_key, parameter_key, bucket
    )
    SELECT array_agg(a.p), array_agg(a.q), array_agg(a.d) INTO fp, fq, fd
    FROM a LEFT JOIN done dn ON dn.point_key = a.p AND dn.parameter_key = a.q AND dn.bucket = a.d
    WHERE dn.bucket IS NULL;

    -- a day from its hours: between hours with readings, the previous hour's last value holds until the
    -- next reading (and after the last hour, until the day's end), as in the day's own sample and hold
    INSERT INTO reading_rollup_day AS o (point_key, parameter_key, bucket, count, min, max, sum, last,
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
        WHERE h.point_key = d.p AND h.parameter_key = d.q
          AND h.bucket >= d.d AND h.bucket < d.d + interval '1 day' AND h.count > 0
        WINDOW w AS (ORDER BY h.bucket)
    ) x ON true
    GROUP BY d.p, d.q, d.d
    ON CONFLICT (point_key, parameter_key, bucket) DO UPDATE
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
        FROM (SELECT DISTINCT point_key, parameter_key, date_trunc('hour', time, 'UTC')
              FROM reading
              WHERE time >= greatest(d, date_trunc('hour', from_time, 'UTC'))
                AND time < least(d + interval '1 day', to_time)) AS r(p, q, h);
        d := d + interval '1 day';
    END LOOP;
END
$fn$;

-- For SQL by hand: the readings with their sample point and parameter codes.
CREATE VIEW reading_named AS
SELECT k.sample_point_id, q.code AS parameter, r.time, r.value, r.quality, r.sample_temperature_cel, r.compensated
FROM reading r
JOIN reading_point k ON k.point_key = r.point_key
JOIN reading_parameter q ON q.parameter_key = r.parameter_key;

-- the service's in-memory copies of readings predate the conversion
SELECT invalidate_reading_heads();
