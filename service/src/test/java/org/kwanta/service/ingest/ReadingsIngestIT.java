package org.kwanta.service.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpResponse;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Locale;
import java.util.Random;
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
 * Ingest over HTTP against the real PostgreSQL: atomic, idempotent, order-independent, evaluated.
 */
@DatabaseTest
class ReadingsIngestIT {

  private static final JsonMapper JSON = JsonMapper.builder().build();

  @LocalServerPort int port;
  @Autowired JdbcTemplate jdbc;
  Http http;

  @BeforeEach
  void client() {
    http = Http.admin(port);
  }

  /** Invented AVT(O) feedwater readings (demo-style numbers, not measurements). */
  static List<String> feedwaterReadings(String point, Instant start, int steps, long stepSeconds) {
    Random random = new Random(42);
    List<String> out = new ArrayList<>();
    for (int i = 0; i < steps; i++) {
      String t = start.plusSeconds(i * stepSeconds).toString();
      double sc = 5.4 + 0.1 * random.nextGaussian();
      double cc = 0.08 + 0.004 * random.nextGaussian();
      double dcc = 0.06 + 0.003 * random.nextGaussian();
      double ph = 9.66 + 0.02 * random.nextGaussian();
      double temperature = 27.0 + random.nextGaussian();
      out.add(
          reading(
              point,
              "specific_conductivity",
              t,
              sc,
              "uS/cm",
              ",\"sampleTemperatureCel\":" + temperature));
      out.add(reading(point, "cation_conductivity", t, cc, "uS/cm", ",\"compensated\":true"));
      out.add(reading(point, "degassed_cation_conductivity", t, dcc, "uS/cm", ""));
      out.add(reading(point, "ph", t, ph, "[pH]", ""));
      out.add(reading(point, "sodium", t, 0.4 + 0.05 * random.nextGaussian(), "ug/kg", ""));
    }
    return out;
  }

  static String reading(
      String point, String parameter, String time, double value, String unit, String extra) {
    return String.format(
        Locale.ROOT,
        "{\"samplePoint\":\"%s\",\"parameter\":\"%s\",\"time\":\"%s\",\"value\":%s,\"unit\":\"%s\"%s}",
        point,
        parameter,
        time,
        value,
        unit,
        extra);
  }

  static String batch(List<String> readings) {
    return "{\"readings\":[" + String.join(",", readings) + "]}";
  }

  private HttpResponse<String> post(List<String> readings) {
    return http.post("/api/v1/readings", "application/json", batch(readings));
  }

  private static Instant yesterday() {
    return Instant.now().truncatedTo(ChronoUnit.DAYS).minus(1, ChronoUnit.DAYS);
  }

  @Test
  void storesAndEvaluatesABatch() {
    String point = TestPlants.feedwaterPoints(http, 1).get(0);
    HttpResponse<String> r = post(feedwaterReadings(point, yesterday(), 10, 60));
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    JsonNode outcome = JSON.readTree(r.body());
    assertThat(outcome.get("inserted").asInt()).isEqualTo(50);
    assertThat(outcome.get("evaluationsWritten").asInt()).isEqualTo(10);

    JsonNode state = JSON.readTree(http.get("/api/v1/sample-points/" + point + "/state").body());
    assertThat(state.get("readings")).hasSize(5);
    JsonNode evaluation = state.get("evaluation").get("evaluation");
    double phT = evaluation.get("phAtTemperature").get("ph").asDouble();
    double neutral = evaluation.get("phAtTemperature").get("neutralPh").asDouble();
    // ammonia-treated feedwater at 155 °C is alkaline at temperature, but far less than at 25 °C
    assertThat(phT).isGreaterThan(neutral).isLessThan(9.66);
    assertThat(evaluation.get("compensated")).isNotEmpty();
  }

  @Test
  void refusesAWholeBatchListingEveryBadReading() {
    String point = TestPlants.feedwaterPoints(http, 1).get(0);
    String t = yesterday().toString();
    List<String> readings =
        List.of(
            reading(point, "specific_conductivity", t, 5.4, "uS/cm", ""),
            reading(point, "sodium", t, 1.0, "ug/L", ""),
            reading("NO-SUCH-POINT", "ph", t, 9.6, "[pH]", ""),
            reading(point, "ph", t, 19.0, "[pH]", ""),
            reading(point, "colour", t, 1, "1", ""),
            reading(point, "ph", "2026-11-30T10:00:00", 9.6, "[pH]", ""),
            "{\"samplePoint\":\""
                + point
                + "\",\"parameter\":\"ph\",\"time\":\""
                + t
                + "\",\"value\":9.6}");
    HttpResponse<String> r = post(readings);
    assertThat(r.statusCode()).isEqualTo(400);
    assertThat(r.headers().firstValue("Content-Type").orElseThrow())
        .startsWith("application/problem+json");
    JsonNode body = JSON.readTree(r.body());
    assertThat(body.get("type").asString()).isEqualTo("urn:kwanta:problem:invalid-readings");
    List<Integer> indexes = new ArrayList<>();
    body.get("rejected").forEach(e -> indexes.add(e.get("index").asInt()));
    assertThat(indexes).containsExactly(1, 2, 3, 4, 5, 6);
    assertThat(count(point)).isZero();
  }

