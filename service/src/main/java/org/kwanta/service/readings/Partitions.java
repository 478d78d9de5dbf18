package org.kwanta.service.readings;

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
 * Daily partitions of the {@code reading} and {@code evaluation} tables (UTC days). Created ahead
 * by {@link StorageMaintenance} and on demand for backfilled days, always before rows arrive, so
 * the default partitions stay empty.
 */
@Component
public class Partitions {

  static final List<String> TABLES = List.of("reading", "evaluation");
  private static final Logger log = LoggerFactory.getLogger(Partitions.class);
  private static final DateTimeFormatter SUFFIX = DateTimeFormatter.ofPattern("yyyyMMdd");
  private static final long LOCK_KEY = 0x6B77616E7461L; // "kwanta"

  private final JdbcTemplate jdbc;
  private final TransactionTemplate ownTransaction;
  private final Set<LocalDate> known = ConcurrentHashMap.newKeySet();

  Partitions(JdbcTemplate jdbc, PlatformTransactionManager transactions) {
    this.jdbc = jdbc;
    this.ownTransaction = new TransactionTemplate(transactions);
    this.ownTransaction.setPropagationBehavior(TransactionDefinition.PROPAGATION_REQUIRES_NEW);
  }

  /** Makes sure every table has a partition for each of the days, in a transaction of its own. */
  public void ensure(Collection<LocalDate> days) {
    Set<LocalDate> missing = new TreeSet<>();
    for (LocalDate d : days) {
      if (!known.contains(d)) {
        missing.add(d);
      }
    }
    if (missing.isEmpty()) {
      return;
    }
    ownTransaction.executeWithoutResult(
        status -> {
          jdbc.queryForObject("SELECT pg_advisory_xact_lock(?)", Object.class, LOCK_KEY);
          for (LocalDate day : missing) {
            for (String table : TABLES) {
              String name = table + "_p" + day.format(SUFFIX);
              Boolean exists =
                  jdbc.queryForObject("SELECT to_regclass(?) IS NOT NULL", Boolean.class, name);
              if (!Boolean.TRUE.equals(exists)) {
                jdbc.execute(
                    "CREATE TABLE "
                        + name
                        + " PARTITION OF "
                        + table
                        + " FOR VALUES FROM ('"
                        + day
                        + " 00:00:00+00') TO ('"
                        + day.plusDays(1)
                        + " 00:00:00+00')");
                log.debug("Created partition {}", name);
              }
            }
          }
        });
    known.addAll(missing);
  }

  /** Drops whole-day partitions that end before the given day. Returns the names dropped. */
  public List<String> dropBefore(LocalDate firstKeptDay) {
    List<String> names =
        jdbc.queryForList(
            """
            SELECT c.relname FROM pg_inherits i
            JOIN pg_class c ON c.oid = i.inhrelid
            JOIN pg_class p ON p.oid = i.inhparent
            WHERE p.relname = ANY (?::text[]) AND c.relname ~ '_p[0-9]{8}$'""",
            String.class, (Object) TABLES.toArray(String[]::new));
    List<String> dropped =
        names.stream()
            .filter(
                n -> LocalDate.parse(n.substring(n.length() - 8), SUFFIX).isBefore(firstKeptDay))
            .sorted()
            .toList();
    if (!dropped.isEmpty()) {
      ownTransaction.executeWithoutResult(
          status -> {
            // dropping a partition fires no trigger: mark every in-memory copy of readings stale,
            // first, in the same transaction (heads before readings, the ingest's lock order)
            jdbc.queryForObject("SELECT invalidate_reading_heads()", Object.class);
            for (String name : dropped) {
              jdbc.execute("DROP TABLE IF EXISTS " + name);
            }
          });
      dropped.forEach(
          name -> known.remove(LocalDate.parse(name.substring(name.length() - 8), SUFFIX)));
    }
    return dropped;
  }

  static LocalDate dayOf(java.time.Instant t) {
    return LocalDate.ofInstant(t, ZoneOffset.UTC);
  }
}
