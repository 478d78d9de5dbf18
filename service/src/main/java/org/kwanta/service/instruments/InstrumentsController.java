package org.kwanta.service.instruments;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.tags.Tag;
import jakarta.validation.Valid;
import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.NotNull;
import jakarta.validation.constraints.Size;
import java.time.Clock;
import java.time.Instant;
import java.time.YearMonth;
import java.time.ZoneOffset;
import java.util.List;
import org.kwanta.model.Parameter;
import org.kwanta.service.audit.Actor;
import org.kwanta.service.system.ProblemException;
import org.kwanta.service.system.TimeParameters;
import org.springframework.http.HttpStatus;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.ResponseStatus;
import org.springframework.web.bind.annotation.RestController;

@RestController
@Tag(
    name = "Instrument care",
    description =
        "The log of calibrations and checks per instrument (a sample point and a parameter), when"
            + " each check is next due, and core-instrument availability per month (slots of"
            + " in-service time with good data not in doubt, over slots in service).")
class InstrumentsController {

  private final InstrumentLog log;
  private final CheckSchedule schedule;
  private final Availability availability;
  private final GrabComparisons grabs;
  private final JdbcClient jdbc;
  private final Clock clock;

  InstrumentsController(
      InstrumentLog log,
      CheckSchedule schedule,
      Availability availability,
      GrabComparisons grabs,
      JdbcClient jdbc,
      Clock clock) {
    this.grabs = grabs;
    this.log = log;
    this.schedule = schedule;
    this.availability = availability;
    this.jdbc = jdbc;
    this.clock = clock;
  }

  /** A check as a chemist enters it. */
  record CheckRequest(
      @NotBlank @Size(max = 64) String parameter,
      @NotNull CheckKind kind,
      @NotNull Instant performedAt,
      @NotNull Outcome outcome,
      @Size(max = 20) List<@Valid ResultRequest> results,
      @Size(min = 1, max = 4000) String note) {}

  /** One result of a check, in its unit (UCUM). */
  record ResultRequest(
      @NotBlank @Size(max = 100) String name,
      @NotNull Double value,
      @NotBlank @Size(max = 32) String unit,
      Double reference) {}

  /** One logged check; who logged it is the key of the request. */
  record CheckResponse(
      long id,
      String samplePoint,
      String parameter,
      CheckKind kind,
      Instant performedAt,
      Outcome outcome,
      List<InstrumentLog.Result> results,
      String note,
      Instant recordedAt,
      String recordedByKeyId,
      String recordedBy) {
    static CheckResponse from(InstrumentLog.Check c) {
      return new CheckResponse(
          c.id(),
          c.samplePoint(),
          c.parameter().code(),
          c.kind(),
          c.performedAt(),
          c.outcome(),
          c.results(),
          c.note(),
          c.recordedAt(),
          c.keyId(),
          c.keyName());
    }
  }

  /** One check of one instrument: when it was last done and when it is next due. */
  record DueResponse(
      String samplePoint,
      String parameter,
      CheckKind kind,
      long intervalDays,
      Instant lastDone,
      Outcome lastOutcome,
      Instant lastPerformed,
      Instant nextDue,
      CheckSchedule.Status status) {
    static DueResponse from(CheckSchedule.Due d) {
      return new DueResponse(
          d.samplePoint(),
          d.parameter().code(),
          d.kind(),
          d.intervalDays(),
          d.lastDone(),
          d.lastOutcome(),
          d.lastPerformed(),
          d.nextDue(),
          d.status());
    }
  }

  @PostMapping("/api/v1/sample-points/{samplePoint}/instrument-checks")
  @ResponseStatus(HttpStatus.CREATED)
  @Operation(
      summary = "Log a calibration or check of an instrument (chemist)",
      description =
          "kind: CELL_CONSTANT_CHECK (conductivities), BUFFER_CALIBRATION (ph),"
              + " SODIUM_CALIBRATION (sodium), CATION_RESIN_CHANGE (cation conductivities),"
              + " DISSOLVED_OXYGEN_ZERO_SPAN (dissolved_oxygen); outcome PASSED, ADJUSTED or"
              + " FAILED. Appended and audited; who logged it is the key of the request.")
  CheckResponse record(@PathVariable String samplePoint, @Valid @RequestBody CheckRequest r) {
    requirePoint(samplePoint);
    Parameter p = parameter(r.parameter());
    if (!r.kind().scheduled()) {
      throw ProblemException.of(
          r.kind() + " is logged by the service when a grab or lab result is entered");
    }
    if (!r.kind().appliesTo(p)) {
      throw ProblemException.of(r.kind() + " is not a check of a " + p.code() + " instrument");
    }
    if (r.performedAt().isAfter(clock.instant().plusSeconds(300))) {
      throw ProblemException.of("performedAt " + r.performedAt() + " lies in the future");
    }
    Actor by = Actor.current().orElseThrow(() -> new IllegalStateException("no authenticated key"));
    List<InstrumentLog.Result> results =
        r.results() == null
            ? List.of()
            : r.results().stream()
                .map(x -> new InstrumentLog.Result(x.name(), x.value(), x.unit(), x.reference()))
                .toList();
    return CheckResponse.from(
        log.record(samplePoint, p, r.kind(), r.performedAt(), r.outcome(), results, r.note(), by));
  }

