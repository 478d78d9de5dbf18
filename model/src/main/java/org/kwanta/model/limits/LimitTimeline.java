package org.kwanta.model.limits;

import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import org.kwanta.model.Parameter;

/**
 * The limits of one parameter at one sample point over time: consecutive periods, each with the
 * profile in force from its start until the next period's start (or with none: no limits then).
 *
 * <p>A plant changes its limits (or its treatment regime) from time to time; a past value is judged
 * against the limits in force when it was measured, so a change today never rewrites last week's
 * record. A series classified over a timeline keeps its state across a boundary: an excursion that
 * is still beyond the new threshold goes on, and one that the new limits no longer hold ends after
 * the deadband and persistence of the new profile.
 */
public final class LimitTimeline {

  /**
   * One period.
   *
   * @param from the first instant the profile is in force ({@link Instant#MIN} for "always")
   * @param profile the profile in force, or empty when the parameter has no limits then
   */
  public record Period(Instant from, Optional<LimitProfile> profile) {
    public Period {
      Objects.requireNonNull(from, "from");
      Objects.requireNonNull(profile, "profile");
    }
  }

  private final List<Period> periods;

  private LimitTimeline(List<Period> periods) {
    this.periods = periods;
  }

  /** One profile in force at every time. */
  public static LimitTimeline of(LimitProfile profile) {
    return new LimitTimeline(
        List.of(new Period(Instant.MIN, Optional.of(Objects.requireNonNull(profile)))));
  }

  /**
   * Periods in strictly increasing order of start. Times before the first start have no limits.
   *
   * @throws IllegalArgumentException when there is no period, when the starts are not strictly
   *     increasing, or when the profiles are for different parameters
   */
  public static LimitTimeline of(List<Period> periods) {
    if (periods.isEmpty()) {
      throw new IllegalArgumentException("A limit timeline needs at least one period");
    }
    Parameter parameter = null;
    Instant previous = null;
    for (Period p : periods) {
      if (previous != null && !p.from().isAfter(previous)) {
        throw new IllegalArgumentException(
            "Limit periods must start in strictly increasing order: "
                + p.from()
                + " after "
                + previous);
      }
      previous = p.from();
      if (p.profile().isPresent()) {
        Parameter q = p.profile().get().key().parameter();
        if (parameter != null && parameter != q) {
          throw new IllegalArgumentException(
              "A limit timeline is for one parameter: " + parameter + " and " + q);
        }
        parameter = q;
      }
    }
    return new LimitTimeline(List.copyOf(periods));
  }

  /** The periods, oldest first. */
  public List<Period> periods() {
    return periods;
  }

  /** The index of the period in force at {@code t}, or -1 before the first. */
  public int indexAt(Instant t) {
    int lo = 0;
    int hi = periods.size() - 1;
    int found = -1;
    while (lo <= hi) {
      int mid = (lo + hi) >>> 1;
      if (periods.get(mid).from().isAfter(t)) {
        hi = mid - 1;
      } else {
        found = mid;
        lo = mid + 1;
      }
    }
    return found;
  }

  /** The profile in force at {@code t}, if any. */
  public Optional<LimitProfile> at(Instant t) {
    int i = indexAt(t);
    return i < 0 ? Optional.empty() : periods.get(i).profile();
  }

  /** Whether any period has limits. */
  public boolean hasLimits() {
    return periods.stream().anyMatch(p -> p.profile().isPresent());
  }

  /** The same timeline without periods ending before {@code t} (the one in force at t kept). */
  public LimitTimeline from(Instant t) {
    int i = Math.max(0, indexAt(t));
    return new LimitTimeline(List.copyOf(new ArrayList<>(periods.subList(i, periods.size()))));
  }
}
