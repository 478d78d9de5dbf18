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

  /** The Spring Security authorities a key of this role holds: admin holds all three. */
  List<GrantedAuthority> authorities() {
    List<Role> held = this == ADMIN ? List.of(ADMIN, READ, INGEST) : List.of(this);
    return held.stream()
        .<GrantedAuthority>map(r -> new SimpleGrantedAuthority("ROLE_" + r.name()))
        .toList();
  }
}
