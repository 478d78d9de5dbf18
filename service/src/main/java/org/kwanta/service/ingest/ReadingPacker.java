package org.kwanta.service.ingest;

import java.time.Clock;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.List;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.scheduling.annotation.Scheduled;
import org.springframework.stereotype.Component;

/**
 * Packs whole days of readings older than {@code kwanta.storage.pack-after} (default two days) into
 * blocks ({@link PackedReadings#pack}), when {@code kwanta.storage.packing} is on, every {@code
 * kwanta.storage.pack-every} (default one hour; the first run {@code pack-first}, five minutes,
 * after the start). A day is packed once all of it lies before the horizon. Several instances may
 * run it: each day is packed under the partitions' advisory lock, once.
 */
@Component
class ReadingPacker {

  private static final Logger log = LoggerFactory.getLogger(ReadingPacker.class);

  private final PackedReadings packed;
  private final Partitions partitions;
  private final StorageMaintenance.StorageProperties properties;
  private final Clock clock;

  ReadingPacker(
      PackedReadings packed,
      Partitions partitions,
      StorageMaintenance.StorageProperties properties,
      Clock clock) {
    this.packed = packed;
    this.partitions = partitions;
    this.properties = properties;
    this.clock = clock;
  }

  @Scheduled(
      fixedDelayString = "${kwanta.storage.pack-every:PT1H}",
      initialDelayString = "${kwanta.storage.pack-first:PT5M}")
  void run() {
    if (properties.packing()) {
      packBefore(clock.instant().minus(properties.packAfter()));
    }
  }

  /**
   * Packs every day with a partition of {@code reading} that ends at or before the horizon, oldest
   * first. Returns the days packed.
   */
  List<LocalDate> packBefore(Instant horizon) {
    List<LocalDate> done = new ArrayList<>();
    for (LocalDate day : partitions.readingDaysBefore(Partitions.dayOf(horizon))) {
      if (packDay(day) >= 0) {
        done.add(day);
      }
    }
    return done;
  }

  /**
   * Packs one day's partition of {@code reading} (whatever its age). Returns the readings packed,
   * or -1 when the day has no partition.
   */
  long packDay(LocalDate day) {
    long start = System.nanoTime();
    long n = packed.pack(day);
    if (n >= 0) {
      partitions.markPacked(day);
      log.debug("Packed {} ({} readings) in {} ms", day, n, (System.nanoTime() - start) / 1e6);
    }
    return n;
  }
}
