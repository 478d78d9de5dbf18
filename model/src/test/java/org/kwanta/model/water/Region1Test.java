package org.kwanta.model.water;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvFileSource;
import org.kwanta.model.OutOfValidityRangeException;

class Region1Test {

  /** IF97 Table 5, specific volume, to half a unit of the last printed digit. */
  @ParameterizedTest
  @CsvFileSource(resources = "/water/if97-table5-region1.csv", numLinesToSkip = 1)
  void matchesReleaseTable5(double t, double pMPa, String v) {
    assertThat(Region1.specificVolumeUnchecked(t, pMPa * 1e6))
        .isCloseTo(Double.parseDouble(v), within(Printed.halfUnitInLastDigit(v)));
    assertThat(Region1.density(t, pMPa * 1e6))
        .isCloseTo(1 / Double.parseDouble(v), within(1e-8 / Double.parseDouble(v)));
  }

  /**
   * The regrouped fast evaluation equals the table-form evaluation of Table 2 (consistency check,
   * the table form being the one checked against Table 5), at seeded random points of region 1.
   */
  @Test
  void fastGammaPiMatchesTableForm() {
    SplittableRandom random = new SplittableRandom(20240601);
    for (int k = 0; k < 2000; k++) {
      double t = random.nextDouble(273.15, 623.15);
      double p = random.nextDouble(Region4.saturationPressurePaUnchecked(t), 100e6);
      double pi = p / Region1.P_STAR;
      double tau = Region1.T_STAR / t;
      double table = Region1.gammaPiFromTable(pi, tau);
      assertThat(Region1.gammaPi(pi, tau)).isCloseTo(table, within(Math.abs(table) * 1e-13));
    }
  }

  @Test
  void rejectsPressureBelowSaturation() {
    assertThatThrownBy(() -> Region1.density(500, 1e6))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("pressure")
        .hasMessageContaining("Pa")
        .hasMessageContaining("IAPWS R7-97(2012)");
  }

  @Test
  void rejectsPressureAboveValidity() {
    assertThatThrownBy(() -> Region1.density(300, 100.1e6))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("pressure 1.001e+08 Pa")
        .hasMessageContaining("1e+08");
  }

  @Test
  void rejectsTemperatureAboveValidity() {
    assertThatThrownBy(() -> Region1.density(623.16, 20e6))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("temperature 623.16 K")
        .hasMessageContaining("[273.15, 623.15] K");
  }
}
