package org.kwanta.model.limits;

import java.time.Duration;
import java.util.Optional;

/**
 * The state of a parameter at a sample point, in increasing order of concern: normal, outside the
 * normal range (below every action level), the three action levels, immediate shutdown.
 *
 * <p>Whether the instrument behind a value was in doubt is not a level: it is reported beside the
 * level ({@link Classification#instrumentInDoubt()}), so that doubt never hides a level.
 *
 * <p>Allowances: AL1 one week, AL2 24 hours, AL3 four hours (IAPWS technical guidance usage, from
 * memory — verify). OUTSIDE_NORMAL has none: it is advisory, not an action level and not an
 * excursion.
 */
public enum Level {
  /** Within the normal range and below every action level. */
  NORMAL(0, null),
  /**
   * Outside the normal (target) range but below every action level: advisory, shown and alerted
   * apart from the action levels, never an excursion.
   */
  OUTSIDE_NORMAL(0, null),
  /** Action Level 1: return to normal within one week (from memory — verify). */
  AL1(1, Duration.ofHours(168)),
  /** Action Level 2: return to normal within 24 hours (from memory — verify). */
  AL2(2, Duration.ofHours(24)),
  /** Action Level 3: return to normal within four hours or shut down (from memory — verify). */
  AL3(3, Duration.ofHours(4)),
  /** Immediate shutdown (for example drum water pH at 25 °C below 8.0; from memory — verify). */
  SHUTDOWN(4, Duration.ZERO);

  private final int severity;
  private final Duration allowance;

  Level(int severity, Duration allowance) {
    this.severity = severity;
    this.allowance = allowance;
  }

  /**
   * The action-level number, as the metrics show it: 0 for NORMAL and OUTSIDE_NORMAL, 1 to 3 for
   * the action levels, 4 for immediate shutdown. The order of concern is the enum order.
   */
  public int severity() {
    return severity;
  }

  /** Customary time allowed to return to normal; empty for NORMAL and OUTSIDE_NORMAL. */
  public Optional<Duration> allowance() {
    return Optional.ofNullable(allowance);
  }

  /** True for AL1, AL2, AL3 and SHUTDOWN: the levels that make an excursion. */
  public boolean isAction() {
    return severity > 0;
  }

  /**
   * NORMAL for OUTSIDE_NORMAL, otherwise this level: the level as the action-level scheme sees it.
   */
  public Level actionLevel() {
    return this == OUTSIDE_NORMAL ? NORMAL : this;
  }

  /** The action level with this number (0 NORMAL, 1 to 3 AL1 to AL3, 4 SHUTDOWN). */
  static Level ofSeverity(int severity) {
    return switch (severity) {
      case 0 -> NORMAL;
      case 1 -> AL1;
      case 2 -> AL2;
      case 3 -> AL3;
      case 4 -> SHUTDOWN;
      default -> throw new IllegalArgumentException("No level with severity " + severity);
    };
  }
}
