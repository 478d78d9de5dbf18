package org.kwanta.model.water;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.kwanta.model.OutOfValidityRangeException;

class DebyeHuckelTest {

  /**
   * CODATA 2018 values as given by scipy.constants in Debian (e, k and N_A exact in the SI since
   * 2019; ε0 = 8.8541878128e-12 F/m).
   */
  @Test
  void usesCodata2018Constants() {
    assertThat(DebyeHuckel.E).isEqualTo(1.602176634e-19);
    assertThat(DebyeHuckel.K_BOLTZMANN).isEqualTo(1.380649e-23);
    assertThat(DebyeHuckel.N_AVOGADRO).isEqualTo(6.02214076e23);
    assertThat(DebyeHuckel.EPSILON_0).isEqualTo(8.8541878128e-12);
  }

  /**
   * Helgeson and Kirkham (1974) numeric forms A = 1.824928e6 ρ^½ (εT)^(−3/2), B = 50.29158 ρ^½
   * (εT)^(−½) (ρ in g/cm³, B in Å⁻¹): the two constants are from memory, so this is a check of the
   * formula and units to 1e-4 relative (older constants), not of the last digits.
   */
  @Test
  void agreesWithHelgesonKirkhamNumericForms() {
    double[][] points = {{298.15, 997.05, 78.41}, {573.15, 712.14, 20.14}, {273.15, 999.8, 87.9}};
    for (double[] point : points) {
      double t = point[0];
      double rho = point[1];
      double eps = point[2];
      double a = 1.824928e6 * Math.sqrt(rho / 1000) * Math.pow(eps * t, -1.5);
      double b = 50.29158 * Math.sqrt(rho / 1000) / Math.sqrt(eps * t);
      assertThat(DebyeHuckel.a(t, rho, eps)).isCloseTo(a, within(a * 1e-4));
      assertThat(DebyeHuckel.b(t, rho, eps)).isCloseTo(b, within(b * 1e-4));
    }
  }

  /**
   * Osmotic Debye–Hückel slope at 25 °C and 0.1 MPa, A_φ = A ln10 / 3: Archer and Wang (1990) give
   * 0.3915 kg^½ mol^−½ (value from memory). Our A uses the R8-97 ε; ±0.0005 covers the different
   * dielectric data behind their value.
   */
  @Test
  void osmoticSlopeAt25CelsiusAgreesWithArcherAndWang() {
    WaterState state = Water.at(298.15, 101_325, IonizationFormulation.R11_07);
    assertThat(state.debyeHuckelA() * Math.log(10) / 3).isCloseTo(0.3915, within(0.0005));
  }

  @Test
  void rejectsPermittivityBelowOne() {
    assertThatThrownBy(() -> DebyeHuckel.a(300, 1000, 0.5))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("relative permittivity 0.5");
  }
}
