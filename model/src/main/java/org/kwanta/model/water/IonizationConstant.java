package org.kwanta.model.water;

import org.kwanta.model.Reference;
import org.kwanta.model.ValidityRange;

/**
 * Ionization constant of water, pKw = −log10 Kw, from temperature and density (Bandura &amp; Lvov
 * form), with the coefficient sets of IAPWS R11-07 and of its 2024 revision R11-24.
 *
 * <p>Sources: IAPWS R11-07, <i>Release on the Ionization Constant of H2O</i> (Lucerne, 2007); A. V.
 * Bandura and S. N. Lvov, J. Phys. Chem. Ref. Data 35 (2006) 15. The release's equation: with ρ in
 * g cm⁻³ and T in K, Z = ρ exp(α0 + α1/T + α2 ρ^(2/3)/T²), pKw = −2n [log10(1 + Z) − Z/(Z + 1) ρ
 * (β0 + β1/T + β2 ρ)] + pKw^G + 2 log10(Mw/1000), pKw^G = γ0 + γ1/T + γ2/T² + γ3/T³ (equation
 * numbers are not cited: the release text was not at hand when this was written). Coefficients: the
 * release's coefficient table (as transcribed in python3-iapws 1.5.2, function {@code _Kw}, and in
 * a second open implementation). Check values: release Table 3.
 *
 * <p>R11-24 (IAPWS, <i>Revised Release on the Ionization Constant of H2O</i>, 2024) keeps the form,
 * n and the γ coefficients and changes α and β. Those six values were taken from two open
 * implementations (MilanSkocic/iapws, MIT licence, and the R package iapws 1.2), which agree digit
 * for digit; they are not yet checked against the IAPWS document itself, hence {@link
 * Reference.Confidence#RETRIEVED}. Check values: the test table of the first of those
 * implementations.
 *
 * <p>Kw is molal: Kw = a(H⁺) a(OH⁻) / a(H2O)², m° = 1 mol/kg. Validity: {@link #validity()} on T
 * and {@link #DENSITY_VALIDITY} on ρ. R11-07: 273.15 K to 1073.15 K (0 °C to 800 °C) and 0 to 1.25
 * g cm⁻³. R11-24 states 273.15 K to 1273.15 K and 0 to 1000 MPa; its density range was not seen, so
 * the R11-07 density range is applied to both. Units at the methods: K, kg/m³.
 */
final class IonizationConstant {

  /** IAPWS R11-07. */
  static final Reference REFERENCE_R11_07 =
      new Reference(
          "IAPWS R11-07",
          "IAPWS, Release on the Ionization Constant of H2O, R11-07 (2007); A. V. Bandura and"
              + " S. N. Lvov, J. Phys. Chem. Ref. Data 35 (2006) 15",
          Reference.Confidence.VERIFIED_BY_CHECK_TABLE);

  /** IAPWS R11-24, coefficients as found in two open implementations. */
  static final Reference REFERENCE_R11_24 =
      new Reference(
          "IAPWS R11-24",
          "IAPWS, Revised Release on the Ionization Constant of H2O, R11-24 (2024), coefficients"
              + " as given by the open implementations MilanSkocic/iapws and R package iapws 1.2;"
              + " see also Arcis et al., J. Phys. Chem. Ref. Data 49 (2020) 033103",
          Reference.Confidence.RETRIEVED);

  /** Density range, both releases (R11-07: 0 to 1.25 g cm⁻³), kg/m³. */
  static final ValidityRange DENSITY_VALIDITY =
      new ValidityRange("density", 0, 1250, "kg/m3", REFERENCE_R11_07);

  /** R11-07 coefficient table: n. */
  static final int N = 6;

  /** R11-07 coefficient table (unchanged in R11-24): γ0, γ1 (K), γ2 (K²), γ3 (K³). */
  static final double[] GAMMA = {0.61415, 48251.33, -67707.93, 10102100};

