package org.kwanta.service.chemistry;

import io.swagger.v3.oas.annotations.media.Schema;
import java.util.List;

/** A composition and a temperature range: one row per step. Unknown fields are refused. */
@Schema(description = "Composition and a temperature range for a pH-at-temperature curve")
record SpeciationCurveRequest(
    @Schema(description = "Totals of the components present; an empty list is pure water")
        List<AmountInput> composition,
    @Schema(description = "first temperature, °C", example = "25") Double fromCel,
    @Schema(description = "last temperature, °C (included when on the grid)", example = "330")
        Double toCel,
    @Schema(description = "step, °C (at most 500 rows)", example = "5") Double stepCel,
    @Schema(
            description = "pressure, MPa absolute; omit for the saturation pressure",
            example = "15")
        Double pressureMPa,
    @Schema(
            description = "activity model, default davies",
            allowableValues = {"davies", "bdot"})
        String activityModel,
    @Schema(description = "constant set name, default \"default\"") String constantSet,
    @Schema(
            description = "liquid (default) or condensed_steam",
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
