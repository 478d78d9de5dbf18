package org.kwanta.model.aqueous;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;
import org.kwanta.model.OutOfValidityRangeException;

/**
 * The activity model's limit of 0.1 mol/kg (the Davies equation is customarily taken as adequate to
 * about 0.1 mol/kg: common practice, no source; the limit is Kwanta's choice) is enforced on the
 * solution's total ionic strength, not only on each component's total. The compositions are
 * invented; the expected ionic strength is arithmetic (½ Σ m z²).
 */
class IonicStrengthLimitTest {

  /** Each total within 0.1 mol/kg, yet I = ½ Σ m z² ≈ 0.29 mol/kg: refused, naming the limit. */
  @Test
  void totalIonicStrengthAboveTheLimitIsRefused() {
    Composition c =
        Composition.builder()
            .molal(Component.SODIUM, 0.09)
            .molal(Component.CHLORIDE, 0.01)
            .molal(Component.SULFATE, 0.04)
            .molal(Component.LITHIUM, 0.08)
            .molal(Component.POTASSIUM, 0.01)
            .build();
    assertThatThrownBy(() -> Speciation.solveAt25Celsius(c, SpeciationOptions.defaults()))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("ionic strength")
        .hasMessageContaining("[0, 0.1] mol/kg")
        .hasMessageContaining("total ionic strength");
  }

  @Test
  void ionicStrengthWithinTheLimitPasses() {
    Composition c =
        Composition.builder().molal(Component.SODIUM, 0.05).molal(Component.CHLORIDE, 0.05).build();
    assertThat(Speciation.solveAt25Celsius(c, SpeciationOptions.defaults()).ionicStrengthMolPerKg())
        .isLessThan(0.1);
  }
}
