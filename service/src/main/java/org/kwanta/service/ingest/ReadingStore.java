package org.kwanta.service.ingest;

import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.Timestamp;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.kwanta.model.Parameter;
import org.kwanta.service.ingest.EvaluationRunner.StoredReading;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.stereotype.Repository;

/**
 * Writes readings: one statement per batch (arrays unnested server-side), inserting new rows,
 * replacing changed ones and keeping every replaced row in {@code reading_revision}. Identical rows
 * are left alone.
 */
@Repository
class ReadingStore {

  static final String UPSERT =
      """
      WITH incoming AS (
        SELECT * FROM unnest(?::int4[], ?::int2[], ?::text[]::timestamptz[], ?::float8[], ?::int2[],
                             ?::float8[], ?::bool[])
          AS t(point_key, parameter_key, time, value, quality, sample_temperature_cel, compensated)
      ), revised AS (
        INSERT INTO reading_revision (point_key, parameter_key, time, old_value, old_quality,
                                      old_sample_temperature_cel, old_compensated, new_value)
        SELECT r.point_key, r.parameter_key, r.time, r.value, r.quality, r.sample_temperature_cel,
               r.compensated, i.value
        FROM incoming i JOIN reading r USING (point_key, parameter_key, time)
        WHERE (r.value, r.quality, r.sample_temperature_cel, r.compensated)
              IS DISTINCT FROM (i.value, i.quality, i.sample_temperature_cel, i.compensated)
        RETURNING 1
      ), upserted AS (
        INSERT INTO reading AS r (time, value, sample_temperature_cel, point_key, parameter_key, quality,
                                  compensated)
        SELECT time, value, sample_temperature_cel, point_key, parameter_key, quality, compensated
        FROM incoming
        ON CONFLICT (point_key, parameter_key, time) DO UPDATE
          SET value = EXCLUDED.value, quality = EXCLUDED.quality,
              sample_temperature_cel = EXCLUDED.sample_temperature_cel, compensated = EXCLUDED.compensated
          WHERE (r.value, r.quality, r.sample_temperature_cel, r.compensated)
                IS DISTINCT FROM (EXCLUDED.value, EXCLUDED.quality, EXCLUDED.sample_temperature_cel,
                                  EXCLUDED.compensated)
        RETURNING 1
      )
      SELECT (SELECT count(*) FROM upserted), (SELECT count(*) FROM revised)""";

  static final String LOCK_HEADS =
      """
      WITH batch AS (
        SELECT * FROM unnest(?::text[], ?::timestamptz[]) AS b(sample_point_id, max_time)
      ), locked AS MATERIALIZED (
        SELECT h.sample_point_id, h.generation, h.latest_time FROM reading_head h
        WHERE h.sample_point_id IN (SELECT sample_point_id FROM batch)
        ORDER BY h.sample_point_id
        FOR UPDATE
      )
      UPDATE reading_head h
         SET generation = nextval('reading_generation'), latest_time = greatest(h.latest_time, b.max_time)
      FROM locked l JOIN batch b USING (sample_point_id)
      WHERE h.sample_point_id = l.sample_point_id
      RETURNING h.sample_point_id, l.generation, h.generation, l.latest_time""";

  static final String COPY_TARGET =
      "reading (time, value, sample_temperature_cel, point_key, parameter_key, quality,"
          + " compensated)";

  private static final String[] PARAMETER_CODES = Parameter.codeArray();

  /** An upper bound beyond every reading (the validator refuses times this far ahead). */
  static final Instant FAR_FUTURE = Instant.parse("9999-01-01T00:00:00Z");

  /** Time, then parameter code: the order of a point's readings read back. */
  static final java.util.Comparator<StoredReading> TIME_ORDER =
      java.util.Comparator.comparing(StoredReading::time).thenComparing(StoredReading::parameter);

  private final JdbcTemplate jdbc;
  private final SeriesKeys keys;
  private final Partitions partitions;
  private final PackedReadings packed;

  ReadingStore(JdbcTemplate jdbc, SeriesKeys keys, Partitions partitions, PackedReadings packed) {
    this.jdbc = jdbc;
    this.keys = keys;
    this.partitions = partitions;
    this.packed = packed;
  }

