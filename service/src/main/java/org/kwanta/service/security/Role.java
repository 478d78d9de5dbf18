package org.kwanta.service.security;

import com.fasterxml.jackson.annotation.JsonProperty;
import java.util.List;
import java.util.Locale;
import org.springframework.security.core.GrantedAuthority;
import org.springframework.security.core.authority.SimpleGrantedAuthority;

/**
 * What a key may do. {@code admin} includes {@code read} and {@code ingest}; {@code ingest} and
 * {@code read} are separate, so a historian's key cannot read and a dashboard's key cannot write.
 */
public enum Role {
  /** Post readings only: plant historians. */
  @JsonProperty("ingest")
  INGEST,
  /** Queries, state, excursions, calculations, the Prometheus scrape: chemists, dashboards. */
  @JsonProperty("read")
  READ,
  /**
   * What read may, and the chemistry record: acknowledge excursions, set and withdraw limits (with
   * a reason, in force from now or later), read the audit log. Not keys, not the plant registry.
   */
  @JsonProperty("chemist")
  CHEMIST,
  /** Everything: configuration, limits, keys, acknowledgements; also reads and ingests. */
  @JsonProperty("admin")
  ADMIN;

  /** The name in the database and in JSON. */
  public String code() {
    return name().toLowerCase(Locale.ROOT);
  }

  public static Role fromCode(String code) {
    return valueOf(code.toUpperCase(Locale.ROOT));
  }

  /**
   * The Spring Security authorities a key of this role holds: admin holds all four, chemist holds
   * read too.
   */
  List<GrantedAuthority> authorities() {
    List<Role> held =
        switch (this) {
          case ADMIN -> List.of(ADMIN, CHEMIST, READ, INGEST);
          case CHEMIST -> List.of(CHEMIST, READ);
          default -> List.of(this);
        };
    return held.stream()
        .<GrantedAuthority>map(r -> new SimpleGrantedAuthority("ROLE_" + r.name()))
        .toList();
  }
}
