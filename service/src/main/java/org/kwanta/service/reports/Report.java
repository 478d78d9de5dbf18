package org.kwanta.service.reports;

import java.time.Instant;
import java.util.List;
import java.util.Map;

/**
 * A plant's chemistry report over a month or a year, as the API returns it. Hours are in-service
 * hours (IN_SERVICE time and time before a unit's first recorded state); fractions are 0 to 1.
 */
public record Report(
    String plant,
    String plantName,
    String period,
    String label,
    Instant from,
    Instant to,
    Instant asOf,
    String counting,
    String advisory,
    List<UnitTime> units,
    List<Channel> channels,
    List<Event> events,
    List<Instrument> instruments,
    List<CheckStatus> calibration,
    GrabVsOnline grabVsOnline,
    Index index) {

  /** A unit's hours by operating state in the period. */
  public record UnitTime(
      String unit,
      double hoursInService,
      double hoursUnrecorded,
      Map<String, Double> hoursByState) {}

  /** In-service hours per level of one sample point and parameter. */
  public record Channel(
      String samplePoint,
      String unit,
      String parameter,
      String valueUnit,
      double hoursInService,
      Map<String, Double> hoursByLevel,
      double penalty) {}

  /** An excursion event touching the period, with its status and cause now. */
  public record Event(
      long id,
      String title,
      Instant createdAt,
      String status,
      String causeCategory,
      List<String> excursions) {}

  /** A core instrument's availability and data completeness in the period. */
  public record Instrument(
      String samplePoint,
      String unit,
      String parameter,
      long slotSeconds,
      long slotsInService,
      long slotsWithData,
      long slotsGood,
      Double availability,
      Double completeness) {}

  /** A check of an instrument as it stood at the end of the period (or now, if earlier). */
  public record CheckStatus(
      String samplePoint,
      String parameter,
      String kind,
      Instant lastDone,
      Instant nextDue,
      String status,
      int checksInPeriod) {}

  /** The comparison of online instruments with grab samples: not available yet. */
  public record GrabVsOnline(boolean available, String note) {}

  /** The chemistry performance index (docs/report.md). */
  public record Index(
      double value,
      double chemistryScore,
      double availabilityScore,
      int channels,
      int instruments,
      String definition) {}
}
