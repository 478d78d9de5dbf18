package org.kwanta.service.diagnosis;

import java.sql.Timestamp;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.kwanta.model.diagnosis.Minute;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Repository;

/**
 * The minute series the diagnosis reads, from the stored evaluations (conductivities at 25 °C and
 * the calculated pH) and readings (measured pH and sodium; readings of quality "bad" left out): the
 * last value of each minute. Depends only on what is stored, never on arrival order.
 */
@Repository
class MinuteSeries {

  private final JdbcClient jdbc;

  MinuteSeries(JdbcClient jdbc) {
    this.jdbc = jdbc;
  }

  /** Mutable minute while the two queries fill it. */
  private static final class Row {
    double sc = Double.NaN;
    double cation = Double.NaN;
    double degassed = Double.NaN;
    double calculated = Double.NaN;
    double ph = Double.NaN;
    double sodium = Double.NaN;
  }

  /** Minutes of each point in [from, to), time order. */
  Map<String, List<Minute>> load(List<String> points, Instant from, Instant to) {
    Map<String, TreeMap<Instant, Row>> rows = new HashMap<>();
    for (String p : points) {
      rows.put(p, new TreeMap<>());
    }
    String[] ids = points.toArray(String[]::new);
    jdbc.sql(
            """
            SELECT sample_point_id, date_trunc('minute', time) AS m,
                   (array_agg(specific_conductivity_25 ORDER BY time DESC)
                      FILTER (WHERE specific_conductivity_25 IS NOT NULL))[1],
                   (array_agg(cation_conductivity_25 ORDER BY time DESC)
                      FILTER (WHERE cation_conductivity_25 IS NOT NULL))[1],
                   (array_agg(degassed_cation_conductivity_25 ORDER BY time DESC)
                      FILTER (WHERE degassed_cation_conductivity_25 IS NOT NULL))[1],
                   (array_agg(calculated_ph_25 ORDER BY time DESC)
                      FILTER (WHERE calculated_ph_25 IS NOT NULL))[1]
            FROM evaluation
            WHERE sample_point_id = ANY (?::text[]) AND time >= ? AND time < ?
            GROUP BY 1, 2""")
        .params(ids, Timestamp.from(from), Timestamp.from(to))
        .query(
            rs -> {
              Row r =
                  rows.get(rs.getString(1))
                      .computeIfAbsent(rs.getTimestamp(2).toInstant(), k -> new Row());
              r.sc = value(rs, 3);
              r.cation = value(rs, 4);
              r.degassed = value(rs, 5);
              r.calculated = value(rs, 6);
            });
    jdbc.sql(
            """
            SELECT sample_point_id, date_trunc('minute', time) AS m, parameter,
                   (array_agg(value ORDER BY time DESC))[1]
            FROM reading
            WHERE sample_point_id = ANY (?::text[]) AND parameter IN ('ph', 'sodium')
              AND quality <> 2 AND time >= ? AND time < ?
            GROUP BY 1, 2, 3""")
        .params(ids, Timestamp.from(from), Timestamp.from(to))
        .query(
            rs -> {
              Row r =
                  rows.get(rs.getString(1))
                      .computeIfAbsent(rs.getTimestamp(2).toInstant(), k -> new Row());
              if ("ph".equals(rs.getString(3))) {
                r.ph = rs.getDouble(4);
              } else {
                r.sodium = rs.getDouble(4);
              }
            });
    Map<String, List<Minute>> out = new HashMap<>();
    rows.forEach(
        (id, byMinute) -> {
          List<Minute> list = new ArrayList<>(byMinute.size());
          byMinute.forEach(
              (t, r) ->
                  list.add(
                      new Minute(t, r.sc, r.cation, r.degassed, r.ph, r.calculated, r.sodium)));
          out.put(id, list);
        });
    return out;
  }

  private static double value(java.sql.ResultSet rs, int column) throws java.sql.SQLException {
    double v = rs.getDouble(column);
    return rs.wasNull() ? Double.NaN : v;
  }
}
