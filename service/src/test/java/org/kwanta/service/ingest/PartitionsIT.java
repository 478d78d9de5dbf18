package org.kwanta.service.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpResponse;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.transaction.PlatformTransactionManager;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Daily partitions with several instances on one database (issue 17, fault 3) and the bound on the
 * partitions one request may create (fault 4). Another instance is a second {@link Partitions} on
 * the same database, with a list of partitions of its own.
 */
@DatabaseTest
class PartitionsIT {

  private static final JsonMapper JSON = JsonMapper.builder().build();
  private static final DateTimeFormatter SUFFIX = DateTimeFormatter.ofPattern("yyyyMMdd");

  @LocalServerPort int port;
  @Autowired JdbcTemplate jdbc;
  @Autowired PlatformTransactionManager transactions;
  Http http;

  @BeforeEach
  void client() {
    http = Http.admin(port);
  }

  @Test
  void readingsAndEvaluationsHaveNoDefaultPartition() {
    assertThat(jdbc.queryForObject("SELECT to_regclass('reading_default')", String.class)).isNull();
    assertThat(jdbc.queryForObject("SELECT to_regclass('evaluation_default')", String.class))
        .isNull();
  }

  /**
   * The planner statistics of the days being written are refreshed (the machine's PostgreSQL may
   * run with autovacuum off, and a day's partition is new every day); days without a partition are
   * passed over.
   */
  @Test
  void theStatisticsOfTheRecentDaysAreRefreshed(@Autowired Partitions partitions) {
    String point = TestPlants.feedwaterPoints(http, 1).get(0);
    Instant noon = daysAgo(240).plus(12, ChronoUnit.HOURS);
    LocalDate day = LocalDate.ofInstant(noon, ZoneOffset.UTC);
    assertThat(post(ReadingsIngestIT.feedwaterReadings(point, noon, 3, 20)).statusCode())
        .isEqualTo(200);
    List<String> analyzed = partitions.analyze(List.of(day, day.minusDays(1000)));
    assertThat(analyzed)
        .containsExactly("evaluation_p" + day.format(SUFFIX), "reading_p" + day.format(SUFFIX));
    for (String partition : analyzed) {
      assertThat(
              jdbc.queryForObject(
                  // -1 until analyzed (PostgreSQL 14 and later); the catalogue row is
                  // transactional,
                  // unlike the statistics views
                  "SELECT reltuples > 0 FROM pg_class WHERE relname = ?", Boolean.class, partition))
          .as(partition)
          .isTrue();
    }
  }

  @Test
  void aDayDroppedByAnotherInstanceIsMadeAgainNotWrittenToADefaultPartition() {
    String point = TestPlants.feedwaterPoints(http, 1).get(0);
    Instant noon = daysAgo(250).plus(12, ChronoUnit.HOURS);
    LocalDate day = LocalDate.ofInstant(noon, ZoneOffset.UTC);
    assertThat(post(ReadingsIngestIT.feedwaterReadings(point, noon, 3, 20)).statusCode())
        .isEqualTo(200);
    // another instance's retention drops the day; this instance still lists it as made
    jdbc.execute("DROP TABLE reading_p" + day.format(SUFFIX));
    jdbc.execute("DROP TABLE evaluation_p" + day.format(SUFFIX));

    HttpResponse<String> late =
        post(ReadingsIngestIT.feedwaterReadings(point, noon.plusSeconds(3600), 3, 20));
    assertThat(late.statusCode()).as(late.body()).isEqualTo(200);
    assertThat(outsideDailyPartitions()).isZero();
    assertThat(
            jdbc.queryForObject(
                "SELECT count(*) FROM reading_p"
                    + day.format(SUFFIX)
                    + " WHERE point_key = (SELECT point_key FROM reading_point WHERE"
                    + " sample_point_id = ?)",
                Integer.class,
                point))
        .isEqualTo(15);
    // a third instance, with a fresh list, can still make the day, and the day takes more data
    new Partitions(jdbc, transactions).ensure(List.of(day));
    HttpResponse<String> more =
        post(ReadingsIngestIT.feedwaterReadings(point, noon.plusSeconds(7200), 3, 20));
    assertThat(more.statusCode()).as(more.body()).isEqualTo(200);
    assertThat(outsideDailyPartitions()).isZero();
  }

