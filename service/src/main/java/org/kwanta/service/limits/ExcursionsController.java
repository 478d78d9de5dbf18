package org.kwanta.service.limits;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.tags.Tag;
import jakarta.validation.Valid;
import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.NotNull;
import jakarta.validation.constraints.Size;
import java.time.Instant;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.kwanta.model.Parameter;
import org.kwanta.model.limits.Classification;
import org.kwanta.model.limits.Excursions;
import org.kwanta.model.limits.Level;
import org.kwanta.model.limits.MonthlyHours;
import org.kwanta.service.audit.Actor;
import org.kwanta.service.operatingstate.OperatingStates;
import org.kwanta.service.system.ProblemException;
import org.kwanta.service.system.ResponseFormats;
import org.kwanta.service.system.TimeParameters;
import org.springframework.http.HttpStatus;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestHeader;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

@RestController
@RequestMapping("/api/v1/excursions")
@Tag(
    name = "Excursions",
    description =
        "Stretches at Action Level 1 or above, classified against the limits in force, with the"
            + " share of their samples whose instrument was in doubt (doubt never hides a level;"
            + " time outside the normal range alone is not an excursion). The shipped"
            + " default limits are examples recalled from IAPWS guidance (from memory — verify),"
            + " not the plant's limits; set the plant's own per sample point.")
class ExcursionsController {

  private static final int MAX_ROWS = 10_000;
  private final ExcursionFinder finder;
  private final Limits limits;
  private final Acknowledgements acknowledgements;
  private final OperatingStates states;
  private final tools.jackson.databind.json.JsonMapper mapper;

  ExcursionsController(
      ExcursionFinder finder,
      Limits limits,
      Acknowledgements acknowledgements,
      OperatingStates states,
      tools.jackson.databind.json.JsonMapper mapper) {
    this.mapper = mapper;
    this.finder = finder;
    this.limits = limits;
    this.acknowledgements = acknowledgements;
    this.states = states;
  }

  @GetMapping(produces = {MediaType.APPLICATION_JSON_VALUE, "text/csv"})
  @Operation(
      summary = "List excursions (JSON or CSV)",
      description =
          "Filter by plant, samplePoint, parameter, time window [from, to] (ISO 8601; default the"
              + " last 31 days), minLevel (AL1, AL2, AL3, SHUTDOWN) and open. basis=as-reported"
              + " (default: each value against the limits in force at its time) or"
              + " basis=recomputed (today's limits applied to the past); each row and the header"
              + " Kwanta-Basis say which. CSV with"
              + " format=csv or Accept: text/csv. The JSON carries a weak ETag over the data (not"
              + " over what a running excursion counts up to now: durationSeconds,"
              + " timeRemainingSeconds, inServiceSeconds); asked again with If-None-Match it is 304"
              + " Not Modified without a body while nothing else changed. Example:"
              + " ?plant=brackenmoor&samplePoint=U2-CPD")
  ResponseEntity<?> list(
      @RequestParam(required = false) String plant,
      @RequestParam(required = false) String samplePoint,
      @RequestParam(required = false) String parameter,
      @RequestParam(required = false) String from,
      @RequestParam(required = false) String to,
      @RequestParam(required = false) String minLevel,
      @RequestParam(required = false) Boolean open,
      @RequestParam(required = false) String basis,
      @RequestParam(required = false) String format,
      @RequestHeader(value = "Accept", required = false) String accept) {
    ExcursionFinder.Basis b = basis(basis);
    ExcursionFinder.Filter filter =
        new ExcursionFinder.Filter(
            plant,
            samplePoint,
            parameter == null ? null : WebLookups.parameter(parameter),
            TimeParameters.instant("from", from),
            TimeParameters.instant("to", to),
            minLevel == null ? null : level(minLevel),
            open);
    List<ExcursionResponse> rows =
        finder.find(filter, b).stream().limit(MAX_ROWS).map(ExcursionResponse::from).toList();
    if (ResponseFormats.csvRequested(format, accept)) {
      StringBuilder sb = new StringBuilder(ExcursionResponse.CSV_HEADER);
      rows.forEach(r -> sb.append(r.csvRow()));
      return ResponseEntity.ok()
          .contentType(MediaType.parseMediaType("text/csv;charset=UTF-8"))
          .header("Content-Disposition", "attachment; filename=\"excursions.csv\"")
          .header(BASIS_HEADER, b.code())
          .body(sb.toString());
    }
    // a weak tag over the data: asked again with If-None-Match, 304 without a body while it holds
    return ResponseEntity.ok()
        .contentType(MediaType.APPLICATION_JSON)
        .header(BASIS_HEADER, b.code())
        .eTag(ExcursionTags.of(mapper, rows))
        .body(rows);
  }

  /**
   * Hours per action level per calendar month (UTC) at one sample point and parameter; time
   * OUTSIDE_NORMAL counts as NORMAL.
   */
  record MonthlyHoursResponse(
      String month, String level, double hours, String basis, String timeCounted) {}

