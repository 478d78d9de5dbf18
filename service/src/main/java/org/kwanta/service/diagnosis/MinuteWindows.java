package org.kwanta.service.diagnosis;

import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.kwanta.model.diagnosis.Minute;
import org.kwanta.service.ingest.WriteLog;
import org.springframework.stereotype.Component;

/**
 * The minute series of a plant's points over the current diagnosis' look-back, kept up to date
 * incrementally: the same minutes as {@link MinuteSeries#load} reading afresh. Per plant it keeps
 * each point's minutes and the generation (migration V31) they were read at; on each call it
 * re-reads, for all the plant's points in two queries, only from the earliest minute that may have
 * changed: the first minute this instance's ingest wrote readings or evaluations in since that
 * generation ({@link WriteLog}), or the last minute read before (it may have been read in part, and
 * readings ahead of the clock come into range). A generation step the log does not know re-reads
 * the point's whole range.
 *
 * <p>Memory: about 80 bytes a minute, 1,575 minutes (the default look-back of 26 h 15 min) and an
 * hour a point, about 130 kB a point; at most {@link #MAX_PLANTS} plants, the least recently asked
 * dropped first.
 */
@Component
class MinuteWindows {

  /** Plants kept; the least recently asked is dropped beyond this. */
  static final int MAX_PLANTS = 16;

  private final MinuteSeries minutes;
  private final WriteLog writes;

  /** Guarded by this. */
  private final LinkedHashMap<String, PlantMinutes> plants = new LinkedHashMap<>(16, 0.75f, true);

  MinuteWindows(MinuteSeries minutes, WriteLog writes) {
    this.minutes = minutes;
    this.writes = writes;
  }

  /** A plant's minutes by point, read up to (not including) {@code readTo}. */
  private static final class PlantMinutes {
    final Map<String, Long> generations = new HashMap<>();
    final Map<String, List<Minute>> series = new HashMap<>();
    Instant from;
    Instant readTo;
  }

  /**
   * The minutes of the given points in [from, to), time order, as {@link MinuteSeries#load} reads
   * them.
   *
   * @param generations each point's generation, read before this call
   */
  synchronized Map<String, List<Minute>> load(
      String plantId,
      List<String> points,
      Map<String, Long> generations,
      Instant from,
      Instant to) {
    PlantMinutes p = plants.get(plantId);
    boolean whole =
        p == null
            || from.isBefore(p.from)
            || to.isBefore(p.readTo)
            || !p.series.keySet().containsAll(points);
    Instant reread = whole ? from : minute(p.readTo);
    if (!whole) {
      for (String id : points) {
        Optional<WriteLog.Change> change =
            writes.earliestChange(
                id, p.generations.getOrDefault(id, 0L), generations.getOrDefault(id, 0L));
        if (change.isEmpty()) {
          whole = true;
          break;
        }
        if (change.get().any() && change.get().from().isBefore(reread)) {
          reread = minute(change.get().from());
        }
      }
    }
    boolean anew = whole || reread.isBefore(from);
    if (anew) {
      p = new PlantMinutes();
      reread = from;
    }
    // read before the plant's entry is kept: a read that fails (the database gone mid-request)
    // leaves the entry as it was, never one without its minutes
    Map<String, List<Minute>> fresh = minutes.load(points, reread, to);
    if (anew) {
      plants.put(plantId, p);
      while (plants.size() > MAX_PLANTS) {
        plants.remove(plants.keySet().iterator().next());
      }
    }
    Instant keepFrom = reread;
    for (String id : points) {
      List<Minute> kept = p.series.getOrDefault(id, List.of());
      List<Minute> merged = new ArrayList<>(kept.size() + 8);
      for (Minute m : kept) {
        if (!m.time().isBefore(from) && m.time().isBefore(keepFrom)) {
          merged.add(m);
        }
      }
      merged.addAll(fresh.getOrDefault(id, List.of()));
      p.series.put(id, merged);
      p.generations.put(id, generations.getOrDefault(id, 0L));
    }
    p.from = from;
    p.readTo = to;
    Map<String, List<Minute>> out = new HashMap<>();
    for (String id : points) {
      out.put(id, List.copyOf(p.series.get(id)));
    }
    return out;
  }

  private static Instant minute(Instant t) {
    return t.truncatedTo(ChronoUnit.MINUTES);
  }
}
