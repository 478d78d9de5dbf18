package org.kwanta.service.system;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.kwanta.model.Parameter;

/**
 * The documented metrics: Micrometer names (dotted) and the names Prometheus sees on {@code
 * /actuator/prometheus}. The service's metrics code uses these constants, the Grafana dashboard and
 * the alert rules are tested against {@link #exposedNames()}.
 *
 * <p>Labels are bounded and say what they hold: {@code plant}, {@code block} (the plant's block,
 * e.g. U1), {@code sample_point}, {@code parameter} (the codes of {@link Parameter}), {@code level}
 * and {@code side} (of a threshold), {@code reason_code} and {@code points_at} (of a diagnosis
 * finding), and {@code reason} (a fixed list of the ingest's rejection reasons). Never a value, a
 * time or a key.
 *
 * <p>Units: one unit per metric name, and the unit is in the name. Times are in seconds (Prometheus
 * base unit). Chemistry and process values are in the parameter's canonical unit ({@link
 * Parameter#unit()}: µS/cm, µg/kg, pH, °C, mV, MW, MPa, kg/s), not in SI base units, so that alert
 * thresholds read as the guidance writes them; the latest values and the limit thresholds are
 * therefore split into one metric per canonical unit ({@link #sampleValue(Parameter)}, {@link
 * #limitThreshold(Parameter)}), named from {@link #UNIT_IN_NAME}, the one place that knows how a
 * unit is written in a metric name. A parameter with a unit already there needs no metrics code.
 */
public final class MetricNames {

  private MetricNames() {}

  /** Label: plant id. */
  public static final String PLANT = "plant";

  /** Label: block id within the plant. */
  public static final String BLOCK = "block";

  /** Label: sample point id. */
  public static final String SAMPLE_POINT = "sample_point";

  /** Label: parameter code. */
  public static final String PARAMETER = "parameter";

  /** Label: reason a reading was rejected (bounded list of the ingest's reason codes). */
  public static final String REASON = "reason";

  private static final List<String> POINT = List.of(PLANT, BLOCK, SAMPLE_POINT);
  private static final List<String> POINT_PARAMETER =
      List.of(PLANT, BLOCK, SAMPLE_POINT, PARAMETER);

  /** pH at the sample point's operating temperature (and pressure). */
  public static final String SAMPLE_PH_AT_TEMPERATURE = "kwanta.sample.ph.at.temperature";

  /**
   * Current action level: 0 normal (also when outside the normal range), 1 to 3 action level, 4
   * immediate shutdown. Always the level of the values, whatever the doubt about the instrument.
   */
  public static final String SAMPLE_LEVEL = "kwanta.sample.level";

  /**
   * 1 when the value is outside its normal range but below every action level (OUTSIDE_NORMAL,
   * advisory), else 0.
   */
  public static final String SAMPLE_OUTSIDE_NORMAL = "kwanta.sample.outside.normal";

  /** Seconds since the onset of the current level (OUTSIDE_NORMAL counts as a level of its own). */
  public static final String SAMPLE_LEVEL_HELD = "kwanta.sample.level.held";

  /**
   * 1 when the instrument behind the latest value is in doubt (an instrument check failed or the
   * reading's quality is bad), else 0. Independent of the level.
   */
  public static final String SAMPLE_INSTRUMENT_IN_DOUBT = "kwanta.sample.instrument.in.doubt";

  /**
   * The deadline of a running excursion, seconds since the epoch: the earliest, over the levels up
   * to the current one, of the onset of the running stretch at that level or above plus the level's
   * allowance (the {@code deadline} of {@code GET /api/v1/excursions}). Only while an excursion is
   * running.
   */
  public static final String EXCURSION_DEADLINE = "kwanta.excursion.deadline.timestamp";

  /** Age of the latest reading, seconds. */
  public static final String SAMPLE_READING_AGE = "kwanta.sample.reading.age";

  /** Readings stored (counter). */
  public static final String READINGS_INGESTED = "kwanta.readings.ingested";

  /** Readings rejected, by reason (counter). */
  public static final String READINGS_REJECTED = "kwanta.readings.rejected";

  /** Time to evaluate one sample point at one time (timer). */
  public static final String EVALUATION_DURATION = "kwanta.evaluation.duration";

