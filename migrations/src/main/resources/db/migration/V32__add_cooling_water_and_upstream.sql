-- The diagnosis over time needs the plant's cooling water (what a condenser leak brings in) and each sample
-- point's place on the cycle (which points feed it). Both optional: existing plants keep working without them.
ALTER TABLE plant ADD COLUMN cooling_water text;
ALTER TABLE sample_point ADD COLUMN upstream text[] NOT NULL DEFAULT '{}';
