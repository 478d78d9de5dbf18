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
import org.kwanta.model.OperatingStateCode;
import org.kwanta.model.Parameter;
import org.kwanta.model.limits.TimeWindow;
import org.kwanta.service.audit.Actor;
import org.kwanta.service.audit.AuditLog;
import org.kwanta.service.ingest.ReadingHistory;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Repository;
import org.springframework.transaction.annotation.Transactional;

/**
 * The operating-state record of plant blocks (table {@code block_operating_state}, append-only):
 * what a chemist entered, and the timeline it makes together with the historian's {@code
 * operating_state} readings of the block's sample points. The state at a time is that of the entry
 * with the latest {@code since} not after it; of entries with the same {@code since}, the latest
 * entered wins (a correction).
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

  /** What started a span: a state and who reported it. */
  private record Mark(OperatingState state, ServiceTime.Source source) {}

  private final JdbcClient jdbc;
  private final AuditLog audit;
  private final ReadingHistory readings;

  OperatingStates(JdbcClient jdbc, AuditLog audit, ReadingHistory readings) {
    this.jdbc = jdbc;
    this.audit = audit;
    this.readings = readings;
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

  /**
   * The block's time over [from, to) by state, with the windows that count as in service: the
   * chemist's entries merged with the block's historian readings of {@code operating_state}.
   */
  public ServiceTime serviceTime(String plant, String block, Instant from, Instant to) {
    return timeline(entries(plant, block), historianStates(plant, block, from, to), from, to);
  }

  /**
   * The block's {@code operating_state} readings (any of its sample points, quality not bad) that
   * bear on [from, to): the one in force at {@code from} and every later one before {@code to}.
   */
  List<ReadingHistory.PointReading> historianStates(
      String plant, String block, Instant from, Instant to) {
    return readings.blockReadings(plant, block, Parameter.OPERATING_STATE.code(), from, to);
  }

  /**
   * The timeline of a block's entries over [from, to) (entries sorted by since, then entry order).
   */
  static ServiceTime timeline(List<Entry> entries, Instant from, Instant to) {
    return timeline(entries, List.of(), from, to);
  }

  /**
   * The timeline of a block over [from, to) from the chemist's entries (sorted by since, then entry
   * order) and the historian's state readings (sorted by time, then sample point): each entry or
   * reading says "from this instant the block was in this state". At the same instant the chemist
   * wins over the historian (and of two chemist entries the later entered, of two readings the last
   * by sample point id). A reading whose value is not a state code is skipped (the ingest refuses
   * those). Each span names the source of the entry or reading that started it.
   */
  static ServiceTime timeline(
      List<Entry> entries, List<ReadingHistory.PointReading> historian, Instant from, Instant to) {
    // the effective mark per instant: historian first, so a chemist entry at the same instant wins
    java.util.TreeMap<Instant, Mark> bySince = new java.util.TreeMap<>();
    for (ReadingHistory.PointReading r : historian) {
      OperatingStateCode.of(r.value())
          .ifPresent(
              c ->
                  bySince.put(
                      r.time(),
                      new Mark(OperatingState.valueOf(c.name()), ServiceTime.Source.HISTORIAN)));
    }
    for (Entry e : entries) {
      bySince.put(e.since(), new Mark(e.state(), ServiceTime.Source.CHEMIST));
    }
    List<ServiceTime.Span> spans = new ArrayList<>();
    OperatingState state = null;
    ServiceTime.Source source = null;
    Instant start = from;
    for (Map.Entry<Instant, Mark> e : bySince.entrySet()) {
      Mark m = e.getValue();
      if (!e.getKey().isAfter(from)) {
        state = m.state();
        source = m.source();
        continue;
      }
      if (!e.getKey().isBefore(to)) {
        break;
      }
      if (m.state() != state) {
        spans.add(new ServiceTime.Span(state, start, e.getKey(), source));
        state = m.state();
        source = m.source();
        start = e.getKey();
      }
    }
    if (to.isAfter(start)) {
      spans.add(new ServiceTime.Span(state, start, to, source));
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
