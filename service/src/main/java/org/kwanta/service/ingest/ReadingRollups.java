package org.kwanta.service.ingest;

import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.Timestamp;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.Collection;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.stereotype.Repository;

/**
 * The hourly and daily rollups of the readings ({@code reading_rollup_hour}, {@code
 * reading_rollup_day}, migration V60): kept in step by the ingest ({@link #update}, in its
 * transaction) and read by {@link StoredSeries} for buckets of whole hours.
 */
@Repository
class ReadingRollups {

  /** One series' hour touched by a write: the key of a {@code reading_rollup_hour} row. */
  record Hour(String samplePointId, String parameter, Instant start) {

    static Hour of(ValidReading r) {
      return new Hour(
          r.samplePointId(), r.parameter().code(), r.time().truncatedTo(ChronoUnit.HOURS));
    }
  }

  private final JdbcTemplate jdbc;
  private final SeriesKeys keys;
  private final Partitions partitions;

  ReadingRollups(JdbcTemplate jdbc, SeriesKeys keys, Partitions partitions) {
    this.jdbc = jdbc;
    this.keys = keys;
    this.partitions = partitions;
  }

  /**
   * Keeps the rollups in step with the caller's transaction, in one call after its readings are
   * written: the new readings' hours take them in without reading the hour again when they all lie
   * after its last reading, every other touched hour is recomputed from {@code reading}, then the
   * touched days from their hours ({@code update_reading_rollups}, V60).
   *
   * @param recompute hours changed otherwise (corrections, readings of the plain path)
   * @param fresh readings new in this transaction (any quality; bad ones leave the rollups alone),
   *     summed up per hour here
   */
  void update(Collection<Hour> touched, Collection<ValidReading> written) {
    if (!partitions.anyPacked()) {
      updateHot(touched, written);
      return;
    }
    // hours of packed days were recomputed from their blocks when the readings were written
    // (PackedReadings.write); recomputing them here from reading would empty them
    Set<Hour> recompute = new HashSet<>();
    for (Hour h : touched) {
      if (!partitions.isPacked(Partitions.dayOf(h.start()))) {
        recompute.add(h);
      }
    }
    List<ValidReading> fresh = new ArrayList<>(written.size());
    for (ValidReading r : written) {
      if (!partitions.isPacked(Partitions.dayOf(r.time()))) {
        fresh.add(r);
      }
    }
    updateHot(recompute, fresh);
  }

  private void updateHot(Collection<Hour> recompute, Collection<ValidReading> fresh) {
    // the new readings summed up per hour here, so that only one row per hour goes to the database
    Map<Hour, List<ValidReading>> added = new java.util.HashMap<>();
    for (ValidReading r : fresh) {
      Hour h = Hour.of(r);
      if (r.quality() != ValidReading.Quality.BAD && !recompute.contains(h)) {
        added.computeIfAbsent(h, k -> new ArrayList<>()).add(r);
      }
    }
    if (recompute.isEmpty() && added.isEmpty()) {
      return;
    }
    int n = recompute.size();
    Integer[] points = new Integer[n];
    Short[] parameters = new Short[n];
    String[] starts = new String[n];
    int i = 0;
    for (Hour h : recompute) {
      points[i] = keys.point(h.samplePointId());
      parameters[i] = keys.parameter(h.parameter());
      starts[i++] = h.start().toString();
    }
    Map<Hour, List<ValidReading>> addedDays = new java.util.HashMap<>();
    added.forEach(
        (h, rs) ->
            addedDays
                .computeIfAbsent(
                    new Hour(
                        h.samplePointId(), h.parameter(), h.start().truncatedTo(ChronoUnit.DAYS)),
                    k -> new ArrayList<>())
                .addAll(rs));
    Sums hourSums = Sums.of(added, 3_600, keys);
    Sums daySums = Sums.of(addedDays, 86_400, keys);
    jdbc.execute(
        (Connection c) -> {
          try (PreparedStatement ps = c.prepareStatement(UPDATE)) {
            ps.setArray(1, c.createArrayOf("int4", points));
            ps.setArray(2, c.createArrayOf("int2", parameters));
            ps.setArray(3, c.createArrayOf("text", starts));
            hourSums.set(ps, 4, c);
            daySums.set(ps, 15, c);
            ps.executeQuery().close();
          }
          return null;
        });
  }

