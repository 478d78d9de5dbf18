-- Packed cold storage of readings (issue 19 item 2; docs/scaling.md, "Packed cold storage"). Whole days of
-- reading older than kwanta.storage.pack-after are packed by the service, per series and UTC hour, into one row
-- whose block holds every reading of that hour losslessly (ReadingBlock: delta-of-delta times, Gorilla XOR or
-- exact scaled-integer values, runs of quality, temperature presence and compensation, a CRC-32C); the day's
-- partition of reading is then dropped, so its space is freed without VACUUM. Corrections to a packed hour
-- rewrite its block in the ingest transaction; the replaced reading still goes to reading_revision.
-- Sharding (item 5): distributed by point_key like reading; no foreign key.
CREATE TABLE reading_pack (
    start          timestamptz NOT NULL,   -- the hour (UTC) the block covers: [start, start + 1 hour)
    point_key      integer     NOT NULL,
    count          integer     NOT NULL,   -- readings in the block
    parameter_key  smallint    NOT NULL,
    block          bytea       NOT NULL,
    CONSTRAINT reading_pack_pkey PRIMARY KEY (point_key, parameter_key, start)
);

-- The block is already compressed: PostgreSQL's TOAST compression (pglz) would only spend time finding that out,
-- and moving a block of 2-8 kB out of line (TOAST chunks of about 2 kB, each a row with its index entry) cost
-- about 2-3 bytes per reading on this machine (scripts/load/pack_load.py, full-precision and jittered data).
-- EXTERNAL never compresses; a tuple target of a whole page keeps blocks inline up to about 8 kB; larger ones
-- (hours of 1 s data at full precision) still go out of line, uncompressed.
ALTER TABLE reading_pack ALTER COLUMN block SET STORAGE EXTERNAL;
ALTER TABLE reading_pack SET (toast_tuple_target = 8160);

-- The days whose partition of reading was packed and dropped: the ingest never makes a partition of reading
-- for them again (Partitions), and writes their readings into the blocks instead. A small registry table (a
-- reference table when sharded).
CREATE TABLE reading_pack_day (
    day        date        PRIMARY KEY,
    readings   bigint      NOT NULL,
    packed_at  timestamptz NOT NULL DEFAULT now()
);

-- A day's rollup from its hours, as update_reading_rollups (V62) computes it: for the hours of packed days,
-- whose rollups the service recomputes from the decoded blocks and then gives their days here.
CREATE FUNCTION update_reading_rollup_days(points int4[], parameters int2[], days timestamptz[])
RETURNS void LANGUAGE sql AS $fn$
    INSERT INTO reading_rollup_day AS o (point_key, parameter_key, bucket, count, min, max, sum, last,
                                         first_time, last_time, tw_sum, held_seconds)
    SELECT d.p, d.q, d.d, coalesce(sum(x.count), 0)::int, min(x.min), max(x.max), sum(x.sum),
           max(x.last) FILTER (WHERE x.next_bucket IS NULL), min(x.first_time), max(x.last_time),
           sum(x.tw_sum + x.last * extract(epoch FROM
               coalesce(x.next_first, d.d + interval '1 day') - (x.bucket + interval '1 hour'))::float8),
           extract(epoch FROM d.d + interval '1 day' - min(x.first_time))::float8
    FROM (SELECT DISTINCT u.p, u.q, date_trunc('day', u.h, 'UTC') FROM unnest(points, parameters, days) AS u(p, q, h))
         AS d(p, q, d)
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
$fn$;
