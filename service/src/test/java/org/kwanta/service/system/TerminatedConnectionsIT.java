package org.kwanta.service.system;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpResponse;
import java.sql.Connection;
import java.sql.ResultSet;
import java.sql.Statement;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.kwanta.service.support.TestDatabase;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.boot.test.web.server.LocalServerPort;

/**
 * PostgreSQL terminating the service's connections in the middle of ingest (as a failover, an
 * administrator's {@code pg_terminate_backend} or an idle-session timeout does) is a database
 * outage: every failed request is 503 with Retry-After, never 500, and a group that failed for it
 * is not retried on the plain path. Bounded: {@value #SECONDS} s, loopback only.
 */
@org.junit.jupiter.api.Tag(org.kwanta.service.support.Depth.THOROUGH)
@DatabaseTest
class TerminatedConnectionsIT {

  private static final Logger log = LoggerFactory.getLogger(TerminatedConnectionsIT.class);
  private static final int SECONDS = 12;
  private static final int CLIENTS = 3;
  private static final String POINT = "U1-ECO-IN"; // fictional Brackenmoor demo plant
  private static final String[] PARAMETERS = {
    "specific_conductivity", "cation_conductivity", "degassed_cation_conductivity"
  };

  @LocalServerPort int port;

  @Test
  void terminatedConnectionsGive503WithRetryAfterAndNoPlainPathRetry() throws Exception {
    Http http = Http.admin(port);
    double retriedBefore = counter(http, "kwanta_ingest_retried_total");
    Map<Integer, AtomicInteger> statuses = new ConcurrentHashMap<>();
    List<String> bad = java.util.Collections.synchronizedList(new ArrayList<>());
    AtomicBoolean running = new AtomicBoolean(true);
    AtomicInteger terminated = new AtomicInteger();
    Instant base = Instant.now().minus(6, ChronoUnit.HOURS).truncatedTo(ChronoUnit.MINUTES);
    ExecutorService pool = Executors.newFixedThreadPool(CLIENTS + 1);
    List<Future<?>> futures = new ArrayList<>();
    for (int c = 0; c < CLIENTS; c++) {
      String parameter = PARAMETERS[c];
      futures.add(
          pool.submit(
              () -> {
                int batch = 0;
                while (running.get()) {
                  StringBuilder body = new StringBuilder("{\"readings\":[");
                  for (int i = 0; i < 100; i++) {
                    // wrap within the last 6 h: a fast machine sends more batches than fit
                    // before now, and readings past now + 5 min are refused
                    Instant t = base.plusSeconds(10L * ((batch * 100 + i) % 2000));
                    body.append(i == 0 ? "" : ",")
                        .append("{\"samplePoint\":\"")
                        .append(POINT)
                        .append("\",\"parameter\":\"")
                        .append(parameter)
                        .append("\",\"time\":\"")
                        .append(t)
                        .append("\",\"value\":")
                        .append(0.05 + (i % 7) * 0.01)
                        .append(",\"unit\":\"uS/cm\"}");
                  }
                  body.append("]}");
                  HttpResponse<String> r =
                      http.post("/api/v1/readings", "application/json", body.toString());
                  statuses.computeIfAbsent(r.statusCode(), k -> new AtomicInteger()).addAndGet(1);
                  if (r.statusCode() == 503) {
                    if (r.headers().firstValue("Retry-After").isEmpty()
                        || !r.body().contains("urn:kwanta:problem:database-unavailable")) {
                      bad.add(r.statusCode() + " " + r.headers().map() + " " + r.body());
                    }
                  } else if (r.statusCode() != 200) {
                    bad.add(r.statusCode() + " " + r.body());
                  } else {
                    batch++;
                  }
                }
                return null;
              }));
    }
    futures.add(
        pool.submit(
            () -> {
              try (Connection db = TestDatabase.get().connect();
                  Statement s = db.createStatement()) {
                while (running.get()) {
                  Thread.sleep(150);
                  try (ResultSet rs =
                      s.executeQuery(
                          "SELECT count(*) FILTER (WHERE pg_terminate_backend(pid)) FROM"
                              + " pg_stat_activity WHERE datname = current_database() AND pid <>"
                              + " pg_backend_pid() AND backend_type = 'client backend'")) {
                    rs.next();
                    terminated.addAndGet(rs.getInt(1));
                  }
                }
              }
              return null;
            }));
    Thread.sleep(SECONDS * 1000L);
    running.set(false);
    pool.shutdown();
    assertThat(pool.awaitTermination(60, TimeUnit.SECONDS)).isTrue();
    for (Future<?> f : futures) {
      f.get();
    }
    Map<Integer, Integer> counts = new TreeMap<>();
    statuses.forEach((k, v) -> counts.put(k, v.get()));
    log.info("Terminated {} backends during ingest; answers by status: {}", terminated, counts);
    assertThat(terminated.get()).isPositive();
    assertThat(counts).containsKey(503).containsKey(200);
    assertThat(bad).as("answers other than 200 and 503 database-unavailable").isEmpty();
    // wait for the pool to heal, then: an outage is never retried batch by batch on the plain path
    HttpResponse<String> scrape = null;
    for (int i = 0; i < 20 && (scrape == null || scrape.statusCode() != 200); i++) {
      scrape = http.get("/actuator/prometheus");
    }
    assertThat(counter(http, "kwanta_ingest_retried_total")).isEqualTo(retriedBefore);
  }

  private static double counter(Http http, String name) {
    HttpResponse<String> r = http.get("/actuator/prometheus");
    for (int i = 0; i < 10 && r.statusCode() != 200; i++) {
      r = http.get("/actuator/prometheus");
    }
    Matcher m = Pattern.compile("(?m)^" + name + "(?:\\{[^}]*})? (\\S+)$").matcher(r.body());
    return m.find() ? Double.parseDouble(m.group(1)) : 0;
  }
}