  /**
   * Takes the readings of packed days out of the list and writes them into their blocks ({@link
   * PackedReadings#write}); the rest stay for {@code reading}.
   */
  private Counts writePacked(List<ValidReading> readings) {
    if (!partitions.anyPacked()) {
      return new Counts(0, 0, 0);
    }
    List<ValidReading> coldReadings = new ArrayList<>();
    List<ValidReading> hot = new ArrayList<>(readings.size());
    for (ValidReading r : readings) {
      (partitions.isPacked(Partitions.dayOf(r.time())) ? coldReadings : hot).add(r);
    }
    if (coldReadings.isEmpty()) {
      return new Counts(0, 0, 0);
    }
    List<PackedReadings.Incoming> cold = new ArrayList<>(coldReadings.size());
    for (Keyed k : keyed(coldReadings)) {
      ValidReading r = k.reading();
      cold.add(
          new PackedReadings.Incoming(
              k.point(),
              k.parameter(),
              new ReadingBlock.Row(
                  PackedReadings.micros(r.time()),
                  r.value(),
                  r.quality().code(),
                  Double.isNaN(r.sampleTemperatureCel()) ? null : r.sampleTemperatureCel(),
                  r.compensated())));
    }
    readings.clear();
    readings.addAll(hot);
    return packed.write(cold);
  }

  /**
   * The readings in key order (point key, parameter key, time). Written in this order, a series'
   * new index entries follow each other in the heap, which lets PostgreSQL split a full leaf page
   * after the new entry instead of in the middle (its "split after new item" rule), so the primary
   * key's pages stay nearly full.
   */
  private List<Keyed> keyed(List<ValidReading> readings) {
    keys.ensure(readings.stream().map(ValidReading::samplePointId).distinct().toList());
    List<Keyed> out = new ArrayList<>(readings.size());
    for (ValidReading r : readings) {
      out.add(new Keyed(keys.point(r.samplePointId()), keys.parameter(r.parameter()), r));
    }
    out.sort(KEY_ORDER);
    return out;
  }

  private record Keyed(int point, short parameter, ValidReading reading) {}

  private static final java.util.Comparator<Keyed> KEY_ORDER =
      java.util.Comparator.comparingInt(Keyed::point)
          .thenComparingInt(Keyed::parameter)
          .thenComparing(k -> k.reading().time());

  /** What a batch changed. */
  record Counts(int inserted, int corrected, int unchanged) {}

  /**
   * Upserts readings with distinct keys (the caller de-duplicates). Runs in the caller's
   * transaction.
   */
  Counts upsert(List<ValidReading> all) {
    if (!partitions.anyPacked()) {
      return upsertHot(all);
    }
    List<ValidReading> readings = new ArrayList<>(all);
    Counts cold = writePacked(readings);
    if (readings.isEmpty()) {
      return cold;
    }
    Counts hot = upsertHot(readings);
    return new Counts(
        hot.inserted() + cold.inserted(),
        hot.corrected() + cold.corrected(),
        hot.unchanged() + cold.unchanged());
  }

  private Counts upsertHot(List<ValidReading> readings) {
    int n = readings.size();
    Integer[] points = new Integer[n];
    Short[] parameters = new Short[n];
    String[] times = new String[n];
    Double[] values = new Double[n];
    Short[] qualities = new Short[n];
    Double[] temperatures = new Double[n];
    Boolean[] compensated = new Boolean[n];
    List<Keyed> sorted = keyed(readings);
    for (int i = 0; i < n; i++) {
      Keyed k = sorted.get(i);
      ValidReading r = k.reading();
      points[i] = k.point();
      parameters[i] = k.parameter();
      times[i] = r.time().toString();
      values[i] = r.value();
      qualities[i] = r.quality().code();
      temperatures[i] = Double.isNaN(r.sampleTemperatureCel()) ? null : r.sampleTemperatureCel();
      compensated[i] = r.compensated();
    }
    return jdbc.execute(
        (Connection c) -> {
          try (PreparedStatement ps = c.prepareStatement(UPSERT)) {
            ps.setArray(1, c.createArrayOf("int4", points));
            ps.setArray(2, c.createArrayOf("int2", parameters));
            ps.setArray(3, c.createArrayOf("text", times));
            ps.setArray(4, c.createArrayOf("float8", values));
            ps.setArray(5, c.createArrayOf("int2", qualities));
            ps.setArray(6, c.createArrayOf("float8", temperatures));
            ps.setArray(7, c.createArrayOf("bool", compensated));
            try (ResultSet rs = ps.executeQuery()) {
              rs.next();
              // an update happens exactly where a revision is written (same IS DISTINCT FROM test)
              int corrected = rs.getInt(2);
              int inserted = rs.getInt(1) - corrected;
              return new Counts(inserted, corrected, n - inserted - corrected);
            }
          }
        });
  }

  /**
   * A sample point's {@code reading_head} row as locked by an ingest transaction.
   *
   * @param previousGeneration the generation before this transaction
   * @param generation the generation this transaction set
   * @param previousLatest the latest reading time ingested before, or null when not known
   */
  record Head(long previousGeneration, long generation, Instant previousLatest) {}

