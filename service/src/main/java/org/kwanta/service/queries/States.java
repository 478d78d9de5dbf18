package org.kwanta.service.queries;

import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.Locale;
import org.kwanta.model.Parameter;
import org.kwanta.service.ingest.EvaluationView;
import org.kwanta.service.ingest.Evaluations;
import org.kwanta.service.ingest.ReadingHistory;
import org.kwanta.service.ingest.ValidReading;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.stereotype.Repository;

/**
 * The latest state of sample points: each parameter's latest reading with its age, the current
 * level of each parameter with limits, the latest evaluation.
 *
 * <p>"Latest" looks back {@code kwanta.queries.latest-look-back} (default 35 days, so that a
 * monthly laboratory result still shows): a reading or evaluation older than that is not part of
 * the state. The bound lets PostgreSQL prune the daily partitions before it; without one, every
 * partition of {@code reading} and {@code evaluation} was planned and probed on each request.
 */
@Repository
class States {

  private final ReadingHistory readings;
  private final Evaluations evaluations;
  private final CurrentLevels levels;
  private final Duration lookBack;

  States(
      ReadingHistory readings,
      Evaluations evaluations,
      CurrentLevels levels,
      @Value("${kwanta.queries.latest-look-back:P35D}") Duration lookBack) {
    this.readings = readings;
    this.evaluations = evaluations;
    this.levels = levels;
    this.lookBack = lookBack;
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
    Instant since = now.minus(lookBack);
    List<Latest> latest =
        readings.latestPerParameter(samplePointId, since).stream()
            .map(
                r -> {
                  Parameter p = Parameter.byCode(r.parameter()).orElseThrow();
                  return new Latest(
                      p.code(),
                      p.unit(),
                      r.time(),
                      Duration.between(r.time(), now).toMillis() / 1000.0,
                      r.value(),
                      ValidReading.Quality.ofCode(r.quality()).name().toLowerCase(Locale.ROOT),
                      Double.isNaN(r.sampleTemperatureCel()) ? null : r.sampleTemperatureCel(),
                      p.isConductivity() ? r.compensated() : null);
                })
            .toList();
    LatestEvaluation evaluation =
        evaluations
            .latest(samplePointId, since)
            .map(
                e ->
                    new LatestEvaluation(
                        e.time(),
                        Duration.between(e.time(), now).toMillis() / 1000.0,
                        e.evaluation()))
            .orElse(null);
    return new State(
        samplePointId,
        name,
        cycleLocation,
        regime,
        now,
        latest,
        levels.of(samplePointId, now),
        evaluation,
        diagnosis == null
            ? null
            : new Diagnosis(
                diagnosis.time(),
                org.kwanta.service.diagnosis.FindingOut.of(diagnosis.findings())));
  }
}
