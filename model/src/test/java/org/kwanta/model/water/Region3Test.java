package org.kwanta.model.water;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvFileSource;
import org.kwanta.model.OutOfValidityRangeException;

class Region3Test {

  /** IF97 Table 33, pressure, to half a unit of the last printed digit. */
  @ParameterizedTest
  @CsvFileSource(resources = "/water/if97-table33-region3.csv", numLinesToSkip = 1)
  void matchesReleaseTable33(double t, double rho, String pMPa) {
    double p = Double.parseDouble(pMPa) * 1e6;
    double tol = Printed.halfUnitInLastDigit(pMPa) * 1e6;
    assertThat(Region3.pressurePa(rho, t)).isCloseTo(p, within(tol));
    assertThat(Region3.pressurePaFromTable(rho, t)).isCloseTo(p, within(tol));
  }

  /**
   * The density search inverts Table 33: from the printed (T, p) back to the tabulated density, to
   * the precision the 9 printed digits of p allow (|Δρ| ≤ Δp / (∂p/∂ρ)).
   */
  @ParameterizedTest
  @CsvFileSource(resources = "/water/if97-table33-region3.csv", numLinesToSkip = 1)
  void densityInvertsReleaseTable33(double t, double rho, String pMPa) {
    double p = Double.parseDouble(pMPa) * 1e6;
    double dp = Printed.halfUnitInLastDigit(pMPa) * 1e6;
    double slope =
        (Region3.pressurePa(rho * 1.0001, t) - Region3.pressurePa(rho, t)) / (rho * 1e-4);
    assertThat(Region3.density(t, p)).isCloseTo(rho, within(2 * dp / slope));
  }

  @Test
  void rejectsPressureBelowTheB23Line() {
    assertThatThrownBy(() -> Region3.density(700, 10e6))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("pressure 1e+07 Pa")
        .hasMessageContaining("IAPWS R7-97(2012)");
  }

  @Test
  void rejectsTemperatureAboveRegion3() {
    assertThatThrownBy(() -> Region3.density(870, 50e6))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("temperature 870 K");
  }
}
