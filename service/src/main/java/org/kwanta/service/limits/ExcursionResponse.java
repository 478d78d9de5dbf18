package org.kwanta.service.limits;

import java.time.Instant;
import java.util.List;
import java.util.Locale;

/**
 * One excursion in the API. Values are in {@code valueUnit} (UCUM), durations in seconds.
 * Allowances are the customary AL1 one week, AL2 24 h, AL3 4 h (from memory — verify).
 *
 * <p>{@code sampleCount} samples lie within the excursion; {@code inDoubtSampleCount} of them had
 * their instrument in doubt ({@code inDoubtFraction}, 0 to 1), and {@code calculatedSampleCount}
 * were classified on a calculated value (drum water pH while the electrode was in doubt). Doubt
 * never removes an excursion: it is reported with it.
 *
 * <p>{@code basis} says which limits judged it: {@code as-reported} (the versions in force at the
 * time) or {@code recomputed} (today's limits applied to the past); {@code limitsOrigin}, {@code
 * limitsVersion} and {@code limitsEffectiveFrom} name the limits in force at its start on that
 * basis. {@code acknowledgements} is the whole history, oldest first; {@code acknowledgedAt},
 * {@code acknowledgedBy} (the key's name), {@code acknowledgedByKeyId} and {@code
 * acknowledgementNote} repeat the latest. {@code inServiceSeconds} is the part of {@code
 * durationSeconds} (up to now, for a running excursion) that fell in time the block was in service:
 * excursion hours count only that (time before a block's first recorded state counts as in
 * service).
 */
public record ExcursionResponse(
    String plant,
    String block,
    String samplePoint,
    String parameter,
    String valueUnit,
    String limitsOrigin,
    int limitsVersion,
    Instant limitsEffectiveFrom,
    String basis,
    Instant start,
    Instant end,
    boolean open,
    String side,
    double peakValue,
    Instant peakTime,
    String highestLevel,
    String currentLevel,
    long durationSeconds,
    long allowanceSeconds,
    Instant deadline,
    Long timeRemainingSeconds,
    boolean allowanceExceeded,
    int sampleCount,
    int inDoubtSampleCount,
    double inDoubtFraction,
    int calculatedSampleCount,
    Instant acknowledgedAt,
    String acknowledgedBy,
    String acknowledgedByKeyId,
    String acknowledgementNote,
    List<AcknowledgementResponse> acknowledgements,
    long inServiceSeconds) {

  /** One acknowledgement in the history, oldest first; by the key that made it. */
  public record AcknowledgementResponse(Instant at, String keyId, String keyName, String note) {
    static AcknowledgementResponse from(ExcursionFinder.Acknowledgement a) {
      return new AcknowledgementResponse(a.at(), a.byKeyId(), a.byKeyName(), a.note());
    }
  }

  static ExcursionResponse from(ExcursionFinder.Found f) {
    var e = f.excursion();
    var p = f.limits().point();
    var parameter = f.limits().profile().key().parameter();
    var ack = f.acknowledgement();
    return new ExcursionResponse(
        p.plant(),
        p.block(),
        p.id(),
        parameter.code(),
        parameter.unit(),
        f.limits().origin().name(),
        f.limits().version(),
        f.limits().effectiveFrom(),
        f.basis().code(),
        e.start(),
        e.end().orElse(null),
        e.open(),
        e.side().name(),
        e.peakValue(),
        e.peakTime(),
        e.highestLevel().name(),
        e.currentLevel().name(),
        e.duration().toSeconds(),
        e.allowance().toSeconds(),
        e.deadline().orElse(null),
        e.timeRemaining().map(d -> d.toSeconds()).orElse(null),
        e.allowanceExceeded(),
        e.samples(),
        e.inDoubtSamples(),
        e.inDoubtFraction(),
        e.calculatedSamples(),
        ack.map(ExcursionFinder.Acknowledgement::at).orElse(null),
        ack.map(ExcursionFinder.Acknowledgement::byKeyName).orElse(null),
        ack.map(ExcursionFinder.Acknowledgement::byKeyId).orElse(null),
        ack.map(ExcursionFinder.Acknowledgement::note).orElse(null),
        f.acknowledgements().stream().map(AcknowledgementResponse::from).toList(),
        f.inService().toSeconds());
  }

  static final String CSV_HEADER =
      "plant,block,sample_point,parameter,value_unit,limits_origin,start,end,open,side,peak_value,"
          + "peak_time,highest_level,current_level,duration_s,allowance_s,deadline,"
          + "time_remaining_s,allowance_exceeded,samples,in_doubt_samples,in_doubt_fraction,"
          + "calculated_samples,acknowledged_at,acknowledged_by,"
          + "acknowledgement_note,limits_version,limits_effective_from,basis,acknowledged_by_key_id,"
          + "acknowledgements,in_service_s\r\n";

  String csvRow() {
    return String.join(
            ",",
            csv(plant),
            csv(block),
            csv(samplePoint),
            csv(parameter),
            csv(valueUnit),
            limitsOrigin,
            String.valueOf(start),
            end == null ? "" : end.toString(),
            String.valueOf(open),
            side,
            String.format(Locale.ROOT, "%s", peakValue),
            String.valueOf(peakTime),
            highestLevel,
            currentLevel,
            String.valueOf(durationSeconds),
            String.valueOf(allowanceSeconds),
            deadline == null ? "" : deadline.toString(),
            timeRemainingSeconds == null ? "" : timeRemainingSeconds.toString(),
            String.valueOf(allowanceExceeded),
            String.valueOf(sampleCount),
            String.valueOf(inDoubtSampleCount),
            String.format(Locale.ROOT, "%.3f", inDoubtFraction),
            String.valueOf(calculatedSampleCount),
            acknowledgedAt == null ? "" : acknowledgedAt.toString(),
            csv(acknowledgedBy),
            csv(acknowledgementNote),
            String.valueOf(limitsVersion),
            limitsEffectiveFrom == null ? "" : limitsEffectiveFrom.toString(),
            basis,
            csv(acknowledgedByKeyId),
            String.valueOf(acknowledgements.size()),
            String.valueOf(inServiceSeconds))
        + "\r\n";
  }

  /** RFC 4180 quoting; a leading formula character is neutralised for spreadsheets. */
  private static String csv(String s) {
    if (s == null) {
      return "";
    }
    String v = !s.isEmpty() && "=+-@".indexOf(s.charAt(0)) >= 0 ? "'" + s : s;
    return v.contains(",") || v.contains("\"") || v.contains("\n") || v.contains("\r")
        ? "\"" + v.replace("\"", "\"\"") + "\""
        : v;
  }
}
