package org.kwanta.model.evaluation;

import java.util.List;
import org.kwanta.model.aqueous.PhUncertainty;

/**
 * pH at the sample point's operating temperature and pressure, from the inferred composition
 * through the speciation engine; for a steam sample, the pH of the liquid in equilibrium with the
 * steam (its first condensate) at the saturation temperature.
 *
 * @param temperatureK temperature of the liquid, K (for a steam sample: T_s at the operating
 *     pressure, or the operating temperature when no pressure is declared)
 * @param pressurePa pressure used, Pa
 * @param ph pH on the molal activity scale
 * @param low lower end of the combined band: the parts of {@code uncertainty} combined by {@link
 *     PhUncertainty#RULE}
 * @param high upper end of the combined band
 * @param neutralPh pKw/2 at that state
 * @param basis what liquid the pH is of
 * @param notes assumptions and sources the reader must see (empty for a liquid sample)
 * @param uncertainty the band itemised: (a) instrument tolerances, (b) constant-set spread, (c)
 *     estimated or extrapolated constants, (d) operating temperature and pressure
 */
public record OperatingPh(
    double temperatureK,
    double pressurePa,
    double ph,
    double low,
    double high,
    double neutralPh,
    Basis basis,
    List<String> notes,
    PhUncertainty uncertainty) {

  public OperatingPh {
    notes = List.copyOf(notes);
  }

  /** What liquid the pH at temperature is of. */
  public enum Basis {
    /** The sampled liquid at the operating temperature and pressure. */
    LIQUID,
    /** The first condensate of the sampled steam (the liquid in equilibrium with it). */
    EARLY_CONDENSATE
  }
}