  /** Per series and bucket (hour or day), the sums of the new readings, as arrays for the call. */
  private record Sums(
      Integer[] points,
      Short[] parameters,
      String[] starts,
      Integer[] counts,
      Double[] mins,
      Double[] maxs,
      Double[] sums,
      Double[] lasts,
      String[] firstTimes,
      String[] lastTimes,
      Double[] twSums) {

    static Sums of(Map<Hour, List<ValidReading>> buckets, long bucketSeconds, SeriesKeys keys) {
      int m = buckets.size();
      Sums s =
          new Sums(
              new Integer[m],
              new Short[m],
              new String[m],
              new Integer[m],
              new Double[m],
              new Double[m],
              new Double[m],
              new Double[m],
              new String[m],
              new String[m],
              new Double[m]);
      int j = 0;
      for (Map.Entry<Hour, List<ValidReading>> e : buckets.entrySet()) {
        Hour h = e.getKey();
        List<ValidReading> rs = e.getValue();
        rs.sort(java.util.Comparator.comparing(ValidReading::time));
        Aggregate a =
            Aggregate.of(
                rs.size(),
                k -> micros(rs.get(k).time()),
                k -> rs.get(k).value(),
                micros(h.start().plusSeconds(bucketSeconds)));
        s.points[j] = keys.point(h.samplePointId());
        s.parameters[j] = keys.parameter(h.parameter());
        s.starts[j] = h.start().toString();
        s.counts[j] = rs.size();
        s.mins[j] = a.min();
        s.maxs[j] = a.max();
        s.sums[j] = a.sum();
        s.lasts[j] = rs.get(rs.size() - 1).value();
        s.firstTimes[j] = rs.get(0).time().toString();
        s.lastTimes[j] = rs.get(rs.size() - 1).time().toString();
        s.twSums[j++] = a.timeWeightedSum();
      }
      return s;
    }

    /** Sets the 11 arrays from parameter {@code first} on. */
    void set(PreparedStatement ps, int first, Connection c) throws java.sql.SQLException {
      ps.setArray(first, c.createArrayOf("int4", points));
      ps.setArray(first + 1, c.createArrayOf("int2", parameters));
      ps.setArray(first + 2, c.createArrayOf("text", starts));
      ps.setArray(first + 3, c.createArrayOf("int4", counts));
      ps.setArray(first + 4, c.createArrayOf("float8", mins));
      ps.setArray(first + 5, c.createArrayOf("float8", maxs));
      ps.setArray(first + 6, c.createArrayOf("float8", sums));
      ps.setArray(first + 7, c.createArrayOf("float8", lasts));
      ps.setArray(first + 8, c.createArrayOf("text", firstTimes));
      ps.setArray(first + 9, c.createArrayOf("text", lastTimes));
      ps.setArray(first + 10, c.createArrayOf("float8", twSums));
    }
  }

  /** Seconds from {@code a} to {@code b}, to the microsecond as PostgreSQL stores times. */
  private static long micros(Instant t) {
    return Math.addExact(Math.multiplyExact(t.getEpochSecond(), 1_000_000L), t.getNano() / 1000);
  }

  /**
   * The sums of a bucket's readings (time order, bad ones left out), as the rollup tables keep
   * them: each value held from its time until the next reading or the bucket's end, in seconds at
   * microsecond resolution. One place for the hot path (new readings) and for a packed hour
   * rewritten from its block ({@link PackedReadings}).
   */
  record Aggregate(double min, double max, double sum, double timeWeightedSum) {

    static Aggregate of(
        int n,
        java.util.function.IntToLongFunction micros,
        java.util.function.IntToDoubleFunction value,
        long endMicros) {
      double min = Double.POSITIVE_INFINITY;
      double max = Double.NEGATIVE_INFINITY;
      double sum = 0;
      double tw = 0;
      for (int k = 0; k < n; k++) {
        double v = value.applyAsDouble(k);
        min = Math.min(min, v);
        max = Math.max(max, v);
        sum += v;
        long until = k + 1 < n ? micros.applyAsLong(k + 1) : endMicros;
        tw += v * ((until - micros.applyAsLong(k)) / 1e6);
      }
      return new Aggregate(min, max, sum, tw);
    }
  }

