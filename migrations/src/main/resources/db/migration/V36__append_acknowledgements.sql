-- Acknowledgements of excursions as an append-only history (issue 13): a second acknowledgement no longer
-- overwrites the first, and who acknowledged is the API key of the request (its id and name), not a free
-- text. Rows from before this migration keep their free-text "by" as key_name with key_id 'legacy'.

ALTER TABLE excursion_acknowledgement DROP CONSTRAINT excursion_acknowledgement_pkey;
ALTER TABLE excursion_acknowledgement ADD COLUMN id bigserial PRIMARY KEY;
ALTER TABLE excursion_acknowledgement RENAME COLUMN acknowledged_by TO key_name;
ALTER TABLE excursion_acknowledgement ADD COLUMN key_id text NOT NULL DEFAULT 'legacy';
ALTER TABLE excursion_acknowledgement ALTER COLUMN key_id DROP DEFAULT;

CREATE INDEX excursion_acknowledgement_excursion_idx
    ON excursion_acknowledgement (sample_point_id, parameter, excursion_start, id);

CREATE TRIGGER excursion_acknowledgement_append_only BEFORE UPDATE OR DELETE ON excursion_acknowledgement
    FOR EACH ROW EXECUTE FUNCTION refuse_record_change();
CREATE TRIGGER excursion_acknowledgement_no_truncate BEFORE TRUNCATE ON excursion_acknowledgement
    FOR EACH STATEMENT EXECUTE FUNCTION refuse_record_change();