  /**
   * Marks the transaction as the ingest's (see migration V31), then locks the heads of the given
   * points in id order, setting new generations and latest times. Creates missing heads.
   *
   * @param maxTimes per sample point, the latest reading time of this batch
   */
  Map<String, Head> lockHeads(Map<String, Instant> maxTimes) {
    jdbc.queryForObject("SELECT set_config('kwanta.writer', 'ingest', true)", String.class);
    Map<String, Head> heads = lockOnce(maxTimes);
    if (heads.size() < maxTimes.size()) {
      // first batch of new points: create their heads, then lock those (not the others again,
      // which would return this transaction's own generations as the previous ones)
      Map<String, Instant> missing = new TreeMap<>(maxTimes);
      missing.keySet().removeAll(heads.keySet());
      jdbc.update(
          "INSERT INTO reading_head (sample_point_id, generation) SELECT unnest(?::text[]), 0"
              + " ON CONFLICT DO NOTHING",
          (Object) missing.keySet().toArray(String[]::new));
      heads.putAll(lockOnce(missing));
    }
    return heads;
  }

  private Map<String, Head> lockOnce(Map<String, Instant> maxTimes) {
    String[] points = maxTimes.keySet().toArray(String[]::new);
    String[] times = new String[points.length];
    for (int i = 0; i < points.length; i++) {
      times[i] = maxTimes.get(points[i]).toString();
    }
    Map<String, Head> out = new HashMap<>();
    jdbc.query(
        c -> {
          PreparedStatement ps = c.prepareStatement(LOCK_HEADS);
          ps.setArray(1, c.createArrayOf("text", points));
          ps.setArray(2, c.createArrayOf("text", times));
          return ps;
        },
        rs -> {
          Timestamp latest = rs.getTimestamp(4);
          out.put(
              rs.getString(1),
              new Head(rs.getLong(2), rs.getLong(3), latest == null ? null : latest.toInstant()));
        });
    return out;
  }

  /**
   * The latest stored reading time of a point after {@code after}, or null (one index probe per
   * parameter). Parameters: the parameter codes, the sample point, {@code after}. The lower bound
   * lets PostgreSQL prune every daily partition before it (without it, every partition of {@code
   * reading} was planned and probed, hundreds after a long backfill).
   */
  static final String LATEST_STORED =
      """
      SELECT max(m) FROM (SELECT parameter_key FROM reading_parameter WHERE code = ANY (?::text[])) p,
        LATERAL (SELECT max(time) AS m FROM reading
                 WHERE point_key = (SELECT point_key FROM reading_point WHERE sample_point_id = ?)
                   AND parameter_key = p.parameter_key AND time > ?) x""";

  /**
   * The latest stored reading time of a point if it is later than {@code after}, else null. The
   * ingest only needs to know whether the database holds readings beyond its batch.
   */
  Instant latestStoredAfter(String samplePointId, Instant after) {
    String[] codes = PARAMETER_CODES;
    Timestamp t =
        jdbc.query(
            c -> {
              PreparedStatement ps = c.prepareStatement(LATEST_STORED);
              ps.setArray(1, c.createArrayOf("text", codes));
              ps.setString(2, samplePointId);
              ps.setTimestamp(3, Timestamp.from(after));
              return ps;
            },
            rs -> rs.next() ? rs.getTimestamp(1) : null);
    if (t != null) {
      return t.toInstant();
    }
    // packed days lie before every hot one (only days before the horizon are packed), so the
    // blocks are asked only when reading has nothing after the time
    Instant latest = null;
    for (StoredReading r :
        PackedReadings.stored(
            jdbc, samplePointId, after.plusNanos(1000), FAR_FUTURE, PARAMETER_CODES)) {
      latest = latest == null || r.time().isAfter(latest) ? r.time() : latest;
    }
    return latest;
  }

  /**
   * Every stored reading of some points, each from its own time. Parameters: the points, their
   * times, the parameter codes, the earliest of the times (a constant bound the planner prunes by;
   * the per-point one is known only row by row).
   */
  static final String LOAD_SINCE =
      """
      SELECT k.sample_point_id, q.code, r.time, r.value, r.quality,
             r.sample_temperature_cel, r.compensated
      FROM unnest(?::text[], ?::timestamptz[]) AS s(sample_point_id, since)
      JOIN reading_point k ON k.sample_point_id = s.sample_point_id
      CROSS JOIN LATERAL (
        SELECT * FROM reading x
        WHERE x.point_key = k.point_key
          AND x.parameter_key = ANY (ARRAY(SELECT parameter_key FROM reading_parameter
                                           WHERE code = ANY (?::text[])))
          AND x.time >= s.since AND x.time >= ?) r
      JOIN reading_parameter q ON q.parameter_key = r.parameter_key""";

