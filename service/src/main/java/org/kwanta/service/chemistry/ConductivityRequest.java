package org.kwanta.service.chemistry;

import io.swagger.v3.oas.annotations.media.Schema;
import java.util.List;

/**
 * A water's composition and the sample temperature at which to give its conductivities (besides 25
 * °C). Unknown fields are refused.
 */
@Schema(description = "Composition for the forward conductivity calculation")
record ConductivityRequest(
    @Schema(
            description =
                "Totals of the components present (alkalizers, sodium, chloride, sulfate,"
                    + " carbon_dioxide, phosphate); an empty list is pure water")
        List<AmountInput> composition,
    @Schema(
            description = "sample temperature, °C (0–100); the 25 °C values are always given",
            example = "40")
        Double sampleTemperatureCel) {}
