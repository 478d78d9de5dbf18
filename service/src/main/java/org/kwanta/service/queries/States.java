package org.kwanta.service.queries;

import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.Locale;
import org.kwanta.service.ingest.EvaluationView;
import org.kwanta.service.ingest.MeasuredParameter;
import org.kwanta.service.ingest.ValidReading;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.stereotype.Repository;
import tools.jackson.databind.json.JsonMapper;

/**
 * The latest state of sample points: each parameter's latest reading with its age, the current
 * level of each parameter with limits, the latest evaluation.
 */
@Repository
class States {

  private final JdbcTemplate jdbc;
  private final JsonMapper json;
  private final CurrentLevels levels;

  States(JdbcTemplate jdbc, JsonMapper json, CurrentLevels levels) {
    this.jdbc = jdbc;
    this.json = json;
    this.levels = levels;
  }

  /** A parameter's latest reading. */
  record Latest(
      String parameter,
      String unit,
      Instant time,
      double ageSeconds,
      double value,
      String quality,
      Double sampleTemperatureCel,
      Boolean compensated) {}

  /** The latest evaluation. */
  record LatestEvaluation(Instant time, double ageSeconds, EvaluationView evaluation) {}

  /** A sample point's state. */
  record State(
      String samplePoint,
      String name,
      String cycleLocation,
      String treatmentRegime,
      Instant asOf,
      List<Latest> readings,
      List<CurrentLevels.LevelState> levels,
      LatestEvaluation evaluation,
      Diagnosis diagnosis) {}

  /**
   * The diagnosis over time at the point's latest minute (see docs/diagnosis.md): findings with
   * what was expected, what was read, residual and tolerance. Null without recent data.
   */
  record Diagnosis(Instant time, List<org.kwanta.service.diagnosis.FindingOut> findings) {}

  State of(
      String samplePointId,
      String name,
      String cycleLocation,
      String regime,
      Instant now,
      org.kwanta.service.diagnosis.DiagnosisService.PointDiagnosis diagnosis) {
    List<Latest> latest =
        jdbc.query(
            """
            SELECT p.code, r.time, r.value, r.quality, r.sample_temperature_cel, r.compensated
            FROM unnest(?::text[]) AS p(code)
            CROSS JOIN LATERAL (
              SELECT time, value, quality, sample_temperature_cel, compensated FROM reading
              WHERE sample_point_id = ? AND parameter = p.code ORDER BY time DESC LIMIT 1) r
            ORDER BY p.code""",
            (rs, i) -> {
              MeasuredParameter p = MeasuredParameter.byCode(rs.getString(1)).orElseThrow();
              Instant t = rs.getTimestamp(2).toInstant();
              double temperature = rs.getDouble(5);
              Double sampleTemperature = rs.wasNull() ? null : temperature;
              return new Latest(
                  p.code(),
                  p.canonicalUnit(),
                  t,
                  Duration.between(t, now).toMillis() / 1000.0,
                  rs.getDouble(3),
                  ValidReading.Quality.ofCode(rs.getInt(4)).name().toLowerCase(Locale.ROOT),
                  sampleTemperature,
                  p.isConductivity() ? rs.getBoolean(6) : null);
            },
            (Object) MeasuredParameter.codeArray(),
            samplePointId);
    List<LatestEvaluation> evaluation =
        jdbc.query(
            "SELECT time, details::text FROM evaluation WHERE sample_point_id = ?"
                + " ORDER BY time DESC LIMIT 1",
            (rs, i) -> {
              Instant t = rs.getTimestamp(1).toInstant();
              return new LatestEvaluation(
                  t,
                  Duration.between(t, now).toMillis() / 1000.0,
                  json.readValue(rs.getString(2), EvaluationView.class));
            },
            samplePointId);
    return new State(
        samplePointId,
        name,
        cycleLocation,
        regime,
        now,
        latest,
        levels.of(samplePointId, now),
        evaluation.isEmpty() ? null : evaluation.get(0),
        diagnosis == null
            ? null
            : new Diagnosis(
                diagnosis.time(),
                org.kwanta.service.diagnosis.FindingOut.of(diagnosis.findings())));
  }
}
