package org.kwanta.service.system;

import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;

/**
 * The documented metrics: Micrometer names (dotted) and the names Prometheus sees on {@code
 * /actuator/prometheus}. The service's metrics code uses these constants, the Grafana dashboard and
 * the alert rules are tested against {@link #exposedNames()}.
 *
 * <p>Labels are bounded: {@code plant}, {@code block} (the plant's block, e.g. U1), {@code
 * sample_point}, {@code parameter} (the codes of {@link org.kwanta.model.Parameter}), and {@code
 * reason} (a fixed list of rejection reasons). Never a value, a time or a key.
 *
 * <p>Units: times in seconds (Prometheus base unit). Chemistry values are in the parameter's
 * canonical trade unit (µS/cm, µg/kg, mg/kg, pH) as listed by {@link
 * org.kwanta.model.Parameter#unit()}, not in SI base units, so that alert thresholds read as the
 * guidance writes them; the unit is fixed per parameter label value.
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

  /** Latest value of a parameter at a sample point, in the parameter's canonical unit. */
  public static final String SAMPLE_VALUE = "kwanta.sample.value";

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

  /** Kind of meter, for the exposed suffixes. */
  /** A threshold of the limits in force (normal range bounds and action levels). */
  public static final String LIMIT_THRESHOLD = "kwanta.limit.threshold";

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

  /** Label: a finding's reason code. */
  public static final String CODE = "code";

  /** Label: what a finding points at (an instrument, sample conditioning, or the process). */
  public static final String POINTS_AT = "points_at";

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

  /** The service's own metrics. */
  public static final List<Metric> METRICS =
      List.of(
          new Metric(
              SAMPLE_VALUE,
              "kwanta_sample_value",
              Type.GAUGE,
              POINT_PARAMETER,
              "Latest value, in the parameter's canonical unit"),
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
              LIMIT_THRESHOLD,
              "kwanta_limit_threshold",
              Type.GAUGE,
              List.of(PLANT, BLOCK, SAMPLE_POINT, PARAMETER, LEVEL, SIDE),
              "A threshold of the limits in force now, in the parameter's canonical unit (NORMAL:"
                  + " the normal range's bound; AL1-AL3, SHUTDOWN: action levels)"),
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
              List.of(PLANT, BLOCK, SAMPLE_POINT, CODE, POINTS_AT),
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
