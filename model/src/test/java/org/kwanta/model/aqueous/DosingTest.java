package org.kwanta.model.aqueous;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.model.water.Water;
import org.kwanta.model.water.WaterState;

/**
 * Dosing advice: round trips dose → pH → dose (internal consistency), and one number of the trade:
 * 1 mg/kg NH₃ gives pH₂₅ ≈ 9.4 (common practice, no source).
 */
class DosingTest {

  private static final WaterState W25 =
      Water.at(298.15, Water.ATMOSPHERIC_PRESSURE_PA, IonizationFormulation.R11_07);
  private static final WaterState ECO = Water.at(428.15, 15e6, IonizationFormulation.R11_07);
  private static final Composition BACKGROUND =
      Composition.builder()
          .microgramsPerKilogram(Component.CHLORIDE, 2)
          .microgramsPerKilogram(Component.CARBON_DIOXIDE, 20)
          .build();

  /** Dose → pH₂₅ → dose, ammonia, an amine, and a mix. */
  @ParameterizedTest
  @CsvSource({
    "AMMONIA, 1.0, , 0",
    "AMMONIA, 0.2, , 0",
    "ETHANOLAMINE, 2.0, , 0",
    "AMMONIA, 0.5, ETHANOLAMINE, 0.4"
  })
  void roundTripsThePh25(Component a, double fractionA, Component b, double fractionB) {
    Map<Component, Double> mix =
        b == null ? Map.of(a, 1.0) : Map.of(a, 1 - fractionB, b, fractionB);
    double x = 3e-5 * fractionA / 0.5;
    Composition dosed = BACKGROUND;
    for (Map.Entry<Component, Double> e : mix.entrySet()) {
      dosed = dosed.with(e.getKey(), x * e.getValue());
    }
    double ph = Speciation.ph(dosed, W25, SpeciationOptions.defaults()).ph();
    Dosing.Advice adv =
        Dosing.advise(
            BACKGROUND, mix, Dosing.Basis.PH_25, ph, W25, W25, SpeciationOptions.defaults());
    assertThat(adv.dose().amountMolPerKg()).isCloseTo(x, within(x * 1e-7));
    assertThat(adv.dose().ph25()).isCloseTo(ph, within(1e-8));
    assertThat(adv.lowest().amountMolPerKg()).isLessThanOrEqualTo(x * (1 + 1e-7));
    assertThat(adv.highest().amountMolPerKg()).isGreaterThanOrEqualTo(x * (1 - 1e-7));
    assertThat(adv.alreadyAtTarget()).isFalse();
  }

  /** Dose → margin over neutral at 155 °C / 15 MPa → dose. */
  @Test
  void roundTripsTheMarginAtTheEconomizer() {
    double x = 1.0 / 17.031 / 1000;
    Composition dosed = BACKGROUND.with(Component.AMMONIA, x);
    double margin = Speciation.ph(dosed, ECO, SpeciationOptions.defaults()).ph() - ECO.neutralPh();
    Dosing.Advice adv =
        Dosing.advise(
            BACKGROUND,
            Map.of(Component.AMMONIA, 1.0),
            Dosing.Basis.MARGIN_OVER_NEUTRAL,
            margin,
            W25,
            ECO,
            SpeciationOptions.defaults());
    assertThat(adv.dose().amountMolPerKg()).isCloseTo(x, within(x * 1e-7));
    assertThat(adv.dose().phAtLocation() - adv.dose().neutralPhAtLocation())
        .isCloseTo(margin, within(1e-8));
    assertThat(adv.highest().amountMolPerKg()).isGreaterThan(adv.lowest().amountMolPerKg());
  }

  /** pH₂₅ 9.4 takes about 1 mg/kg NH₃ (common practice, no source: 0.7–1.4 mg/kg accepted). */
  @Test
  void ammoniaForPh94IsAboutOneMilligram() {
    Dosing.Advice adv =
        Dosing.advise(
            Composition.PURE_WATER,
            Map.of(Component.AMMONIA, 1.0),
            Dosing.Basis.PH_25,
            9.4,
            W25,
            W25,
            SpeciationOptions.defaults());
    assertThat(adv.dose().amountMolPerKg() * 17.031 * 1000).isBetween(0.7, 1.4);
  }

  @Test
  void aTargetAlreadyMetNeedsNoDose() {
    Dosing.Advice adv =
        Dosing.advise(
            Composition.PURE_WATER,
            Map.of(Component.AMMONIA, 1.0),
            Dosing.Basis.PH_25,
            6.5,
            W25,
            W25,
            SpeciationOptions.defaults());
    assertThat(adv.alreadyAtTarget()).isTrue();
    assertThat(adv.dose().amountMolPerKg()).isZero();
  }

  @Test
  void refusesAnUnreachableTargetAndANonBase() {
    assertThatThrownBy(
            () ->
                Dosing.advise(
                    Composition.PURE_WATER,
                    Map.of(Component.AMMONIA, 1.0),
                    Dosing.Basis.PH_25,
                    13.5,
                    W25,
                    W25,
                    SpeciationOptions.defaults()))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("not reached");
    assertThatThrownBy(
            () ->
                Dosing.advise(
                    Composition.PURE_WATER,
                    Map.of(Component.CHLORIDE, 1.0),
                    Dosing.Basis.PH_25,
                    9,
                    W25,
                    W25,
                    SpeciationOptions.defaults()))
        .isInstanceOf(IllegalArgumentException.class);
  }
}
