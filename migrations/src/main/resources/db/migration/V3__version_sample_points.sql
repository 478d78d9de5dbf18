-- Sample-point configuration as versions: every change adds a row, none is overwritten, so an evaluation can
-- always be explained by the configuration in force at its time (evaluation.config_version).

ALTER TABLE sample_point
    ADD COLUMN alkalizer       text    NOT NULL DEFAULT 'AMMONIA',
    ADD COLUMN parameters      text[]  NOT NULL DEFAULT '{}',
    ADD COLUMN check_settings  jsonb   NOT NULL DEFAULT '{}',
    ADD COLUMN version         integer NOT NULL DEFAULT 1,
    ADD COLUMN updated_at      timestamptz NOT NULL DEFAULT now(),
    ADD COLUMN updated_by      text    NOT NULL DEFAULT 'system';

CREATE TABLE sample_point_version (
    sample_point_id  text        NOT NULL REFERENCES sample_point (id),
    version          integer     NOT NULL,
    valid_from       timestamptz NOT NULL DEFAULT now(),
    changed_by       text        NOT NULL,
    config           jsonb       NOT NULL,
    PRIMARY KEY (sample_point_id, version)
);

INSERT INTO sample_point_version (sample_point_id, version, changed_by, config)
SELECT id, 1, 'migration', jsonb_build_object(
           'id', id, 'unit', unit_id, 'name', name, 'cycleLocation', cycle_location,
           'treatmentRegime', treatment_regime, 'operatingTemperatureCel', operating_temperature_cel,
           'operatingPressureMPa', operating_pressure_mpa, 'alkalizer', 'AMMONIA')
FROM sample_point;
