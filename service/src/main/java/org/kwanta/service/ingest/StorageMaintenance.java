package org.kwanta.service.ingest;

import java.time.Clock;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.boot.context.event.ApplicationReadyEvent;
import org.springframework.boot.context.properties.ConfigurationProperties;
import org.springframework.context.event.EventListener;
import org.springframework.scheduling.annotation.Scheduled;
import org.springframework.stereotype.Component;

/**
 * Creates partitions ahead and drops those past the retention horizon, at start and every hour;
 * refreshes the planner statistics of yesterday's and today's partitions every hour.
 */
@Component
class StorageMaintenance {

  private static final Logger log = LoggerFactory.getLogger(StorageMaintenance.class);

  private final Partitions partitions;
  private final StorageProperties properties;
  private final Clock clock;

  private final PackedReadings packed;

  StorageMaintenance(
      Partitions partitions, PackedReadings packed, StorageProperties properties, Clock clock) {
    this.partitions = partitions;
    this.packed = packed;
    this.properties = properties;
    this.clock = clock;
  }

  @EventListener(ApplicationReadyEvent.class)
  void atStart() {
    run();
  }

  @Scheduled(fixedDelayString = "PT1H", initialDelayString = "PT1H")
  void run() {
    LocalDate today = LocalDate.now(clock.withZone(java.time.ZoneOffset.UTC));
    List<LocalDate> days = new ArrayList<>();
    for (int i = -1; i <= properties.partitionsAheadDays(); i++) {
      days.add(today.plusDays(i));
    }
    partitions.ensure(days);
    if (properties.retentionDays() > 0) {
      List<String> dropped = partitions.dropBefore(today.minusDays(properties.retentionDays()));
      if (!dropped.isEmpty()) {
        log.info("Retention: dropped partitions {}", dropped);
      }
      LocalDate firstKept = today.minusDays(properties.retentionDays());
      int blocks = packed.deleteBefore(firstKept);
      partitions.forgetPackedBefore(firstKept);
      if (blocks > 0) {
        log.info("Retention: deleted {} packed blocks before {}", blocks, firstKept);
      }
    }
  }

  /**
   * Planner statistics of the partitions being written (yesterday's and today's), every {@code
   * kwanta.storage.analyze-every} (default one hour; first run two minutes after the start). Off
   * with {@code kwanta.storage.analyze-recent=false}, for a database whose autovacuum is trusted to
   * do it. Partitioned parents are not analyzed: on PostgreSQL 15 that would sample every
   * partition.
   */
  @Scheduled(
      fixedDelayString = "${kwanta.storage.analyze-every:PT1H}",
      initialDelayString = "${kwanta.storage.analyze-first:PT2M}")
  void analyzeRecent() {
    if (!properties.analyzeRecent()) {
      return;
    }
    LocalDate today = LocalDate.now(clock.withZone(java.time.ZoneOffset.UTC));
    long start = System.nanoTime();
    List<String> analyzed = partitions.analyze(List.of(today.minusDays(1), today));
    log.debug(
        "Statistics refreshed for {} in {} ms", analyzed, (System.nanoTime() - start) / 1_000_000);
  }

  /**
   * Storage settings.
   *
   * @param partitionsAheadDays how many days of partitions to keep ready ahead of today
   * @param retentionDays readings and evaluations older than this many days are dropped (whole
   *     days); 0 keeps everything
   * @param analyzeRecent whether to refresh the statistics of yesterday's and today's partitions
   *     (default true; null when the property is absent)
   * @param packing whether whole days older than {@code packAfter} are packed into blocks ({@link
   *     ReadingPacker}; default true)
   * @param packAfter the age after which a day of readings is packed (default two days; less than
   *     one day is refused: the latest readings of a point, read from {@code reading} alone, must
   *     stay hot)
   */
  @ConfigurationProperties("kwanta.storage")
  record StorageProperties(
      int partitionsAheadDays,
      int retentionDays,
      Boolean analyzeRecent,
      Boolean packing,
      java.time.Duration packAfter) {

    /** The shortest {@code kwanta.storage.pack-after} accepted. */
    static final java.time.Duration MIN_PACK_AFTER = java.time.Duration.ofDays(1);

    StorageProperties {
      if (partitionsAheadDays <= 0) {
        partitionsAheadDays = 7;
      }
      if (retentionDays < 0) {
        retentionDays = 0;
      }
      if (analyzeRecent == null) {
        analyzeRecent = true;
      }
      if (packing == null) {
        packing = true;
      }
      if (packAfter == null) {
        packAfter = java.time.Duration.ofDays(2);
      }
      if (packAfter.compareTo(MIN_PACK_AFTER) < 0) {
        throw new IllegalArgumentException(
            "kwanta.storage.pack-after is "
                + packAfter
                + ", less than the shortest accepted, "
                + MIN_PACK_AFTER
                + ": readings younger than a day must stay in reading");
      }
    }
  }
}
