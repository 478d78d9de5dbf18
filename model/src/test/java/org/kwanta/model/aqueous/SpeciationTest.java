package org.kwanta.model.aqueous;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.kwanta.model.OutOfValidityRangeException;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.model.water.Phase;
import org.kwanta.model.water.PressureSource;
import org.kwanta.model.water.Water;
import org.kwanta.model.water.WaterState;

class SpeciationTest {

  private static final IonizationFormulation R11_07 = IonizationFormulation.R11_07;

  private static WaterState saturated(double celsius) {
    return Water.atSaturation(celsius + 273.15, R11_07);
  }

  private static WaterState at25Celsius() {
    return Water.at(298.15, Water.ATMOSPHERIC_PRESSURE_PA, R11_07);
  }

  /** Neutral pH at 25 °C: R11-07 pKw 13.995 (CRC tabulation of R11-07), halved: 6.997-6.998. */
  @Test
  void pureWaterAt25CelsiusIsNeutralAtHalfPkwOfR1107() {
    SpeciationResult r = Speciation.solve(Composition.PURE_WATER, saturated(25));
    assertThat(r.ph()).isBetween(6.997, 6.998);
    assertThat(r.phMinusNeutral()).isCloseTo(0, within(1e-12));
  }

  /** Neutral pH at 300 °C on saturation: CRC tabulation of R11-07 pKw 11.339, halved = 5.6695. */
  @Test
  void pureWaterAt300CelsiusOnSaturationHasPh567() {
    SpeciationResult r = Speciation.solve(Composition.PURE_WATER, saturated(300));
    assertThat(r.ph()).isCloseTo(11.339 / 2, within(0.0005 / 2 + 1e-9));
    assertThat(r.neutralPh()).isCloseTo(5.67, within(0.0005 + 1e-9));
  }

  /** 1 mg/kg NH3 gives pH25 ≈ 9.4 (common practice, no source); tolerance ±0.05. */
  @Test
  void oneMilligramPerKilogramAmmoniaGivesPh94At25Celsius() {
    Composition c = Composition.builder().milligramsPerKilogram(Component.AMMONIA, 1).build();
    SpeciationResult r = Speciation.solve(c, at25Celsius());
    assertThat(r.ph()).isCloseTo(9.4, within(0.05));
    assertThat(r.constant(Equilibrium.AMMONIUM).orElseThrow().sourceId()).isEqualTo("ammonium-1");
  }

  /**
   * ASTM D5128, Standard Test Method for On-Line pH Measurement of Water of Low Conductivity, Table
   * 1 (retrieved): NaOH 0.1 / 1.0 / 8.0 mg/L gives pH 8.40 / 9.40 / 10.30 at 25 °C. Tolerance
   * ±0.02: the table prints two decimals (±0.005), and it rests on an older pKw (14.00 against
   * R11-07 13.995 at 25 °C, 0.005 in pH) and unstated activity and mg/L conventions (≈0.005 each).
   */
  @Test
  void sodiumHydroxideMatchesAstmD5128Table1() {
    WaterState w = at25Celsius();
    double molarMassNaOH = Amounts.NA + Amounts.O + Amounts.H;
    double[] mgPerL = {0.1, 1.0, 8.0};
    double[] ph = {8.40, 9.40, 10.30};
    for (int i = 0; i < mgPerL.length; i++) {
      // mg/L → mol/L → mol/kg with the density of water at 25 °C (kg/L = ρ/1000).
      double molal = mgPerL[i] / 1000 / molarMassNaOH / (w.densityKgPerM3() / 1000);
      SpeciationResult r = Speciation.solve(Composition.of(Component.SODIUM, molal), w);
      assertThat(r.ph()).as("%s mg/L NaOH", mgPerL[i]).isCloseTo(ph[i], within(0.02));
    }
  }

  /**
   * pH300 for 1 mg/kg NH3 over the ammonium fits: 5.89 (Thermoddem V1.10, BRGM) to 6.08 (Bates
   * &amp; Pinching, J. Res. NBS 42 (1949) 419, extrapolated). No publication prints this band: the
   * numbers are our own earlier hand evaluation of those published fits (consistency check, not an
   * outside value).
   */
  @Test
  void ammoniaBandAt300CelsiusSpansThermoddemToBatesPinching() {
    Composition c = Composition.builder().milligramsPerKilogram(Component.AMMONIA, 1).build();
    PhBand band = Speciation.band(c, saturated(300), SpeciationOptions.defaults());
    assertThat(band.minSet()).isEqualTo("ammonium-2");
    assertThat(band.maxSet()).isEqualTo("ammonium-3");
    assertThat(band.minPh()).isCloseTo(5.89, within(0.02));
    assertThat(band.maxPh()).isCloseTo(6.08, within(0.02));
    assertThat(band.members())
        .filteredOn(m -> m.constantSet().equals("ammonium-3"))
        .singleElement()
        .matches(PhBand.Member::extrapolated);
  }

  @Test
  void reportGivesPhAt25CelsiusOfTheSameWater() {
    Composition c =
        Composition.builder()
            .milligramsPerKilogram(Component.AMMONIA, 1)
            .microgramsPerKilogram(Component.CHLORIDE, 5)
            .build();
    SpeciationReport report = Speciation.report(c, saturated(300), SpeciationOptions.defaults());
    assertThat(report.at25Celsius().temperatureK()).isEqualTo(298.15);
    assertThat(report.at25Celsius().water().pressurePa()).isEqualTo(101_325.0);
    assertThat(report.at25Celsius().ph()).isEqualTo(Speciation.solve(c, at25Celsius()).ph());
    assertThat(report.band().minPh()).isLessThanOrEqualTo(report.atTemperature().ph());
    assertThat(report.band().maxPh()).isGreaterThanOrEqualTo(report.atTemperature().ph());
  }

