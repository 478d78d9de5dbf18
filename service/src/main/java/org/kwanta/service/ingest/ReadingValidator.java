package org.kwanta.service.ingest;

import java.time.Clock;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.format.DateTimeParseException;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Set;
import org.kwanta.model.Parameter;

/** Checks a batch: every reading is valid, or the batch is refused with every problem listed. */
final class ReadingValidator {

  static final int MAX_ID_LENGTH = 64;

  private final IngestLimits limits;
  private final Clock clock;

  ReadingValidator(IngestLimits limits, Clock clock) {
    this.limits = limits;
    this.clock = clock;
  }

  /** Result: valid readings, or the reasons for refusal. */
  record Outcome(List<ValidReading> valid, List<RejectedReading> rejected) {}

  Outcome validate(List<ReadingInput> inputs, Set<String> knownSamplePoints) {
    return validate(inputs, knownSamplePoints, false);
  }

  /**
   * Checks a batch of online readings ({@code lab} false: a grab or lab source is refused, with a
   * pointer to the lab endpoint) or of grab and lab results ({@code lab} true: source grab or lab,
   * sample id, method and censoring checked).
   */
  Outcome validate(List<ReadingInput> inputs, Set<String> knownSamplePoints, boolean lab) {
    List<ValidReading> valid = new ArrayList<>(inputs.size());
    List<RejectedReading> rejected = new ArrayList<>();
    Instant now = clock.instant();
    Instant latest = now.plus(limits.futureSkew());
    Instant earliest = now.minus(limits.pastHorizon());
    java.util.Map<String, Instant> parsedTimes = new java.util.HashMap<>();
    for (int i = 0; i < inputs.size(); i++) {
      ReadingInput in = inputs.get(i);
      int before = rejected.size();
      if (in == null) {
        rejected.add(new RejectedReading(i, null, "reading is null"));
        continue;
      }
      String point = in.samplePoint();
      if (point == null || point.isBlank()) {
        rejected.add(new RejectedReading(i, "samplePoint", "missing"));
      } else if (point.length() > MAX_ID_LENGTH || !knownSamplePoints.contains(point)) {
        rejected.add(
            new RejectedReading(
                i, "samplePoint", "unknown sample point '" + abbreviate(point) + "'"));
      }
      Optional<Parameter> parameter = Parameter.byCode(in.parameter());
      if (in.parameter() == null) {
        rejected.add(new RejectedReading(i, "parameter", "missing"));
      } else if (parameter.isEmpty()) {
        rejected.add(
            new RejectedReading(
                i,
                "parameter",
                "unknown parameter '"
                    + abbreviate(in.parameter())
                    + "'; known: "
                    + Parameter.codes()));
      }
      Instant time = null;
      if (in.time() == null) {
        rejected.add(new RejectedReading(i, "time", "missing"));
      } else {
        try {
          // stored to the microsecond, as PostgreSQL keeps it; readings of a batch share times
          time = parsedTimes.get(in.time());
          if (time == null) {
            time = OffsetDateTime.parse(in.time()).toInstant().truncatedTo(ChronoUnit.MICROS);
            parsedTimes.put(in.time(), time);
          }
          if (time.isAfter(latest)) {
            rejected.add(
                new RejectedReading(
                    i, "time", "more than " + limits.futureSkew() + " in the future"));
          } else if (time.isBefore(earliest)) {
            rejected.add(
                new RejectedReading(
                    i, "time", "older than the past horizon of " + limits.pastHorizon()));
          }
        } catch (DateTimeParseException e) {
          rejected.add(
              new RejectedReading(
                  i,
                  "time",
                  "not ISO 8601 with an offset (e.g. 2026-11-30T10:00:00Z): '"
                      + abbreviate(in.time())
                      + "'"));
        }
      }
      double canonical = Double.NaN;
      if (in.value() == null) {
        rejected.add(new RejectedReading(i, "value", "missing"));
      } else if (!Double.isFinite(in.value())) {
        rejected.add(new RejectedReading(i, "value", "not a finite number"));
      } else if (in.unit() == null || in.unit().isBlank()) {
        rejected.add(new RejectedReading(i, "unit", "missing; give a UCUM code"));
      } else if (parameter.isPresent()) {
        Parameter p = parameter.get();
        Optional<Double> converted = Units.toCanonical(p, in.value(), in.unit());
        if (converted.isEmpty()) {
          rejected.add(
              new RejectedReading(
                  i,
                  "unit",
                  "unit '"
                      + abbreviate(in.unit())
                      + "' is not accepted for "
                      + p.code()
                      + "; accepted (UCUM): "
                      + String.join(", ", new java.util.TreeSet<>(Units.accepted(p)))));
        } else {
          canonical = converted.get();
          if (canonical < p.min() || canonical > p.max()) {
            rejected.add(
                new RejectedReading(
                    i,
                    "value",
                    String.format(
                        Locale.ROOT,
                        "%s %s outside the physical bounds [%s, %s] %s",
                        p.code(),
                        canonical,
                        p.min(),
                        p.max(),
                        p.unit())));
          } else if (p.quantity() == Parameter.Quantity.STATE_CODE
              && org.kwanta.model.OperatingStateCode.of(canonical).isEmpty()) {
            rejected.add(
                new RejectedReading(
                    i,
                    "value",
                    p.code()
                        + " "
                        + canonical
                        + " is not a state code: 1 in service, 2 start-up, 3 shut down,"
                        + " 4 layup wet, 5 layup dry"));
          }
        }
      }
      ValidReading.Quality quality = ValidReading.Quality.GOOD;
      if (in.quality() != null) {
        try {
          quality = ValidReading.Quality.valueOf(in.quality().trim().toUpperCase(Locale.ROOT));
        } catch (IllegalArgumentException e) {
          rejected.add(
              new RejectedReading(
                  i,
                  "quality",
                  "must be good, uncertain or bad, not '" + abbreviate(in.quality()) + "'"));
        }
      }
      double sampleTemperature = Double.NaN;
      if (in.sampleTemperatureCel() != null) {
        if (parameter.isPresent() && !parameter.get().isConductivity()) {
          rejected.add(
              new RejectedReading(
                  i, "sampleTemperatureCel", "only conductivities carry a sample temperature"));
        } else if (!Double.isFinite(in.sampleTemperatureCel())
            || in.sampleTemperatureCel() < -10
            || in.sampleTemperatureCel() > 200) {
          rejected.add(
              new RejectedReading(
                  i, "sampleTemperatureCel", "must be a finite temperature in [-10, 200] Cel"));
        } else {
          sampleTemperature = in.sampleTemperatureCel();
        }
      }
      if (in.compensated() != null && parameter.isPresent() && !parameter.get().isConductivity()) {
        rejected.add(
            new RejectedReading(i, "compensated", "only conductivities can be compensated"));
      }
      checkSource(in, i, lab, rejected);
      if (lab && parameter.isPresent() && parameter.get().isProcessValue()) {
        rejected.add(
            new RejectedReading(
                i,
                "parameter",
                parameter.get().code()
                    + " is a process value: the historian sends it to POST /api/v1/readings"));
      }
      boolean compensated =
          in.compensated() != null ? in.compensated() : in.sampleTemperatureCel() == null;
      if (rejected.size() == before) {
        valid.add(
            new ValidReading(
                point, parameter.get(), time, canonical, quality, sampleTemperature, compensated));
      }
    }
    return new Outcome(valid, rejected);
  }

