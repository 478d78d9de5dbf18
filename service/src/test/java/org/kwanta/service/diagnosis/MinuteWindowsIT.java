package org.kwanta.service.diagnosis;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.kwanta.model.diagnosis.Diagnoser;
import org.kwanta.service.ingest.ReadingHistory;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.kwanta.service.support.RandomFeed;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.jdbc.core.JdbcTemplate;

/**
 * The current diagnosis' minutes kept up to date incrementally ({@link MinuteWindows}) equal the
 * minutes read afresh ({@link MinuteSeries#load}) at every step of a random feed ({@link
 * RandomFeed}: out-of-order batches, corrections that re-evaluate later minutes, bad readings,
 * readings ahead of the time asked for, a change by SQL by hand), over a look-back that slides past
 * the first readings.
 */
@DatabaseTest
class MinuteWindowsIT {

  @LocalServerPort int port;
  @Autowired MinuteWindows windows;
  @Autowired MinuteSeries minutes;
  @Autowired ReadingHistory readings;
  @Autowired JdbcTemplate jdbc;
  @Autowired DiagnosisService diagnosis;

  @Test
  void incrementalMinutesEqualTheMinutesReadAfresh() {
    RandomFeed feed = new RandomFeed(Http.admin(port), jdbc, "minutes");
    feed.run(
        at -> {
          // the current diagnosis' range: a day and a quarter back, whole minutes, to a minute on
          Instant from = at.minus(Duration.ofHours(26)).plusSeconds(15 * 60);
          Instant to = at.plusSeconds(60);
          for (int i = 0; i < 2; i++) {
            assertThat(
                    windows.load(
                        feed.plant,
                        feed.points(),
                        readings.generationsByPoint(feed.plant),
                        from,
                        to))
                .as("minutes at %s", at)
                .isEqualTo(minutes.load(feed.points(), from, to));
          }
        });
    // the plant-wide current diagnosis (incremental minutes, each point with the series it
    // reads) equals the diagnosis over time at each point's latest minute
    Map<String, DiagnosisService.PointDiagnosis> current = diagnosis.current(feed.plant);
    assertThat(current).isNotEmpty();
    current.forEach(
        (point, d) -> {
          List<Diagnoser.Diagnosed> over = diagnosis.overTime(point, d.time(), d.time());
          assertThat(over).as(point).isNotEmpty();
          assertThat(d.findings()).as(point).isEqualTo(over.get(over.size() - 1).findings());
        });
  }
}
