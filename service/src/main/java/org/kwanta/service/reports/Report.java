package org.kwanta.service.reports;

import java.time.Instant;
import java.util.List;
import java.util.Map;

/**
 * A plant's chemistry report over a month or a year, as the API returns it. Hours are in-service
 * hours (IN_SERVICE time and time before a block's first recorded state); fractions are 0 to 1.
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
    List<BlockTime> blocks,
    List<Channel> channels,
    List<Event> events,
    List<Instrument> instruments,
    List<CheckStatus> calibration,
    GrabVsOnline grabVsOnline,
    Index index,
    String basis) {

  /** A block's hours by operating state in the period. */
  public record BlockTime(
      String block,
      double hoursInService,
      double hoursUnrecorded,
      Map<String, Double> hoursByState) {}

  /** In-service hours per level of one sample point and parameter. */
  public record Channel(
      String samplePoint,
      String block,
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
      String block,
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

  /**
   * Online instruments against grab and lab results in the period: per instrument a summary, and
   * every comparison (a result below its detection limit keeps {@code censored} "below" and shows
   * as "&lt; limit").
   */
  public record GrabVsOnline(
      boolean available,
      String note,
      String toleranceSource,
      List<GrabAgreement> instruments,
      List<GrabRow> comparisons) {}

  /** One instrument's agreement with grab results in the period. */
  public record GrabAgreement(
      String samplePoint,
      String parameter,
      String unit,
      int comparisons,
      int withinTolerance,
      double meanDeviation,
      double maxAbsDeviation,
      String lastVerdict) {}

  /** One comparison (deviation = online − grab, canonical unit). */
  public record GrabRow(
      String samplePoint,
      String parameter,
      String unit,
      Instant grabTime,
      String source,
      String sampleId,
      double grabValue,
      String censored,
      String grab,
      double onlineValue,
      double deviation,
      double tolerance,
      boolean withinTolerance,
      String verdict) {}

  /** The chemistry performance index (docs/report.md). */
  public record Index(
      double value,
      double chemistryScore,
      double availabilityScore,
      int channels,
      int instruments,
      String definition) {}
}
