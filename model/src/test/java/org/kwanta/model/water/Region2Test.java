package org.kwanta.model.water;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvFileSource;
import org.kwanta.model.OutOfValidityRangeException;

class Region2Test {

  /**
   * IF97 Table 15, specific volume, to half a unit of the last printed digit. Two of the three
   * points lie at 700 K, beyond the part of region 2 this class accepts through its checked method,
   * so the unchecked equation is evaluated (it is the same equation).
   */
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

  @Test
  void rejectsPressureAboveSaturation() {
    assertThatThrownBy(() -> Region2.density(300, 1e5))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("pressure 100000 Pa");
  }
}
