-- A sample point's configuration version may be in force from a past time (an admin's correction of the
-- record, with a reason); valid_from is that time, recorded_at when it was entered.
ALTER TABLE sample_point_version
    ADD COLUMN reason      text,
    ADD COLUMN recorded_at timestamptz NOT NULL DEFAULT now();