  @Test
  void sameValueIsANoOpAndADifferentValueIsACorrection() {
    String point = TestPlants.feedwaterPoints(http, 1).get(0);
    String t = yesterday().plusSeconds(3600).toString();
    List<String> first = List.of(reading(point, "cation_conductivity", t, 0.080, "uS/cm", ""));
    assertThat(JSON.readTree(post(first).body()).get("inserted").asInt()).isEqualTo(1);
    assertThat(JSON.readTree(post(first).body()).get("unchanged").asInt()).isEqualTo(1);
    List<String> corrected = List.of(reading(point, "cation_conductivity", t, 0.095, "uS/cm", ""));
    assertThat(JSON.readTree(post(corrected).body()).get("corrected").asInt()).isEqualTo(1);
    assertThat(count(point)).isEqualTo(1);
    Double old =
        jdbc.queryForObject(
            "SELECT old_value FROM reading_revision WHERE point_key ="
                + " (SELECT point_key FROM reading_point WHERE sample_point_id = ?)",
            Double.class,
            point);
    assertThat(old).isEqualTo(0.080);
    Double now =
        jdbc.queryForObject(
            "SELECT value FROM reading_named WHERE sample_point_id = ?", Double.class, point);
    assertThat(now).isEqualTo(0.095);
  }

  @Test
  void convertsUnitsToCanonical() {
    String point = TestPlants.feedwaterPoints(http, 1).get(0);
    String t = yesterday().plusSeconds(7200).toString();
    HttpResponse<String> r =
        post(
            List.of(
                reading(point, "specific_conductivity", t, 0.0054, "mS/cm", ""),
                reading(point, "sodium", t, 0.002, "mg/kg", ""),
                reading(point, "sample_temperature", t, 300.15, "K", "")));
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    assertThat(value(point, "specific_conductivity"))
        .isCloseTo(5.4, org.assertj.core.data.Offset.offset(1e-12));
    assertThat(value(point, "sodium")).isCloseTo(2.0, org.assertj.core.data.Offset.offset(1e-12));
    assertThat(value(point, "sample_temperature"))
        .isCloseTo(27.0, org.assertj.core.data.Offset.offset(1e-9));
  }

  @Test
  void acceptsCsvAndRejectsABadHeader() {
    String point = TestPlants.feedwaterPoints(http, 1).get(0);
    String t = yesterday().plusSeconds(10800).toString();
    String csv =
        "sample_point,parameter,time,value,unit,sample_temperature_cel\r\n"
            + point
            + ",specific_conductivity,"
            + t
            + ",5.4,uS/cm,26.5\r\n"
            + point
            + ",ph,"
            + t
            + ",9.65,[pH],\r\n";
    HttpResponse<String> r = http.post("/api/v1/readings", "text/csv", csv);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    assertThat(count(point)).isEqualTo(2);
    HttpResponse<String> bad = http.post("/api/v1/readings", "text/csv", "point,value\r\nx,1\r\n");
    assertThat(bad.statusCode()).isEqualTo(400);
    assertThat(bad.body()).contains("missing columns");
    String badRow =
        "sample_point,parameter,time,value,unit\r\n" + point + ",ph," + t + ",abc,[pH]\r\n";
    HttpResponse<String> rejected = http.post("/api/v1/readings", "text/csv", badRow);
    assertThat(rejected.statusCode()).isEqualTo(400);
    assertThat(rejected.body()).contains("\"index\":0").contains("not a number");
  }

  @Test
  void storedEvaluationsDoNotDependOnArrivalOrderOrDuplication() {
    assertOrderIndependent(144, 600); // one day at 10-minute steps
  }

  @Test
  void storedEvaluationsAtFineResolutionDoNotDependOnArrivalOrder() {
    // 20 s steps: several readings per history bucket, so the history is thinned
    assertOrderIndependent(org.kwanta.service.support.Depth.of(120, 360), 20);
  }

