-- The chemist role (issue 13): reads, acknowledges excursions, sets and withdraws limits (with a reason) and
-- reads the audit log; cannot manage keys or the plant registry.
ALTER TABLE api_key DROP CONSTRAINT api_key_role_check;
ALTER TABLE api_key ADD CONSTRAINT api_key_role_check CHECK (role IN ('ingest', 'read', 'chemist', 'admin'));
