package org.kwanta.model.evaluation;

import org.kwanta.model.Parameter;

/**
 * A conductivity at 25 °C.
 *
 * @param parameter which channel
 * @param raw the reading as received, µS/cm
 * @param sampleTemperatureK its sample temperature, K
 * @param at25 conductivity at 25 °C, µS/cm (model-based compensation, or the analyser's own)
 * @param compensatedByAnalyser true when the analyser already compensated it (taken as is)
 * @param belowPureWater true when the reading was below theoretical pure water (then at25 is pure
 *     water at 25 °C)
 */
public record CompensatedValue(
    Parameter parameter,
    double raw,
    double sampleTemperatureK,
    double at25,
    boolean compensatedByAnalyser,
    boolean belowPureWater) {}
