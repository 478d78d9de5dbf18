package org.kwanta.service.chemistry;

import io.swagger.v3.oas.annotations.media.Schema;
import org.kwanta.model.aqueous.AmountUnit;
import org.kwanta.model.aqueous.Amounts;
import org.kwanta.model.aqueous.Component;

/** A component's total as given and as used by the engine. */
@Schema(description = "A component's total as given and as the molality the engine used")
record ComponentTotal(
    @Schema(example = "ammonia") String component,
    @Schema(description = "formula the total is counted as (mass basis)", example = "NH3")
        String countedAs,
    @Schema(description = "molar mass of countedAs, g/mol", example = "17.031")
        double molarMassGPerMol,
    @Schema(example = "0.8") double amount,
    @Schema(example = "mg/kg") String unit,
    @Schema(example = "4.6973e-5") double molalityMolPerKg) {

  static ComponentTotal of(Component c, double amount, AmountUnit unit, double molPerKg) {
    return new ComponentTotal(
        SpeciationInputs.apiName(c),
        c.countedAs(),
        Amounts.molarMassGPerMol(c),
        amount,
        unit.ucum(),
        molPerKg);
  }
}
