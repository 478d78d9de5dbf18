package org.kwanta.service.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.time.Duration;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.kwanta.service.support.RandomFeed;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.jdbc.core.JdbcTemplate;

/**
 * The rollups of the derived series (migration V64) equal aggregates of the stored evaluations,
 * computed here in Java from the raw rows, through a random feed ({@link RandomFeed}: out-of-order
 * batches, corrections that recompute the evaluations of the hour after them, bad readings); and a
 * derived series bucketed through the rollups equals the same series from the raw evaluations.
 */
@DatabaseTest
class EvaluationRollupsIT {

  @LocalServerPort int port;
  @Autowired JdbcTemplate jdbc;
  @Autowired StoredSeries series;
  @Autowired EvaluationRollups rollups;

  /**
   * Settles every marked hour now, as the settler does every few seconds. The application's own
   * settler runs too: the marks it holds are skipped here, so this waits until no mark is left (its
   * transaction committed) before the rollups are compared.
   */
  private void settle() {
    long deadline = System.nanoTime() + Duration.ofSeconds(30).toNanos();
    while (true) {
      while (rollups.settle() == EvaluationRollups.SETTLE_BATCH) {
        // more than one round
      }
      Integer left =
          jdbc.queryForObject("SELECT count(*)::int FROM evaluation_rollup_pending", Integer.class);
      if (left == 0) {
        return;
      }
      assertThat(System.nanoTime()).as("marks settled within 30 s").isLessThan(deadline);
      try {
        Thread.sleep(20);
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
        throw new IllegalStateException(e);
      }
    }
  }

  /** count, min, max, sum and last (at lastTime) of one bucket of one column. */
  private static final class Aggregate {
    long count;
    double min = Double.POSITIVE_INFINITY;
    double max = Double.NEGATIVE_INFINITY;
    double sum;
    double last;
    Instant lastTime;

    void add(Instant t, double v) {
      count++;
      min = Math.min(min, v);
      max = Math.max(max, v);
      sum += v;
      last = v;
      lastTime = t;
    }
  }

  /** Per "column|bucket", the aggregates of a point's evaluations, from the raw rows. */
  private Map<String, Aggregate> fromEvaluations(String point, ChronoUnit unit) {
    Map<String, Aggregate> out = new HashMap<>();
    StoredSeries.DerivedColumn[] columns = StoredSeries.DerivedColumn.values();
    StringBuilder select = new StringBuilder("SELECT time");
    for (StoredSeries.DerivedColumn c : columns) {
      select.append(", ").append(c.code());
    }
    jdbc.query(
        select
            + " FROM evaluation WHERE point_key ="
            + " (SELECT point_key FROM reading_point WHERE sample_point_id = ?) ORDER BY time",
        rs -> {
          Instant t = rs.getTimestamp(1).toInstant();
          Instant bucket = t.truncatedTo(unit);
          for (int i = 0; i < columns.length; i++) {
            double v = rs.getDouble(i + 2);
            if (!rs.wasNull()) {
              out.computeIfAbsent(columns[i].code() + "|" + bucket, k -> new Aggregate()).add(t, v);
            }
          }
        },
        point);
    return out;
  }

  private void assertRollupsEqualTheEvaluations(String point) {
    for (ChronoUnit unit : List.of(ChronoUnit.HOURS, ChronoUnit.DAYS)) {
      Map<String, Aggregate> expected = fromEvaluations(point, unit);
      Map<String, Aggregate> stored = new HashMap<>();
      String table = unit == ChronoUnit.HOURS ? "evaluation_rollup_hour" : "evaluation_rollup_day";
      jdbc.query(
          "SELECT parameter, bucket, count, min, max, sum, last, last_time FROM "
              + table
              + " WHERE point_key = (SELECT point_key FROM reading_point WHERE sample_point_id = ?)"
              + " AND count > 0",
          rs -> {
            Aggregate a = new Aggregate();
            a.count = rs.getLong(3);
            a.min = rs.getDouble(4);
            a.max = rs.getDouble(5);
            a.sum = rs.getDouble(6);
            a.last = rs.getDouble(7);
            a.lastTime = rs.getTimestamp(8).toInstant();
            stored.put(rs.getString(1) + "|" + rs.getTimestamp(2).toInstant(), a);
          },
          point);
      assertThat(stored.keySet()).as("%s rows of %s", table, point).isEqualTo(expected.keySet());
      expected.forEach(
          (key, e) -> {
            Aggregate a = stored.get(key);
            String at = String.format(Locale.ROOT, "%s %s %s", table, point, key);
            assertThat(a.count).as(at).isEqualTo(e.count);
            assertThat(a.min).as(at).isEqualTo(e.min);
            assertThat(a.max).as(at).isEqualTo(e.max);
            assertThat(a.last).as(at).isEqualTo(e.last);
            assertThat(a.lastTime).as(at).isEqualTo(e.lastTime);
            assertThat(a.sum).as(at).isCloseTo(e.sum, within(1e-9 * Math.max(1, Math.abs(e.sum))));
          });
    }
  }

