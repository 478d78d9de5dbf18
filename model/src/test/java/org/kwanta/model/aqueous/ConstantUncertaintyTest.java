package org.kwanta.model.aqueous;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * The stated log10 K uncertainties of part (c). The 25 °C and 300 °C figures of the estimates are
 * confidence judgements, not published values: water-and-equilibria.md §10.1 in the shared
 * reference material (row cyclohexylamine "Low (±0.1 at 25 °C; ±0.4 at 300 °C)", an estimate around
 * the 25 °C values recalled from memory; row 3-methoxypropylamine "25 °C value itself ±0.3"). The
 * beyond-range rule is the project's choice (ConstantUncertainty class comment). Every expected
 * value here is a hand calculation from those rules.
 */
class ConstantUncertaintyTest {

  private static double k(double celsius) {
    return celsius + 273.15;
  }

  /** Cyclohexylamine: 0.1 at 25 °C and 0.1 + (0.3/275 K)·275 K = 0.4 at 300 °C (§10.1). */
  @Test
  void cyclohexylamineMatchesTheReferenceNotesAt25And300Celsius() {
    Fit f = EquilibriumConstants.CYCLOHEXYLAMMONIUM_ESTIMATE;
    assertThat(ConstantUncertainty.of(f, k(25))).isCloseTo(0.1, within(1e-12));
    assertThat(ConstantUncertainty.of(f, k(300))).isCloseTo(0.4, within(1e-12));
  }

  /** DEAE at 250 °C: 0.1 + (0.3/275)·225 = 0.1 + 0.245454… = 0.345454… (by hand). */
  @Test
  void deaeAt250CelsiusByHand() {
    assertThat(ConstantUncertainty.of(EquilibriumConstants.DIETHYLAMINOETHANOLIUM_ESTIMATE, k(250)))
        .isCloseTo(0.1 + 0.3 * 225 / 275, within(1e-12))
        .isCloseTo(0.34545, within(1e-5));
  }

  /**
   * Boric acid (Mesmer 1972, stated 0-290 °C): 0.04 inside (single source; the agreement of the
   * Thermoddem V1.10 fit with Mesmer 1972, water-and-equilibria.md §7 of the shared reference
   * material); at 300 °C 10 K beyond, 0.05 + 0.005·10 = 0.10 (by hand); at 350 °C 60 K beyond, 0.05
   * + 0.30 = 0.35.
   */
  @Test
  void boricAcidBeyondItsFitGrowsWithTheDistance() {
    Fit f = EquilibriumConstants.BORIC_MESMER;
    assertThat(ConstantUncertainty.of(f, k(250))).isCloseTo(0.04, within(1e-12));
    assertThat(ConstantUncertainty.of(f, k(300))).isCloseTo(0.10, within(1e-12));
    assertThat(ConstantUncertainty.of(f, k(350))).isCloseTo(0.35, within(1e-12));
    assertThat(ConstantUncertainty.reason(f, k(300))).contains("10.0 K beyond").contains("0-290");
  }

  /** A retrieved fit inside its range has none: its doubt is the constant-set spread, part (b). */
  @Test
  void retrievedFitInsideItsRangeHasNone() {
    assertThat(ConstantUncertainty.of(EquilibriumConstants.AMMONIUM_LLNL, k(300))).isZero();
    assertThat(ConstantUncertainty.reason(EquilibriumConstants.AMMONIUM_LLNL, k(300))).isEmpty();
  }

  /** Never zero for an estimate, at any temperature of the engine. */
  @ParameterizedTest
  @ValueSource(doubles = {0, 25, 100, 250, 275, 300, 350})
  void estimatesAreNeverZero(double celsius) {
    for (Fit f :
        new Fit[] {
          EquilibriumConstants.CYCLOHEXYLAMMONIUM_ESTIMATE,
          EquilibriumConstants.DIETHYLAMINOETHANOLIUM_ESTIMATE,
          EquilibriumConstants.METHOXYPROPYLAMMONIUM_ESTIMATE
        }) {
      assertThat(ConstantUncertainty.of(f, k(celsius))).as(f.id()).isGreaterThanOrEqualTo(0.1);
    }
  }
}
