package org.kwanta.model.limits;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.Instant;
import java.time.YearMonth;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * Excursions, allowances and monthly hours. The condenser-leak series is invented for the fictional
 * Brackenmoor demo plant (Unit 2 condensate pump discharge, cation conductivity); its thresholds
 * are the recalled IAPWS values (from memory — verify), used only to exercise the logic. Every
 * expected time below follows from the series' definition by the arithmetic in the comments.
 */
class ExcursionsTest {

  private static final Instant DAY = Instant.parse("2025-06-12T00:00:00Z");
  private static final LimitProfile CPD_CACE =
      Profiles.cationConductivity(CycleLocation.CONDENSATE, 0.01, Duration.ofMinutes(5));

  private static Instant at(String hhmm) {
    return Instant.parse("2025-06-12T" + hhmm + ":00Z");
  }

  /**
   * U2-CPD cation conductivity, one sample a minute: 0.08 µS/cm until 06:00; a straight rise to
   * 0.95 at 09:00 (a tube leak growing); 0.95 until 09:30; a straight fall to 0.08 at 13:30 (the
   * leaking half of the condenser isolated); 0.08 until 18:00.
   */
  static double condenserLeak(int minute) {
    if (minute < 360) {
      return 0.08;
    }
    if (minute < 540) {
      return 0.08 + 0.87 * (minute - 360) / 180.0;
    }
    if (minute < 570) {
      return 0.95;
    }
    if (minute < 810) {
      return 0.95 - 0.87 * (minute - 570) / 240.0;
    }
    return 0.08;
  }

  private static List<Sample> condenserLeakUntil(int lastMinute) {
    List<Sample> samples = new ArrayList<>();
    for (int m = 0; m <= lastMinute; m++) {
      samples.add(new Sample(DAY.plusSeconds(60L * m), condenserLeak(m), false));
    }
    return samples;
  }

  @Test
  void condenserLeakWalksThroughTheActionLevelsAndBack() {
    List<Classification> classified = new Classifier(CPD_CACE).classify(condenserLeakUntil(1080));
    List<Excursion> excursions = Excursions.of(CPD_CACE, classified, at("18:00"));

    assertThat(excursions).hasSize(1);
    Excursion leak = excursions.get(0);
    // Rise 0.87 µS/cm in 180 min from 06:00: above 0.2 first at minute 25 (0.2008; minute 24 gives
    // 0.196), above 0.35 at minute 56, above 0.65 at minute 118.
    // Fall 0.87 µS/cm in 240 min from 09:30, deadband 0.01: at or below 0.64 first at minute 86
    // (10:56), at or below 0.34 at minute 169 (12:19), at or below 0.19 at minute 210 (13:00).
    assertThat(leak.spans())
        .containsExactly(
            new LevelSpan(Level.AL1, at("06:25"), at("06:56")),
            new LevelSpan(Level.AL2, at("06:56"), at("07:58")),
            new LevelSpan(Level.AL3, at("07:58"), at("10:56")),
            new LevelSpan(Level.AL2, at("10:56"), at("12:19")),
            new LevelSpan(Level.AL1, at("12:19"), at("13:00")));
    assertThat(leak.start()).isEqualTo(at("06:25"));
    assertThat(leak.end()).contains(at("13:00"));
    assertThat(leak.duration()).isEqualTo(Duration.ofHours(6).plusMinutes(35));
    assertThat(leak.side()).isEqualTo(Side.HIGH);
    assertThat(leak.peakValue()).isEqualTo(0.95);
    assertThat(leak.peakTime()).isEqualTo(at("09:00"));
    assertThat(leak.highestLevel()).isEqualTo(Level.AL3);
    assertThat(leak.currentLevel()).isEqualTo(Level.NORMAL);
    assertThat(leak.allowance()).isEqualTo(Duration.ofHours(4));
    // AL3 held 2 h 58 min (< 4 h), AL2 or above 5 h 23 min (< 24 h), AL1 or above 6 h 35 min.
    assertThat(leak.allowanceExceeded()).isFalse();
    assertThat(leak.deadline()).isEmpty();
    assertThat(leak.timeRemaining()).isEmpty();
  }

