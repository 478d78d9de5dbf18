package org.kwanta.service.system;

import com.zaxxer.hikari.HikariDataSource;
import javax.sql.DataSource;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.boot.context.event.ApplicationReadyEvent;
import org.springframework.context.event.EventListener;
import org.springframework.core.env.Environment;
import org.springframework.stereotype.Component;

/** One line at start: where the service listens, which database it uses, and the health URL. */
@Component
class StartupLog {

  private static final Logger log = LoggerFactory.getLogger(StartupLog.class);

  private final Environment environment;
  private final DataSource dataSource;

  StartupLog(Environment environment, DataSource dataSource) {
    this.environment = environment;
    this.dataSource = dataSource;
  }

  @EventListener(ApplicationReadyEvent.class)
  void ready() {
    String port = environment.getProperty("local.server.port", "8080");
    String base = "http://localhost:" + port;
    log.info(
        "Kwanta listening on {} | database {} ({}) | health {}/actuator/health | API docs {}/swagger-ui.html",
        base,
        databaseUrl(),
        environment.getProperty("spring.datasource.url", "").isEmpty() ? "embedded" : "configured",
        base,
        base);
  }

  private String databaseUrl() {
    if (dataSource instanceof HikariDataSource hikari) {
      return hikari.getJdbcUrl();
    }
    return dataSource.getClass().getSimpleName();
  }
}
