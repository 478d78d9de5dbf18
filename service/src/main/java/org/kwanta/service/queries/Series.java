package org.kwanta.service.queries;

import java.sql.Timestamp;
import java.time.Duration;
import java.time.Instant;
import java.util.List;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.stereotype.Repository;

/** Series queries over readings and evaluations. */
@Repository
class Series {

  private final JdbcTemplate jdbc;

  Series(JdbcTemplate jdbc) {
    this.jdbc = jdbc;
  }

  /** One raw point. {@code quality} is null for derived parameters. */
  record Point(Instant time, Double value, String quality) {}

  /** One bucket: [start, start + size). */
  record Bucket(Instant start, double min, double mean, double max, double last, long count) {}

  List<Point> raw(
      String samplePointId, SeriesParameter p, Instant from, Instant to, Instant after, int limit) {
    String quality = p.measured() ? "quality" : "NULL::smallint";
    return jdbc.query(
        "SELECT time, "
            + p.column()
            + ", "
            + quality
            + " FROM "
            + p.table()
            + " WHERE sample_point_id = ? AND time >= ? AND time < ? AND time > ?"
            + (p.measured() ? " AND parameter = '" + p.code() + "'" : "")
            + " ORDER BY time LIMIT ?",
        (rs, i) -> {
          double v = rs.getDouble(2);
          Double value = rs.wasNull() ? null : v;
          int q = rs.getInt(3);
          String qualityName =
              rs.wasNull()
                  ? null
                  : org.kwanta.service.ingest.ValidReading.Quality.ofCode(q)
                      .name()
                      .toLowerCase(java.util.Locale.ROOT);
          return new Point(rs.getTimestamp(1).toInstant(), value, qualityName);
        },
        samplePointId,
        Timestamp.from(from),
        Timestamp.from(to),
        Timestamp.from(after == null ? Instant.EPOCH : after),
        limit);
  }

  List<Bucket> bucketed(
      String samplePointId, SeriesParameter p, Instant from, Instant to, Duration bucket) {
    String filter =
        p.measured()
            ? " AND parameter = '" + p.code() + "' AND quality < 2"
            : " AND " + p.column() + " IS NOT NULL";
    return jdbc.query(
        "SELECT date_bin(make_interval(secs => ?), time, ?) AS b, min(v), avg(v), max(v),"
            + " (array_agg(v ORDER BY time DESC))[1], count(*)"
            + " FROM (SELECT time, "
            + p.column()
            + " AS v FROM "
            + p.table()
            + " WHERE sample_point_id = ? AND time >= ? AND time < ?"
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
