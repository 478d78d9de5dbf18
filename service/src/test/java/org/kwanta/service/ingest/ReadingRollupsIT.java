package org.kwanta.service.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.sql.Timestamp;
import java.time.Duration;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;
import java.util.TreeMap;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.jdbc.core.JdbcTemplate;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The hourly and daily rollups (V60) equal the aggregates of the stored readings, computed here
 * plainly from what was sent, after random out-of-order batches and corrections; and the bucketed
 * series read from them equals the one read from the raw rows. Values are invented (demo-style
 * feedwater sodium and cation conductivity), not measurements.
 */
@DatabaseTest
class ReadingRollupsIT {

  private static final JsonMapper JSON = JsonMapper.builder().build();
  private static final String[] PARAMETERS = {"sodium", "cation_conductivity"};
  private static final String[] UNITS = {"ug/kg", "uS/cm"};
  private static final String[] QUALITIES = {"good", "uncertain", "bad"};

  @LocalServerPort int port;
  @Autowired JdbcTemplate jdbc;
  @Autowired StoredSeries series;
  Http http;

  @BeforeEach
  void client() {
    http = Http.admin(port);
  }

  /** One reading as the test last sent it. */
  record Sent(String point, String parameter, Instant time, double value, int quality) {}

  /** The readings' series start: 20:00 UTC two days ago, so they span two UTC days. */
  private static Instant start() {
    return Instant.now().truncatedTo(ChronoUnit.DAYS).minus(2, ChronoUnit.DAYS).plusSeconds(72_000);
  }

  /**
   * Sends readings at irregular times (30 to 300 s apart) for 30 h, shuffled, in random batches;
   * then corrections of random readings (value and quality) in random batches, and one hour of one
   * series turned bad entirely. Returns the final state per key.
   */
  private Map<String, Sent> sendRandomly(List<String> points, Random random) {
    Map<String, Sent> state = new HashMap<>();
    List<Sent> all = new ArrayList<>();
    Instant end = start().plus(Duration.ofHours(30));
    for (String point : points) {
      for (int p = 0; p < PARAMETERS.length; p++) {
        for (Instant t = start(); t.isBefore(end); t = t.plusSeconds(30 + random.nextInt(271))) {
          double value =
              p == 0 ? 0.4 + 0.1 * random.nextGaussian() : 0.08 + 0.01 * random.nextGaussian();
          all.add(
              new Sent(point, PARAMETERS[p], t, Math.abs(value), random.nextInt(10) == 0 ? 1 : 0));
        }
      }
    }
    Collections.shuffle(all, random);
    send(all, random, state);
    List<Sent> corrections = new ArrayList<>();
    for (int i = 0; i < all.size() / 10; i++) {
      Sent s = all.get(random.nextInt(all.size()));
      corrections.add(
          new Sent(s.point(), s.parameter(), s.time(), s.value() * 1.5, random.nextInt(3)));
    }
    // one whole hour of one series turned bad: no good reading left there
    Instant badHour = start().plus(Duration.ofHours(5));
    for (Sent s : all) {
      if (s.point().equals(points.get(0))
          && s.parameter().equals("sodium")
          && s.time().truncatedTo(ChronoUnit.HOURS).equals(badHour)) {
        corrections.add(new Sent(s.point(), s.parameter(), s.time(), s.value(), 2));
      }
    }
    send(corrections, random, state);
    return state;
  }

  private void send(List<Sent> readings, Random random, Map<String, Sent> state) {
    send(readings, random, state, 0);
  }

  /** Sends in batches of {@code size} readings, or of 50 to 650 at random when size is 0. */
  private void send(List<Sent> readings, Random random, Map<String, Sent> state, int size) {
    int i = 0;
    while (i < readings.size()) {
      int n = Math.min(readings.size() - i, size > 0 ? size : 50 + random.nextInt(600));
      List<String> json = new ArrayList<>();
      for (Sent s : readings.subList(i, i + n)) {
        int p = s.parameter().equals("sodium") ? 0 : 1;
        json.add(
            ReadingsIngestIT.reading(
                s.point(),
                s.parameter(),
                s.time().toString(),
                s.value(),
                UNITS[p],
                ",\"quality\":\"" + QUALITIES[s.quality()] + "\""));
        state.put(s.point() + '/' + s.parameter() + '/' + s.time(), s);
      }
      var r = http.post("/api/v1/readings", "application/json", ReadingsIngestIT.batch(json));
      assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
      i += n;
    }
  }

