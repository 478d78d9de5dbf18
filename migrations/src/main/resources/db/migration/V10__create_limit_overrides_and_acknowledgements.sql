-- A plant's own limits per sample point and parameter (overriding the shipped example defaults), and chemists'
-- acknowledgements of excursions. Excursions themselves are derived from the stored readings on request, so
-- they follow backfill and corrections without a second copy to keep in step.

CREATE TABLE limit_override (
    sample_point_id  text        NOT NULL REFERENCES sample_point (id),
    parameter        text        NOT NULL,
    limits           jsonb       NOT NULL,
    updated_at       timestamptz NOT NULL DEFAULT now(),
    updated_by       text        NOT NULL,
    PRIMARY KEY (sample_point_id, parameter)
);

CREATE TABLE excursion_acknowledgement (
    sample_point_id  text        NOT NULL REFERENCES sample_point (id),
    parameter        text        NOT NULL,
    excursion_start  timestamptz NOT NULL,
    acknowledged_at  timestamptz NOT NULL DEFAULT now(),
    acknowledged_by  text        NOT NULL,
    note             text        NOT NULL,
    PRIMARY KEY (sample_point_id, parameter, excursion_start)
);
