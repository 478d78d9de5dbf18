package org.kwanta.model.limits;

import java.time.Instant;
import java.util.Objects;

/**
 * One value of one parameter at one sample point.
 *
 * @param time when the value was measured (or evaluated)
 * @param value the value in the parameter's canonical unit; finite
 * @param instrumentInDoubt true when the instrument behind the measured value was in doubt (an
 *     instrument check failed, or the reading's quality was bad). The value is classified all the
 *     same; the flag is carried beside the level.
 * @param calculatedValue true when {@code value} is not the measured value but one calculated in
 *     its place (drum water pH at 25 °C from the conductivities while the pH electrode is in doubt)
 */
public record Sample(
    Instant time, double value, boolean instrumentInDoubt, boolean calculatedValue) {

  public Sample {
    Objects.requireNonNull(time, "time");
    if (!Double.isFinite(value)) {
      throw new IllegalArgumentException(
          "A sample value must be finite; was " + value + " at " + time);
    }
  }

  /** A measured value (not calculated). */
  public Sample(Instant time, double value, boolean instrumentInDoubt) {
    this(time, value, instrumentInDoubt, false);
  }
}