  /** Aggregates of one bucket computed plainly from the readings. */
  record Expected(
      long count,
      double min,
      double max,
      double sum,
      double last,
      Instant firstTime,
      Instant lastTime,
      double twSum,
      double heldSeconds) {}

  /**
   * Per series and bucket of {@code unit} (hours or days), from the good and uncertain readings.
   */
  static Map<String, Expected> expected(Map<String, Sent> state, ChronoUnit unit) {
    Map<String, TreeMap<Instant, Double>> byBucket = new TreeMap<>();
    for (Sent s : state.values()) {
      if (s.quality() < 2) {
        byBucket
            .computeIfAbsent(
                s.point() + '/' + s.parameter() + '/' + s.time().truncatedTo(unit),
                k -> new TreeMap<>())
            .put(s.time(), s.value());
      }
    }
    Map<String, Expected> out = new TreeMap<>();
    byBucket.forEach(
        (key, values) -> {
          Instant bucketEnd = values.firstKey().truncatedTo(unit).plus(1, unit);
          double min = Double.POSITIVE_INFINITY;
          double max = Double.NEGATIVE_INFINITY;
          double sum = 0;
          double tw = 0;
          List<Map.Entry<Instant, Double>> e = new ArrayList<>(values.entrySet());
          for (int i = 0; i < e.size(); i++) {
            double v = e.get(i).getValue();
            min = Math.min(min, v);
            max = Math.max(max, v);
            sum += v;
            Instant until = i + 1 < e.size() ? e.get(i + 1).getKey() : bucketEnd;
            tw += v * Duration.between(e.get(i).getKey(), until).toMillis() / 1000.0;
          }
          out.put(
              key,
              new Expected(
                  values.size(),
                  min,
                  max,
                  sum,
                  values.lastEntry().getValue(),
                  values.firstKey(),
                  values.lastKey(),
                  tw,
                  Duration.between(values.firstKey(), bucketEnd).toMillis() / 1000.0));
        });
    return out;
  }

  private Map<String, Expected> stored(String table, List<String> points) {
    return stored(jdbc, table, points);
  }

  /** The stored rollups of the points' series with readings, by "point/parameter/bucket". */
  static Map<String, Expected> stored(JdbcTemplate jdbc, String table, List<String> points) {
    Map<String, Expected> out = new TreeMap<>();
    for (String point : points) {
      jdbc.query(
          "SELECT k.sample_point_id, q.code, bucket, count, min, max, sum, last, first_time,"
              + " last_time, tw_sum, held_seconds, mean, time_weighted_mean FROM "
              + table
              + " JOIN reading_point k USING (point_key)"
              + " JOIN reading_parameter q USING (parameter_key)"
              + " WHERE k.sample_point_id = ? AND count > 0",
          rs -> {
            Instant bucket = rs.getTimestamp(3).toInstant();
            double sum = rs.getDouble(7);
            long count = rs.getLong(4);
            assertThat(rs.getDouble(13)).isCloseTo(sum / count, within(1e-12 * Math.abs(sum)));
            assertThat(rs.getDouble(14))
                .isCloseTo(rs.getDouble(11) / rs.getDouble(12), within(1e-9));
            out.put(
                rs.getString(1) + '/' + rs.getString(2) + '/' + bucket,
                new Expected(
                    count,
                    rs.getDouble(5),
                    rs.getDouble(6),
                    sum,
                    rs.getDouble(8),
                    rs.getTimestamp(9).toInstant(),
                    rs.getTimestamp(10).toInstant(),
                    rs.getDouble(11),
                    rs.getDouble(12)));
          },
          point);
    }
    return out;
  }

