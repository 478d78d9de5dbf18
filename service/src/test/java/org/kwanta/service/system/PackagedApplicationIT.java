package org.kwanta.service.system;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.net.ServerSocket;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.Statement;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.kwanta.service.support.Http;
import org.kwanta.service.support.TestDatabase;

/**
 * Runs the packaged jar (the README's run command) as a separate process. Flyway must migrate in
 * the packaged application, not only in tests; the embedded database must keep its data across a
 * restart.
 */
class PackagedApplicationIT {

  private static Path jar() {
    Path jar = Path.of(System.getProperty("kwanta.packaged-jar", "target/kwanta-service.jar"));
    assertThat(jar).as("packaged application (run `mvn package` first)").exists();
    return jar;
  }

  @Test
  void migratesAnExternalDatabaseAtStart() throws Exception {
    TestDatabase db = TestDatabase.get();
    String url = db.createScratchDatabase("kwanta_packaged");
    try {
      int port = freePort();
      Process app =
          start(
              port,
              Map.of(
                  "SPRING_DATASOURCE_URL", url,
                  "SPRING_DATASOURCE_USERNAME", db.user(),
                  "SPRING_DATASOURCE_PASSWORD", db.password()),
              List.of());
      try {
        awaitHealthy(app, port);
        try (Connection c = DriverManager.getConnection(url, db.user(), db.password());
            Statement s = c.createStatement();
            ResultSet rs =
                s.executeQuery("SELECT count(*) FROM flyway_schema_history WHERE success")) {
          rs.next();
          assertThat(rs.getInt(1)).isPositive();
        }
      } finally {
        stop(app);
      }
    } finally {
      db.dropDatabase(url);
    }
  }

  /**
   * The README's run command with no setup: the first start generates an admin key and prints it
   * once in the log; data and key survive a restart, which prints no new key. The embedded server
   * asks every connection for the password the service keeps beside its data directory (issue 17:
   * it used to trust any local user), before and after the restart.
   */
  @Test
  void embeddedDatabaseKeepsDataAndGeneratedKeyAcrossRestart(@TempDir Path dataDir)
      throws Exception {
    String plant =
        "{\"id\":\"restart-check\",\"name\":\"Restart check\",\"blocks\":[{\"id\":\"U9\",\"name\":\"u\"}],"
            + "\"samplePoints\":[]}";
    int port = freePort();
    int databasePort = freePort();
    List<String> args =
        List.of(
            "--kwanta.embedded-database.data-directory=" + dataDir.resolve("pg"),
            "--kwanta.embedded-database.port=" + databasePort);
    Map<String, String> noKey = Map.of("KWANTA_ADMIN_KEY", "");
    Process first = start(port, noKey, args);
    String key;
    try {
      awaitHealthy(first, port);
      key = generatedKey(lastLog);
      assertThat(new Http(port).post("/api/v1/plants", "application/json", plant).statusCode())
          .as("no key")
          .isEqualTo(401);
      assertThat(
              new Http(port)
                  .withKey(key)
                  .post("/api/v1/plants", "application/json", plant)
                  .statusCode())
          .isEqualTo(201);
      assertEmbeddedServerAsksForThePassword(databasePort, dataDir.resolve("pg.password"));
    } finally {
      stop(first);
    }
    Process second = start(port, noKey, args);
    try {
      awaitHealthy(second, port);
      assertThat(Files.readString(lastLog)).doesNotContain(ADMIN_KEY_BANNER);
      HttpResponse<String> r = new Http(port).withKey(key).get("/api/v1/plants/restart-check");
      assertThat(r.statusCode()).isEqualTo(200);
      assertThat(r.body()).contains("Restart check");
      assertEmbeddedServerAsksForThePassword(databasePort, dataDir.resolve("pg.password"));
    } finally {
      stop(second);
    }
  }

