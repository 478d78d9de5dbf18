package org.kwanta.service.ingest;

import java.sql.ResultSet;
import java.sql.SQLException;
import java.sql.Timestamp;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.kwanta.service.system.ReadSource;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.jdbc.core.RowCallbackHandler;
import org.springframework.stereotype.Repository;
import tools.jackson.databind.json.JsonMapper;

/**
 * The read API of the stored evaluations: the only code outside the ingest's own writer that reads
 * the {@code evaluation} table. Every query bounds the time (or takes the latest row through the
 * time index), so PostgreSQL prunes to the days asked for.
 */
@Repository
public class Evaluations {

  private final JdbcTemplate jdbc;
  private final JsonMapper json;
  private final EvaluationPack.Shapes shapes;

  Evaluations(ReadSource reads, JsonMapper json, EvaluationShapes shapes) {
    this.jdbc = reads.jdbc();
    this.json = json;
    this.shapes = shapes;
  }

  /** One stored evaluation. */
  public record Stored(Instant time, EvaluationView evaluation) {}

  /** A point's evaluations in [from, to), oldest first, at most {@code limit}. */
  public List<Stored> range(String samplePointId, Instant from, Instant to, int limit) {
    return jdbc.query(
        """
        SELECT time, details, detail_pack, %s FROM evaluation
        WHERE point_key = (SELECT point_key FROM reading_point WHERE sample_point_id = ?)
          AND time >= ? AND time < ? ORDER BY time LIMIT ?"""
            .formatted(EvaluationPack.Columns.SELECT),
        this::stored,
        samplePointId,
        Timestamp.from(from),
        Timestamp.from(to),
        limit);
  }

  /** A point's latest evaluation. */
  public Optional<Stored> latest(String samplePointId, Instant since) {
    return jdbc
        .query(LATEST_EVALUATION, this::stored, samplePointId, java.sql.Timestamp.from(since))
        .stream()
        .findFirst();
  }

  /** Several points' latest evaluation since a time, in one query, by point id. */
  public Map<String, Stored> latest(java.util.Collection<String> samplePointIds, Instant since) {
    Map<String, Stored> out = new HashMap<>();
    if (samplePointIds.isEmpty()) {
      return out;
    }
    jdbc.query(
        """
        SELECT k.sample_point_id, e.time, e.details, e.detail_pack, %s FROM reading_point k
        CROSS JOIN LATERAL (
          SELECT time, details, detail_pack, %1$s FROM evaluation
          WHERE point_key = k.point_key AND time >= ? ORDER BY time DESC LIMIT 1) e
        WHERE k.sample_point_id = ANY (?::text[])"""
            .formatted(EvaluationPack.Columns.SELECT),
        (RowCallbackHandler)
            rs ->
                out.put(
                    rs.getString(1),
                    new Stored(
                        rs.getTimestamp(2).toInstant(),
                        stored(rs.getString(3), rs.getBytes(4), rs, 5).fromStorage())),
        Timestamp.from(since),
        (Object) samplePointIds.toArray(String[]::new));
    return out;
  }

  /**
   * The latest evaluation at a point since a time (a bound the planner prunes daily partitions by).
   * Parameters: the sample point, the time.
   */
  public static final String LATEST_EVALUATION =
      """
      SELECT time, details, detail_pack, specific_conductivity_25, cation_conductivity_25,
             degassed_cation_conductivity_25, calculated_ph_25, ph_at_temperature, ph_at_temperature_low,
             ph_at_temperature_high, neutral_ph_at_temperature, config_version, instrument_in_doubt
      FROM evaluation
      WHERE point_key = (SELECT point_key FROM reading_point WHERE sample_point_id = ?) AND time >= ?
      ORDER BY time DESC LIMIT 1""";

  /** pH at temperature and the neutral pH there, NaN when absent. */
  public record PhAtTemperature(double ph, double neutralPh) {}