  private static final String UPDATE =
      "SELECT update_reading_rollups(?::int4[], ?::int2[], ?::text[]::timestamptz[], ?::int4[],"
          + " ?::int2[], ?::text[]::timestamptz[], ?::int4[], ?::float8[], ?::float8[], ?::float8[],"
          + " ?::float8[], ?::text[]::timestamptz[], ?::text[]::timestamptz[], ?::float8[],"
          + " ?::int4[], ?::int2[], ?::text[]::timestamptz[], ?::int4[], ?::float8[], ?::float8[],"
          + " ?::float8[], ?::float8[], ?::text[]::timestamptz[], ?::text[]::timestamptz[], ?::float8[])";

  /** The hours touched by these readings (each once). */
  static Set<Hour> hoursOf(Collection<ValidReading> readings, Set<Hour> into) {
    for (ValidReading r : readings) {
      into.add(Hour.of(r));
    }
    return into;
  }

  static Set<Hour> hours() {
    return new HashSet<>();
  }

  /** Partial sums of one requested bucket, combinable in time order. */
  static final class Part {
    double min = Double.POSITIVE_INFINITY;
    double max = Double.NEGATIVE_INFINITY;
    double sum;
    long count;
    double last;
    Instant lastTime;

    void add(double mn, double mx, double s, long n, double l, Instant lt) {
      if (n == 0) {
        return;
      }
      min = Math.min(min, mn);
      max = Math.max(max, mx);
      sum += s;
      count += n;
      if (lastTime == null || !lt.isBefore(lastTime)) {
        last = l;
        lastTime = lt;
      }
    }
  }

  /**
   * Adds the rollup rows of {@code table} with bucket in [from, to) to the requested buckets of
   * {@code size} seconds starting at {@code origin}, each row only when it lies whole inside one
   * requested bucket (the caller reads the others' readings raw). {@code reader} is the caller's
   * template, so rollups and raw rows come from the same server (the replica inside a read scope).
   */
  void addTo(
      JdbcTemplate reader,
      Map<Instant, Part> buckets,
      String table,
      String samplePointId,
      String parameter,
      Instant origin,
      Instant from,
      Instant to,
      long size,
      java.util.function.Predicate<Instant> skip) {
    if (!from.isBefore(to)) {
      return;
    }
    long rowSeconds = table.endsWith("_day") ? 86_400 : 3_600;
    long o = origin.getEpochSecond();
    reader.query(
        "SELECT bucket, min, max, sum, count, last, last_time FROM "
            + table
            // the evaluation rollups (V71) are keyed by the point's key and the column's code, the
            // reading rollups by the point's and the parameter's keys (V62)
            + " WHERE point_key = (SELECT point_key FROM reading_point WHERE sample_point_id = ?)"
            + (table.startsWith("evaluation_")
                ? " AND parameter = ?"
                : " AND parameter_key = (SELECT parameter_key FROM reading_parameter"
                    + " WHERE code = ?)")
            + " AND bucket >= ? AND bucket < ?"
            + " AND count > 0",
        rs -> {
          Instant bucketStart = rs.getTimestamp(1).toInstant();
          if (skip.test(bucketStart)) {
            return; // read from the raw rows by the caller
          }
          long start = bucketStart.getEpochSecond();
          long k = Math.floorDiv(start - o, size);
          if (k != Math.floorDiv(start + rowSeconds - 1 - o, size)) {
            return;
          }
          buckets
              .computeIfAbsent(Instant.ofEpochSecond(o + k * size), b -> new Part())
              .add(
                  rs.getDouble(2),
                  rs.getDouble(3),
                  rs.getDouble(4),
                  rs.getLong(5),
                  rs.getDouble(6),
                  rs.getTimestamp(7).toInstant());
        },
        samplePointId,
        parameter,
        Timestamp.from(from),
        Timestamp.from(to));
  }

  /** The combined buckets in time order. */
  static List<StoredSeries.Bucket> toBuckets(TreeMap<Instant, Part> buckets) {
    List<StoredSeries.Bucket> out = new ArrayList<>(buckets.size());
    buckets.forEach(
        (start, p) -> {
          if (p.count > 0) {
            out.add(new StoredSeries.Bucket(start, p.min, p.sum / p.count, p.max, p.last, p.count));
          }
        });
    return out;
  }
}