  private static void checkSource(
      ReadingInput in, int i, boolean lab, List<RejectedReading> rejected) {
    if (!lab) {
      if (in.notOnline()) {
        rejected.add(
            new RejectedReading(
                i,
                "source",
                "'"
                    + abbreviate(in.source())
                    + "' is not an online reading: grab and lab results go to POST"
                    + " /api/v1/lab-results"));
      } else if (in.sampleId() != null
          || in.labMethod() != null
          || in.censored() != null
          || in.densityTemperatureCel() != null) {
        rejected.add(
            new RejectedReading(
                i,
                "source",
                "sampleId, labMethod, censored and densityTemperatureCel belong to grab and lab"
                    + " results (POST /api/v1/lab-results)"));
      }
      return;
    }
    if (in.quality() != null && !"good".equalsIgnoreCase(in.quality().trim())) {
      rejected.add(
          new RejectedReading(
              i,
              "quality",
              "grab and lab results carry no quality: omit it, or leave the result out"));
    }
    if (in.sampleTemperatureCel() != null || Boolean.FALSE.equals(in.compensated())) {
      rejected.add(
          new RejectedReading(
              i,
              in.sampleTemperatureCel() != null ? "sampleTemperatureCel" : "compensated",
              "grab and lab conductivities are entered at 25 °C (as the lab reports them)"));
    }
    if (in.source() != null && !"grab".equals(in.source()) && !"lab".equals(in.source())) {
      rejected.add(
          new RejectedReading(
              i, "source", "must be grab or lab here, not '" + abbreviate(in.source()) + "'"));
    }
    if (in.sampleId() != null && (in.sampleId().isBlank() || in.sampleId().length() > 64)) {
      rejected.add(new RejectedReading(i, "sampleId", "1 to 64 characters"));
    }
    if (in.labMethod() != null && (in.labMethod().isBlank() || in.labMethod().length() > 200)) {
      rejected.add(new RejectedReading(i, "labMethod", "1 to 200 characters"));
    }
    if (in.censored() != null && !"below".equals(in.censored())) {
      rejected.add(
          new RejectedReading(
              i,
              "censored",
              "only 'below' (below the detection limit, the value being the limit), not '"
                  + abbreviate(in.censored())
                  + "'"));
    }
  }

  private static String abbreviate(String s) {
    return s.length() <= 80 ? s : s.substring(0, 77) + "...";
  }
}
