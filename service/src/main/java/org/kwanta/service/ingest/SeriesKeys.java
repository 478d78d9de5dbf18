package org.kwanta.service.ingest;

import java.util.Collection;
import java.util.EnumMap;
import java.util.HashMap;
import java.util.Map;
import java.util.TreeSet;
import java.util.concurrent.ConcurrentHashMap;
import org.kwanta.model.Parameter;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.stereotype.Component;
import org.springframework.transaction.PlatformTransactionManager;
import org.springframework.transaction.TransactionDefinition;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * The integer keys that stored readings carry instead of text (migration V62): a sample point's
 * {@code point_key} ({@code reading_point}) and a parameter's {@code parameter_key} ({@code
 * reading_parameter}). Keys never change and are never reused, so they are cached for the life of
 * the service. The writers take keys from here; the read queries translate ids and codes in SQL.
 */
@Component
class SeriesKeys {

  private final JdbcTemplate jdbc;
  private final TransactionTemplate ownTransaction;
  private final Map<String, Integer> points = new ConcurrentHashMap<>();
  private volatile Map<Parameter, Short> parameters;

  SeriesKeys(JdbcTemplate jdbc, PlatformTransactionManager transactions) {
    this.jdbc = jdbc;
    this.ownTransaction = new TransactionTemplate(transactions);
    this.ownTransaction.setPropagationBehavior(TransactionDefinition.PROPAGATION_REQUIRES_NEW);
  }

  /** A sample point's key (made if it has none yet; see {@link #ensure}). */
  int point(String samplePointId) {
    Integer k = points.get(samplePointId);
    if (k == null) {
      ensure(java.util.List.of(samplePointId));
      k = points.get(samplePointId);
    }
    return k;
  }

  /**
   * Makes sure the points have keys and caches them. Points without one get it in a transaction of
   * its own, committed before this returns: a key cached here exists in the database even if the
   * caller's transaction rolls back.
   */
  void ensure(Collection<String> samplePointIds) {
    TreeSet<String> missing = new TreeSet<>();
    for (String id : samplePointIds) {
      if (!points.containsKey(id)) {
        missing.add(id);
      }
    }
    if (missing.isEmpty()) {
      return;
    }
    String[] ids = missing.toArray(String[]::new);
    Map<String, Integer> found = new HashMap<>();
    ownTransaction.executeWithoutResult(
        status -> {
          jdbc.update(
              "INSERT INTO reading_point (sample_point_id) SELECT unnest(?::text[]) ORDER BY 1"
                  + " ON CONFLICT DO NOTHING",
              (Object) ids);
          jdbc.query(
              "SELECT sample_point_id, point_key FROM reading_point"
                  + " WHERE sample_point_id = ANY (?::text[])",
              rs -> {
                found.put(rs.getString(1), rs.getInt(2));
              },
              (Object) ids);
        });
    points.putAll(found);
  }

  /** A parameter's key. */
  short parameter(Parameter p) {
    Map<Parameter, Short> keys = parameters;
    if (keys == null) {
      keys = loadParameters();
      parameters = keys;
    }
    Short k = keys.get(p);
    if (k == null) {
      throw new IllegalStateException("parameter " + p.code() + " has no key in reading_parameter");
    }
    return k;
  }

  /** A parameter's key, by its code. */
  short parameter(String code) {
    return parameter(
        Parameter.byCode(code)
            .orElseThrow(() -> new IllegalArgumentException("not a parameter: " + code)));
  }

  /**
   * The keys of every parameter of the catalogue. A parameter added to the catalogue after the
   * migrations gets the next free key here, in a transaction of its own that locks the table
   * against another instance doing the same, so that adding a parameter needs no migration.
   */
  private Map<Parameter, Short> loadParameters() {
    Map<Parameter, Short> keys = readParameters();
    if (keys.size() < Parameter.values().length) {
      String[] missing =
          java.util.Arrays.stream(Parameter.values())
              .filter(p -> !keys.containsKey(p))
              .map(Parameter::code)
              .sorted()
              .toArray(String[]::new);
      ownTransaction.executeWithoutResult(
          status -> {
            jdbc.execute("LOCK TABLE reading_parameter IN SHARE ROW EXCLUSIVE MODE");
            jdbc.update(
                "INSERT INTO reading_parameter (parameter_key, code)"
                    + " SELECT (SELECT coalesce(max(parameter_key), 0) FROM reading_parameter)"
                    + " + row_number() OVER (ORDER BY code), code"
                    + " FROM unnest(?::text[]) AS u(code)"
                    + " WHERE code NOT IN (SELECT code FROM reading_parameter)",
                (Object) missing);
          });
      return readParameters();
    }
    return keys;
  }

  private Map<Parameter, Short> readParameters() {
    Map<Parameter, Short> keys = new EnumMap<>(Parameter.class);
    jdbc.query(
        "SELECT parameter_key, code FROM reading_parameter",
        rs -> {
          short key = rs.getShort(1);
          Parameter.byCode(rs.getString(2)).ifPresent(p -> keys.put(p, key));
        });
    return keys;
  }
}
