package org.kwanta.service.ingest;

import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Timestamp;
import java.time.Instant;
import java.util.List;
import org.kwanta.model.Parameter;
import org.kwanta.service.ingest.EvaluationRunner.StoredReading;
import org.kwanta.service.system.ReadSource;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.jdbc.core.RowCallbackHandler;
import org.springframework.stereotype.Repository;

/**
 * The read API of the stored readings: the only code outside the ingest's own writer that reads the
 * {@code reading} and {@code reading_head} tables. Queries, limits, metrics and the diagnosis read
 * readings through it. Every query bounds the time on the partitioned table it reads, so PostgreSQL
 * prunes to the days asked for.
 */
@Repository
public class ReadingHistory {

  private static final String[] PARAMETER_CODES = Parameter.codeArray();

  private final JdbcTemplate jdbc;

  ReadingHistory(ReadSource reads) {
    this.jdbc = reads.jdbc();
  }

  /** A point's latest reading of each parameter, ordered by parameter code. */
  public List<StoredReading> latestPerParameter(String samplePointId, Instant since) {
    return jdbc.query(
        LATEST_READINGS,
        ReadingHistory::stored,
        (Object) PARAMETER_CODES,
        samplePointId,
        java.sql.Timestamp.from(since));
  }

  /**
   * Several points' latest reading of each parameter since a time, in one query: by point id, each
   * ordered by parameter code (points without readings absent).
   */
  public java.util.Map<String, List<StoredReading>> latestPerParameter(
      java.util.Collection<String> samplePointIds, Instant since) {
    java.util.Map<String, List<StoredReading>> out = new java.util.HashMap<>();
    if (samplePointIds.isEmpty()) {
      return out;
    }
    jdbc.query(
        """
        SELECT p.code, r.time, r.value, r.quality, r.sample_temperature_cel, r.compensated,
               q.sample_point_id
        FROM (SELECT point_key, sample_point_id FROM reading_point
              WHERE sample_point_id = ANY (?::text[])) q
        CROSS JOIN (SELECT parameter_key, code FROM reading_parameter
                    WHERE code = ANY (?::text[])) p
        CROSS JOIN LATERAL (
          SELECT time, value, quality, sample_temperature_cel, compensated FROM reading
          WHERE point_key = q.point_key AND parameter_key = p.parameter_key AND time >= ?
          ORDER BY time DESC LIMIT 1) r
        ORDER BY 7, 1""",
        (RowCallbackHandler)
            rs ->
                out.computeIfAbsent(rs.getString(7), k -> new java.util.ArrayList<>())
                    .add(stored(rs, 0)),
        (Object) samplePointIds.toArray(String[]::new),
        (Object) PARAMETER_CODES,
        Timestamp.from(since));
    return out;
  }

  /**
   * Each parameter's latest reading at a point since a time (a bound the planner prunes daily
   * partitions by). Parameters: the parameter codes, the sample point, the earliest time.
   */
  public static final String LATEST_READINGS =
      """
      SELECT p.code, r.time, r.value, r.quality, r.sample_temperature_cel, r.compensated
      FROM (SELECT parameter_key, code FROM reading_parameter WHERE code = ANY (?::text[])) p
      CROSS JOIN LATERAL (
        SELECT time, value, quality, sample_temperature_cel, compensated FROM reading
        WHERE point_key = (SELECT point_key FROM reading_point WHERE sample_point_id = ?)
          AND parameter_key = p.parameter_key AND time >= ?
        ORDER BY time DESC LIMIT 1) r
      ORDER BY p.code""";

