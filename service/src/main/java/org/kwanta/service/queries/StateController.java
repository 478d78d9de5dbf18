package org.kwanta.service.queries;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.Parameter;
import io.swagger.v3.oas.annotations.media.Content;
import io.swagger.v3.oas.annotations.media.Schema;
import io.swagger.v3.oas.annotations.responses.ApiResponse;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.time.Clock;
import java.time.Instant;
import java.util.List;
import java.util.Locale;
import org.kwanta.service.diagnosis.DiagnosisService;
import org.kwanta.service.plants.Plants;
import org.kwanta.service.system.ProblemException;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.RestController;

@RestController
@Tag(name = "Queries")
class StateController {

  private final Plants plants;
  private final States states;
  private final Clock clock;
  private final DiagnosisService diagnosis;
  private final Boards boards;

  StateController(
      Plants plants, States states, Clock clock, DiagnosisService diagnosis, Boards boards) {
    this.plants = plants;
    this.states = states;
    this.clock = clock;
    this.diagnosis = diagnosis;
    this.boards = boards;
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

  @GetMapping(
      value = "/api/v1/plants/{plant}/overview",
      produces = MediaType.APPLICATION_JSON_VALUE)
  @Operation(
      summary = "Latest state of every sample point of a plant",
      description =
          "The board as computed at asOf: kept up to date off the request path, at most"
              + " kwanta.board.max-lag old (default 10 s; about a second behind the last write"
              + " under a live feed), levelsAsOf the same time. With a weak ETag over the data"
              + " (not over asOf, the ages, levelsAsOf and the onset of"
              + " a level held the whole window, which move with the clock): asked again with If-None-Match, the answer is 304"
              + " Not Modified without a body while no reading, evaluation, level, finding or limit"
              + " changed; ages then count on from the earlier answer's asOf.")
  @ApiResponse(
      responseCode = "200",
      content =
          @Content(
              mediaType = MediaType.APPLICATION_JSON_VALUE,
              schema = @Schema(implementation = Overview.class)))
  ResponseEntity<byte[]> overview(
      @Parameter(example = "brackenmoor") @PathVariable("plant") String plantId) {
    long start = System.nanoTime();
    Instant asked = clock.instant();
    Boards.Board board = board(plantId);
    // a board kept from before: only the plant's look-up and the store's (docs/page.md)
    String timing =
        board.overview().asOf().isBefore(asked)
            ? String.format(
                Locale.ROOT,
                "stored;dur=%.1f, board;desc=\"computed in %.1f ms\"",
                (System.nanoTime() - start) / 1e6,
                board.millis())
            : board.timing();
    // Spring answers 304 without a body when the request's If-None-Match holds this tag; the
    // body's gzip comes after these stages
    return ResponseEntity.ok()
        .contentType(MediaType.APPLICATION_JSON)
        .eTag(board.tag())
        .header("Server-Timing", timing)
        .body(board.json());
  }

  /** A plant's board, as the overview answers it. */
  Boards.Board board(String plantId) {
    return boards.of(plants.find(plantId).orElseThrow(() -> notFound("plant", plantId)));
  }

  static ProblemException notFound(String what, String id) {
    return ProblemException.notFound(what, id);
  }
}
