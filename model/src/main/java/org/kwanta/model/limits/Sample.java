package org.kwanta.model.limits;

import java.time.Instant;
import java.util.Objects;

/**
 * One value of one parameter at one sample point.
 *
 * @param time when the value was measured (or evaluated)
 * @param value the value in the parameter's canonical unit; may be NaN only when suspect
 * @param suspect true when an instrument check failed for this value
 */
public record Sample(Instant time, double value, boolean suspect) {

  public Sample {
    Objects.requireNonNull(time, "time");
    if (!suspect && !Double.isFinite(value)) {
      throw new IllegalArgumentException(
          "A value that is not suspect must be finite; was " + value + " at " + time);
    }
  }
}
