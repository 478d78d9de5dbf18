package org.kwanta.model.diagnosis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

class DiagnoserTest {

  /**
   * Well above the background, a sea-water leak raises cation conductivity by the limiting
   * conductivities of its acids: per mol Na, 1.16578 mol HCl and 0.06021 mol H₂SO₄ (Millero et al.
   * 2008); λ° H⁺ 349.65, Cl⁻ 76.31, ½SO₄²⁻ 80.0 S cm² mol⁻¹ (CRC Handbook, 25 °C). At 100 µg/kg Na
   * (4.35 µmol/kg) that is 2.38 µS/cm before the Onsager correction, which takes about 1–2 %.
   */
  @Test
  void seaWaterLeakRaisesCationConductivityByItsAcids() {
    double n = 100 / 22.98977 * 1e-6 * 0.997; // mol/L at 25 °C (ρ 0.997 kg/L)
    double limiting =
        n * 1e3 * (1.16578 * (349.65 + 76.31) + 2 * 0.06021 * (349.65 + 80.0)); // µS/cm
    double rise = Ingress.cationRise(100, 0.055, CoolingWater.SEA);
    assertThat(rise).isCloseTo(limiting, within(0.03 * limiting));
    assertThat(rise).isLessThan(limiting); // the Onsager term only lowers it
  }

  /**
   * Near pure water the acid suppresses the water's own ions (Kw = [H⁺][OH⁻] is fixed), so the
   * first µg/kg adds less than its share of the rise at 10 µg/kg: a property of the charge balance,
   * no published table behind it.
   */
  @Test
  void nearPureWaterTheFirstSodiumAddsLessThanItsShare() {
    double one = Ingress.cationRise(1, 0.055, CoolingWater.SEA);
    double ten = Ingress.cationRise(10, 0.055, CoolingWater.SEA);
    assertThat(one).isLessThan(ten / 10);
    assertThat(Ingress.cationRise(0, 0.1, CoolingWater.SEA)).isZero();
  }

  /** Fresh river water carries more acid anions per sodium than sea water (Livingstone 1963). */
  @Test
  void freshWaterBringsMoreAcidPerSodiumThanSeaWater() {
    assertThat(Ingress.cationRise(5, 0.1, CoolingWater.FRESH))
        .isGreaterThan(Ingress.cationRise(5, 0.1, CoolingWater.SEA));
  }

  @Test
  void settingsOutOfRangeAreRefused() {
    assertThatThrownBy(
            () ->
                new Diagnoser.Settings(
                    Duration.ofMinutes(30), Duration.ofMinutes(60), Duration.ofHours(8), 3, 10))
        .isInstanceOf(IllegalArgumentException.class);
  }

  /** The findings at a minute do not depend on the range asked for. */
  @Test
  void findingsDoNotDependOnTheRangeAskedFor() {
    StoryBench.Story story = StoryBench.condenserLeak(CoolingWater.BRACKISH);
    Map<String, Diagnoser.Series> series = StoryBench.generate(story, 5);
    Diagnoser d = new Diagnoser(Diagnoser.Settings.defaults());
    Instant faultStart = StoryBench.START.plus(StoryBench.BASELINE);
    Instant to = faultStart.plus(Duration.ofHours(2));
    List<Diagnoser.Diagnosed> narrow =
        d.diagnose(series, "CPD", faultStart.plus(Duration.ofMinutes(30)), to);
    List<Diagnoser.Diagnosed> wide =
        d.diagnose(series, "CPD", faultStart.minus(Duration.ofHours(2)), to);
    Map<Instant, Diagnoser.Diagnosed> byTime = new HashMap<>();
    wide.forEach(x -> byTime.put(x.time(), x));
    assertThat(narrow).isNotEmpty();
    for (Diagnoser.Diagnosed x : narrow) {
      assertThat(byTime.get(x.time())).isEqualTo(x);
    }
  }

  /** A gap of a few minutes in the feed neither raises nor ends a finding. */
  @Test
  void aGapInTheFeedDoesNotBreakAFinding() {
    StoryBench.Story story = StoryBench.condenserLeak(CoolingWater.BRACKISH);
    Map<String, Diagnoser.Series> series = StoryBench.generate(story, 5);
    Instant faultStart = StoryBench.START.plus(StoryBench.BASELINE);
    Instant gapFrom = faultStart.plus(Duration.ofMinutes(60));
    Map<String, Diagnoser.Series> withGap = new HashMap<>();
    series.forEach(
        (id, s) -> {
          List<Minute> kept = new ArrayList<>();
          for (Minute m : s.minutes()) {
            if (m.time().isBefore(gapFrom) || !m.time().isBefore(gapFrom.plusSeconds(240))) {
              kept.add(m);
            }
          }
          withGap.put(id, new Diagnoser.Series(s.point(), kept));
        });
    Diagnoser d = new Diagnoser(Diagnoser.Settings.defaults());
    Instant after = gapFrom.plusSeconds(300);
    List<Diagnoser.Diagnosed> r = d.diagnose(withGap, "CPD", after, after);
    assertThat(r).hasSize(1);
    assertThat(r.get(0).findings())
        .extracting(f -> f.code().name())
        .contains("COOLING_WATER_INGRESS");
  }
}
