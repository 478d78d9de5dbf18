-- Limits as effective-dated versions (issue 13). A plant's own limits for a sample point and parameter are
-- no longer overwritten in place: every change adds a version with the time it takes effect from, so a past
-- value is always judged against the limits in force when it was measured. A version without limits (NULL)
-- records that the plant's own limits were withdrawn: the shipped default applies again from then on.
-- The shipped defaults carry a version too: limit_defaults_activation records from when each version of the
-- defaults file was in force in this database, so a new release's defaults never rewrite the past.

CREATE TABLE limit_version (
    sample_point_id  text        NOT NULL REFERENCES sample_point (id),
    parameter        text        NOT NULL,
    version          integer     NOT NULL CHECK (version >= 1),
    effective_from   timestamptz NOT NULL,
    limits           jsonb,
    reason           text,
    recorded_at      timestamptz NOT NULL DEFAULT now(),
    recorded_by      text        NOT NULL,
    PRIMARY KEY (sample_point_id, parameter, version)
);

CREATE INDEX limit_version_point_idx ON limit_version (sample_point_id, effective_from);

-- Today's overrides become version 1, in force from when they were last written (the older content was
-- overwritten and is lost).
INSERT INTO limit_version (sample_point_id, parameter, version, effective_from, limits, reason, recorded_at,
                           recorded_by)
SELECT sample_point_id, parameter, 1, updated_at, limits,
       'migrated: the override in force when limits became versions (V35)', updated_at, updated_by
FROM limit_override;

DROP TABLE limit_override;

CREATE TABLE limit_defaults_activation (
    id              serial      PRIMARY KEY,
    version         integer     NOT NULL CHECK (version >= 1),
    effective_from  timestamptz NOT NULL DEFAULT now()
);

-- defaults-v1.yaml has been the only defaults file so far: version 1. The first activation also covers every
-- earlier time.
INSERT INTO limit_defaults_activation (version) VALUES (1);

-- Records are appended, never changed.
CREATE FUNCTION refuse_record_change() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
    RAISE EXCEPTION '% is append-only: % refused', TG_TABLE_NAME, TG_OP
        USING ERRCODE = 'insufficient_privilege';
END
$$;

CREATE TRIGGER limit_version_append_only BEFORE UPDATE OR DELETE ON limit_version
    FOR EACH ROW EXECUTE FUNCTION refuse_record_change();
CREATE TRIGGER limit_version_no_truncate BEFORE TRUNCATE ON limit_version
    FOR EACH STATEMENT EXECUTE FUNCTION refuse_record_change();
CREATE TRIGGER limit_defaults_activation_append_only BEFORE UPDATE OR DELETE ON limit_defaults_activation
    FOR EACH ROW EXECUTE FUNCTION refuse_record_change();
CREATE TRIGGER limit_defaults_activation_no_truncate BEFORE TRUNCATE ON limit_defaults_activation
    FOR EACH STATEMENT EXECUTE FUNCTION refuse_record_change();
