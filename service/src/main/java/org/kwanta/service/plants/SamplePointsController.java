package org.kwanta.service.plants;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.Parameter;
import io.swagger.v3.oas.annotations.tags.Tag;
import jakarta.validation.Valid;
import java.security.Principal;
import java.time.Clock;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import org.kwanta.service.security.EffectiveTimes;
import org.kwanta.service.system.ProblemException;
import org.kwanta.service.system.ProblemTypes;
import org.springframework.http.HttpStatus;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PutMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

@RestController
@RequestMapping("/api/v1")
@Tag(name = "Plants")
class SamplePointsController {

  private final Plants plants;
  private final Clock clock;

  SamplePointsController(Plants plants, Clock clock) {
    this.plants = plants;
    this.clock = clock;
  }

  @GetMapping("/sample-points/{samplePoint}")
  @Operation(summary = "A sample point's current configuration")
  PlantDeclaration.SamplePointDeclaration get(
      @Parameter(example = "U1-ECO-IN") @PathVariable("samplePoint") String samplePointId) {
    return plants.findSamplePoint(samplePointId).orElseThrow(() -> notFound(samplePointId));
  }

  @GetMapping("/sample-points/{samplePoint}/versions")
  @Operation(
      summary = "Every configuration version of a sample point, oldest first",
      description =
          "Evaluations record the configuration version in force when they were computed"
              + " (configVersion), so a past evaluation can be explained by its version here.")
  List<Plants.Version> versions(@PathVariable("samplePoint") String samplePointId) {
    List<Plants.Version> versions = plants.versions(samplePointId);
    if (versions.isEmpty()) {
      throw notFound(samplePointId);
    }
    return versions;
  }

  @PutMapping("/sample-points/{samplePoint}")
  @Operation(
      summary = "Change a sample point's configuration (a new version; old versions are kept)",
      description =
          "The new version is in force from effectiveFrom (default now). A past effectiveFrom (more"
              + " than a minute ago) corrects the record: admin keys only, with a reason, and not"
              + " before the start of the version in force now (409). Limits by treatment regime and"
              + " location follow the version in force at each reading's time. Evaluations computed"
              + " after the change use the new version; stored evaluations keep the version they"
              + " were computed with (configVersion), also after a back-dated change.")
  Map<String, Object> update(
      @PathVariable("samplePoint") String samplePointId,
      @Valid @RequestBody PlantDeclaration.SamplePointDeclaration body,
      @RequestParam(required = false) String effectiveFrom,
      @RequestParam(required = false) String reason,
      Principal principal) {
    Instant from =
        EffectiveTimes.effectiveFrom(
            effectiveFrom, reason, clock.instant(), "a sample point's configuration");
    if (!samplePointId.equals(body.id())) {
      throw ProblemException.of("the body's id must be the path's sample point id");
    }
    PlantDeclaration.SamplePointDeclaration current =
        plants.findSamplePoint(samplePointId).orElseThrow(() -> notFound(samplePointId));
    PlantDeclaration.SamplePointDeclaration next = Plants.normalized(body);
    if (next.equals(Plants.normalized(current))) {
      return Map.of("samplePoint", samplePointId, "changed", false);
    }
    String plantId = plants.plantOf(samplePointId);
    PlantDeclaration check =
        new PlantDeclaration(
            plantId, plantId, plants.find(plantId).orElseThrow().blocks(), List.of(next));
    List<String> problems = Plants.problems(check);
    if (!problems.isEmpty()) {
      throw new ProblemException(
          HttpStatus.BAD_REQUEST,
          ProblemTypes.BAD_REQUEST,
          "Invalid sample point",
          String.join("; ", problems),
          Map.of("problems", problems));
    }
    OperatingPhases.require(check);
    int version;
    try {
      version =
          plants.updateSamplePoint(
              next,
              principal == null ? "api" : "key:" + principal.getName(),
              from,
              EffectiveTimes.blankToNull(reason));
    } catch (Plants.VersionOrderException e) {
      throw new ProblemException(
          HttpStatus.CONFLICT, ProblemTypes.CONFLICT, "Conflict", e.getMessage(), Map.of());
    }
    return Map.of(
        "samplePoint", samplePointId, "changed", true, "version", version, "effectiveFrom", from);
  }

  @PutMapping("/plants/{plant}")
  @Operation(
      summary = "Apply a plant declaration (configuration as code)",
      description =
          "Creates what is missing; changed sample points get a new configuration version; nothing is"
              + " deleted.")
  Plants.Applied apply(
      @PathVariable("plant") String plantId,
      @Valid @RequestBody PlantDeclaration plant,
      Principal principal) {
    if (!plantId.equals(plant.id())) {
      throw ProblemException.of("the body's id must be the path's plant id");
    }
    List<String> problems = Plants.problems(plant);
    if (!problems.isEmpty()) {
      throw new ProblemException(
          HttpStatus.BAD_REQUEST,
          ProblemTypes.BAD_REQUEST,
          "Invalid plant declaration",
          String.join("; ", problems),
          Map.of("problems", problems));
    }
    OperatingPhases.require(plant);
    return plants.apply(plant, principal == null ? "api" : "key:" + principal.getName());
  }

  private static ProblemException notFound(String id) {
    return ProblemException.notFound("sample point", id);
  }
}
