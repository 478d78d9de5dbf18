package org.kwanta.model.evaluation;

import java.time.Instant;
import org.kwanta.model.Parameter;

/**
 * One analyser reading.
 *
 * @param time when it was taken
 * @param value value in the unit of its {@link Parameter}
 * @param sampleTemperatureK sample temperature at the analyser, K (NaN for sodium if unknown)
 * @param compensatedByAnalyser true when the analyser already reports the value at 25 °C (then the
 *     engine cannot undo a wrong compensation, and marks the value so)
 */
public record Reading(
    Instant time, double value, double sampleTemperatureK, boolean compensatedByAnalyser) {

  /** A raw reading at a sample temperature. */
  public static Reading raw(Instant time, double value, double sampleTemperatureK) {
    return new Reading(time, value, sampleTemperatureK, false);
  }
}
