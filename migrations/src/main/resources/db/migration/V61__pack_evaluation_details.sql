-- Evaluations keep their details in a compact binary form (service: ingest/EvaluationPack, format byte first):
-- about 250 bytes instead of about 3 kB of JSON text, which also kept every row above PostgreSQL's 2 kB TOAST
-- threshold (compressed on every insert). Rows written before keep their JSON in details and read back as
-- before; a row has one of the two (the writer sets detail_pack and leaves details NULL; a re-evaluation
-- rewrites an old row in the new form).
ALTER TABLE evaluation ADD COLUMN detail_pack bytea;
ALTER TABLE evaluation ALTER COLUMN details DROP NOT NULL;