  private void assertOrderIndependent(int steps, long stepSeconds) {
    List<String> points = TestPlants.feedwaterPoints(http, 3);
    Instant start = yesterday();
    // 1. in order, in batches of 100
    List<String> inOrder = feedwaterReadings(points.get(0), start, steps, stepSeconds);
    for (int i = 0; i < inOrder.size(); i += 100) {
      assertThat(post(inOrder.subList(i, Math.min(i + 100, inOrder.size()))).statusCode())
          .isEqualTo(200);
    }
    // 2. shuffled, in batches of 37
    List<String> shuffled =
        new ArrayList<>(feedwaterReadings(points.get(1), start, steps, stepSeconds));
    Collections.shuffle(shuffled, new Random(7));
    for (int i = 0; i < shuffled.size(); i += 37) {
      assertThat(post(shuffled.subList(i, Math.min(i + 37, shuffled.size()))).statusCode())
          .isEqualTo(200);
    }
    // 3. reversed and every batch sent twice, plus duplicates inside batches
    List<String> reversed =
        new ArrayList<>(feedwaterReadings(points.get(2), start, steps, stepSeconds));
    Collections.reverse(reversed);
    for (int i = 0; i < reversed.size(); i += 50) {
      List<String> part = new ArrayList<>(reversed.subList(i, Math.min(i + 50, reversed.size())));
      part.add(part.get(0));
      assertThat(post(part).statusCode()).isEqualTo(200);
      assertThat(post(part).statusCode()).isEqualTo(200);
    }
    List<String> a = evaluations(points.get(0));
    List<String> b = evaluations(points.get(1));
    List<String> c = evaluations(points.get(2));
    assertThat(a).hasSize(steps);
    assertThat(b).isEqualTo(a);
    assertThat(c).isEqualTo(a);
  }

  @Test
  void concurrentBatchesForTheSamePointsMatchOneByOne() throws Exception {
    // several historians sending the same points at once: batches are written together (group
    // commit) from the in-memory history; the result must equal sending them one at a time
    List<String> points = TestPlants.feedwaterPoints(http, 2);
    Instant start = yesterday().plusSeconds(6 * 3600);
    List<String> alone = feedwaterReadings(points.get(0), start, 240, 20);
    for (int i = 0; i < alone.size(); i += 60) {
      assertThat(post(alone.subList(i, Math.min(i + 60, alone.size()))).statusCode())
          .isEqualTo(200);
    }
    List<String> together = feedwaterReadings(points.get(1), start, 240, 20);
    List<List<String>> batches = new ArrayList<>();
    for (int i = 0; i < together.size(); i += 60) {
      batches.add(together.subList(i, Math.min(i + 60, together.size())));
    }
    java.util.concurrent.ExecutorService pool =
        java.util.concurrent.Executors.newFixedThreadPool(4);
    try {
      List<java.util.concurrent.Future<Integer>> sent = new ArrayList<>();
      for (List<String> b : batches) {
        sent.add(
            pool.submit(
                () ->
                    Http.admin(port)
                        .post("/api/v1/readings", "application/json", batch(b))
                        .statusCode()));
      }
      for (java.util.concurrent.Future<Integer> f : sent) {
        assertThat(f.get()).isEqualTo(200);
      }
    } finally {
      pool.shutdown();
    }
    assertThat(count(points.get(1))).isEqualTo(together.size());
    assertThat(evaluations(points.get(1))).hasSize(240).isEqualTo(evaluations(points.get(0)));
  }

  @Test
  void readingsChangedBySqlAreSeenByTheNextBatch() {
    // the ingest keeps recent history in memory; a write that bypasses it (here a DELETE by hand)
    // must not leave it stale (migration V31's trigger)
    String point = TestPlants.feedwaterPoints(http, 1).get(0);
    List<String> readings = feedwaterReadings(point, yesterday().plusSeconds(9 * 3600), 30, 20);
    assertThat(post(readings.subList(0, 75)).statusCode()).isEqualTo(200);
    assertThat(post(readings.subList(75, 150)).statusCode()).isEqualTo(200);
    jdbc.update(
        "DELETE FROM reading WHERE point_key ="
            + " (SELECT point_key FROM reading_point WHERE sample_point_id = ?) AND parameter_key ="
            + " (SELECT parameter_key FROM reading_parameter WHERE code = 'ph') AND time = ?",
        point,
        java.sql.Timestamp.from(yesterday().plusSeconds(9 * 3600 + 29 * 20)));
    JsonNode again = JSON.readTree(post(readings.subList(75, 150)).body());
    assertThat(again.get("inserted").asInt()).isEqualTo(1);
    assertThat(again.get("unchanged").asInt()).isEqualTo(74);
    assertThat(count(point)).isEqualTo(150);
  }