  /** No password, or a wrong one: refused; the one in the file: connected. */
  private static void assertEmbeddedServerAsksForThePassword(int port, Path passwordFile)
      throws Exception {
    String url = "jdbc:postgresql://127.0.0.1:" + port + "/postgres";
    assertThat(passwordFile).exists();
    if (passwordFile.getFileSystem().supportedFileAttributeViews().contains("posix")) {
      assertThat(
              java.nio.file.attribute.PosixFilePermissions.toString(
                  Files.getPosixFilePermissions(passwordFile)))
          .isEqualTo("rw-------");
    }
    for (String wrong : new String[] {"", "not-the-password"}) {
      java.util.Properties p = new java.util.Properties();
      p.setProperty("user", "postgres");
      p.setProperty("password", wrong);
      org.assertj.core.api.Assertions.assertThatThrownBy(() -> DriverManager.getConnection(url, p))
          .as("password '%s'", wrong)
          .isInstanceOf(java.sql.SQLException.class);
    }
    try (Connection c =
            DriverManager.getConnection(url, "postgres", Files.readString(passwordFile).trim());
        Statement st = c.createStatement();
        ResultSet rs = st.executeQuery("SELECT 1")) {
      assertThat(rs.next()).isTrue();
    }
  }

  /**
   * SIGTERM while historians are pushing: batches already being processed complete and are stored
   * whole, new ones are refused, and what was acknowledged is exactly what is stored (checked after
   * a restart).
   */
  @Test
  void gracefulShutdownUnderLoadKeepsEveryAcknowledgedBatchWhole(@TempDir Path dataDir)
      throws Exception {
    int port = freePort();
    Map<String, String> env = Map.of("KWANTA_ADMIN_KEY", org.kwanta.service.support.TestKeys.ADMIN);
    List<String> args =
        List.of("--kwanta.embedded-database.data-directory=" + dataDir.resolve("pg"));
    Process app = start(port, env, args);
    Instant base =
        Instant.now().truncatedTo(java.time.temporal.ChronoUnit.DAYS).minusSeconds(86_400);
    int perBatch = 500;
    java.util.concurrent.atomic.AtomicInteger acknowledged =
        new java.util.concurrent.atomic.AtomicInteger();
    java.util.concurrent.atomic.AtomicInteger refused =
        new java.util.concurrent.atomic.AtomicInteger();
    java.util.concurrent.atomic.AtomicInteger serverErrors =
        new java.util.concurrent.atomic.AtomicInteger();
    java.util.concurrent.ExecutorService pool =
        java.util.concurrent.Executors.newFixedThreadPool(6);
    Path firstLog = lastLog;
    // what each request that ended after SIGTERM got, and when (shown if the count is off)
    java.util.concurrent.atomic.AtomicLong sigterm = new java.util.concurrent.atomic.AtomicLong();
    List<String> afterSigterm = java.util.Collections.synchronizedList(new ArrayList<>());
    try {
      awaitHealthy(app, port);
      Http http = Http.admin(port);
      List<java.util.concurrent.Future<?>> clients = new ArrayList<>();
      for (int c = 0; c < 6; c++) {
        int client = c;
        clients.add(
            pool.submit(
                () -> {
                  for (int b = 0; b < 40; b++) {
                    StringBuilder body = new StringBuilder("{\"readings\":[");
                    for (int i = 0; i < perBatch; i++) {
                      Instant t = base.plusSeconds(client * 100_000L + b * 1_000L + i);
                      body.append(i == 0 ? "" : ",")
                          .append(
                              "{\"samplePoint\":\"U1-ECO-IN\",\"parameter\":\"sodium\",\"time\":\"")
                          .append(t)
                          .append("\",\"value\":0.5,\"unit\":\"ug/kg\"}");
                    }
                    body.append("]}");
                    long sent = System.nanoTime();
                    String outcome;
                    try {
                      HttpResponse<String> r =
                          http.post("/api/v1/readings", "application/json", body.toString());
                      outcome = Integer.toString(r.statusCode());
                      if (r.statusCode() == 200) {
                        acknowledged.incrementAndGet();
                      } else if (r.statusCode() >= 500 && r.statusCode() != 503) {
                        serverErrors.incrementAndGet();
                      } else {
                        refused.incrementAndGet();
                      }
                    } catch (RuntimeException connectionRefusedOrClosed) {
                      outcome = String.valueOf(connectionRefusedOrClosed.getMessage());
                      refused.incrementAndGet();
                    }
                    long t0 = sigterm.get();
                    if (t0 != 0) {
                      afterSigterm.add(
                          String.format(
                              "client %d batch %d: sent %+d ms, answered %+d ms after SIGTERM: %s",
                              client,
                              b,
                              (sent - t0) / 1_000_000,
                              (System.nanoTime() - t0) / 1_000_000,
                              outcome));
                    }
                  }
                }));
      }
      while (acknowledged.get() < 6) {
        Thread.sleep(50);
      }
      sigterm.set(System.nanoTime());
      app.destroy(); // SIGTERM under load
      assertThat(app.waitFor(90, java.util.concurrent.TimeUnit.SECONDS))
          .as("graceful shutdown finished")
          .isTrue();
      for (java.util.concurrent.Future<?> f : clients) {
        f.get(120, java.util.concurrent.TimeUnit.SECONDS);
      }
    } finally {
      pool.shutdownNow();
      if (app.isAlive()) {
        app.destroyForcibly().waitFor();
      }
    }
    System.out.printf(
        "graceful shutdown under load: %d batches acknowledged, %d refused or cut off, %d server errors%n",
        acknowledged.get(), refused.get(), serverErrors.get());
    assertThat(serverErrors.get()).isZero();
    assertThat(refused.get()).as("requests after SIGTERM are refused").isPositive();
    Process second = start(port, env, args);
    try {
      awaitHealthy(second, port);
      HttpResponse<String> r =
          Http.admin(port)
              .get(
                  "/api/v1/sample-points/U1-ECO-IN/series?parameter=sodium&limit=100000&from="
                      + base
                      + "&to="
                      + base.plusSeconds(700_000));
      assertThat(r.statusCode()).isEqualTo(200);
      int stored = r.body().split("\"quality\"", -1).length - 1;
      assertThat(stored)
          .as(
              "readings stored = acknowledged batches x %d; requests ending after SIGTERM:%n%s%n"
                  + "the first run's log, last lines:%n%s",
              perBatch, String.join("\n", afterSigterm), tail(firstLog, 80))
          .isEqualTo(acknowledged.get() * perBatch);
    } finally {
      stop(second);
    }
  }

