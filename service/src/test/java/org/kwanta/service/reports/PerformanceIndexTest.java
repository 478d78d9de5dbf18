package org.kwanta.service.reports;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.Arrays;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.kwanta.model.limits.Level;

/** Kwanta's own index (docs/report.md): the worked example and the edge cases, by hand. */
class PerformanceIndexTest {

  /**
   * docs/report.md worked example: AL1 4 h, AL2 2 h, NORMAL 654 h; availability 2600/2640. By hand:
   * P = 2/660, S = 658/660, A = 650/660, I = 100 · 656.4 / 660 = 99.4545…
   */
  @Test
  void matchesTheWorkedExample() {
    Map<Level, Double> hours = Map.of(Level.NORMAL, 654.0, Level.AL1, 4.0, Level.AL2, 2.0);
    assertThat(PerformanceIndex.penalty(hours)).isCloseTo(2.0 / 660, within(1e-15));
    PerformanceIndex.Result r = PerformanceIndex.of(List.of(hours), List.of(2600.0 / 2640));
    assertThat(r.chemistryScore()).isCloseTo(658.0 / 660, within(1e-15));
    assertThat(r.availabilityScore()).isCloseTo(650.0 / 660, within(1e-15));
    assertThat(r.index()).isCloseTo(100 * 656.4 / 660, within(1e-12));
  }

  /** All time at AL3: S = 0; no instruments: A = 1, so I = 100 · 0.2 = 20. */
  @Test
  void allTimeAtAl3LeavesOnlyTheAvailabilityShare() {
    PerformanceIndex.Result r =
        PerformanceIndex.of(List.of(Map.of(Level.AL3, 10.0)), Arrays.asList((Double) null));
    assertThat(r.chemistryScore()).isZero();
    assertThat(r.instruments()).isZero();
    assertThat(r.index()).isCloseTo(20.0, within(1e-12));
  }

  /** Nothing to judge: S = A = 1, I = 100, and the counts say there was nothing. */
  @Test
  void nothingToJudge() {
    PerformanceIndex.Result r = PerformanceIndex.of(List.of(Map.of()), List.of());
    assertThat(r.index()).isEqualTo(100.0);
    assertThat(r.channels()).isZero();
  }
}
