package org.kwanta.model.water;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvFileSource;
import org.kwanta.model.OutOfValidityRangeException;

class IonizationConstantTest {

  /** IAPWS R11-07 Table 3, to half a unit of the last printed digit. */
  @ParameterizedTest
  @CsvFileSource(resources = "/water/r11-07-table3.csv", numLinesToSkip = 1)
  void matchesReleaseTable3(double t, double rho, String pKw) {
    assertThat(IonizationConstant.R11_07.pKw(t, rho))
        .isCloseTo(Double.parseDouble(pKw), within(Printed.halfUnitInLastDigit(pKw)));
  }

  /**
   * IAPWS R11-24 check values as given by the open implementation MilanSkocic/iapws (not from the
   * IAPWS document itself), to half a unit of the last printed digit.
   */
  @ParameterizedTest
  @CsvFileSource(resources = "/water/r11-24-check.csv", numLinesToSkip = 1)
  void matchesR1124CheckValuesOfOpenImplementation(double t, double rho, String pKw) {
    assertThat(IonizationConstant.R11_24.pKw(t, rho))
        .isCloseTo(Double.parseDouble(pKw), within(Printed.halfUnitInLastDigit(pKw)));
  }

  /** The rearranged fast form equals the release's form as written (consistency check). */
  @Test
  void fastEvaluationMatchesReleaseForm() {
    SplittableRandom random = new SplittableRandom(11);
    for (IonizationConstant k :
        new IonizationConstant[] {IonizationConstant.R11_07, IonizationConstant.R11_24}) {
      for (int i = 0; i < 5000; i++) {
        double t = random.nextDouble(273.15, 1073.15);
        double rho = i % 10 == 0 ? random.nextDouble(0, 5) : random.nextDouble(0, 1250);
        assertThat(k.pKwUnchecked(t, rho)).isCloseTo(k.pKwFromRelease(t, rho), within(1e-12));
      }
      assertThat(k.pKwUnchecked(1000, 0)).isEqualTo(k.pKwFromRelease(1000, 0));
    }
  }

  @Test
  void rejectsTemperatureAboveValidity() {
    assertThatThrownBy(() -> IonizationConstant.R11_07.pKw(1100, 500))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("temperature 1100 K")
        .hasMessageContaining("[273.15, 1073.15] K")
        .hasMessageContaining("IAPWS R11-07");
  }

  @Test
  void rejectsDensityAboveValidity() {
    assertThatThrownBy(() -> IonizationConstant.R11_24.pKw(300, 1300))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("density 1300 kg/m3")
        .hasMessageContaining("[0, 1250] kg/m3");
  }
}
