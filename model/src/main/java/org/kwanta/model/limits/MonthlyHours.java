package org.kwanta.model.limits;

import java.time.Duration;
import java.time.YearMonth;

/**
 * Time spent at one level in one calendar month (UTC).
 *
 * @param month the calendar month, UTC
 * @param level NORMAL (which here includes time OUTSIDE_NORMAL) or an action level
 * @param time total time at that level within the month
 */
public record MonthlyHours(YearMonth month, Level level, Duration time) {

  /** The time in hours (fractional). */
  public double hours() {
    return time.toMillis() / 3_600_000.0;
  }
}
