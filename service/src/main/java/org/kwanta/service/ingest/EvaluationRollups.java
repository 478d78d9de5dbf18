package org.kwanta.service.ingest;

import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.Collection;
import java.util.HashMap;
import java.util.HashSet;
import java.util.Map;
import java.util.Set;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.stereotype.Repository;

/**
 * The hourly and daily rollups of the derived series ({@code evaluation_rollup_hour}, {@code
 * evaluation_rollup_day}, migration V64): per point, evaluation value column and UTC hour or day.
 * Kept in step by the ingest ({@link #update}, in its transaction) and read by {@link StoredSeries}
 * for buckets of whole hours, as the reading rollups are for the measured series.
 */
@Repository
class EvaluationRollups {

  private final JdbcTemplate jdbc;

  EvaluationRollups(JdbcTemplate jdbc) {
    this.jdbc = jdbc;
  }

  /** One point's hour. */
  private record Hour(String samplePointId, Instant start) {}

  /**
   * Keeps the rollups in step with the caller's transaction, in one call after its evaluations are
   * written ({@code update_evaluation_rollups}, V64): an hour whose evaluations written here are
   * all new takes them in without being read again when they follow its last values; an hour with a
   * recomputed evaluation is recomputed, and so are the touched days from their hours.
   *
   * @param written every evaluation written (new or recomputed)
   * @param recomputed those of them that replaced a stored evaluation (upserted)
   */
  void update(
      Collection<EvaluationRunner.Result> written, Collection<EvaluationRunner.Result> recomputed) {
    if (written.isEmpty()) {
      return;
    }
    Set<Hour> again = new HashSet<>();
    for (EvaluationRunner.Result r : recomputed) {
      again.add(new Hour(r.samplePointId(), r.time().truncatedTo(ChronoUnit.HOURS)));
    }
    Map<Hour, Instant> from = new HashMap<>();
    for (EvaluationRunner.Result r : written) {
      Hour h = new Hour(r.samplePointId(), r.time().truncatedTo(ChronoUnit.HOURS));
      if (!again.contains(h)) {
        from.merge(h, r.time(), (a, b) -> a.isBefore(b) ? a : b);
      }
    }
    int n = from.size() + again.size();
    String[] points = new String[n];
    String[] hours = new String[n];
    String[] froms = new String[n];
    int i = 0;
    for (Map.Entry<Hour, Instant> e : from.entrySet()) {
      points[i] = e.getKey().samplePointId();
      hours[i] = e.getKey().start().toString();
      froms[i++] = e.getValue().toString();
    }
    for (Hour h : again) {
      points[i] = h.samplePointId();
      hours[i++] = h.start().toString();
    }
    jdbc.query(
        c -> {
          var ps =
              c.prepareStatement(
                  "SELECT update_evaluation_rollups(?::text[], ?::text[]::timestamptz[],"
                      + " ?::text[]::timestamptz[])");
          ps.setArray(1, c.createArrayOf("text", points));
          ps.setArray(2, c.createArrayOf("text", hours));
          ps.setArray(3, c.createArrayOf("text", froms));
          return ps;
        },
        rs -> {});
  }
}
