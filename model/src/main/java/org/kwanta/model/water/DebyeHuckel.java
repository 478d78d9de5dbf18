package org.kwanta.model.water;

import org.kwanta.model.Reference;
import org.kwanta.model.ValidityRange;

/**
 * Debye–Hückel parameters A and B on the molal scale (log10), from the relative permittivity and
 * density of water.
 *
 * <p>With the Bjerrum length l_B = e² / (4π ε0 ε k T): A = (2π N_A ρ)^½ l_B^(3/2) / ln 10 in kg^½
 * mol^−½, and B = (8π N_A ρ l_B)^½ in m⁻¹ kg^½ mol^−½, returned in Å⁻¹ kg^½ mol^−½ (×1e-10); ρ in
 * kg/m³. These are the Debye–Hückel (1923) limiting-law parameters in the form used by H. C.
 * Helgeson and D. H. Kirkham, Am. J. Sci. 274 (1974) 1089, whose numeric forms A = 1.824928e6 ρ^½
 * (εT)^(−3/2) and B = 50.29158 ρ^½ (εT)^(−½) (ρ in g cm⁻³) follow from older constants. Constants
 * here: CODATA 2018 (E. Tiesinga et al., Rev. Mod. Phys. 93 (2021) 025010); e, k and N_A are exact
 * in the SI since 2019.
 *
 * <p>Validity: {@link #VALIDITY} on ε (any ε ≥ 1); the limiting law itself holds for dilute
 * solutions only, which is the caller's concern. Units: K, kg/m³.
 */
final class DebyeHuckel {

  /** CODATA 2018 constants with the Debye–Hückel / Helgeson–Kirkham forms. */
  static final Reference REFERENCE =
      new Reference(
          "Debye-Hückel A, B (CODATA 2018)",
          "P. Debye and E. Hückel, Phys. Z. 24 (1923) 185; forms as in H. C. Helgeson and"
              + " D. H. Kirkham, Am. J. Sci. 274 (1974) 1089; constants CODATA 2018"
              + " (E. Tiesinga et al., Rev. Mod. Phys. 93 (2021) 025010)",
          Reference.Confidence.RETRIEVED);

  /** Relative permittivity must be at least that of vacuum. */
  static final ValidityRange VALIDITY =
      new ValidityRange("relative permittivity", 1, Double.POSITIVE_INFINITY, "1", REFERENCE);

  /** Elementary charge, C (exact, CODATA 2018). */
  static final double E = 1.602176634e-19;

  /** Boltzmann constant, J/K (exact, CODATA 2018). */
  static final double K_BOLTZMANN = 1.380649e-23;

  /** Avogadro constant, 1/mol (exact, CODATA 2018). */
  static final double N_AVOGADRO = 6.02214076e23;

  /** Vacuum electric permittivity, F/m (CODATA 2018). */
  static final double EPSILON_0 = 8.8541878128e-12;

  private static final double E2_OVER_4PI_EPS0_K = E * E / (4 * Math.PI * EPSILON_0 * K_BOLTZMANN);

  private DebyeHuckel() {}

  /**
   * Debye–Hückel A, molal, for log10 γ.
   *
   * @param temperatureK T, K
   * @param densityKgPerM3 ρ of water, kg/m³
   * @param relativePermittivity ε of water
   * @return A, kg^½ mol^−½
   */
  static double a(double temperatureK, double densityKgPerM3, double relativePermittivity) {
    VALIDITY.check(relativePermittivity);
    double bjerrum = E2_OVER_4PI_EPS0_K / (relativePermittivity * temperatureK);
    return Math.sqrt(2 * Math.PI * N_AVOGADRO * densityKgPerM3)
        * bjerrum
        * Math.sqrt(bjerrum)
        / Math.log(10);
  }

  /**
   * Debye–Hückel B, molal.
   *
   * @param temperatureK T, K
   * @param densityKgPerM3 ρ of water, kg/m³
   * @param relativePermittivity ε of water
   * @return B, Å⁻¹ kg^½ mol^−½
   */
  static double b(double temperatureK, double densityKgPerM3, double relativePermittivity) {
    VALIDITY.check(relativePermittivity);
    double bjerrum = E2_OVER_4PI_EPS0_K / (relativePermittivity * temperatureK);
    return Math.sqrt(8 * Math.PI * N_AVOGADRO * densityKgPerM3 * bjerrum) * 1e-10;
  }
}
