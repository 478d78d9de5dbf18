package org.kwanta.service.ingest;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.io.StringReader;
import java.time.Instant;
import java.util.List;
import org.kwanta.model.Parameter;
import org.kwanta.service.audit.Actor;
import org.kwanta.service.system.ProblemException;
import org.kwanta.service.system.TimeParameters;
import org.springframework.http.MediaType;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

@RestController
@Tag(
    name = "Lab results",
    description =
        "Grab and lab results entered by chemists: stored apart from the online readings (never the"
            + " current online value, never a stale-data alarm, not evaluated as online readings);"
            + " ug/L and mg/L converted to ug/kg with the density of water; censored values kept"
            + " censored.")
class LabResultsController {

  private final IngestService ingest;
  private final IngestLimits limits;
  private final LabResults results;
  private final JdbcClient jdbc;
  private final java.time.Clock clock;

  LabResultsController(
      IngestService ingest,
      IngestLimits limits,
      LabResults results,
      JdbcClient jdbc,
      java.time.Clock clock) {
    this.clock = clock;
    this.ingest = ingest;
    this.limits = limits;
    this.results = results;
    this.jdbc = jdbc;
  }

  @PostMapping(path = "/api/v1/lab-results", consumes = MediaType.APPLICATION_JSON_VALUE)
  @Operation(
      summary = "Enter grab or lab results (JSON, all or nothing)",
      description =
          "The fields of a reading plus source (grab or lab, default lab), sampleId, labMethod,"
              + " censored ('below': the value is the detection limit) and densityTemperatureCel"
              + " (for ug/L and mg/L: the density of water there, IAPWS-IF97 at 101.325 kPa,"
              + " converts to ug/kg; default 25 °C; every conversion is in the response). Who"
              + " entered them is the key of the request.")
  LabResults.Outcome json(@RequestBody IngestRequest request) {
    List<ReadingInput> readings = request.readings();
    return ingest.lab(readings == null ? List.of() : readings, List.of(), actor());
  }

  @PostMapping(path = "/api/v1/lab-results", consumes = "text/csv")
  @Operation(
      summary = "Enter grab or lab results (CSV)",
      description =
          "Columns of the readings CSV plus optional source, sample_id, lab_method, censored,"
              + " density_temperature_cel; a value written '<2' is censored below 2.")
  LabResults.Outcome csv(@RequestBody String body) {
    CsvReadings.Parsed parsed = CsvReadings.parse(new StringReader(body), limits.maxBatchSize());
    try {
      return ingest.lab(parsed.readings(), parsed.rejected(), actor());
    } catch (InvalidBatchException e) {
      throw e.withLines(parsed.lines());
    }
  }

  /** One stored result as the API shows it. */
  record LabResultResponse(
      String samplePoint,
      String parameter,
      Instant time,
      String source,
      double value,
      String unit,
      String censored,
      String display,
      String sampleId,
      String labMethod,
      double sentValue,
      String sentUnit,
      Double conversionFactor,
      Double densityKgPerM3,
      Double densityTemperatureCel,
      String enteredBy) {

    static LabResultResponse from(LabResults.LabResult r) {
      return new LabResultResponse(
          r.samplePoint(),
          r.parameter().code(),
          r.time(),
          r.source(),
          r.value(),
          r.unit(),
          r.censored(),
          (r.belowDetectionLimit() ? "< " : "") + r.value() + " " + r.unit(),
          r.sampleId(),
          r.labMethod(),
          r.sentValue(),
          r.sentUnit(),
          r.conversionFactor(),
          r.densityKgPerM3(),
          r.densityTemperatureCel(),
          r.keyName());
    }
  }

  @GetMapping("/api/v1/sample-points/{samplePoint}/lab-results")
  @Operation(
      summary = "A sample point's grab and lab results in [from, to), oldest first",
      description =
          "Censored results keep censored 'below' with the detection limit as value (display"
              + " '< 2.0 ug/kg'). Default: the last 31 days.")
  List<LabResultResponse> list(
      @PathVariable String samplePoint,
      @RequestParam(required = false) String parameter,
      @RequestParam(required = false) String from,
      @RequestParam(required = false) String to) {
    if (jdbc.sql("SELECT count(*) FROM sample_point WHERE id = ?")
            .param(samplePoint)
            .query(Integer.class)
            .single()
        == 0) {
      throw ProblemException.notFound("sample point", samplePoint);
    }
    Parameter p = null;
    if (parameter != null) {
      p =
          Parameter.byCode(parameter)
              .orElseThrow(
                  () ->
                      ProblemException.of(
                          "unknown parameter '" + parameter + "'; known: " + Parameter.codes()));
    }
    TimeParameters.Range range =
        TimeParameters.range(from, to, clock.instant(), java.time.Duration.ofDays(31));
    return results.between(samplePoint, p, range.from(), range.to()).stream()
        .map(LabResultResponse::from)
        .toList();
  }

  private static Actor actor() {
    return Actor.current().orElseThrow(() -> new IllegalStateException("no authenticated key"));
  }
}
