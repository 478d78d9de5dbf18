package org.kwanta.service.system;

import java.time.Duration;
import org.springframework.boot.context.properties.ConfigurationProperties;
import org.springframework.boot.context.properties.bind.DefaultValue;
import org.springframework.util.unit.DataSize;

/**
 * Limits on request size and load ({@code kwanta.http.*}; {@code kwanta.limits.*} is the chemistry
 * limits), applied before a request reaches its controller. Limits on the readings themselves
 * (batch size, future skew, past horizon) belong to ingest: {@code kwanta.ingest.*}.
 *
 * @param maxBodySize largest request body outside ingest; larger: 413
 * @param maxIngestBodySize largest request body on {@code POST /api/v1/readings/**}; larger: 413
 * @param maxConcurrentIngests ingest requests processed at once; more: 503 with Retry-After
 * @param retryAfter the Retry-After given with a 503 (busy, or database unreachable)
 * @param maxJsonStringLength longest JSON string value accepted anywhere, in characters
 * @param maxJsonNestingDepth deepest JSON nesting accepted anywhere
 * @param ingestBodyReadTimeout the whole body of an ingest request must arrive within this time,
 *     read before an ingest slot is taken; slower: 408
 */
@ConfigurationProperties("kwanta.http")
public record HttpLimitsProperties(
    @DefaultValue("1MB") DataSize maxBodySize,
    @DefaultValue("16MB") DataSize maxIngestBodySize,
    @DefaultValue("4") int maxConcurrentIngests,
    @DefaultValue("5s") Duration retryAfter,
    @DefaultValue("65536") int maxJsonStringLength,
    @DefaultValue("64") int maxJsonNestingDepth,
    @DefaultValue("30s") Duration ingestBodyReadTimeout) {

  public HttpLimitsProperties {
    require(maxBodySize.toBytes() > 0, "max-body-size must be positive");
    require(maxIngestBodySize.toBytes() > 0, "max-ingest-body-size must be positive");
    require(maxConcurrentIngests > 0, "max-concurrent-ingests must be positive");
    require(!retryAfter.isNegative() && !retryAfter.isZero(), "retry-after must be positive");
    require(maxJsonStringLength > 0, "max-json-string-length must be positive");
    require(maxJsonNestingDepth > 0, "max-json-nesting-depth must be positive");
    require(
        !ingestBodyReadTimeout.isNegative() && !ingestBodyReadTimeout.isZero(),
        "ingest-body-read-timeout must be positive");
  }

  private static void require(boolean condition, String message) {
    if (!condition) {
      throw new IllegalArgumentException("kwanta.http." + message);
    }
  }
}
