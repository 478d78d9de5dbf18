package org.kwanta.service.operatingstate;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.tags.Tag;
import jakarta.validation.Valid;
import jakarta.validation.constraints.NotNull;
import jakarta.validation.constraints.Size;
import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.kwanta.service.audit.Actor;
import org.kwanta.service.system.ProblemException;
import org.kwanta.service.system.TimeParameters;
import org.springframework.http.HttpStatus;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.ResponseStatus;
import org.springframework.web.bind.annotation.RestController;

@RestController
@RequestMapping("/api/v1/plants/{plant}/blocks/{block}")
@Tag(
    name = "Operating state",
    description =
        "What a block was doing (IN_SERVICE, START_UP, SHUT_DOWN, LAYUP_WET, LAYUP_DRY), entered by a"
            + " chemist (append-only) or sent by the historian as the reading operating_state (codes"
            + " 1-5 in that order) at any sample point of the block; at the same instant the chemist"
            + " wins, and each span of the timeline names its source. Only in-service time counts towards excursion hours, hours per"
            + " level and instrument availability; time before a block's first recorded state counts"
            + " as in service. Start-up hold points are examples recalled from IAPWS guidance (from"
            + " memory — verify); the plant's start-up procedure governs.")
class OperatingStateController {

  private final OperatingStates states;
  private final HoldPoints holdPoints;
  private final java.time.Clock clock;

  OperatingStateController(OperatingStates states, HoldPoints holdPoints, java.time.Clock clock) {
    this.states = states;
    this.holdPoints = holdPoints;
    this.clock = clock;
  }

  /** A state the block entered at {@code since}. */
  record StateRequest(
      @NotNull OperatingState state,
      @NotNull Instant since,
      @Size(min = 1, max = 2000) String note) {}

  /** One recorded entry; who entered it is the key of the request. */
  record EntryResponse(
      long id,
      String plant,
      String block,
      OperatingState state,
      Instant since,
      String note,
      Instant recordedAt,
      String recordedByKeyId,
      String recordedBy) {
    static EntryResponse from(OperatingStates.Entry e) {
      return new EntryResponse(
          e.id(),
          e.plant(),
          e.block(),
          e.state(),
          e.since(),
          e.note(),
          e.recordedAt(),
          e.keyId(),
          e.keyName());
    }
  }

  /**
   * One stretch of the timeline; state null: no state recorded yet (counted as in service). source:
   * CHEMIST or HISTORIAN (null with no state).
   */
  record SpanResponse(
      OperatingState state, Instant start, Instant end, double hours, ServiceTime.Source source) {}

  record TimelineResponse(
      String plant,
      String block,
      Instant from,
      Instant to,
      List<SpanResponse> timeline,
      Map<String, Double> hoursByState,
      double hoursUnrecorded,
      double hoursCountedInService,
      String counting,
      List<EntryResponse> entries) {}

  @PostMapping("/operating-states")
  @ResponseStatus(HttpStatus.CREATED)
  @Operation(
      summary = "Record the state a block entered (chemist)",
      description =
          "Body: {\"state\":\"START_UP\",\"since\":\"2026-04-12T00:00:00Z\",\"note\":\"...\"}."
              + " Appended, never overwritten: a second entry with the same since corrects the"
              + " first. Audited.")
  EntryResponse record(
      @PathVariable String plant, @PathVariable String block, @Valid @RequestBody StateRequest r) {
    requireBlock(plant, block);
    if (r.since().isAfter(clock.instant().plus(Duration.ofMinutes(5)))) {
      throw ProblemException.of("since " + r.since() + " lies in the future");
    }
    Actor by = Actor.current().orElseThrow(() -> new IllegalStateException("no authenticated key"));
    return EntryResponse.from(states.record(plant, block, r.state(), r.since(), r.note(), by));
  }

  @GetMapping("/operating-states")
  @Operation(
      summary = "A block's states over [from, to) and every entry",
      description = "from/to ISO 8601 (default the last 31 days).")
  TimelineResponse timeline(
      @PathVariable String plant,
      @PathVariable String block,
      @RequestParam(required = false) String from,
      @RequestParam(required = false) String to) {
    requireBlock(plant, block);
    Instant end = TimeParameters.instant("to", to);
    end = end == null ? clock.instant() : end;
    Instant start = TimeParameters.instant("from", from);
    start = start == null ? end.minus(Duration.ofDays(31)) : start;
    if (!start.isBefore(end)) {
      throw ProblemException.of("from must lie before to");
    }
    ServiceTime t = states.serviceTime(plant, block, start, end);
    Map<String, Double> byState = new TreeMap<>();
    t.byState().forEach((s, d) -> byState.put(s.name(), hours(d)));
    return new TimelineResponse(
        plant,
        block,
        start,
        end,
        t.spans().stream()
            .map(
                s ->
                    new SpanResponse(
                        s.state(),
                        s.start(),
                        s.end(),
                        hours(Duration.between(s.start(), s.end())),
                        s.source()))
            .toList(),
        byState,
        hours(t.unrecorded()),
        hours(t.inService()),
        COUNTING,
        states.entries(plant, block).stream().map(EntryResponse::from).toList());
  }

  /** One hold point judged at one sample point. */
  record HoldPointResponse(
      String id,
      String step,
      String description,
      String samplePoint,
      String parameter,
      String unit,
      String comparison,
      double holdValue,
      Double measured,
      Instant measuredAt,
      String status,
      boolean met,
      String source,
      boolean fromMemory) {
    static HoldPointResponse from(HoldPoints.Result r) {
      HoldPoints.HoldPoint h = r.holdPoint();
      return new HoldPointResponse(
          h.id(),
          h.step(),
          h.description(),
          r.samplePoint(),
          h.parameter(),
          h.unit(),
          h.comparison().name(),
          h.value(),
          r.measured(),
          r.measuredAt(),
          r.status().name(),
          r.status() == HoldPoints.Status.MET,
          h.source(),
          h.fromMemory());
    }
  }

  record HoldPointsResponse(
      String plant,
      String block,
      Instant at,
      OperatingState state,
      long recentSeconds,
      String advisory,
      List<HoldPointResponse> holdPoints) {}

  @GetMapping("/hold-points")
  @Operation(
      summary = "Start-up hold points, met or not, at a time (default now)",
      description =
          "Each hold point at each of the block's sample points it applies to: the latest reading"
              + " (quality not bad) within the last 30 minutes before `at`, MET, NOT_MET or NO_DATA,"
              + " with the hold point's source.")
  HoldPointsResponse holdPoints(
      @PathVariable String plant,
      @PathVariable String block,
      @RequestParam(required = false) String at) {
    requireBlock(plant, block);
    Instant when = TimeParameters.instant("at", at);
    when = when == null ? clock.instant() : when;
    return new HoldPointsResponse(
        plant,
        block,
        when,
        states.stateAt(plant, block, when).orElse(null),
        HoldPoints.RECENT.toSeconds(),
        ADVISORY,
        holdPoints.check(plant, block, when).stream().map(HoldPointResponse::from).toList());
  }

  /** How hours are counted, said in every response that counts them. */
  static final String COUNTING =
      "in service: IN_SERVICE time and time before the block's first recorded state";

  static final String ADVISORY =
      "Advisory. Example hold points recalled from IAPWS guidance (from memory — verify); the"
          + " plant's start-up procedure governs.";

  private void requireBlock(String plant, String block) {
    if (!states.blockExists(plant, block)) {
      throw ProblemException.notFound("block", plant + "/" + block);
    }
  }

  private static double hours(Duration d) {
    return d.toMillis() / 3_600_000.0;
  }
}
