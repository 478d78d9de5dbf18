package org.kwanta.service.reports;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.time.Instant;
import java.time.Year;
import java.time.YearMonth;
import java.time.ZoneOffset;
import org.kwanta.service.limits.ExcursionFinder;
import org.kwanta.service.system.ProblemException;
import org.kwanta.service.system.ResponseFormats;
import org.kwanta.service.system.TimeParameters;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.RequestHeader;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

@RestController
@RequestMapping("/api/v1/plants/{plant}/reports")
@Tag(
    name = "Reports",
    description =
        "A plant's monthly or annual chemistry report: in-service hours per level per sample point"
            + " and parameter, excursion events with their causes, core-instrument availability and"
            + " data completeness, calibration status, and Kwanta's chemistry performance index"
            + " (docs/report.md). JSON or CSV (format=csv or Accept: text/csv); printable page:"
            + " /report.html?plant=...&month=YYYY-MM.")
class ReportsController {

  private final Reports reports;
  private final JdbcClient jdbc;

  ReportsController(Reports reports, JdbcClient jdbc) {
    this.reports = reports;
    this.jdbc = jdbc;
  }

  @GetMapping(
      value = "/monthly",
      produces = {MediaType.APPLICATION_JSON_VALUE, "text/csv"})
  @Operation(
      summary =
          "The report of a calendar month (UTC), e.g. ?month=2026-04; basis=as-reported (default)"
              + " or recomputed with today's limits")
  ResponseEntity<?> monthly(
      @PathVariable String plant,
      @RequestParam String month,
      @RequestParam(required = false) String basis,
      @RequestParam(required = false) String format,
      @RequestHeader(value = "Accept", required = false) String accept) {
    YearMonth m = TimeParameters.month("month", month);
    Instant from = m.atDay(1).atStartOfDay().toInstant(ZoneOffset.UTC);
    Instant to = m.plusMonths(1).atDay(1).atStartOfDay().toInstant(ZoneOffset.UTC);
    return answer(plant, "month", m.toString(), from, to, basis, format, accept);
  }

  @GetMapping(
      value = "/annual",
      produces = {MediaType.APPLICATION_JSON_VALUE, "text/csv"})
  @Operation(summary = "The report of a calendar year (UTC), e.g. ?year=2026")
  ResponseEntity<?> annual(
      @PathVariable String plant,
      @RequestParam String year,
      @RequestParam(required = false) String basis,
      @RequestParam(required = false) String format,
      @RequestHeader(value = "Accept", required = false) String accept) {
    Year y = TimeParameters.year("year", year);
    Instant from = y.atDay(1).atStartOfDay().toInstant(ZoneOffset.UTC);
    Instant to = y.plusYears(1).atDay(1).atStartOfDay().toInstant(ZoneOffset.UTC);
    return answer(plant, "year", y.toString(), from, to, basis, format, accept);
  }

  private ResponseEntity<?> answer(
      String plant,
      String period,
      String label,
      Instant from,
      Instant to,
      String basis,
      String format,
      String accept) {
    String name =
        jdbc.sql("SELECT name FROM plant WHERE id = ?")
            .param(plant)
            .query(String.class)
            .optional()
            .orElseThrow(() -> ProblemException.notFound("plant", plant));
    Report report =
        reports.build(plant, name, period, label, from, to, ExcursionFinder.Basis.parse(basis));
    if (ResponseFormats.csvRequested(format, accept)) {
      return ResponseEntity.ok()
          .contentType(MediaType.parseMediaType("text/csv;charset=UTF-8"))
          .header(
              "Content-Disposition",
              "attachment; filename=\"kwanta-report-" + plant + "-" + label + ".csv\"")
          .body(ReportCsv.of(report));
    }
    return ResponseEntity.ok().contentType(MediaType.APPLICATION_JSON).body(report);
  }
}
