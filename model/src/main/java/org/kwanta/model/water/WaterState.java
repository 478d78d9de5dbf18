package org.kwanta.model.water;

/**
 * Properties of water at one temperature and pressure, SI units throughout.
 *
 * @param temperatureK temperature, K
 * @param pressurePa pressure used, Pa
 * @param pressureSource whether the pressure was given or taken from the saturation line
 * @param phase IF97 region of the state
 * @param saturationPressurePa IF97 region-4 saturation pressure at {@code temperatureK}, Pa (NaN
 *     above the critical temperature)
 * @param densityKgPerM3 density, kg/m³ (IF97)
 * @param ionization the formulation that gave {@code pKw}
 * @param pKw −log10 Kw, Kw molal (mol²/kg²)
 * @param relativePermittivity static dielectric constant ε (IAPWS R8-97), dimensionless; NaN above
 *     the release's 873 K
 * @param debyeHuckelA Debye–Hückel A, molal, log10 (kg^½ mol^−½); NaN where the state is not
 *     liquid-like ({@link #liquidLike()}) or ε is not available
 * @param debyeHuckelB Debye–Hückel B, molal (Å⁻¹ kg^½ mol^−½); NaN like {@code debyeHuckelA}
 */
public record WaterState(
    double temperatureK,
    double pressurePa,
    PressureSource pressureSource,
    Phase phase,
    double saturationPressurePa,
    double densityKgPerM3,
    IonizationFormulation ionization,
    double pKw,
    double relativePermittivity,
    double debyeHuckelA,
    double debyeHuckelB) {

  /** Neutral pH on the molal activity scale: pKw / 2. */
  public double neutralPh() {
    return pKw / 2;
  }

  /**
   * True when the density is at least the critical density ({@link Water#LIQUID_LIKE_DENSITY}): the
   * states in which a liquid pH scale and Debye–Hückel activity coefficients mean something.
   */
  public boolean liquidLike() {
    return densityKgPerM3 >= Water.LIQUID_LIKE_DENSITY.min();
  }
}
