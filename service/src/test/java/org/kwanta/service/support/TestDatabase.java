package org.kwanta.service.support;

import io.zonky.test.db.postgres.embedded.EmbeddedPostgres;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.SQLException;
import java.sql.Statement;
import java.util.Locale;
import java.util.UUID;
import org.springframework.boot.test.util.TestPropertyValues;
import org.springframework.context.ApplicationContextInitializer;
import org.springframework.context.ConfigurableApplicationContext;

/**
 * The real PostgreSQL server that database tests use, one per test JVM:
 *
 * <ul>
 *   <li>{@code KWANTA_TEST_DATABASE_URL} set (JDBC URL; optional {@code KWANTA_TEST_DATABASE_USER},
 *       {@code KWANTA_TEST_DATABASE_PASSWORD}): that server, for example a scratch database made by
 *       {@code .ci/run}; when the build runs several test JVMs, each takes a database of its own on
 *       that server ({@link #FORK_PROPERTY});
 *   <li>otherwise an embedded PostgreSQL 15 (real binaries from Maven Central) in a temporary
 *       directory, one per test JVM.
 * </ul>
 *
 * There is no fallback and no skip: without a database the tests fail (in CI and elsewhere), so a
 * green run always means the database tests ran. The Testcontainers path is a separate test that
 * skips without Docker.
 */
public final class TestDatabase {

  public static final String URL_VARIABLE = "KWANTA_TEST_DATABASE_URL";

  /**
   * The number of this test JVM when the build runs several ({@code kwanta.test.fork}, {@code f1},
   * {@code f2}..., set by the failsafe configuration from its fork number): with an external server
   * each JVM then uses a database of its own, {@code <database>_f<number>}, dropped and created
   * afresh at its start.
   */
  public static final String FORK_PROPERTY = "kwanta.test.fork";

  private static volatile TestDatabase instance;

  private final String url;
  private final String user;
  private final String password;
  private final String description;

  private TestDatabase(String url, String user, String password, String description) {
    this.url = url;
    this.user = user;
    this.password = password;
    this.description = description;
  }

  /** The shared database, started on first use. */
  public static TestDatabase get() {
    TestDatabase db = instance;
    if (db == null) {
      synchronized (TestDatabase.class) {
        db = instance;
        if (db == null) {
          db = start();
          instance = db;
        }
      }
    }
    return db;
  }

  private static TestDatabase start() {
    String external = System.getenv(URL_VARIABLE);
    if (external != null && !external.isBlank()) {
      String user = envOr("KWANTA_TEST_DATABASE_USER", "postgres");
      String password = envOr("KWANTA_TEST_DATABASE_PASSWORD", "");
      TestDatabase db = new TestDatabase(external, user, password, "external " + external);
      db.checkReachable();
      String fork = System.getProperty(FORK_PROPERTY, "");
      if (fork.matches("f[0-9]+")) {
        // several test JVMs share the server: each takes a database of its own beside the given one
        String name = databaseName(external) + "_" + fork;
        db.recreate(name);
        String url = db.withDatabase(name);
        return new TestDatabase(
            url, user, password, "external " + url + " (test JVM " + fork + ")");
      }
      return db;
    }
    try {
      Path dir = Files.createTempDirectory("kwanta-test-pg");
      EmbeddedPostgres pg =
          EmbeddedPostgres.builder().setDataDirectory(dir).setCleanDataDirectory(true).start();
      Runtime.getRuntime()
          .addShutdownHook(
              new Thread(
                  () -> {
                    try {
                      pg.close();
                    } catch (IOException ignored) {
                      // the JVM is going away
                    }
                  }));
      String url = pg.getJdbcUrl("postgres", "postgres");
      return new TestDatabase(url, "postgres", "", "embedded PostgreSQL at " + url);
    } catch (IOException | RuntimeException e) {
      throw new IllegalStateException(
          "No database for the database tests: the embedded PostgreSQL did not start and "
              + URL_VARIABLE
              + " is not set. Database tests never skip.",
          e);
    }
  }