  /**
   * Per sample point and parameter: slots (aligned on ?) holding any reading, and holding a good
   * one not in doubt, among slots whose start lies in the in-service multirange. Parameters: slot,
   * origin, slot, origin, from, to (evaluation), points, parameters, from, to (reading), slot,
   * origin, in-service multirange.
   */
  public static final String SLOT_COUNTS =
      """
      SELECT k.sample_point_id, q.code,
             count(DISTINCT date_bin(?::interval, r.time, ?::timestamptz)),
             count(DISTINCT date_bin(?::interval, r.time, ?::timestamptz)) FILTER (
               WHERE r.quality = 0
                 AND NOT coalesce(e.points_at && ARRAY[upper(q.code), 'SAMPLE_CONDITIONING'], false))
      FROM reading r
      JOIN reading_point k ON k.point_key = r.point_key
      JOIN reading_parameter q ON q.parameter_key = r.parameter_key
      LEFT JOIN evaluation e ON e.sample_point_id = k.sample_point_id AND e.time = r.time
                            AND e.time >= ? AND e.time < ?
      WHERE r.point_key = ANY (ARRAY(SELECT point_key FROM reading_point
                                     WHERE sample_point_id = ANY (string_to_array(?, ','))))
        AND r.parameter_key = ANY (ARRAY(SELECT parameter_key FROM reading_parameter
                                         WHERE code = ANY (string_to_array(?, ','))))
        AND r.time >= ? AND r.time < ?
        AND date_bin(?::interval, r.time, ?::timestamptz) <@ ?::tstzmultirange
      GROUP BY k.sample_point_id, q.code""";

  /**
   * Per sample point and parameter ("point|parameter"): the number of slots holding any reading and
   * the number holding a good reading not in doubt (see {@link #SLOT_COUNTS}).
   *
   * @param points sample point ids, comma-separated
   * @param parameters parameter codes, comma-separated
   * @param interval the slot as a PostgreSQL interval ("900 seconds")
   * @param inService the in-service slots' multirange literal
   */
  public java.util.Map<String, long[]> slotCounts(
      String points,
      String parameters,
      Instant from,
      Instant to,
      String interval,
      String inService) {
    java.util.Map<String, long[]> out = new java.util.LinkedHashMap<>();
    Timestamp f = Timestamp.from(from);
    Timestamp t = Timestamp.from(to);
    jdbc.query(
        SLOT_COUNTS,
        (RowCallbackHandler)
            rs ->
                out.put(
                    rs.getString(1) + "|" + rs.getString(2),
                    new long[] {rs.getLong(3), rs.getLong(4)}),
        interval,
        f,
        interval,
        f,
        f,
        t,
        points,
        parameters,
        f,
        t,
        interval,
        f,
        inService);
    return out;
  }

  /**
   * A point's latest reading of a parameter that is not of bad quality in (after, at], as {time,
   * value}.
   */
  public java.util.Optional<PointReading> latestNotBad(
      String samplePointId, String parameter, Instant after, Instant at) {
    return jdbc
        .query(
            """
            SELECT time, value FROM reading
            WHERE point_key = (SELECT point_key FROM reading_point WHERE sample_point_id = ?)
              AND parameter_key = (SELECT parameter_key FROM reading_parameter WHERE code = ?)
              AND time > ? AND time <= ? AND quality < 2
            ORDER BY time DESC LIMIT 1""",
            (rs, i) ->
                new PointReading(
                    samplePointId, parameter, rs.getTimestamp(1).toInstant(), rs.getDouble(2)),
            samplePointId,
            parameter,
            Timestamp.from(after),
            Timestamp.from(at))
        .stream()
        .findFirst();
  }

