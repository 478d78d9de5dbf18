package org.kwanta.service.ingest;

import java.sql.Timestamp;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import org.kwanta.model.Parameter;
import org.kwanta.service.system.ReadSource;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.stereotype.Repository;

/**
 * The read API for series: one measured parameter's stored readings, or one column of the stored
 * evaluations, raw or in time buckets.
 */
@Repository
public class StoredSeries {

  private final JdbcTemplate jdbc;
  private final ReadingRollups rollups;
  private final EvaluationRollups evaluationRollups;

  StoredSeries(ReadSource reads, ReadingRollups rollups, EvaluationRollups evaluationRollups) {
    this.jdbc = reads.jdbc();
    this.rollups = rollups;
    this.evaluationRollups = evaluationRollups;
  }

  private static final long HOUR_SECONDS = 3600;
  private static final long DAY_SECONDS = 86400;

  /**
   * Where a series is stored: a parameter's readings, or a column of the evaluations.
   *
   * @param table {@code reading} or {@code evaluation}
   * @param column the value column
   * @param code the parameter code (readings only)
   */
  public record Source(String table, String column, String code) {

    /** The readings of a measured parameter. */
    public static Source readings(String parameterCode) {
      if (Parameter.byCode(parameterCode).isEmpty()) {
        throw new IllegalArgumentException("not a measured parameter: " + parameterCode);
      }
      return new Source("reading", "value", parameterCode);
    }

    /** A column of the evaluations (one of the enum's codes, never text from a request). */
    public static Source evaluations(DerivedColumn column) {
      return new Source("evaluation", column.code(), null);
    }

    /** Whether the values are readings (with a quality). */
    public boolean measured() {
      return "reading".equals(table);
    }
  }

  /** The evaluations' indexed value columns a series can be read from, with their UCUM units. */
  public enum DerivedColumn {
    SPECIFIC_CONDUCTIVITY_25("uS/cm"),
    CATION_CONDUCTIVITY_25("uS/cm"),
    DEGASSED_CATION_CONDUCTIVITY_25("uS/cm"),
    CALCULATED_PH_25("[pH]"),
    PH_AT_TEMPERATURE("[pH]"),
    PH_AT_TEMPERATURE_LOW("[pH]"),
    PH_AT_TEMPERATURE_HIGH("[pH]"),
    NEUTRAL_PH_AT_TEMPERATURE("[pH]");

    private final String unit;

    DerivedColumn(String unit) {
      this.unit = unit;
    }

    /** The column name, also the API code. */
    public String code() {
      return name().toLowerCase(java.util.Locale.ROOT);
    }

    /** UCUM unit of the values. */
    public String unit() {
      return unit;
    }
  }

  /** One raw point. {@code quality} is null for derived parameters. */
  public record Point(Instant time, Double value, String quality) {}

  /** One bucket: [start, start + size). */
  public record Bucket(
      Instant start, double min, double mean, double max, double last, long count) {}

  /**
   * A series' points in [from, to) after {@code after}, oldest first, at most {@code limit}. A
   * measured series reads the packed days' blocks as well ({@link PackedReadings}): a raw read of
   * an old range reaches them.
   */
  public List<Point> raw(
      String samplePointId, Source p, Instant from, Instant to, Instant after, int limit) {
    List<Point> hot = rawHot(samplePointId, p, from, to, after, limit);
    if (!p.measured()) {
      return hot;
    }
    Instant lo = after == null || after.isBefore(from) ? from : after.plusNanos(1000);
    List<Point> cold = new ArrayList<>();
    PackedReadings.read(
        jdbc,
        java.util.Map.of(samplePointId, lo),
        to,
        new String[] {p.code()},
        (point, code, r) ->
            cold.add(
                new Point(
                    PackedReadings.instant(r.micros()),
                    r.value(),
                    ValidReading.Quality.ofCode(r.quality())
                        .name()
                        .toLowerCase(java.util.Locale.ROOT))));
    if (cold.isEmpty()) {
      return hot;
    }
    cold.addAll(hot);
    cold.sort(java.util.Comparator.comparing(Point::time));
    return cold.size() > limit ? cold.subList(0, limit) : cold;
  }

