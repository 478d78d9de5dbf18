-- Evaluations take less room (issue 19). The table is rebuilt, partition by partition, with the same rows;
-- none of these changes loses information:
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
-- 4. The columns are in the order that needs no alignment padding: the 8-byte ones first, then the
--    integer, the flag and the variable-length ones (PostgreSQL aligns an 8-byte column to 8 bytes; the
--    old order lost 3 bytes after sample_point_id, 4 after config_version and 7 after the flag).
--
-- Rows are copied in key order (each point's evaluations together), so the new key is built once per
-- partition from sorted rows. On a large database this takes as long as a full copy of the table, under
-- its lock; the old partitions are dropped one by one as they are copied.
DO $$
BEGIN
    IF EXISTS (SELECT 1 FROM evaluation, unnest(points_at) AS a(name) WHERE a.name LIKE '%,%') THEN
        RAISE EXCEPTION 'evaluation.points_at holds a name with a comma; V70 cannot store it as text';
    END IF;
END $$;

ALTER TABLE evaluation DROP CONSTRAINT evaluation_pkey;
ALTER TABLE evaluation RENAME TO evaluation_before_v70;

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
    config_version                   integer          NOT NULL,
    instrument_in_doubt              boolean          NOT NULL,
    sample_point_id                  text             NOT NULL,
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
        WHERE i.inhparent = 'evaluation_before_v70'::regclass
        ORDER BY 1
    LOOP
        EXECUTE format('ALTER TABLE evaluation_before_v70 DETACH PARTITION %I', p.name);
        EXECUTE format('ALTER TABLE %I RENAME TO %I', p.name, 'v70_' || p.name);
        EXECUTE format('CREATE TABLE %I PARTITION OF evaluation %s', p.name, p.bound);
        EXECUTE format(
            'INSERT INTO %I (time, evaluated_at, specific_conductivity_25, cation_conductivity_25,'
            ' degassed_cation_conductivity_25, calculated_ph_25, ph_at_temperature, ph_at_temperature_low,'
            ' ph_at_temperature_high, neutral_ph_at_temperature, config_version, instrument_in_doubt,'
            ' sample_point_id, points_at, detail_pack, details)'
            ' SELECT time, evaluated_at, specific_conductivity_25, cation_conductivity_25,'
            ' degassed_cation_conductivity_25, calculated_ph_25, ph_at_temperature, ph_at_temperature_low,'
            ' ph_at_temperature_high, neutral_ph_at_temperature, config_version, instrument_in_doubt,'
            ' sample_point_id, nullif(array_to_string(points_at, '',''), ''''), detail_pack, details'
            ' FROM %I ORDER BY sample_point_id, time',
            p.name, 'v70_' || p.name);
        EXECUTE format('DROP TABLE %I', 'v70_' || p.name);
    END LOOP;
END $$;

-- V64's function over the row type, made again for the new table (the settling functions call it by name)
DROP FUNCTION evaluation_values(evaluation_before_v70);
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

DROP TABLE evaluation_before_v70;
ALTER TABLE evaluation ADD PRIMARY KEY (sample_point_id, time);
