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

  ReadingRollups(JdbcTemplate jdbc) {
    this.jdbc = jdbc;
  }

  /**
   * Keeps the rollups in step with the caller's transaction, in one call after its readings are
   * written: the new readings' hours take them in without reading the hour again when they all lie
   * after its last reading, every other touched hour is recomputed from {@code reading}, then the
   * touched days from their hours ({@code update_reading_rollups}, V60).
   *
   * @param recompute hours changed otherwise (corrections, readings of the plain path)
   * @param fresh readings new in this transaction (any quality; bad ones leave the rollups alone)
   */
  void update(Collection<Hour> recompute, Collection<ValidReading> fresh) {
    List<ValidReading> counted = new ArrayList<>(fresh.size());
    for (ValidReading r : fresh) {
      if (r.quality() != ValidReading.Quality.BAD) {
        counted.add(r);
      }
    }
    if (recompute.isEmpty() && counted.isEmpty()) {
      return;
    }
    int n = recompute.size();
    String[] points = new String[n];
    String[] parameters = new String[n];
    String[] starts = new String[n];
    int i = 0;
    for (Hour h : recompute) {
      points[i] = h.samplePointId();
      parameters[i] = h.parameter();
      starts[i++] = h.start().toString();
    }
    int m = counted.size();
    String[] newPoints = new String[m];
    String[] newParameters = new String[m];
    String[] newTimes = new String[m];
    Double[] newValues = new Double[m];
    for (int j = 0; j < m; j++) {
      ValidReading r = counted.get(j);
      newPoints[j] = r.samplePointId();
      newParameters[j] = r.parameter().code();
      newTimes[j] = r.time().toString();
      newValues[j] = r.value();
    }
    jdbc.execute(
        (Connection c) -> {
          try (PreparedStatement ps = c.prepareStatement(UPDATE)) {
            ps.setArray(1, c.createArrayOf("text", points));
            ps.setArray(2, c.createArrayOf("text", parameters));
            ps.setArray(3, c.createArrayOf("text", starts));
            ps.setArray(4, c.createArrayOf("text", newPoints));
            ps.setArray(5, c.createArrayOf("text", newParameters));
            ps.setArray(6, c.createArrayOf("text", newTimes));
            ps.setArray(7, c.createArrayOf("float8", newValues));
            ps.executeQuery().close();
          }
          return null;
        });
  }

  private static final String UPDATE =
      "SELECT update_reading_rollups(?::text[], ?::text[], ?::text[]::timestamptz[], ?::text[],"
          + " ?::text[], ?::text[]::timestamptz[], ?::float8[])";

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
   * requested bucket (the caller reads the others' readings raw).
   */
  void addTo(
      Map<Instant, Part> buckets,
      String table,
      String samplePointId,
      String parameter,
      Instant origin,
      Instant from,
      Instant to,
      long size) {
    if (!from.isBefore(to)) {
      return;
    }
    long rowSeconds = "reading_rollup_day".equals(table) ? 86_400 : 3_600;
    long o = origin.getEpochSecond();
    jdbc.query(
        "SELECT bucket, min, max, sum, count, last, last_time FROM "
            + table
            + " WHERE sample_point_id = ? AND parameter = ? AND bucket >= ? AND bucket < ?"
            + " AND count > 0",
        rs -> {
          long start = rs.getTimestamp(1).toInstant().getEpochSecond();
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
