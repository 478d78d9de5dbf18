package org.kwanta.service.metrics;

import io.micrometer.core.instrument.MeterRegistry;
import io.micrometer.core.instrument.MultiGauge;
import io.micrometer.core.instrument.Tags;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.kwanta.model.Parameter;
import org.kwanta.model.limits.Classification;
import org.kwanta.model.limits.Level;
import org.kwanta.service.ingest.Evaluations;
import org.kwanta.service.ingest.ReadingHistory;
import org.kwanta.service.limits.ExcursionFinder;
import org.kwanta.service.limits.Limits;
import org.kwanta.service.system.MetricNames;
import org.kwanta.service.system.ReadSource;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.scheduling.annotation.Scheduled;
import org.springframework.stereotype.Component;

/**
 * Per sample point and parameter gauges (latest value, one metric per canonical unit; action level,
 * outside the normal range, time in level, instrument in doubt, reading age, the deadline of a
 * running excursion) and the pH at temperature per sample point, refreshed on a schedule from the
 * stored readings and evaluations ({@code kwanta.metrics.refresh}, default 30 s). The level looks
 * back {@code kwanta.metrics.level-window} (default one day, P1D), so time in level is capped at
 * that window.
 *
 * <p>The excursion deadline is the one {@code GET /api/v1/excursions} answers (as reported, by
 * {@link ExcursionFinder#find}, which reads 8 days back so that a running excursion is whole): it
 * is computed only for the series whose current level is an action level, since only those can be
 * in a running excursion.
 */
@Component
class SampleMetrics {

  private final ReadingHistory readings;
  private final Evaluations evaluations;
  private final Limits limits;
  private final ReadSource reads;
  private final ExcursionFinder finder;
  private final Clock clock;
  private final Duration window;

  /** The latest values, one gauge per metric (one per canonical unit). */
  private final Map<MetricNames.Metric, MultiGauge> values = new LinkedHashMap<>();

  private final MultiGauge phAtTemperature;
  private final MultiGauge level;
  private final MultiGauge held;
  private final MultiGauge outsideNormal;
  private final MultiGauge inDoubt;
  private final MultiGauge age;

  /** The thresholds in force, one gauge per metric (one per canonical unit). */
  private final Map<MetricNames.Metric, MultiGauge> thresholds = new LinkedHashMap<>();

  private final MultiGauge phCalculated;
  private final MultiGauge neutralPh;
  private final MultiGauge deadline;

  SampleMetrics(
      MeterRegistry registry,
      ReadingHistory readings,
      Evaluations evaluations,
      Limits limits,
      ExcursionFinder finder,
      ReadSource reads,
      Clock clock,
      @Value("${kwanta.metrics.level-window:P1D}") Duration window) {
    this.readings = readings;
    this.evaluations = evaluations;
    this.limits = limits;
    this.finder = finder;
    this.reads = reads;
    this.clock = clock;
    this.window = window;
    MetricNames.SAMPLE_VALUES.forEach(m -> values.put(m.metric(), gauge(registry, m.metric())));
    this.phAtTemperature = gauge(registry, MetricNames.SAMPLE_PH_AT_TEMPERATURE, null);
    this.level = gauge(registry, MetricNames.SAMPLE_LEVEL, null);
    this.held = gauge(registry, MetricNames.SAMPLE_LEVEL_HELD, "seconds");
    this.outsideNormal = gauge(registry, MetricNames.SAMPLE_OUTSIDE_NORMAL, null);
    this.inDoubt = gauge(registry, MetricNames.SAMPLE_INSTRUMENT_IN_DOUBT, null);
    this.age = gauge(registry, MetricNames.SAMPLE_READING_AGE, "seconds");
    MetricNames.LIMIT_THRESHOLDS.forEach(
        m -> thresholds.put(m.metric(), gauge(registry, m.metric())));
    this.phCalculated = gauge(registry, MetricNames.SAMPLE_PH_CALCULATED, null);
    this.neutralPh = gauge(registry, MetricNames.SAMPLE_NEUTRAL_PH, null);
    this.deadline = gauge(registry, MetricNames.EXCURSION_DEADLINE, "seconds");
  }

