-- The shapes of evaluation packs (issue 19, evaluations ≤ 300 bytes). Format 3 of evaluation.detail_pack
-- (EvaluationPack) keeps a row's values (numbers, times, the figures in its explanations) in the row and
-- the rest, the structure of its fields with their codes and words, once here: consecutive evaluations of a
-- point nearly always share it (in an ingest load run 8 shapes served 145,920 rows, 179 -> 104 bytes a
-- pack). A shape is numbered once and never changes or goes (rows of any age refer to it); a shape is
-- committed before the first row that refers to it. Reference data, not per point: a sharded installation
-- keeps it whole on every node (no foreign key points here, the number is in the pack).
CREATE TABLE evaluation_shape (
    shape_id  integer GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
    shape     bytea   NOT NULL,
    CONSTRAINT evaluation_shape_shape_key UNIQUE (shape)
);
