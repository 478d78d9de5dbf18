package org.kwanta.model.evaluation;

import org.kwanta.model.Instrument;

/**
 * Why a consistency check fired. The codes are Kwanta's own; the meaning is one sentence; the
 * instrument (or process) it points at is the usual one (signal checks name the analyser of the
 * parameter concerned instead).
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
  TWO_COMPOSITIONS_FIT(
      "Phosphate or caustic water: specific conductivity lies below the conductivity of the acids"
          + " the cation channel found, so two sodium amounts fit it; without a sodium reading the"
          + " alkaline one is reported.",
      Instrument.PROCESS),
  NO_CONSISTENT_COMPOSITION(
      "Phosphate or caustic water: no sodium amount gives the specific conductivity read with the"
          + " acids of the cation channel, or the sodium reading matches neither amount that does.",
      Instrument.SPECIFIC_CONDUCTIVITY),
  DEGASSED_ABOVE_CATION(
      "Degassed cation conductivity exceeds cation conductivity beyond tolerance, although"
          + " degassing can only remove acids.",
      Instrument.DEGASSED_CATION_CONDUCTIVITY),
  BELOW_PURE_WATER(
      "A conductivity reads below the theoretical conductivity of pure water at its sample"
          + " temperature.",
      Instrument.SPECIFIC_CONDUCTIVITY),
  CARBON_DIOXIDE_INGRESS(
      "Cation conductivity is well above degassed cation conductivity, or rose over its baseline"
          + " while the degassed channel did not follow: carbon dioxide (air in-leakage), not"
          + " salts.",
      Instrument.PROCESS),
  COOLING_WATER_INGRESS(
      "Sodium and cation conductivity rose over their baselines together, in the proportions the"
          + " plant's declared cooling water would give: a condenser leak.",
      Instrument.PROCESS),
  CONTAMINANT_INGRESS(
      "Cation conductivity (or the make-up water's conductivity) rose over its baseline with"
          + " evidence of a process cause (neighbouring points followed, or sodium came with it):"
          + " contamination entering the cycle.",
      Instrument.PROCESS),
  CATION_COLUMN_EXHAUSTED(
      "Cation conductivity rose over its baseline while sodium, the neighbouring points and the"
          + " degassed channel's carbon dioxide signature do not explain it: the cation exchanger"
          + " is letting the alkalizer through.",
      Instrument.CATION_CONDUCTIVITY),
  SODIUM_WITHOUT_CATION_RISE(
      "Sodium rose over its baseline by so much that cooling water would have raised cation"
          + " conductivity clearly, but cation conductivity stayed put and no neighbour followed:"
          + " check the sodium analyser.",
      Instrument.SODIUM),
  PH_ELECTRODE_DRIFT(
      "Measured minus calculated pH drifts away from its baseline (a cumulative-sum test) while"
          + " specific conductivity stayed steady: the pH electrode is drifting.",
      Instrument.PH),
  PH_ELECTRODE_STEP(
      "Measured minus calculated pH jumped away from its baseline within minutes while specific"
          + " conductivity stayed steady: the pH electrode or its reference junction shifted.",
      Instrument.PH),
  SPECIFIC_CONDUCTIVITY_DRIFT(
      "Specific conductivity drifts away from what the measured pH and cation conductivity"
          + " predict, while the pH stayed steady: cell fouling or a cell-constant change.",
      Instrument.SPECIFIC_CONDUCTIVITY),
  SPECIFIC_CONDUCTIVITY_STEP(
      "Specific conductivity jumped away from what the measured pH and cation conductivity"
          + " predict, while the pH stayed steady: the conductivity cell or its cable.",
      Instrument.SPECIFIC_CONDUCTIVITY),
  DOSING_CHANGE(
      "Specific conductivity and measured pH moved together, consistently with each other, well"
          + " away from their baselines: the alkalizer dose changed (no instrument fault).",
      Instrument.PROCESS),
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
  private final Instrument usuallyPointsAt;

  ReasonCode(String meaning, Instrument usuallyPointsAt) {
    this.meaning = meaning;
    this.usuallyPointsAt = usuallyPointsAt;
  }

  /** One-sentence meaning. */
  public String meaning() {
    return meaning;
  }

  /**
   * What the finding usually points at; for {@link #STALE}, {@link #FLATLINE}, {@link
   * #OUT_OF_RANGE} and {@link #BELOW_PURE_WATER} the finding names the analyser of the parameter
   * concerned.
   */
  public Instrument usuallyPointsAt() {
    return usuallyPointsAt;
  }
}
