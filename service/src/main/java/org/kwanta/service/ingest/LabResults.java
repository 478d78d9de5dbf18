package org.kwanta.service.ingest;

import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Timestamp;
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.kwanta.model.Parameter;
import org.kwanta.model.water.Water;
import org.kwanta.service.audit.Actor;
import org.kwanta.service.audit.AuditLog;
import org.springframework.context.ApplicationEventPublisher;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Repository;
import org.springframework.transaction.annotation.Transactional;

/**
 * Grab and lab results (table {@code lab_result}): stored apart from the online readings, so they
 * never become a point's current online value, never count for stale-data alarms and are not fed to
 * the evaluation engine (which judges online readings only). Written by {@link IngestService#lab};
 * read here. Every entry and correction is audited (the value before and after). After a write, in
 * the same transaction, a {@link Stored} event names what was written (the instrument care compares
 * online instruments with it).
 */
@Repository
public class LabResults {

  /** The density source named in every conversion. */
  public static final String DENSITY_SOURCE =
      "IAPWS-IF97 region 1 (IAPWS R7-97(2012)) at 101.325 kPa, the model's Water.densityKgPerM3";

  /** Default temperature of a measured volume, °C, when the result does not state one. */
  public static final double DEFAULT_VOLUME_TEMPERATURE_CEL = 25.0;

  /** Accepted range of a stated volume temperature, °C (liquid at atmospheric pressure). */
  static final double MIN_VOLUME_TEMPERATURE_CEL = 0.0;

  static final double MAX_VOLUME_TEMPERATURE_CEL = 90.0;

  /**
   * A mass-per-volume result converted to a mass fraction: {@code value[ug/kg] = value[fromUnit] ×
   * factor}, {@code factor = (mass unit in ug) × 1000 / density[kg/m³]}.
   */
  public record Conversion(
      int index,
      String fromUnit,
      String toUnit,
      double factor,
      double densityKgPerM3,
      double temperatureCel,
      String densitySource) {}

  /** What a lab batch gave. */
  public record Outcome(
      int received, int inserted, int corrected, int unchanged, List<Conversion> conversions) {}

  /** One stored grab or lab result, value in the parameter's canonical unit. */
  public record LabResult(
      String samplePoint,
      Parameter parameter,
      Instant time,
      String source,
      double value,
      String censored,
      String sampleId,
      String labMethod,
      double sentValue,
      String sentUnit,
      Double conversionFactor,
      Double densityKgPerM3,
      Double densityTemperatureCel,
      String keyId,
      String keyName) {

    /** The canonical unit (UCUM). */
    public String unit() {
      return parameter.unit();
    }

    /** True when the result is below the detection limit {@link #value()}. */
    public boolean belowDetectionLimit() {
      return "below".equals(censored);
    }
  }

  /** Published in the writing transaction after grab or lab results are stored or corrected. */
  public record Stored(List<LabResult> results) {}

  private final JdbcClient jdbc;
  private final ApplicationEventPublisher events;
  private final AuditLog audit;

  LabResults(JdbcClient jdbc, ApplicationEventPublisher events, AuditLog audit) {
    this.jdbc = jdbc;
    this.events = events;
    this.audit = audit;
  }

  /** The mass-per-volume units a lab result may be sent in, with their mass in ug. */
  private static final Map<String, Double> VOLUMETRIC = Map.of("ug/L", 1.0, "mg/L", 1000.0);

  /** A batch with its volumetric values converted to ug/kg, the conversions and rejections. */
  record Converted(
      List<ReadingInput> inputs, List<Conversion> conversions, List<RejectedReading> rejected) {}

