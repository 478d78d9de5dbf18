package org.kwanta.service.ingest;

import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.Timestamp;
import java.time.Duration;
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
   * Recomputes the given hours from {@code reading} and their days from the hours, in one call (two
   * statements) in the caller's transaction.
   */
  void update(Collection<Hour> hours) {
    if (hours.isEmpty()) {
      return;
    }
    int n = hours.size();
    String[] points = new String[n];
    String[] parameters = new String[n];
    String[] starts = new String[n];
    int i = 0;
    for (Hour h : hours) {
      points[i] = h.samplePointId();
      parameters[i] = h.parameter();
      starts[i++] = h.start().toString();
    }
    jdbc.execute(
        (Connection c) -> {
          try (PreparedStatement ps =
              c.prepareStatement(
                  "SELECT update_reading_rollups(?::text[], ?::text[], ?::text[]::timestamptz[])")) {
            ps.setArray(1, c.createArrayOf("text", points));
            ps.setArray(2, c.createArrayOf("text", parameters));
            ps.setArray(3, c.createArrayOf("text", starts));
            ps.executeQuery().close();
          }
          return null;
        });
  }

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
   * Adds the rollup rows of {@code table} in [from, to) (both on the table's bucket boundaries) to
   * the requested buckets of size {@code size} starting at {@code origin}.
   */
  void addTo(
      Map<Instant, Part> buckets,
      String table,
      String samplePointId,
      String parameter,
      Instant origin,
      Instant from,
      Instant to,
      Duration size) {
    if (!from.isBefore(to)) {
      return;
    }
    jdbc.query(
        "SELECT date_bin(make_interval(secs => ?), bucket, ?), min, max, sum, count, last,"
            + " last_time FROM "
            + table
            + " WHERE sample_point_id = ? AND parameter = ? AND bucket >= ? AND bucket < ?"
            + " AND count > 0 ORDER BY bucket",
        rs -> {
          buckets
              .computeIfAbsent(rs.getTimestamp(1).toInstant(), b -> new Part())
              .add(
                  rs.getDouble(2),
                  rs.getDouble(3),
                  rs.getDouble(4),
                  rs.getLong(5),
                  rs.getDouble(6),
                  rs.getTimestamp(7).toInstant());
        },
        (double) size.toSeconds(),
        Timestamp.from(origin),
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
