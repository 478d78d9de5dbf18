-- Excursion events (issue 13): excursions grouped under one event with a cause category of Kwanta's own, a
-- status (OPEN, UNDER_INVESTIGATION, CLOSED) and notes. Append-only: the event row, its members and its
-- entries are never changed; a status or cause change is a new entry, and the current status and cause are
-- those of the latest entry that set them.

CREATE TABLE excursion_event (
    id            bigserial   PRIMARY KEY,
    title         text        NOT NULL CHECK (length(title) BETWEEN 1 AND 200),
    created_at    timestamptz NOT NULL DEFAULT now(),
    key_id        text        NOT NULL,
    key_name      text        NOT NULL
);

CREATE TABLE excursion_event_member (
    event_id         bigint      NOT NULL REFERENCES excursion_event (id),
    sample_point_id  text        NOT NULL REFERENCES sample_point (id),
    parameter        text        NOT NULL,
    excursion_start  timestamptz NOT NULL,
    added_at         timestamptz NOT NULL DEFAULT now(),
    key_id           text        NOT NULL,
    PRIMARY KEY (event_id, sample_point_id, parameter, excursion_start)
);

CREATE INDEX excursion_event_member_excursion_idx
    ON excursion_event_member (sample_point_id, parameter, excursion_start);

CREATE TABLE excursion_event_entry (
    id              bigserial   PRIMARY KEY,
    event_id        bigint      NOT NULL REFERENCES excursion_event (id),
    at              timestamptz NOT NULL DEFAULT now(),
    key_id          text        NOT NULL,
    key_name        text        NOT NULL,
    status          text        CHECK (status IN ('OPEN', 'UNDER_INVESTIGATION', 'CLOSED')),
    cause_category  text,
    note            text        NOT NULL CHECK (length(note) BETWEEN 1 AND 4000)
);

CREATE INDEX excursion_event_entry_event_idx ON excursion_event_entry (event_id, id);

CREATE TRIGGER excursion_event_append_only BEFORE UPDATE OR DELETE ON excursion_event
    FOR EACH ROW EXECUTE FUNCTION refuse_record_change();
CREATE TRIGGER excursion_event_no_truncate BEFORE TRUNCATE ON excursion_event
    FOR EACH STATEMENT EXECUTE FUNCTION refuse_record_change();
CREATE TRIGGER excursion_event_member_append_only BEFORE UPDATE OR DELETE ON excursion_event_member
    FOR EACH ROW EXECUTE FUNCTION refuse_record_change();
CREATE TRIGGER excursion_event_member_no_truncate BEFORE TRUNCATE ON excursion_event_member
    FOR EACH STATEMENT EXECUTE FUNCTION refuse_record_change();
CREATE TRIGGER excursion_event_entry_append_only BEFORE UPDATE OR DELETE ON excursion_event_entry
    FOR EACH ROW EXECUTE FUNCTION refuse_record_change();
CREATE TRIGGER excursion_event_entry_no_truncate BEFORE TRUNCATE ON excursion_event_entry
    FOR EACH STATEMENT EXECUTE FUNCTION refuse_record_change();
