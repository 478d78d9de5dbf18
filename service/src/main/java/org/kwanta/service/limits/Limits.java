package org.kwanta.service.limits;

import java.sql.Timestamp;
import java.time.Clock;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.TreeSet;
import org.kwanta.model.Parameter;
import org.kwanta.model.diagnosis.CoolingWater;
import org.kwanta.model.limits.CycleLocation;
import org.kwanta.model.limits.LimitKey;
import org.kwanta.model.limits.LimitProfile;
import org.kwanta.model.limits.LimitTimeline;
import org.kwanta.model.limits.PlantType;
import org.kwanta.model.limits.TreatmentRegime;
import org.kwanta.service.audit.AuditLog;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Repository;
import org.springframework.transaction.annotation.Transactional;
import tools.jackson.databind.json.JsonMapper;

/**
 * The limits in force per sample point and parameter, at any time: the point's own limits when a
 * version of them is in force then, otherwise the shipped example default (of the defaults version
 * in force then) for the treatment regime and place in the cycle the point had then.
 *
 * <p>Nothing is overwritten: the plant's own limits are versions with the time they take effect
 * from (table {@code limit_version}), the point's configuration has versions ({@code
 * sample_point_version}), and so do the defaults ({@link DefaultLimitVersions}). The limits in
 * force at a time are the newest version of each that took effect at or before it (a later-recorded
 * version wins a tie); the first version of a point's configuration and of the defaults also covers
 * every earlier time.
 */
@Repository
public class Limits {

  /** Where a profile comes from. */
  public enum Origin {
    /** Set for this sample point by the plant. */
    OVERRIDE,
    /** The shipped example default (not the plant's limits). */
    DEFAULT
  }

  /**
   * A sample point's registry facts that limits and metrics need.
   *
   * @param operatingTemperatureCel the configured operating temperature, °C (null: none)
   * @param operatingPressureMPa the configured operating pressure, MPa (null: none)
   * @param coolingWater the plant's declared cooling water (null: none declared)
   */
  public record Point(
      String id,
      String plant,
      String block,
      String cycleLocation,
      String treatmentRegime,
      PlantType plantType,
      Double operatingTemperatureCel,
      Double operatingPressureMPa,
      CoolingWater coolingWater) {

    /** A point of a plant that declares no cooling water. */
    public Point(
        String id,
        String plant,
        String unit,
        String cycleLocation,
        String treatmentRegime,
        PlantType plantType,
        Double operatingTemperatureCel,
        Double operatingPressureMPa) {
      this(
          id,
          plant,
          unit,
          cycleLocation,
          treatmentRegime,
          plantType,
          operatingTemperatureCel,
          operatingPressureMPa,
          null);
    }

    /** A point of a plant that declares no plant type (a conventional drum plant). */
    public Point(
        String id, String plant, String block, String cycleLocation, String treatmentRegime) {
      this(id, plant, block, cycleLocation, treatmentRegime, PlantType.CONVENTIONAL_DRUM);
    }

    /** A point without operating conditions. */
    public Point(
        String id,
        String plant,
        String block,
        String cycleLocation,
        String treatmentRegime,
        PlantType plantType) {
      this(id, plant, block, cycleLocation, treatmentRegime, plantType, null, null);
    }

    /**
     * The drum pressure that pressure-banded defaults are matched against, MPa: the configured
     * operating pressure, or for a drum-water point without one the IF97 saturation pressure at its
     * operating temperature (a drum is at saturation); null when neither is known.
     */
    static Double drumPressureMPa(String location, Double temperatureCel, Double pressureMPa) {
      if (pressureMPa != null) {
        return pressureMPa;
      }
      if (temperatureCel == null || !"DRUM_WATER".equals(location)) {
        return null;
      }
      try {
        return org.kwanta.model.water.Water.saturationPressurePa(temperatureCel + 273.15) / 1e6;
      } catch (IllegalArgumentException outsideIf97) {
        return null;
      }
    }

    Optional<LimitKey> key(Parameter parameter) {
      return key(treatmentRegime, cycleLocation, parameter);
    }

    static Optional<LimitKey> key(String regime, String location, Parameter parameter) {
      // the trade form (AVT(O)) and the constant's name (AVT_O) both find the regime's limits
      Optional<TreatmentRegime> r = TreatmentRegime.ofCode(regime);
      try {
        return r.map(t -> new LimitKey(t, CycleLocation.valueOf(location), parameter));
      } catch (IllegalArgumentException | NullPointerException e) {
        return Optional.empty();
      }
    }

    /** The key used for a plant's own limits where the regime gives none (make-up water). */
    LimitKey keyOrMakeUp(String regime, String location, Parameter parameter) {
      return key(regime, location, parameter)
          .orElse(new LimitKey(TreatmentRegime.MAKE_UP, CycleLocation.MAKE_UP, parameter));
    }
  }

