-- Unit operating state (issue 14 item 4): per plant unit, the states it was in over time (in service,
-- start-up, shut down, layup wet, layup dry), entered by a chemist or an admin. A row says "from `since` the
-- unit was in `state`"; the state at a time is that of the row with the latest `since` not after it (of rows
-- with the same `since`, the latest entered: a correction is a new row, never an edit). Append-only, like the
-- rest of the chemistry record; who entered a row is the API key of the request.

CREATE TABLE unit_operating_state (
    id           bigserial   PRIMARY KEY,
    plant_id     text        NOT NULL,
    unit_id      text        NOT NULL,
    state        text        NOT NULL
                 CHECK (state IN ('IN_SERVICE', 'START_UP', 'SHUT_DOWN', 'LAYUP_WET', 'LAYUP_DRY')),
    since        timestamptz NOT NULL,
    note         text        CHECK (note IS NULL OR length(note) BETWEEN 1 AND 2000),
    recorded_at  timestamptz NOT NULL DEFAULT now(),
    key_id       text        NOT NULL,
    key_name     text        NOT NULL,
    FOREIGN KEY (plant_id, unit_id) REFERENCES plant_unit (plant_id, id)
);

CREATE INDEX unit_operating_state_unit_idx ON unit_operating_state (plant_id, unit_id, since, id);

CREATE TRIGGER unit_operating_state_append_only BEFORE UPDATE OR DELETE ON unit_operating_state
    FOR EACH ROW EXECUTE FUNCTION refuse_record_change();
CREATE TRIGGER unit_operating_state_no_truncate BEFORE TRUNCATE ON unit_operating_state
    FOR EACH STATEMENT EXECUTE FUNCTION refuse_record_change();
