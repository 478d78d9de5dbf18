-- The derived series' rollups (V64) leave the ingest transaction: recomputing them there from the evaluations
-- just written cost about a third of the ingest rate. The ingest now only marks each (point, UTC hour) it wrote
-- evaluations in; EvaluationRollups.settle recomputes marked hours a few seconds later, off the ingest path,
-- deleting the marks in the same transaction (before it reads, so a mark made meanwhile stays for the next
-- round). Readers take a marked hour, and the day around it, from the evaluations themselves, so an answer
-- never depends on whether the hour has been settled yet.
CREATE TABLE evaluation_rollup_pending (
    sample_point_id  text         NOT NULL,
    bucket           timestamptz  NOT NULL,
    PRIMARY KEY (sample_point_id, bucket)
);
