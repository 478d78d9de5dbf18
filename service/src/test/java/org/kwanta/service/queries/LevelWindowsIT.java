package org.kwanta.service.queries;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Clock;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.kwanta.service.ingest.ReadingHistory;
import org.kwanta.service.limits.Limits;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.kwanta.service.support.RandomFeed;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.jdbc.core.JdbcTemplate;

/**
 * The board's incremental levels ({@link LevelWindows}) equal a fresh computation ({@link
 * CurrentLevels#of}, a day of readings joined with their evaluations read afresh) at every step of
 * a random feed: readings a minute apart at a drum water and a feedwater point with gaps filled
 * later (out-of-order batches), corrections of earlier readings (which re-evaluate the hour after
 * them and so change later readings' doubt), bad-quality readings, readings ahead of the time asked
 * for, a reading changed by SQL by hand (a generation step the ingest did not log), and a window
 * that slides past the first readings. The series are invented; the limits are the shipped examples
 * (IAPWS guidance as recalled, from memory).
 */
@DatabaseTest
class LevelWindowsIT {

  @LocalServerPort int port;
  @Autowired LevelWindows windows;
  @Autowired CurrentLevels levels;
  @Autowired ReadingHistory readings;
  @Autowired Limits limits;
  @Autowired Clock clock;
  @Autowired JdbcTemplate jdbc;

  private void assertIncrementalEqualsFresh(
      String plant,
      List<String> ids,
      Instant at,
      Map<String, List<CurrentLevels.LevelState>> fresh) {
    Map<String, List<CurrentLevels.LevelState>> incremental =
        windows.levels(
            plant,
            ids,
            readings.generationsByPoint(plant),
            limits.stamp(plant, clock.instant()),
            at);
    for (String id : ids) {
      assertThat(incremental.get(id)).as("levels of %s at %s", id, at).isEqualTo(fresh.get(id));
    }
  }

  @Test
  void incrementalLevelsEqualAFreshComputationThroughARandomFeed() {
    RandomFeed feed = new RandomFeed(Http.admin(port), jdbc, "windows");
    boolean[] saw = new boolean[2];
    feed.run(
        at -> {
          // the fresh computation, once per step (it reads a day of readings per series)
          Map<String, List<CurrentLevels.LevelState>> fresh = new java.util.HashMap<>();
          for (String id : feed.points()) {
            fresh.put(id, levels.of(id, at));
          }
          assertIncrementalEqualsFresh(feed.plant, feed.points(), at, fresh);
          // asked again with nothing new: the same answer
          assertIncrementalEqualsFresh(feed.plant, feed.points(), at, fresh);
          for (List<CurrentLevels.LevelState> states : fresh.values()) {
            for (CurrentLevels.LevelState l : states) {
              saw[0] |= l.instrumentInDoubt();
              saw[1] |= l.actionLevel() > 0;
            }
          }
        });
    assertThat(saw[0]).as("the feed put an instrument in doubt at some step").isTrue();
    assertThat(saw[1]).as("the feed raised an action level at some step").isTrue();
  }
}
