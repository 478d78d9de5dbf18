package org.kwanta.model.diagnosis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.EnumSource;
import org.kwanta.model.conductivity.AlkalizerMix;
import org.kwanta.model.conductivity.Solutes;

/**
 * The channel rises of a cooling-water leak. Internal consistency only (no outside value): the
 * diagnosis's own {@link Ingress} rise, and the chloride the {@link CoolingWater} proportions give
 * per sodium (their published sources are cited in {@code CoolingWater}).
 */
class LeakChannelsTest {

  /** On pure water the cation rise is the diagnosis's {@link Ingress#cationRise}. */
  @ParameterizedTest
  @EnumSource(CoolingWater.class)
  void cationRiseIsTheDiagnosisRise(CoolingWater kind) {
    LeakChannels.Rise r = LeakChannels.of(Solutes.NONE, AlkalizerMix.AMMONIA, 298.15, kind, 5);
    assertThat(r.cation()).isCloseTo(Ingress.cationRise(5, 0.0, kind), within(1e-9));
    assertThat(r.degassedCation()).isCloseTo(r.cation(), within(1e-12));
    assertThat(r.specific()).isPositive();
  }

  /**
   * Sea water into ammonia-treated feedwater with CO₂: the cation channels rise by the acids
   * (within 2 % of each other: the background acids of each channel take a little of the rise).
   */
  @Test
  void seaWaterIntoAmmoniaWater() {
    Solutes feed = new Solutes(1e-4 * 0.6, 0, 1e-8, 0, 2e-7, 0);
    LeakChannels.Rise r = LeakChannels.of(feed, AlkalizerMix.AMMONIA, 298.15, CoolingWater.SEA, 10);
    assertThat(r.leak().chloride()).isCloseTo(10 / 22.98977e6 * (1.16398 + 0.00180), within(1e-15));
    assertThat(r.cation()).isGreaterThan(0.1);
    assertThat(r.degassedCation())
        .isCloseTo(r.cation(), org.assertj.core.api.Assertions.withinPercentage(2));
    assertThat(r.specific()).isPositive().isLessThan(r.cation());
  }
}
