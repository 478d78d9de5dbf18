package org.kwanta.service.limits;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Instant;
import java.util.List;
import org.junit.jupiter.api.Test;
import tools.jackson.databind.json.JsonMapper;

/** The excursion list's weak ETag follows the data, not the clock (invented values). */
class ExcursionTagsTest {

  static final JsonMapper MAPPER = JsonMapper.builder().build();
  static final Instant START = Instant.parse("2026-12-03T06:00:00Z");

  /** A running AL1 excursion counted up to {@code seconds} after its start. */
  private static ExcursionResponse running(long seconds, int samples, boolean exceeded) {
    return new ExcursionResponse(
        "brackenmoor",
        "U1",
        "U1-CPD",
        "cation_conductivity",
        "uS/cm",
        "DEFAULT",
        1,
        Instant.EPOCH,
        "as-reported",
        START,
        null,
        true,
        "HIGH",
        0.31,
        START.plusSeconds(60),
        "AL1",
        "AL1",
        seconds,
        604_800,
        START.plusSeconds(604_800),
        exceeded ? 0L : 604_800 - seconds,
        exceeded,
        samples,
        0,
        0.0,
        0,
        null,
        null,
        null,
        null,
        List.of(),
        seconds);
  }

  private static String tag(ExcursionResponse... rows) {
    return ExcursionTags.of(MAPPER, List.of(rows));
  }

  @Test
  void isWeakAndTheSameWhenOnlyARunningExcursionsClockMoved() {
    assertThat(tag(running(600, 10, false)))
        .startsWith("W/\"")
        .isEqualTo(tag(running(640, 10, false)));
  }

  @Test
  void changesWithANewSampleOrThePassingOfTheAllowance() {
    String now = tag(running(600, 10, false));
    assertThat(tag(running(600, 11, false))).isNotEqualTo(now);
    assertThat(tag(running(600, 10, true))).isNotEqualTo(now);
    assertThat(tag()).isNotEqualTo(now);
  }
}
