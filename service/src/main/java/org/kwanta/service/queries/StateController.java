package org.kwanta.service.queries;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.Parameter;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.time.Clock;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import org.kwanta.service.diagnosis.DiagnosisService;
import org.kwanta.service.plants.PlantDeclaration;
import org.kwanta.service.plants.Plants;
import org.kwanta.service.system.ProblemException;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.RestController;
import tools.jackson.databind.json.JsonMapper;

@RestController
@Tag(name = "Queries")
class StateController {

  private final Plants plants;
  private final States states;
  private final Clock clock;
  private final DiagnosisService diagnosis;
  private final JsonMapper mapper;
  private final CurrentLevels levels;

  StateController(
      Plants plants,
      States states,
      Clock clock,
      DiagnosisService diagnosis,
      JsonMapper mapper,
      CurrentLevels levels) {
    this.plants = plants;
    this.states = states;
    this.clock = clock;
    this.diagnosis = diagnosis;
    this.mapper = mapper;
    this.levels = levels;
  }

  /** A plant's latest state, sample point by sample point. */
  record Overview(String plant, String name, Instant asOf, List<States.State> samplePoints) {}

  @GetMapping("/api/v1/sample-points/{samplePoint}/state")
  @Operation(
      summary = "Latest state of a sample point",
      description =
          "Each parameter's latest reading with its age; the current level of each parameter with"
              + " limits (NORMAL, OUTSIDE_NORMAL: outside the normal range, advisory, not an"
              + " action level; AL1-AL3; SHUTDOWN), with whether its instrument is in doubt; and"
              + " the latest evaluation: compensated"
              + " conductivities, composition, calculated pH, pH at operating temperature with its band,"
              + " the instrument checks, and the diagnosis over time at the latest minute. Advisory.")
  States.State state(
      @Parameter(example = "U1-ECO-IN") @PathVariable("samplePoint") String samplePointId) {
    return plants
        .findSamplePoint(samplePointId)
        .map(
            p ->
                states.of(
                    p.id(),
                    p.name(),
                    p.cycleLocation(),
                    p.treatmentRegime(),
                    clock.instant(),
                    diagnosis.currentOf(plants.plantOf(p.id()), p.id()).orElse(null)))
        .orElseThrow(() -> notFound("sample point", samplePointId));
  }

  @GetMapping("/api/v1/plants/{plant}/overview")
  @Operation(
      summary = "Latest state of every sample point of a plant",
      description =
          "With a weak ETag over the data (not over asOf, the ages, levelsAsOf and the onset of"
              + " a level held the whole window, which move with the clock): asked again with If-None-Match, the answer is 304"
              + " Not Modified without a body while no reading, evaluation, level, finding or limit"
              + " changed; ages then count on from the earlier answer's asOf.")
  ResponseEntity<Overview> overview(
      @Parameter(example = "brackenmoor") @PathVariable("plant") String plantId) {
    PlantDeclaration plant = plants.find(plantId).orElseThrow(() -> notFound("plant", plantId));
    Instant now = clock.instant();
    Map<String, DiagnosisService.PointDiagnosis> current = diagnosis.current(plant.id());
    States.Freshness freshness = states.freshness(plant.id(), now);
    Overview overview =
        new Overview(
            plant.id(),
            plant.name(),
            now,
            states.board(
                freshness,
                plant.samplePoints().stream()
                    .map(
                        p ->
                            new States.Shown(
                                p.id(), p.name(), p.cycleLocation(), p.treatmentRegime()))
                    .toList(),
                now,
                current));
    // Spring answers 304 without a body when the request's If-None-Match holds this tag
    return ResponseEntity.ok()
        .eTag(OverviewTags.of(mapper, overview, levels.window()))
        .body(overview);
  }

  static ProblemException notFound(String what, String id) {
    return ProblemException.notFound(what, id);
  }
}
