package org.kwanta.model.conductivity;

import org.kwanta.model.aqueous.Species;

/**
 * Limiting molar conductivity of an ion at temperature, Walden's rule with the Arrhenius-type
 * correction of the PHREEQC database:
 *
 * <pre>
 *   λ°ᵢ(T) = λ°ᵢ(25 °C) · η(25 °C)/η(T) · exp[ dw_Tᵢ · (1/T − 1/298.15 K) ]
 * </pre>
 *
 * with η from IAPWS R12-08 ({@link WaterViscosity}). Source: {@link Species#DW_T} (the λ scaling
 * PHREEQC applies in its specific-conductance calculation); λ°(25 °C) and dw_T per {@link Species}.
 * Against tabulated values (Lange's Handbook Table 8.32, 0 and 18 °C) it is within about 3 % at 0
 * °C and 1–2 % between 15 and 45 °C. Valid 0–100 °C ({@link Conductivity#TEMPERATURE_VALIDITY}).
 */
final class LimitingConductivity {

  /** Reference temperature of λ°(25 °C), K. */
  static final double T25_K = 298.15;

  private LimitingConductivity() {}

  /**
   * λ° of one ion.
   *
   * @param ion the ion
   * @param temperatureK temperature, K
   * @param viscosityRatio η(25 °C)/η(T), dimensionless
   * @return λ° per unit charge, S cm² mol⁻¹
   */
  static double at(Species ion, double temperatureK, double viscosityRatio) {
    return ion.lambda25() * viscosityRatio * Math.exp(ion.dwT() * (1 / temperatureK - 1 / T25_K));
  }
}
