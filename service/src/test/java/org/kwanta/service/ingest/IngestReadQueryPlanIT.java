package org.kwanta.service.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import java.sql.Timestamp;
import java.time.Duration;
import java.time.Instant;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.QueryPlans;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.jdbc.core.JdbcTemplate;

/**
 * Issue 17, fault 4: the ingest's look-up of a point's latest stored reading had no time bound, so
 * its plan held every daily partition of {@code reading} (hundreds after a long backfill). Bounded
 * below by the batch's latest time, it names only the partitions from that day on; the load of a
 * point's recent readings likewise names only the partitions from the earliest time it needs.
 */
@DatabaseTest
class IngestReadQueryPlanIT {

  /** The batch's day and the partitions made ahead (7), and one day of slack. */
  private static final int MAX_PARTITIONS = 1 + 7 + 1;

  @Autowired JdbcTemplate jdbc;
  @Autowired Partitions partitions;

  @Test
  void latestStoredLooksOnlyAtPartitionsAfterTheBatch() {
    partitions.ensure(QueryPlans.days(150, 7));
    assertThat(QueryPlans.count(jdbc, "reading")).isGreaterThanOrEqualTo(150);
    Timestamp after = Timestamp.from(Instant.now().minus(Duration.ofMinutes(5)));
    List<String> plan =
        QueryPlans.explain(
            jdbc,
            ReadingStore.LATEST_STORED,
            (Object) org.kwanta.model.Parameter.codeArray(),
            "U1-CPD",
            after);
    assertThat(QueryPlans.partitions(plan).get("reading"))
        .as(String.join("\n", plan))
        .isNotEmpty()
        .hasSizeLessThanOrEqualTo(MAX_PARTITIONS);
  }

  @Test
  void recentReadingsLoadLooksOnlyAtPartitionsFromTheEarliestTimeNeeded() {
    partitions.ensure(QueryPlans.days(150, 7));
    Instant since = Instant.now().minus(Duration.ofMinutes(75));
    List<String> plan =
        QueryPlans.explain(
            jdbc,
            ReadingStore.LOAD_SINCE,
            new String[] {"U1-CPD", "U2-CPD"},
            new String[] {since.toString(), since.toString()},
            org.kwanta.model.Parameter.codeArray(),
            Timestamp.from(since));
    assertThat(QueryPlans.partitions(plan).get("reading"))
        .as(String.join("\n", plan))
        .isNotEmpty()
        .hasSizeLessThanOrEqualTo(MAX_PARTITIONS + 1);
  }
}
