package org.kwanta.model.limits;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Monthly hours counted only inside given windows (the block's in-service time). The series is
 * invented; it crosses the recalled condensate cation conductivity thresholds of {@link Profiles}
 * (AL1 &gt; 0.2, AL2 &gt; 0.35 µS/cm, from memory — verify).
 */
class InServiceHoursTest {

  private static final Instant T0 = Instant.parse("2026-04-12T00:00:00Z");
  private static final LimitProfile CPD_CACE =
      Profiles.cationConductivity(CycleLocation.CONDENSATE, 0.01, Duration.ofMinutes(5));

  /**
   * 0.5 µS/cm (AL2) for 4 h from T0, then 0.08 to T0 + 12 h, one sample per 5 min. Counted window
   * T0 + 6 h to T0 + 12 h: by hand AL2 0 h, NORMAL 6 h; all time: AL2 4 h, NORMAL 8 h.
   */
  @Test
  void alertTimeOutsideTheCountedWindowsIsLeftOut() {
    List<Sample> samples = new ArrayList<>();
    for (int m = 0; m < 720; m += 5) {
      samples.add(new Sample(T0.plusSeconds(60L * m), m < 240 ? 0.5 : 0.08, false));
    }
    List<Classification> classified = new Classifier(CPD_CACE).classify(samples);
    Instant end = T0.plus(Duration.ofHours(12));
    List<TimeWindow> inService = List.of(new TimeWindow(T0.plus(Duration.ofHours(6)), end));

    List<MonthlyHours> counted = Excursions.monthlyHours(classified, end, inService);
    assertThat(counted).extracting(MonthlyHours::level).containsExactly(Level.NORMAL);
    assertThat(counted.get(0).hours()).isEqualTo(6.0);

    List<MonthlyHours> all = Excursions.monthlyHours(classified, end);
    assertThat(all)
        .extracting(h -> h.level() + " " + h.hours())
        .containsExactlyInAnyOrder("NORMAL 8.0", "AL2 4.0");
    assertThat(Excursions.monthlyHours(classified, end, List.of())).isEmpty();
  }

  @Test
  void overlapOfWindows() {
    TimeWindow a = new TimeWindow(T0, T0.plusSeconds(3600));
    TimeWindow b = new TimeWindow(T0.plusSeconds(7200), T0.plusSeconds(10800));
    assertThat(TimeWindow.overlap(List.of(a, b), T0.plusSeconds(1800), T0.plusSeconds(9000)))
        .isEqualTo(Duration.ofSeconds(1800 + 1800));
    assertThat(a.overlap(T0.plusSeconds(3600), T0.plusSeconds(7200))).isZero();
    assertThat(a.contains(T0)).isTrue();
    assertThat(a.contains(T0.plusSeconds(3600))).isFalse();
    assertThatThrownBy(() -> new TimeWindow(T0, T0.minusSeconds(1)))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("before it starts");
  }
}
