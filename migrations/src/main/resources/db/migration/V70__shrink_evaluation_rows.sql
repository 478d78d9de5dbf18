-- Evaluations take less room (issue 19). None of these changes loses information:
--
-- 1. The primary key no longer carries the eight typed values (V30's INCLUDE). They doubled every value of
--    a row in the index (about 196 bytes of the 825 a row took). The reads that used the index-only scans
--    now fetch the heap rows: the derived series' raw path (StoredSeries.rawIntervals), which only serves
--    short ranges (longer ones come from evaluation_rollup_hour/_day), and the rollup settling, which reads
--    an hour of one point at a time; both find their rows through the key as before.
-- 2. finding_codes goes: no query filters on it, and every code is in the row's details (detail_pack, or
--    details for rows written before V61), each finding with its code.
-- 3. points_at becomes text: the instruments the findings point at, comma-separated and sorted as before,
--    NULL when none (an array of one name took 29 bytes, the text takes 3; an empty array 16). The reading
--    queries test it with string_to_array(points_at, ',') && ... and read NULL as empty. Instrument names
--    hold no comma; the migration stops rather than guess if a stored one does.
--
-- The type change rewrites every partition once (which also frees the room of the dropped column in the
-- rows already written), then the new key is built; on a large database both take the table's lock for
-- as long as a full copy of it takes.
DO $$
BEGIN
    IF EXISTS (SELECT 1 FROM evaluation, unnest(points_at) AS a(name) WHERE a.name LIKE '%,%') THEN
        RAISE EXCEPTION 'evaluation.points_at holds a name with a comma; V70 cannot store it as text';
    END IF;
END $$;

ALTER TABLE evaluation DROP CONSTRAINT evaluation_pkey;
ALTER TABLE evaluation DROP COLUMN finding_codes;
ALTER TABLE evaluation ALTER COLUMN points_at DROP DEFAULT;
ALTER TABLE evaluation ALTER COLUMN points_at DROP NOT NULL;
ALTER TABLE evaluation ALTER COLUMN points_at TYPE text USING nullif(array_to_string(points_at, ','), '');
ALTER TABLE evaluation ADD PRIMARY KEY (sample_point_id, time);
