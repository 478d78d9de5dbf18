package org.kwanta.service.limits;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import org.kwanta.model.Parameter;
import org.kwanta.model.limits.CycleLocation;
import org.kwanta.model.limits.LimitKey;
import org.kwanta.model.limits.TreatmentRegime;

/**
 * A point declared with the trade form AVT(O) finds the AVT(O) limits (it was stored verbatim and
 * found none before the trade form was the one form), and so does one stored as AVT_O.
 */
class PointKeyTest {

  @Test
  void anAvtOPointFindsItsLimits() {
    LimitKey expected =
        new LimitKey(TreatmentRegime.AVT_O, CycleLocation.FEEDWATER, Parameter.CATION_CONDUCTIVITY);
    assertThat(Limits.Point.key("AVT(O)", "FEEDWATER", Parameter.CATION_CONDUCTIVITY))
        .contains(expected);
    assertThat(Limits.Point.key("AVT_O", "FEEDWATER", Parameter.CATION_CONDUCTIVITY))
        .contains(expected);
    assertThat(
            new Limits.Point("P", "plant", "U1", "FEEDWATER", "AVT(O)")
                .keyOrMakeUp("AVT(O)", "FEEDWATER", Parameter.CATION_CONDUCTIVITY))
        .isEqualTo(expected);
  }
}
