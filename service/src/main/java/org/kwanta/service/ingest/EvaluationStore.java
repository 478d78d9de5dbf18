package org.kwanta.service.ingest;

import java.sql.Connection;
import java.sql.PreparedStatement;
import java.util.List;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.stereotype.Repository;

/**
 * Writes evaluations (one statement per batch, or binary COPY for new ones), their details in the
 * compact form of {@link EvaluationPack}. Rows carry the sample point's key (V71), taken from
 * {@link SeriesKeys} as the readings' are.
 */
@Repository
public class EvaluationStore {

  static final String UPSERT =
      """
      INSERT INTO evaluation AS e (point_key, time, config_version, specific_conductivity_25,
          cation_conductivity_25, degassed_cation_conductivity_25, calculated_ph_25, ph_at_temperature,
          ph_at_temperature_low, ph_at_temperature_high, neutral_ph_at_temperature, instrument_in_doubt, points_at,
          detail_pack, evaluated_at)
      SELECT t.point_key, t.time, t.config_version, t.sc25, t.cc25, t.dcc25, t.ph25, t.pht, t.pht_low,
             t.pht_high, t.neutral, t.instrument_in_doubt, t.points_at,
             t.detail_pack, now()
      FROM unnest(?::int4[], ?::text[]::timestamptz[], ?::int4[], ?::float8[], ?::float8[], ?::float8[],
                  ?::float8[], ?::float8[], ?::float8[], ?::float8[], ?::float8[], ?::bool[], ?::text[],
                  ?::bytea[])
        AS t(point_key, time, config_version, sc25, cc25, dcc25, ph25, pht, pht_low, pht_high, neutral,
             instrument_in_doubt, points_at, detail_pack)
      ON CONFLICT (point_key, time) DO UPDATE SET
          config_version = EXCLUDED.config_version,
          specific_conductivity_25 = EXCLUDED.specific_conductivity_25,
          cation_conductivity_25 = EXCLUDED.cation_conductivity_25,
          degassed_cation_conductivity_25 = EXCLUDED.degassed_cation_conductivity_25,
          calculated_ph_25 = EXCLUDED.calculated_ph_25,
          ph_at_temperature = EXCLUDED.ph_at_temperature,
          ph_at_temperature_low = EXCLUDED.ph_at_temperature_low,
          ph_at_temperature_high = EXCLUDED.ph_at_temperature_high,
          neutral_ph_at_temperature = EXCLUDED.neutral_ph_at_temperature,
          instrument_in_doubt = EXCLUDED.instrument_in_doubt,
          points_at = EXCLUDED.points_at,
          details = NULL,
          detail_pack = EXCLUDED.detail_pack,
          evaluated_at = now()
        WHERE e.detail_pack IS DISTINCT FROM EXCLUDED.detail_pack OR e.config_version <> EXCLUDED.config_version
           OR e.instrument_in_doubt <> EXCLUDED.instrument_in_doubt
           OR (float8send(e.specific_conductivity_25), float8send(e.cation_conductivity_25),
               float8send(e.degassed_cation_conductivity_25), float8send(e.calculated_ph_25),
               float8send(e.ph_at_temperature), float8send(e.ph_at_temperature_low),
               float8send(e.ph_at_temperature_high), float8send(e.neutral_ph_at_temperature))
              IS DISTINCT FROM
              (float8send(EXCLUDED.specific_conductivity_25), float8send(EXCLUDED.cation_conductivity_25),
               float8send(EXCLUDED.degassed_cation_conductivity_25), float8send(EXCLUDED.calculated_ph_25),
               float8send(EXCLUDED.ph_at_temperature), float8send(EXCLUDED.ph_at_temperature_low),
               float8send(EXCLUDED.ph_at_temperature_high), float8send(EXCLUDED.neutral_ph_at_temperature))""";

  private final JdbcTemplate jdbc;
  private final SeriesKeys keys;
  private final EvaluationPack.Shapes shapes;

  EvaluationStore(JdbcTemplate jdbc, SeriesKeys keys, EvaluationShapes shapes) {
    this.jdbc = jdbc;
    this.keys = keys;
    this.shapes = shapes;
  }

