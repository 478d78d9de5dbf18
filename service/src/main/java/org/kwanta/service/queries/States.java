package org.kwanta.service.queries;

import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ConcurrentHashMap;
import org.kwanta.model.Parameter;
import org.kwanta.service.ingest.EvaluationRunner.StoredReading;
import org.kwanta.service.ingest.EvaluationView;
import org.kwanta.service.ingest.Evaluations;
import org.kwanta.service.ingest.ReadingHistory;
import org.kwanta.service.ingest.ValidReading;
import org.kwanta.service.limits.Limits;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.scheduling.annotation.Scheduled;
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
  private final LevelWindows windows;
  private final Limits limits;
  private final Duration lookBack;
  private final Clock clock;
  private final Map<String, Entry> cache = new ConcurrentHashMap<>();
  private final Map<String, Instant> lastAsked = new ConcurrentHashMap<>();

  /** Entries of points the board has not asked for this long are dropped, not refreshed. */
  static final Duration UNUSED = Duration.ofMinutes(5);

  States(
      ReadingHistory readings,
      Evaluations evaluations,
      CurrentLevels levels,
      LevelWindows windows,
      Limits limits,
      Clock clock,
      @Value("${kwanta.queries.latest-look-back:P35D}") Duration lookBack) {
    this.readings = readings;
    this.evaluations = evaluations;
    this.levels = levels;
    this.windows = windows;
    this.limits = limits;
    this.clock = clock;
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
      Instant levelsAsOf,
      LatestEvaluation evaluation,
      Diagnosis diagnosis) {}

  /**
   * The diagnosis over time at the point's latest minute (see docs/diagnosis.md): findings with
   * what was expected, what was read, residual and tolerance. Null without recent data.
   */
  record Diagnosis(Instant time, List<org.kwanta.service.diagnosis.FindingOut> findings) {}

  /** The cached latest readings and evaluation of one point, with what they were read at. */
  private record Entry(
      long generation,
      Instant asOf,
      List<StoredReading> latest,
      Optional<Evaluations.Stored> evaluation,
      List<CurrentLevels.LevelState> levels) {

    /** The earliest time the entry shows: it leaves the state when older than the look-back. */
    Instant oldest() {
      Instant t = evaluation.map(Evaluations.Stored::time).orElse(Instant.MAX);
      for (StoredReading r : latest) {
        t = r.time().isBefore(t) ? r.time() : t;
      }
      return t;
    }
  }

  /**
   * What the board's cached entries are checked against: each point's generation (changes with
   * every write of its readings) and the plant's limits fingerprint, read once per request.
   */
  record Freshness(String plantId, Map<String, Long> generations, String limitsStamp) {}

  /** Reads what the entries of a plant's points are checked against (two queries). */
  Freshness freshness(String plantId, Instant now) {
    return new Freshness(plantId, readings.generationsByPoint(plantId), limits.stamp(plantId, now));
  }

  /** A sample point's state now, read afresh (the state endpoint). */
  State of(
      String samplePointId,
      String name,
      String cycleLocation,
      String regime,
      Instant now,
      org.kwanta.service.diagnosis.DiagnosisService.PointDiagnosis diagnosis) {
    Instant since = now.minus(lookBack);
    return state(
        samplePointId,
        name,
        cycleLocation,
        regime,
        now,
        new Entry(
            -1,
            now,
            readings.latestPerParameter(samplePointId, since),
            evaluations.latest(samplePointId, since),
            levels.of(samplePointId, now)),
        diagnosis);
  }

  /** A sample point as the board shows it. */
  record Shown(String id, String name, String cycleLocation, String treatmentRegime) {}

  /**
   * The states of a plant's points for the board, at {@code now}. Each point's latest readings and
   * evaluation are reused while its generation is unchanged and none of them has left the
   * look-back; the others are read afresh, all in two queries. The levels are kept up to date
   * incrementally ({@link LevelWindows}) and are those at {@code now}.
   */
  List<State> board(
      Freshness freshness,
      List<Shown> shown,
      Instant now,
      Map<String, org.kwanta.service.diagnosis.DiagnosisService.PointDiagnosis> diagnoses,
      ServerTiming timing) {
    List<String> ids = shown.stream().map(Shown::id).toList();
    Map<String, List<CurrentLevels.LevelState>> levelsByPoint =
        windows.levels(
            freshness.plantId(), ids, freshness.generations(), freshness.limitsStamp(), now);
    timing.lap("levels");
    Instant since = now.minus(lookBack);
    Map<String, Entry> entries = new java.util.HashMap<>();
    List<String> stale = new ArrayList<>();
    for (String id : ids) {
      String key = freshness.plantId() + "/" + id;
      lastAsked.put(key, now);
      Entry e = cache.get(key);
      if (e == null
          || e.generation() != freshness.generations().getOrDefault(id, 0L)
          || now.isBefore(e.asOf())
          || e.oldest().isBefore(since)) {
        stale.add(id);
      } else {
        entries.put(id, e);
      }
    }
    if (!stale.isEmpty()) {
      Map<String, List<StoredReading>> latest = readings.latestPerParameter(stale, since);
      Map<String, Evaluations.Stored> evaluated = evaluations.latest(stale, since);
      for (String id : stale) {
        Entry e =
            new Entry(
                freshness.generations().getOrDefault(id, 0L),
                now,
                latest.getOrDefault(id, List.of()),
                Optional.ofNullable(evaluated.get(id)),
                List.of());
        cache.put(freshness.plantId() + "/" + id, e);
        entries.put(id, e);
      }
    }
    timing.lap("latest");
    List<State> out = new ArrayList<>(shown.size());
    for (Shown p : shown) {
      Entry e = entries.get(p.id());
      out.add(
          state(
              p.id(),
              p.name(),
              p.cycleLocation(),
              p.treatmentRegime(),
              now,
              new Entry(
                  e.generation(),
                  now,
                  e.latest(),
                  e.evaluation(),
                  levelsByPoint.getOrDefault(p.id(), List.of())),
              diagnoses.get(p.id())));
    }
    timing.lap("states");
    return out;
  }

  /** Drops the entries of points the board has not asked for in {@link #UNUSED}. */
  @Scheduled(fixedDelay = 60_000, initialDelay = 60_000)
  void dropUnused() {
    Instant now = clock.instant();
    lastAsked.forEach(
        (key, asked) -> {
          if (Duration.between(asked, now).compareTo(UNUSED) > 0) {
            lastAsked.remove(key);
            cache.remove(key);
          }
        });
  }

  private static State state(
      String samplePointId,
      String name,
      String cycleLocation,
      String regime,
      Instant now,
      Entry entry,
      org.kwanta.service.diagnosis.DiagnosisService.PointDiagnosis diagnosis) {
    List<Latest> latest =
        entry.latest().stream()
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
        entry
            .evaluation()
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
        entry.levels(),
        entry.asOf(),
        evaluation,
        diagnosis == null
            ? null
            : new Diagnosis(
                diagnosis.time(),
                org.kwanta.service.diagnosis.FindingOut.of(diagnosis.findings())));
  }
}