  @Test
  void theLevelIsReportedOnceThePersistenceDelayHasPassed() {
    List<Classification> classified = new Classifier(CPD_CACE).classify(condenserLeakUntil(1080));
    // Onset 06:25, persistence 5 min: confirmed AL1 at the 06:30 sample, back-dated to 06:25.
    assertThat(classified.get(389).level()).isEqualTo(Level.NORMAL);
    assertThat(classified.get(390).level()).isEqualTo(Level.AL1);
    assertThat(classified.get(390).levelSince()).isEqualTo(at("06:25"));
    assertThat(classified.get(1080).level()).isEqualTo(Level.NORMAL);
  }

  @Test
  void aRunningExcursionCountsDownTheTightestAllowance() {
    List<Classification> classified = new Classifier(CPD_CACE).classify(condenserLeakUntil(510));
    Excursion leak = Excursions.of(CPD_CACE, classified, at("08:30")).get(0);

    assertThat(leak.open()).isTrue();
    assertThat(leak.currentLevel()).isEqualTo(Level.AL3);
    // Deadlines: AL1 06:25 + 168 h, AL2 06:56 + 24 h, AL3 07:58 + 4 h = 11:58, the earliest.
    assertThat(leak.deadline()).contains(at("11:58"));
    assertThat(leak.timeRemaining()).contains(Duration.ofHours(3).plusMinutes(28));
    assertThat(leak.duration()).isEqualTo(Duration.ofHours(2).plusMinutes(5));
    assertThat(leak.peakValue()).isEqualTo(condenserLeak(510));
  }

  @Test
  void anAl1StretchLongerThanOneWeekExceedsItsAllowanceAndSplitsAcrossMonths() {
    LimitProfile profile =
        Profiles.cationConductivity(CycleLocation.CONDENSATE, 0.01, Duration.ZERO);
    Instant start = Instant.parse("2025-03-28T00:00:00Z");
    List<Sample> samples = new ArrayList<>();
    for (int h = 0; h <= 24 * 10; h++) {
      // 0.1 for the first 4 h, then 0.25 (AL1) for 8 days, then 0.1 again.
      double value = h >= 4 && h < 4 + 24 * 8 ? 0.25 : 0.1;
      samples.add(new Sample(start.plusSeconds(3600L * h), value, false));
    }
    List<Classification> classified = new Classifier(profile).classify(samples);
    Instant asOf = start.plusSeconds(3600L * 240);
    Excursion e = Excursions.of(profile, classified, asOf).get(0);
    assertThat(e.duration()).isEqualTo(Duration.ofDays(8));
    assertThat(e.allowanceExceeded()).isTrue();

    // AL1 from 2025-03-28T04:00 to 2025-04-05T04:00: 92 h in March, 100 h in April.
    List<MonthlyHours> hours = Excursions.monthlyHours(classified, asOf);
    assertThat(hours)
        .containsExactly(
            new MonthlyHours(YearMonth.of(2025, 3), Level.NORMAL, Duration.ofHours(4)),
            new MonthlyHours(YearMonth.of(2025, 3), Level.AL1, Duration.ofHours(92)),
            new MonthlyHours(YearMonth.of(2025, 4), Level.NORMAL, Duration.ofHours(44)),
            new MonthlyHours(YearMonth.of(2025, 4), Level.AL1, Duration.ofHours(100)));
    assertThat(hours.get(1).hours()).isEqualTo(92.0);
  }

  @Test
  void anEmptySeriesHasNoExcursions() {
    assertThat(Excursions.of(CPD_CACE, List.of(), DAY)).isEmpty();
    assertThat(Excursions.monthlyHours(List.of(), DAY)).isEmpty();
  }
}