  static void assertSame(Map<String, Expected> actual, Map<String, Expected> expected) {
    assertThat(actual.keySet()).containsExactlyElementsOf(expected.keySet());
    expected.forEach(
        (key, e) -> {
          Expected a = actual.get(key);
          assertThat(a.count()).as(key).isEqualTo(e.count());
          assertThat(a.min()).as(key).isEqualTo(e.min());
          assertThat(a.max()).as(key).isEqualTo(e.max());
          assertThat(a.last()).as(key).isEqualTo(e.last());
          assertThat(a.firstTime()).as(key).isEqualTo(e.firstTime());
          assertThat(a.lastTime()).as(key).isEqualTo(e.lastTime());
          assertThat(a.heldSeconds()).as(key).isCloseTo(e.heldSeconds(), within(1e-6));
          // sums differ from a plain sum only by rounding in another order
          assertThat(a.sum()).as(key).isCloseTo(e.sum(), within(1e-12 * Math.abs(e.sum()) + 1e-15));
          assertThat(a.twSum())
              .as(key)
              .isCloseTo(e.twSum(), within(1e-11 * Math.abs(e.twSum()) + 1e-12));
        });
  }

  @Test
  void rollupsEqualAggregatesOfTheReadingsAfterShuffledBatchesAndCorrections() {
    List<String> points = TestPlants.feedwaterPoints(http, 2);
    Map<String, Sent> state = sendRandomly(points, new Random(19));

    Map<String, Expected> hours = expected(state, ChronoUnit.HOURS);
    assertSame(stored("reading_rollup_hour", points), hours);
    assertSame(stored("reading_rollup_day", points), expected(state, ChronoUnit.DAYS));
    // the hour turned bad has no readings to sum up, and the series' hours still span 30 h
    String bad = points.get(0) + "/sodium/" + start().plus(Duration.ofHours(5));
    assertThat(hours).doesNotContainKey(bad);
    assertThat(hours).containsKey(points.get(0) + "/sodium/" + start().plus(Duration.ofHours(6)));
    assertThat(
            jdbc.queryForObject(
                "SELECT count FROM reading_rollup_hour WHERE point_key = (SELECT point_key FROM"
                    + " reading_point WHERE sample_point_id = ?) AND parameter_key = (SELECT"
                    + " parameter_key FROM reading_parameter WHERE code = 'sodium') AND bucket = ?",
                Integer.class,
                points.get(0),
                Timestamp.from(start().plus(Duration.ofHours(5)))))
        .isZero();
  }

  @Test
  void liveDataInTimeOrderIsAddedToItsHours() {
    // the ingest adds readings that follow an hour's last one without reading the hour again
    List<String> points = TestPlants.feedwaterPoints(http, 1);
    String point = points.get(0);
    Random random = new Random(23);
    List<Sent> all = new ArrayList<>();
    Instant end = start().plus(Duration.ofHours(3));
    for (Instant t = start(); t.isBefore(end); t = t.plusSeconds(5 + random.nextInt(36))) {
      for (int p = 0; p < PARAMETERS.length; p++) {
        double base = p == 0 ? 0.4 : 0.08;
        int quality = random.nextInt(10) == 0 ? 2 : random.nextInt(10) == 0 ? 1 : 0;
        all.add(
            new Sent(point, PARAMETERS[p], t, base * (1 + 0.1 * random.nextGaussian()), quality));
      }
    }
    Map<String, Sent> state = new HashMap<>();
    // the first 10 minutes, in order; then all of them turned bad (the hour's row keeps no
    // reading); then the rest in order, in small batches
    Instant tenMinutes = start().plusSeconds(600);
    List<Sent> first = all.stream().filter(s -> s.time().isBefore(tenMinutes)).toList();
    for (int i = 0; i < first.size(); i += 20) {
      sendInOrder(first.subList(i, Math.min(first.size(), i + 20)), state);
    }
    sendInOrder(
        first.stream()
            .map(s -> new Sent(s.point(), s.parameter(), s.time(), s.value(), 2))
            .toList(),
        state);
    List<Sent> rest = all.stream().filter(s -> !s.time().isBefore(tenMinutes)).toList();
    for (int i = 0, n; i < rest.size(); i += n) {
      n = 2 + random.nextInt(40);
      sendInOrder(rest.subList(i, Math.min(rest.size(), i + n)), state);
    }
    assertSame(stored("reading_rollup_hour", points), expected(state, ChronoUnit.HOURS));
    assertSame(stored("reading_rollup_day", points), expected(state, ChronoUnit.DAYS));
  }