  private final JdbcClient jdbc;
  private final LimitCatalog defaults;
  private final DefaultLimitVersions defaultVersions;
  private final JsonMapper json;
  private final Clock clock;
  private final AuditLog audit;

  Limits(
      JdbcClient jdbc,
      LimitCatalog defaults,
      DefaultLimitVersions defaultVersions,
      JsonMapper json,
      Clock clock,
      AuditLog audit) {
    this.jdbc = jdbc;
    this.defaults = defaults;
    this.defaultVersions = defaultVersions;
    this.json = json;
    this.clock = clock;
    this.audit = audit;
  }

  /** The defaults in use now (the configured defaults file). */
  public LimitCatalog defaults() {
    return defaults;
  }

  /** Sample points, optionally of one plant and/or one id. */
  public List<Point> points(String plant, String samplePoint) {
    return jdbc.sql(
            """
            SELECT s.id, s.plant_id, s.block_id, s.cycle_location, s.treatment_regime, p.plant_type,
                   s.operating_temperature_cel, s.operating_pressure_mpa, p.cooling_water
            FROM sample_point s JOIN plant p ON p.id = s.plant_id
            WHERE (?::text IS NULL OR s.plant_id = ?) AND (?::text IS NULL OR s.id = ?)
            ORDER BY s.id""")
        .params(plant, plant, samplePoint, samplePoint)
        .query(
            (rs, i) ->
                new Point(
                    rs.getString(1),
                    rs.getString(2),
                    rs.getString(3),
                    rs.getString(4),
                    rs.getString(5),
                    PlantType.ofNullable(rs.getString(6)),
                    rs.getObject(7, Double.class),
                    rs.getObject(8, Double.class),
                    // Stored as validated by the plant declaration (as the diagnosis reads it).
                    rs.getString(9) == null ? null : CoolingWater.valueOf(rs.getString(9))))
        .list();
  }

  /**
   * A profile in force and where it comes from.
   *
   * @param version the version of the plant's own limits ({@code OVERRIDE}) or of the shipped
   *     defaults ({@code DEFAULT})
   * @param effectiveFrom from when this profile is in force; {@code null} when always (the first
   *     version)
   */
  public record Effective(
      Point point, LimitProfile profile, Origin origin, int version, Instant effectiveFrom) {

    boolean sameAs(Effective o) {
      return o != null && origin == o.origin && version == o.version && profile.equals(o.profile);
    }
  }

  /**
   * The limits of one point and parameter over time.
   *
   * @param periods consecutive periods, oldest first; the first from {@link Instant#MIN}
   */
  public record History(List<Period> periods) {

    /** A period: from its start until the next period's, these limits (or none). */
    public record Period(Instant from, Optional<Effective> limits) {}

    /** The limits in force at a time. */
    public Optional<Effective> at(Instant t) {
      Optional<Effective> found = Optional.empty();
      for (Period p : periods) {
        if (p.from().isAfter(t)) {
          break;
        }
        found = p.limits();
      }
      return found;
    }

    /** Whether some period has limits. */
    public boolean hasLimits() {
      return periods.stream().anyMatch(p -> p.limits().isPresent());
    }

    /** Whether some period starting before {@code to} and ending after {@code from} has limits. */
    public boolean hasLimits(Instant from, Instant to) {
      for (int i = 0; i < periods.size(); i++) {
        Instant start = periods.get(i).from();
        Instant end = i + 1 < periods.size() ? periods.get(i + 1).from() : Instant.MAX;
        if (periods.get(i).limits().isPresent() && start.isBefore(to) && end.isAfter(from)) {
          return true;
        }
      }
      return false;
    }