  private static MultiGauge gauge(MeterRegistry registry, String name, String baseUnit) {
    return gauge(
        registry,
        MetricNames.METRICS.stream()
            .filter(m -> m.micrometerName().equals(name))
            .findFirst()
            .orElseThrow(),
        baseUnit);
  }

  /** A gauge whose unit is in its name already (no base unit for Micrometer to append). */
  private static MultiGauge gauge(MeterRegistry registry, MetricNames.Metric metric) {
    return gauge(registry, metric, null);
  }

  private static MultiGauge gauge(
      MeterRegistry registry, MetricNames.Metric metric, String baseUnit) {
    return MultiGauge.builder(metric.micrometerName())
        .description(metric.help())
        .baseUnit(baseUnit)
        .register(registry);
  }

  private record Latest(Instant time, double value) {}

  @Scheduled(
      fixedDelayString = "${kwanta.metrics.refresh:PT30S}",
      initialDelayString = "${kwanta.metrics.initial-delay:PT5S}")
  void refresh() {
    reads.onReplica(this::refreshGauges);
  }

  private void refreshGauges() {
    Instant now = clock.instant();
    Instant since = now.minus(window);
    Map<String, Latest> latest = new HashMap<>();
    for (ReadingHistory.PointReading r : readings.latestSince(since)) {
      latest.put(r.samplePointId() + "|" + r.parameter(), new Latest(r.time(), r.value()));
    }
    Map<String, Double> ph = new HashMap<>();
    Map<String, Double> neutral = new HashMap<>();
    evaluations
        .latestPhAtTemperature(since)
        .forEach(
            (point, p) -> {
              ph.put(point, p.ph());
              if (!Double.isNaN(p.neutralPh())) {
                neutral.put(point, p.neutralPh());
              }
            });
    Map<String, Double> calculated = evaluations.latestCalculatedPh(since);

    Map<MetricNames.Metric, List<MultiGauge.Row<?>>> valuesByMetric = rowsPer(values.keySet());
    List<MultiGauge.Row<?>> ages = new ArrayList<>();
    List<MultiGauge.Row<?>> levels = new ArrayList<>();
    List<MultiGauge.Row<?>> helds = new ArrayList<>();
    List<MultiGauge.Row<?>> outsides = new ArrayList<>();
    List<MultiGauge.Row<?>> doubts = new ArrayList<>();
    List<MultiGauge.Row<?>> phs = new ArrayList<>();
    Map<MetricNames.Metric, List<MultiGauge.Row<?>>> thresholdsByMetric =
        rowsPer(thresholds.keySet());
    List<MultiGauge.Row<?>> calculateds = new ArrayList<>();
    List<MultiGauge.Row<?>> neutrals = new ArrayList<>();
    List<MultiGauge.Row<?>> deadlines = new ArrayList<>();
    for (Limits.Point point : limits.points(null, null)) {
      Tags pointTags =
          Tags.of(
              MetricNames.PLANT, point.plant(),
              MetricNames.BLOCK, point.block(),
              MetricNames.SAMPLE_POINT, point.id());
      if (ph.containsKey(point.id())) {
        phs.add(MultiGauge.Row.of(pointTags, ph.get(point.id())));
      }
      if (calculated.containsKey(point.id())) {
        calculateds.add(MultiGauge.Row.of(pointTags, calculated.get(point.id())));
      }
      if (neutral.containsKey(point.id())) {
        neutrals.add(MultiGauge.Row.of(pointTags, neutral.get(point.id())));
      }
      latest.forEach(
          (key, l) -> {
            if (key.startsWith(point.id() + "|")) {
              String code = key.substring(point.id().length() + 1);
              Tags tags = pointTags.and(MetricNames.PARAMETER, code);
              Parameter.byCode(code)
                  .ifPresent(
                      p ->
                          valuesByMetric
                              .get(MetricNames.sampleValue(p))
                              .add(MultiGauge.Row.of(tags, l.value())));
              ages.add(
                  MultiGauge.Row.of(tags, Duration.between(l.time(), now).toMillis() / 1000.0));
            }
          });
      for (Limits.Effective effective : limits.inForce(point)) {
        Parameter limited = effective.profile().key().parameter();
        String parameter = limited.code();
        if (!latest.containsKey(point.id() + "|" + parameter)) {
          continue;
        }
        List<Classification> classified = finder.classify(effective, since, now);
        if (classified.isEmpty()) {
          continue;
        }
        Classification last = classified.get(classified.size() - 1);
        Tags tags = pointTags.and(MetricNames.PARAMETER, parameter);
        thresholdRows(
            effective.profile(), tags, thresholdsByMetric.get(MetricNames.limitThreshold(limited)));
        levels.add(MultiGauge.Row.of(tags, last.level().severity()));
        helds.add(
            MultiGauge.Row.of(tags, Duration.between(last.levelSince(), now).toMillis() / 1000.0));
        outsides.add(MultiGauge.Row.of(tags, last.level() == Level.OUTSIDE_NORMAL ? 1 : 0));
        doubts.add(MultiGauge.Row.of(tags, last.instrumentInDoubt() ? 1 : 0));
        if (last.level().isAction()) {
          deadlineRows(point, limited, now, tags, deadlines);
        }
      }
    }
    values.forEach((metric, gauge) -> gauge.register(valuesByMetric.get(metric), true));
    age.register(ages, true);
    level.register(levels, true);
    held.register(helds, true);
    outsideNormal.register(outsides, true);
    inDoubt.register(doubts, true);
    phAtTemperature.register(phs, true);
    thresholds.forEach((metric, gauge) -> gauge.register(thresholdsByMetric.get(metric), true));
    phCalculated.register(calculateds, true);
    neutralPh.register(neutrals, true);
    deadline.register(deadlines, true);
  }

