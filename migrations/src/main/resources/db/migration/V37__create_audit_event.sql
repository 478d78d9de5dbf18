-- The audit log (issue 13): one row per change to limits, sample-point configuration, API keys and
-- acknowledgements, with who (the API key's id and name, or 'system' for start-up and declaration files),
-- when, what, the entity, and the entity before and after as JSON. Append-only: a trigger refuses UPDATE,
-- DELETE and TRUNCATE for every role that does not own the table's triggers, the application's included.

CREATE TABLE audit_event (
    id           bigserial   PRIMARY KEY,
    at           timestamptz NOT NULL DEFAULT now(),
    key_id       text        NOT NULL,
    key_name     text        NOT NULL,
    action       text        NOT NULL,
    entity_type  text        NOT NULL,
    entity_id    text        NOT NULL,
    before       jsonb,
    after        jsonb
);

CREATE INDEX audit_event_at_idx ON audit_event (at, id);
CREATE INDEX audit_event_entity_idx ON audit_event (entity_type, entity_id, id);

CREATE TRIGGER audit_event_append_only BEFORE UPDATE OR DELETE ON audit_event
    FOR EACH ROW EXECUTE FUNCTION refuse_record_change();
CREATE TRIGGER audit_event_no_truncate BEFORE TRUNCATE ON audit_event
    FOR EACH STATEMENT EXECUTE FUNCTION refuse_record_change();