  /** Time to ingest one batch, from parse to commit (timer). */
  public static final String INGEST_BATCH_DURATION = "kwanta.ingest.batch.duration";

  /**
   * Ingest requests being processed now (bounded by {@code kwanta.http.max-concurrent-ingests}).
   */
  public static final String INGEST_IN_FLIGHT = "kwanta.ingest.in_flight";

  /** Ingest requests refused with 503 because the concurrency bound was reached. */
  public static final String INGEST_REJECTED_BUSY = "kwanta.ingest.rejected.busy";

  /** Batches written again on the plain path after the fast path failed (counter). */
  public static final String INGEST_RETRIED = "kwanta.ingest.retried";

  /** pH at 25 °C calculated from the conductivities, latest evaluation. */
  public static final String SAMPLE_PH_CALCULATED = "kwanta.sample.ph.calculated";

  /** Neutral pH at the operating temperature, latest evaluation. */
  public static final String SAMPLE_NEUTRAL_PH = "kwanta.sample.neutral.ph.at.temperature";

  /** Label: the level a threshold belongs to (NORMAL for the normal range's bounds). */
  public static final String LEVEL = "level";

  /** Label: which side a threshold bounds (HIGH or LOW). */
  public static final String SIDE = "side";

  /** 1 per active finding of the diagnosis over time. */
  public static final String DIAGNOSIS_FINDING = "kwanta.diagnosis.finding";

  /** Label: a diagnosis finding's reason code (e.g. COOLING_WATER_INGRESS). */
  public static final String REASON_CODE = "reason_code";

  /** Label: what a finding points at (an instrument, sample conditioning, or the process). */
  public static final String POINTS_AT = "points_at";

  /**
   * How each canonical unit ({@link Parameter#unit()}, a UCUM code) is written in a metric name:
   * the kind of quantity, then the unit spelled out, as Prometheus names a unit (pH and the state
   * code have no unit to spell). The one place to add a unit; {@link #sampleValue(Parameter)}
   * refuses a parameter whose unit is not here, and a unit test checks every parameter.
   */
  public static final Map<String, String> UNIT_IN_NAME =
      Map.of(
          "uS/cm", "conductivity_microsiemens_per_centimetre",
          "ug/kg", "concentration_micrograms_per_kilogram",
          "[pH]", "ph",
          "Cel", "temperature_celsius",
          "mV", "potential_millivolts",
          "MW", "power_megawatts",
          "MPa", "pressure_megapascals",
          "kg/s", "mass_flow_kilograms_per_second",
          "{state}", "state_code");

  /**
   * The metric of the latest values in one canonical unit: {@code kwanta_sample_} plus the unit in
   * the name, e.g. {@code kwanta_sample_conductivity_microsiemens_per_centimetre}.
   */
  public static final String SAMPLE_VALUE_PREFIX = "kwanta_sample_";

  /**
   * The metric of the limit thresholds in one canonical unit: {@code kwanta_limit_threshold_} plus
   * the unit in the name, e.g. {@code kwanta_limit_threshold_ph}.
   */
  public static final String LIMIT_THRESHOLD_PREFIX = "kwanta_limit_threshold_";

  public enum Type {
    GAUGE,
    COUNTER,
    TIMER
  }

  /**
   * One documented metric.
   *
   * @param micrometerName dotted name used in code
   * @param prometheusName base name on the scrape (before the timer's _count/_sum/_max/_bucket)
   * @param type gauge, counter or timer
   * @param labels its labels
   * @param help one-line description (the scrape's HELP text)
   */
  public record Metric(
      String micrometerName, String prometheusName, Type type, List<String> labels, String help) {

    /** Every series name this metric shows on the scrape. */
    public List<String> exposedNames() {
      return switch (type) {
        case GAUGE -> List.of(prometheusName);
        case COUNTER -> List.of(prometheusName);
        case TIMER ->
            List.of(
                prometheusName + "_count",
                prometheusName + "_sum",
                prometheusName + "_max",
                prometheusName + "_bucket");
      };
    }
  }

