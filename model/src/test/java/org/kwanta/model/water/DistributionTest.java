package org.kwanta.model.water;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvFileSource;
import org.kwanta.model.OutOfValidityRangeException;
import org.kwanta.model.Reference;

class DistributionTest {

  /** IAPWS G7-04 check values of ln K_D for CO2, to half a unit of the last printed digit. */
  @ParameterizedTest
  @CsvFileSource(resources = "/water/g7-04-co2-lnkd.csv", numLinesToSkip = 1)
  void carbonDioxideMatchesGuidelineCheckValues(double t, String lnKd) {
    DistributionConstant k = Distribution.at(VolatileSolute.CARBON_DIOXIDE, t);
    assertThat(Math.log(k.kD()))
        .isCloseTo(Double.parseDouble(lnKd), within(Printed.halfUnitInLastDigit(lnKd)));
    assertThat(k.source().id()).isEqualTo("IAPWS G7-04");
    assertThat(k.extrapolated()).isFalse();
  }

  /** The same equations in Debian python3-iapws ({@code _Kvalue}) over 280–640 K, to 1e-9. */
  @ParameterizedTest
  @CsvFileSource(resources = "/water/python-iapws-co2-lnkd.csv", numLinesToSkip = 2)
  void carbonDioxideAgreesWithPythonIapws(double t, double lnKd) {
    assertThat(CarbonDioxideDistribution.lnKd(t)).isCloseTo(lnKd, within(1e-9));
  }

  /**
   * The llnl.dat Henry's-law fit behind the ammonia estimate: its printed log K at 25 °C is 1.7966
   * (llnl.dat, as in the shared notes §1.4); the five rounded coefficients reproduce it to 0.001.
   */
  @Test
  void ammoniaHenryFitReproducesItsPrinted25CValue() {
    assertThat(AmmoniaDistribution.log10HenryConstant(298.15)).isCloseTo(1.7966, within(1e-3));
  }

  /**
   * Outside check of the ammonia Henry constant at 25 °C: S. L. Clegg and P. Brimblecombe, J. Phys.
   * Chem. 93 (1989) 7237, ln K_H = −8.09694 + 3917.507/T − 0.00314 T (mol kg⁻¹ atm⁻¹) gives 59.9
   * mol kg⁻¹ bar⁻¹; the llnl fit (62.6) agrees within 5 %.
   */
  @Test
  void ammoniaHenryConstantAgreesWithCleggBrimblecombeAt25C() {
    double t = 298.15;
    double cleggPerBar = Math.exp(-8.09694 + 3917.507 / t - 0.00314 * t) / 1.01325;
    assertThat(Math.pow(10, AmmoniaDistribution.log10HenryConstant(t)))
        .isCloseTo(cleggPerBar, within(0.05 * cleggPerBar));
  }

  @Test
  void ammoniaIsAnEstimateMarkedExtrapolatedAbove300C() {
    DistributionConstant k = Distribution.at(VolatileSolute.AMMONIA, 603.15);
    assertThat(k.source().confidence()).isEqualTo(Reference.Confidence.ESTIMATED);
    assertThat(k.extrapolated()).isTrue();
    assertThat(k.relativeUncertainty()).isGreaterThan(0.4);
    assertThat(Distribution.at(VolatileSolute.AMMONIA, 473.15).extrapolated()).isFalse();
  }

  /** Both gases prefer the steam (K_D &gt; 1) and K_D falls with temperature towards Tc. */
  @Test
  void distributionConstantsOfTheGasesFallWithTemperature() {
    for (VolatileSolute s :
        new VolatileSolute[] {VolatileSolute.AMMONIA, VolatileSolute.CARBON_DIOXIDE}) {
      double previous = Double.POSITIVE_INFINITY;
      for (double t = 298.15; t <= 623.15; t += 25) {
        double k = Distribution.at(s, t).kD();
        assertThat(k).isGreaterThan(1).isLessThan(previous);
        previous = k;
      }
    }
  }

