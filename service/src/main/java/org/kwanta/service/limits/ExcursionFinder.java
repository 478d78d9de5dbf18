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
import org.kwanta.model.Parameter;
import org.kwanta.model.limits.Classification;
import org.kwanta.model.limits.Classifier;
import org.kwanta.model.limits.CycleLocation;
import org.kwanta.model.limits.Excursion;
import org.kwanta.model.limits.Excursions;
import org.kwanta.model.limits.Level;
import org.kwanta.model.limits.LimitKey;
import org.kwanta.model.limits.LimitTimeline;
import org.kwanta.model.limits.Sample;
import org.kwanta.service.ingest.ReadingHistory;
import org.kwanta.service.operatingstate.OperatingStates;
import org.kwanta.service.operatingstate.ServiceTime;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Service;

/**
 * Classifies stored readings against the limits and builds excursions: as reported, each value
 * against the limits in force at its time ({@link Limits#history}), or recomputed, today's limits
 * applied to every time ({@link Basis}). Derived on request from the readings (values in canonical
 * units) and the stored evaluations' instrument findings, so the answer is the same whatever order
 * the readings arrived in.
 *
 * <p>Every value is classified at its level. Its instrument is in doubt when its reading has
 * quality "bad", or when the evaluation at that time points at the parameter's own instrument or
 * the sample conditioning; the doubt is carried beside the level and never changes it.
 *
 * <p>Drum water pH fallback: for pH at a DRUM_WATER sample point, when the evaluation at that time
 * points at the pH electrode and has a pH at 25 °C calculated from the conductivities, that
 * calculated pH is classified in place of the measured one (marked as calculated, and in doubt).
 * Without a calculated pH the measured value is classified, in doubt.
 */
@Service
public class ExcursionFinder {

  /** How far before the window start readings are read, so that a running excursion is whole. */
  static final Duration LOOKBACK = Duration.ofDays(8);

  private final JdbcClient jdbc;
  private final ReadingHistory readings;
  private final Limits limits;
  private final Clock clock;
  private final OperatingStates states;

  ExcursionFinder(
      JdbcClient jdbc,
      ReadingHistory readings,
      Limits limits,
      Clock clock,
      OperatingStates states) {
    this.jdbc = jdbc;
    this.readings = readings;
    this.limits = limits;
    this.clock = clock;
    this.states = states;
  }

  /** Which limits judge the past. */
  public enum Basis {
    /** The versions in force at the time of each value: the record as it was reported. */
    AS_REPORTED("as-reported"),
    /** Today's limits applied to every time: what the past would look like under them. */
    RECOMPUTED("recomputed");

    private final String code;

    Basis(String code) {
      this.code = code;
    }

    /** The name in the API. */
    public String code() {
      return code;
    }

    /** The basis a request names ({@code null}: as reported); 400 for anything else. */
    public static Basis parse(String value) {
      if (value == null) {
        return AS_REPORTED;
      }
      for (Basis b : values()) {
        if (b.code().equalsIgnoreCase(value)) {
          return b;
        }
      }
      throw org.kwanta.service.system.ProblemException.of(
          "basis must be as-reported or recomputed");
    }
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

  /**
   * An excursion at one sample point and parameter, with its acknowledgements, oldest first.
   *
   * @param limits the limits in force at the excursion's start (on the basis asked for)
   * @param inService the part of the excursion (up to now, when running) that fell in time the
   *     block was in service ({@link ServiceTime#counted()}): excursion hours count only this
   */
  public record Found(
      Limits.Effective limits,
      Excursion excursion,
      List<Acknowledgement> acknowledgements,
      Basis basis,
      Duration inService) {

    /** The latest acknowledgement, if any. */
    public Optional<Acknowledgement> acknowledgement() {
      return acknowledgements.isEmpty()
          ? Optional.empty()
          : Optional.of(acknowledgements.get(acknowledgements.size() - 1));
    }
  }

  /** A chemist's acknowledgement, by the key that made it. */
  public record Acknowledgement(Instant at, String byKeyId, String byKeyName, String note) {}

