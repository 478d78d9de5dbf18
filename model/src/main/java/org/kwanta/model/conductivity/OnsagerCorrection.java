package org.kwanta.model.conductivity;

import org.kwanta.model.Reference;
import org.kwanta.model.ValidityRange;

/**
 * Concentration correction of ionic conductivities: the Debye–Hückel–Onsager limiting law, in the
 * per-ion form
 *
 * <pre>
 *   λᵢ = λ°ᵢ − (B1·λ°ᵢ + B2/2) · |zᵢ| · √I
 *   B1 = 8.204×10⁵ / (ε_r T)^{3/2}           ((L/mol)^½)
 *   B2 = 82.48 / (η_P (ε_r T)^{1/2})         (S cm² mol⁻¹ (L/mol)^½, η_P in poise)
 * </pre>
 *
 * with I the ionic strength on the molar scale, mol/L. Exact for 1:1 electrolytes in the
 * limiting-law range; an approximation for mixtures and multivalent ions (about +0.5 % for Na₂SO₄
 * at 5×10⁻⁴ mol/L against CRC data). Source: {@link #ROBINSON_STOKES} (textbook form, recalled from
 * memory). Valid for {@link #VALIDITY}.
 */
final class OnsagerCorrection {

  /** The textbook form of the limiting law. */
  static final Reference ROBINSON_STOKES =
      new Reference(
          "Onsager limiting law",
          "Debye-Hückel-Onsager limiting law, standard form as in R. A. Robinson and R. H. Stokes,"
              + " Electrolyte Solutions, 2nd ed., Butterworths 1959 (constants recalled from"
              + " memory)",
          Reference.Confidence.FROM_MEMORY);

  /** Ionic strength range of the limiting law, mol/L. */
  static final ValidityRange VALIDITY =
      new ValidityRange("ionic strength", 0.0, 1.0e-3, "mol/L", ROBINSON_STOKES);

  /** Numerator of B1, (L/mol)^½ K^{3/2}. */
  private static final double B1_NUMERATOR = 8.204e5;

  /** Numerator of B2, S cm² mol⁻¹ (L/mol)^½ poise K^½. */
  private static final double B2_NUMERATOR = 82.48;

  private OnsagerCorrection() {}

  /** B1 at a temperature, (L/mol)^½. */
  static double b1(double relativePermittivity, double temperatureK) {
    double et = relativePermittivity * temperatureK;
    return B1_NUMERATOR / (et * Math.sqrt(et));
  }

  /**
   * B2 at a temperature.
   *
   * @param viscosityPaS viscosity, Pa·s (converted to poise inside)
   * @return B2, S cm² mol⁻¹ (L/mol)^½
   */
  static double b2(double relativePermittivity, double temperatureK, double viscosityPaS) {
    double etaPoise = viscosityPaS * 10;
    return B2_NUMERATOR / (etaPoise * Math.sqrt(relativePermittivity * temperatureK));
  }
}
