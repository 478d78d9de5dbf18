package org.kwanta.model.aqueous;

import org.kwanta.model.water.WaterState;

/**
 * The pH and ionic strength of a speciation, without its species (see {@link
 * Speciation#ph(Composition, WaterState, SpeciationOptions)}).
 *
 * @param ph pH at temperature, molal activity scale: −log10 a(H⁺)
 * @param ionicStrengthMolPerKg ionic strength, mol/kg
 */
public record PhSolution(double ph, double ionicStrengthMolPerKg) {}
