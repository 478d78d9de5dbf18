package org.kwanta.service.system;

import com.zaxxer.hikari.HikariConfig;
import com.zaxxer.hikari.HikariDataSource;
import io.zonky.test.db.postgres.embedded.EmbeddedPostgres;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.sql.Connection;
import java.sql.SQLException;
import java.sql.Statement;
import javax.sql.DataSource;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.boot.autoconfigure.condition.ConditionalOnExpression;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/**
 * Starts an embedded PostgreSQL server when no datasource URL is configured (property {@code
 * spring.datasource.url} or environment variable {@code SPRING_DATASOURCE_URL}). With a URL, Spring
 * Boot's own datasource configuration applies and this class does nothing.
 *
 * <p>The server listens on 127.0.0.1 only and asks every connection for the password of {@link
 * EmbeddedDatabasePassword} (initdb's default trusts any local user).
 */
@Configuration(proxyBeanMethods = false)
@ConditionalOnExpression("'${spring.datasource.url:}'.isEmpty()")
class EmbeddedDatabaseConfiguration {

  private static final Logger log = LoggerFactory.getLogger(EmbeddedDatabaseConfiguration.class);

  /** The embedded server and the password of its {@code postgres} user. */
  record EmbeddedServer(EmbeddedPostgres postgres, String password) implements AutoCloseable {
    @Override
    public void close() throws IOException {
      postgres.close();
    }
  }

  @Bean(destroyMethod = "close")
  EmbeddedServer embeddedPostgres(EmbeddedDatabaseProperties properties)
      throws IOException, SQLException {
    Path dataDirectory = Path.of(properties.dataDirectory()).toAbsolutePath().normalize();
    Files.createDirectories(dataDirectory);
    String password = EmbeddedDatabasePassword.readOrCreate(dataDirectory);
    log.info("Starting embedded PostgreSQL with data in {}", dataDirectory);
    EmbeddedPostgres postgres =
        EmbeddedPostgres.builder()
            .setDataDirectory(dataDirectory)
            .setCleanDataDirectory(false)
            // Stopped by this bean's close(), after the web server has finished in-flight requests
            // and the pool is closed; a JVM shutdown hook of its own would stop it while requests
            // are
            // still running.
            .setRegisterShutdownHook(false)
            .setPort(properties.port())
            .setServerConfig("max_connections", "100")
            // also the start-up check's connection: it gives the password once the server asks
            .setConnectConfig("password", password)
            .start();
    try {
      requirePassword(postgres, dataDirectory, password);
    } catch (IOException | SQLException | RuntimeException e) {
      postgres.close();
      throw e;
    }
    return new EmbeddedServer(postgres, password);
  }

  /**
   * Sets the {@code postgres} user's password and, while pg_hba.conf still trusts local connections
   * (a fresh cluster, or one made by an earlier version), makes the server ask for it.
   */
  private static void requirePassword(
      EmbeddedPostgres postgres, Path dataDirectory, String password)
      throws IOException, SQLException {
    if (!EmbeddedDatabasePassword.needsHba(dataDirectory)) {
      return;
    }
    try (Connection c = postgres.getPostgresDatabase().getConnection();
        Statement s = c.createStatement()) {
      // hex digits only (EmbeddedDatabasePassword), so the literal needs no quoting beyond this
      s.execute("ALTER ROLE postgres PASSWORD '" + password + "'");
      EmbeddedDatabasePassword.writeHba(dataDirectory);
      s.execute("SELECT pg_reload_conf()");
    }
    log.info(
        "Embedded PostgreSQL now asks every connection for the password in {}",
        EmbeddedDatabasePassword.file(dataDirectory));
  }

  @Bean(destroyMethod = "close")
  DataSource dataSource(EmbeddedServer server) {
    HikariConfig config = new HikariConfig();
    config.setPoolName("kwanta");
    config.setJdbcUrl(server.postgres().getJdbcUrl("postgres", "postgres"));
    config.setUsername("postgres");
    config.setPassword(server.password());
    config.setMaximumPoolSize(10);
    config.setConnectionTimeout(5_000); // while PostgreSQL is down: 503 after 5 s, not 30 s
    return new HikariDataSource(config);
  }
}
