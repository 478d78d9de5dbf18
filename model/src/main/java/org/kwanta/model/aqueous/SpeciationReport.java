package org.kwanta.model.aqueous;

/**
 * A speciation at temperature together with the 25 °C pH of the same water and the band over
 * alternative constant sets.
 *
 * @param atTemperature the speciation at the given water state
 * @param at25Celsius the same composition at 298.15 K and 0.101325 MPa
 * @param band pH at temperature over the alternative constant sets
 * @param uncertainty the pH at temperature's uncertainty, itemised ({@link PhUncertainty})
 */
public record SpeciationReport(
    SpeciationResult atTemperature,
    SpeciationResult at25Celsius,
    PhBand band,
    PhUncertainty uncertainty) {}
