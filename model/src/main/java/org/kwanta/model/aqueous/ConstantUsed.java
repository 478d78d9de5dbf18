package org.kwanta.model.aqueous;

import org.kwanta.model.Reference;
import org.kwanta.model.ValidityRange;

/**
 * An equilibrium constant as used in one speciation.
 *
 * @param equilibrium the equilibrium, dissociation direction
 * @param log10K log10 Ka at the temperature (molal)
 * @param sourceId the {@link Fit#id()} it came from
 * @param reference the fit's citation and confidence
 * @param validity the fit's stated temperature range, K
 * @param extrapolated true when the temperature lies outside {@code validity}: the value was
 *     computed by extrapolating the fit
 */
public record ConstantUsed(
    Equilibrium equilibrium,
    double log10K,
    String sourceId,
    Reference reference,
    ValidityRange validity,
    boolean extrapolated) {}
