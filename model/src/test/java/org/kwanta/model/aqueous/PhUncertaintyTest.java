package org.kwanta.model.aqueous;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.kwanta.model.aqueous.LogKFunction.ThreeTerm;
import org.kwanta.model.aqueous.PhUncertainty.Kind;
import org.kwanta.model.aqueous.PhUncertainty.Part;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.model.water.Water;
import org.kwanta.model.water.WaterState;

/**
 * The itemised uncertainty of pH at temperature (parts (b) and (c) of {@link PhUncertainty}) and
 * its combination. Expected values are hand calculations written beside each test, or the exact
 * evaluation the shortcut must reproduce; none is a golden number.
 */
class PhUncertaintyTest {

  private static WaterState saturated(double celsius) {
    return Water.atSaturation(celsius + 273.15, IonizationFormulation.R11_07);
  }

  private static final SpeciationOptions DEFAULTS = SpeciationOptions.defaults();

  /**
   * The first-order sensitivity dpH/dlog10 K used by parts (b) and (c) agrees with a central finite
   * difference of the full solve (log10 K of cyclohexylammonium moved by ±0.001): within 1 % (the
   * closed form holds the activity coefficients fixed).
   */
  @Test
  void sensitivityMatchesFiniteDifferenceOfTheFullSolve() {
    Composition c =
        Composition.builder().milligramsPerKilogram(Component.CYCLOHEXYLAMINE, 5).build();
    WaterState w = saturated(300);
    PhSolution central = Speciation.ph(c, w, DEFAULTS);
    Part part = PhUncertainties.estimatedConstants(c, w, DEFAULTS, central);
    double u = ConstantUncertainty.of(EquilibriumConstants.CYCLOHEXYLAMMONIUM_ESTIMATE, 573.15);
    double analytic = part.halfWidth() / u;
    double h = 0.001;
    double up = Speciation.ph(c, w, DEFAULTS.withConstants(shiftedCyclohexylamine(h))).ph();
    double down = Speciation.ph(c, w, DEFAULTS.withConstants(shiftedCyclohexylamine(-h))).ph();
    double numeric = Math.abs(up - down) / (2 * h);
    assertThat(analytic).isCloseTo(numeric, within(0.01 * numeric));
  }

  private static ConstantSet shiftedCyclohexylamine(double h) {
    Fit f = EquilibriumConstants.CYCLOHEXYLAMMONIUM_ESTIMATE;
    Fit shifted =
        new Fit(
            "cha-shifted",
            f.equilibrium(),
            new ThreeTerm(-10.64 + h, 54_600, 30),
            f.reference(),
            f.validity());
    return ConstantSets.DEFAULT.with(
        "cha-shifted",
        "test",
        Map.of(Equilibrium.ofWeakBase(Component.CYCLOHEXYLAMINE), List.of(shifted)));
  }

  /**
   * Part (c) by hand for cyclohexylamine water at 300 °C. Charge balance (activity coefficients
   * taken as 1): C·f + h = Kw/h, with f = h/(h + Ka) the protonated fraction and h = m(H⁺).
   * Differentiating with respect to ln Ka (d(C·f) = C·f·(1 − f)·(d ln h − d ln Ka)) gives d ln h/d
   * ln Ka = C·f·(1 − f)/(C·f·(1 − f) + C·f + 2h) = (1 − f)/(2 − f + 2h/(C·f)), so dpH/dlog10 Ka =
   * −(1 − f)/(2 − f + 2h/(C·f)): −0.5 for a barely protonated base. With u = 0.4 at 300 °C (the
   * confidence judgement of water-and-equilibria.md §10.1, shared reference material; no published
   * source), part (c) = 0.4·(1 − f)/(2 − f + 2h/(C·f)), f and h read from the solved species;
   * within 1 % (activity coefficients ≈ 0.99 at I ≈ 1e-5 mol/kg). With 5 mg/kg (C = 5.04e-5 mol/kg)
   * f ≈ 0.2 and 2h/(C·f) ≈ 0.1, so (c) ≈ 0.4·0.8/1.9 ≈ 0.17.
   */
  @Test
  void estimatedConstantsPartForCyclohexylamineAt300CelsiusByHand() {
    Composition c =
        Composition.builder().milligramsPerKilogram(Component.CYCLOHEXYLAMINE, 5).build();
    SpeciationReport report = Speciation.report(c, saturated(300), DEFAULTS);
    double f =
        report.atTemperature().species().stream()
            .filter(s -> s.species() == Species.CYCLOHEXYLAMMONIUM)
            .findFirst()
            .orElseThrow()
            .fractionOfComponent();
    double cf = c.molality(Component.CYCLOHEXYLAMINE) * f;
    double h = report.atTemperature().hydrogenIonMolality();
    double byHand = 0.4 * (1 - f) / (2 - f + 2 * h / cf);
    Part part = report.uncertainty().part(Kind.ESTIMATED_CONSTANTS);
    assertThat(part.halfWidth()).isCloseTo(byHand, within(0.01 * byHand)).isBetween(0.15, 0.19);
    assertThat(part.contributions()).hasSize(1);
    assertThat(part.contributions().get(0).source()).isEqualTo("cyclohexylammonium");
    assertThat(part.contributions().get(0).detail()).contains("± 0.400").contains("estimate");
  }

