package org.kwanta.service.system;

import com.zaxxer.hikari.HikariConfig;
import com.zaxxer.hikari.HikariDataSource;
import java.io.PrintWriter;
import java.sql.Connection;
import java.sql.SQLException;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.util.Optional;
import java.util.concurrent.locks.ReentrantLock;
import java.util.function.Supplier;
import java.util.logging.Logger;
import javax.sql.DataSource;
import org.slf4j.LoggerFactory;
import org.springframework.beans.factory.DisposableBean;
import org.springframework.boot.jdbc.autoconfigure.DataSourceProperties;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.stereotype.Component;

/**
 * Where the read APIs read: the primary, or the read replica of {@link ReplicaProperties}. The one
 * place that routes reads. The read APIs ({@code ReadingHistory}, {@code Evaluations}, {@code
 * StoredSeries}) take their template from {@link #jdbc()}; it reads from the replica only inside a
 * read scope ({@link #onReplica}), which GET requests to the API and the gauge refresh open, and
 * only while the replica answers and its lag ({@link ReplicaLag}, measured at most once per {@code
 * lag-refresh}) is within {@code max-lag}. Everywhere else, ingest and every write included, the
 * same template is the primary's, so it joins the primary's transactions as before.
 *
 * <p>The replica pool is private to this class (no second {@code DataSource} bean, so Spring Boot's
 * primary datasource stays as configured). A replica that refuses a connection in a read scope
 * sends that read to the primary and is asked again at the next lag measurement.
 */
@Component
public class ReadSource implements DisposableBean {

  private static final org.slf4j.Logger LOG = LoggerFactory.getLogger(ReadSource.class);

  /** Why a read went where it went. */
  public enum Reason {
    /** No replica is configured. */
    NO_REPLICA,
    /** The replica answered with a lag within the maximum. */
    REPLICA,
    /** The replica's lag is over the maximum. */
    LAG,
    /** The replica did not answer. */
    UNREACHABLE
  }

  /**
   * One routing decision.
   *
   * @param replica whether reads go to the replica
   * @param lag the replica's measured lag, empty when not measured
   * @param reason why
   */
  public record Decision(boolean replica, Optional<Duration> lag, Reason reason) {}

  private static final Decision NO_REPLICA =
      new Decision(false, Optional.empty(), Reason.NO_REPLICA);

  private static final ThreadLocal<Boolean> READ_SCOPE = new ThreadLocal<>();

  private final DataSource primary;
  private final HikariDataSource replica;
  private final JdbcTemplate replicaJdbc;
  private final JdbcTemplate lagJdbc;
  private final ReplicaProperties properties;
  private final ReplicaLag lagMeasure;
  private final Clock clock;
  private final JdbcTemplate jdbc;
  private final ReentrantLock measuring = new ReentrantLock();
  private volatile Decision decision = NO_REPLICA;
  private volatile Instant measuredAt = Instant.MIN;

  ReadSource(
      DataSource primary,
      DataSourceProperties primaryProperties,
      ReplicaProperties properties,
      ReplicaLag lagMeasure,
      Clock clock) {
    this.primary = primary;
    this.properties = properties;
    this.lagMeasure = lagMeasure;
    this.clock = clock;
    this.replica = properties.enabled() ? pool(properties, primaryProperties) : null;
    this.replicaJdbc = replica == null ? null : new JdbcTemplate(new FallbackDataSource());
    this.lagJdbc = replica == null ? null : new JdbcTemplate(replica);
    this.jdbc = new RoutingJdbcTemplate();
    if (replica != null) {
      LOG.info(
          "Read replica configured at {} (max lag {}); ingest and writes use the primary",
          properties.url(),
          properties.maxLag());
    }
  }

  private static HikariDataSource pool(ReplicaProperties p, DataSourceProperties primary) {
    HikariConfig config = new HikariConfig();
    config.setPoolName("kwanta-replica");
    config.setJdbcUrl(p.url());
    config.setUsername(p.username().isEmpty() ? primary.getUsername() : p.username());
    config.setPassword(p.password().isEmpty() ? primary.getPassword() : p.password());
    config.setReadOnly(true);
    config.setConnectionTimeout(Math.max(250, p.connectionTimeout().toMillis()));
    config.setValidationTimeout(Math.max(250, p.connectionTimeout().toMillis()));
    // start even when the replica is down: reads then go to the primary
    config.setInitializationFailTimeout(-1);
    config.setMinimumIdle(0);
    config.setMaximumPoolSize(10);
    return new HikariDataSource(config);
  }

