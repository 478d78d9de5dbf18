package org.kwanta.service.limits;

import static org.assertj.core.api.Assertions.assertThat;

import java.sql.Timestamp;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.kwanta.service.ingest.Partitions;
import org.kwanta.service.ingest.ReadingHistory;
import org.kwanta.service.support.DatabaseTest;
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

  private static final Pattern PARTITION = Pattern.compile("\\b(reading|evaluation)_p\\d{8}\\b");

  @Autowired JdbcTemplate jdbc;
  @Autowired Partitions partitions;

  @Test
  void classifyQueryPrunesThePartitionsOfBothTables() {
    LocalDate today = LocalDate.now(ZoneOffset.UTC);
    List<LocalDate> days = new ArrayList<>();
    for (int i = 60; i <= 120; i++) {
      days.add(today.minusDays(i));
    }
    partitions.ensure(days);
    Instant to = Instant.now();
    Instant from = to.minus(1, ChronoUnit.DAYS);
    List<String> plan =
        jdbc.queryForList(
            "EXPLAIN " + ReadingHistory.JUDGED,
            String.class,
            "PH",
            Timestamp.from(from),
            Timestamp.from(to),
            "NOWHERE",
            "ph",
            Timestamp.from(from),
            Timestamp.from(to));
    Set<String> reading = new TreeSet<>();
    Set<String> evaluation = new TreeSet<>();
    for (String line : plan) {
      Matcher m = PARTITION.matcher(line);
      while (m.find()) {
        (m.group(1).equals("reading") ? reading : evaluation).add(m.group());
      }
    }
    assertThat(reading).as(String.join("\n", plan)).isNotEmpty().hasSizeLessThanOrEqualTo(2);
    assertThat(evaluation).as(String.join("\n", plan)).isNotEmpty().hasSizeLessThanOrEqualTo(2);
  }
}
