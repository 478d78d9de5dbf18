package org.kwanta.service.readings;

import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.util.List;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.stereotype.Repository;

/**
 * Writes readings: one statement per batch (arrays unnested server-side), inserting new rows,
 * replacing changed ones and keeping every replaced row in {@code reading_revision}. Identical rows
 * are left alone.
 */
@Repository
class ReadingStore {

  static final String UPSERT =
      """
      WITH incoming AS (
        SELECT * FROM unnest(?::text[], ?::text[], ?::text[]::timestamptz[], ?::float8[], ?::int2[],
                             ?::float8[], ?::bool[])
          AS t(sample_point_id, parameter, time, value, quality, sample_temperature_cel, compensated)
      ), revised AS (
        INSERT INTO reading_revision (sample_point_id, parameter, time, old_value, old_quality,
                                      old_sample_temperature_cel, old_compensated, old_received_at, new_value)
        SELECT r.sample_point_id, r.parameter, r.time, r.value, r.quality, r.sample_temperature_cel,
               r.compensated, r.received_at, i.value
        FROM incoming i JOIN reading r USING (sample_point_id, parameter, time)
        WHERE (r.value, r.quality, r.sample_temperature_cel, r.compensated)
              IS DISTINCT FROM (i.value, i.quality, i.sample_temperature_cel, i.compensated)
        RETURNING 1
      ), upserted AS (
        INSERT INTO reading AS r (sample_point_id, parameter, time, value, quality, sample_temperature_cel,
                                  compensated)
        SELECT * FROM incoming
        ON CONFLICT (sample_point_id, parameter, time) DO UPDATE
          SET value = EXCLUDED.value, quality = EXCLUDED.quality,
              sample_temperature_cel = EXCLUDED.sample_temperature_cel, compensated = EXCLUDED.compensated,
              received_at = now()
          WHERE (r.value, r.quality, r.sample_temperature_cel, r.compensated)
                IS DISTINCT FROM (EXCLUDED.value, EXCLUDED.quality, EXCLUDED.sample_temperature_cel,
                                  EXCLUDED.compensated)
        RETURNING 1
      )
      SELECT (SELECT count(*) FROM upserted), (SELECT count(*) FROM revised)""";

  private final JdbcTemplate jdbc;

  ReadingStore(JdbcTemplate jdbc) {
    this.jdbc = jdbc;
  }

  /** What a batch changed. */
  record Counts(int inserted, int corrected, int unchanged) {}

  /**
   * Upserts readings with distinct keys (the caller de-duplicates). Runs in the caller's
   * transaction.
   */
  Counts upsert(List<ValidReading> readings) {
    int n = readings.size();
    String[] points = new String[n];
    String[] parameters = new String[n];
    String[] times = new String[n];
    Double[] values = new Double[n];
    Short[] qualities = new Short[n];
    Double[] temperatures = new Double[n];
    Boolean[] compensated = new Boolean[n];
    for (int i = 0; i < n; i++) {
      ValidReading r = readings.get(i);
      points[i] = r.samplePointId();
      parameters[i] = r.parameter().code();
      times[i] = r.time().toString();
      values[i] = r.value();
      qualities[i] = r.quality().code();
      temperatures[i] = Double.isNaN(r.sampleTemperatureCel()) ? null : r.sampleTemperatureCel();
      compensated[i] = r.compensated();
    }
    return jdbc.execute(
        (Connection c) -> {
          try (PreparedStatement ps = c.prepareStatement(UPSERT)) {
            ps.setArray(1, c.createArrayOf("text", points));
            ps.setArray(2, c.createArrayOf("text", parameters));
            ps.setArray(3, c.createArrayOf("text", times));
            ps.setArray(4, c.createArrayOf("float8", values));
            ps.setArray(5, c.createArrayOf("int2", qualities));
            ps.setArray(6, c.createArrayOf("float8", temperatures));
            ps.setArray(7, c.createArrayOf("bool", compensated));
            try (ResultSet rs = ps.executeQuery()) {
              rs.next();
              // an update happens exactly where a revision is written (same IS DISTINCT FROM test)
              int corrected = rs.getInt(2);
              int inserted = rs.getInt(1) - corrected;
              return new Counts(inserted, corrected, n - inserted - corrected);
            }
          }
        });
  }
}
