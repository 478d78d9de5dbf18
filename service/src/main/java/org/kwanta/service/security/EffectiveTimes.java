package org.kwanta.service.security;

import java.time.Duration;
import java.time.Instant;
import java.util.Map;
import org.kwanta.service.system.ProblemException;
import org.kwanta.service.system.ProblemTypes;
import org.kwanta.service.system.TimeParameters;
import org.springframework.http.HttpStatus;

/**
 * The one rule for the time from which a change of the record is in force (limits, a sample point's
 * configuration): now by default; a past time (more than a minute ago) rewrites what was in force,
 * so only an admin key may give one, and only with a reason.
 */
public final class EffectiveTimes {

  /** How far before now an effectiveFrom still counts as now (clock skew of the client). */
  public static final Duration PAST_TOLERANCE = Duration.ofMinutes(1);

  private EffectiveTimes() {}

  /**
   * The time a change is in force from.
   *
   * @param value the request's {@code effectiveFrom} (ISO 8601 with offset), or null for now
   * @param reason the request's reason, or null
   * @param now the service's clock
   * @param what what is changed, for the messages ("limits", "a sample point's configuration")
   */
  public static Instant effectiveFrom(String value, String reason, Instant now, String what) {
    if (value == null || value.isBlank()) {
      return now;
    }
    Instant t = TimeParameters.instant("effectiveFrom", value.strip());
    if (t.isBefore(now.minus(PAST_TOLERANCE))) {
      if (Callers.role().orElse(null) != Role.ADMIN) {
        throw new ProblemException(
            HttpStatus.FORBIDDEN,
            ProblemTypes.FORBIDDEN,
            "Forbidden",
            "Only an admin key may set " + what + " in force from a past time (" + t + ")",
            Map.of());
      }
      if (blankToNull(reason) == null) {
        throw ProblemException.of(
            "A past effectiveFrom (" + t + ") changes the record: give a reason");
      }
    }
    return t;
  }

  /** A reason as stored: stripped, and null when blank. */
  public static String blankToNull(String s) {
    return s == null || s.isBlank() ? null : s.strip();
  }
}
