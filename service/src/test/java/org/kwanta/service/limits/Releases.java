package org.kwanta.service.limits;

import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.List;
import org.flywaydb.core.Flyway;
import org.kwanta.service.KwantaApplication;
import org.kwanta.service.support.Http;
import org.kwanta.service.support.TestDatabase;
import org.kwanta.service.support.TestKeys;
import org.springframework.boot.builder.SpringApplicationBuilder;
import org.springframework.boot.web.server.context.WebServerApplicationContext;
import org.springframework.context.ConfigurableApplicationContext;

/**
 * Releases of the service started one after another on a migrated scratch database of their own, as
 * an upgrade meets an installation: each release may bring another shipped defaults file. Closing
 * stops every release still running and drops the database.
 */
final class Releases implements AutoCloseable {

  private final String url;
  private final List<ConfigurableApplicationContext> running = new ArrayList<>();

  /** A new scratch database, migrated, named after {@code name}. */
  Releases(String name) throws java.sql.SQLException {
    TestDatabase db = TestDatabase.get();
    url = db.createScratchDatabase(name);
    Flyway.configure()
        .dataSource(url, db.user(), db.password())
        .locations("classpath:db/migration")
        .load()
        .migrate();
  }

  /** Runs one SQL statement on the database (for example to record an earlier activation). */
  void sql(String statement) throws Exception {
    TestDatabase db = TestDatabase.get();
    try (Connection c = DriverManager.getConnection(url, db.user(), db.password());
        Statement s = c.createStatement()) {
      s.execute(statement);
    }
  }

  /** Starts a release with the given defaults file (null: this build's) and the admin key. */
  Http start(String defaultsFile) {
    TestDatabase db = TestDatabase.get();
    List<String> args = new ArrayList<>();
    args.add("--server.port=0");
    args.add("--spring.datasource.url=" + url);
    args.add("--spring.datasource.username=" + db.user());
    args.add("--spring.datasource.password=" + db.password());
    args.add("--" + TestKeys.ADMIN_KEY_PROPERTY + "=" + TestKeys.ADMIN);
    args.add("--kwanta.demo.load-plant=false");
    if (defaultsFile != null) {
      args.add("--kwanta.limits.defaults=" + defaultsFile);
    }
    ConfigurableApplicationContext context =
        new SpringApplicationBuilder(KwantaApplication.class).run(args.toArray(String[]::new));
    running.add(context);
    return Http.admin(((WebServerApplicationContext) context).getWebServer().getPort());
  }

  /** Stops the release started first that still runs (before the next one starts). */
  void stopOldest() {
    running.remove(0).close();
  }

  @Override
  public void close() throws java.sql.SQLException {
    for (ConfigurableApplicationContext c : running) {
      c.close();
    }
    TestDatabase.get().dropDatabase(url);
  }
}
