package org.kwanta.service.security;

import java.util.Optional;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.boot.ApplicationArguments;
import org.springframework.boot.ApplicationRunner;
import org.springframework.core.annotation.Order;
import org.springframework.stereotype.Component;
import org.springframework.transaction.annotation.Transactional;

/**
 * The first admin key. With {@code KWANTA_ADMIN_KEY} set, its hash is stored at start unless that
 * key id is stored already. Without it, when no active admin key exists (the first start), a key is
 * generated and printed once in the log; later starts print nothing. An advisory lock keeps two
 * instances starting together on one database from both generating one.
 */
@Component
@Order(0)
class AdminKeyBootstrap implements ApplicationRunner {

  static final String FROM_ENVIRONMENT = "admin (KWANTA_ADMIN_KEY)";
  static final String GENERATED = "admin (generated at first start)";
  private static final Logger log = LoggerFactory.getLogger(AdminKeyBootstrap.class);

  private final ApiKeys keys;
  private final ApiKeyProperties properties;

  AdminKeyBootstrap(ApiKeys keys, ApiKeyProperties properties) {
    this.keys = keys;
    this.properties = properties;
  }

  @Override
  @Transactional
  public void run(ApplicationArguments args) {
    keys.lockKeyTable();
    String configured = properties.adminKey();
    if (configured != null && !configured.isBlank()) {
      installConfigured(configured);
    } else if (keys.activeAdmins() == 0) {
      ApiKeyToken token = ApiKeyToken.generate();
      keys.insert(token, GENERATED, Role.ADMIN);
      log.warn(
          """

          ==========================================================================================
          No admin key existed, so one was generated. It is shown now and never again:

              {}

          Send it as 'Authorization: Bearer <key>' or 'X-API-Key: <key>'. Create further keys with
          POST /api/v1/keys. To choose the admin key yourself, set KWANTA_ADMIN_KEY instead.
          ==========================================================================================""",
          token.text());
    }
  }

  private void installConfigured(String configured) {
    ApiKeyToken token =
        ApiKeyToken.parse(configured)
            .orElseThrow(
                () ->
                    new IllegalStateException(
                        "KWANTA_ADMIN_KEY must read kw_<id>_<secret>: an id of 1 to 32 lower-case"
                            + " letters and digits, and a secret of at least 32 characters A-Z a-z"
                            + " 0-9 _ - (for example kw_ops_ followed by `openssl rand -hex 32`)"));
    Optional<ApiKeys.ApiKey> stored = keys.find(token.id());
    if (stored.isEmpty()) {
      keys.insert(token, FROM_ENVIRONMENT, Role.ADMIN);
      log.info("Stored the admin key from KWANTA_ADMIN_KEY as key id '{}'", token.id());
      return;
    }
    ApiKeys.ApiKey key = stored.get();
    if (key.role() != Role.ADMIN || keys.authenticate(token.text()).isEmpty()) {
      if (key.revokedAt() != null) {
        log.warn(
            "KWANTA_ADMIN_KEY names key id '{}', which was revoked at {}; it stays revoked",
            token.id(),
            key.revokedAt());
        return;
      }
      throw new IllegalStateException(
          "KWANTA_ADMIN_KEY names key id '"
              + token.id()
              + "', which is stored with a different secret or role; choose another id");
    }
  }
}
