package org.kwanta.service.plants;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.tags.Tag;
import jakarta.validation.Valid;
import java.util.List;
import org.kwanta.service.system.ProblemException;
import org.kwanta.service.system.ProblemTypes;
import org.springframework.http.HttpStatus;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.ResponseStatus;
import org.springframework.web.bind.annotation.RestController;

@RestController
@RequestMapping("/api/v1/plants")
@Tag(name = "Plants", description = "Plants, blocks and sample points (registry)")
class PlantsController {

  private final Plants plants;

  PlantsController(Plants plants) {
    this.plants = plants;
  }

  @GetMapping
  @Operation(summary = "List plants")
  List<Plants.PlantSummary> list() {
    return plants.list();
  }

  @PostMapping
  @ResponseStatus(HttpStatus.CREATED)
  @Operation(summary = "Declare a new plant with its blocks and sample points")
  PlantDeclaration create(@Valid @RequestBody PlantDeclaration plant) {
    if (plants.exists(plant.id())) {
      throw new ProblemException(
          HttpStatus.CONFLICT,
          ProblemTypes.CONFLICT,
          "Conflict",
          "A plant with id '" + plant.id() + "' exists already",
          java.util.Map.of());
    }
    List<String> problems = Plants.problems(plant);
    if (!problems.isEmpty()) {
      throw new ProblemException(
          HttpStatus.BAD_REQUEST,
          ProblemTypes.BAD_REQUEST,
          "Invalid plant declaration",
          String.join("; ", problems),
          java.util.Map.of("problems", problems));
    }
    OperatingPhases.require(plant);
    plants.insert(plant, "api");
    return plant;
  }

  @GetMapping("/{plant}")
  @Operation(summary = "A plant with its blocks and sample points")
  PlantDeclaration get(@PathVariable("plant") String plantId) {
    return plants.find(plantId).orElseThrow(() -> ProblemException.notFound("plant", plantId));
  }
}
