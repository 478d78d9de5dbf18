-- Names of our own, one word per concept (issue 18 item 4; the glossary is docs/names.md).
-- The audit log is left as it was written (it is the record of what was sent at the time).

-- 1. A plant's block was called a "unit", the same word as a unit of measure. The block is now `block`
-- everywhere: tables, columns, the stored sample-point configurations (key "unit" → "block") and the API.
-- Units of measure keep the word `unit`.

ALTER TABLE plant_unit RENAME TO plant_block;
ALTER INDEX plant_unit_pkey RENAME TO plant_block_pkey;

ALTER TABLE sample_point RENAME COLUMN unit_id TO block_id;
ALTER INDEX sample_point_plant_idx RENAME TO sample_point_plant_block_idx;

ALTER TABLE unit_operating_state RENAME TO block_operating_state;
ALTER TABLE block_operating_state RENAME COLUMN unit_id TO block_id;
ALTER INDEX unit_operating_state_pkey RENAME TO block_operating_state_pkey;
ALTER INDEX unit_operating_state_unit_idx RENAME TO block_operating_state_block_idx;
ALTER SEQUENCE unit_operating_state_id_seq RENAME TO block_operating_state_id_seq;
ALTER TRIGGER unit_operating_state_append_only ON block_operating_state
    RENAME TO block_operating_state_append_only;
ALTER TRIGGER unit_operating_state_no_truncate ON block_operating_state
    RENAME TO block_operating_state_no_truncate;

-- Stored configuration versions: the declaration JSON's "unit" key becomes "block" (same value).
UPDATE sample_point_version
SET config = (config - 'unit') || jsonb_build_object('block', config -> 'unit')
WHERE config ? 'unit';

-- 2. "suspect" meant three things. On an evaluation the boolean is now `instrument_in_doubt` (a finding
-- points at an instrument or the sample conditioning) and the array of what the findings point at is
-- `points_at`. Renaming a column of the partitioned table renames it in every partition. The stored JSON
-- details keep their old keys (suspect, rawUSPerCm); the service reads them under the new names, and a
-- recomputed evaluation is written with the new ones.
ALTER TABLE evaluation RENAME COLUMN suspect TO instrument_in_doubt;
ALTER TABLE evaluation RENAME COLUMN suspects TO points_at;

-- 3. Treatment regimes on the wire only in their trade form: AVT(R), AVT(O), OT, PT, CT (and MAKE_UP for
-- make-up water). The registry and the stored configurations held the constant names AVT_R / AVT_O, and a
-- point declared as AVT(O) was stored verbatim and found no default limits; both now hold the trade form.
UPDATE sample_point SET treatment_regime = CASE upper(btrim(treatment_regime))
        WHEN 'AVT_R' THEN 'AVT(R)' WHEN 'AVTR' THEN 'AVT(R)' WHEN 'AVT(R)' THEN 'AVT(R)'
        WHEN 'AVT_O' THEN 'AVT(O)' WHEN 'AVTO' THEN 'AVT(O)' WHEN 'AVT(O)' THEN 'AVT(O)'
        WHEN 'PHOSPHATE' THEN 'PT' WHEN 'CAUSTIC' THEN 'CT' WHEN 'MAKEUP' THEN 'MAKE_UP'
        ELSE upper(btrim(treatment_regime)) END;

UPDATE sample_point_version
SET config = jsonb_set(config, '{treatmentRegime}', to_jsonb(CASE upper(btrim(config ->> 'treatmentRegime'))
        WHEN 'AVT_R' THEN 'AVT(R)' WHEN 'AVTR' THEN 'AVT(R)' WHEN 'AVT(R)' THEN 'AVT(R)'
        WHEN 'AVT_O' THEN 'AVT(O)' WHEN 'AVTO' THEN 'AVT(O)' WHEN 'AVT(O)' THEN 'AVT(O)'
        WHEN 'PHOSPHATE' THEN 'PT' WHEN 'CAUSTIC' THEN 'CT' WHEN 'MAKEUP' THEN 'MAKE_UP'
        ELSE upper(btrim(config ->> 'treatmentRegime')) END))
WHERE config ? 'treatmentRegime';
