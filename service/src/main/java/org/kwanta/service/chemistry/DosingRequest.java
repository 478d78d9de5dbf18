package org.kwanta.service.chemistry;

import io.swagger.v3.oas.annotations.media.Schema;
import java.util.List;

/**
 * The water before dosing, the alkalizer(s) dosed and the target: give targetPh25, or
 * targetMarginOverNeutral with the location's temperatureCel (and pressureMPa; omitted:
 * saturation). Unknown fields are refused.
 */
@Schema(description = "Dosing advice: the alkalizer amount for a target pH")
record DosingRequest(
    @Schema(description = "the water before dosing (as for the speciation; may be empty)")
        List<AmountInput> composition,
    @Schema(description = "the alkalizers dosed with their mass parts (any scale)")
        List<AlkalizerPart> alkalizers,
    @Schema(description = "target pH at 25 °C", example = "9.6") Double targetPh25,
    @Schema(description = "target pH at the location minus the neutral pH there", example = "1.0")
        Double targetMarginOverNeutral,
    @Schema(description = "the location's temperature, °C (with the margin)", example = "155")
        Double temperatureCel,
    @Schema(description = "the location's pressure, MPa; omit for saturation", example = "15")
        Double pressureMPa) {

  /** One alkalizer of the dose, with its mass part. */
  record AlkalizerPart(
      @Schema(example = "ammonia") String component,
      @Schema(description = "mass part (any scale); default 1", example = "1") Double massPart) {}
}