  private static String envOr(String name, String fallback) {
    String v = System.getenv(name);
    return v == null || v.isBlank() ? fallback : v;
  }

  private void checkReachable() {
    try (Connection ignored = connect()) {
      // reachable
    } catch (SQLException e) {
      throw new IllegalStateException("Test database " + url + " is not reachable", e);
    }
  }

  public Connection connect() throws SQLException {
    return DriverManager.getConnection(url, user, password);
  }

  public String url() {
    return url;
  }

  public String user() {
    return user;
  }

  public String password() {
    return password;
  }

  public String description() {
    return description;
  }

  /**
   * Creates a new empty database on the same server and returns its JDBC URL. Tests that need their
   * own schema (for example the packaged-application test) use it and drop it afterwards.
   */
  public String createScratchDatabase(String prefix) throws SQLException {
    String name =
        (prefix + "_" + UUID.randomUUID().toString().replace("-", "")).toLowerCase(Locale.ROOT);
    try (Connection c = connect();
        Statement s = c.createStatement()) {
      s.execute("CREATE DATABASE " + name);
    }
    return withDatabase(name);
  }

  private void recreate(String name) {
    try (Connection c = connect();
        Statement s = c.createStatement()) {
      s.execute("DROP DATABASE IF EXISTS " + name + " WITH (FORCE)");
      s.execute("CREATE DATABASE " + name);
    } catch (SQLException e) {
      throw new IllegalStateException("could not create the test database " + name, e);
    }
  }

  public void dropDatabase(String jdbcUrl) throws SQLException {
    String name = databaseName(jdbcUrl);
    try (Connection c = connect();
        Statement s = c.createStatement()) {
      s.execute("DROP DATABASE IF EXISTS " + name + " WITH (FORCE)");
    }
  }

  private String withDatabase(String name) {
    int slash = url.indexOf('/', "jdbc:postgresql://".length());
    int query = url.indexOf('?', slash);
    return url.substring(0, slash + 1) + name + (query < 0 ? "" : url.substring(query));
  }

  private static String databaseName(String jdbcUrl) {
    int slash = jdbcUrl.indexOf('/', "jdbc:postgresql://".length());
    int query = jdbcUrl.indexOf('?', slash);
    return jdbcUrl.substring(slash + 1, query < 0 ? jdbcUrl.length() : query);
  }

  /**
   * Points a Spring test context at the shared test database, and installs the test admin key
   * ({@link TestKeys#ADMIN}).
   */
  public static final class Initializer
      implements ApplicationContextInitializer<ConfigurableApplicationContext> {

    @Override
    public void initialize(ConfigurableApplicationContext context) {
      TestDatabase db = get();
      TestPropertyValues.of(
              "spring.datasource.url=" + db.url(),
              "spring.datasource.username=" + db.user(),
              "spring.datasource.password=" + db.password(),
              TestKeys.ADMIN_KEY_PROPERTY + "=" + TestKeys.ADMIN)
          .applyTo(context.getEnvironment());
    }
  }

  /**
   * Like {@link Initializer}, on a new empty database of its own on the same server: for a test
   * that must see the service as a new installation does (the README's examples), whatever the
   * other tests sharing the server wrote.
   */
  public static final class OwnDatabaseInitializer
      implements ApplicationContextInitializer<ConfigurableApplicationContext> {

    @Override
    public void initialize(ConfigurableApplicationContext context) {
      TestDatabase db = get();
      String url;
      try {
        url = db.createScratchDatabase("kwanta_own");
      } catch (SQLException e) {
        throw new IllegalStateException("could not create a database of its own", e);
      }
      TestPropertyValues.of(
              "spring.datasource.url=" + url,
              "spring.datasource.username=" + db.user(),
              "spring.datasource.password=" + db.password(),
              TestKeys.ADMIN_KEY_PROPERTY + "=" + TestKeys.ADMIN)
          .applyTo(context.getEnvironment());
    }
  }
}
