package org.kwanta.model.water;

import java.util.Objects;
import org.kwanta.model.Reference;
import org.kwanta.model.ValidityRange;

/**
 * Vapour–liquid distribution constants of volatile solutes between steam and water: the facade over
 * {@link CarbonDioxideDistribution} (IAPWS G7-04), {@link AmmoniaDistribution} (an estimate from a
 * Henry's-law fit) and {@link AmineDistribution} (morpholine, ethanolamine, cyclohexylamine,
 * dimethylamine, methoxypropylamine, diethylaminoethanol: order-of-magnitude estimates recalled
 * from memory, ±100 %, since no K_D correlation for them was retrieved; their confidence says so).
 *
 * <p>Range: each correlation's fit range; beyond it, up to {@link #ENGINE_LIMIT} (623.15 K, the
 * speciation engine's liquid limit), the value is returned marked extrapolated, with a larger
 * uncertainty; outside that, {@link org.kwanta.model.OutOfValidityRangeException}.
 */
public final class Distribution {

  /**
   * The range in which Kwanta evaluates distribution constants, K: the speciation engine's liquid
   * range, 273.15–623.15 K. Kwanta's limit.
   */
  public static final ValidityRange ENGINE_LIMIT =
      new ValidityRange(
          "temperature",
          273.15,
          623.15,
          "K",
          new Reference(
              "Kwanta distribution constants (to 350 °C)",
              "Kwanta evaluates vapour-liquid distribution constants where it speciates liquid"
                  + " water, 273.15-623.15 K; beyond a correlation's fit range the value is"
                  + " marked extrapolated",
              Reference.Confidence.ESTIMATED));

  private Distribution() {}

  /**
   * K_D of a solute at a temperature on the saturation line.
   *
   * @param solute the solute
   * @param temperatureK T, K
   * @return the constant with its source, fit range and uncertainty
   * @throws org.kwanta.model.OutOfValidityRangeException outside {@link #ENGINE_LIMIT} or the
   *     correlation's own hard limit, or for NaN
   */
  public static DistributionConstant at(VolatileSolute solute, double temperatureK) {
    Objects.requireNonNull(solute, "solute");
    ENGINE_LIMIT.check(temperatureK);
    return switch (solute) {
      case CARBON_DIOXIDE -> {
        CarbonDioxideDistribution.VALIDITY.check(temperatureK);
        yield new DistributionConstant(
            solute,
            temperatureK,
            Math.exp(CarbonDioxideDistribution.lnKd(temperatureK)),
            CarbonDioxideDistribution.RELATIVE_UNCERTAINTY,
            CarbonDioxideDistribution.VALIDITY,
            false,
            CarbonDioxideDistribution.REFERENCE);
      }
      case AMMONIA ->
          new DistributionConstant(
              solute,
              temperatureK,
              AmmoniaDistribution.kD(temperatureK),
              AmmoniaDistribution.relativeUncertainty(temperatureK),
              AmmoniaDistribution.VALIDITY,
              !AmmoniaDistribution.VALIDITY.contains(temperatureK),
              AmmoniaDistribution.REFERENCE);
      // every other solute is an amine of the estimate table
      default ->
          new DistributionConstant(
              solute,
              temperatureK,
              AmineDistribution.kD(solute, temperatureK),
              AmineDistribution.relativeUncertainty(temperatureK),
              AmineDistribution.VALIDITY,
              !AmineDistribution.VALIDITY.contains(temperatureK),
              AmineDistribution.REFERENCE);
    };
  }
}