  private List<Point> rawHot(
      String samplePointId, Source p, Instant from, Instant to, Instant after, int limit) {
    String quality = p.measured() ? "quality" : "NULL::smallint";
    return jdbc.query(
        "SELECT time, "
            + p.column()
            + ", "
            + quality
            + " FROM "
            + p.table()
            + " WHERE "
            + seriesOf(p)
            + " AND time >= ? AND time < ? AND time > ?"
            + " ORDER BY time LIMIT ?",
        (rs, i) -> {
          double v = rs.getDouble(2);
          Double value = rs.wasNull() ? null : v;
          int q = rs.getInt(3);
          String qualityName =
              rs.wasNull()
                  ? null
                  : ValidReading.Quality.ofCode(q).name().toLowerCase(java.util.Locale.ROOT);
          return new Point(rs.getTimestamp(1).toInstant(), value, qualityName);
        },
        samplePointId,
        Timestamp.from(from),
        Timestamp.from(to),
        Timestamp.from(after == null ? Instant.EPOCH : after),
        limit);
  }

  /**
   * The condition selecting a series' rows; its one parameter is the sample point id. Readings are
   * keyed by the point's and the parameter's keys (V62), evaluations by the point's key (V71).
   */
  static String seriesOf(Source p) {
    return p.measured()
        ? POINT_KEY
            + " AND parameter_key = (SELECT parameter_key FROM reading_parameter WHERE code = '"
            + p.code()
            + "')"
        : POINT_KEY;
  }

  /** A sample point's key, its one parameter the point's id (computed once per statement). */
  private static final String POINT_KEY =
      "point_key = (SELECT point_key FROM reading_point WHERE sample_point_id = ?)";

  /**
   * The series in buckets [from + k·bucket, from + (k + 1)·bucket) ∩ [from, to): min, mean, max,
   * last and count of the good and uncertain readings (or of the evaluation column's non-null
   * values). In buckets of whole hours, every UTC hour that lies whole inside one bucket comes from
   * the hourly rollups, of the readings (V60) or of the evaluations (V64) (whole days from the
   * daily ones when the buckets are whole days starting at midnight UTC), and only the rest from
   * {@code reading} or {@code evaluation}: the partial hour before {@code to} and, when {@code
   * from} is not on the hour, the hour around each bucket boundary. The answer is the same as from
   * raw data up to the rounding of the means' sums.
   */
  public List<Bucket> bucketed(
      String samplePointId, Source p, Instant from, Instant to, Duration bucket) {
    if (usesRollups(p, from, to, bucket)) {
      return fromRollups(samplePointId, p, from, to, bucket);
    }
    return bucketedRaw(samplePointId, p, from, to, bucket);
  }

  /** Whether {@link #bucketed} reads the rollups for this request. */
  static boolean usesRollups(Source p, Instant from, Instant to, Duration bucket) {
    return bucket.getNano() == 0
        && bucket.getSeconds() % HOUR_SECONDS == 0
        && bucket.getSeconds() > 0
        && from.getNano() == 0
        && hourCeil(from).isBefore(hourFloor(to));
  }

  private List<Bucket> fromRollups(
      String samplePointId, Source p, Instant from, Instant to, Duration bucket) {
    // the measured series' rollups are keyed by parameter code, the derived ones' by column
    String rollup = p.measured() ? "reading_rollup" : "evaluation_rollup";
    String parameter = p.measured() ? p.code() : p.column();
    long size = bucket.getSeconds();
    long origin = from.getEpochSecond();
    Instant hoursTo = hourFloor(to);
    Instant hoursFrom = hourCeil(from);
    java.util.TreeMap<Instant, ReadingRollups.Part> parts = new java.util.TreeMap<>();
    // derived series: hours marked by the ingest and not yet settled (V65) come from the
    // evaluations, and their days from the hours
    java.util.Set<Instant> pending =
        p.measured()
            ? java.util.Set.of()
            : evaluationRollups.pendingHours(jdbc, samplePointId, from, to);
    java.util.Set<Instant> pendingDays = new java.util.HashSet<>();
    for (Instant h : pending) {
      pendingDays.add(
          Instant.ofEpochSecond(Math.floorDiv(h.getEpochSecond(), DAY_SECONDS) * DAY_SECONDS));
    }
    List<Instant[]> rest = new ArrayList<>();
    if (size % DAY_SECONDS == 0 && origin % DAY_SECONDS == 0) {
      Instant days =
          Instant.ofEpochSecond(Math.floorDiv(to.getEpochSecond(), DAY_SECONDS) * DAY_SECONDS);
      if (days.isAfter(from)) {
        rollups.addTo(
            jdbc,
            parts,
            rollup + "_day",
            samplePointId,
            parameter,
            from,
            from,
            days,
            size,
            pendingDays::contains);
        for (Instant d : pendingDays) {
          if (!d.isBefore(from) && d.isBefore(days)) {
            rollups.addTo(
                jdbc,
                parts,
                rollup + "_hour",
                samplePointId,
                parameter,
                from,
                d,
                d.plusSeconds(DAY_SECONDS),
                size,
                pending::contains);
          }
        }
        hoursFrom = days;
      }
    }
    rollups.addTo(
        jdbc,
        parts,
        rollup + "_hour",
        samplePointId,
        parameter,
        from,
        hoursFrom,
        hoursTo,
        size,
        pending::contains);
    for (Instant h : pending) {
      Instant end = h.plusSeconds(HOUR_SECONDS);
      if (!h.isBefore(from) && !end.isAfter(hoursTo)) {
        rest.add(new Instant[] {h, end});
      }
    }
    // the raw rest: the hour around each bucket boundary off the hour, and the partial last hour
    if (origin % HOUR_SECONDS != 0) {
      for (long b = origin; b < to.getEpochSecond(); b += size) {
        Instant at = Instant.ofEpochSecond(b);
        rest.add(new Instant[] {max(from, hourFloor(at)), min(hourCeil(at), to)});
      }
    }
    if (hoursTo.isBefore(to)) {
      rest.add(new Instant[] {max(hoursTo, hoursFrom), to});
    }
    addRaw(parts, samplePointId, p, from, to, bucket, merged(rest));
    return ReadingRollups.toBuckets(parts);
  }

