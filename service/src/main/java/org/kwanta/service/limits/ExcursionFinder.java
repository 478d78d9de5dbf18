package org.kwanta.service.limits;

import java.sql.Timestamp;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.stream.Collectors;
import org.kwanta.model.limits.Classification;
import org.kwanta.model.limits.Classifier;
import org.kwanta.model.limits.CycleLocation;
import org.kwanta.model.limits.Excursion;
import org.kwanta.model.limits.Excursions;
import org.kwanta.model.limits.Level;
import org.kwanta.model.limits.LimitKey;
import org.kwanta.model.limits.Parameter;
import org.kwanta.model.limits.Sample;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Service;

/**
 * Classifies stored readings against the limits in force and builds excursions. Derived on request
 * from the readings (values in canonical units) and the stored evaluations' instrument findings, so
 * the answer is the same whatever order the readings arrived in.
 *
 * <p>Every value is classified at its level. Its instrument is in doubt when its reading has
 * quality "bad", or when the evaluation at that time suspects the parameter's own instrument or the
 * sample conditioning; the doubt is carried beside the level and never changes it.
 *
 * <p>Drum water pH fallback: for pH at a DRUM_WATER sample point, when the evaluation at that time
 * suspects the pH electrode and has a pH at 25 °C calculated from the conductivities, that
 * calculated pH is classified in place of the measured one (marked as calculated, and in doubt).
 * Without a calculated pH the measured value is classified, in doubt.
 */
@Service
public class ExcursionFinder {

  /** How far before the window start readings are read, so that a running excursion is whole. */
  static final Duration LOOKBACK = Duration.ofDays(8);

  private final JdbcClient jdbc;
  private final Limits limits;
  private final Clock clock;

  ExcursionFinder(JdbcClient jdbc, Limits limits, Clock clock) {
    this.jdbc = jdbc;
    this.limits = limits;
    this.clock = clock;
  }

  /** Which excursions to list. Null fields do not filter. */
  public record Filter(
      String plant,
      String samplePoint,
      Parameter parameter,
      Instant from,
      Instant to,
      Level minLevel,
      Boolean open) {}

  /** An excursion at one sample point and parameter, with its acknowledgement if any. */
  public record Found(
      Limits.Effective limits, Excursion excursion, Optional<Acknowledgement> acknowledgement) {}

  /** A chemist's acknowledgement. */
  public record Acknowledgement(Instant at, String by, String note) {}

  /**
   * A point's readings of one parameter over [from, to] with the evaluation at each reading's time.
   * Both sides carry the time range, so PostgreSQL prunes the daily partitions of both tables (a
   * bound on the readings alone left every evaluation partition in the plan). Parameters: the
   * parameter's instrument name, from, to, sample point, parameter code, from, to.
   */
  static final String CLASSIFY =
      """
      SELECT r.time, r.value,
             r.quality = 2
               OR coalesce(e.suspects && ARRAY[?::text, 'SAMPLE_CONDITIONING'], false),
             e.calculated_ph_25,
             coalesce('PH' = ANY(e.suspects), false)
      FROM reading r
      LEFT JOIN evaluation e ON e.sample_point_id = r.sample_point_id AND e.time = r.time
                            AND e.time >= ? AND e.time <= ?
      WHERE r.sample_point_id = ? AND r.parameter = ? AND r.time >= ? AND r.time <= ?
      ORDER BY r.time""";

  /** The classified series of one point and parameter over [from, to]. */
  public List<Classification> classify(Limits.Effective effective, Instant from, Instant to) {
    Parameter parameter = effective.profile().key().parameter();
    boolean phFallback = usesCalculatedPhFallback(effective.profile().key());
    List<Sample> samples =
        jdbc.sql(CLASSIFY)
            .params(
                parameter.name(),
                Timestamp.from(from),
                Timestamp.from(to),
                effective.point().id(),
                parameter.code(),
                Timestamp.from(from),
                Timestamp.from(to))
            .query(
                (rs, i) -> {
                  Instant time = rs.getTimestamp(1).toInstant();
                  double measured = rs.getDouble(2);
                  boolean inDoubt = rs.getBoolean(3);
                  double calculated = rs.getDouble(4);
                  boolean hasCalculated = !rs.wasNull() && Double.isFinite(calculated);
                  if (phFallback && rs.getBoolean(5) && hasCalculated) {
                    return new Sample(time, calculated, true, true);
                  }
                  return new Sample(time, measured, inDoubt, false);
                })
            .list();
    return new Classifier(effective.profile()).classify(samples);
  }

