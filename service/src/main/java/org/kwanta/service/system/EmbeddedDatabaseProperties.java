package org.kwanta.service.system;

import org.springframework.boot.context.properties.ConfigurationProperties;

/**
 * The zero-setup database: a real PostgreSQL server (binaries from Maven Central) started by the
 * service when no {@code spring.datasource.url} is configured.
 *
 * @param dataDirectory where the cluster lives; it survives restarts (relative paths resolve
 *     against the working directory; the default is ignored by git)
 * @param port TCP port on 127.0.0.1; 0 picks a free one at each start
 */
@ConfigurationProperties("kwanta.embedded-database")
public record EmbeddedDatabaseProperties(String dataDirectory, int port) {

  public EmbeddedDatabaseProperties {
    if (dataDirectory == null || dataDirectory.isBlank()) {
      dataDirectory = ".kwanta-data/postgres";
    }
  }
}