  /** Adds the values of the given disjoint intervals within [from, to) to the buckets. */
  private void addRaw(
      java.util.Map<Instant, ReadingRollups.Part> parts,
      String samplePointId,
      Source p,
      Instant from,
      Instant to,
      Duration bucket,
      List<Instant[]> intervals) {
    if (intervals.isEmpty()) {
      return;
    }
    String[] los = new String[intervals.size()];
    String[] his = new String[intervals.size()];
    for (int i = 0; i < intervals.size(); i++) {
      los[i] = intervals.get(i)[0].toString();
      his[i] = intervals.get(i)[1].toString();
    }
    jdbc.query(
        (java.sql.Connection c) -> {
          java.sql.PreparedStatement ps =
              c.prepareStatement(p.measured() ? RAW_INTERVALS : rawIntervals(p.column()));
          int i = 1;
          ps.setDouble(i++, (double) bucket.toSeconds());
          ps.setTimestamp(i++, Timestamp.from(from));
          ps.setArray(i++, c.createArrayOf("text", los));
          ps.setArray(i++, c.createArrayOf("text", his));
          ps.setString(i++, samplePointId);
          if (p.measured()) {
            ps.setString(i++, p.code());
          }
          ps.setTimestamp(i++, Timestamp.from(from));
          ps.setTimestamp(i, Timestamp.from(to));
          return ps;
        },
        rs -> {
          parts
              .computeIfAbsent(rs.getTimestamp(1).toInstant(), b -> new ReadingRollups.Part())
              .add(
                  rs.getDouble(2),
                  rs.getDouble(3),
                  rs.getDouble(4),
                  rs.getLong(5),
                  rs.getDouble(6),
                  rs.getTimestamp(7).toInstant());
        });
    if (p.measured()) {
      for (Instant[] interval : intervals) {
        addPacked(parts, samplePointId, p, from, bucket, interval[0], interval[1]);
      }
    }
  }

  /**
   * Adds the packed readings of a measured series in [lo, hi) (good and uncertain ones) to buckets
   * of {@code bucket} from {@code origin}, as {@code date_bin} bins them.
   */
  private void addPacked(
      java.util.Map<Instant, ReadingRollups.Part> parts,
      String samplePointId,
      Source p,
      Instant origin,
      Duration bucket,
      Instant lo,
      Instant hi) {
    long o = PackedReadings.micros(origin);
    long size = bucket.toNanos() / 1000;
    PackedReadings.read(
        jdbc,
        java.util.Map.of(samplePointId, lo),
        hi,
        new String[] {p.code()},
        (point, code, r) -> {
          if (r.quality() < 2) {
            long b = o + Math.floorDiv(r.micros() - o, size) * size;
            double v = r.value();
            parts
                .computeIfAbsent(PackedReadings.instant(b), k -> new ReadingRollups.Part())
                .add(v, v, v, 1, v, PackedReadings.instant(r.micros()));
          }
        });
  }

  /**
   * The good and uncertain readings of one series in some intervals, per bucket: one index range
   * scan per interval (the lateral subquery), the partitions bounded by [from, to).
   */
  static final String RAW_INTERVALS =
      """
      SELECT date_bin(make_interval(secs => ?), r.time, ?) AS b, min(r.value), max(r.value),
             sum(r.value), count(*), (array_agg(r.value ORDER BY r.time DESC))[1], max(r.time)
      FROM unnest(?::text[]::timestamptz[], ?::text[]::timestamptz[]) AS w(lo, hi)
      CROSS JOIN LATERAL (
          SELECT time, value FROM reading
          WHERE point_key = (SELECT point_key FROM reading_point WHERE sample_point_id = ?)
            AND parameter_key = (SELECT parameter_key FROM reading_parameter WHERE code = ?)
            AND time >= ? AND time < ? AND time >= w.lo AND time < w.hi AND quality < 2) r
      GROUP BY b""";