  /** Per sample point, the latest pH at temperature at or after {@code since}. */
  public Map<String, PhAtTemperature> latestPhAtTemperature(Instant since) {
    Map<String, PhAtTemperature> out = new HashMap<>();
    jdbc.query(
        """
        SELECT s.id, e.ph_at_temperature, e.neutral_ph_at_temperature FROM sample_point s
        JOIN reading_point k ON k.sample_point_id = s.id
        CROSS JOIN LATERAL (
          SELECT ph_at_temperature, neutral_ph_at_temperature FROM evaluation
          WHERE point_key = k.point_key AND time >= ? AND ph_at_temperature IS NOT NULL
          ORDER BY time DESC LIMIT 1) e""",
        (RowCallbackHandler)
            rs -> out.put(rs.getString(1), new PhAtTemperature(rs.getDouble(2), value(rs, 3))),
        Timestamp.from(since));
    return out;
  }

  /** Per sample point, the latest calculated pH at 25 °C at or after {@code since}. */
  public Map<String, Double> latestCalculatedPh(Instant since) {
    Map<String, Double> out = new HashMap<>();
    jdbc.query(
        """
        SELECT s.id, e.calculated_ph_25 FROM sample_point s
        JOIN reading_point k ON k.sample_point_id = s.id
        CROSS JOIN LATERAL (
          SELECT calculated_ph_25 FROM evaluation
          WHERE point_key = k.point_key AND time >= ? AND calculated_ph_25 IS NOT NULL
          ORDER BY time DESC LIMIT 1) e""",
        (RowCallbackHandler) rs -> out.put(rs.getString(1), rs.getDouble(2)),
        Timestamp.from(since));
    return out;
  }

  /**
   * A minute's last values of the evaluations' indexed columns (NaN when none in the minute).
   *
   * @param minute the start of the minute
   */
  public record MinuteValues(
      String samplePointId,
      Instant minute,
      double specificConductivity25,
      double cationConductivity25,
      double degassedCationConductivity25,
      double calculatedPh25) {}

  /** The last value of each column in each minute of [from, to), per point. */
  public List<MinuteValues> lastPerMinute(List<String> samplePointIds, Instant from, Instant to) {
    List<MinuteValues> out = new ArrayList<>();
    jdbc.query(
        """
        SELECT k.sample_point_id, date_trunc('minute', e.time) AS m,
               (array_agg(specific_conductivity_25 ORDER BY time DESC)
                  FILTER (WHERE specific_conductivity_25 IS NOT NULL))[1],
               (array_agg(cation_conductivity_25 ORDER BY time DESC)
                  FILTER (WHERE cation_conductivity_25 IS NOT NULL))[1],
               (array_agg(degassed_cation_conductivity_25 ORDER BY time DESC)
                  FILTER (WHERE degassed_cation_conductivity_25 IS NOT NULL))[1],
               (array_agg(calculated_ph_25 ORDER BY time DESC)
                  FILTER (WHERE calculated_ph_25 IS NOT NULL))[1]
        FROM evaluation e JOIN reading_point k ON k.point_key = e.point_key
        WHERE e.point_key = ANY (ARRAY(SELECT point_key FROM reading_point
                                       WHERE sample_point_id = ANY (?::text[])))
          AND e.time >= ? AND e.time < ?
        GROUP BY 1, 2""",
        (RowCallbackHandler)
            rs ->
                out.add(
                    new MinuteValues(
                        rs.getString(1),
                        rs.getTimestamp(2).toInstant(),
                        value(rs, 3),
                        value(rs, 4),
                        value(rs, 5),
                        value(rs, 6))),
        samplePointIds.toArray(String[]::new),
        Timestamp.from(from),
        Timestamp.from(to));
    return out;
  }

  private Stored stored(ResultSet rs, int i) throws SQLException {
    return new Stored(
        rs.getTimestamp(1).toInstant(),
        stored(rs.getString(2), rs.getBytes(3), rs, 4).fromStorage());
  }

  /**
   * A stored view: the compact form (which may refer to the row's typed columns, selected from
   * {@code firstColumn} on in the order of {@link EvaluationPack.Columns#SELECT}), or the JSON of
   * rows written before it.
   */
  private EvaluationView stored(String details, byte[] pack, ResultSet rs, int firstColumn)
      throws SQLException {
    return pack != null
        ? EvaluationPack.decode(pack, EvaluationPack.Columns.read(rs, firstColumn), shapes)
        : json.readValue(details, EvaluationView.class);
  }

  private static double value(ResultSet rs, int column) throws SQLException {
    double v = rs.getDouble(column);
    return rs.wasNull() ? Double.NaN : v;
  }
}