  /** True for drum water pH: classified on the calculated pH while the electrode is in doubt. */
  static boolean usesCalculatedPhFallback(LimitKey key) {
    return key.location() == CycleLocation.DRUM_WATER && key.parameter() == Parameter.PH;
  }

  /** Excursions overlapping [from, to], oldest first. */
  public List<Found> find(Filter filter) {
    Instant now = clock.instant();
    Instant to = filter.to() == null || filter.to().isAfter(now) ? now : filter.to();
    Instant from = filter.from() == null ? to.minus(Duration.ofDays(31)) : filter.from();
    List<Found> out = new ArrayList<>();
    for (Limits.Point point : limits.points(filter.plant(), filter.samplePoint())) {
      Map<String, Acknowledgement> acks = acknowledgements(point.id());
      for (Limits.Effective effective : limits.inForce(point)) {
        Parameter parameter = effective.profile().key().parameter();
        if (filter.parameter() != null && filter.parameter() != parameter) {
          continue;
        }
        List<Classification> classified = classify(effective, from.minus(LOOKBACK), to);
        for (Excursion e : Excursions.of(effective.profile(), classified, to)) {
          Instant end = e.end().orElse(to);
          boolean overlaps = !end.isBefore(from) && !e.start().isAfter(to);
          boolean level =
              filter.minLevel() == null
                  || e.highestLevel().severity() >= filter.minLevel().severity();
          boolean open = filter.open() == null || filter.open() == e.open();
          if (overlaps && level && open) {
            out.add(
                new Found(
                    effective,
                    e,
                    Optional.ofNullable(acks.get(parameter.code() + "|" + e.start()))));
          }
        }
      }
    }
    out.sort(Comparator.comparing((Found f) -> f.excursion().start()));
    return out;
  }

  private Map<String, Acknowledgement> acknowledgements(String samplePoint) {
    return jdbc
        .sql(
            """
            SELECT parameter, excursion_start, acknowledged_at, acknowledged_by, note
            FROM excursion_acknowledgement WHERE sample_point_id = ?""")
        .param(samplePoint)
        .query(
            (rs, i) ->
                Map.entry(
                    rs.getString(1) + "|" + rs.getTimestamp(2).toInstant(),
                    new Acknowledgement(
                        rs.getTimestamp(3).toInstant(), rs.getString(4), rs.getString(5))))
        .list()
        .stream()
        .collect(Collectors.toMap(Map.Entry::getKey, Map.Entry::getValue));
  }

  /**
   * Records an acknowledgement of the excursion that starts at {@code start}.
   *
   * @return false when no such excursion exists
   */
  public boolean acknowledge(
      Limits.Point point, Parameter parameter, Instant start, String by, String note) {
    Optional<Limits.Effective> effective = limits.find(point, parameter);
    if (effective.isEmpty()) {
      return false;
    }
    Instant now = clock.instant();
    List<Classification> classified = classify(effective.get(), start.minus(LOOKBACK), now);
    boolean exists =
        Excursions.of(effective.get().profile(), classified, now).stream()
            .anyMatch(e -> e.start().equals(start));
    if (!exists) {
      return false;
    }
    jdbc.sql(
            """
            INSERT INTO excursion_acknowledgement
                (sample_point_id, parameter, excursion_start, acknowledged_by, note)
            VALUES (?, ?, ?, ?, ?)
            ON CONFLICT (sample_point_id, parameter, excursion_start) DO UPDATE
            SET acknowledged_by = EXCLUDED.acknowledged_by, note = EXCLUDED.note,
                acknowledged_at = now()""")
        .params(point.id(), parameter.code(), Timestamp.from(start), by, note)
        .update();
    return true;
  }
}
