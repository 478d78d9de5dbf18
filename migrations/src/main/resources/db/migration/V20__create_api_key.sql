-- API keys. The secret is never stored: only a random per-key salt and SHA-256(salt || secret).
-- A key reads kw_<id>_<secret>; the id is public and finds the row. Revoked keys stay for the record.
CREATE TABLE api_key (
    id            text PRIMARY KEY CHECK (id ~ '^[a-z0-9]{1,32}$'),
    name          text NOT NULL CHECK (length(name) BETWEEN 1 AND 200),
    role          text NOT NULL CHECK (role IN ('ingest', 'read', 'admin')),
    secret_salt   bytea NOT NULL,
    secret_hash   bytea NOT NULL,
    created_at    timestamptz NOT NULL DEFAULT now(),
    revoked_at    timestamptz,
    last_used_at  timestamptz
);

CREATE INDEX api_key_active_role_idx ON api_key (role) WHERE revoked_at IS NULL;
