package org.kwanta.service.events;

import java.sql.Timestamp;
import java.time.Instant;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.kwanta.service.audit.Actor;
import org.kwanta.service.audit.AuditLog;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Repository;
import org.springframework.transaction.annotation.Transactional;

/**
 * Excursion events in PostgreSQL, append-only: an event, the excursions it groups, and its entries
 * (notes, each optionally changing the status or the cause category). Every change also writes an
 * audit row.
 */
@Repository
class ExcursionEvents {

  /** An excursion named by point, parameter and start (as reported). */
  record Member(String samplePoint, String parameter, Instant start) {}

  /** A note, optionally setting status and cause. */
  record Entry(
      long id,
      Instant at,
      String keyId,
      String keyName,
      EventStatus status,
      CauseCategory causeCategory,
      String note) {}

  /** An event with its current status and cause (from the latest entries that set them). */
  record Event(
      long id,
      String title,
      Instant createdAt,
      String keyId,
      String keyName,
      EventStatus status,
      CauseCategory causeCategory,
      List<Member> excursions,
      List<Entry> entries) {}

  private final JdbcClient jdbc;
  private final AuditLog audit;

  ExcursionEvents(JdbcClient jdbc, AuditLog audit) {
    this.jdbc = jdbc;
    this.audit = audit;
  }

  @Transactional
  Event create(String title, CauseCategory cause, String note, List<Member> members, Actor by) {
    long id =
        jdbc.sql(
                "INSERT INTO excursion_event (title, key_id, key_name) VALUES (?, ?, ?) RETURNING id")
            .params(title, by.keyId(), by.keyName())
            .query(Long.class)
            .single();
    for (Member m : members) {
      insertMember(id, m, by);
    }
    insertEntry(id, EventStatus.OPEN, cause, note, by);
    Event event = find(id).orElseThrow();
    audit.record("excursion-event.create", "excursion-event", String.valueOf(id), null, event);
    return event;
  }

  @Transactional
  Optional<Event> append(long id, EventStatus status, CauseCategory cause, String note, Actor by) {
    Optional<Event> before = find(id);
    if (before.isEmpty()) {
      return Optional.empty();
    }
    insertEntry(id, status, cause, note, by);
    Event after = find(id).orElseThrow();
    audit.record(
        "excursion-event.entry",
        "excursion-event",
        String.valueOf(id),
        summary(before.get()),
        summary(after));
    return Optional.of(after);
  }

  @Transactional
  Optional<Event> add(long id, Member m, Actor by) {
    Optional<Event> before = find(id);
    if (before.isEmpty()) {
      return Optional.empty();
    }
    if (!before.get().excursions().contains(m)) {
      insertMember(id, m, by);
      audit.record(
          "excursion-event.add-excursion",
          "excursion-event",
          String.valueOf(id),
          before.get().excursions(),
          find(id).orElseThrow().excursions());
    }
    return find(id);
  }

  private static Map<String, Object> summary(Event e) {
    Map<String, Object> m = new LinkedHashMap<>();
    m.put("status", e.status());
    m.put("causeCategory", e.causeCategory());
    m.put("entries", e.entries().size());
    m.put(
        "lastNote", e.entries().isEmpty() ? null : e.entries().get(e.entries().size() - 1).note());
    return m;
  }

  private void insertMember(long id, Member m, Actor by) {
    jdbc.sql(
            """
            INSERT INTO excursion_event_member
                (event_id, sample_point_id, parameter, excursion_start, key_id)
            VALUES (?, ?, ?, ?, ?)""")
        .params(id, m.samplePoint(), m.parameter(), Timestamp.from(m.start()), by.keyId())
        .update();
  }

  private void insertEntry(
      long id, EventStatus status, CauseCategory cause, String note, Actor by) {
    jdbc.sql(
            """
            INSERT INTO excursion_event_entry
                (event_id, key_id, key_name, status, cause_category, note)
            VALUES (?, ?, ?, ?, ?, ?)""")
        .params(
            id,
            by.keyId(),
            by.keyName(),
            status == null ? null : status.name(),
            cause == null ? null : cause.name(),
            note)
        .update();
  }

  Optional<Event> find(long id) {
    return jdbc.sql("SELECT id FROM excursion_event WHERE id = ?")
        .param(id)
        .query(Long.class)
        .optional()
        .map(x -> list(null, x).get(0));
  }

  private record Head(long id, String title, Instant createdAt, String keyId, String keyName) {}

  /** Events, newest first (at most 1,000), optionally of one status; or one by id. */
  List<Event> list(EventStatus status, Long onlyId) {
    List<Head> heads =
        jdbc.sql(
                """
                SELECT id, title, created_at, key_id, key_name FROM excursion_event
                WHERE (?::bigint IS NULL OR id = ?) ORDER BY id DESC LIMIT 1000""")
            .params(onlyId, onlyId)
            .query(
                (rs, i) ->
                    new Head(
                        rs.getLong(1),
                        rs.getString(2),
                        rs.getTimestamp(3).toInstant(),
                        rs.getString(4),
                        rs.getString(5)))
            .list();
    List<Event> events = new java.util.ArrayList<>();
    for (Head h : heads) {
      List<Entry> entries = entries(h.id());
      EventStatus current = EventStatus.OPEN;
      CauseCategory cause = CauseCategory.UNDETERMINED;
      for (Entry e : entries) {
        current = e.status() == null ? current : e.status();
        cause = e.causeCategory() == null ? cause : e.causeCategory();
      }
      if (status == null || status == current) {
        events.add(
            new Event(
                h.id(),
                h.title(),
                h.createdAt(),
                h.keyId(),
                h.keyName(),
                current,
                cause,
                members(h.id()),
                entries));
      }
    }
    return events;
  }

  private List<Member> members(long id) {
    return jdbc.sql(
            """
            SELECT sample_point_id, parameter, excursion_start FROM excursion_event_member
            WHERE event_id = ? ORDER BY excursion_start, sample_point_id, parameter""")
        .param(id)
        .query(
            (rs, i) -> new Member(rs.getString(1), rs.getString(2), rs.getTimestamp(3).toInstant()))
        .list();
  }

  private List<Entry> entries(long id) {
    return jdbc.sql(
            """
            SELECT id, at, key_id, key_name, status, cause_category, note
            FROM excursion_event_entry WHERE event_id = ? ORDER BY id""")
        .param(id)
        .query(
            (rs, i) ->
                new Entry(
                    rs.getLong(1),
                    rs.getTimestamp(2).toInstant(),
                    rs.getString(3),
                    rs.getString(4),
                    rs.getString(5) == null ? null : EventStatus.valueOf(rs.getString(5)),
                    rs.getString(6) == null ? null : CauseCategory.valueOf(rs.getString(6)),
                    rs.getString(7)))
        .list();
  }
}
