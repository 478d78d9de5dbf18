package org.kwanta.model.evaluation;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.Instant;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The time helpers of the trend and pH checks against their plain definitions: the gap equals
 * |Duration.between(a, b).toMillis()| (the JDK's own definition) on seeded random instants
 * (sub-millisecond and negative differences, both orders, spans beyond the nanosecond range of a
 * long), and the early-stopping nearest-reading scan picks what the full scan picks.
 */
class ChecksGapTest {

  @Test
  void gapEqualsTheAbsoluteDurationInMillis() {
    Random r = new Random(7L);
    for (int i = 0; i < 20_000; i++) {
      long s = 1_741_946_400L + r.nextInt(1_000_000) - 500_000;
      Instant a = Instant.ofEpochSecond(s, r.nextInt(1_000_000_000));
      long span =
          switch (i % 4) {
            case 0 -> r.nextInt(3);
            case 1 -> r.nextInt(100_000);
            case 2 -> r.nextLong() % 20_000_000_000L;
            default -> 0;
          };
      Instant b = Instant.ofEpochSecond(s + span, r.nextInt(1_000_000_000));
      long expected = Math.abs(Duration.between(a, b).toMillis());
      assertThat(Checks.gapMillis(a, b)).as("%s .. %s", a, b).isEqualTo(expected);
      assertThat(Checks.gapMillis(b, a)).as("%s .. %s", b, a).isEqualTo(expected);
    }
  }

  /**
   * On time-ordered readings (with repeated and equidistant times) the early-stopping scan picks
   * the same reading as the full scan.
   */
  @Test
  void sortedScanPicksTheSameReadingAsTheFullScan() {
    Random r = new Random(11L);
    Instant t0 = Instant.parse("2025-03-14T08:00:00Z");
    for (int round = 0; round < 500; round++) {
      java.util.List<Reading> h = new java.util.ArrayList<>();
      Instant t = t0;
      for (int i = 0; i < 1 + r.nextInt(30); i++) {
        t = t.plusMillis(r.nextInt(3) == 0 ? 0 : 1 + r.nextInt(600_000));
        h.add(Reading.raw(t, i, 298.15));
      }
      assertThat(Checks.isSorted(h)).isTrue();
      for (int k = 0; k < 20; k++) {
        Instant q = t0.plusMillis(r.nextInt(20_000_000) - 1_000_000);
        assertThat(Checks.nearest(h, q, true)).isSameAs(Checks.nearest(h, q, false));
      }
      for (Reading x : h) {
        Instant q = x.time().plusMillis(r.nextInt(3) - 1);
        assertThat(Checks.nearest(h, q, true)).isSameAs(Checks.nearest(h, q, false));
      }
    }
  }

  /**
   * The search from a start index picks what the full scan picks, from every start, on time-ordered
   * readings with repeated, sub-millisecond and equidistant times; and the cursor over a series of
   * times, increasing or not, picks what the full scan picks at each.
   */
  @Test
  void searchFromAnyStartPicksTheSameReadingAsTheFullScan() {
    Random r = new Random(13L);
    Instant t0 = Instant.parse("2025-03-14T08:00:00Z");
    for (int round = 0; round < 500; round++) {
      java.util.List<Reading> h = new java.util.ArrayList<>();
      Instant t = t0;
      for (int i = 0; i < 1 + r.nextInt(30); i++) {
        long nanos =
            switch (r.nextInt(4)) {
              case 0 -> 0;
              case 1 -> r.nextInt(2_000_000);
              default -> 1_000_000L * (1 + r.nextInt(600_000));
            };
        t = t.plusNanos(nanos);
        h.add(Reading.raw(t, i, 298.15));
      }
      java.util.List<Instant> queries = new java.util.ArrayList<>();
      for (int k = 0; k < 20; k++) {
        queries.add(t0.plusNanos(r.nextLong(20_000_000_000_000L) - 1_000_000_000_000L));
      }
      for (Reading x : h) {
        queries.add(x.time().plusNanos(r.nextInt(3_000_000) - 1_500_000));
      }
      for (Instant q : queries) {
        Reading full = Checks.nearest(h, q, false);
        for (int from = -1; from <= h.size(); from++) {
          assertThat(h.get(Checks.nearestIndex(h, q, from))).isSameAs(full);
        }
      }
      Checks.NearestReadings cursor = new Checks.NearestReadings(h);
      for (Instant q : queries) {
        assertThat(cursor.at(q)).isSameAs(Checks.nearest(h, q, false));
      }
      queries.sort(null);
      Checks.NearestReadings increasing = new Checks.NearestReadings(h);
      for (Instant q : queries) {
        assertThat(increasing.at(q)).isSameAs(Checks.nearest(h, q, false));
      }
    }
  }
}