  /**
   * The readings of one parameter (not of bad quality) at every sample point of a plant block: the
   * latest at or before {@code from} (the value in force at the start) and every one in (from, to),
   * by time, then sample point id.
   */
  public List<PointReading> blockReadings(
      String plant, String block, String parameter, Instant from, Instant to) {
    return jdbc.query(
        """
        (SELECT s.id, x.time, x.value FROM sample_point s
         JOIN reading_point k ON k.sample_point_id = s.id
         CROSS JOIN LATERAL (
           SELECT r.time, r.value FROM reading r
           WHERE r.point_key = k.point_key
             AND r.parameter_key = (SELECT parameter_key FROM reading_parameter WHERE code = ?)
             AND r.quality < 2 AND r.time <= ?
           ORDER BY r.time DESC LIMIT 1) x
         WHERE s.plant_id = ? AND s.block_id = ?
         ORDER BY x.time DESC, s.id DESC LIMIT 1)
        UNION ALL
        (SELECT s.id, r.time, r.value FROM reading r
         JOIN reading_point k ON k.point_key = r.point_key
         JOIN sample_point s ON s.id = k.sample_point_id
         WHERE s.plant_id = ? AND s.block_id = ?
           AND r.parameter_key = (SELECT parameter_key FROM reading_parameter WHERE code = ?)
           AND r.quality < 2 AND r.time > ? AND r.time < ?)
        ORDER BY 2, 1""",
        (rs, i) ->
            new PointReading(
                rs.getString(1), parameter, rs.getTimestamp(2).toInstant(), rs.getDouble(3)),
        parameter,
        Timestamp.from(from),
        plant,
        block,
        plant,
        block,
        parameter,
        Timestamp.from(from),
        Timestamp.from(to));
  }

  /** A point's reading of one parameter. */
  public record PointReading(String samplePointId, String parameter, Instant time, double value) {}

  /** Every sample point's latest reading of each parameter at or after {@code since}. */
  public List<PointReading> latestSince(Instant since) {
    List<PointReading> out = new java.util.ArrayList<>();
    jdbc.query(
        """
        SELECT s.id, p.code, r.time, r.value
        FROM sample_point s JOIN reading_point k ON k.sample_point_id = s.id
        CROSS JOIN (SELECT parameter_key, code FROM reading_parameter WHERE code = ANY (?::text[])) p
        CROSS JOIN LATERAL (
          SELECT time, value FROM reading
          WHERE point_key = k.point_key AND parameter_key = p.parameter_key AND time >= ?
          ORDER BY time DESC LIMIT 1) r""",
        (RowCallbackHandler)
            rs ->
                out.add(
                    new PointReading(
                        rs.getString(1),
                        rs.getString(2),
                        rs.getTimestamp(3).toInstant(),
                        rs.getDouble(4))),
        (Object) PARAMETER_CODES,
        Timestamp.from(since));
    return out;
  }

  /**
   * The last reading of each minute in [from, to) of the given points and parameters, readings of
   * quality "bad" left out; {@code time} is the start of the minute.
   */
  public List<PointReading> lastPerMinute(
      List<String> samplePointIds, List<String> parameters, Instant from, Instant to) {
    List<PointReading> out = new java.util.ArrayList<>();
    jdbc.query(
        """
        SELECT k.sample_point_id, date_trunc('minute', r.time) AS m, q.code,
               (array_agg(r.value ORDER BY r.time DESC))[1]
        FROM reading r
        JOIN reading_point k ON k.point_key = r.point_key
        JOIN reading_parameter q ON q.parameter_key = r.parameter_key
        WHERE r.point_key = ANY (ARRAY(SELECT point_key FROM reading_point
                                       WHERE sample_point_id = ANY (?::text[])))
          AND r.parameter_key = ANY (ARRAY(SELECT parameter_key FROM reading_parameter
                                           WHERE code = ANY (?::text[])))
          AND r.quality <> 2 AND r.time >= ? AND r.time < ?
        GROUP BY 1, 2, 3""",
        (RowCallbackHandler)
            rs ->
                out.add(
                    new PointReading(
                        rs.getString(1),
                        rs.getString(3),
                        rs.getTimestamp(2).toInstant(),
                        rs.getDouble(4))),
        samplePointIds.toArray(String[]::new),
        parameters.toArray(String[]::new),
        Timestamp.from(from),
        Timestamp.from(to));
    return out;
  }

