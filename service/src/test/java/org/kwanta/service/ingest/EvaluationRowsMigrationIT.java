package org.kwanta.service.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.charset.StandardCharsets;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.Statement;
import java.sql.Timestamp;
import java.time.Instant;
import java.util.List;
import org.flywaydb.core.Flyway;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.TestDatabase;
import tools.jackson.databind.json.JsonMapper;

/**
 * Migration V70 (smaller evaluation rows) keeps every stored evaluation readable as before: a row
 * in format 1 of the pack, a row with its details as JSON text (before V61) and a row without
 * findings read back to the views they were written from, their typed columns unchanged and {@code
 * points_at} as comma-separated text (NULL for none); the primary key no longer carries the typed
 * values and {@code finding_codes} is gone. (Read after V71 too, which keys the rows by the point's
 * key: {@code EvaluationPointKeyMigrationIT}.)
 */
@org.junit.jupiter.api.Tag(org.kwanta.service.support.Depth.THOROUGH)
class EvaluationRowsMigrationIT {

  private static final JsonMapper JSON = JsonMapper.builder().build();

  private static final String COLUMNS =
      "SELECT details, detail_pack, " + EvaluationPack.Columns.SELECT + " FROM evaluation";

  @Test
  void rowsOfEarlierFormatsReadBackAsBefore() throws Exception {
    List<EvaluationView> views;
    try (var in =
        EvaluationRowsMigrationIT.class.getResourceAsStream(
            "/evaluation-pack/demo-evaluations.jsonl")) {
      views =
          new String(in.readAllBytes(), StandardCharsets.UTF_8)
              .lines()
              .filter(l -> !l.isBlank())
              .map(l -> JSON.readValue(l, EvaluationView.class).forStorage())
              .toList();
    }
    EvaluationView withFinding =
        views.stream().filter(v -> !v.findings().isEmpty()).findFirst().orElseThrow();
    EvaluationView withoutFinding =
        views.stream().filter(v -> v.findings().isEmpty()).findFirst().orElseThrow();
    TestDatabase db = TestDatabase.get();
    String url = db.createScratchDatabase("evrows");
    try {
      flyway(url, db, "69").migrate();
      Instant t0 = Instant.parse("2026-12-01T10:00:00Z");
      try (Connection c = DriverManager.getConnection(url, db.user(), db.password());
          Statement s = c.createStatement()) {
        s.execute(
            "CREATE TABLE evaluation_p20261201 PARTITION OF evaluation FOR VALUES FROM"
                + " ('2026-12-01 00:00:00+00') TO ('2026-12-02 00:00:00+00')");
        insert(c, "E-1", t0, withFinding, EvaluationPack.encodeFormat1(withFinding), null);
        insert(
            c, "E-1", t0.plusSeconds(10), withFinding, null, JSON.writeValueAsString(withFinding));
        insert(c, "E-2", t0, withoutFinding, EvaluationPack.encodeFormat1(withoutFinding), null);
      }
      flyway(url, db, "latest").migrate();
      try (Connection c = DriverManager.getConnection(url, db.user(), db.password());
          Statement s = c.createStatement()) {
        assertThat(read(s, "E-1", t0)).isEqualTo(withFinding);
        assertThat(read(s, "E-1", t0.plusSeconds(10))).isEqualTo(withFinding);
        assertThat(read(s, "E-2", t0)).isEqualTo(withoutFinding);
        try (ResultSet rs =
            s.executeQuery(
                "SELECT k.sample_point_id, coalesce(e.points_at::text, '-') FROM evaluation e"
                    + " JOIN reading_point k USING (point_key) ORDER BY k.sample_point_id, e.time")) {
          StringBuilder all = new StringBuilder();
          while (rs.next()) {
            all.append(rs.getString(1)).append(' ').append(rs.getString(2)).append(';');
          }
          String pointsAt = String.join(",", EvaluationStore.pointsAt(withFinding));
          assertThat(pointsAt).isNotEmpty();
          assertThat(all.toString()).isEqualTo("E-1 " + pointsAt + ";E-1 " + pointsAt + ";E-2 -;");
        }
        try (ResultSet rs =
            s.executeQuery("SELECT indexdef FROM pg_indexes WHERE indexname = 'evaluation_pkey'")) {
          assertThat(rs.next()).isTrue();
          assertThat(rs.getString(1)).doesNotContain("INCLUDE").contains("(point_key, \"time\")");
        }
        try (ResultSet rs =
            s.executeQuery(
                "SELECT count(*) FROM information_schema.columns WHERE table_name = 'evaluation'"
                    + " AND column_name = 'finding_codes'")) {
          assertThat(rs.next()).isTrue();
          assertThat(rs.getInt(1)).isZero();
        }
      }
    } finally {
      db.dropDatabase(url);
    }
  }