  /**
   * The false certainty of issue 16: estimated amines at 250-300 °C had a band of width zero (one
   * fit, no alternative set). Part (c) is now at least 0.1·0.45 (u ≥ 0.1, |dpH/dlog10 K| ≳ 0.45 for
   * a base mostly unprotonated, see above), and so is the combined band on each side.
   */
  @ParameterizedTest
  @CsvSource({
    "CYCLOHEXYLAMINE, 250",
    "CYCLOHEXYLAMINE, 275",
    "CYCLOHEXYLAMINE, 300",
    "DIETHYLAMINOETHANOL, 250",
    "DIETHYLAMINOETHANOL, 275",
    "DIETHYLAMINOETHANOL, 300",
    "METHOXYPROPYLAMINE, 250",
    "METHOXYPROPYLAMINE, 300"
  })
  void estimatedAminesNeverGetAZeroWidthBand(Component amine, double celsius) {
    Composition c = Composition.builder().milligramsPerKilogram(amine, 3).build();
    SpeciationReport report = Speciation.report(c, saturated(celsius), DEFAULTS);
    PhUncertainty u = report.uncertainty();
    assertThat(u.part(Kind.CONSTANT_SET_SPREAD).halfWidth()).isZero();
    assertThat(u.part(Kind.ESTIMATED_CONSTANTS).halfWidth()).isGreaterThan(0.045);
    assertThat(u.ph() - u.low()).isGreaterThan(0.045);
    assertThat(u.high() - u.ph()).isGreaterThan(0.045);
  }

  /**
   * Boric acid with lithium beyond its fit (Mesmer 1972, stated to 290 °C): part (c) at 300 °C uses
   * u = 0.05 + 0.005·10 = 0.10 (hand calculation, ConstantUncertaintyTest); at 250 °C, inside, the
   * single-source 0.04. Neither is zero.
   */
  @Test
  void boricAcidBeyondItsFitHasAStatedUncertainty() {
    Composition c =
        Composition.builder()
            .milligramsPerKilogram(Component.BORON, 500)
            .milligramsPerKilogram(Component.LITHIUM, 2)
            .build();
    Part at300 =
        Speciation.report(c, saturated(300), DEFAULTS).uncertainty().part(Kind.ESTIMATED_CONSTANTS);
    Part at250 =
        Speciation.report(c, saturated(250), DEFAULTS).uncertainty().part(Kind.ESTIMATED_CONSTANTS);
    assertThat(at300.contributions().get(0).detail()).contains("± 0.100").contains("beyond");
    assertThat(at300.halfWidth()).isGreaterThan(0.01);
    assertThat(at250.halfWidth()).isGreaterThan(0.004);
    assertThat(at300.halfWidth()).isGreaterThan(at250.halfWidth());
  }

  /**
   * The shortcut of part (b) (sets ranked to first order, only the extremes solved) gives exactly
   * the ends of the band that solves every set, for ammonia water with carbon dioxide and sulfate
   * at 155 °C and 300 °C.
   */
  @ParameterizedTest
  @CsvSource({"155", "250", "300"})
  void screenedSpreadEqualsTheExactBand(double celsius) {
    Composition c =
        Composition.builder()
            .milligramsPerKilogram(Component.AMMONIA, 1)
            .microgramsPerKilogram(Component.CARBON_DIOXIDE, 50)
            .microgramsPerKilogram(Component.SULFATE, 2)
            .microgramsPerKilogram(Component.CHLORIDE, 2)
            .build();
    WaterState w = saturated(celsius);
    PhSolution central = Speciation.ph(c, w, DEFAULTS);
    PhBand band = Speciation.band(c, w, DEFAULTS);
    Part screened = PhUncertainties.constantParts(c, w, DEFAULTS, central).constantSetSpread();
    Part exact = PhUncertainties.constantSetSpread(band, central.ph(), "default");
    assertThat(screened.below()).isCloseTo(exact.below(), within(1e-10));
    assertThat(screened.above()).isCloseTo(exact.above(), within(1e-10));
    assertThat(screened.lowConstantSet()).isEqualTo(exact.lowConstantSet());
    assertThat(screened.highConstantSet()).isEqualTo(exact.highConstantSet());
    assertThat(screened.halfWidth()).isGreaterThan(0);
  }

  /**
   * The combination rule by hand: (a) ±0.03 and (b) 0.04 below / 0.12 above give low = pH − √(0.03²
   * + 0.04²) = pH − 0.05 and high = pH + √(0.03² + 0.12²) = pH + 0.123693.
   */
  @Test
  void combinesPartsByRootSumSquareOnEachSide() {
    PhUncertainty u =
        PhUncertainty.combine(
            6.0,
            List.of(
                Part.symmetric(Kind.INSTRUMENT_TOLERANCES, 0.03, "", List.of()),
                new Part(Kind.CONSTANT_SET_SPREAD, 0.04, 0.12, "a", "b", "", List.of()),
                Part.notApplicable(Kind.ESTIMATED_CONSTANTS, "none"),
                Part.notApplicable(Kind.OPERATING_CONDITIONS, "none")));
    assertThat(u.low()).isCloseTo(5.95, within(1e-12));
    assertThat(u.high()).isCloseTo(6.0 + Math.sqrt(0.0009 + 0.0144), within(1e-12));
  }

  /** Every label names its part by letter, and the API names are distinct. */
  @Test
  void labelsSayWhichPart() {
    assertThat(Kind.INSTRUMENT_TOLERANCES.label()).startsWith("(a) instrument");
    assertThat(Kind.CONSTANT_SET_SPREAD.label()).startsWith("(b)").contains("constant sets");
    assertThat(Kind.ESTIMATED_CONSTANTS.label()).startsWith("(c)").contains("estimated");
    assertThat(Kind.OPERATING_CONDITIONS.label()).startsWith("(d) operating");
  }
}
