package org.kwanta.service.plants;

import jakarta.validation.Valid;
import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.NotNull;
import jakarta.validation.constraints.Pattern;
import jakarta.validation.constraints.Size;
import java.util.List;

/**
 * A plant declared as configuration (YAML or JSON): its blocks and sample points.
 *
 * @param id stable plant id
 * @param name display name
 * @param blocks the plant's blocks (a block: one steam cycle, with its generating set)
 * @param samplePoints the sample points, each in one block
 * @param coolingWater the condensers' cooling water ({@code SEA}, {@code BRACKISH}, {@code FRESH},
 *     {@code HARD_FRESH}); optional. The diagnosis names a condenser leak only when it is declared.
 * @param plantType the kind of steam generator ({@code CONVENTIONAL_DRUM}, {@code HRSG}, {@code
 *     ONCE_THROUGH}); optional, {@code CONVENTIONAL_DRUM} when absent. The default limits depend on
 *     it from defaults version 2.
 */
public record PlantDeclaration(
    @NotBlank @Size(max = 64) @Pattern(regexp = PlantDeclaration.ID_PATTERN) String id,
    @NotBlank @Size(max = 200) String name,
    @NotNull @Size(max = 100) List<@Valid BlockDeclaration> blocks,
    @NotNull @Size(max = 2000) List<@Valid SamplePointDeclaration> samplePoints,
    @Size(max = 32) String coolingWater,
    @Size(max = 32) String plantType) {

  /** A declaration without a plant type (a conventional drum plant). */
  public PlantDeclaration(
      String id,
      String name,
      List<BlockDeclaration> blocks,
      List<SamplePointDeclaration> samplePoints,
      String coolingWater) {
    this(id, name, blocks, samplePoints, coolingWater, null);
  }

  /** A declaration without a cooling water. */
  public PlantDeclaration(
      String id,
      String name,
      List<BlockDeclaration> blocks,
      List<SamplePointDeclaration> samplePoints) {
    this(id, name, blocks, samplePoints, null, null);
  }

  /**
   * Ids: letters, digits, '-', '_' and '.', starting with a letter or digit; at most 64 characters.
   */
  public static final String ID_PATTERN = "[A-Za-z0-9][A-Za-z0-9._-]{0,63}";

  /** A block of a plant (one steam cycle). */
  public record BlockDeclaration(
      @NotBlank @Pattern(regexp = PlantDeclaration.ID_PATTERN) String id,
      @NotBlank @Size(max = 200) String name) {}

  /**
   * A sample point.
   *
   * @param operatingTemperatureCel process temperature at the point, 0–800 °C: the at-temperature
   *     pH is computed there for a liquid point; a steam point (SATURATED_STEAM, MAIN_STEAM,
   *     REHEAT_STEAM) is evaluated as its first condensate at the saturation temperature of its
   *     pressure. A location that contradicts the phase at the declared temperature and pressure is
   *     refused (422)
   * @param operatingPressureMPa pressure for it, MPa; null means saturation
   * @param alkalizer the alkalizer (AMMONIA when absent; MORPHOLINE, ETHANOLAMINE, ...)
   * @param parameters the parameters measured there (codes as in the readings API); informative
   * @param upstream ids of the sample points whose water reaches this one (make-up → condensate →
   *     feedwater → drum → steam); optional, used by the diagnosis to tell process from instrument
   */
  public record SamplePointDeclaration(
      @NotBlank @Pattern(regexp = PlantDeclaration.ID_PATTERN) String id,
      @NotBlank @Pattern(regexp = PlantDeclaration.ID_PATTERN) String block,
      @NotBlank @Size(max = 200) String name,
      @NotBlank @Size(max = 64) String cycleLocation,
      @NotBlank @Size(max = 64) String treatmentRegime,
      Double operatingTemperatureCel,
      Double operatingPressureMPa,
      @Size(max = 64) String alkalizer,
      @Size(max = 30) List<@NotBlank @Size(max = 64) String> parameters,
      @Size(max = 20)
          List<@NotBlank @Pattern(regexp = PlantDeclaration.ID_PATTERN) String> upstream) {

    /** A sample point without a declared place on the cycle. */
    public SamplePointDeclaration(
        String id,
        String block,
        String name,
        String cycleLocation,
        String treatmentRegime,
        Double operatingTemperatureCel,
        Double operatingPressureMPa,
        String alkalizer,
        List<String> parameters) {
      this(
          id,
          block,
          name,
          cycleLocation,
          treatmentRegime,
          operatingTemperatureCel,
          operatingPressureMPa,
          alkalizer,
          parameters,
          null);
    }
  }
}
