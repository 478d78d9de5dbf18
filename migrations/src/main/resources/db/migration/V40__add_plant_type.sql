-- The kind of steam generator (CONVENTIONAL_DRUM, HRSG, ONCE_THROUGH): the default limits depend on it from
-- defaults version 2. Existing plants are conventional drum plants until they declare otherwise.
ALTER TABLE plant ADD COLUMN plant_type text NOT NULL DEFAULT 'CONVENTIONAL_DRUM';
