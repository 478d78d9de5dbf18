package org.kwanta.service.system;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.ByteArrayInputStream;
import java.io.InputStream;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.Executors;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.context.annotation.Import;
import org.springframework.test.context.TestPropertySource;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RestController;

/**
 * Limits on input and load: body size (413), unknown fields, parser limits and unstorable text
 * (400, nothing stored), and the ingest concurrency bound (503 with Retry-After). The ingest
 * endpoint here is a stand-in under {@code /api/v1/readings/}, so the bound is tested on its own.
 */
@DatabaseTest
@TestPropertySource(properties = "kwanta.http.max-concurrent-ingests=2")
@Import(LimitsIT.StandInIngest.class)
class LimitsIT {

  static volatile CountDownLatch entered = new CountDownLatch(0);
  static volatile CountDownLatch release = new CountDownLatch(0);

  /** Reads the whole body and answers its length; waits on {@link #release} when told to. */
  @RestController
  static class StandInIngest {
    @PostMapping("/api/v1/readings/limits-stand-in")
    String ingest(InputStream body) throws Exception {
      long n = body.transferTo(java.io.OutputStream.nullOutputStream());
      entered.countDown();
      if (!release.await(60, TimeUnit.SECONDS)) {
        throw new IllegalStateException("test did not release the stand-in");
      }
      return Long.toString(n);
    }
  }

  @LocalServerPort int port;
  Http admin;

  @BeforeEach
  void client() {
    admin = Http.admin(port);
  }

  @Test
  void declaredBodyOverTheLimitIs413BeforeReading() {
    String big = "{\"id\":\"big\",\"name\":\"" + "a".repeat(1_100_000) + "\"}";
    HttpResponse<String> r = admin.post("/api/v1/plants", "application/json", big);
    assertThat(r.statusCode()).isEqualTo(413);
    assertThat(r.body()).contains("urn:kwanta:problem:payload-too-large");
  }

  @Test
  void chunkedBodyOverTheLimitIs413WhileReading() {
    StringBuilder blocks = new StringBuilder();
    for (int i = 0; blocks.length() < 1_200_000; i++) {
      blocks.append(i == 0 ? "" : ",").append("{\"id\":\"u").append(i).append("\",\"name\":\"n\"}");
    }
    byte[] body =
        ("{\"id\":\"chunked\",\"name\":\"c\",\"blocks\":[" + blocks + "],\"samplePoints\":[]}")
            .getBytes(StandardCharsets.UTF_8);
    HttpResponse<String> r =
        admin.send(
            HttpRequest.newBuilder(admin.uri("/api/v1/plants"))
                .header("Content-Type", "application/json")
                .POST(
                    HttpRequest.BodyPublishers.ofInputStream(
                        () -> new ByteArrayInputStream(body))));
    assertThat(r.statusCode()).isEqualTo(413);
    assertThat(r.body()).contains("urn:kwanta:problem:payload-too-large");
    assertThat(admin.get("/api/v1/plants/chunked").statusCode()).isEqualTo(404);
  }

  @Test
  void ingestAcceptsLargerBodiesUpToItsOwnLimit() {
    release = new CountDownLatch(0);
    HttpResponse<String> twoMiB =
        admin.post("/api/v1/readings/limits-stand-in", "text/csv", "x".repeat(2 << 20));
    assertThat(twoMiB.statusCode()).isEqualTo(200);
    assertThat(twoMiB.body()).isEqualTo(Integer.toString(2 << 20));
    HttpResponse<String> seventeenMiB =
        admin.post("/api/v1/readings/limits-stand-in", "text/csv", "x".repeat(17 << 20));
    assertThat(seventeenMiB.statusCode()).isEqualTo(413);
  }

  @Test
  void unknownFieldIs400NamingTheField() {
    HttpResponse<String> r =
        admin.post(
            "/api/v1/plants",
            "application/json",
            "{\"id\":\"unknown-field\",\"name\":\"x\",\"blocks\":[],\"samplePoints\":[],\"colour\":1}");
    assertThat(r.statusCode()).isEqualTo(400);
    assertThat(r.body()).contains("Unknown field 'colour'").doesNotContain("org.kwanta");
    assertThat(admin.get("/api/v1/plants/unknown-field").statusCode()).isEqualTo(404);
  }

  @Test
  void overlongStringAndDeepNestingAre400() {
    String longName =
        "{\"id\":\"long\",\"name\":\""
            + "a".repeat(70_000)
            + "\",\"blocks\":[],\"samplePoints\":[]}";
    HttpResponse<String> r = admin.post("/api/v1/plants", "application/json", longName);
    assertThat(r.statusCode()).isEqualTo(400);
    assertThat(r.body()).contains("parser limit");
    String deep = "{\"id\":" + "[".repeat(200) + "]".repeat(200) + "}";
    HttpResponse<String> d = admin.post("/api/v1/plants", "application/json", deep);
    assertThat(d.statusCode()).isEqualTo(400);
  }

  @Test
  void textPostgresCannotStoreIs400AndNothingIsStored() {
    String nul =
        "{\"id\":\"nul-name\",\"name\":\"a\\u0000b\",\"blocks\":[{\"id\":\"U1\",\"name\":\"u\"}],"
            + "\"samplePoints\":[]}";
    HttpResponse<String> r = admin.post("/api/v1/plants", "application/json", nul);
    assertThat(r.statusCode()).isEqualTo(400);
    assertThat(r.body()).contains("U+0000");
    assertThat(admin.get("/api/v1/plants/nul-name").statusCode()).isEqualTo(404);
  }

  @Test
  void ingestBeyondTheConcurrencyLimitIs503WithRetryAfter() throws Exception {
    entered = new CountDownLatch(2);
    release = new CountDownLatch(1);
    var pool = Executors.newFixedThreadPool(2);
    try {
      List<CompletableFuture<HttpResponse<String>>> held = new ArrayList<>();
      for (int i = 0; i < 2; i++) {
        held.add(
            CompletableFuture.supplyAsync(
                () -> admin.post("/api/v1/readings/limits-stand-in", "text/csv", "a,b"), pool));
      }
      assertThat(entered.await(30, TimeUnit.SECONDS)).as("two ingests in progress").isTrue();
      HttpResponse<String> third = admin.post("/api/v1/readings/limits-stand-in", "text/csv", "c");
      assertThat(third.statusCode()).isEqualTo(503);
      assertThat(third.headers().firstValue("Retry-After")).hasValue("5");
      assertThat(third.body()).contains("urn:kwanta:problem:service-unavailable");
      // other endpoints are not affected
      assertThat(admin.get("/api/v1/plants").statusCode()).isEqualTo(200);
      release.countDown();
      for (CompletableFuture<HttpResponse<String>> f : held) {
        assertThat(f.get(30, TimeUnit.SECONDS).statusCode()).isEqualTo(200);
      }
      assertThat(admin.post("/api/v1/readings/limits-stand-in", "text/csv", "d").statusCode())
          .isEqualTo(200);
    } finally {
      release.countDown();
      pool.shutdownNow();
    }
  }
}
