package org.kwanta.service.system;

import static org.assertj.core.api.Assertions.assertThat;

import java.sql.SQLException;
import org.junit.jupiter.api.Test;
import org.springframework.dao.DataAccessResourceFailureException;
import org.springframework.dao.DataIntegrityViolationException;
import org.springframework.transaction.TransactionSystemException;

/**
 * Which failures are a database outage (503 + Retry-After, no retry on the plain path). The chains
 * are the ones seen when PostgreSQL terminated the service's connections mid-ingest ({@code
 * TerminatedConnectionsIT}).
 */
class DatabaseOutageTest {

  /** PostgreSQL's FATAL for pg_terminate_backend, as Spring translates it. */
  private static DataAccessResourceFailureException terminated() {
    return new DataAccessResourceFailureException(
        "PreparedStatementCallback; FATAL: terminating connection due to administrator command",
        new SQLException("FATAL: terminating connection due to administrator command", "57P01"));
  }

  /** Spring's rollback failure on a connection the pool has closed (no SQLSTATE). */
  private static TransactionSystemException rollbackFailed(Throwable application) {
    TransactionSystemException e =
        new TransactionSystemException(
            "JDBC rollback failed", new SQLException("Connection is closed"));
    if (application != null) {
      e.initApplicationException(application);
    }
    return e;
  }

  @Test
  void rollbackFailureHidingAConnectionFailureIsAnOutage() {
    assertThat(DatabaseOutage.isCause(rollbackFailed(terminated()))).isTrue();
  }

  @Test
  void rollbackFailureHidingAConnectionFailureDeeperInTheChainIsAnOutage() {
    RuntimeException wrapped = new IllegalStateException("evaluating", terminated());
    assertThat(DatabaseOutage.isCause(new RuntimeException(rollbackFailed(wrapped)))).isTrue();
  }

  @Test
  void suppressedConnectionFailureIsAnOutage() {
    RuntimeException e = new IllegalStateException("closing");
    e.addSuppressed(new SQLException("An I/O error occurred", "08006"));
    assertThat(DatabaseOutage.isCause(e)).isTrue();
  }

  /**
   * A commit that failed because the connection was terminated, then a rollback that failed too:
   * Spring logs the commit's exception and throws the rollback's alone, without an application
   * exception (seen once in 121 terminations in TerminatedConnectionsIT).
   */
  @Test
  void rollbackFailureAfterAFailedCommitIsAnOutage() {
    assertThat(DatabaseOutage.isCause(rollbackFailed(null))).isTrue();
  }

  @Test
  void rollbackFailureHidingABugOrAConstraintIsNotAnOutage() {
    assertThat(DatabaseOutage.isCause(rollbackFailed(new IllegalStateException("bug")))).isFalse();
    assertThat(
            DatabaseOutage.isCause(
                rollbackFailed(
                    new DataIntegrityViolationException(
                        "duplicate", new SQLException("duplicate key", "23505")))))
        .isFalse();
  }

  @Test
  void selfReferencingAndCyclicChainsEnd() {
    TransactionSystemException a =
        new TransactionSystemException("JDBC rollback failed", new IllegalStateException("bug"));
    TransactionSystemException b = rollbackFailed(a);
    a.initApplicationException(b);
    assertThat(DatabaseOutage.isCause(a)).isFalse();
  }
}
