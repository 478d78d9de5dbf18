package org.kwanta.service.ingest;

import java.time.Instant;
import java.util.ArrayList;
import java.util.Collection;
import java.util.Comparator;
import java.util.HashMap;
import java.util.Iterator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeSet;
import org.kwanta.service.ingest.EvaluationRunner.StoredReading;

/**
 * The last hours of readings of recently ingested sample points, in memory, so that evaluating a
 * new batch does not read the point's history back from PostgreSQL. A copy of a point holds
 * <em>every</em> stored reading of the point from {@link PointHistory#coveredFrom()} on, as of
 * generation {@link PointHistory#generation()} of the point's {@code reading_head} row; the ingest
 * uses it only when the row still has that generation (see migration V31), so writes by another
 * instance or by hand are never missed.
 *
 * <p>Not thread-safe: only the ingest's combining thread (one at a time) touches it. Bounded by a
 * total number of readings; the least recently used points are dropped first.
 */
final class RecentReadings {

  /** Time, then parameter code: the order the evaluation runner expects. */
  static final Comparator<StoredReading> ORDER =
      (a, b) -> {
        int c = a.time().compareTo(b.time());
        return c != 0 ? c : a.parameter().compareTo(b.parameter());
      };

  private final int maxReadings;
  private final long bucketMillis;
  private final LinkedHashMap<String, PointHistory> points = new LinkedHashMap<>(64, 0.75f, true);
  private long total;

  RecentReadings(int maxReadings, java.time.Duration historyWindow) {
    this.maxReadings = maxReadings;
    this.bucketMillis = EvaluationRunner.bucketMillis(historyWindow);
  }

  /** The copy of a point, if it is at the given generation; otherwise none (and it is dropped). */
  PointHistory current(String samplePointId, long generation) {
    PointHistory h = points.get(samplePointId);
    if (h == null) {
      return null;
    }
    if (h.generation != generation) {
      forget(samplePointId);
      return null;
    }
    return h;
  }

  /** Starts a copy from readings loaded from the database (all those at or after {@code from}). */
  PointHistory start(String samplePointId, Instant from, Collection<StoredReading> loaded) {
    forget(samplePointId);
    PointHistory h = new PointHistory(from, bucketMillis);
    for (StoredReading r : loaded) {
      h.put(r);
    }
    points.put(samplePointId, h);
    h.accounted = h.readings.size();
    total += h.accounted;
    return h;
  }

  /**
   * A history of a point that is not kept: every stored reading after {@code from} (a backfill the
   * copy does not reach, or a point without a copy). The same structure and the same rule as a kept
   * copy, so a cache miss is only a cold history, never a second way of evaluating.
   */
  PointHistory cold(Instant from, Collection<StoredReading> loaded) {
    PointHistory h = new PointHistory(from, bucketMillis);
    for (StoredReading r : loaded) {
      h.put(r);
    }
    return h;
  }

  /** Drops a point's copy (after a failed transaction, or when it cannot be kept current). */
  void forget(String samplePointId) {
    PointHistory h = points.remove(samplePointId);
    if (h != null) {
      total -= h.accounted;
    }
  }

  /** Drops every copy. */
  void clear() {
    points.clear();
    total = 0;
  }

  /**
   * After a commit: stamps the copy with its new generation, drops readings before {@code
   * keepFrom}, and evicts the least recently used points while over the size bound.
   */
  void committed(String samplePointId, long generation, Instant keepFrom) {
    PointHistory h = points.get(samplePointId);
    if (h == null) {
      return;
    }
    h.generation = generation;
    h.trim(keepFrom);
    total += h.readings.size() - h.accounted;
    h.accounted = h.readings.size();
  }

  /** Evicts least recently used points until the total is within bounds. */
  void evict() {
    Iterator<Map.Entry<String, PointHistory>> it = points.entrySet().iterator();
    while (total > maxReadings && it.hasNext()) {
      total -= it.next().getValue().accounted;
      it.remove();
    }
  }

  /** A key for searching the ordered readings (parameter "" sorts first, "\uffff" last). */
  private static StoredReading probe(String parameter, Instant time) {
    return new StoredReading(parameter, time, 0, (short) 0, 0, false);
  }

  /** The copy of one sample point. */
  static final class PointHistory {
    private long generation = Long.MIN_VALUE;
    private Instant coveredFrom;
    private final TreeSet<StoredReading> readings = new TreeSet<>(ORDER);
    private final long bucketMillis;

