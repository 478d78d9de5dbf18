-- Ready to shard by sample point: every reading-side table carries sample_point_id in its primary key
-- and unique constraints, so a distributed PostgreSQL (for example the Citus extension) can distribute
-- reading, reading_revision, evaluation, reading_head and lab_result by sample_point_id and keep every
-- key check on one shard. reading_revision was the one keyed by its identity column alone.
ALTER TABLE reading_revision DROP CONSTRAINT reading_revision_pkey;
ALTER TABLE reading_revision ADD PRIMARY KEY (sample_point_id, id);