  /**
   * The generation of each point of a plant (migration V31), by point id; a point never written is
   * absent. A point's generation changes whenever a reading of it is written, so a cached answer
   * built on that point's readings and evaluations is current while it stays the same.
   */
  public java.util.Map<String, Long> generationsByPoint(String plantId) {
    java.util.Map<String, Long> out = new java.util.HashMap<>();
    jdbc.query(
        """
        SELECT h.sample_point_id, h.generation FROM reading_head h
        JOIN sample_point s ON s.id = h.sample_point_id WHERE s.plant_id = ?""",
        (RowCallbackHandler) rs -> out.put(rs.getString(1), rs.getLong(2)),
        plantId);
    return out;
  }

  /**
   * A point's readings of one parameter over [from, to] with the evaluation at each reading's time.
   * Both sides carry the time range, so PostgreSQL prunes the daily partitions of both tables (a
   * bound on the readings alone left every evaluation partition in the plan); and the evaluations
   * carry the point's id itself, so they are read by their key (point, time): joined through the
   * point's key row instead, PostgreSQL hashed every point's evaluations of the range, about 0.1 s
   * a series for the demo plant's day and 20-30 s for the page's excursion list under a live feed
   * on the loaded machine. Parameters: the parameter's instrument name, sample point, from, to,
   * sample point, parameter code, from, to.
   */
  public static final String JUDGED =
      """
      SELECT r.time, r.value,
             r.quality = 2
               OR coalesce(e.points_at && ARRAY[?::text, 'SAMPLE_CONDITIONING'], false),
             e.calculated_ph_25,
             coalesce('PH' = ANY(e.points_at), false)
      FROM reading r
      LEFT JOIN evaluation e ON e.sample_point_id = ? AND e.time = r.time
                            AND e.time >= ? AND e.time <= ?
      WHERE r.point_key = (SELECT point_key FROM reading_point WHERE sample_point_id = ?)
        AND r.parameter_key = (SELECT parameter_key FROM reading_parameter WHERE code = ?)
        AND r.time >= ? AND r.time <= ?
      ORDER BY r.time""";

  /**
   * A stored reading with what its evaluation says about it.
   *
   * @param inDoubt bad quality, or its instrument (or the sample conditioning) pointed at by the
   *     evaluation
   * @param calculatedPh25 the evaluation's calculated pH at 25 °C, or null
   * @param phElectrodeInDoubt the evaluation points at the pH electrode
   */
  public record Judged(
      Instant time,
      double value,
      boolean inDoubt,
      Double calculatedPh25,
      boolean phElectrodeInDoubt) {}

  /**
   * A point's readings of one parameter over [from, to], oldest first, each judged by the
   * evaluation at its time.
   *
   * @param instrument the name of the instrument that measures the parameter
   */
  public List<Judged> judged(
      String samplePointId, String parameter, String instrument, Instant from, Instant to) {
    return jdbc.query(
        JUDGED,
        (rs, i) -> {
          Instant time = rs.getTimestamp(1).toInstant();
          double measured = rs.getDouble(2);
          boolean inDoubt = rs.getBoolean(3);
          double calculated = rs.getDouble(4);
          boolean hasCalculated = !rs.wasNull() && Double.isFinite(calculated);
          return new Judged(
              time, measured, inDoubt, hasCalculated ? calculated : null, rs.getBoolean(5));
        },
        instrument,
        samplePointId,
        Timestamp.from(from),
        Timestamp.from(to),
        samplePointId,
        parameter,
        Timestamp.from(from),
        Timestamp.from(to));
  }

