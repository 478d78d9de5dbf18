package org.kwanta.model.evaluation;

/**
 * Instrument tolerances propagated into the composition and every number computed from it.
 *
 * @param specificConductivityRelative relative tolerance of specific conductivity (0.02 = ±2 %)
 * @param cationConductivityAbsolute absolute tolerance of cation and degassed cation conductivity,
 *     µS/cm
 * @param ph absolute tolerance of measured pH
 * @param sodiumRelative relative tolerance of sodium
 */
public record Tolerances(
    double specificConductivityRelative,
    double cationConductivityAbsolute,
    double ph,
    double sodiumRelative) {

  /** ±2 % SC, ±0.01 µS/cm CACE and DCACE, ±0.05 pH, ±10 % Na. */
  public static Tolerances defaults() {
    return new Tolerances(0.02, 0.01, 0.05, 0.10);
  }
}
