package org.kwanta.service.queries;

import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeMap;
import org.kwanta.model.Parameter;
import org.kwanta.model.limits.Classification;
import org.kwanta.model.limits.Classifier;
import org.kwanta.service.ingest.ReadingHistory;
import org.kwanta.service.ingest.WriteLog;
import org.kwanta.service.limits.ExcursionFinder;
import org.kwanta.service.limits.Limits;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.stereotype.Component;

/**
 * The board's current levels, kept up to date incrementally and exactly: the same answer as {@link
 * CurrentLevels#of} reading afresh at the same time.
 *
 * <p>Per sample point it keeps the judged readings of the level window ({@link JudgedWindow}) of
 * every parameter with limits, and the generation of the point (migration V31) they were read at.
 * On each request it re-reads, for all the plant's points in one query, only what may have changed:
 * from the earliest time this instance's ingest wrote since that generation ({@link WriteLog}:
 * readings and the evaluations that judge them, so corrections, late readings and re-evaluations
 * that change an older reading's doubt are all read again), and everything after the previous read
 * (readings ahead of the clock come into the window as it moves). A generation step the log does
 * not know (another instance, SQL by hand, retention) re-reads the point's whole window. Then the
 * in-memory {@link Classifier} runs on the window; the result is reused while neither the window's
 * readings nor the limits in force changed.
 *
 * <p>Memory is bounded by {@code kwanta.queries.level-cache-readings} readings in all (default 4
 * million, about 70 MB at 17 bytes a reading, 25 for pH): the least recently asked points are
 * dropped first and read afresh when asked again.
 */
@Component
class LevelWindows {

  private final ReadingHistory readings;
  private final WriteLog writes;
  private final Limits limits;
  private final Duration window;
  private final long maxReadings;

  /** Points by plant/id, least recently asked first. Guarded by this. */
  private final LinkedHashMap<String, PointWindow> points = new LinkedHashMap<>(64, 0.75f, true);

  /** Limits in force per plant, with the stamp they were read at. Guarded by this. */
  private final Map<String, PlantLimits> plantLimits = new HashMap<>();

  private long total;

  LevelWindows(
      ReadingHistory readings,
      WriteLog writes,
      Limits limits,
      @Value("${kwanta.metrics.level-window:P1D}") Duration window,
      @Value("${kwanta.queries.level-cache-readings:4000000}") long maxReadings) {
    this.readings = readings;
    this.writes = writes;
    this.limits = limits;
    this.window = window;
    this.maxReadings = maxReadings;
  }

  /** The limits in force at each point of a plant, as of a limits stamp. */
  private record PlantLimits(String stamp, Map<String, List<Limits.Effective>> byPoint) {}

  /** One point's windows, by parameter code, and what they were read at. */
  private static final class PointWindow {
    long generation;
    Instant readTo;
    Instant coveredFrom;
    Set<String> parameters = Set.of();
    final Map<String, JudgedWindow> series = new HashMap<>();
    final Map<String, Memo> levels = new HashMap<>();

    long readings() {
      long n = 0;
      for (JudgedWindow w : series.values()) {
        n += w.size();
      }
      return n;
    }
  }

  /** A level computed on a window's contents against one profile. */
  private record Memo(long version, Limits.Effective effective, CurrentLevels.LevelState level) {}

