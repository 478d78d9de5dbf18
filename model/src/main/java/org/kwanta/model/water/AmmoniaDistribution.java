package org.kwanta.model.water;

import org.kwanta.model.Reference;
import org.kwanta.model.ValidityRange;

/**
 * Vapour–liquid distribution constant K_D of ammonia between steam and water on the saturation
 * line, derived from a Henry's-law fit: an estimate.
 *
 * <p>No distribution measurement could be retrieved (M. E. Jones, J. Phys. Chem. 67 (1963) 1113; D.
 * A. Palmer and J. M. Simonson, J. Chem. Eng. Data 38 (1993) 465: their coefficients were not at
 * hand). Instead: log10 K_H = A1 + A2 T + A3/T + A4 log10 T + A5/T² for NH3(g) = NH3(aq), K_H in
 * mol kg⁻¹ bar⁻¹, from the SUPCRT92-based database {@code llnl.dat} distributed with PHREEQC (0–300
 * °C; its log K at 25 °C is 1.7966), as transcribed in the project's shared reference notes
 * (section 1.4). With an ideal vapour (fugacity coefficient 1): K_D = (1000/M_w) / (K_H p_s), p_s
 * in bar from IF97 region 4, M_w = 18.015268 g/mol.
 *
 * <p>Confidence: {@link Reference.Confidence#ESTIMATED}. The llnl and Thermoddem fits agree to ±5 %
 * up to 150 °C and diverge above (35–50 % at 250–300 °C); the fugacity coefficient of NH3 in steam
 * below 1 would raise K_D by 10–25 % at 250–300 °C. {@link #relativeUncertainty} follows the shared
 * notes' flag: 10 % to 150 °C, 20 % at 200 °C, 40 % at 300 °C, linear between, and beyond the fit
 * 40 % plus 10 % per 10 K.
 *
 * <p>Range: {@link #VALIDITY}, the fit's 273.15–573.15 K; the engine evaluates it up to 623.15 K
 * and marks the value extrapolated. Units: K; K_D dimensionless.
 */
final class AmmoniaDistribution {

  /** The Henry's-law fit and the derivation, with its confidence. */
  static final Reference REFERENCE =
      new Reference(
          "NH3 K_D from llnl.dat Henry fit (estimate)",
          "K_D of NH3 derived from the NH3(g) = NH3(aq) Henry's-law fit of the SUPCRT92-based"
              + " database llnl.dat (PHREEQC distribution) with an ideal vapour and IF97"
              + " saturation pressure; an estimate pending M. E. Jones, J. Phys. Chem. 67 (1963)"
              + " 1113 and D. A. Palmer and J. M. Simonson, J. Chem. Eng. Data 38 (1993) 465",
          Reference.Confidence.ESTIMATED);

  /** Temperature range of the Henry's-law fit, K. */
  static final ValidityRange VALIDITY =
      new ValidityRange("temperature", 273.15, 573.15, "K", REFERENCE);

  /** llnl.dat analytic coefficients A1 … A5 of log10 K_H (mol kg⁻¹ bar⁻¹). */
  static final double[] A = {-1.8758e1, 3.367e-4, 2.5113e3, 4.8619, 3.9192e1};

  /** Moles of water per kg, 1000/M_w, mol/kg (M_w = 18.015268 g/mol). */
  static final double WATER_MOL_PER_KG = 1000 / 18.015268;

  private AmmoniaDistribution() {}

  /** log10 K_H, K_H in mol kg⁻¹ bar⁻¹, without range check. */
  static double log10HenryConstant(double t) {
    return A[0] + A[1] * t + A[2] / t + A[3] * Math.log10(t) + A[4] / (t * t);
  }

  /** K_D without range check. */
  static double kD(double t) {
    double psBar = Region4.saturationPressurePaUnchecked(t) / 1e5;
    return WATER_MOL_PER_KG / (Math.pow(10, log10HenryConstant(t)) * psBar);
  }

  /** The relative standard uncertainty taken for K_D at T (see class comment). */
  static double relativeUncertainty(double t) {
    double c = t - 273.15;
    if (c <= 150) {
      return 0.10;
    }
    if (c <= 200) {
      return 0.10 + 0.10 * (c - 150) / 50;
    }
    if (c <= 300) {
      return 0.20 + 0.20 * (c - 200) / 100;
    }
    return 0.40 + 0.10 * (c - 300) / 10;
  }
}
