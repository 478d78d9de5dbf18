package org.kwanta.service.events;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.tags.Tag;
import jakarta.validation.Valid;
import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.NotEmpty;
import jakarta.validation.constraints.NotNull;
import jakarta.validation.constraints.Size;
import java.lang.annotation.ElementType;
import java.lang.annotation.Retention;
import java.lang.annotation.RetentionPolicy;
import java.lang.annotation.Target;
import java.time.Instant;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.kwanta.model.Parameter;
import org.kwanta.service.audit.Actor;
import org.kwanta.service.limits.ExcursionFinder;
import org.kwanta.service.limits.Limits;
import org.kwanta.service.system.ProblemException;
import org.kwanta.service.system.ProblemTypes;
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
@RequestMapping("/api/v1/excursion-events")
@Tag(
    name = "Excursion events",
    description =
        "Excursions grouped under one event with a cause category, a status (OPEN,"
            + " UNDER_INVESTIGATION, CLOSED) and notes; append-only, every entry by its API key.")
class ExcursionEventsController {

  private final ExcursionEvents events;
  private final ExcursionFinder finder;
  private final Limits limits;
  private final tools.jackson.databind.json.JsonMapper mapper;

  ExcursionEventsController(
      ExcursionEvents events,
      ExcursionFinder finder,
      Limits limits,
      tools.jackson.databind.json.JsonMapper mapper) {
    this.mapper = mapper;
    this.events = events;
    this.finder = finder;
    this.limits = limits;
  }

  /** An excursion as reported, named by sample point, parameter and start. */
  record ExcursionRef(
      @NotBlank @Size(max = 64) String samplePoint,
      @NotBlank @Size(max = 64) String parameter,
      @NotNull Instant start) {}

  record CreateRequest(
      @NotBlank @Size(max = 200) String title,
      String causeCategory,
      @NotBlank @Size(max = 4000) String note,
      @NotEmpty @Size(max = 100) List<@Valid ExcursionRef> excursions) {}

  record EntryRequest(
      String status, String causeCategory, @NotBlank @Size(max = 4000) String note) {}

  @PostMapping
  @ResponseStatus(HttpStatus.CREATED)
  @Operation(
      summary = "Group excursions under an event (status OPEN)",
      description =
          "causeCategory: CONDENSER_INGRESS, AIR_INGRESS, MAKE_UP_WATER, CONDENSATE_POLISHING,"
              + " CHEMICAL_DOSING, OPERATING_TRANSIENT, INSTRUMENT_OR_SAMPLING, OTHER,"
              + " UNDETERMINED (default).")
  ExcursionEvents.Event create(@Valid @RequestBody CreateRequest r) {
    List<ExcursionEvents.Member> members = r.excursions().stream().map(this::member).toList();
    CauseCategory cause =
        r.causeCategory() == null ? CauseCategory.UNDETERMINED : cause(r.causeCategory());
    return events.create(r.title().strip(), cause, r.note(), members, actor());
  }

  @PostMapping("/{event}/entries")
  @ResponseStatus(HttpStatus.CREATED)
  @Operation(summary = "Append a note, optionally changing the status and/or the cause category")
  ExcursionEvents.Event append(
      @EventNumber @PathVariable("event") long eventId, @Valid @RequestBody EntryRequest r) {
    return events
        .append(
            eventId,
            r.status() == null ? null : status(r.status()),
            r.causeCategory() == null ? null : cause(r.causeCategory()),
            r.note(),
            actor())
        .orElseThrow(() -> notFound(eventId));
  }

  @PostMapping("/{event}/excursions")
  @ResponseStatus(HttpStatus.CREATED)
  @Operation(summary = "Add an excursion to an event")
  ExcursionEvents.Event add(
      @EventNumber @PathVariable("event") long eventId, @Valid @RequestBody ExcursionRef r) {
    return events.add(eventId, member(r), actor()).orElseThrow(() -> notFound(eventId));
  }

  @GetMapping
  @Operation(
      summary = "Excursion events, newest first, optionally of one status",
      description =
          "With a weak ETag over the list: asked again with If-None-Match, the answer is 304 Not"
              + " Modified without a body while no event, member or entry changed.")
  org.springframework.http.ResponseEntity<List<ExcursionEvents.Event>> list(
      @RequestParam(required = false) String status) {
    List<ExcursionEvents.Event> list = events.list(status == null ? null : status(status), null);
    return org.springframework.http.ResponseEntity.ok()
        .eTag(org.kwanta.service.system.WeakTags.of(mapper, list))
        .body(list);
  }

  @GetMapping("/{event}")
  @Operation(summary = "One excursion event with its excursions and every entry")
  ExcursionEvents.Event one(@EventNumber @PathVariable("event") long eventId) {
    return events.find(eventId).orElseThrow(() -> notFound(eventId));
  }

  /** The OpenAPI description of the {@code {event}} path variable. */
  @Target(ElementType.PARAMETER)
  @Retention(RetentionPolicy.RUNTIME)
  @io.swagger.v3.oas.annotations.Parameter(
      description = "The excursion event's number (its id, as the create answered)",
      example = "1")
  @interface EventNumber {}

  private ExcursionEvents.Member member(ExcursionRef r) {
    Parameter parameter;
    try {
      parameter = Parameter.limitedOfCode(r.parameter());
    } catch (IllegalArgumentException e) {
      throw ProblemException.of(e.getMessage());
    }
    Limits.Point point =
        limits.points(null, r.samplePoint()).stream()
            .findFirst()
            .orElseThrow(() -> ProblemException.notFound("sample point", r.samplePoint()));
    if (!finder.exists(point, parameter, r.start())) {
      throw new ProblemException(
          HttpStatus.NOT_FOUND,
          ProblemTypes.NOT_FOUND,
          "Not found",
          "No excursion of " + parameter.code() + " at " + point.id() + " starts at " + r.start(),
          Map.of());
    }
    return new ExcursionEvents.Member(point.id(), parameter.code(), r.start());
  }

  private static Actor actor() {
    return Actor.current().orElseThrow(() -> new IllegalStateException("no authenticated key"));
  }

  private static ProblemException notFound(long eventId) {
    return ProblemException.notFound("excursion event", String.valueOf(eventId));
  }

  private static CauseCategory cause(String name) {
    try {
      return CauseCategory.valueOf(name.strip().toUpperCase(Locale.ROOT));
    } catch (IllegalArgumentException e) {
      throw ProblemException.of(
          "causeCategory must be one of " + java.util.Arrays.toString(CauseCategory.values()));
    }
  }

  private static EventStatus status(String name) {
    try {
      return EventStatus.valueOf(name.strip().toUpperCase(Locale.ROOT));
    } catch (IllegalArgumentException e) {
      throw ProblemException.of(
          "status must be one of " + java.util.Arrays.toString(EventStatus.values()));
    }
  }
}
