package org.kwanta.model.limits;

import java.time.Duration;
import java.time.Instant;

/**
 * A stretch of time at one confirmed level, from its onset to the onset of the next level.
 *
 * @param level the level (OUTSIDE_NORMAL included)
 * @param start onset, inclusive
 * @param end onset of the next level, or the evaluation time for the running span; exclusive
 */
public record LevelSpan(Level level, Instant start, Instant end) {

  /** Length of the span. */
  public Duration duration() {
    return Duration.between(start, end);
  }
}
