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

/** Creates partitions ahead and drops those past the retention horizon, at start and every hour. */
@Component
class StorageMaintenance {

  private static final Logger log = LoggerFactory.getLogger(StorageMaintenance.class);

  private final Partitions partitions;
  private final StorageProperties properties;
  private final Clock clock;

  StorageMaintenance(Partitions partitions, StorageProperties properties, Clock clock) {
    this.partitions = partitions;
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
    }
  }

  /**
   * Storage settings.
   *
   * @param partitionsAheadDays how many days of partitions to keep ready ahead of today
   * @param retentionDays readings and evaluations older than this many days are dropped (whole
   *     days); 0 keeps everything
   */
  @ConfigurationProperties("kwanta.storage")
  record StorageProperties(int partitionsAheadDays, int retentionDays) {

    StorageProperties {
      if (partitionsAheadDays <= 0) {
        partitionsAheadDays = 7;
      }
      if (retentionDays < 0) {
        retentionDays = 0;
      }
    }
  }
}