  /**
   * The amine estimates reproduce their own table rows (values from memory — verify; the CSV header
   * says so): a regression check of the interpolation, not a check against a publication.
   */
  @ParameterizedTest
  @CsvFileSource(resources = "/water/amine-kd-estimates.csv", numLinesToSkip = 1)
  void amineEstimatesReproduceTheirTableRows(String amine, double celsius, double kD) {
    DistributionConstant k = Distribution.at(VolatileSolute.valueOf(amine), celsius + 273.15);
    assertThat(k.kD()).isCloseTo(kD, within(1e-9 * kD));
  }

  /**
   * P. V. Balakrishnan, Can. J. Chem. 56 (1978) 2620, abstract: morpholine forms an azeotrope with
   * water (K_D &gt; 1) only above 175 °C, and its volatility is close to that of water.
   */
  @Test
  void morpholineCrossesOneNear175CAsBalakrishnan1978() {
    assertThat(Distribution.at(VolatileSolute.MORPHOLINE, 273.15 + 165).kD()).isLessThan(1);
    assertThat(Distribution.at(VolatileSolute.MORPHOLINE, 273.15 + 185).kD()).isGreaterThan(1);
    for (double c = 150; c <= 300; c += 10) {
      assertThat(Distribution.at(VolatileSolute.MORPHOLINE, 273.15 + c).kD()).isBetween(0.5, 2.0);
    }
  }

  /**
   * Balakrishnan 1978 (abstract): cyclohexylamine strongly prefers the steam over 150–300 °C, more
   * than morpholine.
   */
  @Test
  void cyclohexylaminePrefersTheSteamAsBalakrishnan1978() {
    for (double c = 150; c <= 300; c += 10) {
      double t = 273.15 + c;
      double cha = Distribution.at(VolatileSolute.CYCLOHEXYLAMINE, t).kD();
      assertThat(cha).isGreaterThan(2);
      assertThat(cha).isGreaterThan(1.5 * Distribution.at(VolatileSolute.MORPHOLINE, t).kD());
    }
  }

  /** Toward the critical temperature both phases become one, so every K_D moves toward 1. */
  @Test
  void amineEstimatesMoveTowardOneNearTc() {
    for (VolatileSolute s : amines()) {
      double at300 = Math.abs(Math.log(Distribution.at(s, 573.15).kD()));
      double at350 = Math.abs(Math.log(Distribution.at(s, 623.15).kD()));
      assertThat(at350).as(s.name()).isLessThan(at300);
    }
  }

  /** The amine constants say what they are: estimates, from memory, about a factor of two. */
  @Test
  void amineConstantsAreMarkedEstimatesFromMemory() {
    for (VolatileSolute s : amines()) {
      DistributionConstant k = Distribution.at(s, 473.15);
      assertThat(k.source().confidence()).isEqualTo(Reference.Confidence.ESTIMATED);
      assertThat(k.source().id()).contains("from memory");
      assertThat(k.relativeUncertainty()).isGreaterThanOrEqualTo(1.0);
      assertThat(k.extrapolated()).isFalse();
      DistributionConstant cold = Distribution.at(s, 298.15);
      assertThat(cold.extrapolated()).isTrue();
      assertThat(cold.relativeUncertainty()).isGreaterThan(k.relativeUncertainty());
      assertThat(Distribution.at(s, 623.15).extrapolated()).isTrue();
    }
  }

  private static VolatileSolute[] amines() {
    return new VolatileSolute[] {
      VolatileSolute.MORPHOLINE,
      VolatileSolute.ETHANOLAMINE,
      VolatileSolute.CYCLOHEXYLAMINE,
      VolatileSolute.DIMETHYLAMINE,
      VolatileSolute.METHOXYPROPYLAMINE,
      VolatileSolute.DIETHYLAMINOETHANOL
    };
  }

  @Test
  void rejectsTemperaturesBeyondTheEngine() {
    assertThatThrownBy(() -> Distribution.at(VolatileSolute.AMMONIA, 640))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("Kwanta distribution constants");
  }
}
