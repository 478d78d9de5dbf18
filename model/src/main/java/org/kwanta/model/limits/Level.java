package org.kwanta.model.limits;

import java.time.Duration;
import java.util.Optional;

/**
 * Classification of a value: normal, one of the three action levels, immediate shutdown, or suspect
 * (the instrument check failed, so the value is shown but never raises a level).
 *
 * <p>Allowances: AL1 one week, AL2 24 hours, AL3 four hours (IAPWS technical guidance usage, from
 * memory — verify).
 */
public enum Level {
  /** The instrument check failed: the value is not trusted; the action level is unchanged. */
  SUSPECT(-1, null),
  /** Within the normal range or below every action level. */
  NORMAL(0, null),
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

  /** The level as a number for metrics: -1 suspect, 0 normal, 1 to 3 action levels, 4 shutdown. */
  public int severity() {
    return severity;
  }

  /** Customary time allowed to return to normal; empty for NORMAL and SUSPECT. */
  public Optional<Duration> allowance() {
    return Optional.ofNullable(allowance);
  }

  /** True for AL1, AL2, AL3 and SHUTDOWN. */
  public boolean isAction() {
    return severity > 0;
  }

  /** The non-suspect level with this severity (0 to 4). */
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
