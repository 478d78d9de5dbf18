package org.kwanta.service.security;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.nio.file.attribute.PosixFilePermissions;
import java.util.Optional;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.boot.ApplicationArguments;
import org.springframework.boot.ApplicationRunner;
import org.springframework.core.annotation.Order;
import org.springframework.stereotype.Component;
import org.springframework.transaction.annotation.Transactional;

/**
 * The metrics scraper's {@code read} key, from the file named by {@code KWANTA_SCRAPE_KEY_FILE}
 * ({@code kwanta.security.scrape-key-file}), so that Prometheus can read the same file with {@code
 * authorization: credentials_file:} and no one has to copy a key by hand.
 *
 * <ul>
 *   <li>The file exists (a mounted Kubernetes Secret, a file of your own): its key is stored with
 *       the read role unless that key id is stored already. A stored id with another secret or role
 *       refuses the start (choose a new id to rotate); a revoked one stays revoked.
 *   <li>It does not exist (docker compose's shared volume, {@code check-alert.sh}): a key is
 *       generated, written there (readable by the scraper's user: mode 0644 in a directory only the
 *       service and the scraper mount) and stored. The secret is never logged.
 * </ul>
 */
@Component
@Order(1)
class ScrapeKeyBootstrap implements ApplicationRunner {

  static final String NAME = "prometheus scrape (KWANTA_SCRAPE_KEY_FILE)";
  private static final Logger log = LoggerFactory.getLogger(ScrapeKeyBootstrap.class);

  private final ApiKeys keys;
  private final ApiKeyProperties properties;

  ScrapeKeyBootstrap(ApiKeys keys, ApiKeyProperties properties) {
    this.keys = keys;
    this.properties = properties;
  }

  @Override
  @Transactional
  public void run(ApplicationArguments args) {
    String configured = properties.scrapeKeyFile();
    if (configured == null || configured.isBlank()) {
      return;
    }
    Path file = Path.of(configured.trim());
    keys.lockKeyTable();
    ApiKeyToken token = Files.exists(file) ? read(file) : generateInto(file);
    Optional<ApiKeys.ApiKey> stored = keys.find(token.id());
    if (stored.isEmpty()) {
      keys.insert(token, NAME, Role.READ);
      log.info("Stored the scrape key of {} (read role) as key id '{}'", file, token.id());
      return;
    }
    ApiKeys.ApiKey key = stored.get();
    if (key.revokedAt() != null) {
      log.warn(
          "The scrape key in {} (key id '{}') was revoked at {}; it stays revoked, so scrapes get"
              + " 401: put a new key in the file",
          file,
          token.id(),
          key.revokedAt());
    } else if (key.role() != Role.READ || keys.authenticate(token.text()).isEmpty()) {
      throw new IllegalStateException(
          "The scrape key in "
              + file
              + " names key id '"
              + token.id()
              + "', which is stored with a different secret or role; choose another id");
    }
  }

  private static ApiKeyToken read(Path file) {
    try {
      return ApiKeyToken.parse(Files.readString(file, StandardCharsets.UTF_8))
          .orElseThrow(
              () ->
                  new IllegalStateException(
                      "The scrape key file "
                          + file
                          + " must hold one key kw_<id>_<secret>: an id of 1 to 32 lower-case"
                          + " letters and digits, and a secret of at least 32 characters A-Z a-z"
                          + " 0-9 _ - (for example kw_prometheus_ followed by `openssl rand -hex"
                          + " 32`)"));
    } catch (IOException e) {
      throw new UncheckedIOException("Cannot read the scrape key file " + file, e);
    }
  }

  private static ApiKeyToken generateInto(Path file) {
    ApiKeyToken token = ApiKeyToken.generate();
    try {
      Files.writeString(
          file,
          token.text() + "\n",
          StandardCharsets.UTF_8,
          StandardOpenOption.CREATE_NEW,
          StandardOpenOption.WRITE);
      if (file.getFileSystem().supportedFileAttributeViews().contains("posix")) {
        Files.setPosixFilePermissions(file, PosixFilePermissions.fromString("rw-r--r--"));
      }
    } catch (FileAlreadyExistsException e) {
      // another instance sharing the file wrote it first: use that one
      return read(file);
    } catch (IOException e) {
      throw new UncheckedIOException(
          "The scrape key file " + file + " does not exist and cannot be written", e);
    }
    log.info("Generated a scrape key (read role) into {}", file);
    return token;
  }
}
