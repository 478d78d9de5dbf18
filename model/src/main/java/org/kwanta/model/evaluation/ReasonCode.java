package org.kwanta.model.evaluation;

/**
 * Why a consistency check fired. The codes are Kwanta's own; the meaning is one sentence; the
 * suspect is the usual one (signal checks name the analyser of the parameter concerned instead).
 */
public enum ReasonCode {
  PH_MEASURED_VS_CALCULATED(
      "Measured pH differs from the pH calculated from specific and cation conductivity by more"
          + " than the band, for longer than the persistence time.",
      Instrument.PH),
  CATION_ABOVE_SPECIFIC(
      "In a volatile-treated sample cation conductivity exceeds specific conductivity, and no"
          + " sodium or degassed cation rise corroborates contamination.",
      Instrument.CATION_CONDUCTIVITY),
  SPECIFIC_BELOW_PHYSICAL_BOUND(
      "Specific conductivity is below a quarter of the cation conductivity excess over pure"
          + " water, which no solution can produce.",
      Instrument.SPECIFIC_CONDUCTIVITY),
  DEGASSED_ABOVE_CATION(
      "Degassed cation conductivity exceeds cation conductivity beyond tolerance, although"
          + " degassing can only remove acids.",
      Instrument.DEGASSED_CATION_CONDUCTIVITY),
  BELOW_PURE_WATER(
      "A conductivity reads below the theoretical conductivity of pure water at its sample"
          + " temperature.",
      Instrument.SPECIFIC_CONDUCTIVITY),
  CATION_COLUMN_EXHAUSTED(
      "Cation conductivity rises while tracking specific conductivity and sodium stays flat: the"
          + " cation exchanger is exhausted, not the water contaminated.",
      Instrument.CATION_CONDUCTIVITY),
  INGRESS_SUSPECTED(
      "Cation conductivity rises together with sodium or degassed cation conductivity,"
          + " independent of the alkalizer: contamination is entering the cycle.",
      Instrument.PROCESS),
  CARBON_DIOXIDE_INGRESS(
      "Cation conductivity is well above degassed cation conductivity while the latter is low:"
          + " carbon dioxide (air in-leakage), not salts.",
      Instrument.PROCESS),
  SODIUM_WITHOUT_CATION_RISE(
      "Sodium rises without a matching cation conductivity rise: check the sodium analyser, or"
          + " caustic or phosphate carry-over.",
      Instrument.SODIUM),
  STALE(
      "The latest reading is older than the maximum age and was not used.",
      Instrument.SPECIFIC_CONDUCTIVITY),
  FLATLINE(
      "The readings have not changed at all for longer than the flat-line time.",
      Instrument.SPECIFIC_CONDUCTIVITY),
  OUT_OF_RANGE(
      "The reading is missing, non-positive or pinned at the analyser range limit and was not"
          + " used.",
      Instrument.SPECIFIC_CONDUCTIVITY),
  SAMPLE_TEMPERATURE_OUT_OF_BAND(
      "The sample temperature is outside the configured band around 25 °C, so compensation and"
          + " the pH comparison are less certain.",
      Instrument.SAMPLE_CONDITIONING),
  SAMPLE_TEMPERATURE_OUTSIDE_MODEL(
      "The sample temperature is outside 0–100 °C, where the conductivity model is not valid;"
          + " the reading was not compensated or used.",
      Instrument.SAMPLE_CONDITIONING);

  private final String meaning;
  private final Instrument usualSuspect;

  ReasonCode(String meaning, Instrument usualSuspect) {
    this.meaning = meaning;
    this.usualSuspect = usualSuspect;
  }

  /** One-sentence meaning. */
  public String meaning() {
    return meaning;
  }

  /**
   * The usual suspect; for {@link #STALE}, {@link #FLATLINE}, {@link #OUT_OF_RANGE} and {@link
   * #BELOW_PURE_WATER} the finding names the analyser of the parameter concerned.
   */
  public Instrument usualSuspect() {
    return usualSuspect;
  }
}