  private static final String ADMIN_KEY_BANNER = "No admin key existed, so one was generated";

  private static String generatedKey(Path log) throws IOException {
    String text = Files.readString(log);
    assertThat(text).contains(ADMIN_KEY_BANNER);
    java.util.regex.Matcher m =
        java.util.regex.Pattern.compile("\\s(kw_[a-z0-9]+_[A-Za-z0-9_-]{32,})\\s").matcher(text);
    assertThat(m.find()).as("generated key in the log").isTrue();
    return m.group(1);
  }

  private static Path lastLog;

  private static Process start(int port, Map<String, String> env, List<String> extraArgs)
      throws IOException {
    String java = ProcessHandle.current().info().command().orElse("java");
    List<String> command = new ArrayList<>(List.of(java, "-Xmx512m", "-jar", jar().toString()));
    command.add("--server.port=" + port);
    command.addAll(extraArgs);
    ProcessBuilder pb = new ProcessBuilder(command);
    pb.environment().remove("SPRING_DATASOURCE_URL");
    pb.environment().remove("KWANTA_ADMIN_KEY");
    pb.environment().putAll(env);
    Path log = Files.createTempFile("kwanta-packaged", ".log");
    lastLog = log;
    pb.redirectErrorStream(true).redirectOutput(log.toFile());
    return pb.start();
  }

  /** The last lines of a log file, for a failure's message. */
  private static String tail(Path log, int lines) {
    try {
      List<String> all = Files.readAllLines(log);
      return String.join("\n", all.subList(Math.max(0, all.size() - lines), all.size()));
    } catch (IOException e) {
      return "(log unreadable: " + e.getMessage() + ")";
    }
  }

  private static void awaitHealthy(Process app, int port) throws Exception {
    Instant deadline = Instant.now().plus(Duration.ofSeconds(120));
    Http http = new Http(port);
    while (Instant.now().isBefore(deadline)) {
      assertThat(app.isAlive()).as("packaged application exited early").isTrue();
      try {
        HttpResponse<String> r = http.get("/actuator/health/readiness");
        if (r.statusCode() == 200) {
          return;
        }
      } catch (RuntimeException notYet) {
        // not listening yet
      }
      Thread.sleep(500);
    }
    throw new AssertionError("packaged application did not become ready within 120 s");
  }

  private static void stop(Process app) throws InterruptedException {
    app.destroy(); // SIGTERM: graceful shutdown, the embedded database stops cleanly
    if (!app.waitFor(60, java.util.concurrent.TimeUnit.SECONDS)) {
      app.destroyForcibly().waitFor();
    }
  }

  private static int freePort() throws IOException {
    try (ServerSocket s = new ServerSocket(0)) {
      return s.getLocalPort();
    }
  }
}
