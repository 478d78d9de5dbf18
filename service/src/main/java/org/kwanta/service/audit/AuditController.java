package org.kwanta.service.audit;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.format.DateTimeParseException;
import java.util.List;
import java.util.Locale;
import org.kwanta.service.system.BadRequestException;
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
        log.find(time("from", from), time("to", to), entity, entityId, MAX_ROWS);
    if (csv(format, accept)) {
      StringBuilder sb =
          new StringBuilder("id,at,key_id,key_name,action,entity_type,entity_id,before,after\r\n");
      for (AuditLog.Event e : events) {
        sb.append(
                String.join(
                    ",",
                    String.valueOf(e.id()),
                    e.at().toString(),
                    cell(e.keyId()),
                    cell(e.keyName()),
                    cell(e.action()),
                    cell(e.entityType()),
                    cell(e.entityId()),
                    cell(e.before() == null ? null : e.before().toString()),
                    cell(e.after() == null ? null : e.after().toString())))
            .append("\r\n");
      }
      return ResponseEntity.ok()
          .contentType(MediaType.parseMediaType("text/csv;charset=UTF-8"))
          .header("Content-Disposition", "attachment; filename=\"audit.csv\"")
          .body(sb.toString());
    }
    return ResponseEntity.ok().contentType(MediaType.APPLICATION_JSON).body(events);
  }

  /** RFC 4180 quoting; a leading formula character is neutralised for spreadsheets. */
  private static String cell(String s) {
    if (s == null) {
      return "";
    }
    String v = !s.isEmpty() && "=+-@".indexOf(s.charAt(0)) >= 0 ? "'" + s : s;
    return v.contains(",") || v.contains("\"") || v.contains("\n") || v.contains("\r")
        ? "\"" + v.replace("\"", "\"\"") + "\""
        : v;
  }

  private static Instant time(String name, String value) {
    if (value == null) {
      return null;
    }
    try {
      return OffsetDateTime.parse(value).toInstant();
    } catch (DateTimeParseException e) {
      throw BadRequestException.of(
          name + " must be an ISO 8601 time with offset, e.g. 2025-06-12T06:00:00Z");
    }
  }

  private static boolean csv(String format, String accept) {
    if (format != null) {
      return switch (format.toLowerCase(Locale.ROOT)) {
        case "csv" -> true;
        case "json" -> false;
        default -> throw BadRequestException.of("format must be json or csv");
      };
    }
    return accept != null && accept.toLowerCase(Locale.ROOT).contains("text/csv");
  }
}
