package org.kwanta.service.system;

import jakarta.servlet.http.HttpServletRequest;
import java.sql.SQLException;
import java.sql.SQLNonTransientConnectionException;
import java.sql.SQLTransientConnectionException;
import java.time.Duration;
import org.springframework.dao.DataAccessResourceFailureException;
import org.springframework.dao.TransientDataAccessResourceException;
import org.springframework.http.HttpStatus;
import org.springframework.http.ProblemDetail;
import org.springframework.stereotype.Component;
import org.springframework.transaction.CannotCreateTransactionException;
import org.springframework.transaction.TransactionSystemException;

/**
 * Recognises "PostgreSQL is unreachable" in an exception chain, and the 503 answer for it: the
 * client should retry later, nothing of the request was acknowledged. A failure during commit may
 * leave the outcome unknown, which is why a retried ingest must be idempotent.
 */
@Component
public class DatabaseOutage {

  private final Duration retryAfter;

  DatabaseOutage(HttpLimitsProperties limits) {
    this.retryAfter = limits.retryAfter();
  }

  /**
   * Whether this exception, or one of its causes, says the database cannot be reached. A failed
   * rollback hides the exception that made the transaction roll back: Spring throws the rollback's
   * {@link TransactionSystemException} (for a connection the pool has already closed, a bare
   * "Connection is closed" without SQLSTATE) and keeps the original as its application exception,
   * which is examined too, as are suppressed exceptions.
   */
  public static boolean isCause(Throwable e) {
    return isCause(e, 0);
  }

  private static boolean isCause(Throwable e, int depth) {
    if (depth > 4) {
      return false;
    }
    int links = 0;
    for (Throwable t = e; t != null && links < 100; t = t.getCause() == t ? null : t.getCause()) {
      links++;
      if (t instanceof DataAccessResourceFailureException
          || t instanceof TransientDataAccessResourceException
          || t instanceof CannotCreateTransactionException
          || t instanceof SQLTransientConnectionException
          || t instanceof SQLNonTransientConnectionException) {
        return true;
      }
      // SQLSTATE class 08: connection exception; 57P01-57P03: server shutting down or starting
      if (t instanceof SQLException sql && sql.getSQLState() != null) {
        String state = sql.getSQLState();
        if (state.startsWith("08") || state.startsWith("57P")) {
          return true;
        }
      }
      if (t instanceof TransactionSystemException tx
          && tx.getApplicationException() != null
          && isCause(tx.getApplicationException(), depth + 1)) {
        return true;
      }
      // a rollback that fails after a failed commit: Spring logs the commit's exception ("Commit
      // exception overridden by rollback exception") and throws only this one, with no
      // application exception; the connection is gone
      if (t instanceof TransactionSystemException tx
          && tx.getApplicationException() == null
          && t.getCause() instanceof SQLException) {
        return true;
      }
      for (Throwable suppressed : t.getSuppressed()) {
        if (isCause(suppressed, depth + 1)) {
          return true;
        }
      }
    }
    return false;
  }

  public Duration retryAfter() {
    return retryAfter;
  }

  public ProblemDetail problem(HttpServletRequest request) {
    return ProblemResponses.problem(
        HttpStatus.SERVICE_UNAVAILABLE,
        ProblemTypes.DATABASE_UNAVAILABLE,
        "Database unavailable",
        "The database cannot be reached; the request was not completed. Retry later.",
        request);
  }
}
