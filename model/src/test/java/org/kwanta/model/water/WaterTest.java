package org.kwanta.model.water;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvFileSource;
import org.kwanta.model.OutOfValidityRangeException;

class WaterTest {

  private static final IonizationFormulation R11_07 = IonizationFormulation.R11_07;

  /**
   * CRC Handbook, "Ionization constant of water" (Bandura and Lvov 2006), 0.1 MPa / saturation
   * column and 25 MPa column, to ±0.001: the values are printed to three decimals and the CRC
   * computed density from IAPWS-95, not IF97, which may move the third decimal by one. The 0 °C row
   * is reproduced at 0.1 MPa (14.9463) and not at saturation (14.9467, which would print 14.947),
   * so the first column is 0.1 MPa below 100 °C and saturation above, as the CSV header says.
   */
  @ParameterizedTest
  @CsvFileSource(resources = "/water/crc-pkw.csv", numLinesToSkip = 1)
  void matchesCrcHandbookTabulation(double tCelsius, String pMPa, double pKw) {
    double t = 273.15 + tCelsius;
    double p = pMPa.equals("sat") ? Water.saturationPressurePa(t) : Double.parseDouble(pMPa) * 1e6;
    WaterState state = Water.at(t, p, R11_07);
    assertThat(state.phase()).isEqualTo(Phase.LIQUID_REGION_1);
    assertThat(state.pKw()).isCloseTo(pKw, within(0.001));
    assertThat(Water.pKw(t, p, R11_07)).isEqualTo(state.pKw());
  }

  /** Trade fact, common practice, no source: Kw = 1.0e-14 at 298 K and 100 kPa, neutral pH 7. */
  @Test
  void kwIsAboutOneEMinus14AtRoomTemperature() {
    WaterState state = Water.at(298, 100e3, R11_07);
    assertThat(state.pKw()).isCloseTo(14.0, within(0.01));
    assertThat(state.neutralPh()).isCloseTo(7.0, within(0.005));
  }

  @Test
  void atSaturationUsesAtmosphericFloorBelow100Celsius() {
    WaterState state = Water.atSaturation(298.15, R11_07);
    assertThat(state.pressureSource()).isEqualTo(PressureSource.ATMOSPHERIC_FLOOR);
    assertThat(state.pressurePa()).isEqualTo(Water.ATMOSPHERIC_PRESSURE_PA);
    assertThat(state.saturationPressurePa()).isEqualTo(Water.saturationPressurePa(298.15));
    assertThat(state.phase()).isEqualTo(Phase.LIQUID_REGION_1);
  }

  /**
   * At exactly p_s the state is the saturated liquid (region 1); IF97 Table 35 gives p_s(500 K).
   */
  @Test
  void atSaturationUsesSaturationPressureAbove100Celsius() {
    WaterState state = Water.atSaturation(500, R11_07);
    assertThat(state.pressureSource()).isEqualTo(PressureSource.SATURATION);
    assertThat(state.pressurePa()).isCloseTo(0.263889776e1 * 1e6, within(5e-3));
    assertThat(state.phase()).isEqualTo(Phase.LIQUID_REGION_1);
    assertThat(state.densityKgPerM3()).isEqualTo(Region1.density(500, state.pressurePa()));
  }

  /** Below p_s the state is steam: IF97 region 2, Table 15 point (300 K, 0.0035 MPa). */
  @Test
  void vapourBelowSaturationPressureUsesRegion2() {
    WaterState state = Water.at(300, 3500, R11_07);
    assertThat(state.phase()).isEqualTo(Phase.VAPOUR_REGION_2);
    assertThat(1 / state.densityKgPerM3())
        .isCloseTo(0.394913866e2, within(Printed.halfUnitInLastDigit("0.394913866e2")));
  }

  @Test
  void givenPressureIsReportedAsGiven() {
    WaterState state = Water.at(573.15, 15.5e6, IonizationFormulation.R11_24);
    assertThat(state.pressureSource()).isEqualTo(PressureSource.GIVEN);
    assertThat(state.ionization()).isEqualTo(IonizationFormulation.R11_24);
    assertThat(state.pKw())
        .isEqualTo(IonizationConstant.R11_24.pKw(573.15, state.densityKgPerM3()));
  }

  @Test
  void rejectsTemperatureAboveValidity() {
    assertThatThrownBy(() -> Water.at(1073.2, 20e6, R11_07))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessage(
            "temperature 1073.2 K is outside the validity range [273.15, 1073.15] K of IAPWS"
                + " R7-97(2012) regions 1-3 (region 5 not implemented in Kwanta)");
  }

  /** Liquid above 350 °C lies in IF97 region 3: 360 °C at 20 MPa (a PWR pressurizer's state). */
  @Test
  void liquidAbove623KIsRegion3() {
    WaterState w = Water.at(633.15, 20e6, R11_07);
    assertThat(w.phase()).isEqualTo(Phase.LIQUID_REGION_3);
    assertThat(w.liquidLike()).isTrue();
    assertThat(w.debyeHuckelA()).isFinite();
  }

  /** Steam: density and pKw, but no Debye–Hückel parameters (Kwanta's liquid-like limit). */
  @Test
  void steamHasNoDebyeHuckelParameters() {
    WaterState w = Water.at(573.15, 5e6, R11_07);
    assertThat(w.phase()).isEqualTo(Phase.VAPOUR_REGION_2);
    assertThat(w.liquidLike()).isFalse();
    assertThat(w.pKw()).isFinite();
    assertThat(w.debyeHuckelA()).isNaN();
    assertThat(w.debyeHuckelB()).isNaN();
  }

  /** Above R8-97's 873 K there is no permittivity; density and pKw remain. */
  @Test
  void noPermittivityAbove873K() {
    WaterState w = Water.at(1000, 10e6, R11_07);
    assertThat(w.relativePermittivity()).isNaN();
    assertThat(w.pKw()).isFinite();
    assertThat(w.saturationPressurePa()).isNaN();
  }

  @Test
  void saturationEndsAtTheCriticalPoint() {
    assertThat(Water.atSaturation(645, R11_07).phase()).isEqualTo(Phase.LIQUID_REGION_3);
    assertThatThrownBy(() -> Water.atSaturation(650, R11_07))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("[273.15, 647.096] K");
  }

  @Test
  void rejectsTemperatureBelowValidity() {
    assertThatThrownBy(() -> Water.atSaturation(273.0, R11_07))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("temperature 273 K")
        .hasMessageContaining("[273.15, 647.096] K");
  }

  @Test
  void rejectsPressureAboveValidity() {
    assertThatThrownBy(() -> Water.at(300, 101e6, R11_07))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("pressure 1.01e+08 Pa")
        .hasMessageContaining("1e+08] Pa")
        .hasMessageContaining("IAPWS R7-97(2012)");
  }

  @Test
  void rejectsNonPositivePressure() {
    assertThatThrownBy(() -> Water.at(300, 0, R11_07))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("pressure 0 Pa");
  }

  @Test
  void rejectsNaNNamingTheQuantity() {
    assertThatThrownBy(() -> Water.at(Double.NaN, 1e5, R11_07))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("temperature NaN K");
    assertThatThrownBy(() -> Water.pKw(300, Double.NaN, R11_07))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("pressure NaN Pa");
    assertThatThrownBy(() -> Water.atSaturation(Double.NaN, R11_07))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("temperature NaN K");
  }

  @Test
  void rejectsMissingFormulation() {
    assertThatThrownBy(() -> Water.at(300, 1e5, null))
        .isInstanceOf(NullPointerException.class)
        .hasMessageContaining("ionization formulation");
  }
}
