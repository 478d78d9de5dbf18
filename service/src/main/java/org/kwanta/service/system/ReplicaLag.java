package org.kwanta.service.system;

import java.time.Duration;
import java.time.temporal.ChronoUnit;
import org.springframework.jdbc.core.JdbcTemplate;

/**
 * Measures how far a replica's data is behind the primary. The bean is replaceable (tests inject a
 * lag); the default is {@link #REPLAY}.
 */
@FunctionalInterface
public interface ReplicaLag {

  /**
   * The replica's lag; throws (a {@code DataAccessException}) when the replica cannot be asked.
   *
   * @param replica a template on the replica
   */
  Duration measure(JdbcTemplate replica);

  /**
   * Zero on a server that is not in recovery (a promoted replica, or a primary named as replica);
   * zero on a standby that has replayed all the WAL it received (an idle primary sends no new
   * transactions, so the age of the last replayed one is no lag); otherwise the age of the last
   * replayed transaction, {@code now() - pg_last_xact_replay_timestamp()}, in microseconds.
   */
  String REPLAY_LAG_SQL =
      """
      SELECT CASE
        WHEN NOT pg_is_in_recovery() THEN 0
        WHEN pg_last_wal_receive_lsn() = pg_last_wal_replay_lsn() THEN 0
        ELSE coalesce((extract(epoch FROM now() - pg_last_xact_replay_timestamp()) * 1e6)::bigint,
                      9223372036854775807)
      END""";

  /** The replay lag of {@link #REPLAY_LAG_SQL}. */
  ReplicaLag REPLAY =
      replica -> {
        Long micros = replica.queryForObject(REPLAY_LAG_SQL, Long.class);
        return Duration.of(Math.max(0L, micros), ChronoUnit.MICROS);
      };
}