  @GetMapping("/api/v1/sample-points/{samplePoint}/instrument-checks")
  @Operation(summary = "The check log of a sample point's instruments, oldest first")
  List<CheckResponse> checks(
      @PathVariable String samplePoint, @RequestParam(required = false) String parameter) {
    requirePoint(samplePoint);
    return log.checks(samplePoint, parameter == null ? null : parameter(parameter)).stream()
        .map(CheckResponse::from)
        .toList();
  }

  /** One comparison of an online instrument with a grab or lab result. */
  record GrabComparisonResponse(
      String samplePoint,
      String parameter,
      String unit,
      Instant grabTime,
      String source,
      String sampleId,
      double grabValue,
      String censored,
      Instant onlineTime,
      double onlineValue,
      double deviation,
      double tolerance,
      String toleranceSource,
      boolean withinTolerance,
      boolean inDoubtBefore,
      GrabComparisons.Verdict verdict) {
    static GrabComparisonResponse from(GrabComparisons.Comparison c) {
      return new GrabComparisonResponse(
          c.samplePoint(),
          c.parameter().code(),
          c.parameter().unit(),
          c.grabTime(),
          c.source(),
          c.sampleId(),
          c.grabValue(),
          c.censored(),
          c.onlineTime(),
          c.onlineValue(),
          c.deviation(),
          c.tolerance(),
          GrabComparisons.TOLERANCE_SOURCE,
          c.withinTolerance(),
          c.inDoubtBefore(),
          c.verdict());
    }
  }

  @GetMapping("/api/v1/sample-points/{samplePoint}/grab-comparisons")
  @Operation(
      summary = "Online instruments against grab and lab results over time, oldest first",
      description =
          "For each grab or lab result in [from, to) (default the last 31 days) of a parameter with"
              + " a tolerance (ph, the conductivities, sodium, silica, dissolved_oxygen): the online"
              + " value at its time (latest in the 15 minutes up to it), deviation online − grab,"
              + " tolerance (common practice, no source), whether the instrument was in doubt"
              + " before and the verdict: CLEARED, CONFIRMED, AGREES or DISAGREES.")
  List<GrabComparisonResponse> grabComparisons(
      @PathVariable String samplePoint,
      @RequestParam(required = false) String parameter,
      @RequestParam(required = false) String from,
      @RequestParam(required = false) String to) {
    requirePoint(samplePoint);
    TimeParameters.Range range =
        TimeParameters.range(from, to, clock.instant(), java.time.Duration.ofDays(31));
    return grabs
        .between(
            samplePoint, parameter == null ? null : parameter(parameter), range.from(), range.to())
        .stream()
        .map(GrabComparisonResponse::from)
        .toList();
  }

  @GetMapping("/api/v1/plants/{plant}/instrument-checks/due")
  @Operation(
      summary = "When each check of each instrument of a plant is next due",
      description =
          "At `at` (default now): per instrument and applicable check, the last successful one,"
              + " the next due date (last + interval of its kind, kwanta.instruments.*) and IN_DATE,"
              + " OVERDUE or NEVER_DONE.")
  List<DueResponse> due(@PathVariable String plant, @RequestParam(required = false) String at) {
    requirePlant(plant);
    Instant when = TimeParameters.instant("at", at);
    return schedule.at(plant, when == null ? clock.instant() : when).stream()
        .map(DueResponse::from)
        .toList();
  }

  /** One core instrument's availability in the month. */
  record AvailabilityResponse(
      String samplePoint,
      String block,
      String parameter,
      long slotSeconds,
      long slotsInService,
      long slotsWithData,
      long slotsGood,
      Double availability,
      Double completeness,
      String counting) {
    static AvailabilityResponse from(Availability.Instrument i) {
      return new AvailabilityResponse(
          i.samplePoint(),
          i.block(),
          i.parameter().code(),
          i.slot().toSeconds(),
          i.slotsInService(),
          i.slotsWithData(),
          i.slotsGood(),
          i.availability(),
          i.completeness(),
          COUNTING);
    }
  }

  static final String COUNTING =
      "slots of in-service time (IN_SERVICE and time before the block's first recorded state)";

  @GetMapping("/api/v1/plants/{plant}/instrument-availability")
  @Operation(
      summary = "Core-instrument availability and completeness in a calendar month (UTC)",
      description = "month=YYYY-MM. Availability and completeness are fractions 0 to 1.")
  List<AvailabilityResponse> availability(@PathVariable String plant, @RequestParam String month) {
    requirePlant(plant);
    YearMonth m = TimeParameters.month("month", month);
    Instant from = m.atDay(1).atStartOfDay().toInstant(ZoneOffset.UTC);
    Instant to = m.plusMonths(1).atDay(1).atStartOfDay().toInstant(ZoneOffset.UTC);
    return availability.of(plant, from, to).stream().map(AvailabilityResponse::from).toList();
  }

  private static Parameter parameter(String code) {
    try {
      return Parameter.ofCode(code);
    } catch (IllegalArgumentException e) {
      throw ProblemException.of(e.getMessage());
    }
  }

  private void requirePoint(String id) {
    if (jdbc.sql("SELECT count(*) FROM sample_point WHERE id = ?")
            .param(id)
            .query(Integer.class)
            .single()
        == 0) {
      throw ProblemException.notFound("sample point", id);
    }
  }

  private void requirePlant(String id) {
    if (jdbc.sql("SELECT count(*) FROM plant WHERE id = ?").param(id).query(Integer.class).single()
        == 0) {
      throw ProblemException.notFound("plant", id);
    }
  }
}
