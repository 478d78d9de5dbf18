package org.kwanta.service.ingest;

import io.micrometer.core.instrument.Counter;
import io.micrometer.core.instrument.MeterRegistry;
import io.micrometer.core.instrument.Timer;
import java.util.function.Supplier;
import org.kwanta.service.system.MetricNames;
import org.springframework.stereotype.Component;

/**
 * The service's ingest counters and timers, under the names of {@link MetricNames}. The ingest code
 * calls these; the meters exist from start-up, so "ingest stopped" shows as a flat counter rather
 * than a missing series.
 */
@Component
public class IngestMetrics {

  private final MeterRegistry registry;
  private final Timer evaluation;
  private final Timer batch;
  private final Counter retried;

  IngestMetrics(MeterRegistry registry) {
    this.registry = registry;
    this.evaluation =
        Timer.builder(MetricNames.EVALUATION_DURATION)
            .description("Time to evaluate one sample point at one time")
            .publishPercentileHistogram()
            .register(registry);
    this.batch =
        Timer.builder(MetricNames.INGEST_BATCH_DURATION)
            .description("Time to ingest one batch")
            .publishPercentileHistogram()
            .register(registry);
    this.retried =
        Counter.builder(MetricNames.INGEST_RETRIED)
            .description("Batches written again on the plain path after the fast path failed")
            .register(registry);
    ingestedCounter("none");
  }

  private Counter ingestedCounter(String plant) {
    return Counter.builder(MetricNames.READINGS_INGESTED)
        .description("Readings stored")
        .tag(MetricNames.PLANT, plant)
        .register(registry);
  }

  /** Counts stored readings of a plant. */
  public void ingested(String plant, int readings) {
    ingestedCounter(plant).increment(readings);
  }

  /** Counts rejected readings; {@code reason} must come from a fixed list (bounded label). */
  public void rejected(String reason, int readings) {
    Counter.builder(MetricNames.READINGS_REJECTED)
        .description("Readings rejected, by reason")
        .tag(MetricNames.REASON, reason)
        .register(registry)
        .increment(readings);
  }

  /**
   * Counts batches whose fast write (in-memory history, COPY) failed and were written again on the
   * plain path (database history, upserts); steadily rising means something else writes readings.
   */
  public void retried(int batches) {
    retried.increment(batches);
  }

  /** Times one batch from parse to commit. */
  public <T> T timeBatch(Supplier<T> work) {
    return batch.record(work);
  }

  /** Times the evaluation of one sample point at one time. */
  public <T> T timeEvaluation(Supplier<T> work) {
    return evaluation.record(work);
  }
}
