package org.kwanta.service.limits;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

/**
 * The drum pressure that pressure-banded defaults are matched against. Check values: saturation
 * pressure from Debian {@code python3-iapws} 1.5.2, {@code IAPWS97(T=603.15, x=0).P} =
 * 12.857521889803 MPa and {@code IAPWS97(T=423.15, x=0).P} = 0.476101381081 MPa (IAPWS-IF97 region
 * 4).
 */
class DrumPressureTest {

  @Test
  void aDrumWithoutAConfiguredPressureIsAtTheSaturationPressureOfItsTemperature() {
    assertThat(Limits.Point.drumPressureMPa("DRUM_WATER", 330.0, null))
        .isCloseTo(12.857521889803, within(1e-6));
    assertThat(Limits.Point.drumPressureMPa("DRUM_WATER", 150.0, null))
        .isCloseTo(0.476101381081, within(1e-8));
  }

  @Test
  void aConfiguredPressureWins() {
    assertThat(Limits.Point.drumPressureMPa("DRUM_WATER", 330.0, 14.0)).isEqualTo(14.0);
    assertThat(Limits.Point.drumPressureMPa("FEEDWATER", 155.0, 15.0)).isEqualTo(15.0);
  }

  @Test
  void withoutAPressureOnlyADrumHasOne() {
    assertThat(Limits.Point.drumPressureMPa("FEEDWATER", 155.0, null)).isNull();
    assertThat(Limits.Point.drumPressureMPa("DRUM_WATER", null, null)).isNull();
  }
}
