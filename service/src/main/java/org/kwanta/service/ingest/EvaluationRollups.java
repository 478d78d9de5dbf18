package org.kwanta.service.ingest;

import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.Collection;
import java.util.HashSet;
import java.util.List;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.stereotype.Repository;

/**
 * The hourly and daily rollups of the derived series ({@code evaluation_rollup_hour}, {@code
 * evaluation_rollup_day}, migration V64): per point, evaluation value column and UTC hour or day;
 * keyed, as the marks are, by the point's key (V71). Marked by the ingest ({@link #mark}, in its
 * transaction), recomputed a few seconds later off the ingest path ({@link #settle}, {@code
 * EvaluationRollupSettler}), and read by {@link StoredSeries} for buckets of whole hours that are
 * not marked, as the reading rollups are for the measured series.
 */
@Repository
class EvaluationRollups {

  private final JdbcTemplate jdbc;
  private final SeriesKeys keys;

  EvaluationRollups(JdbcTemplate jdbc, SeriesKeys keys) {
    this.jdbc = jdbc;
    this.keys = keys;
  }

  /** One point's UTC hour. */
  private record Hour(int point, Instant start) {}

  private static final java.util.Comparator<Hour> HOUR_ORDER =
      java.util.Comparator.comparingInt(Hour::point).thenComparing(Hour::start);

  /**
   * Marks, in the caller's (ingest) transaction, every (point, UTC hour) of the evaluations written
   * ({@code evaluation_rollup_pending}, V65); {@link #settle} recomputes them later, off the ingest
   * path. Readers take a marked hour from the evaluations themselves ({@link #pendingHours}). Marks
   * go in in key order, so that two writers never wait on each other's marks in a cycle.
   *
   * @param written every evaluation written (new or recomputed)
   */
  void mark(Collection<EvaluationRunner.Result> written) {
    if (written.isEmpty()) {
      return;
    }
    java.util.TreeSet<Hour> marks = new java.util.TreeSet<>(HOUR_ORDER);
    for (EvaluationRunner.Result r : written) {
      marks.add(new Hour(keys.point(r.samplePointId()), r.time().truncatedTo(ChronoUnit.HOURS)));
    }
    Integer[] points = new Integer[marks.size()];
    String[] hours = new String[marks.size()];
    int i = 0;
    for (Hour h : marks) {
      points[i] = h.point();
      hours[i++] = h.start().toString();
    }
    jdbc.update(
        c -> {
          var ps =
              c.prepareStatement(
                  "INSERT INTO evaluation_rollup_pending (point_key, bucket)"
                      + " SELECT p, h FROM unnest(?::int4[], ?::text[]::timestamptz[]) AS u(p, h)"
                      + " ORDER BY p, h ON CONFLICT DO NOTHING");
          ps.setArray(1, c.createArrayOf("int4", points));
          ps.setArray(2, c.createArrayOf("text", hours));
          return ps;
        });
  }

  /** Hours settled per round at most. */
  static final int SETTLE_BATCH = 2_000;

  /**
   * Recomputes marked hours (and their days) from the evaluations, up to {@link #SETTLE_BATCH} per
   * call, in one transaction that first deletes the marks it takes (rows another instance is
   * settling are skipped): an evaluation committed after the delete has its own mark, one committed
   * before it is seen by the recomputation that follows. Returns the number of hours settled.
   */
  @org.springframework.transaction.annotation.Transactional
  public int settle() {
    List<Object[]> taken =
        jdbc.query(
            """
            WITH d AS (
              DELETE FROM evaluation_rollup_pending
              WHERE (point_key, bucket) IN (
                SELECT point_key, bucket FROM evaluation_rollup_pending
                ORDER BY point_key, bucket LIMIT ? FOR UPDATE SKIP LOCKED)
              RETURNING point_key, bucket)
            SELECT point_key, bucket FROM d""",
            (rs, i) -> new Object[] {rs.getInt(1), rs.getTimestamp(2)},
            SETTLE_BATCH);
    if (taken.isEmpty()) {
      return 0;
    }
    Integer[] points = new Integer[taken.size()];
    java.sql.Timestamp[] hours = new java.sql.Timestamp[taken.size()];
    for (int i = 0; i < points.length; i++) {
      points[i] = (Integer) taken.get(i)[0];
      hours[i] = (java.sql.Timestamp) taken.get(i)[1];
    }
    jdbc.query(
        c -> {
          var ps =
              c.prepareStatement("SELECT settle_evaluation_rollups(?::int4[], ?::timestamptz[])");
          ps.setArray(1, c.createArrayOf("int4", points));
          ps.setArray(2, c.createArrayOf("timestamptz", hours));
          return ps;
        },
        rs -> {});
    return points.length;
  }

  /**
   * The marked (not yet settled) hours of a point in [from, to): a reader takes them, and the days
   * around them, from the evaluations rather than from the rollups.
   */
  java.util.Set<Instant> pendingHours(
      JdbcTemplate reader, String samplePointId, Instant from, Instant to) {
    return new HashSet<>(
        reader.query(
            "SELECT bucket FROM evaluation_rollup_pending"
                + " WHERE point_key = (SELECT point_key FROM reading_point WHERE sample_point_id = ?)"
                + " AND bucket >= ? AND bucket < ?",
            (rs, i) -> rs.getTimestamp(1).toInstant(),
            samplePointId,
            java.sql.Timestamp.from(from.truncatedTo(ChronoUnit.HOURS)),
            java.sql.Timestamp.from(to)));
  }
}