    /** The same periods for the classifier. */
    public LimitTimeline timeline() {
      return LimitTimeline.of(
          periods.stream()
              .map(p -> new LimitTimeline.Period(p.from(), p.limits().map(Effective::profile)))
              .toList());
    }

    /** One set of limits applied at every time (today's limits applied to the past). */
    public static History always(Effective e) {
      return new History(List.of(new Period(Instant.MIN, Optional.of(e))));
    }
  }

  /** One stored version of a plant's own limits ({@code limits} empty: withdrawn). */
  public record OverrideVersion(
      String parameter,
      int version,
      Instant effectiveFrom,
      Optional<LimitDocument> limits,
      String reason,
      Instant recordedAt,
      String recordedBy) {}

  private record RegimeVersion(
      Instant from, String regime, String location, Double temperatureCel, Double pressureMPa) {}

  /**
   * A fingerprint of everything the limits in force at a plant's points depend on at time {@code
   * now}: the points' rows, their own limit versions and configuration versions (those in effect by
   * {@code now} counted apart, so a version taking effect later changes it when it does) and the
   * activations of the shipped defaults. Equal fingerprints mean {@link #inForce} and {@link
   * #histories} answer the same; a cache of answers built on the limits (the board's levels) is
   * current while it stays the same.
   */
  public String stamp(String plantId, Instant now) {
    java.sql.Timestamp t = java.sql.Timestamp.from(now);
    return jdbc.sql(
            """
            SELECT concat_ws('|',
              (SELECT md5(string_agg(s::text, ',' ORDER BY s.id)) || ':' || max(p.plant_type)
                      || ':' || coalesce(max(p.cooling_water), '')
                 FROM sample_point s JOIN plant p ON p.id = s.plant_id WHERE s.plant_id = ?),
              (SELECT count(*) || ':' || count(*) FILTER (WHERE l.effective_from <= ?) || ':'
                      || coalesce(max(l.recorded_at)::text, '')
                 FROM limit_version l JOIN sample_point s ON s.id = l.sample_point_id
                 WHERE s.plant_id = ?),
              (SELECT count(*) || ':' || count(*) FILTER (WHERE v.valid_from <= ?) || ':'
                      || coalesce(sum(v.version), 0)
                 FROM sample_point_version v JOIN sample_point s ON s.id = v.sample_point_id
                 WHERE s.plant_id = ?),
              (SELECT count(*) || ':' || count(*) FILTER (WHERE a.effective_from <= ?)
                 FROM limit_defaults_activation a))""")
        .params(plantId, t, plantId, t, plantId, t)
        .query(String.class)
        .single();
  }

  /** Every profile in force at a point now, one per parameter that has limits. */
  public List<Effective> inForce(Point point) {
    Instant now = clock.instant();
    List<Effective> out = new ArrayList<>();
    for (History h : histories(point).values()) {
      h.at(now).ifPresent(out::add);
    }
    return out;
  }

  /** The profile in force at a point for one parameter now, if any. */
  public Optional<Effective> find(Point point, Parameter parameter) {
    return history(point, parameter).at(clock.instant());
  }

  /** The limits of one point and parameter over time. */
  public History history(Point point, Parameter parameter) {
    return history(
        point,
        parameter,
        overrideVersions(point.id()).stream()
            .filter(v -> v.parameter().equals(parameter.code()))
            .toList(),
        regimeVersions(point),
        defaultVersions.activations());
  }

  /** The limits of every parameter of a point over time, in parameter order. */
  public java.util.Map<Parameter, History> histories(Point point) {
    List<OverrideVersion> overrides = overrideVersions(point.id());
    List<RegimeVersion> regimes = regimeVersions(point);
    List<DefaultLimitVersions.Activation> activations = defaultVersions.activations();
    java.util.Map<Parameter, History> out = new java.util.EnumMap<>(Parameter.class);
    for (Parameter parameter : Parameter.limited()) {
      History h =
          history(
              point,
              parameter,
              overrides.stream().filter(v -> v.parameter().equals(parameter.code())).toList(),
              regimes,
              activations);
      if (h.hasLimits()) {
        out.put(parameter, h);
      }
    }
    return out;
  }