  @Test
  void refreshRecomputesAfterReadingsWereChangedBySql() {
    List<String> points = TestPlants.feedwaterPoints(http, 1);
    Map<String, Sent> state = new HashMap<>();
    List<Sent> sent = new ArrayList<>();
    for (int i = 0; i < 200; i++) {
      sent.add(new Sent(points.get(0), "sodium", start().plusSeconds(97L * i), 0.3 + 0.001 * i, 0));
    }
    sendInOrder(sent, state);
    // SQL by hand bypasses the ingest, and so the rollups, until they are refreshed
    jdbc.update(
        "UPDATE reading SET value = value * 2 WHERE point_key = (SELECT point_key FROM"
            + " reading_point WHERE sample_point_id = ?) AND time >= ?"
            + " AND time < ?",
        points.get(0),
        Timestamp.from(start()),
        Timestamp.from(start().plusSeconds(86_400)));
    jdbc.queryForList(
        "SELECT refresh_reading_rollups(?, ?)::text",
        String.class,
        Timestamp.from(start().plusSeconds(1800)),
        Timestamp.from(start().plusSeconds(86_400)));
    Map<String, Sent> doubled = new HashMap<>();
    state.forEach(
        (k, s) ->
            doubled.put(
                k, new Sent(s.point(), s.parameter(), s.time(), s.value() * 2, s.quality())));
    assertSame(stored("reading_rollup_hour", points), expected(doubled, ChronoUnit.HOURS));
    assertSame(stored("reading_rollup_day", points), expected(doubled, ChronoUnit.DAYS));
  }

  private void sendInOrder(List<Sent> readings, Map<String, Sent> state) {
    send(readings, new Random(0), state, readings.size());
  }

