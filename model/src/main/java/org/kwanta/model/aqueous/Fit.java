package org.kwanta.model.aqueous;

import org.kwanta.model.Reference;
import org.kwanta.model.ValidityRange;

/**
 * One published temperature fit of one equilibrium: the function with its coefficients as printed,
 * the source, and the temperature range the source states. Outside that range the engine still
 * evaluates the fit but marks the constant as extrapolated in every result.
 *
 * @param id stable id of our own shown in results, e.g. {@code "ammonium-1"} (the equilibrium and a
 *     number; the source is in {@code reference})
 * @param equilibrium the dissociation equilibrium (the engine's direction)
 * @param function log10 Ka(T) in the engine's direction, built from the printed reaction(s)
 * @param reference citation and confidence ([V] retrieved, [M] from memory, [E] estimated)
 * @param validity the stated temperature range, K
 */
public record Fit(
    String id,
    Equilibrium equilibrium,
    LogKFunction function,
    Reference reference,
    ValidityRange validity) {

  /**
   * log10 Ka at a temperature; computed also outside {@link #validity()} (check {@link
   * #isExtrapolatedAt}).
   *
   * @param temperatureK temperature, K
   * @param pKw −log10 Kw at the same state (used only by the boric-acid quotient)
   */
  public double log10K(double temperatureK, double pKw) {
    return function.log10K(temperatureK, pKw);
  }

  /** True when the temperature lies outside the fit's stated range. */
  public boolean isExtrapolatedAt(double temperatureK) {
    return !validity.contains(temperatureK);
  }
}