  private History history(
      Point point,
      Parameter parameter,
      List<OverrideVersion> overrides,
      List<RegimeVersion> regimes,
      List<DefaultLimitVersions.Activation> activations) {
    TreeSet<Instant> starts = new TreeSet<>();
    starts.add(Instant.MIN);
    overrides.forEach(v -> starts.add(v.effectiveFrom()));
    regimes.stream().skip(1).forEach(r -> starts.add(r.from()));
    activations.stream().skip(1).forEach(a -> starts.add(a.from()));
    List<History.Period> periods = new ArrayList<>();
    Effective previous = null;
    boolean previousEmpty = false;
    for (Instant s : starts) {
      RegimeVersion regime = latest(regimes, RegimeVersion::from, s);
      String regimeName = regime == null ? point.treatmentRegime() : regime.regime();
      String location = regime == null ? point.cycleLocation() : regime.location();
      Double drumPressure =
          regime == null
              ? Point.drumPressureMPa(
                  location, point.operatingTemperatureCel(), point.operatingPressureMPa())
              : Point.drumPressureMPa(location, regime.temperatureCel(), regime.pressureMPa());
      OverrideVersion override = latestOverride(overrides, s);
      Instant from = s.equals(Instant.MIN) ? null : s;
      Optional<Effective> e;
      if (override != null && override.limits().isPresent()) {
        LimitKey key = point.keyOrMakeUp(regimeName, location, parameter);
        e =
            Optional.of(
                new Effective(
                    point,
                    override.limits().get().toProfile(key),
                    Origin.OVERRIDE,
                    override.version(),
                    from));
      } else {
        DefaultLimitVersions.Activation a =
            latest(activations, DefaultLimitVersions.Activation::from, s);
        int version = a == null ? defaults.version() : a.version();
        e =
            Point.key(regimeName, location, parameter)
                .flatMap(
                    k ->
                        defaultVersions
                            .catalog(version)
                            .find(k, point.plantType(), drumPressure, point.coolingWater()))
                .map(p -> new Effective(point, p, Origin.DEFAULT, version, from));
      }
      if (e.isPresent() ? e.get().sameAs(previous) : previousEmpty) {
        continue;
      }
      periods.add(new History.Period(s, e));
      previous = e.orElse(null);
      previousEmpty = e.isEmpty();
    }
    return new History(List.copyOf(periods));
  }

  /** The newest entry starting at or before {@code t}; the first one also covers earlier times. */
  private static <T> T latest(
      List<T> ordered, java.util.function.Function<T, Instant> from, Instant t) {
    T found = ordered.isEmpty() ? null : ordered.get(0);
    for (T x : ordered) {
      if (!from.apply(x).isAfter(t)) {
        found = x;
      }
    }
    return found;
  }

  /** The override version in force at t (none before the first), a later-recorded one on a tie. */
  private static OverrideVersion latestOverride(List<OverrideVersion> ordered, Instant t) {
    OverrideVersion found = null;
    for (OverrideVersion v : ordered) {
      if (!v.effectiveFrom().isAfter(t)) {
        found = v;
      }
    }
    return found;
  }

  /** A point's own limit versions, every parameter, by effective time then version. */
  public List<OverrideVersion> overrideVersions(String samplePointId) {
    return jdbc.sql(
            """
            SELECT parameter, version, effective_from, limits::text, reason, recorded_at, recorded_by
            FROM limit_version WHERE sample_point_id = ? ORDER BY effective_from, version""")
        .param(samplePointId)
        .query(
            (rs, i) ->
                new OverrideVersion(
                    rs.getString(1),
                    rs.getInt(2),
                    rs.getTimestamp(3).toInstant(),
                    Optional.ofNullable(rs.getString(4))
                        .map(text -> json.readValue(text, LimitDocument.class)),
                    rs.getString(5),
                    rs.getTimestamp(6).toInstant(),
                    rs.getString(7)))
        .list();
  }

  private List<RegimeVersion> regimeVersions(Point point) {
    return jdbc.sql(
            """
            SELECT valid_from, config->>'treatmentRegime', config->>'cycleLocation',
                   (config->>'operatingTemperatureCel')::double precision,
                   (config->>'operatingPressureMPa')::double precision
            FROM sample_point_version WHERE sample_point_id = ? ORDER BY version""")
        .param(point.id())
        .query(
            (rs, i) ->
                new RegimeVersion(
                    rs.getTimestamp(1).toInstant(),
                    rs.getString(2),
                    rs.getString(3),
                    rs.getObject(4, Double.class),
                    rs.getObject(5, Double.class)))
        .list();
  }