  @Test
  void aFailedFastWriteIsRetriedOnThePlainPath() {
    // an evaluation row the in-memory history cannot know of (written by hand, no readings at its
    // time) makes the fast path's COPY of evaluations fail; the batch must still be stored whole,
    // on the plain path, with the same evaluations as a clean run
    List<String> points = TestPlants.feedwaterPoints(http, 2);
    Instant start = yesterday().plusSeconds(12 * 3600);
    List<String> clean = feedwaterReadings(points.get(0), start, 30, 20);
    List<String> disturbed = feedwaterReadings(points.get(1), start, 30, 20);
    assertThat(post(clean.subList(0, 75)).statusCode()).isEqualTo(200);
    assertThat(post(clean.subList(75, 150)).statusCode()).isEqualTo(200);
    assertThat(post(disturbed.subList(0, 75)).statusCode()).isEqualTo(200);
    jdbc.update(
        "INSERT INTO evaluation (point_key, time, config_version, instrument_in_doubt, details)"
            + " VALUES (reading_point_key(?), ?, 1, false, '{}')",
        points.get(1),
        java.sql.Timestamp.from(start.plusSeconds(20 * 20)));
    double retriedBefore = retried();
    HttpResponse<String> second = post(disturbed.subList(75, 150));
    assertThat(second.statusCode()).isEqualTo(200);
    assertThat(JSON.readTree(second.body()).get("inserted").asInt()).isEqualTo(75);
    assertThat(retried()).isEqualTo(retriedBefore + 1);
    assertThat(count(points.get(1))).isEqualTo(150);
    assertThat(evaluations(points.get(1))).hasSize(30).isEqualTo(evaluations(points.get(0)));
  }

  @Test
  void droppingAPartitionMakesTheInMemoryHistoryStale() {
    // retention drops whole partitions, which fires no trigger; it must still invalidate the
    // ingest's in-memory history (invalidate_reading_heads)
    String point = TestPlants.feedwaterPoints(http, 1).get(0);
    Instant old = Instant.now().truncatedTo(ChronoUnit.DAYS).minus(300, ChronoUnit.DAYS);
    assertThat(post(feedwaterReadings(point, old, 3, 20)).statusCode()).isEqualTo(200);
    long before = generation(point);
    assertThat(
            partitions.dropBefore(
                java.time.LocalDate.ofInstant(old, java.time.ZoneOffset.UTC).plusDays(1)))
        .isNotEmpty();
    assertThat(generation(point)).isNotEqualTo(before);
    assertThat(count(point)).isZero();
    JsonNode again = JSON.readTree(post(feedwaterReadings(point, old, 3, 20)).body());
    assertThat(again.get("inserted").asInt()).isEqualTo(15);
  }

  @Autowired Partitions partitions;

  private long generation(String point) {
    return jdbc.queryForObject(
        "SELECT generation FROM reading_head WHERE sample_point_id = ?", Long.class, point);
  }

  private double retried() {
    String scrape = http.get("/actuator/prometheus").body();
    return scrape
        .lines()
        .filter(l -> l.startsWith("kwanta_ingest_retried_total"))
        .mapToDouble(l -> Double.parseDouble(l.substring(l.lastIndexOf(' ') + 1)))
        .sum();
  }

  private List<String> evaluations(String point) {
    return jdbc.queryForList(
        "SELECT "
            + STORED_EVALUATION
            + " FROM evaluation WHERE point_key ="
            + " (SELECT point_key FROM reading_point WHERE sample_point_id = ?) ORDER BY time",
        String.class,
        point);
  }

  /**
   * A stored evaluation as text: its time, details and every column a pack of format 2 refers to,
   * the numbers bit for bit (so rows written by COPY and by the upsert compare whole).
   */
  static final String STORED_EVALUATION =
      "time::text || ' ' || coalesce(details, encode(detail_pack, 'hex')) || ' ' || config_version"
          + " || ' ' || instrument_in_doubt || ' ' || coalesce(points_at, '-') || ' ' || concat_ws(' ',"
          + " coalesce(encode(float8send(specific_conductivity_25), 'hex'), '-'),"
          + " coalesce(encode(float8send(cation_conductivity_25), 'hex'), '-'),"
          + " coalesce(encode(float8send(degassed_cation_conductivity_25), 'hex'), '-'),"
          + " coalesce(encode(float8send(calculated_ph_25), 'hex'), '-'),"
          + " coalesce(encode(float8send(ph_at_temperature), 'hex'), '-'),"
          + " coalesce(encode(float8send(ph_at_temperature_low), 'hex'), '-'),"
          + " coalesce(encode(float8send(ph_at_temperature_high), 'hex'), '-'),"
          + " coalesce(encode(float8send(neutral_ph_at_temperature), 'hex'), '-'))";

  private int count(String point) {
    return jdbc.queryForObject(
        "SELECT count(*) FROM reading_named WHERE sample_point_id = ?", Integer.class, point);
  }

  private double value(String point, String parameter) {
    return jdbc.queryForObject(
        "SELECT value FROM reading_named WHERE sample_point_id = ? AND parameter = ?",
        Double.class,
        point,
        parameter);
  }
}
