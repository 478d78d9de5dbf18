package org.kwanta.model.evaluation;

/**
 * pH at the sample point's operating temperature and pressure, from the inferred composition
 * through the speciation engine.
 *
 * @param temperatureK operating temperature, K
 * @param pressurePa pressure used, Pa
 * @param ph pH on the molal activity scale
 * @param low lower end of the band from the instrument tolerances
 * @param high upper end
 * @param neutralPh pKw/2 at that state
 */
public record OperatingPh(
    double temperatureK, double pressurePa, double ph, double low, double high, double neutralPh) {}
