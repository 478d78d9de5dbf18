package org.kwanta.model.water;

import org.kwanta.model.Reference;
import org.kwanta.model.ValidityRange;

/**
 * Static dielectric constant (relative permittivity) ε of water from temperature and density.
 *
 * <p>Source: IAPWS R8-97, <i>Release on the Static Dielectric Constant of Ordinary Water Substance
 * for Temperatures from 238 K to 873 K and Pressures up to 1000 MPa</i> (1997); D. P. Fernández, A.
 * R. H. Goodwin, E. W. Lemmon, J. M. H. Levelt Sengers and R. C. Williams, J. Phys. Chem. Ref. Data
 * 26 (1997) 1125. With δ = ρ/ρc, τ = Tc/T: the Harris–Alder factor g = 1 + Σ_{k=1..11} N_k δ^i_k
 * τ^j_k + N_12 δ (T/228 K − 1)^(−1.2); A = N_A μ² ρ g / (M ε0 k T); B = N_A α ρ / (3 M ε0); ε = [1
 * + A + 5B + (9 + 2A + 18B + A² + 10AB + 9B²)^½] / [4(1 − B)]. Equation numbers are not cited (the
 * release text was not at hand); the coefficients N_k, i_k, j_k are the release's coefficient table
 * as transcribed in python3-iapws 1.5.2 ({@code _Dielectric}) and other public ports. Check values:
 * release Table 4, whose densities are IAPWS-95 values at the tabulated (T, p).
 *
 * <p>The physical constants are those fixed by the release (not CODATA 2018). Validity: {@link
 * #VALIDITY}, 238 K to 873 K (the release also limits p ≤ 1000 MPa; the caller holds p). Units at
 * the methods: K, kg/m³; ε is dimensionless.
 */
final class DielectricConstant {

  /** IAPWS R8-97. */
  static final Reference REFERENCE =
      new Reference(
          "IAPWS R8-97",
          "IAPWS, Release on the Static Dielectric Constant of Ordinary Water Substance for"
              + " Temperatures from 238 K to 873 K and Pressures up to 1000 MPa, R8-97 (1997);"
              + " D. P. Fernández et al., J. Phys. Chem. Ref. Data 26 (1997) 1125",
          Reference.Confidence.VERIFIED_BY_CHECK_TABLE);

  /** Temperature range of the release, K. */
  static final ValidityRange VALIDITY = new ValidityRange("temperature", 238, 873, "K", REFERENCE);

  /** Critical density ρc, kg/m³. */
  static final double RHO_C = 322;

  /** Critical temperature Tc, K. */
  static final double T_C = 647.096;

  /** Coefficient table: exponents i_k of δ, k = 1 … 11. */
  static final int[] I = {1, 1, 1, 2, 3, 3, 4, 5, 6, 7, 10};

  /** Coefficient table: exponents j_k of τ, k = 1 … 11 (all multiples of 1/4). */
  static final double[] J = {0.25, 1, 2.5, 1.5, 1.5, 2.5, 2, 2, 5, 0.5, 10};

  /** Coefficient table: N_1 … N_12. */
  static final double[] N = {
    0.978224486826,
    -0.957771379375,
    0.237511794148,
    0.714692244396,
    -0.298217036956,
    -0.108863472196,
    0.949327488264e-1,
    -0.980469816509e-2,
    0.165167634970e-4,
    0.937359795772e-4,
    -0.123179218720e-9,
    0.196096504426e-2
  };

  /** Molecular dipole moment μ fixed by the release, C m. */
  static final double MU = 6.138e-30;

  /** Mean molecular polarizability α fixed by the release, C² J⁻¹ m². */
  static final double ALPHA = 1.636e-40;

  /** Boltzmann constant as fixed by the release, J/K. */
  static final double K_BOLTZMANN = 1.380658e-23;

  /** Avogadro constant as fixed by the release, 1/mol. */
  static final double N_AVOGADRO = 6.0221367e23;

  /** Vacuum permittivity as fixed by the release, C² J⁻¹ m⁻¹. */
  static final double EPSILON_0 = 8.854187817e-12;

  /** Molar mass of water, kg/mol. */
  static final double M = 0.018015268;

  /** 4 j_k: the τ exponents in quarters, so that τ^j_k = (τ^¼)^(4 j_k). */
  private static final int[] J_QUARTERS = new int[J.length];

  static {
    for (int k = 0; k < J.length; k++) {
      J_QUARTERS[k] = (int) Math.round(4 * J[k]);
      if (J_QUARTERS[k] != 4 * J[k]) {
        throw new ExceptionInInitializerError("j_k not a multiple of 1/4");
      }
    }
  }

  private DielectricConstant() {}

  /**
   * Relative permittivity ε.
   *
   * @param temperatureK T, K
   * @param densityKgPerM3 ρ, kg/m³
   * @return ε, dimensionless
   * @throws org.kwanta.model.OutOfValidityRangeException if T is outside {@link #VALIDITY} or NaN,
   *     or ρ is negative or NaN
   */
  static double relativePermittivity(double temperatureK, double densityKgPerM3) {
    VALIDITY.check(temperatureK);
    IonizationConstant.DENSITY_VALIDITY.check(densityKgPerM3);
    return relativePermittivityUnchecked(temperatureK, densityKgPerM3);
  }

  /** ε without range checks; the caller has checked T and ρ. */
  static double relativePermittivityUnchecked(double t, double rho) {
    double delta = rho / RHO_C;
    double tau = T_C / t;
    double tauQuarter = Math.sqrt(Math.sqrt(tau));
    double g = 1 + N[11] * delta * Math.pow(t / 228 - 1, -1.2);
    for (int k = 0; k < I.length; k++) {
      g += N[k] * Region1.power(delta, I[k]) * Region1.power(tauQuarter, J_QUARTERS[k]);
    }
    double a = N_AVOGADRO * MU * MU * rho * g / (M * EPSILON_0 * K_BOLTZMANN * t);
    double b = N_AVOGADRO * ALPHA * rho / (3 * M * EPSILON_0);
    return (1 + a + 5 * b + Math.sqrt(9 + 2 * a + 18 * b + a * a + 10 * a * b + 9 * b * b))
        / (4 * (1 - b));
  }

  /** ε evaluated from the coefficient table with {@code Math.pow}: the oracle for tests. */
  static double relativePermittivityFromTable(double t, double rho) {
    double delta = rho / RHO_C;
    double tau = T_C / t;
    double g = 1 + N[11] * delta * Math.pow(t / 228 - 1, -1.2);
    for (int k = 0; k < I.length; k++) {
      g += N[k] * Math.pow(delta, I[k]) * Math.pow(tau, J[k]);
    }
    double a = N_AVOGADRO * MU * MU * rho * g / (M * EPSILON_0 * K_BOLTZMANN * t);
    double b = N_AVOGADRO * ALPHA * rho / (3 * M * EPSILON_0);
    return (1 + a + 5 * b + Math.sqrt(9 + 2 * a + 18 * b + a * a + 10 * a * b + 9 * b * b))
        / (4 * (1 - b));
  }
}
