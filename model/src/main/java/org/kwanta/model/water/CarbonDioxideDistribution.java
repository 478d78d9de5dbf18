package org.kwanta.model.water;

import org.kwanta.model.Reference;
import org.kwanta.model.ValidityRange;

/**
 * Vapour–liquid distribution constant K_D of carbon dioxide between steam and water on the
 * saturation line.
 *
 * <p>Source: IAPWS G7-04, <i>Guideline on the Henry's Constant and Vapor-Liquid Distribution
 * Constant for Gases in H2O and D2O at High Temperatures</i> (Kyoto, 2004); R. Fernández-Prini, J.
 * L. Alvarez and A. H. Harvey, J. Phys. Chem. Ref. Data 32 (2003) 903. With T_R = T/Tc1, τ = 1 −
 * T_R, Tc1 = 647.096 K: ln K_D = q F + (E/T) f(τ) + (F + G τ^(2/3) + H τ) exp((273.15 K − T)/100
 * K), T in kelvin in the E/T term, q = −0.023767 for H2O (guideline Eq. 5), and f(τ) = ρ₁'/ρc1 − 1
 * = Σ c_i τ^d_i (Eq. 6), the saturated-liquid density auxiliary equation. Check values: the
 * guideline's table of ln K_D (300, 400, 500, 600 K).
 *
 * <p>Coefficient provenance: E, F, G, H for CO2 and c_i, d_i as given in the project's shared
 * reference notes (section 1.3), which found them identical in two open implementations; Debian
 * {@code python3-iapws} 1.5.3 ({@code _Kvalue}) agrees to all printed digits (tested).
 *
 * <p>Validity: {@link #VALIDITY}, 274.19 K to 642.66 K, the guideline's range for CO2. Uncertainty:
 * about ±0.05 to 0.1 in ln K_D at low temperature, growing toward Tc (from memory of the 2003
 * paper, per the shared notes); {@link #RELATIVE_UNCERTAINTY} takes 0.1. Units: K; K_D
 * dimensionless.
 */
final class CarbonDioxideDistribution {

  /** IAPWS G7-04. */
  static final Reference REFERENCE =
      new Reference(
          "IAPWS G7-04",
          "IAPWS, Guideline on the Henry's Constant and Vapor-Liquid Distribution Constant for"
              + " Gases in H2O and D2O at High Temperatures, G7-04 (2004); R. Fernández-Prini,"
              + " J. L. Alvarez and A. H. Harvey, J. Phys. Chem. Ref. Data 32 (2003) 903",
          Reference.Confidence.VERIFIED_BY_CHECK_TABLE);

  /** The guideline's temperature range for CO2, K. */
  static final ValidityRange VALIDITY =
      new ValidityRange("temperature", 274.19, 642.66, "K", REFERENCE);

  /** Relative standard uncertainty taken for K_D (0.1 in ln K_D; from memory, see above). */
  static final double RELATIVE_UNCERTAINTY = 0.1;

  /** Critical temperature of H2O used by the guideline, K. */
  static final double TC1 = 647.096;

  /** Eq. 5: q for H2O as the solvent. */
  static final double Q = -0.023767;

  /** Coefficient table, CO2 row: E (K), F, G, H. */
  static final double E = 1672.9376;

  static final double F = 28.1751;
  static final double G = -112.4619;
  static final double H = 85.3807;

  /** Eq. 6: c_i of the saturated-liquid density equation. */
  static final double[] C = {
    1.99274064, 1.09965342, -0.510839303, -1.75493479, -45.5170352, -6.7469445e5
  };

  /** Eq. 6: exponents d_i, as printed (thirds). */
  static final double[] D = {1.0 / 3, 2.0 / 3, 5.0 / 3, 16.0 / 3, 43.0 / 3, 110.0 / 3};

  private CarbonDioxideDistribution() {}

  /**
   * ln K_D without range check (Eq. 5).
   *
   * @param t T, K
   * @return ln K_D
   */
  static double lnKd(double t) {
    double tau = 1 - t / TC1;
    double f = 0;
    for (int i = 0; i < C.length; i++) {
      f += C[i] * Math.pow(tau, D[i]);
    }
    return Q * F
        + E / t * f
        + (F + G * Math.pow(tau, 2.0 / 3) + H * tau) * Math.exp((273.15 - t) / 100);
  }
}