  /** The classified series of one point and parameter over [from, to] against one profile. */
  public List<Classification> classify(Limits.Effective effective, Instant from, Instant to) {
    return classify(
        effective.point(),
        Limits.History.always(effective).timeline(),
        effective.profile().key().parameter(),
        from,
        to);
  }

  /**
   * The classified series of one point and parameter over [from, to], each value against the limits
   * the history gives for its time.
   */
  public List<Classification> classify(
      Limits.Point point, Limits.History history, Parameter parameter, Instant from, Instant to) {
    return classify(point, history.timeline(), parameter, from, to);
  }

  private List<Classification> classify(
      Limits.Point point, LimitTimeline limits, Parameter parameter, Instant from, Instant to) {
    List<ReadingHistory.Judged> rows =
        readings.judged(point.id(), parameter.code(), parameter.name(), from, to);
    List<Sample> samples = new ArrayList<>(rows.size());
    for (ReadingHistory.Judged r : rows) {
      boolean phFallback =
          limits.at(r.time()).map(p -> usesCalculatedPhFallback(p.key())).orElse(false);
      samples.add(
          sample(
              phFallback,
              r.time(),
              r.value(),
              r.inDoubt(),
              r.calculatedPh25() == null ? Double.NaN : r.calculatedPh25(),
              r.phElectrodeInDoubt()));
    }
    return new Classifier(limits).classify(samples);
  }

  /** True for drum water pH: classified on the calculated pH while the electrode is in doubt. */
  public static boolean usesCalculatedPhFallback(LimitKey key) {
    return key.location() == CycleLocation.DRUM_WATER && key.parameter() == Parameter.PH;
  }

  /**
   * The sample a judged reading is classified as: the calculated pH at 25 °C (in doubt, marked
   * calculated) in place of the measured value when the series uses the drum water pH fallback, the
   * pH electrode is in doubt and a calculated pH exists; otherwise the measured value.
   *
   * @param calculatedPh25 the evaluation's calculated pH at 25 °C, NaN when none
   */
  public static Sample sample(
      boolean phFallback,
      Instant time,
      double value,
      boolean inDoubt,
      double calculatedPh25,
      boolean phElectrodeInDoubt) {
    return phFallback && phElectrodeInDoubt && !Double.isNaN(calculatedPh25)
        ? new Sample(time, calculatedPh25, true, true)
        : new Sample(time, value, inDoubt, false);
  }

  /** Excursions overlapping [from, to], oldest first, as reported. */
  public List<Found> find(Filter filter) {
    return find(filter, Basis.AS_REPORTED);
  }

  /** Excursions overlapping [from, to], oldest first, on the basis asked for. */
  public List<Found> find(Filter filter, Basis basis) {
    Instant now = clock.instant();
    Instant to = filter.to() == null || filter.to().isAfter(now) ? now : filter.to();
    Instant from = filter.from() == null ? to.minus(Duration.ofDays(31)) : filter.from();
    List<Found> out = new ArrayList<>();
    for (Limits.Point point : limits.points(filter.plant(), filter.samplePoint())) {
      Map<String, List<Acknowledgement>> acks = acknowledgements(point.id());
      ServiceTime service =
          states.serviceTime(point.plant(), point.block(), from.minus(LOOKBACK), to);
      for (Map.Entry<Parameter, Limits.History> entry : histories(point, basis, now).entrySet()) {
        Parameter parameter = entry.getKey();
        if (filter.parameter() != null && filter.parameter() != parameter) {
          continue;
        }
        Limits.History history = entry.getValue();
        if (!history.hasLimits(from.minus(LOOKBACK), to)) {
          continue;
        }
        LimitTimeline timeline = history.timeline();
        List<Classification> classified =
            classify(point, timeline, parameter, from.minus(LOOKBACK), to);
        for (Excursion e : Excursions.of(timeline, classified, to)) {
          Instant end = e.end().orElse(to);
          boolean overlaps = !end.isBefore(from) && !e.start().isAfter(to);
          boolean level =
              filter.minLevel() == null
                  || e.highestLevel().severity() >= filter.minLevel().severity();
          boolean open = filter.open() == null || filter.open() == e.open();
          Optional<Limits.Effective> in = history.at(e.start());
          if (overlaps && level && open && in.isPresent()) {
            out.add(
                new Found(
                    in.get(),
                    e,
                    acks.getOrDefault(parameter.code() + "|" + e.start(), List.of()),
                    basis,
                    service.inService(e.start(), end)));
          }
        }
      }
    }
    out.sort(Comparator.comparing((Found f) -> f.excursion().start()));
    return out;
  }

