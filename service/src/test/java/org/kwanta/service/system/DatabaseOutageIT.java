package org.kwanta.service.system;

import static org.assertj.core.api.Assertions.assertThat;

import io.zonky.test.db.postgres.embedded.EmbeddedPostgres;
import java.io.IOException;
import java.net.ServerSocket;
import java.net.http.HttpResponse;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import java.sql.Statement;
import java.time.Duration;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.kwanta.service.KwantaApplication;
import org.kwanta.service.support.Http;
import org.kwanta.service.support.TestKeys;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.boot.builder.SpringApplicationBuilder;
import org.springframework.context.ConfigurableApplicationContext;

/**
 * Durability through a database outage (loopback only, bounded): the service runs on its own
 * embedded PostgreSQL on a fixed port; two historian-like clients ingest batches and retry every
 * refused one; PostgreSQL is stopped for {@value #OUTAGE_SECONDS} s and started again. While it is
 * down, readiness is down and ingest answers 503 with Retry-After; afterwards readiness comes back
 * by itself, and the database holds every acknowledged reading exactly once, with its value.
 */
class DatabaseOutageIT {

  private static final Logger log = LoggerFactory.getLogger(DatabaseOutageIT.class);

  static final int OUTAGE_SECONDS = 25;
  private static final int CLIENTS = 2;
  private static final int BATCHES_PER_CLIENT = 60;
  private static final int READINGS_PER_BATCH = 50;
  private static final String POINT = "U1-ECO-IN"; // fictional Brackenmoor demo plant

  @Test
  void noAcknowledgedReadingIsLostOrDuplicatedThroughAnOutage(@TempDir Path dir) throws Exception {
    int pgPort = freePort();
    Path data = dir.resolve("pg");
    EmbeddedPostgres pg = startPostgres(data, pgPort);
    String url = "jdbc:postgresql://localhost:" + pgPort + "/postgres";
    ConfigurableApplicationContext app =
        new SpringApplicationBuilder(KwantaApplication.class)
            .run(
                "--server.port=0",
                "--spring.datasource.url=" + url,
                "--spring.datasource.username=postgres",
                "--" + TestKeys.ADMIN_KEY_PROPERTY + "=" + TestKeys.ADMIN,
                "--kwanta.http.retry-after=1s");
    ExecutorService clients = Executors.newFixedThreadPool(CLIENTS);
    try {
      int port = Integer.parseInt(app.getEnvironment().getProperty("local.server.port"));
      Http http = Http.admin(port);
      String ingestKey =
          tools.jackson.databind.json.JsonMapper.builder()
              .build()
              .readTree(
                  http.post(
                          "/api/v1/keys",
                          "application/json",
                          "{\"name\":\"outage historian\",\"role\":\"ingest\"}")
                      .body())
              .get("key")
              .asString();
      assertThat(http.get("/actuator/health/readiness").statusCode()).isEqualTo(200);

      Instant start = Instant.now().truncatedTo(ChronoUnit.SECONDS).minus(Duration.ofHours(6));
      Stats stats = new Stats();
      List<Future<Map<Instant, Double>>> sent = new ArrayList<>();
      for (int c = 0; c < CLIENTS; c++) {
        int client = c;
        sent.add(
            clients.submit(
                () -> runClient(new Http(port).withKey(ingestKey), client, start, stats)));
      }
      await(() -> stats.acknowledged.get() >= 10, Duration.ofSeconds(60), "ingest under way");

      pg.close();
      Instant down = Instant.now();
      log.info("PostgreSQL stopped after {} acknowledged batches", stats.acknowledged.get());
      await(
          () -> http.get("/actuator/health/readiness").statusCode() == 503,
          Duration.ofSeconds(20),
          "readiness down while PostgreSQL is down");
      HttpResponse<String> refused = http.get("/api/v1/plants");
      assertThat(refused.statusCode()).isEqualTo(503);
      assertThat(refused.headers().firstValue("Retry-After")).hasValue("1");
      assertThat(refused.body()).contains("urn:kwanta:problem:database-unavailable");
      assertThat(http.get("/actuator/health/liveness").statusCode()).isEqualTo(200);
      Thread.sleep(
          Math.max(0, OUTAGE_SECONDS * 1000L - Duration.between(down, Instant.now()).toMillis()));

      pg = startPostgres(data, pgPort);
      Instant up = Instant.now();
      await(
          () -> http.get("/actuator/health/readiness").statusCode() == 200,
          Duration.ofSeconds(60),
          "readiness back by itself after PostgreSQL restarts");
      Duration recovery = Duration.between(up, Instant.now());

      Map<Instant, Double> acknowledged = new HashMap<>();
      for (Future<Map<Instant, Double>> f : sent) {
        acknowledged.putAll(f.get(300, TimeUnit.SECONDS));
      }
      assertThat(acknowledged).hasSize(CLIENTS * BATCHES_PER_CLIENT * READINGS_PER_BATCH);
      assertThat(stats.refused503.get())
          .as("ingest refused with 503 during the outage")
          .isPositive();

      Map<Instant, Double> stored = new HashMap<>();
      int rows;
      try (Connection conn = DriverManager.getConnection(url, "postgres", "");
          Statement s = conn.createStatement()) {
        try (ResultSet rs =
            s.executeQuery(
                "SELECT count(*), count(DISTINCT (sample_point_id, parameter, time))"
                    + " FROM reading_named"
                    + " WHERE sample_point_id = '"
                    + POINT
                    + "'")) {
          rs.next();
          rows = rs.getInt(1);
          assertThat(rs.getInt(2)).as("no duplicates").isEqualTo(rows);
        }
        try (ResultSet rs =
            s.executeQuery(
                "SELECT time, value FROM reading_named WHERE sample_point_id = '"
                    + POINT
                    + "' AND parameter = 'specific_conductivity'")) {
          while (rs.next()) {
            stored.put(
                rs.getObject(1, java.time.OffsetDateTime.class).toInstant(), rs.getDouble(2));
          }
        }
      }
      assertThat(rows).isEqualTo(acknowledged.size());
      assertThat(stored).isEqualTo(acknowledged);
      log.info(
          "Outage survived: PostgreSQL down {} s; {} readings in {} batches acknowledged and stored"
              + " exactly once; {} requests refused with 503 and {} failed at the connection, all"
              + " retried; readiness back {} ms after PostgreSQL restarted",
          OUTAGE_SECONDS,
          acknowledged.size(),
          stats.acknowledged.get(),
          stats.refused503.get(),
          stats.ioErrors.get(),
          recovery.toMillis());
    } finally {
      clients.shutdownNow();
      app.close();
      pg.close();
    }
  }

