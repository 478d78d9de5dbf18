package org.kwanta.service.ingest;

import io.swagger.v3.oas.annotations.media.Schema;

/**
 * One reading as a historian sends it. Everything is checked by {@link ReadingValidator}; nothing
 * is guessed.
 *
 * @param samplePoint sample point id, e.g. {@code U1-ECO-IN}
 * @param parameter parameter code, e.g. {@code cation_conductivity}
 * @param time ISO 8601 with an offset, e.g. {@code 2026-11-30T10:00:00Z} or {@code
 *     2026-11-30T11:00:00+01:00}
 * @param value the value in {@code unit}
 * @param unit UCUM code, e.g. {@code uS/cm}, {@code ug/kg}, {@code [pH]}, {@code Cel}
 * @param quality good (default), uncertain or bad
 * @param sampleTemperatureCel for conductivities: the sample temperature, °C, at which {@code
 *     value} was measured (then the service compensates it to 25 °C with its own model)
 * @param compensated for conductivities: true when the analyser already referred the value to 25
 *     °C. Default: false when a sample temperature is given, true otherwise
 */
@Schema(description = "One reading")
public record ReadingInput(
    @Schema(example = "U1-ECO-IN") String samplePoint,
    @Schema(example = "specific_conductivity") String parameter,
    @Schema(example = "2026-11-30T10:00:00Z") String time,
    @Schema(example = "5.42") Double value,
    @Schema(example = "uS/cm") String unit,
    @Schema(
            example = "good",
            allowableValues = {"good", "uncertain", "bad"})
        String quality,
    @Schema(example = "27.4") Double sampleTemperatureCel,
    @Schema(example = "false") Boolean compensated) {}
