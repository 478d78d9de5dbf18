-- Readings as pushed by plant historians, in the canonical unit of their parameter, and the evaluations derived
-- from them. Both are partitioned by day on time (declarative partitioning); the service creates partitions
-- ahead (and for backfilled days) and drops those past the retention horizon.

CREATE TABLE reading (
    sample_point_id         text             NOT NULL,
    parameter               text             NOT NULL,
    time                    timestamptz      NOT NULL,
    value                   double precision NOT NULL,
    quality                 smallint         NOT NULL DEFAULT 0,   -- 0 good, 1 uncertain, 2 bad
    sample_temperature_cel  double precision,
    compensated             boolean          NOT NULL DEFAULT true,
    received_at             timestamptz      NOT NULL DEFAULT now(),
    PRIMARY KEY (sample_point_id, parameter, time)
) PARTITION BY RANGE (time);

-- Safety net only: partitions are created before rows arrive, so this stays empty.
CREATE TABLE reading_default PARTITION OF reading DEFAULT;

-- A correction (same sample point, parameter and time, different value) keeps the replaced row here.
CREATE TABLE reading_revision (
    id                          bigint GENERATED ALWAYS AS IDENTITY PRIMARY KEY,
    sample_point_id             text             NOT NULL,
    parameter                   text             NOT NULL,
    time                        timestamptz      NOT NULL,
    old_value                   double precision NOT NULL,
    old_quality                 smallint         NOT NULL,
    old_sample_temperature_cel  double precision,
    old_compensated             boolean          NOT NULL,
    old_received_at             timestamptz      NOT NULL,
    new_value                   double precision NOT NULL,
    revised_at                  timestamptz      NOT NULL DEFAULT now()
);
CREATE INDEX reading_revision_point_idx ON reading_revision (sample_point_id, parameter, time);

CREATE TABLE evaluation (
    sample_point_id                  text             NOT NULL,
    time                             timestamptz      NOT NULL,
    config_version                   integer          NOT NULL,
    specific_conductivity_25         double precision,
    cation_conductivity_25           double precision,
    degassed_cation_conductivity_25  double precision,
    calculated_ph_25                 double precision,
    ph_at_temperature                double precision,
    ph_at_temperature_low            double precision,
    ph_at_temperature_high           double precision,
    neutral_ph_at_temperature        double precision,
    suspect                          boolean          NOT NULL,
    finding_codes                    text[]           NOT NULL,
    details                          jsonb            NOT NULL,
    evaluated_at                     timestamptz      NOT NULL DEFAULT now(),
    PRIMARY KEY (sample_point_id, time)
) PARTITION BY RANGE (time);

CREATE TABLE evaluation_default PARTITION OF evaluation DEFAULT;