  /**
   * The current levels of a plant's points at {@code now}, by point id (points without levels map
   * to an empty list).
   *
   * @param generations each point's generation, read before this call (an older one only makes the
   *     next call read more)
   * @param limitsStamp the plant's limits fingerprint ({@link Limits#stamp})
   */
  synchronized Map<String, List<CurrentLevels.LevelState>> levels(
      String plantId,
      List<String> pointIds,
      Map<String, Long> generations,
      String limitsStamp,
      Instant now) {
    Map<String, List<Limits.Effective>> inForce = inForce(plantId, limitsStamp);
    Instant from = now.minus(window);
    long fromMicros = JudgedWindow.micros(from);
    Map<String, Instant> toRead = new TreeMap<>();
    Set<String> parameters = new HashSet<>();
    Map<String, PointWindow> asked = new LinkedHashMap<>();
    for (String id : pointIds) {
      List<Limits.Effective> effective = inForce.getOrDefault(id, List.of());
      Set<String> wanted = new HashSet<>();
      effective.forEach(e -> wanted.add(e.profile().key().parameter().code()));
      String key = plantId + "/" + id;
      PointWindow p = points.get(key);
      long generation = generations.getOrDefault(id, 0L);
      Instant readFrom = p == null ? null : readFrom(id, p, generation, from, now, wanted);
      if (readFrom == null) {
        if (p != null) {
          total -= p.readings();
        }
        p = new PointWindow();
        p.parameters = wanted;
        for (String c : wanted) {
          p.series.put(c, new JudgedWindow(Parameter.PH.code().equals(c)));
        }
        points.put(key, p);
        readFrom = from;
      }
      asked.put(id, p);
      if (wanted.isEmpty()) {
        p.generation = generation;
        p.readTo = now;
        p.coveredFrom = from;
        continue;
      }
      long readMicros = JudgedWindow.micros(readFrom);
      for (JudgedWindow w : p.series.values()) {
        total -= w.size();
        w.truncateFrom(readMicros);
        w.dropBefore(fromMicros);
        total += w.size();
      }
      p.generation = generation;
      p.readTo = now;
      p.coveredFrom = from;
      toRead.put(id, readFrom);
      parameters.addAll(wanted);
    }
    readings.judgedSince(
        toRead,
        parameters,
        now,
        (point, parameter, micros, value, inDoubt, calculated, phInDoubt) -> {
          JudgedWindow w = asked.get(point).series.get(parameter);
          if (w != null && micros >= fromMicros) {
            w.append(micros, value, inDoubt, calculated, phInDoubt);
            total++;
          }
        });
    Map<String, List<CurrentLevels.LevelState>> out = new HashMap<>();
    asked.forEach((id, p) -> out.put(id, levels(p, inForce.getOrDefault(id, List.of()))));
    evict(asked.size());
    return out;
  }

  /**
   * Where a point's windows must be read again from, or null when they must be read whole: never
   * read at this clock, a parameter with limits not held, or a generation step not in the log.
   */
  private Instant readFrom(
      String id, PointWindow p, long generation, Instant from, Instant now, Set<String> wanted) {
    if (now.isBefore(p.readTo)
        || from.isBefore(p.coveredFrom)
        || !p.parameters.containsAll(wanted)) {
      return null;
    }
    Optional<WriteLog.Change> change = writes.earliestChange(id, p.generation, generation);
    if (change.isEmpty()) {
      return null;
    }
    Instant readFrom = p.readTo;
    if (change.get().any() && change.get().from().isBefore(readFrom)) {
      readFrom = change.get().from();
    }
    return readFrom.isBefore(from) ? from : readFrom;
  }

  /** A point's levels from its windows, by parameter code; reused while nothing changed. */
  private static List<CurrentLevels.LevelState> levels(
      PointWindow p, List<Limits.Effective> effective) {
    List<CurrentLevels.LevelState> out = new ArrayList<>();
    for (Limits.Effective e : effective) {
      String code = e.profile().key().parameter().code();
      JudgedWindow w = p.series.get(code);
      if (w == null || w.size() == 0) {
        p.levels.remove(code);
        continue;
      }
      Memo m = p.levels.get(code);
      if (m == null || m.version() != w.version() || !m.effective().equals(e)) {
        m = new Memo(w.version(), e, level(e, w));
        p.levels.put(code, m);
      }
      out.add(m.level());
    }
    out.sort(Comparator.comparing(CurrentLevels.LevelState::parameter));
    return out;
  }

  private static CurrentLevels.LevelState level(Limits.Effective e, JudgedWindow w) {
    boolean phFallback = ExcursionFinder.usesCalculatedPhFallback(e.profile().key());
    List<Classification> classified = new Classifier(e.profile()).classify(w.samples(phFallback));
    return CurrentLevels.LevelState.of(e, classified.get(classified.size() - 1));
  }

  /** The limits in force at each point of a plant, read again when the stamp changes. */
  private Map<String, List<Limits.Effective>> inForce(String plantId, String stamp) {
    PlantLimits l = plantLimits.get(plantId);
    if (l == null || !l.stamp().equals(stamp)) {
      Map<String, List<Limits.Effective>> byPoint = new HashMap<>();
      for (Limits.Point point : limits.points(plantId, null)) {
        byPoint.put(point.id(), limits.inForce(point));
      }
      l = new PlantLimits(stamp, byPoint);
      plantLimits.put(plantId, l);
    }
    return l.byPoint();
  }

  /** Drops the least recently asked points beyond the bound (never those just asked). */
  private void evict(int justAsked) {
    var it = points.entrySet().iterator();
    int removable = points.size() - justAsked;
    while (total > maxReadings && removable-- > 0 && it.hasNext()) {
      total -= it.next().getValue().readings();
      it.remove();
    }
  }
}
