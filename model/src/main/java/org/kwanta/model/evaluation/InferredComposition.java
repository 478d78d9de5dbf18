package org.kwanta.model.evaluation;

import org.kwanta.model.conductivity.Solutes;

/**
 * The composition inferred from the 25 °C readings, with its uncertainty from the instrument
 * tolerances (first-order: each reading perturbed by its tolerance, effects added in quadrature).
 *
 * @param solutes total amounts, mol/kg (alkalizer as the configured mix)
 * @param uncertainty standard-uncertainty-like spread of each amount, mol/kg
 * @param alkalizerMgPerKg alkalizer, mg/kg (NaN without specific conductivity)
 * @param chlorideEquivalentUgPerKg strong-acid anions as chloride, µg/kg
 * @param carbonDioxideUgPerKg carbon dioxide, µg/kg (0 without degassed cation conductivity)
 * @param sodiumUgPerKg sodium, µg/kg (from the sodium analyser, or fitted for phosphate and caustic
 *     treatment)
 * @param phosphateMgPerKg phosphate as PO₄, mg/kg
 * @param sodiumToPhosphateMolarRatio Na:PO₄ molar ratio (NaN unless phosphate treatment)
 */
public record InferredComposition(
    Solutes solutes,
    Solutes uncertainty,
    double alkalizerMgPerKg,
    double chlorideEquivalentUgPerKg,
    double carbonDioxideUgPerKg,
    double sodiumUgPerKg,
    double phosphateMgPerKg,
    double sodiumToPhosphateMolarRatio) {}
