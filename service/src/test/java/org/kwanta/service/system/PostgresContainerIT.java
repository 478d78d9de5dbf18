package org.kwanta.service.system;

import static org.assertj.core.api.Assertions.assertThat;

import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.ResultSet;
import org.flywaydb.core.Flyway;
import org.junit.jupiter.api.Test;
import org.testcontainers.junit.jupiter.Container;
import org.testcontainers.junit.jupiter.Testcontainers;
import org.testcontainers.postgresql.PostgreSQLContainer;

/**
 * The migrations on a PostgreSQL 15 container, where Docker is available. Without a Docker engine
 * (as on the project's build machines) this class is skipped, cleanly and visibly; the other
 * database tests still run on the embedded server.
 */
@Testcontainers(disabledWithoutDocker = true)
class PostgresContainerIT {

  @Container
  static final PostgreSQLContainer POSTGRES = new PostgreSQLContainer("postgres:15-alpine");

  @Test
  void migrationsApplyOnAContainer() throws Exception {
    Flyway.configure()
        .dataSource(POSTGRES.getJdbcUrl(), POSTGRES.getUsername(), POSTGRES.getPassword())
        .locations("classpath:db/migration")
        .load()
        .migrate();
    try (Connection c =
            DriverManager.getConnection(
                POSTGRES.getJdbcUrl(), POSTGRES.getUsername(), POSTGRES.getPassword());
        ResultSet rs =
            c.createStatement().executeQuery("SELECT count(*) FROM flyway_schema_history")) {
      rs.next();
      assertThat(rs.getInt(1)).isPositive();
    }
  }
}
