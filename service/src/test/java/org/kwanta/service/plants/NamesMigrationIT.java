package org.kwanta.service.plants;

import static org.assertj.core.api.Assertions.assertThat;

import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.Statement;
import org.flywaydb.core.Flyway;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.TestDatabase;

/**
 * V68 (names of our own, docs/names.md): a plant's units become blocks, the stored sample-point
 * configurations say "block" and hold the regime in its trade form, and an evaluation's doubt and
 * targets are in instrument_in_doubt and points_at.
 */
@org.junit.jupiter.api.Tag(org.kwanta.service.support.Depth.THOROUGH)
class NamesMigrationIT {

  @Test
  void storedConfigurationSaysBlockAndTheTradeForm() throws Exception {
    TestDatabase db = TestDatabase.get();
    String url = db.createScratchDatabase("names");
    try {
      flyway(url, db, "54").migrate();
      try (Connection c = DriverManager.getConnection(url, db.user(), db.password());
          Statement s = c.createStatement()) {
        s.execute("INSERT INTO plant (id, name) VALUES ('names', 'Names test plant (invented)')");
        s.execute("INSERT INTO plant_unit (plant_id, id, name) VALUES ('names', 'U1', 'Unit 1')");
        s.execute(
            "INSERT INTO sample_point (id, plant_id, unit_id, name, cycle_location,"
                + " treatment_regime) VALUES ('N-ECO', 'names', 'U1', 'Economizer inlet',"
                + " 'FEEDWATER', 'AVT_O')");
        s.execute(
            "INSERT INTO sample_point_version (sample_point_id, version, changed_by, config)"
                + " VALUES ('N-ECO', 1, 'test', '{\"id\":\"N-ECO\",\"unit\":\"U1\","
                + "\"name\":\"Economizer inlet\",\"cycleLocation\":\"FEEDWATER\","
                + "\"treatmentRegime\":\"AVT_O\"}')");
      }
      flyway(url, db, "latest").migrate();
      try (Connection c = DriverManager.getConnection(url, db.user(), db.password());
          Statement s = c.createStatement()) {
        try (ResultSet rs =
            s.executeQuery(
                "SELECT block_id, treatment_regime FROM sample_point WHERE id = 'N-ECO'")) {
          assertThat(rs.next()).isTrue();
          assertThat(rs.getString(1)).isEqualTo("U1");
          assertThat(rs.getString(2)).isEqualTo("AVT(O)");
        }
        try (ResultSet rs =
            s.executeQuery(
                "SELECT config ->> 'block', config ? 'unit', config ->> 'treatmentRegime'"
                    + " FROM sample_point_version WHERE sample_point_id = 'N-ECO'")) {
          assertThat(rs.next()).isTrue();
          assertThat(rs.getString(1)).isEqualTo("U1");
          assertThat(rs.getBoolean(2)).isFalse();
          assertThat(rs.getString(3)).isEqualTo("AVT(O)");
        }
        try (ResultSet rs = s.executeQuery("SELECT id FROM plant_block WHERE plant_id = 'names'")) {
          assertThat(rs.next()).isTrue();
          assertThat(rs.getString(1)).isEqualTo("U1");
        }
        try (ResultSet rs =
            s.executeQuery(
                "SELECT count(*) FROM information_schema.columns WHERE table_name = 'evaluation'"
                    + " AND column_name IN ('instrument_in_doubt', 'points_at')")) {
          assertThat(rs.next()).isTrue();
          assertThat(rs.getInt(1)).isEqualTo(2);
        }
      }
    } finally {
      db.dropDatabase(url);
    }
  }

  private static Flyway flyway(String url, TestDatabase db, String target) {
    return Flyway.configure()
        .dataSource(url, db.user(), db.password())
        .locations("classpath:db/migration")
        .target(target)
        .load();
  }
}
