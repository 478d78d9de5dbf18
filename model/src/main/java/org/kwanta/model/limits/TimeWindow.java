package org.kwanta.model.limits;

import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.Objects;

/**
 * A half-open stretch of time [start, end), such as a stretch a block was in service.
 *
 * @param start the first instant inside
 * @param end the first instant after; not before {@code start}
 */
public record TimeWindow(Instant start, Instant end) {

  public TimeWindow {
    Objects.requireNonNull(start, "start");
    Objects.requireNonNull(end, "end");
    if (end.isBefore(start)) {
      throw new IllegalArgumentException(
          "A window ends (" + end + ") before it starts (" + start + ")");
    }
  }

  /** The window's length. */
  public Duration length() {
    return Duration.between(start, end);
  }

  /** Whether {@code t} lies inside [start, end). */
  public boolean contains(Instant t) {
    return !t.isBefore(start) && t.isBefore(end);
  }

  /** The time [from, to) shares with this window (zero when they do not meet). */
  public Duration overlap(Instant from, Instant to) {
    Instant a = from.isAfter(start) ? from : start;
    Instant b = to.isBefore(end) ? to : end;
    return b.isAfter(a) ? Duration.between(a, b) : Duration.ZERO;
  }

  /** The time [from, to) shares with a list of windows that do not overlap one another. */
  public static Duration overlap(List<TimeWindow> windows, Instant from, Instant to) {
    Duration sum = Duration.ZERO;
    for (TimeWindow w : windows) {
      sum = sum.plus(w.overlap(from, to));
    }
    return sum;
  }
}
