package org.kwanta.model.limits;

import java.util.Objects;
import java.util.OptionalDouble;

/**
 * The normal (target) range of a parameter. Either bound may be open. A value strictly outside it
 * but inside every action-level threshold is OUTSIDE_NORMAL (with the profile's deadband and
 * persistence), an advisory state that is not an excursion.
 *
 * @param low lower bound, canonical unit, or empty
 * @param high upper bound, canonical unit, or empty
 * @param source where the range comes from
 */
public record NormalRange(OptionalDouble low, OptionalDouble high, String source) {

  public NormalRange {
    Objects.requireNonNull(low, "low");
    Objects.requireNonNull(high, "high");
    Objects.requireNonNull(source, "source");
    if (low.isPresent() && high.isPresent() && low.getAsDouble() > high.getAsDouble()) {
      throw new IllegalArgumentException(
          "Normal range low " + low.getAsDouble() + " is above high " + high.getAsDouble());
    }
  }

  /** True when {@code x} lies within the range (bounds inclusive). */
  public boolean contains(double x) {
    return (low.isEmpty() || x >= low.getAsDouble()) && (high.isEmpty() || x <= high.getAsDouble());
  }
}
