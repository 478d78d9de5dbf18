package org.kwanta.service.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import org.flywaydb.core.Flyway;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.TestDatabase;

/**
 * The migrated schema is ready to be distributed by sample point (docs/scaling.md): every
 * reading-side table carries {@code sample_point_id} in every primary key and unique constraint,
 * and no foreign key joins two reading-side tables (a foreign key to a small registry table such as
 * {@code sample_point} is allowed: those become reference tables, copied to every node).
 */
class ShardReadySchemaIT {

  /** The tables that grow with the readings and would be distributed by sample point. */
  static final Set<String> DISTRIBUTED =
      Set.of(
          "reading",
          "reading_revision",
          "evaluation",
          "reading_head",
          "lab_result",
          "reading_rollup_hour",
          "reading_rollup_day");

  @Test
  void everyKeyOfAReadingSideTableHoldsTheSamplePoint() throws Exception {
    List<String> offending = new ArrayList<>();
    List<String> seen = new ArrayList<>();
    withMigratedSchema(
        s -> {
          try (ResultSet rs =
              s.executeQuery(
                  """
                  SELECT r.relname, c.conname,
                         EXISTS (SELECT 1 FROM unnest(c.conkey) k
                                 JOIN pg_attribute a ON a.attrelid = c.conrelid AND a.attnum = k
                                 WHERE a.attname = 'sample_point_id') AS has_point
                  FROM pg_constraint c JOIN pg_class r ON r.oid = c.conrelid
                  JOIN pg_namespace n ON n.oid = r.relnamespace
                  WHERE n.nspname = current_schema() AND c.contype IN ('p', 'u')
                    AND NOT r.relispartition
                  """)) {
            while (rs.next()) {
              if (DISTRIBUTED.contains(rs.getString(1))) {
                seen.add(rs.getString(1));
                if (!rs.getBoolean(3)) {
                  offending.add(rs.getString(1) + "." + rs.getString(2));
                }
              }
            }
          }
        });
    assertThat(seen).as("every distributed table has a primary key").containsAll(DISTRIBUTED);
    assertThat(offending).as("keys without sample_point_id").isEmpty();
  }

  @Test
  void noForeignKeyJoinsTwoReadingSideTables() throws Exception {
    List<String> crossing = new ArrayList<>();
    withMigratedSchema(
        s -> {
          try (ResultSet rs =
              s.executeQuery(
                  """
                  SELECT r.relname, f.relname, c.conname
                  FROM pg_constraint c JOIN pg_class r ON r.oid = c.conrelid
                  JOIN pg_class f ON f.oid = c.confrelid
                  JOIN pg_namespace n ON n.oid = r.relnamespace
                  WHERE n.nspname = current_schema() AND c.contype = 'f'
                    AND NOT r.relispartition
                  """)) {
            while (rs.next()) {
              if (DISTRIBUTED.contains(rs.getString(1)) && DISTRIBUTED.contains(rs.getString(2))) {
                crossing.add(rs.getString(3));
              }
              assertThat(
                      DISTRIBUTED.contains(rs.getString(2))
                          && !DISTRIBUTED.contains(rs.getString(1)))
                  .as(
                      "a registry table %s refers to the reading-side %s",
                      rs.getString(1), rs.getString(2))
                  .isFalse();
            }
          }
        });
    assertThat(crossing).isEmpty();
  }

  interface SchemaCheck {
    void run(Statement s) throws Exception;
  }

  private static void withMigratedSchema(SchemaCheck check) throws Exception {
    TestDatabase db = TestDatabase.get();
    String url = db.createScratchDatabase("shardready");
    try {
      Flyway.configure()
          .dataSource(url, db.user(), db.password())
          .locations("classpath:db/migration")
          .load()
          .migrate();
      try (Connection c = DriverManager.getConnection(url, db.user(), db.password());
          Statement s = c.createStatement()) {
        check.run(s);
      }
    } finally {
      db.dropDatabase(url);
    }
  }
}
