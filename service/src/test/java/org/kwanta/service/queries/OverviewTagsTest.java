package org.kwanta.service.queries;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.Instant;
import java.util.List;
import org.junit.jupiter.api.Test;
import tools.jackson.databind.json.JsonMapper;

/** The overview's weak ETag follows the data, not the clock (invented values). */
class OverviewTagsTest {

  static final JsonMapper MAPPER = JsonMapper.builder().build();
  static final Duration WINDOW = Duration.ofDays(1);
  static final Instant T = Instant.parse("2026-12-03T07:00:00Z");

  @Test
  void isWeakAndTheSameWhenOnlyTheClockMoved() {
    String first = tag(overview(T, 0.20, T.minus(WINDOW).plusSeconds(12)));
    // 40 s later: asOf, ages and levelsAsOf moved, and the onset of a level held all day slid
    String later = tag(overview(T.plusSeconds(40), 0.20, T.minus(WINDOW).plusSeconds(52)));
    assertThat(first).startsWith("W/\"").isEqualTo(later);
  }

  @Test
  void changesWithAValue() {
    Instant since = T.minus(Duration.ofMinutes(45));
    assertThat(tag(overview(T, 0.20, since))).isNotEqualTo(tag(overview(T, 0.21, since)));
  }

  @Test
  void changesWithTheOnsetOfALevelWithinTheWindow() {
    assertThat(tag(overview(T, 0.20, T.minus(Duration.ofMinutes(45)))))
        .isNotEqualTo(tag(overview(T, 0.20, T.minus(Duration.ofMinutes(30)))));
  }

  private static String tag(StateController.Overview o) {
    return OverviewTags.of(MAPPER, o, WINDOW);
  }

  /** One point whose cation conductivity reads value, its level AL1 since the given time. */
  private static StateController.Overview overview(Instant now, double value, Instant since) {
    Instant read = T.minusSeconds(30);
    double age = Duration.between(read, now).toSeconds();
    States.State s =
        new States.State(
            "P",
            "a point (invented)",
            "FEEDWATER",
            "AVT(O)",
            now,
            List.of(
                new States.Latest(
                    "cation_conductivity", "uS/cm", read, age, value, "good", 25.0, true)),
            List.of(
                new CurrentLevels.LevelState(
                    "cation_conductivity",
                    "AL1",
                    1,
                    since,
                    value,
                    "uS/cm",
                    false,
                    false,
                    "DEFAULT")),
            now,
            null,
            null);
    return new StateController.Overview("plant", "Plant (invented)", now, List.of(s));
  }
}
