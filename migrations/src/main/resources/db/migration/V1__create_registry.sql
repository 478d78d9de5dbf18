-- Registry of plants, units and sample points. Later migrations extend it; never edit an applied migration.
CREATE TABLE plant (
    id          text PRIMARY KEY,
    name        text NOT NULL,
    created_at  timestamptz NOT NULL DEFAULT now()
);

CREATE TABLE plant_unit (
    plant_id    text NOT NULL REFERENCES plant (id),
    id          text NOT NULL,
    name        text NOT NULL,
    PRIMARY KEY (plant_id, id)
);

CREATE TABLE sample_point (
    id                         text PRIMARY KEY,
    plant_id                   text NOT NULL REFERENCES plant (id),
    unit_id                    text NOT NULL,
    name                       text NOT NULL,
    cycle_location             text NOT NULL,
    treatment_regime           text NOT NULL,
    operating_temperature_cel  double precision,
    operating_pressure_mpa     double precision,
    created_at                 timestamptz NOT NULL DEFAULT now(),
    FOREIGN KEY (plant_id, unit_id) REFERENCES plant_unit (plant_id, id)
);

CREATE INDEX sample_point_plant_idx ON sample_point (plant_id, unit_id);