  @GetMapping(value = "/monthly-hours", produces = MediaType.APPLICATION_JSON_VALUE)
  @Operation(
      summary = "Cumulative hours per action level per calendar month (UTC)",
      description =
          "NORMAL, AL1, AL2, AL3, SHUTDOWN; time outside the normal range but below AL1 counts as"
              + " NORMAL here (it is not excursion time). Only time the block was in service counts"
              + " (time=in-service, the default: IN_SERVICE time and time before the block's first"
              + " recorded state); time=all counts every hour. Each row and the header"
              + " Kwanta-Time-Counted say which. Example:"
              + " ?samplePoint=U2-CPD&parameter=cation_conductivity")
  ResponseEntity<List<MonthlyHoursResponse>> monthlyHours(
      @RequestParam String samplePoint,
      @RequestParam String parameter,
      @RequestParam(required = false) String from,
      @RequestParam(required = false) String to,
      @RequestParam(required = false) String basis,
      @RequestParam(required = false) String time) {
    ExcursionFinder.Basis b = basis(basis);
    boolean all = timeCounted(time);
    Parameter p = WebLookups.parameter(parameter);
    Limits.Point point = WebLookups.point(limits, samplePoint);
    Limits.History history =
        finder
            .history(point, p, b)
            .orElseThrow(
                () -> WebLookups.notFound("No limits for " + p.code() + " at " + samplePoint));
    Instant end =
        TimeParameters.instant("to", to) == null ? Instant.now() : TimeParameters.instant("to", to);
    Instant start =
        TimeParameters.instant("from", from) == null
            ? end.minus(java.time.Duration.ofDays(366))
            : TimeParameters.instant("from", from);
    List<Classification> classified = finder.classify(point, history, p, start, end);
    List<MonthlyHours> hours =
        Excursions.monthlyHours(
            classified,
            end,
            all ? null : states.serviceTime(point.plant(), point.block(), start, end).counted());
    String counted = all ? "all" : "in-service";
    return ResponseEntity.ok()
        .header(BASIS_HEADER, b.code())
        .header(TIME_COUNTED_HEADER, counted)
        .body(
            hours.stream()
                .map(
                    h ->
                        new MonthlyHoursResponse(
                            h.month().toString(), h.level().name(), h.hours(), b.code(), counted))
                .toList());
  }

  /**
   * An acknowledgement by a chemist. Who acknowledged is the API key of the request, never the
   * body: a {@code by} field is an unknown field, refused with 400 like any other.
   */
  record AcknowledgementRequest(
      @NotBlank @Size(max = 64) String samplePoint,
      @NotBlank @Size(max = 64) String parameter,
      @NotNull Instant start,
      @NotBlank @Size(max = 4000) String note) {}

  @PostMapping("/acknowledgements")
  @Operation(
      summary = "Acknowledge an excursion with a note (appended to its history)",
      description =
          "The excursion (as reported) is named by sample point, parameter and its start time."
              + " Every acknowledgement is kept; who made it is the API key of the request (a"
              + " 'by' in the body is refused with 400).")
  ResponseEntity<Map<String, Object>> acknowledge(@Valid @RequestBody AcknowledgementRequest r) {
    Parameter parameter = WebLookups.parameter(r.parameter());
    Limits.Point point = WebLookups.point(limits, r.samplePoint());
    Actor actor =
        Actor.current().orElseThrow(() -> new IllegalStateException("no authenticated key"));
    ExcursionFinder.Acknowledgement ack =
        acknowledgements
            .acknowledge(point, parameter, r.start(), actor, r.note())
            .orElseThrow(
                () ->
                    WebLookups.notFound(
                        "No excursion of "
                            + parameter.code()
                            + " at "
                            + point.id()
                            + " starts at "
                            + r.start()));
    return ResponseEntity.status(HttpStatus.CREATED)
        .body(
            Map.of(
                "samplePoint", point.id(),
                "parameter", parameter.code(),
                "start", r.start().toString(),
                "acknowledgedAt", ack.at().toString(),
                "acknowledgedBy", ack.byKeyName(),
                "acknowledgedByKeyId", ack.byKeyId()));
  }

  /** The header that says which limits judged the past. */
  static final String BASIS_HEADER = "Kwanta-Basis";

  /** The header that says which time the hours count: in-service or all. */
  static final String TIME_COUNTED_HEADER = "Kwanta-Time-Counted";

  private static boolean timeCounted(String value) {
    if (value == null || value.equalsIgnoreCase("in-service")) {
      return false;
    }
    if (value.equalsIgnoreCase("all")) {
      return true;
    }
    throw ProblemException.of("time must be in-service or all");
  }

  private static ExcursionFinder.Basis basis(String value) {
    return ExcursionFinder.Basis.parse(value);
  }

  private static Level level(String name) {
    try {
      Level level = Level.valueOf(name.toUpperCase(Locale.ROOT));
      if (!level.isAction()) {
        throw new IllegalArgumentException();
      }
      return level;
    } catch (IllegalArgumentException e) {
      throw ProblemException.of("minLevel must be AL1, AL2, AL3 or SHUTDOWN");
    }
  }
}
