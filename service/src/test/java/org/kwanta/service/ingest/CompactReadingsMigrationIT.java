package org.kwanta.service.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.Statement;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import org.flywaydb.core.Flyway;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.TestDatabase;
import org.springframework.core.io.Resource;
import org.springframework.core.io.support.PathMatchingResourcePatternResolver;

/**
 * Migration V62 (compact readings) converts every stored row without loss: readings (values bit for
 * bit, times to the microsecond, quality, sample temperature or its absence, compensation),
 * revisions (with their ids and the time the old value had arrived) and the hourly and daily
 * rollups, across daily partitions, for points of the registry and a point written by hand that the
 * registry does not know, and a parameter code the service does not know.
 */
@org.junit.jupiter.api.Tag(org.kwanta.service.support.Depth.THOROUGH)
class CompactReadingsMigrationIT {

  private static final String READINGS =
      "SELECT sample_point_id || ' ' || parameter || ' ' || time::text || ' ' ||"
          + " encode(float8send(value), 'hex') || ' ' || quality || ' ' ||"
          + " coalesce(encode(float8send(sample_temperature_cel), 'hex'), '-') || ' ' || compensated"
          + " FROM %s";

  private static final String REVISIONS =
      "SELECT id || ' ' || sample_point_id || ' ' || parameter || ' ' || time::text || ' ' ||"
          + " encode(float8send(old_value), 'hex') || ' ' || old_quality || ' ' ||"
          + " coalesce(encode(float8send(old_sample_temperature_cel), 'hex'), '-') || ' ' ||"
          + " old_compensated || ' ' || old_received_at::text || ' ' ||"
          + " encode(float8send(new_value), 'hex') || ' ' || revised_at::text FROM %s";

  private static final String ROLLUPS =
      "SELECT sample_point_id || ' ' || parameter || ' ' || bucket::text || ' ' || count || ' ' ||"
          + " concat_ws(' ', encode(float8send(min), 'hex'), encode(float8send(max), 'hex'),"
          + " encode(float8send(sum), 'hex'), encode(float8send(last), 'hex'), first_time::text,"
          + " last_time::text, encode(float8send(tw_sum), 'hex'),"
          + " encode(float8send(held_seconds), 'hex'), encode(float8send(mean), 'hex'),"
          + " encode(float8send(time_weighted_mean), 'hex')) FROM %s";

  private static final String NAMED_ROLLUP =
      "(SELECT k.sample_point_id, q.code AS parameter, r.* FROM %s r"
          + " JOIN reading_point k USING (point_key) JOIN reading_parameter q USING (parameter_key))"
          + " x";

