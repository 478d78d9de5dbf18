package org.kwanta.service.queries;

import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
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
  private final Limits limits;
  private final Duration lookBack;
  private final Clock clock;
  private final Map<String, Entry> cache = new ConcurrentHashMap<>();
  private final Map<String, Instant> lastAsked = new ConcurrentHashMap<>();

  /** Entries of points the board has not asked for this long are dropped, not refreshed. */
  static final Duration UNUSED = Duration.ofMinutes(5);

  /**
   * Longest time the board reuses a point's levels without new readings of it: the levels look back
   * a day, so while no reading arrives they change only as old values leave that window.
   */
  static final Duration CACHE_TIME = Duration.ofSeconds(30);

  States(
      ReadingHistory readings,
      Evaluations evaluations,
      CurrentLevels levels,
      Limits limits,
      Clock clock,
      @Value("${kwanta.queries.latest-look-back:P35D}") Duration lookBack) {
    this.readings = readings;
    this.evaluations = evaluations;
    this.levels = levels;
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

  /** The cached data of one point, with what it was built on. */
  private record Entry(
      long generation,
      String limitsStamp,
      Instant asOf,
      List<StoredReading> latest,
      Optional<Evaluations.Stored> evaluation,
      List<CurrentLevels.LevelState> levels) {}

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
    return state(
        samplePointId,
        name,
        cycleLocation,
        regime,
        now,
        load(samplePointId, now, -1, ""),
        diagnosis);
  }

  /**
   * A sample point's state for the board: its latest readings, latest evaluation and levels are
   * reused from an earlier request while the point has had no new reading, the plant's limits are
   * unchanged and the entry is younger than {@link #CACHE_TIME}; otherwise read afresh. The levels
   * are then those {@link CurrentLevels#of} gave at {@code levelsAsOf}; ages are always from now.
   */
  State cachedOf(
      Freshness freshness,
      String samplePointId,
      String name,
      String cycleLocation,
      String regime,
      Instant now,
      org.kwanta.service.diagnosis.DiagnosisService.PointDiagnosis diagnosis) {
    long generation = freshness.generations().getOrDefault(samplePointId, 0L);
    String key = freshness.plantId() + "/" + samplePointId;
    Entry e = cache.get(key);
    if (e == null
        || e.generation() != generation
        || !e.limitsStamp().equals(freshness.limitsStamp())
        || now.isBefore(e.asOf())
        || Duration.between(e.asOf(), now).compareTo(CACHE_TIME) >= 0) {
      e = load(samplePointId, now, generation, freshness.limitsStamp());
      cache.put(key, e);
    }
    lastAsked.put(key, now);
    return state(samplePointId, name, cycleLocation, regime, now, e, diagnosis);
  }

  /**
   * Re-reads, off the request path, the entries that would be older than {@link #CACHE_TIME} before
   * the next run, so that a board request rarely reads a point afresh unless the point has new
   * readings; entries not asked for in {@link #UNUSED} are dropped.
   */
  @Scheduled(fixedDelay = 10_000, initialDelay = 10_000)
  void refreshAgeing() {
    Instant now = clock.instant();
    lastAsked.forEach(
        (key, asked) -> {
          if (Duration.between(asked, now).compareTo(UNUSED) > 0) {
            lastAsked.remove(key);
            cache.remove(key);
          }
        });
    Map<String, Freshness> byPlant = new java.util.HashMap<>();
    cache.forEach(
        (key, e) -> {
          if (Duration.between(e.asOf(), now).compareTo(CACHE_TIME.minusSeconds(12)) < 0) {
            return;
          }
          String plantId = key.substring(0, key.indexOf('/'));
          String point = key.substring(key.indexOf('/') + 1);
          Freshness f = byPlant.computeIfAbsent(plantId, p -> freshness(p, now));
          cache.put(
              key, load(point, now, f.generations().getOrDefault(point, 0L), f.limitsStamp()));
        });
  }

  private Entry load(String samplePointId, Instant now, long generation, String limitsStamp) {
    Instant since = now.minus(lookBack);
    return new Entry(
        generation,
        limitsStamp,
        now,
        readings.latestPerParameter(samplePointId, since),
        evaluations.latest(samplePointId, since),
        levels.of(samplePointId, now));
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