  @Test
  void reportsEveryConstantUsedAndFlagsExtrapolation() {
    Composition c =
        Composition.builder()
            .molal(Component.AMMONIA, 1e-4)
            .molal(Component.SULFATE, 1e-6)
            .molal(Component.CARBON_DIOXIDE, 1e-5)
            .build();
    SpeciationResult at300 = Speciation.solve(c, saturated(300));
    assertThat(at300.constants())
        .extracting(ConstantUsed::equilibrium)
        .containsExactly(
            Equilibrium.AMMONIUM,
            Equilibrium.BISULFATE,
            Equilibrium.CARBONIC_FIRST,
            Equilibrium.CARBONIC_SECOND);
    // Dickson 1990 and Plummer-Busenberg 1982 are stated to 250 °C.
    assertThat(at300.constant(Equilibrium.BISULFATE).orElseThrow().extrapolated()).isTrue();
    assertThat(at300.constant(Equilibrium.AMMONIUM).orElseThrow().extrapolated()).isFalse();
    assertThat(at300.notices()).contains(Notice.EXTRAPOLATED_CONSTANT);
    SpeciationResult at25 = Speciation.solve(c, saturated(25));
    assertThat(at25.notices()).doesNotContain(Notice.EXTRAPOLATED_CONSTANT);
  }

  /**
   * At 300 °C pKa(HSO4⁻) ≈ 6.2 (Dickson, Wesolowski, Palmer &amp; Mesmer, J. Phys. Chem. 94 (1990)
   * 7978, fit extrapolated from 250 °C: 6.249) lies above neutral pH 5.67 (IAPWS R11-07), so
   * sulfate is largely bisulfate at neutral-to-acid pH: the engine must carry HSO4⁻.
   */
  @Test
  void bisulfateIsCarriedAtTemperature() {
    Composition c = Composition.of(Component.SULFATE, 1e-5);
    SpeciationResult r = Speciation.solve(c, saturated(300));
    assertThat(r.fraction(Species.BISULFATE)).isGreaterThan(0.5);
    assertThat(r.fraction(Species.BISULFATE) + r.fraction(Species.SULFATE))
        .isCloseTo(1, within(1e-15));
  }

  @Test
  void speciesMolalitiesAddUpToTheTotals() {
    Composition c =
        Composition.builder()
            .molal(Component.PHOSPHATE, 2e-5)
            .molal(Component.SODIUM, 5e-5)
            .molal(Component.BORON, 1e-4)
            .build();
    SpeciationResult r = Speciation.solve(c, saturated(150));
    double p = 0;
    for (Species s : Component.PHOSPHATE.species()) {
      p += r.molality(s);
    }
    assertThat(p).isCloseTo(2e-5, within(1e-20));
    // free Na⁺ plus NaOH° (the only sodium pair without chloride or sulfate)
    assertThat(r.molality(Species.SODIUM_ION) + r.molality(Species.SODIUM_HYDROXIDE_PAIR))
        .isCloseTo(5e-5, within(1e-19));
    double b = 0;
    for (SpeciesAmount a : r.species()) {
      b += a.species().countOf(Component.BORON) * a.molalityMolPerKg();
    }
    assertThat(b).isCloseTo(1e-4, within(1e-18));
  }

  @Test
  void condensedSteamIsSpeciatedAsLiquidWithANotice() {
    SpeciationResult r =
        Speciation.solve(
            Composition.of(Component.AMMONIA, 1e-5),
            saturated(40),
            SpeciationOptions.defaults().withSampleOrigin(SampleOrigin.CONDENSED_STEAM));
    assertThat(r.notices()).contains(Notice.CONDENSED_LIQUID_AT_STATED_TEMPERATURE);
  }

  @Test
  void rejectsVapourState() {
    WaterState steam = Water.at(573.15, 1e6, R11_07);
    assertThat(steam.phase()).isEqualTo(Phase.VAPOUR_REGION_2);
    assertThatThrownBy(() -> Speciation.solve(Composition.PURE_WATER, steam))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("liquid");
  }

  @Test
  void rejectsTemperatureOutsideTheEngineRange() {
    WaterState cold =
        new WaterState(
            260,
            101_325,
            PressureSource.GIVEN,
            Phase.LIQUID_REGION_1,
            200,
            998,
            R11_07,
            15.0,
            90,
            0.49,
            0.32);
    assertThatThrownBy(() -> Speciation.solve(Composition.PURE_WATER, cold))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("temperature")
        .hasMessageContaining("K");
  }

  @Test
  void rejectsNegativeOrExcessiveTotals() {
    assertThatThrownBy(() -> Composition.of(Component.SODIUM, -1e-6))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("mol/kg");
    assertThatThrownBy(() -> Composition.of(Component.SODIUM, 0.2))
        .isInstanceOf(OutOfValidityRangeException.class);
    assertThatThrownBy(() -> Composition.of(Component.SODIUM, Double.NaN))
        .isInstanceOf(OutOfValidityRangeException.class);
  }

  @Test
  void bDotModelIsValidFrom25To300Celsius() {
    SpeciationOptions bdot = SpeciationOptions.defaults().withActivityModel(ActivityModel.B_DOT);
    Composition c = Composition.of(Component.AMMONIA, 1e-4);
    assertThat(Speciation.solve(c, saturated(300), bdot).ph())
        .isCloseTo(Speciation.solve(c, saturated(300)).ph(), within(0.002));
    assertThatThrownBy(() -> Speciation.solve(c, saturated(10), bdot))
        .isInstanceOf(OutOfValidityRangeException.class);
  }
}
