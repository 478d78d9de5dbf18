package org.kwanta.service.ingest;

import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.Timestamp;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.Collection;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.kwanta.service.ingest.EvaluationRunner.StoredReading;
import org.kwanta.service.ingest.ReadingBlock.Row;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.jdbc.core.RowCallbackHandler;
import org.springframework.stereotype.Repository;
import org.springframework.transaction.PlatformTransactionManager;
import org.springframework.transaction.TransactionDefinition;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * Packed cold storage of readings ({@code reading_pack}, migration V69): one row per series and UTC
 * hour holding a {@link ReadingBlock}. This class is the one code path that reads and writes
 * blocks: {@link #pack} turns a day's partition of {@code reading} into blocks and drops it, {@link
 * #write} merges readings of packed days into their blocks in the ingest transaction (revisions and
 * rollups as the hot path keeps them), and {@link #read} decodes blocks for the readers.
 *
 * <p>A day is either hot (a partition of {@code reading}) or packed (listed in {@code
 * reading_pack_day}, blocks only), never both: {@link Partitions} does not make a partition for a
 * packed day again, and {@link ReadingStore} sends its readings here.
 */
@Repository
class PackedReadings {

  private static final Logger log = LoggerFactory.getLogger(PackedReadings.class);

  /** An hour in microseconds. */
  static final long HOUR_MICROS = 3_600_000_000L;

  private final JdbcTemplate jdbc;
  private final TransactionTemplate ownTransaction;

  PackedReadings(JdbcTemplate jdbc, PlatformTransactionManager transactions) {
    this.jdbc = jdbc;
    this.ownTransaction = new TransactionTemplate(transactions);
    this.ownTransaction.setPropagationBehavior(TransactionDefinition.PROPAGATION_REQUIRES_NEW);
  }

  static long micros(Instant t) {
    return Math.multiplyExact(t.getEpochSecond(), 1_000_000L) + t.getNano() / 1000;
  }

  static Instant instant(long micros) {
    return Instant.ofEpochSecond(
        Math.floorDiv(micros, 1_000_000L), Math.floorMod(micros, 1_000_000L) * 1000L);
  }

  static long hourOf(long micros) {
    return Math.floorDiv(micros, HOUR_MICROS) * HOUR_MICROS;
  }

  // ---- reading

  /** Receives decoded readings. */
  @FunctionalInterface
  interface Sink {
    void accept(String samplePointId, String parameter, Row row);
  }

  /**
   * The packed readings of some points in [from of the point, to), per point, parameter and hour
   * (time order within a series), of the given parameter codes. One query; blocks decoded here.
   *
   * @param jdbc the template to read with (the primary in the ingest, the read source elsewhere)
   */
  static void read(
      JdbcTemplate jdbc, Map<String, Instant> fromByPoint, Instant to, String[] codes, Sink out) {
    if (fromByPoint.isEmpty()) {
      return;
    }
    String[] points = fromByPoint.keySet().toArray(String[]::new);
    Timestamp[] froms = new Timestamp[points.length];
    Map<String, Long> fromMicros = new HashMap<>();
    for (int i = 0; i < points.length; i++) {
      froms[i] = Timestamp.from(fromByPoint.get(points[i]));
      fromMicros.put(points[i], micros(fromByPoint.get(points[i])));
    }
    long toMicros = micros(to);
    jdbc.query(
        c -> {
          PreparedStatement ps =
              c.prepareStatement(
                  """
                  SELECT s.sample_point_id, q.code, p.block
                  FROM unnest(?::text[], ?::timestamptz[]) AS s(sample_point_id, since)
                  JOIN reading_point k ON k.sample_point_id = s.sample_point_id
                  JOIN reading_pack p ON p.point_key = k.point_key
                   AND p.parameter_key = ANY (ARRAY(SELECT parameter_key FROM reading_parameter
                                                    WHERE code = ANY (?::text[])))
                   AND p.start > s.since - interval '1 hour' AND p.start < ?
                  JOIN reading_parameter q ON q.parameter_key = p.parameter_key
                  ORDER BY s.sample_point_id, q.code, p.start""");
          ps.setArray(1, c.createArrayOf("text", points));
          ps.setArray(2, c.createArrayOf("timestamptz", froms));
          ps.setArray(3, c.createArrayOf("text", codes));
          ps.setTimestamp(4, Timestamp.from(to));
          return ps;
        },
        (RowCallbackHandler)
            rs -> {
              String point = rs.getString(1);
              String code = rs.getString(2);
              long from = fromMicros.get(point);
              for (Row r : ReadingBlock.decode(rs.getBytes(3))) {
                if (r.micros() >= from && r.micros() < toMicros) {
                  out.accept(point, code, r);
                }
              }
            });
  }

  /**
   * Per point and parameter, the last packed reading at or after {@code since} (the last block
   * only: one index probe per series).
   */
  static void latest(
      JdbcTemplate jdbc, Collection<String> points, Instant since, String[] codes, Sink out) {
    if (points.isEmpty() || codes.length == 0) {
      return;
    }
    long sinceMicros = micros(since);
    jdbc.query(
        c -> {
          PreparedStatement ps =
              c.prepareStatement(
                  """
                  SELECT k.sample_point_id, q.code, b.block
                  FROM reading_point k
                  CROSS JOIN (SELECT parameter_key, code FROM reading_parameter
                              WHERE code = ANY (?::text[])) q
                  CROSS JOIN LATERAL (
                    SELECT block FROM reading_pack p
                    WHERE p.point_key = k.point_key AND p.parameter_key = q.parameter_key
                      AND p.start > ?::timestamptz - interval '1 hour'
                    ORDER BY p.start DESC LIMIT 1) b
                  WHERE k.sample_point_id = ANY (?::text[])""");
          ps.setArray(1, c.createArrayOf("text", codes));
          ps.setTimestamp(2, Timestamp.from(since));
          ps.setArray(3, c.createArrayOf("text", points.toArray(String[]::new)));
          return ps;
        },
        (RowCallbackHandler)
            rs -> {
              List<Row> rows = ReadingBlock.decode(rs.getBytes(3));
              Row last = rows.get(rows.size() - 1);
              if (last.micros() >= sinceMicros) {
                out.accept(rs.getString(1), rs.getString(2), last);
              }
            });
  }

  /**
   * Among some points, the latest packed reading of one parameter at or before {@code at} that is
   * not of bad quality, as (sample point, row), or null; on equal times the greater point id. Reads
   * the blocks backwards from {@code at} and stops at the first hour that cannot hold a later one.
   */
  static Map.Entry<String, Row> lastNotBadAtOrBefore(
      JdbcTemplate jdbc, Collection<String> points, String code, Instant at) {
    if (points.isEmpty()) {
      return null;
    }
    long atMicros = micros(at);
    return jdbc.query(
        c -> {
          PreparedStatement ps =
              c.prepareStatement(
                  """
                  SELECT k.sample_point_id, p.start, p.block FROM reading_pack p
                  JOIN reading_point k ON k.point_key = p.point_key
                  WHERE k.sample_point_id = ANY (?::text[])
                    AND p.parameter_key = (SELECT parameter_key FROM reading_parameter WHERE code = ?)
                    AND p.start <= ?
                  ORDER BY p.start DESC""");
          ps.setArray(1, c.createArrayOf("text", points.toArray(String[]::new)));
          ps.setString(2, code);
          ps.setTimestamp(3, Timestamp.from(at));
          ps.setFetchSize(100);
          return ps;
        },
        rs -> {
          String bestPoint = null;
          Row best = null;
          while (rs.next()) {
            long start = micros(rs.getTimestamp(2).toInstant());
            if (best != null && start + HOUR_MICROS <= best.micros()) {
              break;
            }
            String point = rs.getString(1);
            List<Row> rows = ReadingBlock.decode(rs.getBytes(3));
            for (int i = rows.size() - 1; i >= 0; i--) {
              Row r = rows.get(i);
              if (r.micros() <= atMicros && r.quality() < 2) {
                if (best == null
                    || r.micros() > best.micros()
                    || (r.micros() == best.micros() && point.compareTo(bestPoint) > 0)) {
                  best = r;
                  bestPoint = point;
                }
                break;
              }
            }
          }
          return best == null ? null : Map.entry(bestPoint, best);
        });
  }

  /** The packed readings of one point in [from, to), of the given parameter codes. */
  static List<StoredReading> stored(
      JdbcTemplate jdbc, String samplePointId, Instant from, Instant to, String[] codes) {
    List<StoredReading> out = new ArrayList<>();
    read(jdbc, Map.of(samplePointId, from), to, codes, (p, code, r) -> out.add(stored(code, r)));
    return out;
  }

  static StoredReading stored(String code, Row r) {
    return new StoredReading(
        code,
        instant(r.micros()),
        r.value(),
        r.quality(),
        r.temperature() == null ? Double.NaN : r.temperature(),
        r.compensated());
  }

  // ---- writing into packed days (the ingest transaction)

  /** A reading for a packed day, with its series keys. */
  record Incoming(int point, short parameter, Row row) {}

  /**
   * Merges readings of packed days into their blocks, in the caller's transaction: per series and
   * hour, in key order, the block is locked ({@code FOR UPDATE}), decoded, compared reading by
   * reading as the hot upsert compares rows ({@code IS DISTINCT FROM}: -0.0 equals 0.0, NaN equals
   * NaN), every replaced reading kept in {@code reading_revision}, and the block written back when
   * something changed; then the changed hours' rollups are recomputed from the merged blocks and
   * their days from the hours. Keys must be distinct (the caller de-duplicates).
   */
  ReadingStore.Counts write(Collection<Incoming> readings) {
    Map<List<Long>, List<Incoming>> byBlock = new TreeMap<>(PackedReadings::compareKeys);
    for (Incoming i : readings) {
      byBlock
          .computeIfAbsent(
              List.of((long) i.point(), (long) i.parameter(), hourOf(i.row().micros())),
              k -> new ArrayList<>())
          .add(i);
    }
    int inserted = 0;
    int corrected = 0;
    int unchanged = 0;
    List<Object[]> revisions = new ArrayList<>();
    List<Object[]> blocks = new ArrayList<>();
    List<Object[]> hours = new ArrayList<>();
    Map<List<Long>, Boolean> days = new TreeMap<>(PackedReadings::compareKeys);
    for (Map.Entry<List<Long>, List<Incoming>> e : byBlock.entrySet()) {
      int point = e.getKey().get(0).intValue();
      short parameter = e.getKey().get(1).shortValue();
      long hour = e.getKey().get(2);
      Timestamp start = Timestamp.from(instant(hour));
      List<byte[]> found =
          jdbc.query(
              "SELECT block FROM reading_pack WHERE point_key = ? AND parameter_key = ?"
                  + " AND start = ? FOR UPDATE",
              (rs, n) -> rs.getBytes(1),
              point,
              parameter,
              start);
      List<Row> base = found.isEmpty() ? List.of() : ReadingBlock.decode(found.get(0));
      Map<Long, Row> byTime = new HashMap<>();
      for (Row r : base) {
        byTime.put(r.micros(), r);
      }
      List<Row> changes = new ArrayList<>();
      for (Incoming i : e.getValue()) {
        Row now = i.row();
        Row before = byTime.get(now.micros());
        if (before == null) {
          inserted++;
          changes.add(now);
        } else if (same(before, now)) {
          unchanged++;
        } else {
          corrected++;
          changes.add(now);
          revisions.add(
              new Object[] {
                point,
                parameter,
                Timestamp.from(instant(now.micros())),
                before.value(),
                before.quality(),
                before.temperature(),
                before.compensated(),
                now.value()
              });
        }
      }
      if (changes.isEmpty()) {
        continue;
      }
      List<Row> merged = ReadingBlock.merge(base, changes);
      blocks.add(
          new Object[] {start, point, merged.size(), parameter, ReadingBlock.encode(merged)});
      hours.add(hourRollup(point, parameter, hour, merged));
      days.put(
          List.of(
              (long) point,
              (long) parameter,
              Math.floorDiv(hour, 24 * HOUR_MICROS) * 24 * HOUR_MICROS),
          true);
    }
    if (!revisions.isEmpty()) {
      jdbc.batchUpdate(
          """
          INSERT INTO reading_revision (point_key, parameter_key, time, old_value, old_quality,
                                        old_sample_temperature_cel, old_compensated, new_value)
          VALUES (?, ?, ?, ?, ?, ?, ?, ?)""",
          revisions);
    }
    if (!blocks.isEmpty()) {
      jdbc.batchUpdate(UPSERT_BLOCK, blocks);
      jdbc.batchUpdate(UPSERT_HOUR, hours);
      int n = days.size();
      Integer[] ps = new Integer[n];
      Short[] qs = new Short[n];
      Timestamp[] ds = new Timestamp[n];
      int k = 0;
      for (List<Long> d : days.keySet()) {
        ps[k] = d.get(0).intValue();
        qs[k] = d.get(1).shortValue();
        ds[k++] = Timestamp.from(instant(d.get(2)));
      }
      jdbc.execute(
          (Connection c) -> {
            try (PreparedStatement st =
                c.prepareStatement("SELECT update_reading_rollup_days(?, ?, ?)")) {
              st.setArray(1, c.createArrayOf("int4", ps));
              st.setArray(2, c.createArrayOf("int2", qs));
              st.setArray(3, c.createArrayOf("timestamptz", ds));
              st.executeQuery().close();
            }
            return null;
          });
    }
    return new ReadingStore.Counts(inserted, corrected, unchanged);
  }

  private static final String UPSERT_BLOCK =
      """
      INSERT INTO reading_pack (start, point_key, count, parameter_key, block) VALUES (?, ?, ?, ?, ?)
      ON CONFLICT (point_key, parameter_key, start)
        DO UPDATE SET count = EXCLUDED.count, block = EXCLUDED.block""";

  private static final String UPSERT_HOUR =
      """
      INSERT INTO reading_rollup_hour AS o (point_key, parameter_key, bucket, count, min, max, sum,
                                            last, first_time, last_time, tw_sum, held_seconds)
      VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)
      ON CONFLICT (point_key, parameter_key, bucket) DO UPDATE
        SET count = EXCLUDED.count, min = EXCLUDED.min, max = EXCLUDED.max, sum = EXCLUDED.sum,
            last = EXCLUDED.last, first_time = EXCLUDED.first_time, last_time = EXCLUDED.last_time,
            tw_sum = EXCLUDED.tw_sum, held_seconds = EXCLUDED.held_seconds""";

  /**
   * An hour's rollup row from all its readings, as {@code update_reading_rollups} (V62) computes it
   * from {@code reading}: readings of quality below 2; each value held until the next reading or
   * the hour's end; no reading gives count 0 and nulls.
   */
  static Object[] hourRollup(int point, short parameter, long hour, List<Row> rows) {
    List<Row> kept = new ArrayList<>();
    for (Row r : rows) {
      if (r.quality() < 2) {
        kept.add(r);
      }
    }
    long end = hour + HOUR_MICROS;
    Timestamp bucket = Timestamp.from(instant(hour));
    if (kept.isEmpty()) {
      return new Object[] {
        point, parameter, bucket, 0, null, null, null, null, null, null, null, null
      };
    }
    ReadingRollups.Aggregate a =
        ReadingRollups.Aggregate.of(
            kept.size(), k -> kept.get(k).micros(), k -> kept.get(k).value(), end);
    Row first = kept.get(0);
    Row last = kept.get(kept.size() - 1);
    return new Object[] {
      point,
      parameter,
      bucket,
      kept.size(),
      a.min(),
      a.max(),
      a.sum(),
      last.value(),
      Timestamp.from(instant(first.micros())),
      Timestamp.from(instant(last.micros())),
      a.timeWeightedSum(),
      (end - first.micros()) / 1e6
    };
  }

  /** Equal as PostgreSQL's {@code IS NOT DISTINCT FROM} compares the stored columns. */
  static boolean same(Row a, Row b) {
    return equal(a.value(), b.value())
        && a.quality() == b.quality()
        && a.compensated() == b.compensated()
        && (a.temperature() == null
            ? b.temperature() == null
            : b.temperature() != null && equal(a.temperature(), b.temperature()));
  }

  private static boolean equal(double a, double b) {
    return a == b || (Double.isNaN(a) && Double.isNaN(b));
  }

  private static int compareKeys(List<Long> a, List<Long> b) {
    for (int i = 0; i < a.size(); i++) {
      int c = Long.compare(a.get(i), b.get(i));
      if (c != 0) {
        return c;
      }
    }
    return 0;
  }

  // ---- packing and retention

  /**
   * Packs one day's partition of {@code reading} into blocks and drops it, in a transaction of its
   * own under the advisory lock that creating and dropping partitions take: the partition is locked
   * against writes ({@code SHARE}: readers go on), read in key order, each series-hour encoded
   * (merged with a block already there, the partition's rows winning), the day listed in {@code
   * reading_pack_day}, the partition dropped.
   *
   * <p>The in-memory copies of readings and the heads' generations are left alone: packing moves
   * readings without changing one, and a later write to the day goes to its blocks ({@link
   * Partitions#isPacked}, or a missing partition that makes the ingest retry the batch). Marking
   * every head stale here would also hold every head's row lock, and so stop every ingest, for as
   * long as the day takes to pack (3 s for 555,000 readings on the build machine).
   *
   * <p>The {@code DROP} needs the parent {@code reading} exclusively. It waits at most {@link
   * #DROP_LOCK_TIMEOUT_MS} ms, less than PostgreSQL's {@code deadlock_timeout} (1 s by default),
   * and is tried {@link #DROP_ATTEMPTS} times, a second apart, so that what queues behind it waits
   * no longer. Before each attempt, if a transaction waits to write into the day (an ingest that
   * has written another day, so holds the parent, and would deadlock with the {@code DROP}), the
   * packer gives the day up at once: the waiting transaction's own deadlock check (after {@code
   * deadlock_timeout}) then never finds the packer waiting on it. If no attempt succeeds, nothing
   * of the day is packed and the next run tries again.
   *
   * @return the readings packed, -1 when the day has no partition (packed already, or never
   *     written), -2 when its partition could not be dropped this time
   */
  long pack(LocalDate day) {
    return pack(day, DROP_ATTEMPTS);
  }

  /** {@link #pack(LocalDate)} with the given number of attempts at the {@code DROP}. */
  long pack(LocalDate day, int dropAttempts) {
    String partition = Partitions.name("reading", day);
    Long packed =
        ownTransaction.execute(
            status -> {
              jdbc.queryForObject(
                  "SELECT pg_advisory_xact_lock(?)", Object.class, Partitions.LOCK_KEY);
              if (jdbc.queryForObject("SELECT to_regclass(?) IS NULL", Boolean.class, partition)) {
                return -1L;
              }
              // no ingest writes into the day from here on; readers go on until the DROP
              jdbc.execute("LOCK TABLE " + partition + " IN SHARE MODE");
              Timestamp dayStart = Timestamp.from(day.atStartOfDay(ZoneOffset.UTC).toInstant());
              Timestamp dayEnd =
                  Timestamp.from(day.plusDays(1).atStartOfDay(ZoneOffset.UTC).toInstant());
              Map<List<Long>, byte[]> existing = new HashMap<>();
              jdbc.query(
                  "SELECT point_key, parameter_key, start, block FROM reading_pack"
                      + " WHERE start >= ? AND start < ?",
                  (RowCallbackHandler)
                      rs ->
                          existing.put(
                              List.of(
                                  (long) rs.getInt(1),
                                  (long) rs.getShort(2),
                                  micros(rs.getTimestamp(3).toInstant())),
                              rs.getBytes(4)),
                  dayStart,
                  dayEnd);
              Packer packer = new Packer(existing);
              jdbc.query(
                  c -> {
                    PreparedStatement ps =
                        c.prepareStatement(
                            "SELECT point_key, parameter_key, time, value, quality,"
                                + " sample_temperature_cel, compensated FROM "
                                + partition
                                + " ORDER BY point_key, parameter_key, time");
                    ps.setFetchSize(20_000);
                    return ps;
                  },
                  (RowCallbackHandler) packer::row);
              packer.flush();
              packer.send();
              jdbc.update(
                  "INSERT INTO reading_pack_day (day, readings) VALUES (?, ?)"
                      + " ON CONFLICT (day) DO UPDATE"
                      + " SET readings = reading_pack_day.readings + EXCLUDED.readings",
                  day,
                  packer.readings);
              if (!dropWithinTimeout(status, partition, dropAttempts)) {
                status.setRollbackOnly();
                return -2L;
              }
              return packer.readings;
            });
    if (packed != null && packed == -2) {
      log.warn(
          "Could not drop the partition of {} within {} attempts of {} ms (transactions on"
              + " reading held it); nothing of the day was packed, the next run tries again",
          day,
          dropAttempts,
          DROP_LOCK_TIMEOUT_MS);
      return -2;
    }
    if (packed != null && packed >= 0) {
      log.info("Packed {} readings of {} and dropped its partition", packed, day);
    }
    return packed == null ? -1 : packed;
  }

  /** How long the {@code DROP} of a packed partition waits for its locks, per attempt. */
  static final int DROP_LOCK_TIMEOUT_MS = 500;

  /** How often the {@code DROP} is tried before the day's packing is given up for this run. */
  static final int DROP_ATTEMPTS = 5;

  /** Pause between two attempts of the {@code DROP}. */
  static final long DROP_PAUSE_MS = 1000;

  private boolean dropWithinTimeout(
      org.springframework.transaction.TransactionStatus status, String partition, int attempts) {
    for (int attempt = 1; attempt <= attempts; attempt++) {
      if (writerWaits(partition)) {
        // a transaction waits to write this day while holding, maybe, what the DROP needs: the
        // DROP would wait on it as it waits on us, a deadlock; let it go first
        log.debug("A transaction waits to write into {}; packing given up for this run", partition);
        return false;
      }
      Object savepoint = status.createSavepoint();
      try {
        jdbc.execute("SET LOCAL lock_timeout = '" + DROP_LOCK_TIMEOUT_MS + "ms'");
        jdbc.execute("DROP TABLE " + partition);
        jdbc.execute("SET LOCAL lock_timeout = 0");
        status.releaseSavepoint(savepoint);
        return true;
      } catch (org.springframework.dao.DataAccessException e) {
        if (!isLockTimeout(e)) {
          throw e;
        }
        status.rollbackToSavepoint(savepoint);
        status.releaseSavepoint(savepoint);
        log.debug("DROP of {} timed out waiting for its locks (attempt {})", partition, attempt);
        if (attempt < attempts) {
          try {
            Thread.sleep(DROP_PAUSE_MS);
          } catch (InterruptedException interrupted) {
            Thread.currentThread().interrupt();
            return false;
          }
        }
      }
    }
    return false;
  }

  /** Whether another transaction waits for a lock on the partition (a write into its day). */
  private boolean writerWaits(String partition) {
    return jdbc.queryForObject(
        "SELECT EXISTS (SELECT 1 FROM pg_locks WHERE relation = ?::regclass AND NOT granted)",
        Boolean.class,
        partition);
  }

  /** PostgreSQL's lock_not_available (55P03), which a lock_timeout raises. */
  private static boolean isLockTimeout(Throwable e) {
    for (Throwable t = e; t != null; t = t.getCause()) {
      if (t instanceof java.sql.SQLException sql && "55P03".equals(sql.getSQLState())) {
        return true;
      }
    }
    return false;
  }

  /** Encodes the partition's rows series-hour by series-hour, sending blocks in batches. */
  private final class Packer {
    private final Map<List<Long>, byte[]> existing;
    private final List<Object[]> batch = new ArrayList<>();
    private final List<Row> rows = new ArrayList<>();
    private int point;
    private short parameter;
    private long hour = Long.MIN_VALUE;
    long readings;

    Packer(Map<List<Long>, byte[]> existing) {
      this.existing = existing;
    }

    void row(ResultSet rs) throws java.sql.SQLException {
      int p = rs.getInt(1);
      short q = rs.getShort(2);
      long t = micros(rs.getTimestamp(3).toInstant());
      long h = hourOf(t);
      if (p != point || q != parameter || h != hour) {
        flush();
        point = p;
        parameter = q;
        hour = h;
      }
      double temperature = rs.getDouble(6);
      boolean noTemperature = rs.wasNull();
      rows.add(
          new Row(
              t,
              rs.getDouble(4),
              rs.getShort(5),
              noTemperature ? null : temperature,
              rs.getBoolean(7)));
      readings++;
    }

    void flush() {
      if (rows.isEmpty()) {
        return;
      }
      byte[] old = existing.remove(List.of((long) point, (long) parameter, hour));
      List<Row> all =
          old == null ? List.copyOf(rows) : ReadingBlock.merge(ReadingBlock.decode(old), rows);
      batch.add(
          new Object[] {
            Timestamp.from(instant(hour)), point, all.size(), parameter, ReadingBlock.encode(all)
          });
      rows.clear();
      if (batch.size() >= 1000) {
        send();
      }
    }

    void send() {
      if (!batch.isEmpty()) {
        jdbc.batchUpdate(UPSERT_BLOCK, batch);
        batch.clear();
      }
    }
  }

  /**
   * Retention: deletes the blocks of hours before the day and forgets the packed days before it,
   * then vacuums the table so that the space is reused (this installation may run with autovacuum
   * off). Returns the blocks deleted.
   */
  int deleteBefore(LocalDate firstKeptDay) {
    Timestamp limit = Timestamp.from(firstKeptDay.atStartOfDay(ZoneOffset.UTC).toInstant());
    Integer deleted =
        ownTransaction.execute(
            status -> {
              jdbc.queryForObject(
                  "SELECT pg_advisory_xact_lock(?)", Object.class, Partitions.LOCK_KEY);
              int n = jdbc.update("DELETE FROM reading_pack WHERE start < ?", limit);
              jdbc.update("DELETE FROM reading_pack_day WHERE day < ?", firstKeptDay);
              return n;
            });
    if (deleted != null && deleted > 0) {
      jdbc.execute("VACUUM reading_pack");
    }
    return deleted == null ? 0 : deleted;
  }
}