  /**
   * Converts mass-per-volume values of mass-fraction parameters to ug/kg with the density of water
   * at the stated temperature (default 25 °C). Other values pass unchanged (the validator checks
   * them).
   */
  static Converted convert(List<ReadingInput> inputs) {
    List<ReadingInput> out = new ArrayList<>(inputs.size());
    List<Conversion> conversions = new ArrayList<>();
    List<RejectedReading> rejected = new ArrayList<>();
    for (int i = 0; i < inputs.size(); i++) {
      ReadingInput in = inputs.get(i);
      Double ug = in == null || in.unit() == null ? null : VOLUMETRIC.get(in.unit());
      var parameter =
          in == null ? java.util.Optional.<Parameter>empty() : Parameter.byCode(in.parameter());
      if (in != null && in.densityTemperatureCel() != null && ug == null) {
        rejected.add(
            new RejectedReading(i, "densityTemperatureCel", "only for values in ug/L or mg/L"));
      }
      if (ug == null
          || parameter.isEmpty()
          || parameter.get().quantity() != Parameter.Quantity.MASS_FRACTION
          || in.value() == null
          || !Double.isFinite(in.value())) {
        out.add(in);
        continue;
      }
      double t =
          in.densityTemperatureCel() == null
              ? DEFAULT_VOLUME_TEMPERATURE_CEL
              : in.densityTemperatureCel();
      if (!(t >= MIN_VOLUME_TEMPERATURE_CEL && t <= MAX_VOLUME_TEMPERATURE_CEL)) {
        rejected.add(
            new RejectedReading(
                i,
                "densityTemperatureCel",
                "must be in ["
                    + MIN_VOLUME_TEMPERATURE_CEL
                    + ", "
                    + MAX_VOLUME_TEMPERATURE_CEL
                    + "] Cel"));
        out.add(in);
        continue;
      }
      double density = Water.densityKgPerM3(t + 273.15, Water.ATMOSPHERIC_PRESSURE_PA);
      double factor = Units.significant(ug * 1000.0 / density);
      out.add(in.withValue(Units.significant(in.value() * ug * 1000.0 / density), "ug/kg"));
      conversions.add(
          new Conversion(
              i, in.unit(), "ug/kg", factor, Math.round(density * 1e4) / 1e4, t, DENSITY_SOURCE));
    }
    return new Converted(out, conversions, rejected);
  }

  /**
   * Stores a validated batch ({@code valid.get(i)} checked from {@code inputs.get(i)}, sent values
   * in {@code sent.get(i)}): a result is keyed by point, parameter, time and source; the same key
   * with the same content is unchanged, with other content a correction. The last of a key in a
   * batch wins.
   */
  @Transactional
  Outcome write(
      List<ReadingInput> sent,
      List<ReadingInput> inputs,
      List<ValidReading> valid,
      List<Conversion> conversions,
      Actor by) {
    Map<Integer, Conversion> byIndex = new java.util.HashMap<>();
    conversions.forEach(c -> byIndex.put(c.index(), c));
    Map<String, LabResult> distinct = new LinkedHashMap<>();
    for (int i = 0; i < valid.size(); i++) {
      ValidReading v = valid.get(i);
      ReadingInput in = inputs.get(i);
      ReadingInput raw = sent.get(i);
      String source = in.source() == null ? "lab" : in.source();
      Conversion c = byIndex.get(i);
      distinct.put(
          v.samplePointId()
              + '\u0000'
              + v.parameter().code()
              + '\u0000'
              + v.time()
              + '\u0000'
              + source,
          new LabResult(
              v.samplePointId(),
              v.parameter(),
              v.time(),
              source,
              v.value(),
              in.censored(),
              in.sampleId(),
              in.labMethod(),
              raw.value(),
              raw.unit(),
              c == null ? null : c.factor(),
              c == null ? null : c.densityKgPerM3(),
              c == null ? null : c.temperatureCel(),
              by.keyId(),
              by.keyName()));
    }
    int inserted = 0;
    int corrected = 0;
    List<LabResult> changed = new ArrayList<>();
    for (LabResult r : distinct.values()) {
      LabResult before =
          jdbc.sql(
                  SELECT
                      + " WHERE sample_point_id = ? AND parameter = ? AND time = ? AND source = ?"
                      + " FOR UPDATE")
              .params(r.samplePoint(), r.parameter().code(), Timestamp.from(r.time()), r.source())
              .query((rs, i) -> row(rs))
              .optional()
              .orElse(null);
      List<Boolean> written =
          jdbc.sql(
                  """
                  INSERT INTO lab_result AS l (sample_point_id, parameter, time, source, value,
                      censored, sample_id, lab_method, sent_value, sent_unit, conversion_factor,
                      density_kg_m3, density_temperature_cel, key_id, key_name)
                  VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)
                  ON CONFLICT (sample_point_id, parameter, time, source) DO UPDATE SET
                      value = EXCLUDED.value, censored = EXCLUDED.censored,
                      sample_id = EXCLUDED.sample_id, lab_method = EXCLUDED.lab_method,
                      sent_value = EXCLUDED.sent_value, sent_unit = EXCLUDED.sent_unit,
                      conversion_factor = EXCLUDED.conversion_factor,
                      density_kg_m3 = EXCLUDED.density_kg_m3,
                      density_temperature_cel = EXCLUDED.density_temperature_cel,
                      key_id = EXCLUDED.key_id, key_name = EXCLUDED.key_name, recorded_at = now()
                  WHERE (l.value, l.censored, l.sample_id, l.lab_method, l.sent_value, l.sent_unit)
                      IS DISTINCT FROM (EXCLUDED.value, EXCLUDED.censored, EXCLUDED.sample_id,
                      EXCLUDED.lab_method, EXCLUDED.sent_value, EXCLUDED.sent_unit)
                  RETURNING (xmax = 0)""")
              .params(
                  r.samplePoint(),
                  r.parameter().code(),
                  Timestamp.from(r.time()),
                  r.source(),
                  r.value(),
                  r.censored(),
                  r.sampleId(),
                  r.labMethod(),
                  r.sentValue(),
                  r.sentUnit(),
                  r.conversionFactor(),
                  r.densityKgPerM3(),
                  r.densityTemperatureCel(),
                  r.keyId(),
                  r.keyName())
              .query(Boolean.class)
              .list();
      if (!written.isEmpty()) {
        changed.add(r);
        audit.record(
            before == null ? "lab-result.enter" : "lab-result.correct",
            "lab-result",
            r.samplePoint() + "/" + r.parameter().code() + "/" + r.time() + "/" + r.source(),
            before,
            r);
        if (written.get(0)) {
          inserted++;
        } else {
          corrected++;
        }
      }
    }
    if (!changed.isEmpty()) {
      events.publishEvent(new Stored(List.copyOf(changed)));
    }
    return new Outcome(
        sent.size(), inserted, corrected, distinct.size() - inserted - corrected, conversions);
  }