  private static Map<MetricNames.Metric, List<MultiGauge.Row<?>>> rowsPer(
      Iterable<MetricNames.Metric> metrics) {
    Map<MetricNames.Metric, List<MultiGauge.Row<?>>> rows = new HashMap<>();
    metrics.forEach(m -> rows.put(m, new ArrayList<>()));
    return rows;
  }

  /**
   * The deadline of the running excursion of one point and parameter, as the excursions endpoint
   * gives it (as reported), in seconds since the epoch.
   */
  private void deadlineRows(
      Limits.Point point,
      Parameter parameter,
      Instant now,
      Tags tags,
      List<MultiGauge.Row<?>> out) {
    ExcursionFinder.Filter running =
        new ExcursionFinder.Filter(point.plant(), point.id(), parameter, now, now, null, true);
    for (ExcursionFinder.Found found : finder.find(running)) {
      found
          .excursion()
          .deadline()
          .ifPresent(d -> out.add(MultiGauge.Row.of(tags, d.toEpochMilli() / 1000.0)));
    }
  }

  /** The normal range's bounds and every action level of a profile as threshold rows. */
  private static void thresholdRows(
      org.kwanta.model.limits.LimitProfile profile, Tags tags, List<MultiGauge.Row<?>> out) {
    profile
        .normal()
        .low()
        .ifPresent(
            v ->
                out.add(
                    MultiGauge.Row.of(
                        tags.and(MetricNames.LEVEL, "NORMAL", MetricNames.SIDE, "LOW"), v)));
    profile
        .normal()
        .high()
        .ifPresent(
            v ->
                out.add(
                    MultiGauge.Row.of(
                        tags.and(MetricNames.LEVEL, "NORMAL", MetricNames.SIDE, "HIGH"), v)));
    for (org.kwanta.model.limits.Threshold t : profile.thresholds()) {
      out.add(
          MultiGauge.Row.of(
              tags.and(MetricNames.LEVEL, t.level().name(), MetricNames.SIDE, t.side().name()),
              t.value()));
    }
  }
}