  /** A row as the writer before V70 stored it (columns from the view, finding codes, points_at). */
  private static void insert(
      Connection c, String point, Instant time, EvaluationView v, byte[] pack, String json)
      throws Exception {
    EvaluationPack.Columns col = EvaluationPack.Columns.of(v);
    try (PreparedStatement ps =
        c.prepareStatement(
            "INSERT INTO evaluation (sample_point_id, time, config_version,"
                + " specific_conductivity_25, cation_conductivity_25,"
                + " degassed_cation_conductivity_25, calculated_ph_25, ph_at_temperature,"
                + " ph_at_temperature_low, ph_at_temperature_high, neutral_ph_at_temperature,"
                + " instrument_in_doubt, finding_codes, points_at, detail_pack, details)"
                + " VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)")) {
      ps.setString(1, point);
      ps.setTimestamp(2, Timestamp.from(time));
      ps.setInt(3, v.configVersion());
      setTypedValues(ps, 4, col);
      ps.setBoolean(12, v.instrumentInDoubt());
      ps.setArray(
          13,
          c.createArrayOf(
              "text",
              v.findings().stream().map(EvaluationView.FindingView::code).distinct().toArray()));
      ps.setArray(14, c.createArrayOf("text", EvaluationStore.pointsAt(v).toArray()));
      ps.setBytes(15, pack);
      ps.setString(16, json);
      ps.executeUpdate();
    }
  }

  /** A row read as {@link Evaluations} reads it. */
  private static EvaluationView read(Statement s, String point, Instant time) throws Exception {
    try (ResultSet rs =
        s.executeQuery(
            COLUMNS
                + " WHERE point_key = (SELECT point_key FROM reading_point WHERE sample_point_id = '"
                + point
                + "') AND time = '"
                + time
                + "'")) {
      assertThat(rs.next()).isTrue();
      byte[] pack = rs.getBytes(2);
      return pack != null
          ? EvaluationPack.decode(pack, EvaluationPack.Columns.read(rs, 3))
          : JSON.readValue(rs.getString(1), EvaluationView.class);
    }
  }

  private static Flyway flyway(String url, TestDatabase db, String target) {
    return Flyway.configure()
        .dataSource(url, db.user(), db.password())
        .locations("classpath:db/migration")
        .target(target)
        .load();
  }

  /** The eight typed values of a row from {@code first} on, NULL where the column is NaN. */
  static void setTypedValues(PreparedStatement ps, int first, EvaluationPack.Columns col)
      throws java.sql.SQLException {
    double[] values = {
      col.sc25(),
      col.cc25(),
      col.dcc25(),
      col.ph25(),
      col.phAtTemperature(),
      col.low(),
      col.high(),
      col.neutral()
    };
    for (int k = 0; k < values.length; k++) {
      if (Double.isNaN(values[k])) {
        ps.setNull(first + k, java.sql.Types.DOUBLE);
      } else {
        ps.setDouble(first + k, values[k]);
      }
    }
  }
}
