package org.kwanta.service.limits;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.boot.context.event.ApplicationReadyEvent;
import org.springframework.context.event.EventListener;
import org.springframework.core.io.ClassPathResource;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Component;

/**
 * The versions of the shipped default limits and from when each was in force in this database
 * (table {@code limit_defaults_activation}). The first time a service runs with a defaults file of
 * another version than the last one recorded, that version is recorded as in force from then on;
 * earlier times keep the version that was in force then, read from {@code
 * limits/defaults-v<version>.yaml} on the class path. The first activation also covers every
 * earlier time. A database migrated without readings starts with no activation (V54), so in a new
 * installation the version of the first start judges everything, a historian's backfill included; a
 * database that held data when limits became versions (V35) keeps version 1 before its upgrade.
 */
@Component
class DefaultLimitVersions {

  /** From when a version of the defaults is in force. */
  record Activation(int version, Instant from) {}

  private static final Logger LOG = LoggerFactory.getLogger(DefaultLimitVersions.class);

  private final JdbcClient jdbc;
  private final LimitCatalog current;
  private final Map<Integer, LimitCatalog> catalogs = new ConcurrentHashMap<>();
  private volatile boolean registered;

  DefaultLimitVersions(JdbcClient jdbc, LimitCatalog current) {
    this.jdbc = jdbc;
    this.current = current;
    catalogs.put(current.version(), current);
  }

  /**
   * Records the configured defaults' version at start, so that it is in force from the start of the
   * release that brought it. If the database cannot be reached now, the first request does it.
   */
  @EventListener(ApplicationReadyEvent.class)
  void registerAtStart() {
    try {
      register();
    } catch (RuntimeException e) {
      LOG.warn("Could not record the default limits' version at start; will on first use", e);
    }
  }

  /** The activations, oldest first; never empty (this build's version is recorded first). */
  List<Activation> activations() {
    if (!registered) {
      register();
    }
    return jdbc.sql("SELECT version, effective_from FROM limit_defaults_activation ORDER BY id")
        .query((rs, i) -> new Activation(rs.getInt(1), rs.getTimestamp(2).toInstant()))
        .list();
  }

  private synchronized void register() {
    if (registered) {
      return;
    }
    // Two instances starting at once may both record the version: harmless, the same version twice.
    jdbc.sql(
            """
              INSERT INTO limit_defaults_activation (version)
              SELECT ? WHERE (SELECT version FROM limit_defaults_activation ORDER BY id DESC LIMIT 1)
                             IS DISTINCT FROM ?""")
        .params(current.version(), current.version())
        .update();
    registered = true;
  }

  /**
   * The catalog of a version: the configured one, or {@code limits/defaults-v<version>.yaml}.
   *
   * @throws IllegalStateException when that version's file is no longer on the class path (the past
   *     cannot be judged as it was reported without it)
   */
  LimitCatalog catalog(int version) {
    return catalogs.computeIfAbsent(version, DefaultLimitVersions::load);
  }

  private static LimitCatalog load(int version) {
    String resource = "limits/defaults-v" + version + ".yaml";
    ClassPathResource file = new ClassPathResource(resource);
    if (!file.exists()) {
      throw new IllegalStateException(
          "Default limits version "
              + version
              + " were in force in this database, but "
              + resource
              + " is not on the class path: keep every released defaults file");
    }
    try (InputStream in = file.getInputStream()) {
      LimitCatalog catalog = LimitCatalog.read(in);
      if (catalog.version() != version) {
        throw new IllegalStateException(resource + " says it is version " + catalog.version());
      }
      return catalog;
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }
}
