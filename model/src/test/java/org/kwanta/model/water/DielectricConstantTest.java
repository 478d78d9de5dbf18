package org.kwanta.model.water;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvFileSource;
import org.kwanta.model.OutOfValidityRangeException;

class DielectricConstantTest {

  /**
   * IAPWS R8-97 Table 4, the tabulated IAPWS-95 density fed directly into the equation. Tolerance:
   * half a unit of the last printed digit of ε, plus the effect of the density being printed to
   * only three decimals (half a unit of that digit times ∂ε/∂ρ, up to 6e-5 at 300 K, 1000 MPa).
   */
  @ParameterizedTest
  @CsvFileSource(resources = "/water/r8-97-table4.csv", numLinesToSkip = 1)
  void matchesReleaseTable4(double t, double pMPa, String rho, String epsilon) {
    double density = Double.parseDouble(rho);
    double h = 1e-3;
    double slope =
        (DielectricConstant.relativePermittivity(t, density + h)
                - DielectricConstant.relativePermittivity(t, density - h))
            / (2 * h);
    double tolerance =
        Printed.halfUnitInLastDigit(epsilon)
            + Math.abs(slope) * Printed.halfUnitInLastDigit(rho) * 1.01;
    assertThat(DielectricConstant.relativePermittivity(t, density))
        .isCloseTo(Double.parseDouble(epsilon), within(tolerance));
  }

  /**
   * The two doctest examples of {@code _Dielectric} in Debian python3-iapws 1.5.2 (their origin in
   * the release is not stated there), to half a unit of the last printed digit. The second lies at
   * 873.15 K, just above the release's 873 K limit, so the unchecked equation is evaluated.
   */
  @Test
  void matchesPythonIapwsDocstringExamples() {
    assertThat(DielectricConstant.relativePermittivity(298.15, 999.242866))
        .isCloseTo(78.5907250, within(5e-8));
    assertThat(DielectricConstant.relativePermittivityUnchecked(873.15, 26.0569558))
        .isCloseTo(1.12620970, within(5e-9));
  }

  /** The quarter-power evaluation equals the Math.pow table form (consistency check). */
  @Test
  void fastEvaluationMatchesTableForm() {
    SplittableRandom random = new SplittableRandom(7);
    for (int k = 0; k < 1000; k++) {
      double t = random.nextDouble(238, 873);
      double rho = random.nextDouble(0, 1250);
      double table = DielectricConstant.relativePermittivityFromTable(t, rho);
      assertThat(DielectricConstant.relativePermittivityUnchecked(t, rho))
          .isCloseTo(table, within(table * 1e-13));
    }
  }

  @Test
  void rejectsTemperatureBelowValidity() {
    assertThatThrownBy(() -> DielectricConstant.relativePermittivity(230, 1000))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("temperature 230 K")
        .hasMessageContaining("[238, 873] K")
        .hasMessageContaining("IAPWS R8-97");
  }
}
