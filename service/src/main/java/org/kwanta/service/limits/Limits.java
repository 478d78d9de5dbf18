package org.kwanta.service.limits;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.kwanta.model.limits.CycleLocation;
import org.kwanta.model.limits.LimitKey;
import org.kwanta.model.limits.LimitProfile;
import org.kwanta.model.limits.Parameter;
import org.kwanta.model.limits.TreatmentRegime;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Repository;
import tools.jackson.databind.json.JsonMapper;

/**
 * The limits in force per sample point and parameter: the point's own override when there is one,
 * otherwise the shipped example default for its treatment regime and place in the cycle.
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

  /** A sample point's registry facts that limits and metrics need. */
  public record Point(
      String id, String plant, String unit, String cycleLocation, String treatmentRegime) {

    Optional<LimitKey> key(Parameter parameter) {
      try {
        return Optional.of(
            new LimitKey(
                TreatmentRegime.valueOf(treatmentRegime),
                CycleLocation.valueOf(cycleLocation),
                parameter));
      } catch (IllegalArgumentException e) {
        return Optional.empty();
      }
    }
  }

  /** A profile in force and where it comes from. */
  public record Effective(Point point, LimitProfile profile, Origin origin) {}

  private final JdbcClient jdbc;
  private final LimitCatalog defaults;
  private final JsonMapper json;

  Limits(JdbcClient jdbc, LimitCatalog defaults, JsonMapper json) {
    this.jdbc = jdbc;
    this.defaults = defaults;
    this.json = json;
  }

  public LimitCatalog defaults() {
    return defaults;
  }

  /** Sample points, optionally of one plant and/or one id. */
  public List<Point> points(String plant, String samplePoint) {
    return jdbc.sql(
            """
            SELECT id, plant_id, unit_id, cycle_location, treatment_regime FROM sample_point
            WHERE (?::text IS NULL OR plant_id = ?) AND (?::text IS NULL OR id = ?)
            ORDER BY id""")
        .params(plant, plant, samplePoint, samplePoint)
        .query(
            (rs, i) ->
                new Point(
                    rs.getString(1),
                    rs.getString(2),
                    rs.getString(3),
                    rs.getString(4),
                    rs.getString(5)))
        .list();
  }

  /** Every profile in force at a point, override first, then default. */
  public List<Effective> inForce(Point point) {
    List<Effective> out = new ArrayList<>();
    for (Parameter parameter : Parameter.values()) {
      find(point, parameter).ifPresent(out::add);
    }
    return out;
  }

  /** The profile in force at a point for one parameter, if any. */
  public Optional<Effective> find(Point point, Parameter parameter) {
    Optional<LimitKey> key = point.key(parameter);
    Optional<String> override =
        jdbc.sql(
                "SELECT limits::text FROM limit_override WHERE sample_point_id = ? AND parameter = ?")
            .params(point.id(), parameter.code())
            .query(String.class)
            .optional();
    if (override.isPresent()) {
      LimitKey k =
          key.orElse(new LimitKey(TreatmentRegime.MAKE_UP, CycleLocation.MAKE_UP, parameter));
      LimitDocument doc = json.readValue(override.get(), LimitDocument.class);
      return Optional.of(new Effective(point, doc.toProfile(k), Origin.OVERRIDE));
    }
    return key.flatMap(defaults::find).map(p -> new Effective(point, p, Origin.DEFAULT));
  }

  /**
   * Sets a point's own limits for a parameter (replacing an earlier override).
   *
   * @throws IllegalArgumentException when the document is incomplete or inconsistent
   */
  public LimitProfile override(Point point, Parameter parameter, LimitDocument doc, String by) {
    LimitKey key =
        point
            .key(parameter)
            .orElse(new LimitKey(TreatmentRegime.MAKE_UP, CycleLocation.MAKE_UP, parameter));
    LimitProfile profile = doc.toProfile(key);
    jdbc.sql(
            """
            INSERT INTO limit_override (sample_point_id, parameter, limits, updated_by)
            VALUES (?, ?, ?::jsonb, ?)
            ON CONFLICT (sample_point_id, parameter)
            DO UPDATE SET limits = EXCLUDED.limits, updated_by = EXCLUDED.updated_by,
                          updated_at = now()""")
        .params(
            point.id(), parameter.code(), json.writeValueAsString(LimitDocument.of(profile)), by)
        .update();
    return profile;
  }

  /** Removes a point's override; true when there was one. */
  public boolean removeOverride(Point point, Parameter parameter) {
    return jdbc.sql("DELETE FROM limit_override WHERE sample_point_id = ? AND parameter = ?")
            .params(point.id(), parameter.code())
            .update()
        > 0;
  }
}
