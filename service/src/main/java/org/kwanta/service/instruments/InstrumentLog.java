package org.kwanta.service.instruments;

import java.sql.Timestamp;
import java.time.Instant;
import java.util.List;
import org.kwanta.model.Parameter;
import org.kwanta.service.audit.Actor;
import org.kwanta.service.audit.AuditLog;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Repository;
import org.springframework.transaction.annotation.Transactional;
import tools.jackson.core.type.TypeReference;
import tools.jackson.databind.json.JsonMapper;

/**
 * The log of calibrations and checks per instrument (table {@code instrument_check}, append-only),
 * each entry audited in the same transaction.
 */
@Repository
public class InstrumentLog {

  /**
   * One result of a check, e.g. the cell constant found: {@code name} "cell constant", {@code
   * value} 0.0102, {@code unit} "cm-1", {@code reference} 0.0100 (the value expected, when there is
   * one).
   */
  public record Result(String name, double value, String unit, Double reference) {}

  /** One logged check. */
  public record Check(
      long id,
      String samplePoint,
      Parameter parameter,
      CheckKind kind,
      Instant performedAt,
      Outcome outcome,
      List<Result> results,
      String note,
      Instant recordedAt,
      String keyId,
      String keyName) {}

  private final JdbcClient jdbc;
  private final JsonMapper json;
  private final AuditLog audit;

  InstrumentLog(JdbcClient jdbc, JsonMapper json, AuditLog audit) {
    this.jdbc = jdbc;
    this.json = json;
    this.audit = audit;
  }

  /** Appends a check and its audit event. */
  @Transactional
  public Check record(
      String samplePoint,
      Parameter parameter,
      CheckKind kind,
      Instant performedAt,
      Outcome outcome,
      List<Result> results,
      String note,
      Actor by) {
    long id =
        jdbc.sql(
                """
                INSERT INTO instrument_check (sample_point_id, parameter, kind, performed_at, outcome,
                                              results, note, key_id, key_name)
                VALUES (?, ?, ?, ?, ?, ?::jsonb, ?, ?, ?) RETURNING id""")
            .params(
                samplePoint,
                parameter.code(),
                kind.name(),
                Timestamp.from(performedAt),
                outcome.name(),
                json.writeValueAsString(results),
                note,
                by.keyId(),
                by.keyName())
            .query(Long.class)
            .single();
    Check check = find(samplePoint, null, id).get(0);
    audit.record(
        "instrument-check.record", "instrument", samplePoint + "/" + parameter.code(), null, check);
    return check;
  }

  /** The checks of a sample point (of one parameter, or all), oldest first. */
  public List<Check> checks(String samplePoint, Parameter parameter) {
    return find(samplePoint, parameter, null);
  }

  /** The checks of every sample point of a plant performed before {@code before}, oldest first. */
  public List<Check> plantChecks(String plant, Instant before) {
    return jdbc.sql(
            SELECT
                + " WHERE c.sample_point_id IN (SELECT id FROM sample_point WHERE plant_id = ?)"
                + " AND c.performed_at < ? ORDER BY c.performed_at, c.id")
        .params(plant, Timestamp.from(before))
        .query((rs, i) -> row(rs))
        .list();
  }

  private static final String SELECT =
      "SELECT c.id, c.sample_point_id, c.parameter, c.kind, c.performed_at, c.outcome,"
          + " c.results::text, c.note, c.recorded_at, c.key_id, c.key_name FROM instrument_check c";

  private List<Check> find(String samplePoint, Parameter parameter, Long id) {
    return jdbc.sql(
            SELECT
                + " WHERE c.sample_point_id = ? AND (?::text IS NULL OR c.parameter = ?)"
                + " AND (?::bigint IS NULL OR c.id = ?) ORDER BY c.performed_at, c.id")
        .params(
            samplePoint,
            parameter == null ? null : parameter.code(),
            parameter == null ? null : parameter.code(),
            id,
            id)
        .query((rs, i) -> row(rs))
        .list();
  }

  private Check row(java.sql.ResultSet rs) throws java.sql.SQLException {
    return new Check(
        rs.getLong(1),
        rs.getString(2),
        Parameter.ofCode(rs.getString(3)),
        CheckKind.valueOf(rs.getString(4)),
        rs.getTimestamp(5).toInstant(),
        Outcome.valueOf(rs.getString(6)),
        json.readValue(rs.getString(7), new TypeReference<List<Result>>() {}),
        rs.getString(8),
        rs.getTimestamp(9).toInstant(),
        rs.getString(10),
        rs.getString(11));
  }
}
