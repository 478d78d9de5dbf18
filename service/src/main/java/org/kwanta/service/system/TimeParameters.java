package org.kwanta.service.system;

import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.Year;
import java.time.YearMonth;
import java.time.format.DateTimeParseException;

/** Request parameters that name a time, a month or a year; a bad one is a 400 naming the format. */
public final class TimeParameters {

  private TimeParameters() {}

  /** An ISO 8601 time with offset, or null when absent. */
  public static Instant instant(String name, String value) {
    if (value == null) {
      return null;
    }
    try {
      return OffsetDateTime.parse(value).toInstant();
    } catch (DateTimeParseException e) {
      throw ProblemException.of(
          name + " must be an ISO 8601 time with offset, e.g. 2026-04-12T06:00:00Z; was " + value);
    }
  }

  /** A time range [from, to). */
  public record Range(Instant from, Instant to) {}

  /**
   * The range of optional {@code from} and {@code to} parameters: {@code to} defaults to five
   * minutes after {@code now} (the ingest's future skew), {@code from} to {@code span} before
   * {@code to}; {@code from} after {@code to} is a 400.
   */
  public static Range range(String from, String to, Instant now, java.time.Duration span) {
    Instant end = instant("to", to);
    end = end == null ? now.plusSeconds(300) : end;
    Instant start = instant("from", from);
    start = start == null ? end.minus(span) : start;
    if (start.isAfter(end)) {
      throw ProblemException.of("from " + start + " lies after to " + end);
    }
    return new Range(start, end);
  }

  /** A calendar month {@code YYYY-MM}. */
  public static YearMonth month(String name, String value) {
    try {
      return YearMonth.parse(value);
    } catch (DateTimeParseException | NullPointerException e) {
      throw ProblemException.of(name + " must be a month YYYY-MM, e.g. 2026-04; was " + value);
    }
  }

  /** A calendar year {@code YYYY}. */
  public static Year year(String name, String value) {
    try {
      return Year.parse(value);
    } catch (DateTimeParseException | NullPointerException e) {
      throw ProblemException.of(name + " must be a year YYYY, e.g. 2026; was " + value);
    }
  }
}