  /**
   * {@link #RAW_INTERVALS} for a column of the evaluations (its non-null values), one of {@link
   * DerivedColumn}'s names, never text from a request.
   */
  static String rawIntervals(String column) {
    return """
        SELECT date_bin(make_interval(secs => ?), r.time, ?) AS b, min(r.v), max(r.v),
               sum(r.v), count(*), (array_agg(r.v ORDER BY r.time DESC))[1], max(r.time)
        FROM unnest(?::text[]::timestamptz[], ?::text[]::timestamptz[]) AS w(lo, hi)
        CROSS JOIN LATERAL (
            SELECT time, %1$s AS v FROM evaluation
            WHERE point_key = (SELECT point_key FROM reading_point WHERE sample_point_id = ?)
              AND time >= ? AND time < ?
              AND time >= w.lo AND time < w.hi AND %1$s IS NOT NULL) r
        GROUP BY b"""
        .formatted(column);
  }

  /** The intervals sorted and merged where they touch or overlap; empty ones dropped. */
  private static List<Instant[]> merged(List<Instant[]> intervals) {
    intervals.sort(java.util.Comparator.comparing(i -> i[0]));
    List<Instant[]> out = new ArrayList<>();
    for (Instant[] i : intervals) {
      if (!i[0].isBefore(i[1])) {
        continue;
      }
      Instant[] last = out.isEmpty() ? null : out.get(out.size() - 1);
      if (last != null && !i[0].isAfter(last[1])) {
        last[1] = max(last[1], i[1]);
      } else {
        out.add(new Instant[] {i[0], i[1]});
      }
    }
    return out;
  }

  private static Instant hourFloor(Instant t) {
    return Instant.ofEpochSecond(Math.floorDiv(t.getEpochSecond(), HOUR_SECONDS) * HOUR_SECONDS);
  }

  private static Instant hourCeil(Instant t) {
    Instant f = hourFloor(t);
    return f.equals(t) ? f : f.plusSeconds(HOUR_SECONDS);
  }

  private static Instant min(Instant a, Instant b) {
    return a.isBefore(b) ? a : b;
  }

  private static Instant max(Instant a, Instant b) {
    return a.isAfter(b) ? a : b;
  }

  /**
   * {@link #bucketed} from the stored rows alone, never the rollups; a measured series' packed days
   * included (a bucket holding hot and packed readings takes its last value from the hot ones:
   * packed days lie before the hot ones).
   */
  public List<Bucket> bucketedRaw(
      String samplePointId, Source p, Instant from, Instant to, Duration bucket) {
    List<Bucket> hot = bucketedHot(samplePointId, p, from, to, bucket);
    if (!p.measured()) {
      return hot;
    }
    java.util.TreeMap<Instant, ReadingRollups.Part> parts = new java.util.TreeMap<>();
    addPacked(parts, samplePointId, p, from, bucket, from, to);
    if (parts.isEmpty()) {
      return hot;
    }
    for (Bucket b : hot) {
      parts
          .computeIfAbsent(b.start(), k -> new ReadingRollups.Part())
          .add(
              b.min(), b.max(), b.mean() * b.count(), b.count(), b.last(), ReadingStore.FAR_FUTURE);
    }
    return ReadingRollups.toBuckets(parts);
  }

  private List<Bucket> bucketedHot(
      String samplePointId, Source p, Instant from, Instant to, Duration bucket) {
    String filter = p.measured() ? " AND quality < 2" : " AND " + p.column() + " IS NOT NULL";
    return jdbc.query(
        "SELECT date_bin(make_interval(secs => ?), time, ?) AS b, min(v), avg(v), max(v),"
            + " (array_agg(v ORDER BY time DESC))[1], count(*)"
            + " FROM (SELECT time, "
            + p.column()
            + " AS v FROM "
            + p.table()
            + " WHERE "
            + seriesOf(p)
            + " AND time >= ? AND time < ?"
            + filter
            + ") s GROUP BY b ORDER BY b",
        (rs, i) ->
            new Bucket(
                rs.getTimestamp(1).toInstant(),
                rs.getDouble(2),
                rs.getDouble(3),
                rs.getDouble(4),
                rs.getDouble(5),
                rs.getLong(6)),
        (double) bucket.toMillis() / 1000.0,
        Timestamp.from(from),
        samplePointId,
        Timestamp.from(from),
        Timestamp.from(to));
  }
}