  @Test
  void ingestWhileAnotherInstanceKeepsDroppingTheDayIsNeverLostOrMisplaced() throws Exception {
    String point = TestPlants.feedwaterPoints(http, 1).get(0);
    Instant noon = daysAgo(390).plus(12, ChronoUnit.HOURS);
    LocalDate day = LocalDate.ofInstant(noon, ZoneOffset.UTC);
    Partitions other = new Partitions(jdbc, transactions);
    AtomicBoolean stop = new AtomicBoolean();
    AtomicInteger drops = new AtomicInteger();
    Thread retention =
        new Thread(
            () -> {
              while (!stop.get()) {
                if (!other.dropBefore(day.plusDays(1)).isEmpty()) {
                  drops.incrementAndGet();
                }
                try {
                  Thread.sleep(150);
                } catch (InterruptedException e) {
                  return;
                }
              }
            });
    retention.start();
    List<Integer> statuses = new ArrayList<>();
    try {
      for (int i = 0; i < 20; i++) {
        statuses.add(
            post(ReadingsIngestIT.feedwaterReadings(point, noon.plusSeconds(i * 300L), 1, 20))
                .statusCode());
        Thread.sleep(60);
      }
    } finally {
      stop.set(true);
      retention.join();
    }
    assertThat(statuses).containsOnly(200);
    assertThat(drops.get()).isPositive();
    assertThat(outsideDailyPartitions()).isZero();
  }

  @Test
  void aBackfillReachingMoreNewDaysThanAllowedIsRefusedWhole() {
    String point = TestPlants.feedwaterPoints(http, 1).get(0);
    Instant first = daysAgo(380).plus(12, ChronoUnit.HOURS);
    List<String> daily = new ArrayList<>();
    for (int i = 0; i < 40; i++) {
      daily.add(
          ReadingsIngestIT.reading(
              point, "ph", first.plus(i, ChronoUnit.DAYS).toString(), 9.6, "[pH]", ""));
    }
    HttpResponse<String> refused = post(daily);
    assertThat(refused.statusCode()).as(refused.body()).isEqualTo(422);
    JsonNode problem = JSON.readTree(refused.body());
    assertThat(problem.get("type").asString()).isEqualTo("urn:kwanta:problem:too-many-new-days");
    assertThat(problem.get("limit").asInt()).isEqualTo(31);
    assertThat(problem.get("detail").asString())
        .contains("40 days")
        .contains("31")
        .contains("kwanta.ingest.max-new-days-per-request");
    LocalDate firstDay = LocalDate.ofInstant(first, ZoneOffset.UTC);
    assertThat(
            jdbc.queryForObject(
                "SELECT to_regclass(?)", String.class, "reading_p" + firstDay.format(SUFFIX)))
        .isNull();
    assertThat(count(point)).isZero();

    HttpResponse<String> accepted = post(daily.subList(0, 20));
    assertThat(accepted.statusCode()).as(accepted.body()).isEqualTo(200);
    assertThat(count(point)).isEqualTo(20);
  }

  private HttpResponse<String> post(List<String> readings) {
    return http.post("/api/v1/readings", "application/json", ReadingsIngestIT.batch(readings));
  }

  private static Instant daysAgo(int days) {
    return Instant.now().truncatedTo(ChronoUnit.DAYS).minus(days, ChronoUnit.DAYS);
  }

  /** Rows of either table stored anywhere but in a daily partition (e.g. a default partition). */
  private int outsideDailyPartitions() {
    return jdbc.queryForObject(
        "SELECT (SELECT count(*) FROM reading WHERE tableoid::regclass::text !~ '_p[0-9]{8}$')"
            + " + (SELECT count(*) FROM evaluation"
            + " WHERE tableoid::regclass::text !~ '_p[0-9]{8}$')",
        Integer.class);
  }

  private int count(String point) {
    return jdbc.queryForObject(
        "SELECT count(*) FROM reading_named WHERE sample_point_id = ?", Integer.class, point);
  }
}
