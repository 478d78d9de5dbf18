package org.kwanta.service.ingest;

import java.time.Duration;
import org.springframework.boot.context.properties.ConfigurationProperties;

/**
 * Limits on ingested batches.
 *
 * @param maxBatchSize readings per request
 * @param futureSkew how far a timestamp may lie in the future
 * @param pastHorizon how far back a timestamp may lie
 * @param maxAge how old the latest value of a parameter may be to enter an evaluation
 * @param historyWindow how much history per parameter an evaluation sees (trend, flat-line and
 *     persistence checks)
 * @param recentReadings how many readings (over all sample points) the ingest keeps in memory to
 *     evaluate new batches without reading history back from the database; about 100 bytes each
 * @param maxNewDaysPerRequest how many days without storage (daily partitions) one request may
 *     reach; a longer backfill is refused (422) and must be sent in smaller pieces
 */
@ConfigurationProperties("kwanta.ingest")
public record IngestLimits(
    int maxBatchSize,
    Duration futureSkew,
    Duration pastHorizon,
    Duration maxAge,
    Duration historyWindow,
    int recentReadings,
    int maxNewDaysPerRequest) {

  public IngestLimits {
    if (maxBatchSize <= 0) {
      maxBatchSize = 10_000;
    }
    if (futureSkew == null) {
      futureSkew = Duration.ofMinutes(5);
    }
    if (pastHorizon == null) {
      pastHorizon = Duration.ofDays(400);
    }
    if (maxAge == null) {
      maxAge = Duration.ofMinutes(10);
    }
    if (historyWindow == null) {
      historyWindow = Duration.ofMinutes(60);
    }
    if (recentReadings <= 0) {
      recentReadings = 500_000;
    }
    if (maxNewDaysPerRequest <= 0) {
      maxNewDaysPerRequest = 31;
    }
  }
}
