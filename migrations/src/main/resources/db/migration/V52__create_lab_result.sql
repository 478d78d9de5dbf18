-- Lab and grab results (issue 14 item 1): values from samples taken by hand and analysed at the sample panel
-- (grab) or in the laboratory (lab). Kept apart from the online readings (table reading), so they never become
-- a point's current online value, never count for stale-data alarms and are not evaluated as online readings.
-- Values in the parameter's canonical unit; a value reported below the detection limit is stored censored
-- ('below') with the limit as its value. Who entered it is the API key of the request.

CREATE TABLE lab_result (
    sample_point_id        text             NOT NULL REFERENCES sample_point (id),
    parameter              text             NOT NULL,
    time                   timestamptz      NOT NULL,
    source                 text             NOT NULL CHECK (source IN ('grab', 'lab')),
    value                  double precision NOT NULL,
    censored               text             CHECK (censored IS NULL OR censored = 'below'),
    sample_id              text             CHECK (sample_id IS NULL OR length(sample_id) BETWEEN 1 AND 64),
    lab_method             text             CHECK (lab_method IS NULL OR length(lab_method) BETWEEN 1 AND 200),
    sent_value             double precision NOT NULL,
    sent_unit              text             NOT NULL,
    conversion_factor      double precision,
    density_kg_m3          double precision,
    density_temperature_cel double precision,
    key_id                 text             NOT NULL,
    key_name               text             NOT NULL,
    recorded_at            timestamptz      NOT NULL DEFAULT now(),
    PRIMARY KEY (sample_point_id, parameter, time, source)
);

CREATE INDEX lab_result_time_idx ON lab_result (time);
