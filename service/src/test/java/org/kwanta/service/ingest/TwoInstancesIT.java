package org.kwanta.service.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Random;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;
import org.junit.jupiter.api.Test;
import org.kwanta.service.KwantaApplication;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.kwanta.service.support.TestDatabase;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.builder.SpringApplicationBuilder;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.boot.web.server.context.WebServerApplicationContext;
import org.springframework.context.ConfigurableApplicationContext;
import org.springframework.jdbc.core.JdbcTemplate;

/**
 * Two service instances on one database (issue 17): this test's application (retention off) and a
 * second application context started here (retention on, and dropping old partitions all through
 * the test, which makes every in-memory history stale on both). Overlapping, out-of-order batches
 * and corrections sent to both at once must leave exactly the evaluations that one instance writes
 * from the final readings sent in order, byte for byte.
 */
@DatabaseTest
class TwoInstancesIT {

  @LocalServerPort int port;
  @Autowired JdbcTemplate jdbc;
  @Autowired Partitions partitions;

  @Test
  void overlappingOutOfOrderBatchesOnTwoInstancesMatchOneInstanceInOrder() throws Exception {
    Http a = Http.admin(port);
    List<String> points = TestPlants.feedwaterPoints(a, 2);
    String reference = points.get(0);
    String shared = points.get(1);
    Instant start = Instant.now().truncatedTo(ChronoUnit.DAYS).minus(1, ChronoUnit.DAYS);
    int steps = org.kwanta.service.support.Depth.of(120, 240);

    // the reference: one instance, final values, in order
    List<String> inOrder = ReadingsIngestIT.feedwaterReadings(reference, start, steps, 20);
    for (int i = 0; i < inOrder.size(); i += 60) {
      assertThat(post(a, inOrder.subList(i, Math.min(i + 60, inOrder.size())))).isEqualTo(200);
    }

    try (ConfigurableApplicationContext second =
        new SpringApplicationBuilder(KwantaApplication.class)
            .initializers(new TestDatabase.Initializer())
            // arguments, not default properties: application.yaml would override those
            .run(
                "--server.port=0",
                "--kwanta.storage.retention-days=200",
                "--spring.application.name=kwanta-second")) {
      assertThat(second.getEnvironment().getProperty("kwanta.storage.retention-days"))
          .isEqualTo("200");
      Http b = Http.admin(((WebServerApplicationContext) second).getWebServer().getPort());
      Partitions secondPartitions = second.getBean(Partitions.class);
      Random random = new Random(17);

      // 1. wrong values first (to be corrected), a third of the readings, shuffled, on both
      List<String> finals = ReadingsIngestIT.feedwaterReadings(shared, start, steps, 20);
      List<String> wrong = new ArrayList<>();
      for (String r : finals) {
        if (random.nextInt(3) == 0) {
          wrong.add(r.replaceFirst("\"value\":([0-9.]+)", "\"value\":$1" + "7"));
        }
      }
      Collections.shuffle(wrong, random);
      // 2. the final values, shuffled, in overlapping batches (each reading in one or two)
      List<String> shuffled = new ArrayList<>(finals);
      Collections.shuffle(shuffled, random);
      List<List<String>> batches = new ArrayList<>();
      for (int i = 0; i < shuffled.size(); i += 40) {
        batches.add(
            new ArrayList<>(
                shuffled.subList(Math.max(0, i - 10), Math.min(i + 50, shuffled.size()))));
      }

      // retention on the second instance, all through: old days made and dropped again
      AtomicBoolean stop = new AtomicBoolean();
      AtomicInteger drops = new AtomicInteger();
      LocalDate old = LocalDate.now(ZoneOffset.UTC).minusDays(300);
      Thread retention =
          new Thread(
              () -> {
                while (!stop.get()) {
                  // this instance cannot know the other dropped the day (a write to it would
                  // fail and be retried after forgetting, as here)
                  partitions.forget(List.of(old));
                  partitions.ensure(List.of(old));
                  drops.addAndGet(secondPartitions.dropBefore(old.plusDays(1)).size());
                  try {
                    Thread.sleep(100);
                  } catch (InterruptedException e) {
                    return;
                  }
                }
              });
      retention.start();
      ExecutorService pool = Executors.newFixedThreadPool(4);
      try {
        sendConcurrently(pool, a, b, chunks(wrong, 30));
        sendConcurrently(pool, a, b, batches);
      } finally {
        stop.set(true);
        retention.join();
        pool.shutdown();
      }
      assertThat(drops.get()).isPositive();
    }

    assertThat(count(shared)).isEqualTo(inOrder.size());
    List<String> expected = evaluations(reference);
    assertThat(expected).hasSize(steps);
    assertThat(evaluations(shared)).isEqualTo(expected);
  }

  /** Sends every batch once, alternating between the instances, four at a time. */
  private static void sendConcurrently(
      ExecutorService pool, Http a, Http b, List<List<String>> batches) throws Exception {
    List<Future<Integer>> sent = new ArrayList<>();
    for (int i = 0; i < batches.size(); i++) {
      Http to = i % 2 == 0 ? a : b;
      List<String> batch = batches.get(i);
      sent.add(pool.submit(() -> post(to, batch)));
    }
    for (Future<Integer> f : sent) {
      assertThat(f.get()).isEqualTo(200);
    }
  }

  private static List<List<String>> chunks(List<String> all, int size) {
    List<List<String>> out = new ArrayList<>();
    for (int i = 0; i < all.size(); i += size) {
      out.add(all.subList(i, Math.min(i + size, all.size())));
    }
    return out;
  }

  private static int post(Http http, List<String> readings) {
    return http.post("/api/v1/readings", "application/json", ReadingsIngestIT.batch(readings))
        .statusCode();
  }

  private List<String> evaluations(String point) {
    return jdbc.queryForList(
        "SELECT "
            + ReadingsIngestIT.STORED_EVALUATION
            + " FROM evaluation WHERE point_key ="
            + " (SELECT point_key FROM reading_point WHERE sample_point_id = ?) ORDER BY time",
        String.class,
        point);
  }

  private int count(String point) {
    return jdbc.queryForObject(
        "SELECT count(*) FROM reading_named WHERE sample_point_id = ?", Integer.class, point);
  }
}