    /**
     * Per parameter that evaluations use, per history bucket, the latest good or uncertain reading:
     * what an evaluation sees of the older part of its window.
     */
    private final Map<String, java.util.TreeMap<Long, StoredReading>> latestGood = new HashMap<>();

    private int accounted;

    private PointHistory(Instant coveredFrom, long bucketMillis) {
      this.coveredFrom = coveredFrom;
      this.bucketMillis = bucketMillis;
    }

    long generation() {
      return generation;
    }

    /** Every stored reading of the point at or after this time is held. */
    Instant coveredFrom() {
      return coveredFrom;
    }

    /** The held reading with the same parameter and time, or null. */
    StoredReading find(String parameter, Instant time) {
      StoredReading probe = probe(parameter, time);
      StoredReading found = readings.ceiling(probe);
      return found != null && found.time().equals(time) && found.parameter().equals(parameter)
          ? found
          : null;
    }

    /** Whether a held reading at exactly this time has a parameter the filter accepts. */
    boolean anyAt(Instant time, java.util.function.Predicate<String> parameter) {
      for (StoredReading r : readings.subSet(probe("", time), true, probe("\uffff", time), true)) {
        if (parameter.test(r.parameter())) {
          return true;
        }
      }
      return false;
    }

    /** Adds or replaces a reading. */
    void put(StoredReading r) {
      if (!readings.add(r)) {
        readings.remove(r);
        readings.add(r);
      }
      if (!EvaluationRunner.readByEvaluation(r.parameter())) {
        return;
      }
      long b = EvaluationRunner.bucketOf(r.time(), bucketMillis);
      java.util.TreeMap<Long, StoredReading> buckets =
          latestGood.computeIfAbsent(r.parameter(), k -> new java.util.TreeMap<>());
      StoredReading latest = buckets.get(b);
      if (r.quality() < 2 && (latest == null || !r.time().isBefore(latest.time()))) {
        buckets.put(b, r);
      } else if (latest != null && latest.time().equals(r.time())) {
        // the bucket's latest good reading turned bad: look for the one before it
        buckets.remove(b);
        for (StoredReading x :
            readings
                .subSet(probe("", Instant.ofEpochMilli(b * bucketMillis)), true, r, false)
                .descendingSet()) {
          if (x.parameter().equals(r.parameter()) && x.quality() < 2) {
            buckets.put(b, x);
            break;
          }
        }
      }
    }

    private void trim(Instant keepFrom) {
      if (keepFrom.isAfter(coveredFrom)) {
        readings.headSet(probe("", keepFrom), false).clear();
        long first = EvaluationRunner.bucketOf(keepFrom, bucketMillis);
        for (java.util.TreeMap<Long, StoredReading> buckets : latestGood.values()) {
          buckets.headMap(first, false).clear();
          java.util.Map.Entry<Long, StoredReading> partial = buckets.firstEntry();
          if (partial != null
              && partial.getKey() == first
              && partial.getValue().time().isBefore(keepFrom)) {
            buckets.remove(first);
          }
        }
        coveredFrom = keepFrom;
      }
    }

    /**
     * What an evaluation of [from, to] needs, in the shape {@link EvaluationRunner#run} takes:
     * before the history bucket of {@code from} (back to {@code from − window}), only the latest
     * good or uncertain reading of each parameter per bucket; from that bucket to {@code to}, every
     * reading.
     */
    List<StoredReading> forEvaluation(Instant from, Instant to, java.time.Duration window) {
      long bucketMillis = EvaluationRunner.bucketMillis(window);
      Instant rawFrom =
          Instant.ofEpochMilli(EvaluationRunner.bucketOf(from, bucketMillis) * bucketMillis);
      Instant oldFrom = from.minus(window);
      List<StoredReading> out = new ArrayList<>();
      if (oldFrom.isBefore(rawFrom)) {
        long firstBucket = EvaluationRunner.bucketOf(oldFrom, bucketMillis);
        long rawBucket = EvaluationRunner.bucketOf(rawFrom, bucketMillis);
        for (java.util.TreeMap<Long, StoredReading> buckets : latestGood.values()) {
          for (StoredReading r : buckets.subMap(firstBucket, true, rawBucket, false).values()) {
            if (r.time().isAfter(oldFrom)) {
              out.add(r);
            }
          }
        }
        out.sort(ORDER);
      }
      // one pass (addAll of a subset view counts it first, walking it twice)
      for (StoredReading r : readings.subSet(probe("", rawFrom), true, probe("\uffff", to), true)) {
        out.add(r);
      }
      return out;
    }
  }
}
