package org.kwanta.service.limits;

import static org.assertj.core.api.Assertions.assertThat;

import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.List;
import org.flywaydb.core.Flyway;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.TestDatabase;

/**
 * V54: a database migrated without readings starts with no activation of the shipped defaults (the
 * first start's version then covers every earlier time); a database that held readings keeps the
 * version 1 that V35 recorded.
 */
@org.junit.jupiter.api.Tag(org.kwanta.service.support.Depth.THOROUGH)
class DefaultsActivationMigrationIT {

  @Test
  void aNewDatabaseHasNoActivationAfterTheMigrations() throws Exception {
    assertThat(activationsAfterUpgrade(false)).isEmpty();
  }

  @Test
  void aDatabaseWithReadingsKeepsVersionOne() throws Exception {
    assertThat(activationsAfterUpgrade(true)).containsExactly(1);
  }

  private static List<Integer> activationsAfterUpgrade(boolean withReading) throws Exception {
    TestDatabase db = TestDatabase.get();
    String url = db.createScratchDatabase("activation");
    try {
      flyway(url, db, "53").migrate();
      if (withReading) {
        try (Connection c = DriverManager.getConnection(url, db.user(), db.password());
            Statement s = c.createStatement()) {
          s.execute(
              "CREATE TABLE reading_v54_test PARTITION OF reading"
                  + " FOR VALUES FROM ('2026-01-01') TO ('2026-01-02')");
          s.execute(
              "INSERT INTO reading (sample_point_id, parameter, time, value)"
                  + " VALUES ('X-CPD', 'sodium', '2026-01-01T10:00:00Z', 1.0)");
        }
      }
      flyway(url, db, "latest").migrate();
      List<Integer> versions = new ArrayList<>();
      try (Connection c = DriverManager.getConnection(url, db.user(), db.password());
          Statement s = c.createStatement();
          ResultSet rs =
              s.executeQuery("SELECT version FROM limit_defaults_activation ORDER BY id")) {
        while (rs.next()) {
          versions.add(rs.getInt(1));
        }
      }
      return versions;
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
