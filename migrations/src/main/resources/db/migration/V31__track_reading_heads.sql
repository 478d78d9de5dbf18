-- Ingest keeps the last hours of each sample point's readings in memory, so that evaluating a new batch does not
-- read the point's history back from the database. This table says whether such a copy is still current: every
-- ingest transaction locks the rows of its sample points (in id order), reads their generation and sets a new
-- one from the sequence; a copy made at generation g is current only while the row still says g. Sequence values
-- are never reused, so a rolled-back transaction's generation never matches anything. latest_time is the latest
-- reading time ingested (NULL: not known yet; the service looks it up).
CREATE SEQUENCE reading_generation;

CREATE TABLE reading_head (
    sample_point_id  text        PRIMARY KEY,
    generation       bigint      NOT NULL,
    latest_time      timestamptz
);

INSERT INTO reading_head (sample_point_id, generation)
SELECT id, nextval('reading_generation') FROM sample_point;

-- Makes every in-memory copy stale (rows locked in id order, as the ingest locks them: no deadlock).
CREATE FUNCTION invalidate_reading_heads() RETURNS void LANGUAGE sql AS $$
    UPDATE reading_head h SET generation = nextval('reading_generation'), latest_time = NULL
    FROM (SELECT sample_point_id FROM reading_head ORDER BY sample_point_id FOR UPDATE) l
    WHERE h.sample_point_id = l.sample_point_id;
$$;

-- Readings written by anything other than the ingest (SQL by hand, bulk loads) make every in-memory copy stale;
-- so does dropping a partition (the service calls invalidate_reading_heads() after retention). The ingest marks
-- its own statements with the transaction-local setting kwanta.writer = 'ingest'.
CREATE FUNCTION reading_written_outside_ingest() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
    PERFORM invalidate_reading_heads();
    RETURN NULL;
END
$$;

CREATE TRIGGER reading_written_outside_ingest
    AFTER INSERT OR UPDATE OR DELETE ON reading
    FOR EACH STATEMENT
    WHEN (coalesce(current_setting('kwanta.writer', true), '') <> 'ingest')
    EXECUTE FUNCTION reading_written_outside_ingest();

CREATE TRIGGER reading_truncated
    AFTER TRUNCATE ON reading
    FOR EACH STATEMENT
    EXECUTE FUNCTION reading_written_outside_ingest();

-- Evaluations: the engine's full result is written once per evaluation and read back whole, so it is kept as
-- JSON text (parsing it into jsonb on every insert cost more than the rest of the row). What queries filter on
-- has columns of its own: finding_codes and, new here, the instruments the findings suspect.
ALTER TABLE evaluation ADD COLUMN suspects text[] NOT NULL DEFAULT '{}';
UPDATE evaluation
SET suspects = ARRAY(SELECT DISTINCT f ->> 'suspect' FROM jsonb_array_elements(details -> 'findings') f ORDER BY 1)
WHERE jsonb_array_length(details -> 'findings') > 0;
ALTER TABLE evaluation ALTER COLUMN details TYPE text USING details::text;
