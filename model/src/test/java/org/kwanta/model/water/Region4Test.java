package org.kwanta.model.water;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvFileSource;
import org.kwanta.model.OutOfValidityRangeException;

class Region4Test {

  /** IF97 Table 35, to half a unit of the last printed digit. */
  @ParameterizedTest
  @CsvFileSource(resources = "/water/if97-table35-region4-ps.csv", numLinesToSkip = 1)
  void matchesReleaseTable35(double t, String psMPa) {
    assertThat(Region4.saturationPressurePa(t) / 1e6)
        .isCloseTo(Double.parseDouble(psMPa), within(Printed.halfUnitInLastDigit(psMPa)));
  }

  /** IF97 Table 36, to half a unit of the last printed digit. */
  @ParameterizedTest
  @CsvFileSource(resources = "/water/if97-table36-region4-ts.csv", numLinesToSkip = 1)
  void matchesReleaseTable36(double pMPa, String ts) {
    assertThat(Region4.saturationTemperatureK(pMPa * 1e6))
        .isCloseTo(Double.parseDouble(ts), within(Printed.halfUnitInLastDigit(ts)));
  }

  @Test
  void rejectsTemperatureAboveCritical() {
    assertThatThrownBy(() -> Region4.saturationPressurePa(650))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("temperature 650 K")
        .hasMessageContaining("647.096");
  }

  @Test
  void rejectsNaN() {
    assertThatThrownBy(() -> Region4.saturationTemperatureK(Double.NaN))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("pressure NaN Pa");
  }
}