  /**
   * The metrics of one canonical unit.
   *
   * @param unit the canonical unit, a UCUM code ({@link Parameter#unit()})
   * @param parameters the parameters in that unit whose values the metric may carry (its {@code
   *     parameter} label values), in catalogue order
   * @param metric the metric
   */
  public record PerUnit(String unit, List<Parameter> parameters, Metric metric) {}

  /** Latest values: one metric per canonical unit of the catalogue, in catalogue order. */
  public static final List<PerUnit> SAMPLE_VALUES =
      perUnit(
          List.of(Parameter.values()),
          SAMPLE_VALUE_PREFIX,
          POINT_PARAMETER,
          "Latest value, in %s (UCUM), of %s");

  /** Thresholds of the limits in force: one metric per canonical unit of the limited parameters. */
  public static final List<PerUnit> LIMIT_THRESHOLDS =
      perUnit(
          List.copyOf(Parameter.limited()),
          LIMIT_THRESHOLD_PREFIX,
          List.of(PLANT, BLOCK, SAMPLE_POINT, PARAMETER, LEVEL, SIDE),
          "A threshold of the limits in force now, in %s (UCUM), of %s (level NORMAL: the"
              + " normal range's bound; AL1-AL3, SHUTDOWN: action levels; side HIGH or LOW)");

  private static List<PerUnit> perUnit(
      List<Parameter> parameters, String prefix, List<String> labels, String help) {
    Map<String, List<Parameter>> byUnit = new LinkedHashMap<>();
    for (Parameter p : parameters) {
      if (!UNIT_IN_NAME.containsKey(p.unit())) {
        throw new IllegalStateException(
            "No metric name for the unit "
                + p.unit()
                + " of "
                + p.code()
                + ": add it to MetricNames.UNIT_IN_NAME");
      }
      byUnit.computeIfAbsent(p.unit(), u -> new ArrayList<>()).add(p);
    }
    List<PerUnit> out = new ArrayList<>();
    byUnit.forEach(
        (unit, ps) -> {
          String prometheus = prefix + UNIT_IN_NAME.get(unit);
          String codes = String.join(", ", ps.stream().map(Parameter::code).toList());
          out.add(
              new PerUnit(
                  unit,
                  List.copyOf(ps),
                  new Metric(
                      prometheus.replace('_', '.'),
                      prometheus,
                      Type.GAUGE,
                      labels,
                      help.formatted(unit, codes))));
        });
    return List.copyOf(out);
  }

  /** The metric that carries the latest values of this parameter (the one of its unit). */
  public static Metric sampleValue(Parameter parameter) {
    return ofUnit(SAMPLE_VALUES, parameter);
  }

  /**
   * The metric that carries the limit thresholds of this parameter (the one of its unit).
   *
   * @throws IllegalArgumentException when limits are not set on the parameter
   */
  public static Metric limitThreshold(Parameter parameter) {
    return ofUnit(LIMIT_THRESHOLDS, parameter);
  }

  private static Metric ofUnit(List<PerUnit> metrics, Parameter parameter) {
    return metrics.stream()
        .filter(m -> m.parameters().contains(parameter))
        .findFirst()
        .orElseThrow(() -> new IllegalArgumentException("No metric for " + parameter.code()))
        .metric();
  }

