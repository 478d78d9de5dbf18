package org.kwanta.service.system;

import java.time.Duration;
import java.time.Instant;
import org.springframework.boot.context.properties.ConfigurationProperties;
import org.springframework.boot.context.properties.bind.DefaultValue;
import org.springframework.util.unit.DataSize;

/**
 * Limits on input and load ({@code kwanta.limits.*}), read by the filters in this package and by
 * feature code (ingest validates batch size and timestamps against them).
 *
 * @param maxBatchSize most readings in one ingest request (JSON array entries or CSV rows)
 * @param futureSkew how far after the server's clock a reading's time may lie (clock skew)
 * @param pastHorizon how far before the server's clock a reading's time may lie (back-fill)
 * @param maxBodySize largest request body outside ingest; larger: 413
 * @param maxIngestBodySize largest request body on {@code POST /api/v1/readings/**}; larger: 413
 * @param maxConcurrentIngests ingest requests processed at once; more: 503 with Retry-After
 * @param retryAfter the Retry-After given with a 503 (busy, or database unreachable)
 * @param maxJsonStringLength longest JSON string value accepted anywhere, in characters
 * @param maxJsonNestingDepth deepest JSON nesting accepted anywhere
 */
@ConfigurationProperties("kwanta.limits")
public record LimitsProperties(
    @DefaultValue("10000") int maxBatchSize,
    @DefaultValue("5m") Duration futureSkew,
    @DefaultValue("3650d") Duration pastHorizon,
    @DefaultValue("1MB") DataSize maxBodySize,
    @DefaultValue("16MB") DataSize maxIngestBodySize,
    @DefaultValue("4") int maxConcurrentIngests,
    @DefaultValue("5s") Duration retryAfter,
    @DefaultValue("65536") int maxJsonStringLength,
    @DefaultValue("64") int maxJsonNestingDepth) {

  public LimitsProperties {
    require(maxBatchSize > 0, "max-batch-size must be positive");
    require(!futureSkew.isNegative(), "future-skew must not be negative");
    require(!pastHorizon.isNegative() && !pastHorizon.isZero(), "past-horizon must be positive");
    require(maxBodySize.toBytes() > 0, "max-body-size must be positive");
    require(maxIngestBodySize.toBytes() > 0, "max-ingest-body-size must be positive");
    require(maxConcurrentIngests > 0, "max-concurrent-ingests must be positive");
    require(!retryAfter.isNegative() && !retryAfter.isZero(), "retry-after must be positive");
    require(maxJsonStringLength > 0, "max-json-string-length must be positive");
    require(maxJsonNestingDepth > 0, "max-json-nesting-depth must be positive");
  }

  /** The earliest reading time accepted when the server's clock reads {@code now}. */
  public Instant earliestAccepted(Instant now) {
    return now.minus(pastHorizon);
  }

  /** The latest reading time accepted when the server's clock reads {@code now}. */
  public Instant latestAccepted(Instant now) {
    return now.plus(futureSkew);
  }

  /** Whether a reading time lies within the past horizon and the future skew of {@code now}. */
  public boolean acceptsTime(Instant time, Instant now) {
    return !time.isBefore(earliestAccepted(now)) && !time.isAfter(latestAccepted(now));
  }

  private static void require(boolean condition, String message) {
    if (!condition) {
      throw new IllegalArgumentException("kwanta.limits." + message);
    }
  }
}
