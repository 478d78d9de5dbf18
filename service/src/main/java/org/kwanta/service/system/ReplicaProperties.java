package org.kwanta.service.system;

import java.time.Duration;
import org.springframework.boot.context.properties.ConfigurationProperties;
import org.springframework.boot.context.properties.bind.DefaultValue;

/**
 * The optional read replica ({@code kwanta.replica.*}): with a URL, the read APIs answer GET
 * requests and refresh the sample gauges from it while its lag stays within {@code max-lag}; ingest
 * and every write use the primary ({@code spring.datasource.*}). The URL goes to pgjdbc unchanged,
 * so it may name several hosts ({@code
 * jdbc:postgresql://h1,h2/kwanta?targetServerType=preferSecondary}).
 *
 * @param url the replica's JDBC URL; empty (default) reads everything from the primary
 * @param username the replica's user; empty takes {@code spring.datasource.username}
 * @param password the replica's password; empty takes {@code spring.datasource.password}
 * @param maxLag the largest lag the replica may have and still serve reads (default 5 s)
 * @param lagRefresh how long one lag measurement is reused (default 1 s)
 * @param connectionTimeout how long a read waits for a replica connection before falling back to
 *     the primary (default 1 s)
 */
@ConfigurationProperties("kwanta.replica")
public record ReplicaProperties(
    @DefaultValue("") String url,
    @DefaultValue("") String username,
    @DefaultValue("") String password,
    @DefaultValue("PT5S") Duration maxLag,
    @DefaultValue("PT1S") Duration lagRefresh,
    @DefaultValue("PT1S") Duration connectionTimeout) {

  /** Whether a replica is configured. */
  public boolean enabled() {
    return url != null && !url.isBlank();
  }
}
