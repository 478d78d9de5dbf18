package org.kwanta.model.limits;

import java.time.Instant;

/**
 * The classifier's answer for one sample.
 *
 * @param time the sample's time
 * @param value the sample's value (canonical unit)
 * @param level what to show for this sample: SUSPECT for a suspect value, otherwise {@code
 *     actionLevel}
 * @param actionLevel the confirmed level in force at this time (never SUSPECT; a suspect value
 *     leaves it unchanged)
 * @param actionLevelSince when the condition behind {@code actionLevel} began (its onset, before
 *     the persistence delay confirmed it); the first sample's time at the start of a series
 */
public record Classification(
    Instant time, double value, Level level, Level actionLevel, Instant actionLevelSince) {

  /** True when the sample was suspect. */
  public boolean suspect() {
    return level == Level.SUSPECT;
  }
}
