package org.kwanta.service.audit;

import java.sql.Timestamp;
import java.time.Instant;
import java.util.List;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Repository;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The append-only audit log (table {@code audit_event}): who changed what, when, with the entity
 * before and after. Written in the transaction of the change it records, so a change and its row
 * commit or roll back together. The table refuses UPDATE, DELETE and TRUNCATE (trigger).
 */
@Repository
public class AuditLog {

  /** The name recorded for changes without a request (start-up, declaration files). */
  static final String SYSTEM_NAME = "Kwanta service (start-up or declaration files)";

  /** One recorded change; {@code before} and {@code after} are JSON, null where there is none. */
  public record Event(
      long id,
      Instant at,
      String keyId,
      String keyName,
      String action,
      String entityType,
      String entityId,
      JsonNode before,
      JsonNode after) {}

  private final JdbcClient jdbc;
  private final JsonMapper json;

  AuditLog(JdbcClient jdbc, JsonMapper json) {
    this.jdbc = jdbc;
    this.json = json;
  }

  /**
   * Records a change by the caller of the current request (or the service itself).
   *
   * @param action what was done, e.g. {@code limits.set}
   * @param entityType the kind of entity, e.g. {@code limits}
   * @param entityId the entity's id, e.g. {@code U2-CPD/cation_conductivity}
   * @param before the entity before (serialised to JSON), null when it did not exist
   * @param after the entity after, null when it no longer exists
   */
  public void record(
      String action, String entityType, String entityId, Object before, Object after) {
    String keyId = Actor.current().map(Actor::keyId).orElse(Actor.SYSTEM);
    String keyName = Actor.current().map(Actor::keyName).orElse(SYSTEM_NAME);
    jdbc.sql(
            """
            INSERT INTO audit_event (key_id, key_name, action, entity_type, entity_id, before, after)
            VALUES (?, ?, ?, ?, ?, ?::jsonb, ?::jsonb)""")
        .params(keyId, keyName, action, entityType, entityId, text(before), text(after))
        .update();
  }

  private String text(Object o) {
    return o == null ? null : json.writeValueAsString(o);
  }

  /** Events in [from, to) of one entity type (null: all), oldest first, at most {@code limit}. */
  public List<Event> find(Instant from, Instant to, String entityType, String entityId, int limit) {
    return jdbc.sql(
            """
            SELECT id, at, key_id, key_name, action, entity_type, entity_id, before::text, after::text
            FROM audit_event
            WHERE (?::timestamptz IS NULL OR at >= ?) AND (?::timestamptz IS NULL OR at < ?)
              AND (?::text IS NULL OR entity_type = ?) AND (?::text IS NULL OR entity_id = ?)
            ORDER BY id LIMIT ?""")
        .params(
            ts(from), ts(from), ts(to), ts(to), entityType, entityType, entityId, entityId, limit)
        .query(
            (rs, i) ->
                new Event(
                    rs.getLong(1),
                    rs.getTimestamp(2).toInstant(),
                    rs.getString(3),
                    rs.getString(4),
                    rs.getString(5),
                    rs.getString(6),
                    rs.getString(7),
                    node(rs.getString(8)),
                    node(rs.getString(9))))
        .list();
  }

  private JsonNode node(String text) {
    return text == null ? null : json.readTree(text);
  }

  private static Timestamp ts(Instant t) {
    return t == null ? null : Timestamp.from(t);
  }
}
