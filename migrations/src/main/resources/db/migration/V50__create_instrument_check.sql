-- Instrument care (issue 14 item 3): the log of calibrations and checks of each online instrument (a sample
-- point and the parameter it measures), with its outcome and results. Append-only: a wrong entry is corrected
-- by a later one with a note. Who entered it is the API key of the request.

CREATE TABLE instrument_check (
    id               bigserial   PRIMARY KEY,
    sample_point_id  text        NOT NULL REFERENCES sample_point (id),
    parameter        text        NOT NULL,
    kind             text        NOT NULL
                     CHECK (kind IN ('CELL_CONSTANT_CHECK', 'BUFFER_CALIBRATION', 'SODIUM_CALIBRATION',
                                     'CATION_RESIN_CHANGE', 'DISSOLVED_OXYGEN_ZERO_SPAN')),
    performed_at     timestamptz NOT NULL,
    outcome          text        NOT NULL CHECK (outcome IN ('PASSED', 'ADJUSTED', 'FAILED')),
    results          jsonb       NOT NULL DEFAULT '[]',
    note             text        CHECK (note IS NULL OR length(note) BETWEEN 1 AND 4000),
    recorded_at      timestamptz NOT NULL DEFAULT now(),
    key_id           text        NOT NULL,
    key_name         text        NOT NULL
);

CREATE INDEX instrument_check_instrument_idx
    ON instrument_check (sample_point_id, parameter, kind, performed_at, id);

CREATE TRIGGER instrument_check_append_only BEFORE UPDATE OR DELETE ON instrument_check
    FOR EACH ROW EXECUTE FUNCTION refuse_record_change();
CREATE TRIGGER instrument_check_no_truncate BEFORE TRUNCATE ON instrument_check
    FOR EACH STATEMENT EXECUTE FUNCTION refuse_record_change();
