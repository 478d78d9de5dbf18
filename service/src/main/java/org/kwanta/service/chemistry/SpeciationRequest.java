package org.kwanta.service.chemistry;

import io.swagger.v3.oas.annotations.media.Schema;
import java.util.List;

/**
 * A water's analytical composition and the temperature(s) at which to speciate it. Unknown fields
 * are refused.
 */
@Schema(description = "Composition and conditions for a speciation at one or more temperatures")
record SpeciationRequest(
    @Schema(description = "Totals of the components present; an empty list is pure water")
        List<AmountInput> composition,
    @Schema(description = "temperature, °C (give this or temperaturesCel)", example = "330")
        Double temperatureCel,
    @Schema(description = "several temperatures, °C (at most 50; give this or temperatureCel)")
        List<Double> temperaturesCel,
    @Schema(
            description = "pressure, MPa absolute; omit for the saturation pressure",
            example = "13")
        Double pressureMPa,
    @Schema(
            description = "activity model, default davies",
            allowableValues = {"davies", "bdot"})
        String activityModel,
    @Schema(description = "constant set id, default \"default\"", example = "default")
        String constantSet,
    @Schema(
            description = "liquid (default) or condensed_steam (speciated as condensate)",
            allowableValues = {"liquid", "condensed_steam"})
        String sampleOrigin,
    @Schema(
            description = "pKw formulation, default the service setting (R11-07)",
            allowableValues = {"R11-07", "R11-24"})
        String ionization,
    @Schema(
            description =
                "carry the sodium ion pairs (NaOH°, NaCl°, NaSO₄⁻) and the polyborates; default"
                    + " true",
            example = "true")
        Boolean ionAssociation) {

  /** The options shared with the curve request. */
  SpeciationInputs.Choices choices() {
    return new SpeciationInputs.Choices(
        composition,
        pressureMPa,
        activityModel,
        constantSet,
        sampleOrigin,
        ionization,
        ionAssociation);
  }
}