  /** Molar mass of water used in the release equation, g/mol. */
  static final double MW = 18.015268;

  /** R11-07 coefficient table: α0, α1 (K), α2 (K² (g cm⁻³)^(−2/3)). */
  static final double[] ALPHA_R11_07 = {-0.864671, 8659.19, -22786.2};

  /** R11-07 coefficient table: β0 (cm³ g⁻¹), β1 (K cm³ g⁻¹), β2 (cm⁶ g⁻²). */
  static final double[] BETA_R11_07 = {0.642044, -56.8534, -0.375754};

  /** R11-24: α0, α1 (K), α2 (K² (g cm⁻³)^(−2/3)). */
  static final double[] ALPHA_R11_24 = {-0.702132, 8681.05, -24145.1};

  /** R11-24: β0 (cm³ g⁻¹), β1 (K cm³ g⁻¹), β2 (cm⁶ g⁻²). */
  static final double[] BETA_R11_24 = {0.813876, -51.4471, -0.469920};

  /** The R11-07 formulation (the default). */
  static final IonizationConstant R11_07 =
      new IonizationConstant(
          ALPHA_R11_07,
          BETA_R11_07,
          new ValidityRange("temperature", 273.15, 1073.15, "K", REFERENCE_R11_07));

  /** The R11-24 formulation. */
  static final IonizationConstant R11_24 =
      new IonizationConstant(
          ALPHA_R11_24,
          BETA_R11_24,
          new ValidityRange("temperature", 273.15, 1273.15, "K", REFERENCE_R11_24));

  private static final double TWO_THIRDS = 2.0 / 3.0;

  private static final double LOG10_MW_TERM = 2 * Math.log10(MW / 1000);

  private final double alpha0;
  private final double alpha1;
  private final double alpha2;
  private final double beta0;
  private final double beta1;
  private final double beta2;
  private final ValidityRange validity;

  private IonizationConstant(double[] alpha, double[] beta, ValidityRange validity) {
    this.alpha0 = alpha[0];
    this.alpha1 = alpha[1];
    this.alpha2 = alpha[2];
    this.beta0 = beta[0];
    this.beta1 = beta[1];
    this.beta2 = beta[2];
    this.validity = validity;
  }

  /** The formulation for a facade choice. */
  static IonizationConstant of(IonizationFormulation formulation) {
    return switch (formulation) {
      case R11_07 -> R11_07;
      case R11_24 -> R11_24;
    };
  }

  /** Temperature range of this formulation, K. */
  ValidityRange validity() {
    return validity;
  }

  /**
   * pKw from T and ρ.
   *
   * @param temperatureK T, K
   * @param densityKgPerM3 ρ, kg/m³
   * @return −log10 Kw, Kw molal
   * @throws org.kwanta.model.OutOfValidityRangeException outside {@link #validity()} or {@link
   *     #DENSITY_VALIDITY}, or for NaN
   */
  double pKw(double temperatureK, double densityKgPerM3) {
    validity.check(temperatureK);
    DENSITY_VALIDITY.check(densityKgPerM3);
    return pKwUnchecked(temperatureK, densityKgPerM3);
  }

  /** pKw without range checks; the caller has checked T and ρ. */
  double pKwUnchecked(double t, double densityKgPerM3) {
    double rho = densityKgPerM3 / 1000;
    double invT = 1 / t;
    double z =
        rho * Math.exp(alpha0 + alpha1 * invT + alpha2 * Math.pow(rho, TWO_THIRDS) * invT * invT);
    double pKwG = GAMMA[0] + invT * (GAMMA[1] + invT * (GAMMA[2] + invT * GAMMA[3]));
    return -2 * N * (Math.log10(1 + z) - z / (z + 1) * rho * (beta0 + beta1 * invT + beta2 * rho))
        + pKwG
        + LOG10_MW_TERM;
  }
}
