package org.kwanta.service.plants;

import jakarta.validation.Valid;
import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.NotNull;
import jakarta.validation.constraints.Pattern;
import jakarta.validation.constraints.Size;
import java.util.List;

/**
 * A plant declared as configuration (YAML or JSON): its units and sample points.
 *
 * @param id stable plant id
 * @param name display name
 * @param units the plant's units
 * @param samplePoints the sample points, each in one unit
 */
public record PlantDeclaration(
    @NotBlank @Size(max = 64) @Pattern(regexp = PlantDeclaration.ID_PATTERN) String id,
    @NotBlank @Size(max = 200) String name,
    @NotNull @Size(max = 100) List<@Valid UnitDeclaration> units,
    @NotNull @Size(max = 2000) List<@Valid SamplePointDeclaration> samplePoints) {

  /**
   * Ids: letters, digits, '-', '_' and '.', starting with a letter or digit; at most 64 characters.
   */
  public static final String ID_PATTERN = "[A-Za-z0-9][A-Za-z0-9._-]{0,63}";

  /** A unit (block) of a plant. */
  public record UnitDeclaration(
      @NotBlank @Pattern(regexp = PlantDeclaration.ID_PATTERN) String id,
      @NotBlank @Size(max = 200) String name) {}

  /**
   * A sample point.
   *
   * @param operatingTemperatureCel temperature at which the at-temperature pH is computed, °C
   * @param operatingPressureMPa pressure for it, MPa; null means saturation
   * @param alkalizer the alkalizer (AMMONIA when absent; MORPHOLINE, ETHANOLAMINE, ...)
   * @param parameters the parameters measured there (codes as in the readings API); informative
   */
  public record SamplePointDeclaration(
      @NotBlank @Pattern(regexp = PlantDeclaration.ID_PATTERN) String id,
      @NotBlank @Pattern(regexp = PlantDeclaration.ID_PATTERN) String unit,
      @NotBlank @Size(max = 200) String name,
      @NotBlank @Size(max = 64) String cycleLocation,
      @NotBlank @Size(max = 64) String treatmentRegime,
      Double operatingTemperatureCel,
      Double operatingPressureMPa,
      @Size(max = 64) String alkalizer,
      @Size(max = 30) List<@NotBlank @Size(max = 64) String> parameters) {}
}
