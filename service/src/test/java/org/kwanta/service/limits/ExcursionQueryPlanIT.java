package org.kwanta.service.limits;

import static org.assertj.core.api.Assertions.assertThat;

import java.sql.Timestamp;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.kwanta.service.ingest.Partitions;
import org.kwanta.service.ingest.ReadingHistory;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.QueryPlans;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.jdbc.core.JdbcTemplate;

/**
 * Issue 17, fault 4: after a long backfill made hundreds of daily partitions, {@code GET
 * /api/v1/excursions} stayed slow because its query bounded the readings by time but not the
 * evaluations joined to them, so PostgreSQL scanned every evaluation partition. The plan of the
 * query over one day must touch only that day's partitions of both tables.
 */
@DatabaseTest
class ExcursionQueryPlanIT {

  @Autowired JdbcTemplate jdbc;
  @Autowired Partitions partitions;

  @Test
  void classifyQueryPrunesThePartitionsOfBothTables() {
    partitions.ensure(QueryPlans.days(120, 0).subList(0, 61));
    Instant to = Instant.now();
    Instant from = to.minus(1, ChronoUnit.DAYS);
    List<String> plan =
        QueryPlans.explain(
            jdbc,
            ReadingHistory.JUDGED,
            "PH",
            "NOWHERE",
            Timestamp.from(from),
            Timestamp.from(to),
            "NOWHERE",
            "ph",
            Timestamp.from(from),
            Timestamp.from(to));
    Map<String, Set<String>> touched = QueryPlans.partitions(plan);
    assertThat(touched.get("reading"))
        .as(String.join("\n", plan))
        .isNotEmpty()
        .hasSizeLessThanOrEqualTo(2);
    assertThat(touched.get("evaluation"))
        .as(String.join("\n", plan))
        .isNotEmpty()
        .hasSizeLessThanOrEqualTo(2);
  }
}
