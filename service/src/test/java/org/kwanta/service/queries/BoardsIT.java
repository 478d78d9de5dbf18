package org.kwanta.service.queries;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpResponse;
import java.time.Duration;
import java.time.Instant;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.kwanta.model.diagnosis.Diagnoser;
import org.kwanta.service.diagnosis.DiagnosisService;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.kwanta.service.support.RandomFeed;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.test.context.TestPropertySource;

/**
 * The boards kept up to date off the request path ({@link Boards}) equal a fresh computation at the
 * time they say they are from, at every step of a random feed ({@link RandomFeed}: out-of-order
 * batches, corrections that re-evaluate later minutes, bad readings, readings ahead of the time,
 * and a reading changed by SQL by hand, which the board learns of only through the point's
 * generation, as it learns of another instance's writes). Each point's state is compared whole with
 * the state endpoint's fresh read at the board's {@code asOf} (latest readings and evaluation, the
 * levels by {@link CurrentLevels#of}), its diagnosis with the diagnosis over time at its minute.
 */
@DatabaseTest
@org.junit.jupiter.api.Tag(org.kwanta.service.support.Depth.THOROUGH)
@TestPropertySource(properties = {"kwanta.board.max-lag=PT30S", "kwanta.board.refresh=PT0.2S"})
class BoardsIT {

  @LocalServerPort int port;
  @Autowired StateController controller;
  @Autowired States states;
  @Autowired DiagnosisService diagnosis;
  @Autowired JdbcTemplate jdbc;

  /** The first board computed after {@code written}: the refresher's, within a few seconds. */
  private Boards.Board boardAfter(String plant, Instant written) {
    long deadline = System.nanoTime() + Duration.ofSeconds(45).toNanos();
    while (true) {
      Boards.Board b = controller.board(plant);
      assertThat(Duration.between(b.overview().asOf(), Instant.now()))
          .as("a board is answered at most the lag old")
          .isLessThanOrEqualTo(Duration.ofSeconds(31));
      if (b.overview().asOf().isAfter(written)) {
        return b;
      }
      assertThat(System.nanoTime()).as("refreshed after %s", written).isLessThan(deadline);
      try {
        Thread.sleep(50);
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
        throw new AssertionError(e);
      }
    }
  }

  private void equalsFreshComputation(Boards.Board b) {
    Instant asOf = b.overview().asOf();
    assertThat(b.overview().samplePoints()).hasSize(2);
    for (States.State s : b.overview().samplePoints()) {
      DiagnosisService.PointDiagnosis fresh = null;
      if (s.diagnosis() != null) {
        List<Diagnoser.Diagnosed> d =
            diagnosis.overTime(s.samplePoint(), s.diagnosis().time(), s.diagnosis().time());
        Diagnoser.Diagnosed last = d.get(d.size() - 1);
        fresh = new DiagnosisService.PointDiagnosis(last.time(), last.findings());
      }
      assertThat(s)
          .as("%s on the board of %s", s.samplePoint(), asOf)
          .isEqualTo(
              states.of(
                  s.samplePoint(), s.name(), s.cycleLocation(), s.treatmentRegime(), asOf, fresh));
    }
  }

  @Test
  void keptBoardsEqualAFreshComputationAtTheirTime() {
    Http http = Http.admin(port);
    RandomFeed feed = new RandomFeed(http, jdbc, "boards");
    feed.run(
        at -> {
          Instant written = Instant.now();
          Boards.Board b = boardAfter(feed.plant, written);
          equalsFreshComputation(b);
          // the endpoint answers the kept board: its JSON and tag, 304 with the tag
          HttpResponse<String> r = http.get("/api/v1/plants/" + feed.plant + "/overview");
          assertThat(r.statusCode()).isEqualTo(200);
          assertThat(r.headers().firstValue("ETag")).isPresent();
          assertThat(r.headers().firstValue("Server-Timing")).isPresent();
        });
    // with no write, the refresher recomputes the board at half the lag (what moves with the clock
    // alone: values leaving the level window)
    Boards.Board later = boardAfter(feed.plant, Instant.now().plusSeconds(16));
    equalsFreshComputation(later);
  }
}
