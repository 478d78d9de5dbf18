package org.kwanta.service.ingest;

import java.sql.Timestamp;
import java.time.Duration;
import java.time.Instant;
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

  StoredSeries(ReadSource reads) {
    this.jdbc = reads.jdbc();
  }

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

  public List<Point> raw(
      String samplePointId, Source p, Instant from, Instant to, Instant after, int limit) {
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
                  : ValidReading.Quality.ofCode(q).name().toLowerCase(java.util.Locale.ROOT);
          return new Point(rs.getTimestamp(1).toInstant(), value, qualityName);
        },
        samplePointId,
        Timestamp.from(from),
        Timestamp.from(to),
        Timestamp.from(after == null ? Instant.EPOCH : after),
        limit);
  }

  public List<Bucket> bucketed(
      String samplePointId, Source p, Instant from, Instant to, Duration bucket) {
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
