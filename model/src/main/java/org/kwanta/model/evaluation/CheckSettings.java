package org.kwanta.model.evaluation;

import java.time.Duration;

/**
 * Thresholds of the consistency checks. They are engineering choices, not published limits: keep
 * them per sample point.
 *
 * @param phBand accepted |measured − calculated| pH at 25 °C
 * @param phPersistence how long the pH deviation must last before it is reported
 * @param sampleTemperatureBandK accepted |T_sample − 25 °C|, K
 * @param belowPureWaterRelative how far below the pure-water conductivity a reading may read before
 *     it is reported (0.01 = 1 %; trace NaOH can depress it by 0.5 %)
 * @param degassedAboveCationAbsolute allowance of DCACE over CACE, µS/cm
 * @param degassedAboveCationRelative allowance of DCACE over CACE, relative; the larger applies
 * @param carbonDioxideDifference CACE − DCACE above which carbon dioxide is reported, µS/cm
 * @param maximumAge a latest reading older than this is stale and not used
 * @param flatlineDuration identical readings over at least this long are a flat line
 * @param trendCationRise rise of CACE over the history that counts as rising, µS/cm
 * @param trendSodiumRise rise of sodium over the history that counts as rising, µg/kg
 * @param trackingCorrelation Pearson correlation of CACE with SC over the history above which CACE
 *     "tracks" SC
 * @param conductivityRangeMaximum analyser range top for conductivities, µS/cm (readings at or
 *     above it are pinned)
 * @param sodiumRangeMaximum analyser range top for sodium, µg/kg
 */
public record CheckSettings(
    double phBand,
    Duration phPersistence,
    double sampleTemperatureBandK,
    double belowPureWaterRelative,
    double degassedAboveCationAbsolute,
    double degassedAboveCationRelative,
    double carbonDioxideDifference,
    Duration maximumAge,
    Duration flatlineDuration,
    double trendCationRise,
    double trendSodiumRise,
    double trackingCorrelation,
    double conductivityRangeMaximum,
    double sodiumRangeMaximum) {

  /** Defaults: ±0.2 pH for 10 min; 25 ± 2 °C; 1 % below pure water; 10 min age; 60 min flat. */
  public static CheckSettings defaults() {
    return new CheckSettings(
        0.2,
        Duration.ofMinutes(10),
        2.0,
        0.01,
        0.01,
        0.05,
        0.10,
        Duration.ofMinutes(10),
        Duration.ofMinutes(60),
        0.03,
        1.0,
        0.9,
        100.0,
        1000.0);
  }
}
