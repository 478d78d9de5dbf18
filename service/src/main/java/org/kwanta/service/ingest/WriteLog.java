package org.kwanta.service.ingest;

import java.time.Instant;
import java.util.ArrayDeque;
import java.util.Iterator;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ConcurrentHashMap;

/**
 * What this instance's ingest wrote, per sample point: each committed transaction's step of the
 * point's generation (migration V31) and the earliest time at which it wrote readings or
 * evaluations. A reader that built something on a point at generation {@code g} and now sees
 * generation {@code G} asks {@link #earliestChange} for the earliest time written in between; it
 * has to re-read only from there. A step not in the log (written by another instance, by hand, by a
 * migration, or older than the log keeps) makes the answer unknown, and the reader re-reads all.
 *
 * <p>An ingest transaction that changes readings from time {@code t} on recomputes evaluations only
 * at times at or after {@code t} (up to the history window later), so {@code t} is also the
 * earliest evaluation it writes.
 *
 * <p>Bounded: the last {@link #STEPS_PER_POINT} steps per point, and points are dropped when there
 * are more than {@link #MAX_POINTS} (a reader then re-reads all), about 100 bytes a step.
 */
@org.springframework.stereotype.Component
public class WriteLog {

  /** Steps kept per point: a reader that falls further behind re-reads all. */
  static final int STEPS_PER_POINT = 64;

  /** Points kept; beyond this the log is cleared (readers re-read all once). */
  static final int MAX_POINTS = 20_000;

  /**
   * One committed transaction's step of a point.
   *
   * @param from the earliest time written (readings and evaluations), null when nothing changed
   */
  private record Step(long previous, long generation, Instant from) {}

  private final Map<String, ArrayDeque<Step>> steps = new ConcurrentHashMap<>();

  /** The result of {@link #earliestChange}: nothing written, or the earliest time written. */
  public record Change(Instant from) {

    /** No reading or evaluation written in between. */
    public static final Change NONE = new Change(null);

    /** Whether anything was written. */
    public boolean any() {
      return from != null;
    }
  }

  /**
   * A point's step in an ingest transaction.
   *
   * @param from the earliest time written, null when the transaction changed nothing of the point
   */
  record Written(String samplePointId, long previous, long generation, Instant from) {}

  /** Records the steps of a committed transaction. */
  void committed(java.util.Collection<Written> written) {
    written.forEach(w -> committed(w.samplePointId(), w.previous(), w.generation(), w.from()));
  }

  private void committed(String samplePointId, long previous, long generation, Instant from) {
    if (steps.size() >= MAX_POINTS && !steps.containsKey(samplePointId)) {
      steps.clear();
    }
    ArrayDeque<Step> q = steps.computeIfAbsent(samplePointId, k -> new ArrayDeque<>());
    synchronized (q) {
      q.addLast(new Step(previous, generation, from));
      while (q.size() > STEPS_PER_POINT) {
        q.removeFirst();
      }
    }
  }

  /**
   * The earliest time written to a point between two of its generations: {@link Change#NONE} when
   * they are equal or the steps between them wrote nothing; empty when a step between them is not
   * in the log (the reader re-reads everything).
   */
  public Optional<Change> earliestChange(String samplePointId, long since, long now) {
    if (since == now) {
      return Optional.of(Change.NONE);
    }
    ArrayDeque<Step> q = steps.get(samplePointId);
    if (q == null) {
      return Optional.empty();
    }
    synchronized (q) {
      Instant from = null;
      long at = since;
      boolean started = false;
      for (Iterator<Step> it = q.iterator(); it.hasNext(); ) {
        Step s = it.next();
        if (!started) {
          if (s.previous() != since) {
            continue;
          }
          started = true;
        } else if (s.previous() != at) {
          return Optional.empty();
        }
        at = s.generation();
        if (s.from() != null && (from == null || s.from().isBefore(from))) {
          from = s.from();
        }
        if (at == now) {
          return Optional.of(new Change(from));
        }
      }
      return Optional.empty();
    }
  }
}
