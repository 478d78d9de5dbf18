package org.kwanta.model.conductivity;

/**
 * A solved solution at one temperature: totals, pH, ionic strength and conductivity.
 *
 * @param solutes total amounts, mol/kg
 * @param pH −log10 a(H⁺), molal activity scale
 * @param ionicStrength molal ionic strength, mol/kg
 * @param kappa conductivity at the solution's temperature, µS/cm
 * @param temperatureK temperature, K
 */
public record Solution(
    Solutes solutes, double pH, double ionicStrength, double kappa, double temperatureK) {}