  /** Upserts evaluations; unchanged ones are left alone. */
  public void upsert(List<EvaluationRunner.Result> results) {
    if (results.isEmpty()) {
      return;
    }
    int n = results.size();
    Integer[] points = new Integer[n];
    String[] times = new String[n];
    Integer[] versions = new Integer[n];
    Double[] sc = new Double[n];
    Double[] cc = new Double[n];
    Double[] dcc = new Double[n];
    Double[] ph25 = new Double[n];
    Double[] pht = new Double[n];
    Double[] low = new Double[n];
    Double[] high = new Double[n];
    Double[] neutral = new Double[n];
    Boolean[] inDoubt = new Boolean[n];
    String[] pointsAt = new String[n];
    byte[][] details = new byte[n][];
    for (int i = 0; i < n; i++) {
      EvaluationRunner.Result r = results.get(i);
      EvaluationPack.Columns col = EvaluationPack.Columns.of(r.view());
      List<String> at = pointsAt(r.view());
      points[i] = keys.point(r.samplePointId());
      times[i] = r.time().toString();
      versions[i] = r.view().configVersion();
      sc[i] = nullIfNaN(col.sc25());
      cc[i] = nullIfNaN(col.cc25());
      dcc[i] = nullIfNaN(col.dcc25());
      ph25[i] = nullIfNaN(col.ph25());
      pht[i] = nullIfNaN(col.phAtTemperature());
      low[i] = nullIfNaN(col.low());
      high[i] = nullIfNaN(col.high());
      neutral[i] = nullIfNaN(col.neutral());
      inDoubt[i] = r.view().instrumentInDoubt();
      pointsAt[i] = at.isEmpty() ? null : String.join(",", at);
      details[i] = EvaluationPack.encode(r.view().forStorage(), col, shapes);
    }
    jdbc.execute(
        (Connection c) -> {
          try (PreparedStatement ps = c.prepareStatement(UPSERT)) {
            ps.setArray(1, c.createArrayOf("int4", points));
            ps.setArray(2, c.createArrayOf("text", times));
            ps.setArray(3, c.createArrayOf("int4", versions));
            ps.setArray(4, c.createArrayOf("float8", sc));
            ps.setArray(5, c.createArrayOf("float8", cc));
            ps.setArray(6, c.createArrayOf("float8", dcc));
            ps.setArray(7, c.createArrayOf("float8", ph25));
            ps.setArray(8, c.createArrayOf("float8", pht));
            ps.setArray(9, c.createArrayOf("float8", low));
            ps.setArray(10, c.createArrayOf("float8", high));
            ps.setArray(11, c.createArrayOf("float8", neutral));
            ps.setArray(12, c.createArrayOf("bool", inDoubt));
            ps.setArray(13, c.createArrayOf("text", pointsAt));
            ps.setArray(14, c.createArrayOf("bytea", details));
            return ps.executeUpdate();
          }
        });
  }

  /**
   * Makes sure the points have their keys cached ({@link SeriesKeys#ensure}; no query when they
   * have), so that {@link #encode} on the evaluation threads finds them without a query.
   */
  public void prepareKeys(java.util.Collection<String> samplePointIds) {
    keys.ensure(samplePointIds);
  }

  /**
   * Encodes evaluations for {@link #copyNew} (thread-safe: the ingest encodes points in parallel).
   */
  public BinaryCopy encode(List<EvaluationRunner.Result> results) {
    BinaryCopy rows = BinaryCopy.fragment(results.size(), 320);
    for (EvaluationRunner.Result r : results) {
      EvaluationPack.Columns col = EvaluationPack.Columns.of(r.view());
      List<String> at = pointsAt(r.view());
      rows.row(14)
          .int4(keys.point(r.samplePointId()))
          .timestamp(r.time())
          .int4(r.view().configVersion())
          .float8(col.sc25())
          .float8(col.cc25())
          .float8(col.dcc25())
          .float8(col.ph25())
          .float8(col.phAtTemperature())
          .float8(col.low())
          .float8(col.high())
          .float8(col.neutral())
          .bool(r.view().instrumentInDoubt())
          .text(at.isEmpty() ? null : String.join(",", at))
          .bytea(EvaluationPack.encode(r.view().forStorage(), col, shapes));
    }
    return rows;
  }

  /**
   * Inserts encoded evaluations at times that have none yet with binary COPY. An evaluation that
   * exists after all fails the statement (and the transaction; the ingest then retries the batch
   * with {@link #upsert}).
   */
  public void copyNew(List<BinaryCopy> encoded) {
    BinaryCopy all = new BinaryCopy(1, encoded.stream().mapToInt(BinaryCopy::size).sum() + 2);
    encoded.forEach(all::append);
    if (all.rows() > 0) {
      jdbc.execute((Connection c) -> all.send(c, COPY_TARGET));
    }
  }

  static final String COPY_TARGET =
      """
      evaluation (point_key, time, config_version, specific_conductivity_25, cation_conductivity_25,
          degassed_cation_conductivity_25, calculated_ph_25, ph_at_temperature, ph_at_temperature_low,
          ph_at_temperature_high, neutral_ph_at_temperature, instrument_in_doubt, points_at, detail_pack)""";

  private static Double nullIfNaN(double v) {
    return Double.isNaN(v) ? null : v;
  }

  /** What the findings point at, distinct, sorted. */
  static List<String> pointsAt(EvaluationView v) {
    return v.findings().stream()
        .map(EvaluationView.FindingView::pointsAt)
        .distinct()
        .sorted()
        .toList();
  }
}
