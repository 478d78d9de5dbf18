package org.kwanta.model.aqueous;

/**
 * One species in a speciation result.
 *
 * @param species the species
 * @param molalityMolPerKg molality, mol/kg
 * @param fractionOfComponent molality over the component's total, 0-1
 * @param activityCoefficient molal activity coefficient γ (1 for neutral species)
 */
public record SpeciesAmount(
    Species species,
    double molalityMolPerKg,
    double fractionOfComponent,
    double activityCoefficient) {}
