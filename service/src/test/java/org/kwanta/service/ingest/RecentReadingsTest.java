package org.kwanta.service.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.kwanta.service.ingest.EvaluationRunner.StoredReading;

/**
 * The in-memory history of a point, without a database: whatever order readings arrive in, it hands
 * the evaluation exactly what the rule says (before the bucket of {@code from}, the latest good or
 * uncertain reading of each parameter per history bucket; from there on, every reading).
 */
class RecentReadingsTest {

  private static final Duration WINDOW = Duration.ofMinutes(60);
  private static final Instant T0 = Instant.parse("2026-01-05T08:00:00Z");
  private static final String[] PARAMETERS = {
    "specific_conductivity",
    "cation_conductivity",
    "ph",
    "sample_temperature",
    "silica",
    "drum_pressure"
  };

  /** The rule, written plainly over a full list (the oracle). */
  private static List<StoredReading> rule(List<StoredReading> all, Instant from, Instant to) {
    long bucketMillis = EvaluationRunner.bucketMillis(WINDOW);
    long fromBucket = EvaluationRunner.bucketOf(from, bucketMillis);
    Instant rawFrom = Instant.ofEpochMilli(fromBucket * bucketMillis);
    Instant oldFrom = from.minus(WINDOW);
    List<StoredReading> out = new ArrayList<>();
    java.util.Map<String, StoredReading> latest = new java.util.TreeMap<>();
    for (StoredReading r : all) {
      boolean old = r.time().isAfter(oldFrom) && r.time().isBefore(rawFrom);
      if (old && r.quality() < 2 && EvaluationRunner.readByEvaluation(r.parameter())) {
        String key = r.parameter() + '|' + EvaluationRunner.bucketOf(r.time(), bucketMillis);
        StoredReading was = latest.get(key);
        if (was == null || r.time().isAfter(was.time())) {
          latest.put(key, r);
        }
      }
    }
    out.addAll(latest.values());
    out.sort(RecentReadings.ORDER);
    for (StoredReading r : all) {
      if (!r.time().isBefore(rawFrom) && !r.time().isAfter(to)) {
        out.add(r);
      }
    }
    out.sort(RecentReadings.ORDER);
    return out;
  }

  private static List<StoredReading> series(Random random, int n) {
    List<StoredReading> out = new ArrayList<>();
    for (int i = 0; i < n; i++) {
      Instant t = T0.plusSeconds(20L * i);
      for (String p : PARAMETERS) {
        if (random.nextInt(4) > 0) {
          short quality = (short) (random.nextInt(6) == 0 ? 2 : random.nextInt(2));
          out.add(new StoredReading(p, t, random.nextDouble(), quality, Double.NaN, false));
        }
      }
    }
    return out;
  }

  @ParameterizedTest
  @ValueSource(longs = {1, 2, 3, 20260105})
  void anyArrivalOrderGivesWhatTheRuleSays(long seed) {
    Random random = new Random(seed);
    List<StoredReading> all = series(random, 600);
    List<StoredReading> shuffled = new ArrayList<>(all);
    Collections.shuffle(shuffled, random);
    RecentReadings recent = new RecentReadings(1_000_000, WINDOW);
    RecentReadings.PointHistory h = recent.start("P", T0.minusSeconds(1), List.of());
    shuffled.forEach(h::put);
    all.sort(RecentReadings.ORDER);
    for (int k = 0; k < 20; k++) {
      Instant from = T0.plusSeconds(3600 + random.nextInt(8000));
      Instant to = from.plusSeconds(random.nextInt(4000));
      assertThat(h.forEvaluation(from, to, WINDOW)).isEqualTo(rule(all, from, to));
    }
  }

  @Test
  void aBucketsLatestTurningBadFallsBackToTheOneBefore() {
    RecentReadings recent = new RecentReadings(1000, WINDOW);
    RecentReadings.PointHistory h = recent.start("P", T0, List.of());
    StoredReading first = new StoredReading("ph", T0.plusSeconds(10), 9.1, (short) 0, 25, true);
    StoredReading second = new StoredReading("ph", T0.plusSeconds(20), 9.2, (short) 0, 25, true);
    h.put(first);
    h.put(second);
    h.put(new StoredReading("ph", T0.plusSeconds(20), 9.2, (short) 2, 25, true));
    Instant from = T0.plus(WINDOW.dividedBy(2));
    assertThat(h.forEvaluation(from, from, WINDOW)).containsExactly(first);
  }

  @Test
  void aCopyAtAnotherGenerationIsDroppedAndTheBoundHolds() {
    RecentReadings recent = new RecentReadings(3, WINDOW);
    RecentReadings.PointHistory a =
        recent.start("A", T0, List.of(new StoredReading("ph", T0, 9, (short) 0, 25, true)));
    recent.committed("A", 7, T0);
    assertThat(recent.current("A", 7)).isSameAs(a);
    assertThat(recent.current("A", 8)).isNull();
    assertThat(recent.current("A", 7)).isNull();
    List<StoredReading> four = new ArrayList<>();
    for (int i = 0; i < 4; i++) {
      four.add(new StoredReading("ph", T0.plusSeconds(i), 9, (short) 0, 25, true));
    }
    recent.start("B", T0, four);
    recent.evict();
    assertThat(recent.current("B", Long.MIN_VALUE)).isNull();
  }
}
