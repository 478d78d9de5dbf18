package org.kwanta.service.readings;

import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;
import org.kwanta.service.evaluations.EvaluationRunner;
import org.kwanta.service.evaluations.EvaluationStore;
import org.kwanta.service.metrics.IngestMetrics;
import org.kwanta.service.samplepoints.SamplePointConfigs;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.stereotype.Service;
import org.springframework.transaction.PlatformTransactionManager;
import org.springframework.transaction.support.TransactionTemplate;

/**
 * Ingests a batch: validate everything, then in one transaction store the readings and recompute
 * every evaluation they can affect. A batch is stored whole or not at all; a 2xx means it is
 * committed.
 */
@Service
public class IngestService {

  private final SamplePointConfigs configs;
  private final ReadingStore readings;
  private final EvaluationStore evaluations;
  private final Partitions partitions;
  private final JdbcTemplate jdbc;
  private final IngestLimits limits;
  private final ReadingValidator validator;
  private final TransactionTemplate transaction;
  private final IngestMetrics metrics;

  IngestService(
      SamplePointConfigs configs,
      ReadingStore readings,
      EvaluationStore evaluations,
      Partitions partitions,
      JdbcTemplate jdbc,
      IngestLimits limits,
      Clock clock,
      PlatformTransactionManager transactions,
      IngestMetrics metrics) {
    this.metrics = metrics;
    this.transaction = new TransactionTemplate(transactions);
    this.configs = configs;
    this.readings = readings;
    this.evaluations = evaluations;
    this.partitions = partitions;
    this.jdbc = jdbc;
    this.limits = limits;
    this.validator = new ReadingValidator(limits, clock);
  }

  /** The outcome of an accepted batch. */
  public record Outcome(
      int received,
      int inserted,
      int corrected,
      int unchanged,
      int duplicatesInBatch,
      int evaluationsWritten) {}

  /** Validates and, when everything is valid, stores. */
  public Outcome ingest(List<ReadingInput> inputs) {
    return ingest(inputs, List.of());
  }

  /**
   * Validates (adding rejections found earlier, e.g. by the CSV parser) and stores when all is
   * valid.
   */
  public Outcome ingest(List<ReadingInput> inputs, List<RejectedReading> alreadyRejected) {
    if (inputs == null || inputs.isEmpty()) {
      throw new InvalidBatchException(
          List.of(new RejectedReading(0, null, "batch has no readings")));
    }
    if (inputs.size() > limits.maxBatchSize()) {
      throw new BatchTooLargeException(inputs.size(), limits.maxBatchSize());
    }
    Set<String> named = new TreeSet<>();
    for (ReadingInput in : inputs) {
      if (in != null && in.samplePoint() != null && in.samplePoint().length() <= 64) {
        named.add(in.samplePoint());
      }
    }
    ReadingValidator.Outcome checked = validator.validate(inputs, configs.existing(named));
    if (!checked.rejected().isEmpty() || !alreadyRejected.isEmpty()) {
      // a row the CSV parser refused is reported with the parser's reason only
      Set<Integer> parsedBad = new TreeSet<>();
      alreadyRejected.forEach(r -> parsedBad.add(r.index()));
      List<RejectedReading> all = new ArrayList<>(alreadyRejected);
      checked.rejected().stream().filter(r -> !parsedBad.contains(r.index())).forEach(all::add);
      all.sort(java.util.Comparator.comparingInt(RejectedReading::index));
      for (RejectedReading r : all) {
        metrics.rejected(r.field() == null ? "reading" : r.field(), 1);
      }
      throw new InvalidBatchException(all);
    }
    // Last occurrence wins within a batch: a historian resending a row in the same batch corrects
    // it.
    Map<String, ValidReading> distinct = new LinkedHashMap<>();
    for (ValidReading r : checked.valid()) {
      distinct.put(r.samplePointId() + '\u0000' + r.parameter().code() + '\u0000' + r.time(), r);
    }
    List<ValidReading> batch = new ArrayList<>(distinct.values());
    TreeSet<java.time.LocalDate> days = new TreeSet<>();
    for (ValidReading r : batch) {
      days.add(Partitions.dayOf(r.time()));
      days.add(Partitions.dayOf(r.time().plus(limits.historyWindow())));
    }
    partitions.ensure(days);
    int duplicates = inputs.size() - batch.size();
    Stored stored =
        metrics.timeBatch(
            () -> transaction.execute(status -> store(batch, inputs.size(), duplicates)));
    stored.changedPerPlant().forEach(metrics::ingested);
    return stored.outcome();
  }

  /** A committed batch and how many readings it added or changed per plant. */
  private record Stored(Outcome outcome, Map<String, Integer> changedPerPlant) {}

  private Stored store(List<ValidReading> batch, int received, int duplicates) {
    // Per-point locks, in a fixed order: concurrent batches for the same point evaluate one after
    // the other,
    // each seeing the other's committed readings, so the stored evaluations do not depend on
    // arrival order.
    TreeMap<String, Instant[]> ranges = new TreeMap<>();
    for (ValidReading r : batch) {
      ranges.merge(
          r.samplePointId(),
          new Instant[] {r.time(), r.time()},
          (a, b) ->
              new Instant[] {a[0].isBefore(b[0]) ? a[0] : b[0], a[1].isAfter(b[1]) ? a[1] : b[1]});
    }
    for (String point : ranges.keySet()) {
      jdbc.queryForObject("SELECT pg_advisory_xact_lock(hashtext(?))", Object.class, point);
    }
    ReadingStore.Counts counts = readings.upsert(batch);
    int written = 0;
    Map<String, SamplePointConfigs.Versioned> current = configs.current(ranges.keySet());
    Map<String, Integer> perPlant = new TreeMap<>();
    if (counts.inserted() + counts.corrected() > 0) {
      for (ValidReading r : batch) {
        perPlant.merge(current.get(r.samplePointId()).plantId(), 1, Integer::sum);
      }
      Duration window = limits.historyWindow();
      for (Map.Entry<String, Instant[]> e : ranges.entrySet()) {
        Instant from = e.getValue()[0];
        Instant to = e.getValue()[1].plus(window);
        List<EvaluationRunner.StoredReading> stored =
            evaluations.readings(e.getKey(), from, to, window);
        List<EvaluationRunner.Result> results =
            metrics.timeEvaluation(
                () ->
                    EvaluationRunner.run(
                        current.get(e.getKey()), stored, from, to, window, limits.maxAge()));
        evaluations.upsert(results);
        written += results.size();
      }
    }
    return new Stored(
        new Outcome(
            received,
            counts.inserted(),
            counts.corrected(),
            counts.unchanged(),
            duplicates,
            written),
        perPlant);
  }
}
