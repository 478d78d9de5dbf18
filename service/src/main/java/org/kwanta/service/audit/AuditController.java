package org.kwanta.service.audit;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.util.List;
import org.kwanta.service.system.CsvCells;
import org.kwanta.service.system.ResponseFormats;
import org.kwanta.service.system.TimeParameters;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.RequestHeader;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

@RestController
@Tag(
    name = "Audit",
    description =
        "The append-only record of every change to limits, sample-point configuration, API keys"
            + " and acknowledgements: who (API key id and name), when, what, before and after.")
class AuditController {

  private static final int MAX_ROWS = 10_000;
  private final AuditLog log;

  AuditController(AuditLog log) {
    this.log = log;
  }

  @GetMapping(
      value = "/api/v1/audit",
      produces = {MediaType.APPLICATION_JSON_VALUE, "text/csv"})
  @Operation(
      summary = "The audit log (JSON or CSV), oldest first",
      description =
          "Filter by from/to (ISO 8601, [from, to)), entity (limits, sample-point, plant,"
              + " api-key, acknowledgement) and entityId; at most 10,000 rows. CSV with"
              + " format=csv or Accept: text/csv.")
  ResponseEntity<?> list(
      @RequestParam(required = false) String from,
      @RequestParam(required = false) String to,
      @RequestParam(required = false) String entity,
      @RequestParam(required = false) String entityId,
      @RequestParam(required = false) String format,
      @RequestHeader(value = "Accept", required = false) String accept) {
    List<AuditLog.Event> events =
        log.find(
            TimeParameters.instant("from", from),
            TimeParameters.instant("to", to),
            entity,
            entityId,
            MAX_ROWS);
    if (ResponseFormats.csvRequested(format, accept)) {
      StringBuilder sb =
          new StringBuilder("id,at,key_id,key_name,action,entity_type,entity_id,before,after\r\n");
      for (AuditLog.Event e : events) {
        sb.append(
                String.join(
                    ",",
                    String.valueOf(e.id()),
                    e.at().toString(),
                    CsvCells.of(e.keyId()),
                    CsvCells.of(e.keyName()),
                    CsvCells.of(e.action()),
                    CsvCells.of(e.entityType()),
                    CsvCells.of(e.entityId()),
                    CsvCells.of(e.before() == null ? null : e.before().toString()),
                    CsvCells.of(e.after() == null ? null : e.after().toString())))
            .append("\r\n");
      }
      return ResponseEntity.ok()
          .contentType(MediaType.parseMediaType("text/csv;charset=UTF-8"))
          .header("Content-Disposition", "attachment; filename=\"audit.csv\"")
          .body(sb.toString());
    }
    return ResponseEntity.ok().contentType(MediaType.APPLICATION_JSON).body(events);
  }
}
