package org.kwanta.model.evaluation;

/**
 * Instrument tolerances propagated into the composition and every number computed from it, and the
 * tolerance of the operating state the pH at temperature is computed for.
 *
 * @param specificConductivityRelative relative tolerance of specific conductivity (0.02 = ±2 %)
 * @param cationConductivityAbsolute absolute tolerance of cation and degassed cation conductivity,
 *     µS/cm
 * @param ph absolute tolerance of measured pH
 * @param sodiumRelative relative tolerance of sodium
 * @param operatingTemperatureK tolerance of the operating temperature, ± K (0: taken as exact)
 * @param operatingPressureRelative relative tolerance of the operating pressure (0.05 = ±5 %; 0:
 *     taken as exact; not used at the saturation pressure, which follows the temperature)
 */
public record Tolerances(
    double specificConductivityRelative,
    double cationConductivityAbsolute,
    double ph,
    double sodiumRelative,
    double operatingTemperatureK,
    double operatingPressureRelative) {

  /** Default operating-temperature tolerance, ± K (common practice, our choice; no source). */
  public static final double OPERATING_TEMPERATURE_K = 2.0;

  /** Default operating-pressure tolerance, relative (common practice, our choice; no source). */
  public static final double OPERATING_PRESSURE_RELATIVE = 0.05;

  public Tolerances {
    if (!(operatingTemperatureK >= 0) || !(operatingPressureRelative >= 0)) {
      throw new IllegalArgumentException(
          "operating tolerances must be ≥ 0: temperature "
              + operatingTemperatureK
              + " K, pressure "
              + operatingPressureRelative);
    }
  }

  /** The instrument tolerances with the default operating tolerances. */
  public Tolerances(
      double specificConductivityRelative,
      double cationConductivityAbsolute,
      double ph,
      double sodiumRelative) {
    this(
        specificConductivityRelative,
        cationConductivityAbsolute,
        ph,
        sodiumRelative,
        OPERATING_TEMPERATURE_K,
        OPERATING_PRESSURE_RELATIVE);
  }

  /**
   * ±2 % SC, ±0.01 µS/cm CACE and DCACE, ±0.05 pH, ±10 % Na; operating temperature ±2 K and
   * pressure ±5 %.
   */
  public static Tolerances defaults() {
    return new Tolerances(0.02, 0.01, 0.05, 0.10);
  }

  /** The same instrument tolerances with other operating tolerances. */
  public Tolerances withOperating(double temperatureK, double pressureRelative) {
    return new Tolerances(
        specificConductivityRelative,
        cationConductivityAbsolute,
        ph,
        sodiumRelative,
        temperatureK,
        pressureRelative);
  }
}
