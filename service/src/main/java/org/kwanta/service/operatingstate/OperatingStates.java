package org.kwanta.service.operatingstate;

import java.sql.Timestamp;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.kwanta.model.limits.TimeWindow;
import org.kwanta.service.audit.Actor;
import org.kwanta.service.audit.AuditLog;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Repository;
import org.springframework.transaction.annotation.Transactional;

/**
 * The operating-state record of plant blocks (table {@code block_operating_state}, append-only):
 * what a chemist entered, and the timeline it makes. The state at a time is that of the entry with
 * the latest {@code since} not after it; of entries with the same {@code since}, the latest entered
 * wins (a correction).
 */
@Repository
public class OperatingStates {

  /** One entry as recorded. */
  public record Entry(
      long id,
      String plant,
      String block,
      OperatingState state,
      Instant since,
      String note,
      Instant recordedAt,
      String keyId,
      String keyName) {}

  private final JdbcClient jdbc;
  private final AuditLog audit;

  OperatingStates(JdbcClient jdbc, AuditLog audit) {
    this.jdbc = jdbc;
    this.audit = audit;
  }

  /** Whether the plant has this block. */
  public boolean blockExists(String plant, String block) {
    return jdbc.sql("SELECT count(*) FROM plant_block WHERE plant_id = ? AND id = ?")
            .params(plant, block)
            .query(Integer.class)
            .single()
        > 0;
  }

  /** Appends an entry and its audit event in one transaction. */
  @Transactional
  public Entry record(
      String plant, String block, OperatingState state, Instant since, String note, Actor by) {
    Optional<OperatingState> before = stateAt(plant, block, since);
    long id =
        jdbc.sql(
                """
                INSERT INTO block_operating_state (plant_id, block_id, state, since, note, key_id, key_name)
                VALUES (?, ?, ?, ?, ?, ?, ?) RETURNING id""")
            .params(
                plant, block, state.name(), Timestamp.from(since), note, by.keyId(), by.keyName())
            .query(Long.class)
            .single();
    Entry entry =
        entries(plant, block).stream().filter(e -> e.id() == id).findFirst().orElseThrow();
    Map<String, Object> was = new LinkedHashMap<>();
    was.put("since", since);
    was.put("state", before.orElse(null));
    audit.record(
        "operating-state.record", "block-operating-state", plant + "/" + block, was, entry);
    return entry;
  }

  /** Every entry of a block, by {@code since} then by entry order. */
  public List<Entry> entries(String plant, String block) {
    return jdbc.sql(
            """
            SELECT id, plant_id, block_id, state, since, note, recorded_at, key_id, key_name
            FROM block_operating_state WHERE plant_id = ? AND block_id = ? ORDER BY since, id""")
        .params(plant, block)
        .query(
            (rs, i) ->
                new Entry(
                    rs.getLong(1),
                    rs.getString(2),
                    rs.getString(3),
                    OperatingState.valueOf(rs.getString(4)),
                    rs.getTimestamp(5).toInstant(),
                    rs.getString(6),
                    rs.getTimestamp(7).toInstant(),
                    rs.getString(8),
                    rs.getString(9)))
        .list();
  }

  /** The recorded state at {@code t}, if one was recorded at or before it. */
  public Optional<OperatingState> stateAt(String plant, String block, Instant t) {
    return serviceTime(plant, block, t, t.plusMillis(1)).spans().stream()
        .findFirst()
        .map(ServiceTime.Span::state);
  }

  /** The block's time over [from, to) by state, with the windows that count as in service. */
  public ServiceTime serviceTime(String plant, String block, Instant from, Instant to) {
    return timeline(entries(plant, block), from, to);
  }

  /**
   * The timeline of a block's entries over [from, to) (entries sorted by since, then entry order).
   */
  static ServiceTime timeline(List<Entry> entries, Instant from, Instant to) {
    // the effective entry per `since`: the latest entered
    Map<Instant, OperatingState> bySince = new LinkedHashMap<>();
    for (Entry e : entries) {
      bySince.put(e.since(), e.state());
    }
    List<ServiceTime.Span> spans = new ArrayList<>();
    OperatingState state = null;
    Instant start = from;
    for (Map.Entry<Instant, OperatingState> e : bySince.entrySet()) {
      if (!e.getKey().isAfter(from)) {
        state = e.getValue();
        continue;
      }
      if (!e.getKey().isBefore(to)) {
        break;
      }
      if (e.getValue() != state) {
        spans.add(new ServiceTime.Span(state, start, e.getKey()));
        state = e.getValue();
        start = e.getKey();
      }
    }
    if (to.isAfter(start)) {
      spans.add(new ServiceTime.Span(state, start, to));
    }
    List<TimeWindow> counted = new ArrayList<>();
    Map<OperatingState, Duration> byState = new EnumMap<>(OperatingState.class);
    Duration unrecorded = Duration.ZERO;
    for (ServiceTime.Span s : spans) {
      Duration d = Duration.between(s.start(), s.end());
      if (s.state() == null) {
        unrecorded = unrecorded.plus(d);
      } else {
        byState.merge(s.state(), d, Duration::plus);
      }
      if (s.state() == null || s.state() == OperatingState.IN_SERVICE) {
        if (!counted.isEmpty() && counted.get(counted.size() - 1).end().equals(s.start())) {
          TimeWindow last = counted.remove(counted.size() - 1);
          counted.add(new TimeWindow(last.start(), s.end()));
        } else {
          counted.add(new TimeWindow(s.start(), s.end()));
        }
      }
    }
    return new ServiceTime(from, to, List.copyOf(spans), List.copyOf(counted), byState, unrecorded);
  }
}
