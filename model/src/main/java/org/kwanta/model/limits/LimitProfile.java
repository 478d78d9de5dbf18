package org.kwanta.model.limits;

import java.time.Duration;
import java.util.Comparator;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * The limits for one treatment regime, kind of sample point and parameter: a normal range, action
 * level and shutdown thresholds (high, low or both), a deadband and a persistence delay.
 *
 * <p>Rules checked on construction: on each side the thresholds are ordered by level (higher levels
 * further out), at most one per level and side; the deadband is finite and not negative; the
 * persistence is not negative; every value carries a source text.
 *
 * @param key regime, location and parameter
 * @param normal normal (target) range: a value outside it, below every action level, is
 *     OUTSIDE_NORMAL (advisory, never an excursion)
 * @param thresholds AL1/AL2/AL3/SHUTDOWN thresholds; may be empty (no action levels)
 * @param deadband hysteresis in the parameter's canonical unit: a level once entered is kept until
 *     the value comes back inside its threshold by more than this
 * @param deadbandSource where the deadband comes from
 * @param persistence how long a new level must hold before it is reported (up and down)
 * @param persistenceSource where the persistence comes from
 */
public record LimitProfile(
    LimitKey key,
    NormalRange normal,
    List<Threshold> thresholds,
    double deadband,
    String deadbandSource,
    Duration persistence,
    String persistenceSource) {

  public LimitProfile {
    Objects.requireNonNull(key, "key");
    Objects.requireNonNull(normal, "normal");
    Objects.requireNonNull(deadbandSource, "deadbandSource");
    Objects.requireNonNull(persistence, "persistence");
    Objects.requireNonNull(persistenceSource, "persistenceSource");
    thresholds =
        thresholds.stream()
            .sorted(Comparator.comparing(Threshold::side).thenComparing(Threshold::level))
            .toList();
    if (!(deadband >= 0) || !Double.isFinite(deadband)) {
      throw new IllegalArgumentException(
          key + ": deadband must be finite and >= 0, was " + deadband);
    }
    if (persistence.isNegative()) {
      throw new IllegalArgumentException(key + ": persistence must be >= 0, was " + persistence);
    }
    for (Side side : Side.values()) {
      List<Threshold> s = thresholds.stream().filter(t -> t.side() == side).toList();
      for (int i = 1; i < s.size(); i++) {
        Threshold lower = s.get(i - 1);
        Threshold upper = s.get(i);
        if (lower.level() == upper.level()) {
          throw new IllegalArgumentException(
              key + ": two " + side + " thresholds for " + lower.level());
        }
        boolean ordered =
            side == Side.HIGH ? upper.value() >= lower.value() : upper.value() <= lower.value();
        if (!ordered) {
          throw new IllegalArgumentException(
              key
                  + ": "
                  + side
                  + " threshold "
                  + upper.level()
                  + " = "
                  + upper.value()
                  + " is inside "
                  + lower.level()
                  + " = "
                  + lower.value());
        }
      }
    }
  }

  /** HIGH, LOW or BOTH from the thresholds' sides; HIGH when there are none. */
  public Direction direction() {
    boolean high = thresholds.stream().anyMatch(t -> t.side() == Side.HIGH);
    boolean low = thresholds.stream().anyMatch(t -> t.side() == Side.LOW);
    return high && low ? Direction.BOTH : low ? Direction.LOW : Direction.HIGH;
  }

  /**
   * The highest action level whose threshold {@code x} exceeds (NORMAL when none; the normal range
   * is not considered).
   */
  public Level levelOf(double x) {
    Level worst = Level.NORMAL;
    for (Threshold t : thresholds) {
      if (t.exceededBy(x) && t.level().severity() > worst.severity()) {
        worst = t.level();
      }
    }
    return worst;
  }

  /**
   * True when {@code x} holds {@code level} with the deadband applied: some threshold of that level
   * held, or for OUTSIDE_NORMAL a bound of the normal range.
   */
  boolean holds(Level level, double x) {
    if (level == Level.OUTSIDE_NORMAL) {
      return normal.high().isPresent() && x > normal.high().getAsDouble() - deadband
          || normal.low().isPresent() && x < normal.low().getAsDouble() + deadband;
    }
    for (Threshold t : thresholds) {
      if (t.level() == level && t.heldBy(x, deadband)) {
        return true;
      }
    }
    return false;
  }

  /**
   * True when {@code x} enters {@code level}: some threshold of that level exceeded, or for
   * OUTSIDE_NORMAL the value strictly outside the normal range.
   */
  boolean enters(Level level, double x) {
    if (level == Level.OUTSIDE_NORMAL) {
      return !normal.contains(x);
    }
    for (Threshold t : thresholds) {
      if (t.level() == level && t.exceededBy(x)) {
        return true;
      }
    }
    return false;
  }

  /** The side on which {@code x} is beyond a threshold or the normal range, if any. */
  public Optional<Side> sideOf(double x) {
    for (Threshold t : thresholds) {
      if (t.exceededBy(x)) {
        return Optional.of(t.side());
      }
    }
    if (normal.high().isPresent() && x > normal.high().getAsDouble()) {
      return Optional.of(Side.HIGH);
    }
    if (normal.low().isPresent() && x < normal.low().getAsDouble()) {
      return Optional.of(Side.LOW);
    }
    return Optional.empty();
  }
}