  private void assertSeriesFromRollupsEqualsRaw(String point, Instant t0, Instant end) {
    Instant day = t0.truncatedTo(ChronoUnit.DAYS);
    record Ask(Instant from, Instant to, Duration bucket) {}
    List<Ask> asks =
        List.of(
            new Ask(t0, end, Duration.ofHours(1)),
            new Ask(t0.plusSeconds(1234), end, Duration.ofHours(3)),
            new Ask(day, end, Duration.ofDays(1)),
            new Ask(day.minus(Duration.ofDays(88)), end, Duration.ofHours(6)));
    for (StoredSeries.DerivedColumn c : StoredSeries.DerivedColumn.values()) {
      StoredSeries.Source source = StoredSeries.Source.evaluations(c);
      for (Ask a : asks) {
        assertThat(StoredSeries.usesRollups(source, a.from(), a.to(), a.bucket())).isTrue();
        List<StoredSeries.Bucket> rolled =
            series.bucketed(point, source, a.from(), a.to(), a.bucket());
        List<StoredSeries.Bucket> raw =
            series.bucketedRaw(point, source, a.from(), a.to(), a.bucket());
        String what = c.code() + " " + a;
        assertBucketsEqual(what, rolled, raw);
      }
    }
  }

  @Test
  void rollupsEqualAggregatesOfTheEvaluationsThroughARandomFeed() {
    RandomFeed feed = new RandomFeed(Http.admin(port), jdbc, "rollups");
    int[] steps = {0};
    feed.run(
        at -> {
          if (steps[0]++ % 10 == 0) {
            // before settling: the marked hours come from the evaluations, the answer is the same
            for (String point : feed.points()) {
              assertSeriesFromRollupsEqualsRaw(point, feed.t0, Instant.now().plusSeconds(600));
            }
            settle();
            feed.points().forEach(this::assertRollupsEqualTheEvaluations);
          }
        });
    settle();
    feed.points().forEach(this::assertRollupsEqualTheEvaluations);
    Instant end = Instant.now().plusSeconds(600);
    for (String point : feed.points()) {
      assertSeriesFromRollupsEqualsRaw(point, feed.t0, end);
    }
    Integer rows =
        jdbc.queryForObject(
            "SELECT count(*)::int FROM evaluation_rollup_hour WHERE point_key ="
                + " (SELECT point_key FROM reading_point WHERE sample_point_id = ?)"
                + " AND parameter = 'ph_at_temperature' AND count > 0",
            Integer.class,
            feed.drum);
    assertThat(rows).as("pH at temperature has rollups at the drum").isPositive();
  }

  /**
   * Buckets from the rollups equal those computed from the raw rows: counts, extremes and last bit
   * for bit, the mean to 1e-12 relative (summed in another order).
   */
  static void assertBucketsEqual(
      String what, List<StoredSeries.Bucket> rolled, List<StoredSeries.Bucket> raw) {
    assertThat(rolled).as(what).hasSameSizeAs(raw);
    for (int i = 0; i < raw.size(); i++) {
      StoredSeries.Bucket r = rolled.get(i);
      StoredSeries.Bucket e = raw.get(i);
      String at = what + " bucket " + e.start();
      assertThat(r.start()).as(at).isEqualTo(e.start());
      assertThat(r.count()).as(at).isEqualTo(e.count());
      assertThat(r.min()).as(at).isEqualTo(e.min());
      assertThat(r.max()).as(at).isEqualTo(e.max());
      assertThat(r.last()).as(at).isEqualTo(e.last());
      assertThat(r.mean()).as(at).isCloseTo(e.mean(), within(1e-12 * Math.abs(e.mean())));
    }
  }
}
