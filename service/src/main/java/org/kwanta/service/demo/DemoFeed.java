package org.kwanta.service.demo;

import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import org.kwanta.service.ingest.IngestService;
import org.kwanta.service.ingest.ReadingInput;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.boot.autoconfigure.condition.ConditionalOnBooleanProperty;
import org.springframework.boot.context.event.ApplicationReadyEvent;
import org.springframework.boot.context.properties.ConfigurationProperties;
import org.springframework.context.event.EventListener;
import org.springframework.scheduling.annotation.Scheduled;
import org.springframework.stereotype.Component;

/**
 * Opt-in demo feed ({@code --kwanta.demo.feed=true}): replays invented readings of the Brackenmoor
 * stories in real time through the normal ingest path. At start it fills the last 26 hours, so
 * every point has the day-long baseline the diagnosis needs at once.
 */
@Component
@ConditionalOnBooleanProperty(name = "kwanta.demo.feed")
class DemoFeed {

  private static final Logger log = LoggerFactory.getLogger(DemoFeed.class);

  private final IngestService ingest;
  private final Clock clock;
  private final DemoFeedProperties properties;
  private final DemoStories stories;

  DemoFeed(IngestService ingest, Clock clock, DemoFeedProperties properties) {
    this.ingest = ingest;
    this.clock = clock;
    this.properties = properties;
    this.stories = new DemoStories(properties.storyPeriod());
  }

  @EventListener(ApplicationReadyEvent.class)
  void backfill() {
    Instant now = clock.instant().truncatedTo(ChronoUnit.SECONDS);
    List<ReadingInput> batch = new ArrayList<>();
    int total = 0;
    for (Instant t = now.minus(properties.backfill());
        t.isBefore(now);
        t = t.plus(Duration.ofMinutes(1))) {
      batch.addAll(stories.at(t));
      if (batch.size() > 5_000) {
        total += ingest.ingest(batch).received();
        batch.clear();
      }
    }
    if (!batch.isEmpty()) {
      total += ingest.ingest(batch).received();
    }
    // the back-filled days' statistics now, not at the hourly refresh: the first board plans on
    // them
    java.util.TreeSet<java.time.LocalDate> days = new java.util.TreeSet<>();
    for (Instant t = now.minus(properties.backfill());
        !t.isAfter(now);
        t = t.plus(Duration.ofHours(1))) {
      days.add(java.time.LocalDate.ofInstant(t, java.time.ZoneOffset.UTC));
    }
    days.add(java.time.LocalDate.ofInstant(now, java.time.ZoneOffset.UTC));
    ingest.refreshStatistics(days);
    log.info(
        "Demo feed on: {} invented readings back-filled over {}, live every {} (stories repeat every {})",
        total,
        properties.backfill(),
        properties.interval(),
        properties.storyPeriod());
  }

  @Scheduled(fixedDelayString = "${kwanta.demo.interval:PT10S}", initialDelayString = "PT5S")
  void tick() {
    try {
      ingest.ingest(stories.at(clock.instant().truncatedTo(ChronoUnit.SECONDS)));
    } catch (RuntimeException e) {
      log.warn("Demo feed tick failed: {}", e.getMessage());
    }
  }

  /**
   * Demo feed settings.
   *
   * @param interval time between live readings
   * @param storyPeriod the five stories repeat with this period
   * @param backfill history generated at start
   */
  @ConfigurationProperties("kwanta.demo")
  record DemoFeedProperties(Duration interval, Duration storyPeriod, Duration backfill) {
    DemoFeedProperties {
      if (interval == null) {
        interval = Duration.ofSeconds(10);
      }
      if (storyPeriod == null) {
        storyPeriod = Duration.ofHours(8);
      }
      if (backfill == null) {
        backfill = Duration.ofHours(26);
      }
    }
  }
}
