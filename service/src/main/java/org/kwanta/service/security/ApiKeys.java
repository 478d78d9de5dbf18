package org.kwanta.service.security;

import java.sql.ResultSet;
import java.sql.SQLException;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ConcurrentHashMap;
import org.kwanta.service.audit.AuditLog;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Repository;
import org.springframework.transaction.annotation.Transactional;

/** API keys in PostgreSQL: only salts and hashes of the secrets are stored. */
@Repository
public class ApiKeys {

  /** last_used_at is written at most this often per key, so reads do not turn into writes. */
  private static final long LAST_USED_RESOLUTION_MILLIS = 60_000;

  private final JdbcClient jdbc;
  private final AuditLog audit;
  private final Map<String, Long> lastUsedWritten = new ConcurrentHashMap<>();

  ApiKeys(JdbcClient jdbc, AuditLog audit) {
    this.jdbc = jdbc;
    this.audit = audit;
  }

  /** Stores a new key and returns it with its secret, which is not kept anywhere. */
  @Transactional
  public Created create(String name, Role role) {
    ApiKeyToken token = ApiKeyToken.generate();
    while (exists(token.id())) {
      token = ApiKeyToken.generate();
    }
    return new Created(insert(token, name, role), token.text());
  }

  ApiKey insert(ApiKeyToken token, String name, Role role) {
    byte[] salt = ApiKeyToken.newSalt();
    ApiKey created =
        jdbc.sql(
                """
            INSERT INTO api_key (id, name, role, secret_salt, secret_hash) VALUES (?, ?, ?, ?, ?)
            RETURNING id, name, role, created_at, revoked_at, last_used_at""")
            .params(token.id(), name, role.code(), salt, token.hash(salt))
            .query(ApiKeys::row)
            .single();
    audit.record("api-key.create", "api-key", created.id(), null, created);
    return created;
  }

  boolean exists(String id) {
    return jdbc.sql("SELECT count(*) FROM api_key WHERE id = ?")
            .param(id)
            .query(Long.class)
            .single()
        > 0;
  }

  public List<ApiKey> list() {
    return jdbc.sql(
            "SELECT id, name, role, created_at, revoked_at, last_used_at FROM api_key ORDER BY"
                + " created_at, id")
        .query(ApiKeys::row)
        .list();
  }

  public Optional<ApiKey> find(String id) {
    return jdbc.sql(
            "SELECT id, name, role, created_at, revoked_at, last_used_at FROM api_key WHERE id = ?")
        .param(id)
        .query(ApiKeys::row)
        .optional();
  }

  /** Number of admin keys not revoked. */
  long activeAdmins() {
    return jdbc.sql("SELECT count(*) FROM api_key WHERE role = 'admin' AND revoked_at IS NULL")
        .query(Long.class)
        .single();
  }

  /**
   * Revokes a key (the row stays, with its revocation time). Refuses to revoke the last active
   * admin key, which would lock everyone out.
   *
   * @return the key after revocation, empty if there is no such key
   * @throws LastAdminKeyException when the key is the last active admin key
   */
  @Transactional
  public Optional<ApiKey> revoke(String id) {
    lockKeyTable();
    Optional<ApiKey> key = find(id);
    if (key.isEmpty() || key.get().revokedAt() != null) {
      return key;
    }
    if (key.get().role() == Role.ADMIN && activeAdmins() <= 1) {
      throw new LastAdminKeyException(id);
    }
    jdbc.sql("UPDATE api_key SET revoked_at = now() WHERE id = ?").param(id).update();
    Optional<ApiKey> revoked = find(id);
    audit.record("api-key.revoke", "api-key", id, key.get(), revoked.orElse(null));
    return revoked;
  }

  /** The active key this text names, or empty when it is malformed, unknown, wrong or revoked. */
  Optional<ApiKey> authenticate(String text) {
    Optional<ApiKeyToken> token = ApiKeyToken.parse(text);
    if (token.isEmpty()) {
      return Optional.empty();
    }
    Optional<Stored> stored =
        jdbc.sql(
                "SELECT id, name, role, created_at, revoked_at, last_used_at, secret_salt,"
                    + " secret_hash FROM api_key WHERE id = ?")
            .param(token.get().id())
            .query((rs, i) -> new Stored(row(rs, i), rs.getBytes(7), rs.getBytes(8)))
            .optional();
    if (stored.isEmpty()
        || stored.get().key().revokedAt() != null
        || !token.get().matches(stored.get().salt(), stored.get().hash())) {
      return Optional.empty();
    }
    touch(stored.get().key().id());
    return Optional.of(stored.get().key());
  }

  private void touch(String id) {
    long now = System.currentTimeMillis();
    Long last = lastUsedWritten.get(id);
    if (last == null || now - last > LAST_USED_RESOLUTION_MILLIS) {
      lastUsedWritten.put(id, now);
      jdbc.sql("UPDATE api_key SET last_used_at = now() WHERE id = ?").param(id).update();
    }
  }

  /**
   * Serializes key administration across instances sharing the database (first-start bootstrap,
   * revocation of admin keys), for the current transaction.
   */
  void lockKeyTable() {
    jdbc.sql("SELECT pg_advisory_xact_lock(hashtext('kwanta.api_key'))").query().singleRow();
  }

  private static ApiKey row(ResultSet rs, int rowNum) throws SQLException {
    return new ApiKey(
        rs.getString("id"),
        rs.getString("name"),
        Role.fromCode(rs.getString("role")),
        instant(rs.getObject("created_at", OffsetDateTime.class)),
        instant(rs.getObject("revoked_at", OffsetDateTime.class)),
        instant(rs.getObject("last_used_at", OffsetDateTime.class)));
  }

  private static Instant instant(OffsetDateTime t) {
    return t == null ? null : t.toInstant();
  }

  private record Stored(ApiKey key, byte[] salt, byte[] hash) {}

  /**
   * A stored key, without its secret.
   *
   * @param revokedAt null while the key is active
   * @param lastUsedAt last successful use, to the minute; null if never used
   */
  public record ApiKey(
      String id,
      String name,
      Role role,
      Instant createdAt,
      Instant revokedAt,
      Instant lastUsedAt) {}

  /**
   * A key just created.
   *
   * @param key the full key: shown once, in this response, and never again
   */
  public record Created(ApiKey stored, String key) {}

  /** Revoking the last active admin key would leave nobody able to administer the service. */
  public static final class LastAdminKeyException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    LastAdminKeyException(String id) {
      super(
          "Key '"
              + id
              + "' is the last active admin key; create another admin key before revoking it");
    }
  }
}
