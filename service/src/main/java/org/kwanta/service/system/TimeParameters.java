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
      throw BadRequestException.of(
          name + " must be an ISO 8601 time with offset, e.g. 2026-04-12T06:00:00Z; was " + value);
    }
  }

  /** A calendar month {@code YYYY-MM}. */
  public static YearMonth month(String name, String value) {
    try {
      return YearMonth.parse(value);
    } catch (DateTimeParseException | NullPointerException e) {
      throw BadRequestException.of(name + " must be a month YYYY-MM, e.g. 2026-04; was " + value);
    }
  }

  /** A calendar year {@code YYYY}. */
  public static Year year(String name, String value) {
    try {
      return Year.parse(value);
    } catch (DateTimeParseException | NullPointerException e) {
      throw BadRequestException.of(name + " must be a year YYYY, e.g. 2026; was " + value);
    }
  }
}
