package org.kwanta.service.limits;

import java.time.Duration;
import java.time.format.DateTimeParseException;
import java.util.List;
import java.util.OptionalDouble;
import org.kwanta.model.Parameter;
import org.kwanta.model.limits.Level;
import org.kwanta.model.limits.LimitKey;
import org.kwanta.model.limits.LimitProfile;
import org.kwanta.model.limits.NormalRange;
import org.kwanta.model.limits.Side;
import org.kwanta.model.limits.Threshold;

/**
 * The written form of one set of limits for a parameter, as in the default data files and in a
 * sample point's override. Units are the parameter's canonical unit, stated in {@code unit} so that
 * a file is never read with a guessed unit.
 *
 * @param parameter parameter code, e.g. {@code cation_conductivity}
 * @param unit the parameter's canonical unit (UCUM); must match
 * @param normal normal range
 * @param thresholds action-level and shutdown thresholds
 * @param deadband hysteresis with its source
 * @param persistence delay (ISO 8601 duration, e.g. {@code PT5M}) with its source
 */
public record LimitDocument(
    String parameter,
    String unit,
    Normal normal,
    List<ThresholdEntry> thresholds,
    Sourced deadband,
    SourcedDuration persistence) {

  /** A normal range; either bound may be omitted. */
  public record Normal(Double low, Double high, String source) {}

  /** One threshold: level AL1/AL2/AL3/SHUTDOWN, side HIGH or LOW. */
  public record ThresholdEntry(String level, String side, double value, String source) {}

  /** A number with its source. */
  public record Sourced(double value, String source) {}

  /** A duration (ISO 8601) with its source. */
  public record SourcedDuration(String value, String source) {}

  /**
   * Builds the model profile.
   *
   * @throws IllegalArgumentException naming the entry when anything is missing or inconsistent
   */
  LimitProfile toProfile(LimitKey key) {
    String where = "limits for " + key;
    require(normal != null, where + ": 'normal' is missing");
    require(deadband != null, where + ": 'deadband' is missing");
    require(persistence != null, where + ": 'persistence' is missing");
    require(
        key.parameter().unit().equals(unit),
        where + ": unit '" + unit + "' is not the canonical unit '" + key.parameter().unit() + "'");
    requireSource(normal.source(), where + " normal range");
    requireSource(deadband.source(), where + " deadband");
    requireSource(persistence.source(), where + " persistence");
    Duration delay;
    try {
      delay = Duration.parse(persistence.value());
    } catch (DateTimeParseException | NullPointerException e) {
      throw new IllegalArgumentException(
          where + ": persistence '" + persistence.value() + "' is not an ISO 8601 duration", e);
    }
    List<Threshold> list =
        (thresholds == null ? List.<ThresholdEntry>of() : thresholds)
            .stream()
                .map(
                    t -> {
                      requireSource(t.source(), where + " threshold " + t.level());
                      return new Threshold(
                          Level.valueOf(t.level()), Side.valueOf(t.side()), t.value(), t.source());
                    })
                .toList();
    return new LimitProfile(
        key,
        new NormalRange(optional(normal.low()), optional(normal.high()), normal.source()),
        list,
        deadband.value(),
        deadband.source(),
        delay,
        persistence.source());
  }

  /** The written form of a model profile. */
  static LimitDocument of(LimitProfile p) {
    NormalRange n = p.normal();
    return new LimitDocument(
        p.key().parameter().code(),
        p.key().parameter().unit(),
        new Normal(
            n.low().isPresent() ? n.low().getAsDouble() : null,
            n.high().isPresent() ? n.high().getAsDouble() : null,
            n.source()),
        p.thresholds().stream()
            .map(t -> new ThresholdEntry(t.level().name(), t.side().name(), t.value(), t.source()))
            .toList(),
        new Sourced(p.deadband(), p.deadbandSource()),
        new SourcedDuration(p.persistence().toString(), p.persistenceSource()));
  }

  Parameter parameterOrThrow() {
    require(parameter != null, "limits: 'parameter' is missing");
    return Parameter.limitedOfCode(parameter);
  }

  private static OptionalDouble optional(Double d) {
    return d == null ? OptionalDouble.empty() : OptionalDouble.of(d);
  }

  private static void requireSource(String source, String what) {
    require(source != null && !source.isBlank(), what + " has no source text");
  }

  private static void require(boolean condition, String message) {
    if (!condition) {
      throw new IllegalArgumentException(message);
    }
  }
}
