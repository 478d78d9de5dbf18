package org.kwanta.model.water;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvFileSource;
import org.kwanta.model.OutOfValidityRangeException;

class Region2Test {

  /** IF97 Table 15, specific volume, to half a unit of the last printed digit. */
  @ParameterizedTest
  @CsvFileSource(resources = "/water/if97-table15-region2.csv", numLinesToSkip = 1)
  void matchesReleaseTable15(double t, double pMPa, String v) {
    assertThat(Region2.specificVolumeUnchecked(t, pMPa * 1e6))
        .isCloseTo(Double.parseDouble(v), within(Printed.halfUnitInLastDigit(v)));
  }

  @Test
  void checkedDensityAtTable15PointInRange() {
    // Table 15 prints v to 9 digits: half a unit is 1.3e-9 relative, so ρ = 1/v to the same.
    assertThat(Region2.density(300, 3500))
        .isCloseTo(1 / 0.394913866e2, within(1.3e-9 / 0.394913866e2));
  }

  /** The 700 K points of Table 15 through the checked method: region 2 now reaches 1073.15 K. */
  @Test
  void checkedDensityAtTable15PointsAbove623K() {
    assertThat(Region2.density(700, 30e6))
        .isCloseTo(1 / 0.542946619e-2, within(0.5e-11 / 0.542946619e-2 / 0.542946619e-2));
    assertThat(Region2.density(700, 3500))
        .isCloseTo(1 / 0.923015898e2, within(1.3e-9 / 0.923015898e2));
  }

  @Test
  void rejectsPressureAboveTheB23Line() {
    assertThatThrownBy(() -> Region2.density(700, 60e6))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("pressure 6e+07 Pa");
  }

  @Test
  void rejectsTemperatureAboveRegion2() {
    assertThatThrownBy(() -> Region2.density(1100, 1e6))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("[273.15, 1073.15] K");
  }

  @Test
  void rejectsPressureAboveSaturation() {
    assertThatThrownBy(() -> Region2.density(300, 1e5))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("pressure 100000 Pa");
  }
}