  @Test
  void seriesFromRollupsEqualsTheSeriesFromRawReadings() {
    List<String> points = TestPlants.feedwaterPoints(http, 1);
    String point = points.get(0);
    sendRandomly(points, new Random(7));
    Instant day = start().truncatedTo(ChronoUnit.DAYS);
    record Ask(Instant from, Instant to, Duration bucket) {}
    List<Ask> asks =
        List.of(
            new Ask(start(), start().plus(Duration.ofMinutes(30 * 60 + 17)), Duration.ofHours(1)),
            new Ask(start().minusSeconds(7200), start().plusSeconds(40_000), Duration.ofHours(3)),
            new Ask(day, day.plus(Duration.ofMinutes(2 * 1440 - 13)), Duration.ofDays(1)),
            new Ask(day, day.plus(Duration.ofDays(2)), Duration.ofHours(24)),
            new Ask(day.plusSeconds(3600), day.plus(Duration.ofDays(2)), Duration.ofHours(5)),
            // off the hour: the hours around the bucket boundaries from raw data
            new Ask(start().plusSeconds(600), start().plusSeconds(30_000), Duration.ofHours(1)),
            new Ask(start().plusSeconds(1234), start().plusSeconds(107_000), Duration.ofHours(3)),
            new Ask(day.plusSeconds(59), day.plus(Duration.ofDays(2)), Duration.ofHours(12)),
            new Ask(day.plusSeconds(7), day.plus(Duration.ofDays(2)), Duration.ofDays(1)));
    for (String parameter : PARAMETERS) {
      StoredSeries.Source source = StoredSeries.Source.readings(parameter);
      for (Ask a : asks) {
        List<StoredSeries.Bucket> fromRollups =
            series.bucketed(point, source, a.from(), a.to(), a.bucket());
        List<StoredSeries.Bucket> raw =
            series.bucketedRaw(point, source, a.from(), a.to(), a.bucket());
        assertThat(raw).as("%s %s", parameter, a).isNotEmpty();
        assertSameBuckets(fromRollups, raw, parameter + " " + a);
      }
    }
    StoredSeries.Source sodium = StoredSeries.Source.readings("sodium");
    Instant later = day.plus(Duration.ofDays(1));
    assertThat(StoredSeries.usesRollups(sodium, day.plusSeconds(5), later, Duration.ofHours(1)))
        .isTrue();
    assertThat(StoredSeries.usesRollups(sodium, day, later, Duration.ofMinutes(90))).isFalse();
    assertThat(StoredSeries.usesRollups(sodium, day, later, Duration.ofMinutes(30))).isFalse();

    // the whole hours do come from the rollups: a rollup row changed by hand shows in the answer
    jdbc.update(
        "UPDATE reading_rollup_hour SET max = 999 WHERE point_key = (SELECT point_key FROM"
            + " reading_point WHERE sample_point_id = ?) AND parameter_key = (SELECT parameter_key"
            + " FROM reading_parameter WHERE code = 'cation_conductivity') AND bucket = ?",
        point,
        Timestamp.from(start().plusSeconds(3600)));
    assertThat(
            series.bucketed(
                point,
                StoredSeries.Source.readings("cation_conductivity"),
                start(),
                start().plusSeconds(3 * 3600 + 60),
                Duration.ofHours(2)))
        .extracting(StoredSeries.Bucket::max)
        .first()
        .isEqualTo(999.0);

    // the HTTP answer (rollups) against the raw computation
    Instant from = start();
    Instant to = start().plus(Duration.ofMinutes(30 * 60 + 17));
    JsonNode answer =
        JSON.readTree(
            http.get(
                    "/api/v1/sample-points/"
                        + point
                        + "/series?parameter=sodium&bucket=PT2H&from="
                        + from
                        + "&to="
                        + to)
                .body());
    List<StoredSeries.Bucket> raw =
        series.bucketedRaw(
            point, StoredSeries.Source.readings("sodium"), from, to, Duration.ofHours(2));
    JsonNode buckets = answer.get("buckets");
    assertThat(buckets).hasSize(raw.size());
    for (int i = 0; i < raw.size(); i++) {
      JsonNode b = buckets.get(i);
      StoredSeries.Bucket r = raw.get(i);
      assertThat(Instant.parse(b.get("start").asString())).isEqualTo(r.start());
      assertThat(b.get("count").asLong()).isEqualTo(r.count());
      assertThat(b.get("min").asDouble()).isEqualTo(r.min());
      assertThat(b.get("max").asDouble()).isEqualTo(r.max());
      assertThat(b.get("last").asDouble()).isEqualTo(r.last());
      assertThat(b.get("mean").asDouble()).isCloseTo(r.mean(), within(1e-12 * r.mean()));
    }
  }

  private static void assertSameBuckets(
      List<StoredSeries.Bucket> actual, List<StoredSeries.Bucket> expected, String what) {
    assertThat(actual).as(what).hasSameSizeAs(expected);
    for (int i = 0; i < expected.size(); i++) {
      StoredSeries.Bucket a = actual.get(i);
      StoredSeries.Bucket e = expected.get(i);
      String at = String.format(Locale.ROOT, "%s bucket %s", what, e.start());
      assertThat(a.start()).as(at).isEqualTo(e.start());
      assertThat(a.count()).as(at).isEqualTo(e.count());
      assertThat(a.min()).as(at).isEqualTo(e.min());
      assertThat(a.max()).as(at).isEqualTo(e.max());
      assertThat(a.last()).as(at).isEqualTo(e.last());
      assertThat(a.mean()).as(at).isCloseTo(e.mean(), within(1e-12 * Math.abs(e.mean())));
    }
  }
}