  /**
   * Every stored reading of the given points at or after the given time, per point, in time order.
   */
  Map<String, List<StoredReading>> loadSince(Map<String, Instant> since) {
    Map<String, List<StoredReading>> out = new TreeMap<>();
    if (since.isEmpty()) {
      return out;
    }
    String[] points = since.keySet().toArray(String[]::new);
    String[] times = new String[points.length];
    Instant earliest = Instant.MAX;
    for (int i = 0; i < points.length; i++) {
      Instant t = since.get(points[i]);
      times[i] = t.toString();
      earliest = t.isBefore(earliest) ? t : earliest;
      out.put(points[i], new ArrayList<>());
    }
    Instant earliestSince = earliest;
    jdbc.query(
        c -> {
          PreparedStatement ps = c.prepareStatement(LOAD_SINCE);
          ps.setArray(1, c.createArrayOf("text", points));
          ps.setArray(2, c.createArrayOf("text", times));
          ps.setArray(3, c.createArrayOf("text", PARAMETER_CODES));
          ps.setTimestamp(4, Timestamp.from(earliestSince));
          return ps;
        },
        rs -> {
          double t = rs.getDouble(6);
          boolean noTemperature = rs.wasNull();
          out.get(rs.getString(1))
              .add(
                  new StoredReading(
                      rs.getString(2),
                      rs.getTimestamp(3).toInstant(),
                      rs.getDouble(4),
                      rs.getShort(5),
                      noTemperature ? Double.NaN : t,
                      rs.getBoolean(7)));
        });
    // the packed days in the range (a history that starts more than pack-after back)
    int[] added = {0};
    PackedReadings.read(
        jdbc,
        since,
        FAR_FUTURE,
        PARAMETER_CODES,
        (point, code, row) -> {
          out.get(point).add(PackedReadings.stored(code, row));
          added[0]++;
        });
    if (added[0] > 0) {
      out.values().forEach(l -> l.sort(TIME_ORDER));
    }
    return out;
  }

  /** Every stored reading of a point in (after, to], in time order (a cold history). */
  List<StoredReading> between(String samplePointId, Instant after, Instant to) {
    List<StoredReading> cold =
        PackedReadings.stored(
            jdbc, samplePointId, after.plusNanos(1000), to.plusNanos(1000), PARAMETER_CODES);
    List<StoredReading> hot = betweenHot(samplePointId, after, to);
    if (cold.isEmpty()) {
      return hot;
    }
    List<StoredReading> all = new ArrayList<>(cold);
    all.addAll(hot);
    all.sort(TIME_ORDER);
    return all;
  }

  private List<StoredReading> betweenHot(String samplePointId, Instant after, Instant to) {
    return jdbc.query(
        """
        SELECT q.code, r.time, r.value, r.quality, r.sample_temperature_cel, r.compensated
        FROM reading r JOIN reading_parameter q ON q.parameter_key = r.parameter_key
        WHERE r.point_key = (SELECT point_key FROM reading_point WHERE sample_point_id = ?)
          AND r.time > ? AND r.time <= ?
        ORDER BY r.time, q.code""",
        ReadingHistory::stored,
        samplePointId,
        Timestamp.from(after),
        Timestamp.from(to));
  }

  /**
   * Inserts readings known to be new (keys absent from the table) with COPY. A key that exists
   * after all fails the statement (and so the transaction): nothing is overwritten silently.
   */
  int copyNew(List<ValidReading> all) {
    List<ValidReading> readings = partitions.anyPacked() ? new ArrayList<>(all) : all;
    Counts cold = writePacked(readings);
    if (cold.corrected() + cold.unchanged() > 0) {
      throw new IllegalStateException(
          "in-memory readings out of step with the packed blocks; the batch is retried");
    }
    if (readings.isEmpty()) {
      return cold.inserted();
    }
    BinaryCopy rows = new BinaryCopy(readings.size(), 64);
    for (Keyed k : keyed(readings)) {
      ValidReading r = k.reading();
      rows.row(7)
          .timestamp(r.time())
          .float8(r.value())
          .float8(r.sampleTemperatureCel())
          .int4(k.point())
          .int2(k.parameter())
          .int2(r.quality().code())
          .bool(r.compensated());
    }
    Long n = jdbc.execute((Connection c) -> rows.send(c, COPY_TARGET));
    return (n == null ? 0 : n.intValue()) + cold.inserted();
  }
}
