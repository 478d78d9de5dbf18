package org.kwanta.service.system;

import com.zaxxer.hikari.HikariConfig;
import com.zaxxer.hikari.HikariDataSource;
import io.zonky.test.db.postgres.embedded.EmbeddedPostgres;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
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
 */
@Configuration(proxyBeanMethods = false)
@ConditionalOnExpression("'${spring.datasource.url:}'.isEmpty()")
class EmbeddedDatabaseConfiguration {

  private static final Logger log = LoggerFactory.getLogger(EmbeddedDatabaseConfiguration.class);

  @Bean(destroyMethod = "close")
  EmbeddedPostgres embeddedPostgres(EmbeddedDatabaseProperties properties) throws IOException {
    Path dataDirectory = Path.of(properties.dataDirectory()).toAbsolutePath().normalize();
    Files.createDirectories(dataDirectory);
    log.info("Starting embedded PostgreSQL with data in {}", dataDirectory);
    return EmbeddedPostgres.builder()
        .setDataDirectory(dataDirectory)
        .setCleanDataDirectory(false)
        // Stopped by this bean's close(), after the web server has finished in-flight requests and
        // the pool
        // is closed; a JVM shutdown hook of its own would stop it while requests are still running.
        .setRegisterShutdownHook(false)
        .setPort(properties.port())
        .setServerConfig("max_connections", "100")
        .start();
  }

  @Bean(destroyMethod = "close")
  DataSource dataSource(EmbeddedPostgres postgres) {
    HikariConfig config = new HikariConfig();
    config.setPoolName("kwanta");
    config.setJdbcUrl(postgres.getJdbcUrl("postgres", "postgres"));
    config.setUsername("postgres");
    config.setMaximumPoolSize(10);
    config.setConnectionTimeout(5_000); // while PostgreSQL is down: 503 after 5 s, not 30 s
    return new HikariDataSource(config);
  }
}
