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
 * @param source online (default), grab or lab; grab and lab results go to {@code POST
 *     /api/v1/lab-results} and are stored apart from the online readings
 * @param sampleId grab and lab: the sample's id (free text, up to 64 characters)
 * @param labMethod grab and lab: the method (free text, up to 200 characters)
 * @param censored grab and lab: {@code below} when the result is below the detection limit; then
 *     {@code value} is the limit
 * @param densityTemperatureCel grab and lab in ug/L or mg/L: the temperature, °C, at which the
 *     volume was measured (default 25 °C); the density of water there converts to ug/kg
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
    @Schema(example = "false") Boolean compensated,
    @Schema(
            example = "online",
            allowableValues = {"online", "grab", "lab"})
        String source,
    @Schema(example = "S-2026-1130-04") String sampleId,
    @Schema(example = "ion chromatography") String labMethod,
    @Schema(
            example = "below",
            allowableValues = {"below"})
        String censored,
    @Schema(example = "20") Double densityTemperatureCel) {

  /** An online reading (the historian's fields only). */
  public ReadingInput(
      String samplePoint,
      String parameter,
      String time,
      Double value,
      String unit,
      String quality,
      Double sampleTemperatureCel,
      Boolean compensated) {
    this(
        samplePoint,
        parameter,
        time,
        value,
        unit,
        quality,
        sampleTemperatureCel,
        compensated,
        null,
        null,
        null,
        null,
        null);
  }

  /** Whether this is a grab or lab result rather than an online reading (source not "online"). */
  boolean notOnline() {
    return source != null && !"online".equals(source);
  }

  /** The same reading with another value and unit (a converted lab result). */
  ReadingInput withValue(double newValue, String newUnit) {
    return new ReadingInput(
        samplePoint,
        parameter,
        time,
        newValue,
        newUnit,
        quality,
        sampleTemperatureCel,
        compensated,
        source,
        sampleId,
        labMethod,
        censored,
        densityTemperatureCel);
  }
}
