/**
 * Aqueous equilibria, activity and speciation on the molal scale, for liquid water 0-350 °C.
 *
 * <p>Entry point: {@link org.kwanta.model.aqueous.Speciation}. Inputs are a {@link
 * org.kwanta.model.aqueous.Composition} (total molalities per {@link
 * org.kwanta.model.aqueous.Component}; {@link org.kwanta.model.aqueous.Amounts} converts mg/kg and
 * µg/kg) and a {@link org.kwanta.model.water.WaterState}. Every equilibrium constant is data in
 * {@link org.kwanta.model.aqueous.EquilibriumConstants}; {@link
 * org.kwanta.model.aqueous.ConstantSets} holds the default choice and the alternatives the pH band
 * is evaluated over. The sodium ion pairs and polyborates ({@link
 * org.kwanta.model.aqueous.Association}) are carried by default and can be turned off in {@link
 * org.kwanta.model.aqueous.SpeciationOptions}.
 */
package org.kwanta.model.aqueous;
