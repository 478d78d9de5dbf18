package org.kwanta.service.queries;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.Parameter;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.format.DateTimeParseException;
import java.util.List;
import org.kwanta.service.ingest.Evaluations;
import org.kwanta.service.ingest.Evaluations.Stored;
import org.kwanta.service.plants.Plants;
import org.kwanta.service.system.ProblemException;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

@RestController
@Tag(name = "Queries")
class EvaluationsController {

  static final int MAX_LIMIT = 5000;

  private final Evaluations stored;
  private final Plants plants;
  private final Clock clock;

  EvaluationsController(Evaluations stored, Plants plants, Clock clock) {
    this.stored = stored;
    this.plants = plants;
    this.clock = clock;
  }

  /** A page of stored evaluations; {@code next} is the {@code from} of the next page, or null. */
  record Page(
      String samplePoint, Instant from, Instant to, List<Stored> evaluations, Instant next) {}

  @GetMapping("/api/v1/sample-points/{samplePoint}/evaluations")
  @Operation(
      summary = "Stored evaluations of a sample point over a time range",
      description =
          "Oldest first, each with its compensated conductivities, composition, calculated pH, pH at"
              + " temperature and the instant instrument checks (the diagnosis over time is at"
              + " .../findings). Range [from, to), default the last hour; at most 5000 a page, then"
              + " `next` gives the following page's from. Advisory.")
  Page evaluations(
      @Parameter(example = "U1-ECO-IN") @PathVariable("samplePoint") String samplePointId,
      @RequestParam(required = false) String from,
      @RequestParam(required = false) String to,
      @RequestParam(defaultValue = "1000") int limit) {
    if (plants.findSamplePoint(samplePointId).isEmpty()) {
      throw ProblemException.notFound("sample point", samplePointId);
    }
    if (limit < 1 || limit > MAX_LIMIT) {
      throw ProblemException.of("limit must be in 1.." + MAX_LIMIT);
    }
    Instant end = to == null ? clock.instant() : instant("to", to);
    Instant start = from == null ? end.minus(Duration.ofHours(1)) : instant("from", from);
    if (!start.isBefore(end)) {
      throw ProblemException.of("from must be before to");
    }
    List<Stored> rows = stored.range(samplePointId, start, end, limit + 1);
    Instant next = null;
    if (rows.size() > limit) {
      next = rows.get(limit).time();
      rows = rows.subList(0, limit);
    }
    return new Page(samplePointId, start, end, List.copyOf(rows), next);
  }

  private static Instant instant(String name, String value) {
    try {
      return OffsetDateTime.parse(value).toInstant();
    } catch (DateTimeParseException e) {
      throw ProblemException.of(name + " must be an ISO 8601 time with an offset: " + value);
    }
  }
}