  @Test
  void everyReadingRevisionAndRollupSurvivesBitForBit() throws Exception {
    TestDatabase db = TestDatabase.get();
    String url = db.createScratchDatabase("compact");
    try {
      flyway(url, db, "61").migrate();
      List<String> readings;
      List<String> revisions;
      List<String> hours;
      List<String> days;
      try (Connection c = DriverManager.getConnection(url, db.user(), db.password());
          Statement s = c.createStatement()) {
        s.execute("INSERT INTO plant (id, name) VALUES ('cmp', 'Compact test plant (invented)')");
        s.execute("INSERT INTO plant_unit (plant_id, id, name) VALUES ('cmp', 'U1', 'Unit 1')");
        s.execute(
            "INSERT INTO sample_point (id, plant_id, unit_id, name, cycle_location,"
                + " treatment_regime) VALUES ('C-ECO', 'cmp', 'U1', 'Economizer inlet',"
                + " 'FEEDWATER', 'AVT_O'), ('C-CPD', 'cmp', 'U1', 'Condensate pump discharge',"
                + " 'CONDENSATE', 'AVT_O')");
        for (LocalDate day = LocalDate.parse("2026-11-30");
            day.isBefore(LocalDate.parse("2026-12-03"));
            day = day.plusDays(1)) {
          s.execute(
              "CREATE TABLE reading_p"
                  + day.toString().replace("-", "")
                  + " PARTITION OF reading FOR VALUES FROM ('"
                  + day
                  + " 00:00:00+00') TO ('"
                  + day.plusDays(1)
                  + " 00:00:00+00')");
        }
        // values awkward to carry: negative zero, the smallest double, a huge one, many digits
        s.execute(
            """
            INSERT INTO reading (sample_point_id, parameter, time, value, quality,
                                 sample_temperature_cel, compensated, received_at)
            SELECT p, par, t + (n % 7) * interval '1 microsecond',
                   CASE n % 9 WHEN 0 THEN '-0'::float8 WHEN 1 THEN 4.9e-324 WHEN 2 THEN 1e300
                              ELSE 0.1 + n / 3.0 + random() END,
                   (n % 3)::int2, CASE WHEN n % 4 = 0 THEN NULL ELSE 20 + random() * 10 END, n % 5 <> 0,
                   t + interval '3 s'
            FROM unnest(ARRAY['C-ECO', 'C-CPD', 'HAND-ONLY']) p,
                 unnest(ARRAY['ph', 'sodium', 'cation_conductivity', 'retired_code']) par,
                 generate_series('2026-11-30 22:00+00'::timestamptz, '2026-12-02 01:00+00', '97 s')
                   WITH ORDINALITY g(t, n)""");
        s.execute(
            """
            INSERT INTO reading_revision (sample_point_id, parameter, time, old_value, old_quality,
                                          old_sample_temperature_cel, old_compensated,
                                          old_received_at, new_value)
            SELECT sample_point_id, parameter, time, value * 3, quality, sample_temperature_cel,
                   compensated, received_at, value
            FROM reading WHERE extract(minute FROM time)::int % 17 = 0""");
        s.execute("SELECT refresh_reading_rollups('-infinity', 'infinity')");
        readings = rows(s, READINGS.formatted("reading"));
        revisions = rows(s, REVISIONS.formatted("reading_revision"));
        hours = rows(s, ROLLUPS.formatted("reading_rollup_hour"));
        days = rows(s, ROLLUPS.formatted("reading_rollup_day"));
      }
      assertThat(readings).hasSizeGreaterThan(10_000);
      assertThat(revisions).isNotEmpty();
      assertThat(hours).hasSizeGreaterThan(300);

      flyway(url, db, "latest").migrate();
      try (Connection c = DriverManager.getConnection(url, db.user(), db.password());
          Statement s = c.createStatement()) {
        assertThat(rows(s, READINGS.formatted("reading_named"))).isEqualTo(readings);
        assertThat(
                rows(
                    s,
                    REVISIONS.formatted(
                        "reading_revision r JOIN reading_point k USING (point_key)"
                            + " JOIN (SELECT parameter_key, code AS parameter FROM"
                            + " reading_parameter) q USING (parameter_key)")))
            .isEqualTo(revisions);
        assertThat(rows(s, ROLLUPS.formatted(NAMED_ROLLUP.formatted("reading_rollup_hour"))))
            .isEqualTo(hours);
        assertThat(rows(s, ROLLUPS.formatted(NAMED_ROLLUP.formatted("reading_rollup_day"))))
            .isEqualTo(days);
        // the partitions keep their names, and new revisions continue the ids
        assertThat(
                rows(
                    s,
                    "SELECT c.relname FROM pg_inherits i JOIN pg_class c ON c.oid = i.inhrelid"
                        + " WHERE i.inhparent = 'reading'::regclass"))
            .containsExactly("reading_p20261130", "reading_p20261201", "reading_p20261202");
        s.execute(
            "INSERT INTO reading_revision (point_key, parameter_key, time, old_value, old_quality,"
                + " old_compensated, new_value) VALUES (1, 1, now(), 1, 0, true, 2)");
        assertThat(rows(s, "SELECT max(id)::text FROM reading_revision"))
            .containsExactly(String.valueOf(revisions.size() + 1));
      }
    } finally {
      db.dropDatabase(url);
    }
  }