  /**
   * Adds a version of a point's own limits for a parameter, in force from {@code effectiveFrom}.
   * Earlier versions stay, and stay in force before it.
   *
   * @throws IllegalArgumentException when the document is incomplete or inconsistent
   */
  @Transactional
  public Effective override(
      Point point,
      Parameter parameter,
      LimitDocument doc,
      Instant effectiveFrom,
      String reason,
      String by) {
    LimitKey key =
        point
            .key(parameter)
            .orElse(new LimitKey(TreatmentRegime.MAKE_UP, CycleLocation.MAKE_UP, parameter));
    LimitProfile profile = doc.toProfile(key);
    lock(point, parameter);
    Optional<Effective> before = history(point, parameter).at(effectiveFrom);
    int version =
        append(
            point,
            parameter,
            json.writeValueAsString(LimitDocument.of(profile)),
            effectiveFrom,
            reason,
            by);
    Effective after = new Effective(point, profile, Origin.OVERRIDE, version, effectiveFrom);
    audit.record(
        "limits.set",
        "limits",
        point.id() + "/" + parameter.code(),
        before.map(Limits::auditView).orElse(null),
        auditView(after, reason));
    return after;
  }

  /** The limits as the audit log shows them. */
  static java.util.Map<String, Object> auditView(Effective e) {
    return auditView(e, null);
  }

  private static java.util.Map<String, Object> auditView(Effective e, String reason) {
    java.util.Map<String, Object> m = new java.util.LinkedHashMap<>();
    m.put("origin", e.origin().name());
    m.put("version", e.version());
    m.put("effectiveFrom", e.effectiveFrom() == null ? null : e.effectiveFrom().toString());
    if (reason != null) {
      m.put("reason", reason);
    }
    m.put("limits", LimitDocument.of(e.profile()));
    return m;
  }

  /**
   * Withdraws a point's own limits from {@code effectiveFrom} on (the default applies again); the
   * versions stay.
   *
   * @return the new version, empty when no own limits were in force then
   */
  @Transactional
  public Optional<Integer> removeOverride(
      Point point, Parameter parameter, Instant effectiveFrom, String reason, String by) {
    lock(point, parameter);
    Optional<Effective> inForce = history(point, parameter).at(effectiveFrom);
    if (inForce.isEmpty() || inForce.get().origin() != Origin.OVERRIDE) {
      return Optional.empty();
    }
    int version = append(point, parameter, null, effectiveFrom, reason, by);
    Optional<Effective> after = history(point, parameter).at(effectiveFrom);
    java.util.Map<String, Object> withdrawn = new java.util.LinkedHashMap<>();
    withdrawn.put("withdrawnVersion", version);
    withdrawn.put("effectiveFrom", effectiveFrom.toString());
    withdrawn.put("reason", reason);
    withdrawn.put("inForce", after.map(Limits::auditView).orElse(null));
    audit.record(
        "limits.withdraw",
        "limits",
        point.id() + "/" + parameter.code(),
        auditView(inForce.get()),
        withdrawn);
    return Optional.of(version);
  }

  private int append(
      Point point,
      Parameter parameter,
      String limitsJson,
      Instant effectiveFrom,
      String reason,
      String by) {
    lock(point, parameter);
    return jdbc.sql(
            """
            INSERT INTO limit_version (sample_point_id, parameter, version, effective_from, limits,
                                       reason, recorded_by)
            SELECT ?, ?, coalesce(max(version), 0) + 1, ?, ?::jsonb, ?, ?
            FROM limit_version WHERE sample_point_id = ? AND parameter = ?
            RETURNING version""")
        .params(
            point.id(),
            parameter.code(),
            Timestamp.from(Objects.requireNonNull(effectiveFrom)),
            limitsJson,
            reason,
            by,
            point.id(),
            parameter.code())
        .query(Integer.class)
        .single();
  }

  private void lock(Point point, Parameter parameter) {
    jdbc.sql("SELECT pg_advisory_xact_lock(hashtext('kwanta.limit_version.' || ? || '.' || ?))")
        .params(point.id(), parameter.code())
        .query()
        .singleRow();
  }
}