  /** Per parameter, the limits over time on a basis: as reported, or today's at every time. */
  Map<Parameter, Limits.History> histories(Limits.Point point, Basis basis, Instant now) {
    Map<Parameter, Limits.History> all = limits.histories(point);
    if (basis == Basis.AS_REPORTED) {
      return all;
    }
    Map<Parameter, Limits.History> out = new java.util.EnumMap<>(Parameter.class);
    all.forEach((p, h) -> h.at(now).ifPresent(e -> out.put(p, Limits.History.always(e))));
    return out;
  }

  /**
   * Per parameter, the limits of one point over time on a basis (parameters without limits left
   * out).
   */
  public Map<Parameter, Limits.History> histories(Limits.Point point, Basis basis) {
    return histories(point, basis, clock.instant());
  }

  /** The limits of one point and parameter over time on a basis, if it has any. */
  public Optional<Limits.History> history(Limits.Point point, Parameter parameter, Basis basis) {
    return Optional.ofNullable(histories(point, basis, clock.instant()).get(parameter));
  }

  private Map<String, List<Acknowledgement>> acknowledgements(String samplePoint) {
    Map<String, List<Acknowledgement>> out = new java.util.HashMap<>();
    jdbc.sql(
            """
            SELECT parameter, excursion_start, acknowledged_at, key_id, key_name, note
            FROM excursion_acknowledgement WHERE sample_point_id = ? ORDER BY id""")
        .param(samplePoint)
        .query(
            (rs, i) ->
                Map.entry(
                    rs.getString(1) + "|" + rs.getTimestamp(2).toInstant(),
                    new Acknowledgement(
                        rs.getTimestamp(3).toInstant(),
                        rs.getString(4),
                        rs.getString(5),
                        rs.getString(6))))
        .list()
        .forEach(e -> out.computeIfAbsent(e.getKey(), k -> new ArrayList<>()).add(e.getValue()));
    return out;
  }

  /** Whether an excursion (as reported) of this point and parameter starts at {@code start}. */
  public boolean exists(Limits.Point point, Parameter parameter, Instant start) {
    Optional<Limits.History> history = history(point, parameter, Basis.AS_REPORTED);
    if (history.isEmpty()) {
      return false;
    }
    Instant now = clock.instant();
    LimitTimeline timeline = history.get().timeline();
    List<Classification> classified =
        classify(point, timeline, parameter, start.minus(LOOKBACK), now);
    return Excursions.of(timeline, classified, now).stream().anyMatch(e -> e.start().equals(start));
  }

  /**
   * Appends an acknowledgement of the excursion (as reported) that starts at {@code start}; earlier
   * acknowledgements stay.
   *
   * @return the acknowledgement, empty when no such excursion exists
   */
  public Optional<Acknowledgement> acknowledge(
      Limits.Point point,
      Parameter parameter,
      Instant start,
      String keyId,
      String keyName,
      String note) {
    if (!exists(point, parameter, start)) {
      return Optional.empty();
    }
    return Optional.of(
        jdbc.sql(
                """
                INSERT INTO excursion_acknowledgement
                    (sample_point_id, parameter, excursion_start, key_id, key_name, note)
                VALUES (?, ?, ?, ?, ?, ?)
                RETURNING acknowledged_at, key_id, key_name, note""")
            .params(point.id(), parameter.code(), Timestamp.from(start), keyId, keyName, note)
            .query(
                (rs, i) ->
                    new Acknowledgement(
                        rs.getTimestamp(1).toInstant(),
                        rs.getString(2),
                        rs.getString(3),
                        rs.getString(4)))
            .single());
  }
}