  /** The template of the read APIs: the replica inside a read scope when it may serve. */
  public JdbcTemplate jdbc() {
    return jdbc;
  }

  /** The JDBC URL of the replica pool exactly as handed to pgjdbc, empty without a replica. */
  public Optional<String> replicaUrl() {
    return replica == null ? Optional.empty() : Optional.of(replica.getJdbcUrl());
  }

  /**
   * Decides where reads go now: measures the replica's lag when the last measurement is older than
   * {@code lag-refresh} (one thread measures; the others take the last decision meanwhile).
   */
  public Decision decide() {
    if (replica == null) {
      return NO_REPLICA;
    }
    Instant now = clock.instant();
    if (Duration.between(measuredAt, now).compareTo(properties.lagRefresh()) >= 0
        && measuring.tryLock()) {
      try {
        decision = measure();
        measuredAt = clock.instant();
      } finally {
        measuring.unlock();
      }
    }
    return decision;
  }

  private Decision measure() {
    Decision before = decision;
    Decision now;
    try {
      Duration lag = lagMeasure.measure(lagJdbc);
      now =
          lag.compareTo(properties.maxLag()) <= 0
              ? new Decision(true, Optional.of(lag), Reason.REPLICA)
              : new Decision(false, Optional.of(lag), Reason.LAG);
    } catch (RuntimeException e) {
      now = new Decision(false, Optional.empty(), Reason.UNREACHABLE);
      if (before.reason() != Reason.UNREACHABLE) {
        LOG.warn("Read replica unreachable, reading from the primary: {}", e.getMessage());
      }
    }
    if (before.reason() != now.reason() && now.reason() != Reason.UNREACHABLE) {
      LOG.info(
          "Reads now from the {} ({}, lag {})",
          now.replica() ? "replica" : "primary",
          now.reason(),
          now.lag().map(Duration::toString).orElse("unknown"));
    }
    return now;
  }

  /**
   * Runs a read in a read scope: its read-API queries go to the replica when {@code decision} says
   * so.
   */
  public <T> T onReplica(Decision decision, Supplier<T> read) {
    if (!decision.replica()) {
      return read.get();
    }
    Boolean outer = READ_SCOPE.get();
    READ_SCOPE.set(Boolean.TRUE);
    try {
      return read.get();
    } finally {
      if (outer == null) {
        READ_SCOPE.remove();
      } else {
        READ_SCOPE.set(outer);
      }
    }
  }

  /** Runs a read in a read scope after {@link #decide()}. */
  public void onReplica(Runnable read) {
    onReplica(
        decide(),
        () -> {
          read.run();
          return null;
        });
  }

  @Override
  public void destroy() {
    if (replica != null) {
      replica.close();
    }
  }

  private void markUnreachable(SQLException e) {
    if (decision.replica()) {
      LOG.warn("Read replica refused a connection, reading from the primary: {}", e.getMessage());
    }
    decision = new Decision(false, Optional.empty(), Reason.UNREACHABLE);
    measuredAt = clock.instant();
  }

  /** The primary's template outside a read scope, the replica's inside one. */
  private final class RoutingJdbcTemplate extends JdbcTemplate {
    RoutingJdbcTemplate() {
      super(primary);
    }

    @Override
    public DataSource getDataSource() {
      return replicaJdbc != null && READ_SCOPE.get() != null
          ? replicaJdbc.getDataSource()
          : primary;
    }
  }

  /** The replica pool, falling back to a primary connection when the replica refuses one. */
  private final class FallbackDataSource implements DataSource {
    @Override
    public Connection getConnection() throws SQLException {
      try {
        return replica.getConnection();
      } catch (SQLException e) {
        markUnreachable(e);
        return primary.getConnection();
      }
    }

    @Override
    public Connection getConnection(String username, String password) throws SQLException {
      throw new SQLException("not supported: the replica pool has its own credentials");
    }

    @Override
    public PrintWriter getLogWriter() {
      return null;
    }

    @Override
    public void setLogWriter(PrintWriter out) {}

    @Override
    public void setLoginTimeout(int seconds) {}

    @Override
    public int getLoginTimeout() {
      return 0;
    }

    @Override
    public Logger getParentLogger() {
      return Logger.getLogger("org.kwanta.service.system");
    }

    @Override
    public <T> T unwrap(Class<T> iface) throws SQLException {
      if (iface.isInstance(replica)) {
        return iface.cast(replica);
      }
      throw new SQLException("not a wrapper for " + iface);
    }

    @Override
    public boolean isWrapperFor(Class<?> iface) {
      return iface.isInstance(replica);
    }
  }
}