  /** Sends this client's batches in order, each retried until acknowledged (2xx). */
  private static Map<Instant, Double> runClient(Http http, int client, Instant start, Stats stats)
      throws InterruptedException {
    Map<Instant, Double> acknowledged = new HashMap<>();
    for (int b = 0; b < BATCHES_PER_CLIENT; b++) {
      Map<Instant, Double> batch = new HashMap<>();
      StringBuilder body = new StringBuilder("{\"readings\":[");
      for (int i = 0; i < READINGS_PER_BATCH; i++) {
        int n = (b * READINGS_PER_BATCH + i) * CLIENTS + client;
        Instant t = start.plusSeconds(n);
        double value = 5.0 + (n % 997) / 1000.0;
        batch.put(t, value);
        body.append(i == 0 ? "" : ",")
            .append(
                String.format(
                    Locale.ROOT,
                    "{\"samplePoint\":\"%s\",\"parameter\":\"specific_conductivity\",\"time\":\"%s\","
                        + "\"value\":%s,\"unit\":\"uS/cm\"}",
                    POINT,
                    t,
                    value));
      }
      body.append("]}");
      Instant deadline = Instant.now().plus(Duration.ofMinutes(4));
      while (true) {
        int status;
        try {
          HttpResponse<String> r =
              http.post("/api/v1/readings", "application/json", body.toString());
          status = r.statusCode();
          if (status / 100 == 2) {
            break;
          }
          assertThat(status).as(r.body()).isEqualTo(503);
          assertThat(r.headers().firstValue("Retry-After")).isPresent();
          stats.refused503.incrementAndGet();
        } catch (RuntimeException connectionFailed) {
          stats.ioErrors.incrementAndGet();
        }
        if (Instant.now().isAfter(deadline)) {
          throw new AssertionError("batch " + b + " of client " + client + " never acknowledged");
        }
        Thread.sleep(500);
      }
      acknowledged.putAll(batch);
      stats.acknowledged.incrementAndGet();
      Thread.sleep(300); // pace the clients so the run spans the outage
    }
    return acknowledged;
  }

  private static final class Stats {
    final AtomicInteger acknowledged = new AtomicInteger();
    final AtomicInteger refused503 = new AtomicInteger();
    final AtomicInteger ioErrors = new AtomicInteger();
  }

  private static EmbeddedPostgres startPostgres(Path data, int port) throws IOException {
    return EmbeddedPostgres.builder()
        .setDataDirectory(data)
        .setCleanDataDirectory(false)
        .setPort(port)
        .start();
  }

  private interface Condition {
    boolean holds() throws Exception;
  }

  private static void await(Condition condition, Duration timeout, String what) throws Exception {
    Instant deadline = Instant.now().plus(timeout);
    while (Instant.now().isBefore(deadline)) {
      try {
        if (condition.holds()) {
          return;
        }
      } catch (RuntimeException notYet) {
        // keep polling
      }
      Thread.sleep(250);
    }
    throw new AssertionError("timed out waiting for: " + what);
  }

  private static int freePort() throws IOException {
    try (ServerSocket s = new ServerSocket(0)) {
      return s.getLocalPort();
    }
  }
}