  private static final String SELECT =
      "SELECT sample_point_id, parameter, time, source, value, censored, sample_id, lab_method,"
          + " sent_value, sent_unit, conversion_factor, density_kg_m3, density_temperature_cel,"
          + " key_id, key_name FROM lab_result";

  /** A point's results in [from, to) (of one parameter, or all when null), oldest first. */
  public List<LabResult> between(
      String samplePoint, Parameter parameter, Instant from, Instant to) {
    return jdbc.sql(
            SELECT
                + " WHERE sample_point_id = ? AND (?::text IS NULL OR parameter = ?)"
                + " AND time >= ? AND time < ? ORDER BY time, parameter, source")
        .params(
            samplePoint,
            parameter == null ? null : parameter.code(),
            parameter == null ? null : parameter.code(),
            Timestamp.from(from),
            Timestamp.from(to))
        .query((rs, i) -> row(rs))
        .list();
  }

  /** The results of every sample point of a plant in [from, to), oldest first. */
  public List<LabResult> plantBetween(String plantId, Instant from, Instant to) {
    return jdbc.sql(
            SELECT
                + " WHERE sample_point_id IN (SELECT id FROM sample_point WHERE plant_id = ?)"
                + " AND time >= ? AND time < ? ORDER BY time, sample_point_id, parameter, source")
        .params(plantId, Timestamp.from(from), Timestamp.from(to))
        .query((rs, i) -> row(rs))
        .list();
  }

  private static LabResult row(ResultSet rs) throws SQLException {
    return new LabResult(
        rs.getString(1),
        Parameter.ofCode(rs.getString(2)),
        rs.getTimestamp(3).toInstant(),
        rs.getString(4),
        rs.getDouble(5),
        rs.getString(6),
        rs.getString(7),
        rs.getString(8),
        rs.getDouble(9),
        rs.getString(10),
        (Double) rs.getObject(11),
        (Double) rs.getObject(12),
        (Double) rs.getObject(13),
        rs.getString(14),
        rs.getString(15));
  }
}