  /**
   * The readings of several series since a time per point, judged as {@link #JUDGED} judges them
   * (the instrument of a parameter is its upper-case code). Parameters: the points, their earliest
   * times, the parameter codes, the earliest of those times and the latest time (reading), the same
   * two (evaluation). The overall bounds let PostgreSQL prune the daily partitions of both tables;
   * each series is read by its own index range (point key, parameter key, time).
   */
  public static final String JUDGED_SINCE =
      """
      SELECT q.point, p.code, r.time, r.value,
             r.quality = 2
               OR coalesce(e.points_at && ARRAY[upper(p.code), 'SAMPLE_CONDITIONING'], false),
             e.calculated_ph_25,
             coalesce('PH' = ANY(e.points_at), false)
      FROM unnest(?::text[], ?::timestamptz[]) AS q(point, since)
      JOIN reading_point k ON k.sample_point_id = q.point
      CROSS JOIN (SELECT parameter_key, code FROM reading_parameter
                  WHERE code = ANY (?::text[])) p
      CROSS JOIN LATERAL (
        SELECT time, value, quality FROM reading
        WHERE point_key = k.point_key AND parameter_key = p.parameter_key
          AND time >= q.since AND time >= ? AND time <= ?) r
      LEFT JOIN evaluation e ON e.sample_point_id = q.point AND e.time = r.time
                            AND e.time >= ? AND e.time <= ?
      ORDER BY 1, 2, 3""";

  /** Receives judged readings one by one, as primitives. */
  @FunctionalInterface
  public interface JudgedRow {
    /**
     * @param epochMicros the reading's time, microseconds since the epoch
     * @param calculatedPh25 the evaluation's calculated pH at 25 °C, NaN when none
     */
    void accept(
        String samplePointId,
        String parameter,
        long epochMicros,
        double value,
        boolean inDoubt,
        double calculatedPh25,
        boolean phElectrodeInDoubt);
  }

  /**
   * The readings of the given parameters at several points over [since of the point, to], by point,
   * parameter and time, each judged by the evaluation at its time as {@link #judged} judges it, in
   * one query.
   */
  public void judgedSince(
      java.util.Map<String, Instant> sinceByPoint,
      java.util.Collection<String> parameters,
      Instant to,
      JudgedRow out) {
    if (sinceByPoint.isEmpty() || parameters.isEmpty()) {
      return;
    }
    String[] points = sinceByPoint.keySet().toArray(String[]::new);
    Timestamp[] sinces = new Timestamp[points.length];
    Instant lo = to;
    for (int i = 0; i < points.length; i++) {
      Instant s = sinceByPoint.get(points[i]);
      sinces[i] = Timestamp.from(s);
      lo = s.isBefore(lo) ? s : lo;
    }
    Timestamp low = Timestamp.from(lo);
    Timestamp high = Timestamp.from(to);
    jdbc.query(
        c -> {
          java.sql.PreparedStatement ps = c.prepareStatement(JUDGED_SINCE);
          ps.setArray(1, c.createArrayOf("text", points));
          ps.setArray(2, c.createArrayOf("timestamptz", sinces));
          ps.setArray(3, c.createArrayOf("text", parameters.toArray(String[]::new)));
          ps.setTimestamp(4, low);
          ps.setTimestamp(5, high);
          ps.setTimestamp(6, low);
          ps.setTimestamp(7, high);
          return ps;
        },
        (RowCallbackHandler)
            rs -> {
              Instant t = rs.getTimestamp(3).toInstant();
              long micros = t.getEpochSecond() * 1_000_000L + t.getNano() / 1000;
              double calculated = rs.getDouble(6);
              boolean none = rs.wasNull() || !Double.isFinite(calculated);
              out.accept(
                  rs.getString(1),
                  rs.getString(2),
                  micros,
                  rs.getDouble(4),
                  rs.getBoolean(5),
                  none ? Double.NaN : calculated,
                  rs.getBoolean(7));
            });
  }

  static StoredReading stored(ResultSet rs, int i) throws SQLException {
    double t = rs.getDouble(5);
    boolean noTemperature = rs.wasNull();
    return new StoredReading(
        rs.getString(1),
        rs.getTimestamp(2).toInstant(),
        rs.getDouble(3),
        rs.getShort(4),
        noTemperature ? Double.NaN : t,
        rs.getBoolean(6));
  }
}
