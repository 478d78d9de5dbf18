-- Evaluations take less room (issue 19). Three changes, none of which loses information:
--
-- 1. The primary key no longer carries the eight typed values (V30's INCLUDE). They doubled every value of
--    a row in the index (about 196 bytes of the 825 a row took). The reads that used the index-only scans
--    now fetch the heap rows: the derived series' raw path (StoredSeries.rawIntervals), which only serves
--    short ranges (longer ones come from evaluation_rollup_hour/_day), and the rollup settling, which reads
--    an hour of one point at a time; both find their rows through the key as before.
-- 2. finding_codes goes: no query filters on it, and every code is in the row's details (detail_pack, or
--    details for rows written before V61), each finding with its code.
-- 3. points_at, which the reading queries test with && and ANY, is NULL when no finding points at anything
--    (an empty array took 29 bytes); the queries read NULL as empty (coalesce(..., false)). Rows already
--    written keep their '{}'.
--
-- On a large database the new key is built over every partition while the table is locked (as V30's was).
ALTER TABLE evaluation DROP CONSTRAINT evaluation_pkey;
ALTER TABLE evaluation ADD PRIMARY KEY (sample_point_id, time);
ALTER TABLE evaluation DROP COLUMN finding_codes;
ALTER TABLE evaluation ALTER COLUMN points_at DROP NOT NULL;
ALTER TABLE evaluation ALTER COLUMN points_at DROP DEFAULT;
