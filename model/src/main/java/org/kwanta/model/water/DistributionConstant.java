package org.kwanta.model.water;

import org.kwanta.model.Reference;
import org.kwanta.model.ValidityRange;

/**
 * The vapour–liquid distribution constant of a neutral solute at one temperature on the saturation
 * line: K_D = y/x at infinite dilution, y the solute's mole fraction in the steam and x in the
 * coexisting water (the IAPWS G7-04 convention, steam over liquid). At infinite dilution it equals
 * the ratio of molalities (or µg/kg) in condensed steam and in the water.
 *
 * @param solute the solute
 * @param temperatureK temperature, K
 * @param kD K_D, dimensionless (steam over liquid)
 * @param relativeUncertainty the source's stated or estimated relative uncertainty of K_D (one
 *     standard uncertainty), dimensionless
 * @param fitRange the temperature range the correlation was fitted to
 * @param extrapolated true when {@code temperatureK} lies outside {@code fitRange}
 * @param source the correlation, with its confidence
 */
public record DistributionConstant(
    VolatileSolute solute,
    double temperatureK,
    double kD,
    double relativeUncertainty,
    ValidityRange fitRange,
    boolean extrapolated,
    Reference source) {}
