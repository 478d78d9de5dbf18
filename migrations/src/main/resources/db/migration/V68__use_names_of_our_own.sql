-- Names of our own, one per concept (issue 18 item 4): a plant's block was called a "unit", the same word as a
-- unit of measure. The block is now `block` everywhere: tables, columns, the stored sample-point
-- configurations (key "unit" → "block") and the API. Units of measure keep the word `unit`.
-- The audit log is left as it was written (it is the record of what was sent at the time).

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
