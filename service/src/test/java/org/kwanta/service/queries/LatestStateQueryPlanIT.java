package org.kwanta.service.queries;

import static org.assertj.core.api.Assertions.assertThat;

import java.sql.Timestamp;
import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.kwanta.model.Parameter;
import org.kwanta.service.ingest.Evaluations;
import org.kwanta.service.ingest.Partitions;
import org.kwanta.service.ingest.ReadingHistory;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.QueryPlans;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.jdbc.core.JdbcTemplate;

/**
 * Issue 17, fault 4: the state of a sample point read each parameter's latest reading and the
 * latest evaluation with no time bound, so after a long backfill every daily partition of both
 * tables was planned and probed on each request. With the look-back ({@code
 * kwanta.queries.latest-look-back}, 35 days by default) the plan names only the partitions from
 * then on: at most the look-back's days plus the partitions made ahead.
 */
@DatabaseTest
class LatestStateQueryPlanIT {

  private static final int LOOK_BACK_DAYS = 35;

  /** The look-back's days, the day it starts in, today and the partitions made ahead (7). */
  private static final int MAX_PARTITIONS = LOOK_BACK_DAYS + 1 + 7 + 1;

  @Autowired JdbcTemplate jdbc;
  @Autowired Partitions partitions;

  @Test
  void latestReadingsAndEvaluationArePrunedToTheLookBack() {
    partitions.ensure(QueryPlans.days(150, 7));
    assertThat(QueryPlans.count(jdbc, "reading")).isGreaterThanOrEqualTo(150);
    assertThat(QueryPlans.count(jdbc, "evaluation")).isGreaterThanOrEqualTo(150);
    Timestamp since = Timestamp.from(Instant.now().minus(Duration.ofDays(LOOK_BACK_DAYS)));

    List<String> readings =
        QueryPlans.explain(
            jdbc, ReadingHistory.LATEST_READINGS, (Object) Parameter.codeArray(), "U1-CPD", since);
    Map<String, Set<String>> touched = QueryPlans.partitions(readings);
    assertThat(touched.get("reading"))
        .as(String.join("\n", readings))
        .isNotEmpty()
        .hasSizeLessThanOrEqualTo(MAX_PARTITIONS);

    List<String> evaluation =
        QueryPlans.explain(jdbc, Evaluations.LATEST_EVALUATION, "U1-CPD", since);
    assertThat(QueryPlans.partitions(evaluation).get("evaluation"))
        .as(String.join("\n", evaluation))
        .isNotEmpty()
        .hasSizeLessThanOrEqualTo(MAX_PARTITIONS);
  }
}
