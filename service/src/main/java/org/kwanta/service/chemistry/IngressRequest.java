package org.kwanta.service.chemistry;

import io.swagger.v3.oas.annotations.media.Schema;
import java.util.List;

/** A water, the cooling water that enters it, and the sodium the leak brings. */
@Schema(description = "Cooling-water leak into a water: the expected rise of each channel")
record IngressRequest(
    @Schema(description = "The water before the leak (as for the conductivity calculation)")
        List<AmountInput> composition,
    @Schema(
            description = "the declared cooling water",
            allowableValues = {"sea", "brackish", "fresh", "hard_fresh"},
            example = "sea")
        String coolingWater,
    @Schema(description = "sodium the leak brings, µg/kg", example = "5") Double sodiumUgPerKg,
    @Schema(description = "temperature of the channels, °C (0–100), default 25", example = "25")
        Double temperatureCel) {}
