-- Registry of plants, units and sample points (issue: foundation; extended by later migrations).
CREATE TABLE plant (
    id          text PRIMARY KEY,
    name        text NOT NULL,
    created_at  timestamptz NOT NULL DEFAULT now()
);

CREATE TABLE unit (
    plant_id    text NOT NULL REFERENCES plant (id),
    id          text NOT NULL,
    name        text NOT NULL,
    PRIMARY KEY (plant_id, id)
);

CREATE TABLE sample_point (
    id                text PRIMARY KEY,
    plant_id          text NOT NULL,
    unit_id           text,
    name              text NOT NULL,
    cycle_location    text NOT NULL,
    treatment_regime  text NOT NULL,
    created_at        timestamptz NOT NULL DEFAULT now(),
    FOREIGN KEY (plant_id) REFERENCES plant (id),
    FOREIGN KEY (plant_id, unit_id) REFERENCES unit (plant_id, id)
);
