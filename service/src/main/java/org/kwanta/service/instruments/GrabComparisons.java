package org.kwanta.service.instruments;

import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.kwanta.model.Parameter;
import org.kwanta.service.audit.Actor;
import org.kwanta.service.ingest.LabResults;
import org.kwanta.service.ingest.ReadingHistory;
import org.springframework.context.event.EventListener;
import org.springframework.stereotype.Service;

/**
 * Online vs grab (issue 14 item 2): each grab or lab result of a parameter with a tolerance
 * compared with the online instrument at the same point at the result's time (the latest online
 * reading not of bad quality in the {@link #MATCH_WINDOW} up to that time).
 *
 * <p>{@code deviation = online − grab}; within tolerance when {@code |deviation| ≤ max(absolute,
 * relative × grab)}. A result below its detection limit L agrees when {@code online ≤ L +
 * tolerance(L)} (the deviation is then reported against L). The instrument was in doubt before the
 * grab when the stored evaluation at the online reading pointed at it (or the sample conditioning),
 * or when its last logged check before the grab had FAILED.
 *
 * <p>Every comparison made when a result is entered is logged in the instrument's history ({@link
 * InstrumentLog}, kind {@link CheckKind#GRAB_COMPARISON}): PASSED within tolerance (a doubt is
 * cleared: a FAILED check is followed by a passing one), FAILED outside (a doubt is confirmed, or
 * raised). The list endpoint recomputes comparisons from the stored data, so online readings that
 * arrive after the grab are used there.
 */
@Service
public class GrabComparisons {

  /**
   * How far before a grab's time an online reading is taken as "the online value at that time":
   * common practice, no source (a grab takes minutes to draw; analysers report every minute or so).
   */
  public static final Duration MATCH_WINDOW = Duration.ofMinutes(15);

  /** Where the tolerances come from. */
  public static final String TOLERANCE_SOURCE = "common practice, no source";

  /**
   * Tolerance of online against grab: the larger of an absolute value (canonical unit) and a
   * fraction of the grab value.
   */
  public record Tolerance(double absolute, double relative) {

    /** The tolerance at a grab value, canonical unit. */
    public double at(double grab) {
      return Math.max(absolute, relative * Math.abs(grab));
    }
  }

  /**
   * Tolerances per parameter, all "common practice, no source": pH ±0.2 (grab pH of high-purity
   * water drifts as it picks up carbon dioxide); conductivities ±5 % (specific, at least 0.05
   * µS/cm) and ±10 % (cation, at least 0.02 µS/cm); sodium, silica and dissolved oxygen ±20 % (at
   * least 0.5, 2 and 2 µg/kg).
   */
  static final Map<Parameter, Tolerance> TOLERANCES = new EnumMap<>(Parameter.class);

  static {
    TOLERANCES.put(Parameter.PH, new Tolerance(0.2, 0));
    TOLERANCES.put(Parameter.SPECIFIC_CONDUCTIVITY, new Tolerance(0.05, 0.05));
    TOLERANCES.put(Parameter.CATION_CONDUCTIVITY, new Tolerance(0.02, 0.10));
    TOLERANCES.put(Parameter.DEGASSED_CATION_CONDUCTIVITY, new Tolerance(0.02, 0.10));
    TOLERANCES.put(Parameter.SODIUM, new Tolerance(0.5, 0.20));
    TOLERANCES.put(Parameter.SILICA, new Tolerance(2, 0.20));
    TOLERANCES.put(Parameter.DISSOLVED_OXYGEN, new Tolerance(2, 0.20));
  }

  /** The tolerance of a parameter's online instrument against grab results, if it has one. */
  public static Optional<Tolerance> tolerance(Parameter p) {
    return Optional.ofNullable(TOLERANCES.get(p));
  }

  /** What a grab comparison found. */
  public enum Verdict {
    /** In doubt before, within tolerance: the doubt is cleared. */
    CLEARED,
    /** In doubt before, outside tolerance: the doubt is confirmed. */
    CONFIRMED,
    /** Not in doubt, within tolerance. */
    AGREES,
    /** Not in doubt, outside tolerance: the instrument is now in doubt. */
    DISAGREES
  }

  /** One comparison of an online instrument with a grab or lab result. */
  public record Comparison(
      String samplePoint,
      Parameter parameter,
      Instant grabTime,
      String source,
      String sampleId,
      double grabValue,
      String censored,
      Instant onlineTime,
      double onlineValue,
      double deviation,
      double tolerance,
      boolean withinTolerance,
      boolean inDoubtBefore,
      Verdict verdict) {}

