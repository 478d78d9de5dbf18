package org.kwanta.service.ingest;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.media.Content;
import io.swagger.v3.oas.annotations.media.ExampleObject;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.io.StringReader;
import java.util.List;
import org.springframework.http.MediaType;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RestController;

@RestController
@RequestMapping("/api/v1/readings")
@Tag(
    name = "Readings",
    description =
        "Batches of analyser readings pushed by plant historians: stored whole or not at all, idempotent,"
            + " order-independent; evaluated at ingest.")
class ReadingsController {

  private final IngestService ingest;
  private final IngestLimits limits;

  ReadingsController(IngestService ingest, IngestLimits limits) {
    this.ingest = ingest;
    this.limits = limits;
  }

  @PostMapping(consumes = MediaType.APPLICATION_JSON_VALUE)
  @Operation(
      summary = "Ingest a JSON batch (up to 10,000 readings)",
      description =
          "Every reading is checked; if any is invalid the whole batch is refused (400, every rejected"
              + " reading listed with its index and reason) and nothing is stored. A 200 means every reading"
              + " is committed. The same (sample point, parameter, time) with the same value is a no-op; a"
              + " different value is a correction that keeps the old value as a revision.",
      requestBody =
          @io.swagger.v3.oas.annotations.parameters.RequestBody(
              content =
                  @Content(
                      examples =
                          @ExampleObject(
                              name = "Brackenmoor Unit 1 feedwater",
                              value =
                                  """
                                  {"readings": [
                                    {"samplePoint": "U1-ECO-IN", "parameter": "specific_conductivity",
                                     "time": "2026-11-30T10:00:00Z", "value": 5.42, "unit": "uS/cm",
                                     "sampleTemperatureCel": 27.4},
                                    {"samplePoint": "U1-ECO-IN", "parameter": "cation_conductivity",
                                     "time": "2026-11-30T10:00:00Z", "value": 0.082, "unit": "uS/cm",
                                     "compensated": true},
                                    {"samplePoint": "U1-ECO-IN", "parameter": "ph",
                                     "time": "2026-11-30T10:00:00Z", "value": 9.68, "unit": "[pH]"}
                                  ]}"""))))
  IngestService.Outcome json(@RequestBody IngestRequest request) {
    List<ReadingInput> readings = request.readings();
    return ingest.ingest(readings == null ? List.of() : readings);
  }

  @PostMapping(consumes = "text/csv")
  @Operation(
      summary = "Ingest a CSV batch (RFC 4180 with a header row)",
      description =
          "Columns sample_point, parameter, time, value, unit; optional quality, sample_temperature_cel,"
              + " compensated. Same rules as the JSON batch; a rejected reading gives its data row from 0"
              + " (index) and the line of the file where the row starts (line; the header is line 1)."
              + " A UTF-8 byte-order mark is skipped; numbers are plain decimals.")
  IngestService.Outcome csv(@RequestBody String body) {
    CsvReadings.Parsed parsed = CsvReadings.parse(new StringReader(body), limits.maxBatchSize());
    try {
      return ingest.ingest(parsed.readings(), parsed.rejected());
    } catch (InvalidBatchException e) {
      throw e.withLines(parsed.lines()); // a CSV rejection names the line of the file
    }
  }
}
