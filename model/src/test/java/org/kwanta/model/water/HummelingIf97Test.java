package org.kwanta.model.water;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import com.hummeling.if97.IF97;
import org.junit.jupiter.api.Test;

/**
 * Density cross-check against com.hummeling:if97 1.0.5, an independent open Java implementation of
 * IAPWS-IF97 (test scope only). Its {@code UnitSystem.SI} takes p in Pa and T in K and returns
 * kg/m³ (checked here against IF97 Table 5, v(300 K, 3 MPa) = 0.100215168e-2 m³/kg).
 *
 * <p>Tolerance: both implement the same region-1 equation in double precision, so they agree to
 * rounding; 1e-11 relative is far below the 9 digits the release prints.
 */
class HummelingIf97Test {

  private final IF97 if97 = new IF97(IF97.UnitSystem.SI);

  @Test
  void unitSystemIsPascalKelvinAndKgPerCubicMetre() {
    assertThat(1 / if97.densityPT(3e6, 300)).isCloseTo(0.100215168e-2, within(5e-12));
  }

  @Test
  void densityAgreesWithHummelingIf97() {
    double[] celsius = {0.5, 25, 60, 100, 150, 200, 250, 300, 345};
    double[] pressuresMPa = {0.101325, 1, 5, 10, 17, 25};
    int compared = 0;
    for (double tc : celsius) {
      double t = 273.15 + tc;
      double ps = Water.saturationPressurePa(t);
      for (double pMPa : pressuresMPa) {
        double p = pMPa * 1e6;
        if (p < ps * 1.001) {
          continue;
        }
        double expected = if97.densityPT(p, t);
        assertThat(Water.densityKgPerM3(t, p))
            .as("T=%s K, p=%s Pa", t, p)
            .isCloseTo(expected, within(expected * 1e-11));
        compared++;
      }
    }
    assertThat(compared).isGreaterThanOrEqualTo(36);
  }
}
