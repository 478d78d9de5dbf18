package org.kwanta.model.evaluation;

import org.kwanta.model.conductivity.AlkalizerMix;

/**
 * What the engine needs to know about a sample point.
 *
 * @param id sample point id, e.g. {@code "U1-ECO-IN"}
 * @param regime treatment at the point (selects the solute models)
 * @param alkalizer the alkalizer or mix of known molar ratio (volatile regimes)
 * @param operatingTemperatureK process temperature at the point, K, for the at-temperature pH
 * @param operatingPressurePa process pressure, Pa; NaN for the saturation pressure
 * @param steam true for a steam sample (saturated, main or reheat steam): its pH at temperature is
 *     that of the first condensate
 * @param tolerances instrument tolerances
 * @param checks check thresholds
 */
public record SamplePointConfig(
    String id,
    Regime regime,
    AlkalizerMix alkalizer,
    double operatingTemperatureK,
    double operatingPressurePa,
    boolean steam,
    Tolerances tolerances,
    CheckSettings checks) {

  /** A liquid sample point with default tolerances and check settings. */
  public static SamplePointConfig of(
      String id,
      Regime regime,
      AlkalizerMix alkalizer,
      double operatingTemperatureK,
      double operatingPressurePa) {
    return new SamplePointConfig(
        id,
        regime,
        alkalizer,
        operatingTemperatureK,
        operatingPressurePa,
        false,
        Tolerances.defaults(),
        CheckSettings.defaults());
  }

  /** The same point as a steam sample. */
  public SamplePointConfig asSteam() {
    return new SamplePointConfig(
        id,
        regime,
        alkalizer,
        operatingTemperatureK,
        operatingPressurePa,
        true,
        tolerances,
        checks);
  }
}