  /**
   * A database migrated before V62 existed already holds V68: the service applies V62 out of order
   * ({@code spring.flyway.out-of-order}, application.yaml) and converts its readings.
   */
  @Test
  void aDatabaseAlreadyPastV62sNumberIsConvertedOutOfOrder() throws Exception {
    TestDatabase db = TestDatabase.get();
    String url = db.createScratchDatabase("compactlate");
    Path before = Files.createTempDirectory("migrations-before-v62");
    try {
      for (Resource r :
          new PathMatchingResourcePatternResolver().getResources("classpath*:db/migration/*.sql")) {
        String name = r.getFilename();
        // V69 (packed cold storage) and V71 (evaluations keyed by point) were written after V62
        // and build on its keys: no database holds them without V62, so they are applied with V62
        // in the second step
        if (!name.startsWith("V62__")
            && !name.startsWith("V63__")
            && !name.startsWith("V69__")
            && !name.startsWith("V71__")) {
          try (var in = r.getInputStream()) {
            Files.copy(in, before.resolve(name));
          }
        }
      }
      Flyway.configure()
          .dataSource(url, db.user(), db.password())
          .locations("filesystem:" + before)
          .load()
          .migrate();
      List<String> readings;
      try (Connection c = DriverManager.getConnection(url, db.user(), db.password());
          Statement s = c.createStatement()) {
        s.execute("INSERT INTO plant (id, name) VALUES ('late', 'Late test plant (invented)')");
        s.execute("INSERT INTO plant_block (plant_id, id, name) VALUES ('late', 'U1', 'Unit 1')");
        s.execute(
            "INSERT INTO sample_point (id, plant_id, block_id, name, cycle_location,"
                + " treatment_regime) VALUES ('L-ECO', 'late', 'U1', 'Economizer inlet',"
                + " 'FEEDWATER', 'AVT(O)')");
        s.execute(
            "CREATE TABLE reading_p20261201 PARTITION OF reading FOR VALUES FROM"
                + " ('2026-12-01 00:00:00+00') TO ('2026-12-02 00:00:00+00')");
        s.execute(
            """
            INSERT INTO reading (sample_point_id, parameter, time, value, quality,
                                 sample_temperature_cel, compensated)
            SELECT 'L-ECO', par, t, random(), 0, NULL, true
            FROM unnest(ARRAY['ph', 'sodium']) par,
                 generate_series('2026-12-01 00:00+00'::timestamptz, '2026-12-01 02:00+00', '10 s') t""");
        readings = rows(s, READINGS.formatted("reading"));
      }
      Flyway.configure()
          .dataSource(url, db.user(), db.password())
          .locations("classpath:db/migration")
          .outOfOrder(true)
          .load()
          .migrate();
      try (Connection c = DriverManager.getConnection(url, db.user(), db.password());
          Statement s = c.createStatement()) {
        assertThat(rows(s, READINGS.formatted("reading_named"))).isEqualTo(readings);
        assertThat(rows(s, "SELECT version FROM flyway_schema_history WHERE success"))
            .contains("62", "68");
      }
    } finally {
      db.dropDatabase(url);
      try (var files = Files.walk(before)) {
        files.sorted(java.util.Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
      }
    }
  }

  /** The migrations give every parameter of the catalogue of their time a key. */
  @Test
  void everyParameterOfTheServiceHasAKey() throws Exception {
    TestDatabase db = TestDatabase.get();
    String url = db.createScratchDatabase("compactkeys");
    try {
      flyway(url, db, "latest").migrate();
      try (Connection c = DriverManager.getConnection(url, db.user(), db.password());
          Statement s = c.createStatement()) {
        assertThat(rows(s, "SELECT code FROM reading_parameter"))
            .containsAll(List.of(org.kwanta.model.Parameter.codeArray()));
      }
    } finally {
      db.dropDatabase(url);
    }
  }

  /**
   * A parameter of the catalogue without a key (one added after the migrations) gets the next free
   * key when the service first needs the keys: adding a parameter needs no migration.
   */
  @Test
  void aParameterWithoutAKeyGetsTheNextOne() throws Exception {
    TestDatabase db = TestDatabase.get();
    String url = db.createScratchDatabase("compactnewkey");
    try {
      flyway(url, db, "latest").migrate();
      var source =
          new org.springframework.jdbc.datasource.DriverManagerDataSource(
              url, db.user(), db.password());
      var jdbc = new org.springframework.jdbc.core.JdbcTemplate(source);
      jdbc.update("DELETE FROM reading_parameter WHERE code = 'orp'");
      short max =
          jdbc.queryForObject("SELECT max(parameter_key) FROM reading_parameter", Short.class);
      SeriesKeys keys =
          new SeriesKeys(
              jdbc, new org.springframework.jdbc.datasource.DataSourceTransactionManager(source));
      assertThat(keys.parameter(org.kwanta.model.Parameter.ORP)).isEqualTo((short) (max + 1));
      assertThat(
              jdbc.queryForObject(
                  "SELECT parameter_key FROM reading_parameter WHERE code = 'orp'", Short.class))
          .isEqualTo((short) (max + 1));
      assertThat(keys.parameter(org.kwanta.model.Parameter.PH))
          .isEqualTo(
              jdbc.queryForObject(
                  "SELECT parameter_key FROM reading_parameter WHERE code = 'ph'", Short.class));
    } finally {
      db.dropDatabase(url);
    }
  }

  private static List<String> rows(Statement s, String sql) throws Exception {
    List<String> out = new ArrayList<>();
    try (ResultSet rs = s.executeQuery(sql)) {
      while (rs.next()) {
        out.add(rs.getString(1));
      }
    }
    out.sort(null);
    return out;
  }

  private static Flyway flyway(String url, TestDatabase db, String target) {
    return Flyway.configure()
        .dataSource(url, db.user(), db.password())
        .locations("classpath:db/migration")
        .target(target)
        .load();
  }
}
