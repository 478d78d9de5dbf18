package org.kwanta.model.diagnosis;

import java.time.Instant;
import java.util.Objects;

/**
 * One minute of one sample point as the diagnosis sees it: the last value of each channel in that
 * minute, NaN where the point has no such channel or no usable value.
 *
 * @param time the start of the minute
 * @param specific25 specific conductivity at 25 °C, µS/cm
 * @param cation25 cation conductivity at 25 °C, µS/cm
 * @param degassed25 degassed cation conductivity at 25 °C, µS/cm
 * @param phMeasured measured pH (as reported by the analyser)
 * @param phCalculated pH at 25 °C calculated from specific and cation conductivity
 * @param sodium sodium, µg/kg
 */
public record Minute(
    Instant time,
    double specific25,
    double cation25,
    double degassed25,
    double phMeasured,
    double phCalculated,
    double sodium) {

  public Minute {
    Objects.requireNonNull(time, "time");
  }

  /** The value of one channel. */
  double value(Channel c) {
    return switch (c) {
      case SPECIFIC -> specific25;
      case CATION -> cation25;
      case DEGASSED -> degassed25;
      case PH -> phMeasured;
      case PH_CALCULATED -> phCalculated;
      case SODIUM -> sodium;
      case PH_RESIDUAL -> phMeasured - phCalculated;
    };
  }
}
