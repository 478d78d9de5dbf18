package org.kwanta.model.aqueous;

import org.kwanta.model.Reference;
import org.kwanta.model.ValidityRange;

/**
 * An association constant as used in one speciation.
 *
 * @param association the reaction (ion pair or polyborate)
 * @param log10K log10 of the constant as the source writes it, at the temperature (molal)
 * @param extrapolated true when the temperature lies outside the fit's stated range
 */
public record AssociationUsed(Association association, double log10K, boolean extrapolated) {

  /** The source's citation and confidence. */
  public Reference reference() {
    return association.reference();
  }

  /** The fit's stated temperature range, K. */
  public ValidityRange validity() {
    return association.validity();
  }
}
