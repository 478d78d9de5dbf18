package org.kwanta.model.water;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.kwanta.model.OutOfValidityRangeException;

class Boundary23Test {

  /**
   * IAPWS R7-97(2012) section 4, the check value of Eqs. 5 and 6: θ = 0.623150000e3 gives π =
   * 0.165291643e2 and back; tolerance half a unit of the last printed digit.
   */
  @Test
  void matchesReleaseSection4CheckValue() {
    assertThat(Boundary23.pressurePa(623.15)).isCloseTo(16.5291643e6, within(0.5e-7 * 1e6));
    assertThat(Boundary23.temperatureK(16.5291643e6)).isCloseTo(623.15, within(0.5e-6));
  }

  @Test
  void rejectsTemperatureBeyondTheLine() {
    assertThatThrownBy(() -> Boundary23.pressurePa(900))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("[623.15, 863.15] K");
  }
}
