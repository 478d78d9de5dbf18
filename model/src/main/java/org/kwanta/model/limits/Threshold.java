package org.kwanta.model.limits;

import java.util.Objects;

/**
 * One action-level or shutdown threshold.
 *
 * @param level AL1, AL2, AL3 or SHUTDOWN
 * @param side HIGH: exceeded above {@code value}; LOW: exceeded below it
 * @param value threshold in the parameter's canonical unit
 * @param source where the number comes from, e.g. {@code "IAPWS TGD5-13 (from memory — verify)"}
 */
public record Threshold(Level level, Side side, double value, String source) {

  public Threshold {
    Objects.requireNonNull(level, "level");
    Objects.requireNonNull(side, "side");
    Objects.requireNonNull(source, "source");
    if (!level.isAction()) {
      throw new IllegalArgumentException(
          "A threshold is for AL1, AL2, AL3 or SHUTDOWN, not " + level);
    }
    if (!Double.isFinite(value)) {
      throw new IllegalArgumentException("Threshold value must be finite, was " + value);
    }
    if (source.isBlank()) {
      throw new IllegalArgumentException("Threshold " + level + " " + side + " has no source text");
    }
  }

  /** True when {@code x} is beyond the threshold (strictly). */
  boolean exceededBy(double x) {
    return side == Side.HIGH ? x > value : x < value;
  }

  /**
   * True when {@code x} is still beyond the threshold moved back by {@code deadband}: the condition
   * for staying at this level once entered.
   */
  boolean heldBy(double x, double deadband) {
    return side == Side.HIGH ? x > value - deadband : x < value + deadband;
  }
}
