package org.kwanta.service.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.Statement;
import java.sql.Timestamp;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.flywaydb.core.Flyway;
import org.junit.jupiter.api.Test;
import org.kwanta.service.KwantaApplication;
import org.kwanta.service.support.Http;
import org.kwanta.service.support.TestDatabase;
import org.kwanta.service.support.TestKeys;
import org.springframework.boot.builder.SpringApplicationBuilder;
import org.springframework.boot.web.server.context.WebServerApplicationContext;
import org.springframework.context.ConfigurableApplicationContext;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Migration V71 (evaluations keyed by the point's integer key) keeps every evaluation written under
 * V70: rows in format 2 and format 1 of the pack and rows with JSON details, at points that had a
 * key (from their readings), at a registered point without one and at a point known only from its
 * evaluations, across a UTC midnight. After it, every row holds the same values bit for bit under
 * its point's key (an existing key is kept), the derived series' rollups and the marks of hours not
 * yet settled likewise; the service started on the migrated database answers the stored evaluations
 * as the V70 reader decoded them (the API's JSON, each point's range and its latest), and its
 * derived series through the rollups equal those from the raw rows, before and after the marks are
 * settled.
 */
@org.junit.jupiter.api.Tag(org.kwanta.service.support.Depth.THOROUGH)
class EvaluationPointKeyMigrationIT {

  private static final JsonMapper JSON = JsonMapper.builder().build();

  private static final Instant START = Instant.parse("2026-11-30T21:00:00Z");
  private static final Instant END = Instant.parse("2026-12-02T00:00:00Z");

  /** The registered points; K-HAND is known from its evaluations only. */
  private static final List<String> REGISTERED = List.of("K-CPD", "K-ECO");

  private static final List<String> POINTS = List.of("K-CPD", "K-ECO", "K-HAND");

  /** A row of evaluation as text, every value bit for bit; %s is the sample point's id. */
  private static final String ROW =
      "concat_ws(' ', %s, time::text, evaluated_at::text,"
          + " coalesce(encode(float8send(specific_conductivity_25), 'hex'), '-'),"
          + " coalesce(encode(float8send(cation_conductivity_25), 'hex'), '-'),"
          + " coalesce(encode(float8send(degassed_cation_conductivity_25), 'hex'), '-'),"
          + " coalesce(encode(float8send(calculated_ph_25), 'hex'), '-'),"
          + " coalesce(encode(float8send(ph_at_temperature), 'hex'), '-'),"
          + " coalesce(encode(float8send(ph_at_temperature_low), 'hex'), '-'),"
          + " coalesce(encode(float8send(ph_at_temperature_high), 'hex'), '-'),"
          + " coalesce(encode(float8send(neutral_ph_at_temperature), 'hex'), '-'),"
          + " config_version, instrument_in_doubt, coalesce(points_at, '-'),"
          + " coalesce(encode(detail_pack, 'hex'), '-'), coalesce(details, '-'))";

  /** A rollup row as text; %s is the sample point's id. */
  private static final String ROLLUP =
      "concat_ws(' ', %s, parameter, bucket::text, count,"
          + " coalesce(encode(float8send(min), 'hex'), '-'),"
          + " coalesce(encode(float8send(max), 'hex'), '-'),"
          + " coalesce(encode(float8send(sum), 'hex'), '-'),"
          + " coalesce(encode(float8send(last), 'hex'), '-'),"
          + " coalesce(first_time::text, '-'), coalesce(last_time::text, '-'))";

  private static final String MARK = "concat_ws(' ', %s, bucket::text)";

  @Test
  void everyEvaluationRollupAndMarkSurvivesAndTheApiAnswersAsBefore() throws Exception {
    List<EvaluationView> views = demoViews();
    TestDatabase db = TestDatabase.get();
    String url = db.createScratchDatabase("evkey");
    ConfigurableApplicationContext app = null;
    try {
      flyway(url, db, "70").migrate();
      List<String> rows;
      List<String> hours;
      List<String> days;
      List<String> marks;
      Map<String, Integer> keysBefore = new LinkedHashMap<>();
      Map<String, List<Evaluations.Stored>> before = new LinkedHashMap<>();
      try (Connection c = DriverManager.getConnection(url, db.user(), db.password());
          Statement s = c.createStatement()) {
        s.execute(
            "INSERT INTO plant (id, name) VALUES ('evkey', 'Point key test plant (invented)')");
        s.execute("INSERT INTO plant_block (plant_id, id, name) VALUES ('evkey', 'U1', 'Unit 1')");
        s.execute(
            "INSERT INTO sample_point (id, plant_id, block_id, name, cycle_location,"
                + " treatment_regime) VALUES ('K-CPD', 'evkey', 'U1', 'Condensate pump discharge',"
                + " 'CONDENSATE', 'AVT(O)'), ('K-ECO', 'evkey', 'U1', 'Economizer inlet',"
                + " 'FEEDWATER', 'AVT(O)')");
        // keys made by readings before: K-CPD's is not the first, nor in the order of the ids
        s.execute("SELECT reading_point_key('K-ZZZ'), reading_point_key('K-CPD')");
        for (String day : List.of("20261130", "20261201")) {
          s.execute(
              "CREATE TABLE evaluation_p%s PARTITION OF evaluation FOR VALUES FROM ('%s') TO ('%s')"
                  .formatted(
                      day,
                      day.substring(0, 4) + "-" + day.substring(4, 6) + "-" + day.substring(6),
                      day.equals("20261130") ? "2026-12-01" : "2026-12-02"));
        }
        int n = 0;
        for (String point : POINTS) {
          for (int i = 0; i < 330; i++) {
            // 37 s apart from 21:00, some with microseconds: across midnight into the second day
            Instant t = START.plusSeconds(37L * i).plusNanos(i % 5 == 0 ? 123_000L * i : 0);
            EvaluationView v = views.get((i + n) % views.size()).forStorage();
            int format = i % 7 == 3 ? 1 : i % 11 == 5 ? 0 : 2;
            insertAsV70(c, point, t, v, format);
          }
          n += 7;
        }
        s.execute("SELECT refresh_evaluation_rollups('-infinity', 'infinity')");
        // hours the ingest had marked and the settler had not yet taken
        s.execute(
            "INSERT INTO evaluation_rollup_pending (sample_point_id, bucket) VALUES"
                + " ('K-CPD', '2026-11-30 22:00+00'), ('K-ECO', '2026-12-01 00:00+00'),"
                + " ('K-HAND', '2026-11-30 23:00+00')");
        rows = rows(s, "SELECT " + ROW.formatted("sample_point_id") + " FROM evaluation");
        hours =
            rows(
                s,
                "SELECT " + ROLLUP.formatted("sample_point_id") + " FROM evaluation_rollup_hour");
        days =
            rows(
                s, "SELECT " + ROLLUP.formatted("sample_point_id") + " FROM evaluation_rollup_day");
        marks =
            rows(
                s,
                "SELECT " + MARK.formatted("sample_point_id") + " FROM evaluation_rollup_pending");
        try (ResultSet rs =
            s.executeQuery("SELECT sample_point_id, point_key FROM reading_point")) {
          while (rs.next()) {
            keysBefore.put(rs.getString(1), rs.getInt(2));
          }
        }
        for (String point : REGISTERED) {
          before.put(point, readAsV70(c, point));
        }
      }
      assertThat(rows).hasSize(990);
      assertThat(rows).anyMatch(r -> r.contains("2026-12-01 00:"));
      assertThat(hours).hasSizeGreaterThan(50);
      assertThat(keysBefore).doesNotContainKeys("K-ECO", "K-HAND");

      flyway(url, db, "latest").migrate();
      try (Connection c = DriverManager.getConnection(url, db.user(), db.password());
          Statement s = c.createStatement()) {
        String named = "%s e JOIN reading_point k USING (point_key)";
        assertThat(
                rows(
                    s,
                    "SELECT "
                        + ROW.formatted("k.sample_point_id")
                        + " FROM "
                        + named.formatted("evaluation")))
            .isEqualTo(rows);
        assertThat(
                rows(
                    s,
                    "SELECT "
                        + ROLLUP.formatted("k.sample_point_id")
                        + " FROM "
                        + named.formatted("evaluation_rollup_hour")))
            .isEqualTo(hours);
        assertThat(
                rows(
                    s,
                    "SELECT "
                        + ROLLUP.formatted("k.sample_point_id")
                        + " FROM "
                        + named.formatted("evaluation_rollup_day")))
            .isEqualTo(days);
        assertThat(
                rows(
                    s,
                    "SELECT "
                        + MARK.formatted("k.sample_point_id")
                        + " FROM "
                        + named.formatted("evaluation_rollup_pending")))
            .isEqualTo(marks);
        Map<String, Integer> keysAfter = new LinkedHashMap<>();
        try (ResultSet rs =
            s.executeQuery("SELECT sample_point_id, point_key FROM reading_point")) {
          while (rs.next()) {
            keysAfter.put(rs.getString(1), rs.getInt(2));
          }
        }
        assertThat(keysAfter).containsAllEntriesOf(keysBefore).containsKeys("K-ECO", "K-HAND");
        // the key is (point_key, time); the columns need no alignment padding
        assertThat(
                rows(
                    s,
                    "SELECT indexdef FROM pg_indexes WHERE indexname IN ('evaluation_pkey',"
                        + " 'evaluation_p20261130_pkey', 'evaluation_rollup_hour_pkey',"
                        + " 'evaluation_rollup_day_pkey', 'evaluation_rollup_pending_pkey')"))
            .hasSize(5)
            .allMatch(d -> d.contains("(point_key, "));
        assertThat(
                String.join(
                    ",",
                    rows(
                        s,
                        "SELECT lpad(attnum::text, 3) || ' ' || attname FROM pg_attribute"
                            + " WHERE attrelid = 'evaluation'::regclass AND attnum > 0"
                            + " AND NOT attisdropped")))
            .isEqualTo(
                "  1 time,  2 evaluated_at,  3 specific_conductivity_25,  4 cation_conductivity_25,"
                    + "  5 degassed_cation_conductivity_25,  6 calculated_ph_25,"
                    + "  7 ph_at_temperature,  8 ph_at_temperature_low,  9 ph_at_temperature_high,"
                    + " 10 neutral_ph_at_temperature, 11 point_key, 12 config_version,"
                    + " 13 instrument_in_doubt, 14 points_at, 15 detail_pack, 16 details");
      }

      app = start(url, db);
      int port = ((WebServerApplicationContext) app).getWebServer().getPort();
      Http http = Http.admin(port);
      JsonMapper appJson = app.getBean(JsonMapper.class);
      Evaluations evaluations = app.getBean(Evaluations.class);
      for (String point : REGISTERED) {
        List<Evaluations.Stored> expected = before.get(point);
        assertThat(expected).hasSize(330);
        String body =
            http.get(
                    "/api/v1/sample-points/"
                        + point
                        + "/evaluations?from="
                        + START
                        + "&to="
                        + END
                        + "&limit=5000")
                .body();
        JsonNode answered = JSON.readTree(body).get("evaluations");
        assertThat(answered).as(body.substring(0, Math.min(300, body.length()))).isNotNull();
        assertThat(answered).isEqualTo(JSON.readTree(appJson.writeValueAsString(expected)));
        assertThat(evaluations.range(point, START, END, 5000)).isEqualTo(expected);
        assertThat(evaluations.latest(point, START)).contains(expected.get(expected.size() - 1));
      }
      assertThat(evaluations.latest(POINTS, START))
          .containsOnlyKeys(POINTS)
          .containsEntry("K-CPD", last(before.get("K-CPD")))
          .containsEntry("K-ECO", last(before.get("K-ECO")));

      // derived series through the rollups equal the raw ones: with hours still marked, then after
      // the marks are settled (by the test and by the service's settler)
      StoredSeries series = app.getBean(StoredSeries.class);
      for (String point : POINTS) {
        assertSeriesFromRollupsEqualsRaw(series, point);
      }
      EvaluationRollups rollups = app.getBean(EvaluationRollups.class);
      long deadline = System.nanoTime() + Duration.ofSeconds(30).toNanos();
      try (Connection c = DriverManager.getConnection(url, db.user(), db.password());
          Statement s = c.createStatement()) {
        while (!rows(s, "SELECT bucket::text FROM evaluation_rollup_pending").isEmpty()) {
          rollups.settle();
          assertThat(System.nanoTime()).as("marks settled within 30 s").isLessThan(deadline);
          Thread.sleep(20);
        }
      }
      for (String point : POINTS) {
        assertSeriesFromRollupsEqualsRaw(series, point);
      }
    } finally {
      if (app != null) {
        app.close();
      }
      db.dropDatabase(url);
    }
  }

  private static Evaluations.Stored last(List<Evaluations.Stored> l) {
    return l.get(l.size() - 1);
  }

  private static void assertSeriesFromRollupsEqualsRaw(StoredSeries series, String point) {
    record Ask(Instant from, Instant to, Duration bucket) {}
    Instant day = Instant.parse("2026-11-30T00:00:00Z");
    List<Ask> asks =
        List.of(
            new Ask(day, END, Duration.ofDays(1)),
            new Ask(START, END, Duration.ofHours(1)),
            new Ask(START.plusSeconds(1234), END, Duration.ofHours(2)));
    for (StoredSeries.DerivedColumn column : StoredSeries.DerivedColumn.values()) {
      StoredSeries.Source source = StoredSeries.Source.evaluations(column);
      for (Ask a : asks) {
        assertThat(StoredSeries.usesRollups(source, a.from(), a.to(), a.bucket())).isTrue();
        List<StoredSeries.Bucket> rolled =
            series.bucketed(point, source, a.from(), a.to(), a.bucket());
        List<StoredSeries.Bucket> raw =
            series.bucketedRaw(point, source, a.from(), a.to(), a.bucket());
        String what = point + " " + column.code() + " " + a;
        EvaluationRollupsIT.assertBucketsEqual(what, rolled, raw);
      }
      if (column == StoredSeries.DerivedColumn.CALCULATED_PH_25) {
        assertThat(series.bucketedRaw(point, source, day, END, Duration.ofDays(1)))
            .as("%s has derived values", point)
            .isNotEmpty();
      }
    }
  }

  /** The demo's evaluations (with and without findings), in their stored form. */
  private static List<EvaluationView> demoViews() throws Exception {
    try (var in =
        EvaluationPointKeyMigrationIT.class.getResourceAsStream(
            "/evaluation-pack/demo-evaluations.jsonl")) {
      return new String(in.readAllBytes(), StandardCharsets.UTF_8)
          .lines()
          .filter(l -> !l.isBlank())
          .map(l -> JSON.readValue(l, EvaluationView.class))
          .toList();
    }
  }

  /**
   * A row as V70's writer stored it: the typed columns from the view, points_at as comma-separated
   * text (NULL for none), the details in format 2 (which refers to the columns), format 1, or as
   * JSON text (format 0 here).
   */
  private static void insertAsV70(
      Connection c, String point, Instant time, EvaluationView v, int format) throws Exception {
    EvaluationPack.Columns col = EvaluationPack.Columns.of(v);
    try (PreparedStatement ps =
        c.prepareStatement(
            "INSERT INTO evaluation (sample_point_id, time, config_version,"
                + " specific_conductivity_25, cation_conductivity_25,"
                + " degassed_cation_conductivity_25, calculated_ph_25, ph_at_temperature,"
                + " ph_at_temperature_low, ph_at_temperature_high, neutral_ph_at_temperature,"
                + " instrument_in_doubt, points_at, detail_pack, details, evaluated_at)"
                + " VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)")) {
      ps.setString(1, point);
      ps.setTimestamp(2, Timestamp.from(time));
      ps.setInt(3, v.configVersion());
      EvaluationRowsMigrationIT.setTypedValues(ps, 4, col);
      ps.setBoolean(12, v.instrumentInDoubt());
      List<String> at = EvaluationStore.pointsAt(v);
      ps.setString(13, at.isEmpty() ? null : String.join(",", at));
      ps.setBytes(
          14,
          switch (format) {
            case 2 -> EvaluationPack.encode(v, col);
            case 1 -> EvaluationPack.encodeFormat1(v);
            default -> null;
          });
      ps.setString(15, format == 0 ? JSON.writeValueAsString(v) : null);
      ps.setTimestamp(16, Timestamp.from(time.plusMillis(1500)));
      ps.executeUpdate();
    }
  }

  /** A point's evaluations as V70's {@code Evaluations.range} read and decoded them. */
  private static List<Evaluations.Stored> readAsV70(Connection c, String point) throws Exception {
    List<Evaluations.Stored> out = new ArrayList<>();
    try (PreparedStatement ps =
        c.prepareStatement(
            "SELECT time, details, detail_pack, "
                + EvaluationPack.Columns.SELECT
                + " FROM evaluation WHERE sample_point_id = ? AND time >= ? AND time < ?"
                + " ORDER BY time")) {
      ps.setString(1, point);
      ps.setTimestamp(2, Timestamp.from(START));
      ps.setTimestamp(3, Timestamp.from(END));
      try (ResultSet rs = ps.executeQuery()) {
        while (rs.next()) {
          byte[] pack = rs.getBytes(3);
          EvaluationView v =
              pack != null
                  ? EvaluationPack.decode(pack, EvaluationPack.Columns.read(rs, 4))
                  : JSON.readValue(rs.getString(2), EvaluationView.class);
          out.add(new Evaluations.Stored(rs.getTimestamp(1).toInstant(), v.fromStorage()));
        }
      }
    }
    return out;
  }

  private static List<String> rows(Statement s, String sql) throws Exception {
    List<String> out = new ArrayList<>();
    try (ResultSet rs = s.executeQuery(sql + " ORDER BY 1")) {
      while (rs.next()) {
        out.add(rs.getString(1));
      }
    }
    return out;
  }

  private static ConfigurableApplicationContext start(String url, TestDatabase db) {
    return new SpringApplicationBuilder(KwantaApplication.class)
        .run(
            "--server.port=0",
            "--spring.datasource.url=" + url,
            "--spring.datasource.username=" + db.user(),
            "--spring.datasource.password=" + db.password(),
            "--" + TestKeys.ADMIN_KEY_PROPERTY + "=" + TestKeys.ADMIN,
            "--kwanta.demo.load-plant=false");
  }

  private static Flyway flyway(String url, TestDatabase db, String target) {
    return Flyway.configure()
        .dataSource(url, db.user(), db.password())
        .locations("classpath:db/migration")
        .target(target)
        .load();
  }
}
