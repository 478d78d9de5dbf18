package org.kwanta.service.ingest;

import java.sql.Connection;
import java.sql.PreparedStatement;
import java.util.List;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.stereotype.Repository;

/**
 * Writes evaluations (one statement per batch, or binary COPY for new ones), their details in the
 * compact form of {@link EvaluationPack}.
 */
@Repository
public class EvaluationStore {

  static final String UPSERT =
      """
      INSERT INTO evaluation AS e (sample_point_id, time, config_version, specific_conductivity_25,
          cation_conductivity_25, degassed_cation_conductivity_25, calculated_ph_25, ph_at_temperature,
          ph_at_temperature_low, ph_at_temperature_high, neutral_ph_at_temperature, instrument_in_doubt, finding_codes,
          points_at, detail_pack, evaluated_at)
      SELECT t.sample_point_id, t.time, t.config_version, t.sc25, t.cc25, t.dcc25, t.ph25, t.pht, t.pht_low,
             t.pht_high, t.neutral, t.instrument_in_doubt, string_to_array(t.codes, ','), string_to_array(t.points_at, ','),
             t.detail_pack, now()
      FROM unnest(?::text[], ?::text[]::timestamptz[], ?::int4[], ?::float8[], ?::float8[], ?::float8[],
                  ?::float8[], ?::float8[], ?::float8[], ?::float8[], ?::float8[], ?::bool[], ?::text[],
                  ?::text[], ?::bytea[])
        AS t(sample_point_id, time, config_version, sc25, cc25, dcc25, ph25, pht, pht_low, pht_high, neutral,
             instrument_in_doubt, codes, points_at, detail_pack)
      ON CONFLICT (sample_point_id, time) DO UPDATE SET
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
          finding_codes = EXCLUDED.finding_codes,
          points_at = EXCLUDED.points_at,
          details = NULL,
          detail_pack = EXCLUDED.detail_pack,
          evaluated_at = now()
        WHERE e.detail_pack IS DISTINCT FROM EXCLUDED.detail_pack OR e.config_version <> EXCLUDED.config_version""";

  private final JdbcTemplate jdbc;

  EvaluationStore(JdbcTemplate jdbc) {
    this.jdbc = jdbc;
  }

  /** Upserts evaluations; unchanged ones are left alone. */
  public void upsert(List<EvaluationRunner.Result> results) {
    if (results.isEmpty()) {
      return;
    }
    int n = results.size();
    String[] points = new String[n];
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
    String[] codes = new String[n];
    String[] pointsAt = new String[n];
    byte[][] details = new byte[n][];
    for (int i = 0; i < n; i++) {
      EvaluationRunner.Result r = results.get(i);
      Columns col = Columns.of(r.view());
      points[i] = r.samplePointId();
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
      codes[i] = String.join(",", col.codes());
      pointsAt[i] = String.join(",", col.pointsAt());
      details[i] = EvaluationPack.encode(r.view().forStorage());
    }
    jdbc.execute(
        (Connection c) -> {
          try (PreparedStatement ps = c.prepareStatement(UPSERT)) {
            ps.setArray(1, c.createArrayOf("text", points));
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
            ps.setArray(13, c.createArrayOf("text", codes));
            ps.setArray(14, c.createArrayOf("text", pointsAt));
            ps.setArray(15, c.createArrayOf("bytea", details));
            return ps.executeUpdate();
          }
        });
  }

  /**
   * Encodes evaluations for {@link #copyNew} (thread-safe: the ingest encodes points in parallel).
   */
  public BinaryCopy encode(List<EvaluationRunner.Result> results) {
    BinaryCopy rows = BinaryCopy.fragment(results.size(), 480);
    for (EvaluationRunner.Result r : results) {
      Columns col = Columns.of(r.view());
      rows.row(15)
          .text(r.samplePointId())
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
          .textArray(col.codes())
          .textArray(col.pointsAt())
          .bytea(EvaluationPack.encode(r.view().forStorage()));
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
      evaluation (sample_point_id, time, config_version, specific_conductivity_25, cation_conductivity_25,
          degassed_cation_conductivity_25, calculated_ph_25, ph_at_temperature, ph_at_temperature_low,
          ph_at_temperature_high, neutral_ph_at_temperature, instrument_in_doubt, finding_codes, points_at, detail_pack)""";

  /** An evaluation's indexed columns; NaN where there is no value (SQL NULL). */
  private record Columns(
      double sc25,
      double cc25,
      double dcc25,
      double ph25,
      double phAtTemperature,
      double low,
      double high,
      double neutral,
      List<String> codes,
      List<String> pointsAt) {

    static Columns of(EvaluationView v) {
      EvaluationView.PhAtTemperature t = v.phAtTemperature();
      return new Columns(
          nanIfNull(v.at25("specific_conductivity")),
          nanIfNull(v.at25("cation_conductivity")),
          nanIfNull(v.at25("degassed_cation_conductivity")),
          v.calculatedPh() == null ? Double.NaN : finiteOrNaN(v.calculatedPh().rigorous()),
          t == null ? Double.NaN : finiteOrNaN(t.ph()),
          t == null ? Double.NaN : finiteOrNaN(t.low()),
          t == null ? Double.NaN : finiteOrNaN(t.high()),
          t == null ? Double.NaN : finiteOrNaN(t.neutralPh()),
          v.findings().stream().map(EvaluationView.FindingView::code).distinct().toList(),
          EvaluationStore.pointsAt(v));
    }
  }

  private static double nanIfNull(Double v) {
    return v == null ? Double.NaN : v;
  }

  private static double finiteOrNaN(double v) {
    return Double.isFinite(v) ? v : Double.NaN;
  }

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