  /** The metrics that are not split by unit. */
  private static final List<Metric> OTHERS =
      List.of(
          new Metric(
              SAMPLE_PH_AT_TEMPERATURE,
              "kwanta_sample_ph_at_temperature",
              Type.GAUGE,
              POINT,
              "pH at the sample point's operating temperature"),
          new Metric(
              SAMPLE_LEVEL,
              "kwanta_sample_level",
              Type.GAUGE,
              POINT_PARAMETER,
              "Current action level: 0 normal (or outside the normal range), 1-3 action level,"
                  + " 4 immediate shutdown; whatever the doubt about the instrument"),
          new Metric(
              SAMPLE_OUTSIDE_NORMAL,
              "kwanta_sample_outside_normal",
              Type.GAUGE,
              POINT_PARAMETER,
              "1 when outside the normal range but below every action level (advisory), else 0"),
          new Metric(
              SAMPLE_LEVEL_HELD,
              "kwanta_sample_level_held_seconds",
              Type.GAUGE,
              POINT_PARAMETER,
              "Seconds since the onset of the current level"),
          new Metric(
              SAMPLE_INSTRUMENT_IN_DOUBT,
              "kwanta_sample_instrument_in_doubt",
              Type.GAUGE,
              POINT_PARAMETER,
              "1 when the instrument behind the latest value is in doubt, else 0"),
          new Metric(
              SAMPLE_PH_CALCULATED,
              "kwanta_sample_ph_calculated",
              Type.GAUGE,
              POINT,
              "pH at 25 °C calculated from specific and cation conductivity (latest evaluation)"),
          new Metric(
              SAMPLE_NEUTRAL_PH,
              "kwanta_sample_neutral_ph_at_temperature",
              Type.GAUGE,
              POINT,
              "Neutral pH at the sample point's operating temperature (latest evaluation)"),
          new Metric(
              DIAGNOSIS_FINDING,
              "kwanta_diagnosis_finding",
              Type.GAUGE,
              List.of(PLANT, BLOCK, SAMPLE_POINT, REASON_CODE, POINTS_AT),
              "1 for each finding of the diagnosis over time at the point's latest minute"),
          new Metric(
              EXCURSION_DEADLINE,
              "kwanta_excursion_deadline_timestamp_seconds",
              Type.GAUGE,
              POINT_PARAMETER,
              "Deadline of the running excursion (the excursions endpoint's deadline, as"
                  + " reported), seconds since the epoch; overrun when it lies in the past"),
          new Metric(
              SAMPLE_READING_AGE,
              "kwanta_sample_reading_age_seconds",
              Type.GAUGE,
              POINT_PARAMETER,
              "Age of the latest reading in seconds"),
          new Metric(
              READINGS_INGESTED,
              "kwanta_readings_ingested_total",
              Type.COUNTER,
              List.of(PLANT),
              "Readings stored"),
          new Metric(
              READINGS_REJECTED,
              "kwanta_readings_rejected_total",
              Type.COUNTER,
              List.of(REASON),
              "Readings rejected, by reason"),
          new Metric(
              EVALUATION_DURATION,
              "kwanta_evaluation_duration_seconds",
              Type.TIMER,
              List.of(),
              "Time to recompute the evaluations of one sample point after a batch"),
          new Metric(
              INGEST_BATCH_DURATION,
              "kwanta_ingest_batch_duration_seconds",
              Type.TIMER,
              List.of(),
              "Time to ingest one batch"),
          new Metric(
              INGEST_IN_FLIGHT,
              "kwanta_ingest_in_flight",
              Type.GAUGE,
              List.of(),
              "Ingest requests being processed now"),
          new Metric(
              INGEST_REJECTED_BUSY,
              "kwanta_ingest_rejected_busy_total",
              Type.COUNTER,
              List.of(),
              "Ingest requests refused with 503 because too many were in flight"),
          new Metric(
              INGEST_RETRIED,
              "kwanta_ingest_retried_total",
              Type.COUNTER,
              List.of(),
              "Batches written again on the plain path after the fast path failed"));

  /** The service's own metrics: the ones split by unit, then the others. */
  public static final List<Metric> METRICS = metrics();

  private static List<Metric> metrics() {
    List<Metric> all = new ArrayList<>();
    SAMPLE_VALUES.forEach(m -> all.add(m.metric()));
    LIMIT_THRESHOLDS.forEach(m -> all.add(m.metric()));
    all.addAll(OTHERS);
    return List.copyOf(all);
  }

  /** Platform metrics the dashboards and rules may use (HikariCP pool, JVM, Prometheus's own). */
  public static final List<String> PLATFORM =
      List.of(
          "up",
          "hikaricp_connections_active",
          "hikaricp_connections_idle",
          "hikaricp_connections_pending",
          "hikaricp_connections_max",
          "hikaricp_connections_timeout_total",
          "jvm_memory_used_bytes",
          "process_cpu_usage",
          "http_server_requests_seconds_count",
          "http_server_requests_seconds_sum");

  /** Every series name a dashboard or an alert rule may use. */
  public static Set<String> exposedNames() {
    Set<String> names = new LinkedHashSet<>();
    METRICS.forEach(m -> names.addAll(m.exposedNames()));
    names.addAll(PLATFORM);
    return names;
  }
}