  private final ReadingHistory readings;
  private final LabResults labResults;
  private final InstrumentLog log;

  GrabComparisons(ReadingHistory readings, LabResults labResults, InstrumentLog log) {
    this.readings = readings;
    this.labResults = labResults;
    this.log = log;
  }

  /** A point's comparisons in [from, to) (one parameter, or all when null), oldest first. */
  public List<Comparison> between(
      String samplePoint, Parameter parameter, Instant from, Instant to) {
    List<Comparison> out = new ArrayList<>();
    for (LabResults.LabResult r : labResults.between(samplePoint, parameter, from, to)) {
      compare(r).ifPresent(out::add);
    }
    return out;
  }

  /** The comparisons of every sample point of a plant in [from, to), oldest first. */
  public List<Comparison> plantBetween(String plantId, Instant from, Instant to) {
    List<Comparison> out = new ArrayList<>();
    for (LabResults.LabResult r : labResults.plantBetween(plantId, from, to)) {
      compare(r).ifPresent(out::add);
    }
    return out;
  }

  /** The comparison of one result, when its parameter has a tolerance and an online value. */
  Optional<Comparison> compare(LabResults.LabResult r) {
    Tolerance tol = TOLERANCES.get(r.parameter());
    if (tol == null) {
      return Optional.empty();
    }
    List<ReadingHistory.Judged> online =
        readings.judged(
            r.samplePoint(),
            r.parameter().code(),
            r.parameter().name(),
            r.time().minus(MATCH_WINDOW),
            r.time());
    if (online.isEmpty()) {
      return Optional.empty();
    }
    ReadingHistory.Judged last = online.get(online.size() - 1); // oldest first: the latest one
    double limit = tol.at(r.value());
    double deviation = last.value() - r.value();
    boolean within =
        r.belowDetectionLimit() ? last.value() <= r.value() + limit : Math.abs(deviation) <= limit;
    boolean failedBefore =
        log.checks(r.samplePoint(), r.parameter()).stream()
            .filter(c -> c.performedAt().isBefore(r.time()))
            .reduce((a, b) -> b)
            .map(c -> c.outcome() == Outcome.FAILED)
            .orElse(false);
    boolean inDoubt = last.inDoubt() || failedBefore;
    Verdict verdict =
        inDoubt
            ? (within ? Verdict.CLEARED : Verdict.CONFIRMED)
            : (within ? Verdict.AGREES : Verdict.DISAGREES);
    return Optional.of(
        new Comparison(
            r.samplePoint(),
            r.parameter(),
            r.time(),
            r.source(),
            r.sampleId(),
            r.value(),
            r.censored(),
            last.time(),
            last.value(),
            deviation,
            limit,
            within,
            inDoubt,
            verdict));
  }

  /**
   * Logs the comparison of each newly stored result in the instrument's history, in the transaction
   * that stored the results (so both are committed or neither).
   */
  @EventListener
  void onStored(LabResults.Stored stored) {
    for (LabResults.LabResult r : stored.results()) {
      compare(r).ifPresent(c -> record(c, r));
    }
  }

  private void record(Comparison c, LabResults.LabResult r) {
    String unit = c.parameter().unit();
    List<InstrumentLog.Result> results =
        List.of(
            new InstrumentLog.Result("online value", c.onlineValue(), unit, null),
            new InstrumentLog.Result(
                c.censored() == null ? "grab value" : "grab detection limit (below)",
                c.grabValue(),
                unit,
                null),
            new InstrumentLog.Result("deviation online - grab", c.deviation(), unit, null),
            new InstrumentLog.Result(
                "tolerance (" + TOLERANCE_SOURCE + ")", c.tolerance(), unit, null));
    String note =
        switch (c.verdict()) {
          case CLEARED -> "grab within tolerance: clears the doubt on the instrument";
          case CONFIRMED -> "grab outside tolerance: confirms the doubt on the instrument";
          case AGREES -> "grab within tolerance";
          case DISAGREES -> "grab outside tolerance: the instrument is in doubt";
        };
    note += " (" + c.source() + (c.sampleId() == null ? "" : " sample " + c.sampleId()) + ")";
    log.record(
        c.samplePoint(),
        c.parameter(),
        CheckKind.GRAB_COMPARISON,
        c.grabTime(),
        c.withinTolerance() ? Outcome.PASSED : Outcome.FAILED,
        results,
        note,
        new KeyActor(r.keyId(), r.keyName()));
  }

  /** The key that entered the result, as the actor of the logged comparison. */
  private record KeyActor(String keyId, String keyName) implements Actor {}
}
