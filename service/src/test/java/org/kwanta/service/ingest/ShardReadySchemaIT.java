package org.kwanta.service.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.flywaydb.core.Flyway;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.TestDatabase;

/**
 * The migrated schema is ready to be distributed by sample point (docs/scaling.md): every
 * reading-side table carries its distribution column, the sample point's key ({@code point_key},
 * V62 for the readings, V71 for the evaluations and their rollups) or its id ({@code
 * sample_point_id}) in the tables not yet re-keyed, in every primary key and unique constraint, and
 * no foreign key joins two reading-side tables (a foreign key to a small registry table such as
 * {@code sample_point}, {@code reading_point} or {@code reading_parameter} is allowed: those become
 * reference tables, copied to every node).
 */
class ShardReadySchemaIT {

  /**
   * The tables that grow with the readings and would be distributed by sample point, with their
   * distribution column.
   */
  static final Map<String, String> DISTRIBUTED =
      Map.ofEntries(
          Map.entry("reading", "point_key"),
          Map.entry("reading_pack", "point_key"),
          Map.entry("reading_revision", "point_key"),
          Map.entry("reading_rollup_hour", "point_key"),
          Map.entry("reading_rollup_day", "point_key"),
          Map.entry("evaluation", "point_key"),
          Map.entry("evaluation_rollup_hour", "point_key"),
          Map.entry("evaluation_rollup_day", "point_key"),
          Map.entry("evaluation_rollup_pending", "point_key"),
          Map.entry("reading_head", "sample_point_id"),
          Map.entry("lab_result", "sample_point_id"));

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
                         ARRAY(SELECT a.attname::text FROM unnest(c.conkey) k
                               JOIN pg_attribute a ON a.attrelid = c.conrelid AND a.attnum = k)
                  FROM pg_constraint c JOIN pg_class r ON r.oid = c.conrelid
                  JOIN pg_namespace n ON n.oid = r.relnamespace
                  WHERE n.nspname = current_schema() AND c.contype IN ('p', 'u')
                    AND NOT r.relispartition
                  """)) {
            while (rs.next()) {
              String table = rs.getString(1);
              if (DISTRIBUTED.containsKey(table)) {
                seen.add(table);
                List<String> columns = List.of((String[]) rs.getArray(3).getArray());
                if (!columns.contains(DISTRIBUTED.get(table))) {
                  offending.add(table + "." + rs.getString(2));
                }
              }
            }
          }
        });
    assertThat(seen)
        .as("every distributed table has a primary key")
        .containsAll(DISTRIBUTED.keySet());
    assertThat(offending).as("keys without the distribution column").isEmpty();
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
              if (DISTRIBUTED.containsKey(rs.getString(1))
                  && DISTRIBUTED.containsKey(rs.getString(2))) {
                crossing.add(rs.getString(3));
              }
              assertThat(
                      DISTRIBUTED.containsKey(rs.getString(2))
                          && !DISTRIBUTED.containsKey(rs.getString(1)))
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
