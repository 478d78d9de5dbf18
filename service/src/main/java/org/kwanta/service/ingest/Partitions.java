package org.kwanta.service.ingest;

import java.sql.SQLException;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.util.Collection;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import java.util.concurrent.ConcurrentHashMap;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.stereotype.Component;
import org.springframework.transaction.PlatformTransactionManager;
import org.springframework.transaction.TransactionDefinition;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * Daily partitions of the {@code reading} and {@code evaluation} tables (UTC days), safe with any
 * number of service instances on one database. Created ahead by {@link StorageMaintenance} and on
 * demand for backfilled days, and dropped past the retention horizon; creating and dropping both
 * run under one PostgreSQL advisory lock, and existence is checked in the database under that lock.
 *
 * <p>The tables have no default partition (migration V33): a row for a day without a partition
 * fails its transaction with "no partition of relation ... found for row" ({@link
 * #isMissingPartition}) instead of landing where retention never looks. The in-memory set of known
 * days only saves a round trip; when another instance has dropped a day, the write fails, the day
 * is {@linkplain #forget forgotten}, created again and the batch retried ({@link IngestService}).
 */
@Component
public class Partitions {

  static final List<String> TABLES = List.of("reading", "evaluation");
  private static final Logger log = LoggerFactory.getLogger(Partitions.class);
  private static final DateTimeFormatter SUFFIX = DateTimeFormatter.ofPattern("yyyyMMdd");

  /** The advisory lock held (transaction-scoped) while partitions are created or dropped. */
  static final long LOCK_KEY = 0x6B77616E7461L; // "kwanta"

  private final JdbcTemplate jdbc;
  private final TransactionTemplate ownTransaction;
  private final Set<LocalDate> known = ConcurrentHashMap.newKeySet();

  /**
   * Days whose readings were packed ({@code reading_pack_day}, {@link PackedReadings#pack}): no
   * partition of {@code reading} is made for them again (an empty one would hide nothing, but the
   * day's readings would be split between it and the blocks); their readings go to the blocks. A
   * day once packed stays packed, so this set only grows (retention forgets days before it).
   */
  private final Set<LocalDate> packed = ConcurrentHashMap.newKeySet();

  Partitions(JdbcTemplate jdbc, PlatformTransactionManager transactions) {
    this.jdbc = jdbc;
    this.ownTransaction = new TransactionTemplate(transactions);
    this.ownTransaction.setPropagationBehavior(TransactionDefinition.PROPAGATION_REQUIRES_NEW);
  }

  /** Makes sure every table has a partition for each of the days, in a transaction of its own. */
  public void ensure(Collection<LocalDate> days) {
    ensure(days, Integer.MAX_VALUE);
  }

  /**
   * Makes sure every table has a partition for each of the days, in a transaction of its own,
   * creating at most {@code maxNewDays} days.
   *
   * @throws TooManyNewDaysException when more than {@code maxNewDays} of the days have no partition
   *     yet (nothing is created then)
   */
  public void ensure(Collection<LocalDate> days, int maxNewDays) {
    Set<LocalDate> unknown = new TreeSet<>();
    for (LocalDate d : days) {
      if (!known.contains(d)) {
        unknown.add(d);
      }
    }
    if (unknown.isEmpty()) {
      return;
    }
    // which partitions are missing (read only; the count is checked before anything is made)
    Set<String> missing = new TreeSet<>();
    Set<LocalDate> newDays = new TreeSet<>();
    for (LocalDate day : unknown) {
      if (packedInDatabase(day)) {
        packed.add(day);
      }
      for (String table : TABLES) {
        String name = name(table, day);
        if (table.equals("reading") && packed.contains(day)) {
          continue;
        }
        if (!exists(name)) {
          missing.add(name);
          newDays.add(day);
        }
      }
    }
    if (newDays.size() > maxNewDays) {
      throw new TooManyNewDaysException(newDays.size(), maxNewDays);
    }
    // each partition in a short transaction of its own, under the lock that retention takes too:
    // CREATE TABLE ... PARTITION OF locks its parent exclusively, and holding one parent while
    // waiting for the other deadlocked with ingest transactions that write both tables
    for (String name : missing) {
      String table = name.substring(0, name.length() - 10);
      LocalDate day = LocalDate.parse(name.substring(name.length() - 8), SUFFIX);
      ownTransaction.executeWithoutResult(
          status -> {
            jdbc.queryForObject("SELECT pg_advisory_xact_lock(?)", Object.class, LOCK_KEY);
            if (exists(name)) {
              return; // another instance or request made it meanwhile
            }
            if (table.equals("reading") && packedInDatabase(day)) {
              packed.add(day); // packed meanwhile (under this lock): never made again
              return;
            }
            jdbc.execute(
                "CREATE TABLE IF NOT EXISTS "
                    + name
                    + " PARTITION OF "
                    + table
                    + " FOR VALUES FROM ('"
                    + day
                    + " 00:00:00+00') TO ('"
                    + day.plusDays(1)
                    + " 00:00:00+00')");
            log.debug("Created partition {}", name);
          });
    }
    known.addAll(unknown);
  }

  /**
   * Whether the table exists, read from pg_class with the statement's snapshot (to_regclass reads
   * the session's catalog cache, which may not yet show a table another session just committed).
   */
  private boolean exists(String name) {
    return Boolean.TRUE.equals(
        jdbc.queryForObject(
            "SELECT EXISTS (SELECT 1 FROM pg_class WHERE relname = ? AND relkind IN ('r', 'p'))",
            Boolean.class,
            name));
  }

  private boolean packedInDatabase(LocalDate day) {
    return Boolean.TRUE.equals(
        jdbc.queryForObject(
            "SELECT EXISTS (SELECT 1 FROM reading_pack_day WHERE day = ?)", Boolean.class, day));
  }

  /**
   * Whether the day's readings are packed, as last seen by {@link #ensure} (which the ingest calls
   * for every day of a batch before writing it; a day packed since then fails the write with a
   * missing partition, and the retry's {@code ensure} finds it packed).
   */
  public boolean isPacked(LocalDate day) {
    return packed.contains(day);
  }

  /**
   * Whether any day is known to be packed (the ingest's hot path skips the per-day check if not).
   */
  public boolean anyPacked() {
    return !packed.isEmpty();
  }

  /** Notes that this instance packed the day (its partition of {@code reading} is gone). */
  void markPacked(LocalDate day) {
    packed.add(day);
    known.remove(day);
  }

  /** Forgets packed days before the given day (retention deleted their blocks). */
  void forgetPackedBefore(LocalDate firstKeptDay) {
    packed.removeIf(d -> d.isBefore(firstKeptDay));
  }

  /**
   * The days that have a partition of {@code reading} and end before the given day, oldest first:
   * the days the packer may pack.
   */
  List<LocalDate> readingDaysBefore(LocalDate firstUnpackedDay) {
    return jdbc
        .queryForList(
            """
            SELECT c.relname FROM pg_inherits i
            JOIN pg_class c ON c.oid = i.inhrelid
            WHERE i.inhparent = 'reading'::regclass AND c.relname ~ '^reading_p[0-9]{8}$'""",
            String.class)
        .stream()
        .map(Partitions::dayOf)
        .filter(d -> d.isBefore(firstUnpackedDay))
        .sorted()
        .toList();
  }

  /** Forgets that the days have partitions: the next {@link #ensure} checks the database. */
  public void forget(Collection<LocalDate> days) {
    known.removeAll(days);
  }

  /**
   * Drops whole-day partitions that end before the given day. Returns the names dropped.
   *
   * <p>Each partition goes in a transaction of its own, under the advisory lock that creating
   * takes: dropping a partition locks its parent table exclusively, and a reader that locked one of
   * the two tables and waits for the other would deadlock with a transaction holding both. A
   * reading partition goes first and, since dropping it fires no trigger, marks every in-memory
   * copy of readings stale in the same transaction (heads before readings, the ingest's lock
   * order).
   */
  public List<String> dropBefore(LocalDate firstKeptDay) {
    List<String> names =
        jdbc
            .queryForList(
                """
                SELECT c.relname FROM pg_inherits i
                JOIN pg_class c ON c.oid = i.inhrelid
                JOIN pg_class p ON p.oid = i.inhparent
                WHERE p.relname = ANY (?::text[]) AND c.relname ~ '_p[0-9]{8}$'""",
                String.class, (Object) TABLES.toArray(String[]::new))
            .stream()
            .filter(n -> dayOf(n).isBefore(firstKeptDay))
            .sorted(
                java.util.Comparator.comparing((String n) -> dayOf(n))
                    .thenComparing(n -> !n.startsWith("reading_")))
            .toList();
    List<String> dropped = new java.util.ArrayList<>();
    for (String name : names) {
      known.remove(dayOf(name));
      Boolean done =
          ownTransaction.execute(
              status -> {
                jdbc.queryForObject("SELECT pg_advisory_xact_lock(?)", Object.class, LOCK_KEY);
                if (jdbc.queryForObject("SELECT to_regclass(?) IS NULL", Boolean.class, name)) {
                  return false; // another instance dropped it
                }
                if (name.startsWith("reading_")) {
                  jdbc.queryForObject("SELECT invalidate_reading_heads()", Object.class);
                }
                jdbc.execute("DROP TABLE " + name);
                return true;
              });
      if (Boolean.TRUE.equals(done)) {
        dropped.add(name);
      }
    }
    return dropped;
  }

  /**
   * True when the failure (or a cause) is PostgreSQL refusing a row for which no partition exists
   * (SQLSTATE 23514, "no partition of relation ... found for row").
   */
  static boolean isMissingPartition(Throwable e) {
    for (Throwable t = e; t != null; t = t.getCause() == t ? null : t.getCause()) {
      if (t instanceof SQLException s
          && "23514".equals(s.getSQLState())
          && s.getMessage() != null
          && s.getMessage().contains("no partition of relation")) {
        return true;
      }
    }
    return false;
  }

  /**
   * Refreshes the planner statistics of the days' partitions of every table (those that exist):
   * PostgreSQL's autovacuum does this only when it is on and only after enough rows changed, and a
   * day's partition is new every day, so without it the queries of the board, the series and the
   * diagnosis over today's rows are planned blind (seconds instead of milliseconds on a grown
   * database with autovacuum off). ANALYZE samples a fixed number of rows, so the cost does not
   * grow with the partition.
   *
   * @return the partitions analyzed
   */
  public List<String> analyze(Collection<LocalDate> days) {
    List<String> names = new java.util.ArrayList<>();
    for (String table : TABLES) {
      for (LocalDate day : days) {
        names.add(name(table, day));
      }
    }
    List<String> existing =
        jdbc.queryForList(
            "SELECT relname FROM pg_class WHERE relname = ANY (?::text[]) ORDER BY relname",
            String.class,
            (Object) names.toArray(String[]::new));
    for (String partition : existing) {
      // names are ours (table and yyyyMMdd), never from input
      jdbc.execute("ANALYZE " + partition);
    }
    return existing;
  }

  static String name(String table, LocalDate day) {
    return table + "_p" + day.format(SUFFIX);
  }

  private static LocalDate dayOf(String partition) {
    return LocalDate.parse(partition.substring(partition.length() - 8), SUFFIX);
  }

  static LocalDate dayOf(java.time.Instant t) {
    return LocalDate.ofInstant(t, ZoneOffset.UTC);
  }
}
