package org.kwanta.service.ingest;

import java.sql.Timestamp;
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
import org.kwanta.service.audit.Actor;
import org.kwanta.service.samplepoints.SamplePointConfigs;
import org.kwanta.service.system.DatabaseOutage;
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

  private static final org.slf4j.Logger log =
      org.slf4j.LoggerFactory.getLogger(IngestService.class);

  private final SamplePointConfigs configs;
  private final ReadingStore readings;
  private final EvaluationStore evaluations;
  private final Partitions partitions;
  private final JdbcTemplate jdbc;
  private final IngestLimits limits;
  private final ReadingValidator validator;
  private final TransactionTemplate transaction;
  private final IngestMetrics metrics;
  private final RecentReadings recent;
  private final EvaluationRunner runner;

  /** Evaluates sample points of a group in parallel with the group's database writes. */
  private final java.util.concurrent.ExecutorService evaluators =
      java.util.concurrent.Executors.newFixedThreadPool(
          Math.max(2, Runtime.getRuntime().availableProcessors()),
          new java.util.concurrent.ThreadFactory() {
            private final java.util.concurrent.atomic.AtomicInteger count =
                new java.util.concurrent.atomic.AtomicInteger();

            @Override
            public Thread newThread(Runnable r) {
              Thread t = new Thread(r, "kwanta-evaluate-" + count.getAndIncrement());
              t.setDaemon(true);
              return t;
            }
          });

  private final java.util.concurrent.ConcurrentLinkedQueue<Pending> queue =
      new java.util.concurrent.ConcurrentLinkedQueue<>();
  private final java.util.concurrent.locks.ReentrantLock combining =
      new java.util.concurrent.locks.ReentrantLock();

  IngestService(
      SamplePointConfigs configs,
      ReadingStore readings,
      EvaluationStore evaluations,
      Partitions partitions,
      JdbcTemplate jdbc,
      IngestLimits limits,
      Clock clock,
      PlatformTransactionManager transactions,
      IngestMetrics metrics,
      EvaluationRunner runner,
      LabResults labResults,
      ReadingRollups rollups,
      EvaluationRollups evaluationRollups,
      WriteLog writeLog) {
    this.evaluationRollups = evaluationRollups;
    this.writeLog = writeLog;
    this.labResults = labResults;
    this.rollups = rollups;
    this.metrics = metrics;
    this.runner = runner;
    this.transaction = new TransactionTemplate(transactions);
    this.configs = configs;
    this.readings = readings;
    this.evaluations = evaluations;
    this.partitions = partitions;
    this.jdbc = jdbc;
    this.limits = limits;
    this.validator = new ReadingValidator(limits, clock);
    this.recent = new RecentReadings(limits.recentReadings(), limits.historyWindow());
  }

  private final LabResults labResults;
  private final ReadingRollups rollups;
  private final WriteLog writeLog;
  private final EvaluationRollups evaluationRollups;

  /**
   * Validates and stores a batch of grab and lab results (all or nothing): mass-per-volume values
   * converted to ug/kg first ({@link LabResults#convert}), then the checks of online readings plus
   * those of source, sample id, method and censoring. Who entered them is {@code by}.
   */
  public LabResults.Outcome lab(
      List<ReadingInput> inputs, List<RejectedReading> alreadyRejected, Actor by) {
    if (inputs == null || inputs.isEmpty()) {
      throw new InvalidBatchException(
          List.of(new RejectedReading(0, null, "batch has no results")));
    }
    if (inputs.size() > limits.maxBatchSize()) {
      throw new BatchTooLargeException(inputs.size(), limits.maxBatchSize());
    }
    LabResults.Converted converted = LabResults.convert(inputs);
    Set<String> named = new TreeSet<>();
    for (ReadingInput in : inputs) {
      if (in != null && in.samplePoint() != null && in.samplePoint().length() <= 64) {
        named.add(in.samplePoint());
      }
    }
    ReadingValidator.Outcome checked =
        validator.validate(converted.inputs(), configs.existing(named), true);
    List<RejectedReading> all = new ArrayList<>(alreadyRejected);
    Set<Integer> parsedBad = new TreeSet<>();
    alreadyRejected.forEach(r -> parsedBad.add(r.index()));
    converted.rejected().stream().filter(r -> !parsedBad.contains(r.index())).forEach(all::add);
    checked.rejected().stream().filter(r -> !parsedBad.contains(r.index())).forEach(all::add);
    if (!all.isEmpty()) {
      all.sort(java.util.Comparator.comparingInt(RejectedReading::index));
      throw new InvalidBatchException(all);
    }
    return labResults.write(
        inputs, converted.inputs(), checked.valid(), converted.conversions(), by);
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
    ReadingValidator.Outcome checked = check(inputs);
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
    Map<ReadingKey, ValidReading> distinct = new LinkedHashMap<>();
    for (ValidReading r : checked.valid()) {
      distinct.put(new ReadingKey(r.samplePointId(), r.parameter(), r.time()), r);
    }
    List<ValidReading> batch = new ArrayList<>(distinct.values());
    TreeSet<java.time.LocalDate> days = new TreeSet<>();
    for (ValidReading r : batch) {
      days.add(Partitions.dayOf(r.time()));
      days.add(Partitions.dayOf(r.time().plus(limits.historyWindow())));
    }
    int duplicates = inputs.size() - batch.size();
    for (int attempt = 1; ; attempt++) {
      partitions.ensure(days, limits.maxNewDaysPerRequest());
      Pending pending = new Pending(batch, inputs.size(), duplicates);
      try {
        Outcome outcome = metrics.timeBatch(() -> submit(pending));
        pending.changedPerPlant.forEach(metrics::ingested);
        return outcome;
      } catch (RuntimeException e) {
        if (attempt >= MAX_PARTITION_ATTEMPTS || !Partitions.isMissingPartition(e)) {
          throw e;
        }
        // another instance dropped a day this one thought it had (retention): nothing was
        // written; make the days again (or find them made) and write the batch again
        log.info("A day's partition was missing (dropped by another instance?); retrying");
        partitions.forget(days);
      }
    }
  }

  /**
   * Refreshes the planner statistics of the partitions of the given days ({@code ANALYZE}, as the
   * storage maintenance does every hour): after a bulk back-fill, so that the first queries on it
   * are planned on its rows (the demo's first board took 30-37 s without, 0.1 s with).
   */
  public void refreshStatistics(java.util.Collection<java.time.LocalDate> days) {
    partitions.analyze(days);
  }

  /** A reading's identity within a batch. */
  private record ReadingKey(String point, org.kwanta.model.Parameter parameter, Instant time) {}

  /** How often a batch is tried when a day's partition turns out to be missing. */
  private static final int MAX_PARTITION_ATTEMPTS = 3;

  /** A validated batch waiting to be written, and what writing it gave. */
  private static final class Pending {
    final List<ValidReading> readings;
    final int received;
    final int duplicates;
    final Map<String, Instant[]> ranges = new TreeMap<>();
    final Map<String, Integer> changedPerPlant = new TreeMap<>();
    final List<ValidReading> uncovered = new ArrayList<>();
    int inserted;
    int corrected;
    int unchanged;
    int evaluations;

    /** Completed by the writer with the batch's outcome or failure. */
    final java.util.concurrent.CompletableFuture<Outcome> result =
        new java.util.concurrent.CompletableFuture<>();

    Pending(List<ValidReading> readings, int received, int duplicates) {
      this.readings = readings;
      this.received = received;
      this.duplicates = duplicates;
      for (ValidReading r : readings) {
        widen(ranges, r.samplePointId(), r.time(), r.time());
      }
    }

    boolean done() {
      return result.isDone();
    }

    void fail(Throwable e) {
      result.completeExceptionally(e);
    }

    void reset() {
      changedPerPlant.clear();
      uncovered.clear();
      inserted = 0;
      corrected = 0;
      unchanged = 0;
      evaluations = 0;
    }
  }

  /**
   * Group commit: batches waiting while another is written are written together, in one
   * transaction, by whichever request thread holds the combining lock (each batch still succeeds or
   * fails whole: if a group's transaction fails, its batches are retried one by one). So concurrent
   * historians sending the same sample points do not queue behind each other's transactions one at
   * a time.
   */
  private Outcome submit(Pending pending) {
    queue.add(pending);
    combining.lock();
    try {
      while (!pending.done()) {
        List<Pending> group = drain();
        if (group.isEmpty()) {
          // cannot happen (every drained batch gets a result); never wait for it forever
          pending.fail(new IllegalStateException("the batch was lost before it was written"));
        }
        write(group);
      }
    } finally {
      combining.unlock();
    }
    try {
      return pending.result.join();
    } catch (java.util.concurrent.CompletionException e) {
      Throwable cause = e.getCause();
      if (cause instanceof RuntimeException r) {
        throw r;
      }
      if (cause instanceof Error err) {
        throw err;
      }
      throw new IllegalStateException(cause);
    }
  }

  /**
   * Takes waiting batches in arrival order, up to {@link #MAX_GROUP_READINGS} readings, stopping
   * before a batch that repeats a key (sample point, parameter, time) already in the group, so that
   * within a group every key is written once and later batches still correct earlier ones.
   */
  private List<Pending> drain() {
    List<Pending> group = new ArrayList<>();
    java.util.HashSet<Long> keys = new java.util.HashSet<>();
    int size = 0;
    Pending next;
    while ((next = queue.peek()) != null) {
      if (!group.isEmpty() && size + next.readings.size() > MAX_GROUP_READINGS) {
        break;
      }
      List<Long> own = new ArrayList<>(next.readings.size());
      boolean clash = false;
      for (ValidReading r : next.readings) {
        long k = keyHash(r);
        if (keys.contains(k)) {
          clash = true;
          break;
        }
        own.add(k);
      }
      if (clash && !group.isEmpty()) {
        break;
      }
      keys.addAll(own);
      group.add(queue.poll());
      size += next.readings.size();
    }
    return group;
  }

  /** A hash of a reading's key; a collision only makes a group smaller. */
  private static long keyHash(ValidReading r) {
    long h = r.samplePointId().hashCode();
    h = h * 0x9E3779B97F4A7C15L + r.parameter().ordinal();
    h = h * 0x9E3779B97F4A7C15L + r.time().getEpochSecond();
    return h * 0x9E3779B97F4A7C15L + r.time().getNano();
  }

  static final int MAX_GROUP_READINGS = 20_000;

  /**
   * Writes a group in one transaction. If that fails because the database is unreachable (or with
   * an {@link Error}), every batch of the group fails with it; otherwise each batch is retried
   * alone on the plain path (no in-memory copy, upserts only), so a copy out of step cannot fail a
   * batch. Every batch of the group ends with an outcome or a failure.
   */
  private void write(List<Pending> group) {
    write(group, true);
  }

  private void write(List<Pending> group, boolean retry) {
    if (group.isEmpty()) {
      return;
    }
    Map<String, Kept> kept = new TreeMap<>();
    List<WriteLog.Written> written = new ArrayList<>();
    try {
      // a retried batch takes the plain path: no in-memory copy, upserts only
      boolean fast = retry;
      transaction.executeWithoutResult(status -> store(group, kept, fast, written));
    } catch (Throwable e) {
      // nothing of the group is committed; the copies may hold its readings: drop them
      group.forEach(p -> p.ranges.keySet().forEach(recent::forget));
      if (!retry
          || e instanceof Error
          || DatabaseOutage.isCause(e)
          || Partitions.isMissingPartition(e)) {
        // a missing partition: every request of the group makes its days and resubmits
        group.forEach(p -> p.fail(e));
      } else {
        log.warn(
            "Ingest of {} batch(es) failed on the fast path; retrying each on the plain path: {}",
            group.size(),
            e.toString());
        metrics.retried(group.size());
        for (Pending p : group) {
          p.reset();
          write(List.of(p), false);
        }
      }
      return;
    }
    writeLog.committed(written);
    for (Pending p : group) {
      p.result.complete(
          new Outcome(
              p.received, p.inserted, p.corrected, p.unchanged, p.duplicates, p.evaluations));
    }
    try {
      kept.forEach(
          (point, k) -> {
            if (k.generation() == null) {
              recent.forget(point);
            } else {
              recent.committed(point, k.generation(), k.keepFrom());
            }
          });
      recent.evict();
    } catch (Throwable e) {
      // committed; only the copies are in doubt
      recent.clear();
      log.error("Dropped the in-memory reading histories after an error", e);
    }
  }

  /** What to keep of a point's in-memory copy after the commit (no generation: drop it). */
  private record Kept(Long generation, Instant keepFrom) {}

  /**
   * Writes a group in the caller's transaction, in four steps: lock the points' heads and pick (or
   * load) their histories; classify every reading against its history; write the readings while the
   * evaluations are computed; write the evaluations and count them per batch.
   */
  private void store(
      List<Pending> group, Map<String, Kept> kept, boolean fast, List<WriteLog.Written> written) {
    GroupWrite w = new GroupWrite(group, limits.historyWindow());
    lockAndLoad(w, kept, fast);
    classify(w);
    writeReadingsWhileEvaluating(w);
    writeEvaluations(w);
    // per point, its generation step and the earliest time written (readings, and evaluations,
    // which are recomputed from the first changed reading on), for the readers' caches
    w.heads.forEach(
        (point, head) -> {
          Instant[] range = w.changed.get(point);
          written.add(
              new WriteLog.Written(
                  point,
                  head.previousGeneration(),
                  head.generation(),
                  range == null ? null : range[0]));
        });
  }

  /** What the steps of one group's write hand each other. */
  private static final class GroupWrite {
    final List<Pending> group;
    final Duration window;
    Map<String, SamplePointConfigs.Versioned> current;
    Map<String, ReadingStore.Head> heads;
    Map<String, RecentReadings.PointHistory> copies;
    List<ValidReading> fresh;
    List<ValidReading> corrections;
    Map<String, Instant[]> changed;
    Map<String, java.util.Set<Instant>> newTimes;
    Map<String, List<EvaluationRunner.Result>> results;
    List<BinaryCopy> created;
    List<EvaluationRunner.Result> recomputed;

    GroupWrite(List<Pending> group, Duration window) {
      this.group = group;
      this.window = window;
    }
  }

  /**
   * Step 1: locks the group's points' heads in id order (new generations), and per point picks the
   * in-memory history at the previous generation, loads one, or leaves the point to a cold history.
   */
  private void lockAndLoad(GroupWrite w, Map<String, Kept> kept, boolean fast) {
    List<Pending> group = w.group;
    Duration window = w.window;
    // what is kept in memory per point: a history window back from its latest reading, and a
    // quarter window more so that slightly late data still finds its history there
    Duration keep = window.plus(window.dividedBy(4));
    // the group's time range per point, and its points' heads, locked in id order: concurrent
    // transactions for the same point (from this or another instance) run one after the other
    Map<String, Instant[]> groupRanges = new TreeMap<>();
    for (Pending p : group) {
      p.ranges.forEach((point, r) -> widen(groupRanges, point, r[0], r[1]));
    }
    Map<String, Instant> maxTimes = new TreeMap<>();
    groupRanges.forEach((point, r) -> maxTimes.put(point, r[1]));
    Map<String, ReadingStore.Head> heads = readings.lockHeads(maxTimes);
    Map<String, SamplePointConfigs.Versioned> current = configs.current(groupRanges.keySet());

    // which points have an in-memory copy that covers the group's evaluations
    Map<String, RecentReadings.PointHistory> copies = new java.util.HashMap<>();
    Map<String, Instant> toLoad = new TreeMap<>();
    for (Map.Entry<String, Instant[]> e : groupRanges.entrySet()) {
      String point = e.getKey();
      ReadingStore.Head head = heads.get(point);
      Instant latest = max(head.previousLatest(), e.getValue()[1]);
      if (head.previousLatest() == null) {
        Instant stored = readings.latestStoredAfter(point, latest);
        if (stored != null) {
          latest = stored;
          jdbc.update(
              "UPDATE reading_head SET latest_time = greatest(latest_time, ?) WHERE"
                  + " sample_point_id = ?",
              Timestamp.from(stored),
              point);
        }
      }
      Instant keepFrom = latest.minus(keep);
      Instant needed = e.getValue()[0].minus(window);
      RecentReadings.PointHistory copy =
          fast ? recent.current(point, head.previousGeneration()) : null;
      if (copy != null && !copy.coveredFrom().isAfter(needed)) {
        copies.put(point, copy);
        kept.put(point, new Kept(head.generation(), keepFrom));
      } else if (fast && !keepFrom.isAfter(needed)) {
        toLoad.put(point, keepFrom);
        kept.put(point, new Kept(head.generation(), keepFrom));
      } else {
        // backfill further back than the copy reaches: read from the database
        kept.put(point, new Kept(null, keepFrom));
      }
    }
    readings
        .loadSince(toLoad)
        .forEach(
            (point, loaded) -> copies.put(point, recent.start(point, toLoad.get(point), loaded)));

    w.current = current;
    w.heads = heads;
    w.copies = copies;
  }

  /** Step 2: classifies every reading against its point's history: new, correction or unchanged. */
  private void classify(GroupWrite w) {
    List<Pending> group = w.group;
    Map<String, SamplePointConfigs.Versioned> current = w.current;
    Map<String, RecentReadings.PointHistory> copies = w.copies;
    // classify every reading against the copy: new, correction or unchanged
    List<ValidReading> fresh = new ArrayList<>();
    List<ValidReading> corrections = new ArrayList<>();
    Map<String, Instant[]> changed = new TreeMap<>();
    // per point, the times at which this group makes the first evaluation (no relevant reading
    // there before the group), and the times already judged
    Map<String, java.util.Set<Instant>> newTimes = new java.util.HashMap<>();
    Map<String, Map<Instant, Boolean>> judged = new java.util.HashMap<>();
    for (Pending p : group) {
      Map<String, int[]> changedPerPoint = new java.util.HashMap<>();
      for (ValidReading r : p.readings) {
        String point = r.samplePointId();
        RecentReadings.PointHistory copy = copies.get(point);
        if (copy == null) {
          p.uncovered.add(r);
          continue;
        }
        EvaluationRunner.StoredReading now = stored(r);
        EvaluationRunner.StoredReading before = copy.find(now.parameter(), now.time());
        if (before == null) {
          if (EvaluationRunner.relevant(now.parameter())) {
            // judged before the first put at this time, so the group's own readings do not count
            boolean first =
                judged
                    .computeIfAbsent(point, k -> new java.util.HashMap<>())
                    .computeIfAbsent(now.time(), t -> !copy.anyAt(t, EvaluationRunner::relevant));
            if (first) {
              newTimes.computeIfAbsent(point, k -> new java.util.HashSet<>()).add(now.time());
            }
          }
          fresh.add(r);
          p.inserted++;
        } else if (same(before, now)) {
          p.unchanged++;
          continue;
        } else {
          // a correction at a time that had a relevant reading: never a first evaluation
          judged
              .computeIfAbsent(point, k -> new java.util.HashMap<>())
              .putIfAbsent(now.time(), !copy.anyAt(now.time(), EvaluationRunner::relevant));
          corrections.add(r);
          p.corrected++;
        }
        copy.put(now);
        Instant[] range = changed.get(point);
        if (range == null) {
          changed.put(point, new Instant[] {now.time(), now.time()});
        } else {
          range[0] = min(range[0], now.time());
          range[1] = max(range[1], now.time());
        }
        changedPerPoint.computeIfAbsent(point, k -> new int[1])[0]++;
      }
      changedPerPoint.forEach(
          (point, n) -> p.changedPerPlant.merge(current.get(point).plantId(), n[0], Integer::sum));
    }
    w.fresh = fresh;
    w.corrections = corrections;
    w.changed = changed;
    w.newTimes = newTimes;
  }

  /**
   * Step 3: writes the readings (COPY for new ones, the upsert for corrections and for points
   * without a history) while the evaluation threads evaluate the points held in memory; then
   * evaluates the others on cold histories.
   */
  private void writeReadingsWhileEvaluating(GroupWrite w) {
    List<Pending> group = w.group;
    Duration window = w.window;
    Map<String, SamplePointConfigs.Versioned> current = w.current;
    Map<String, RecentReadings.PointHistory> copies = w.copies;
    List<ValidReading> fresh = w.fresh;
    List<ValidReading> corrections = w.corrections;
    Map<String, Instant[]> changed = w.changed;
    Map<String, java.util.Set<Instant>> newTimes = w.newTimes;
    // the points' keys for the evaluation rows, cached before the evaluation threads encode them
    evaluations.prepareKeys(changed.keySet());
    // evaluate the points held in memory on the evaluation threads while the readings are written
    Map<String, java.util.concurrent.Future<Evaluated>> running = new TreeMap<>();
    for (Map.Entry<String, Instant[]> e : changed.entrySet()) {
      RecentReadings.PointHistory copy = copies.get(e.getKey());
      if (copy != null) {
        String point = e.getKey();
        Instant from = e.getValue()[0];
        Instant to = e.getValue()[1].plus(window);
        java.util.Set<Instant> firsts = newTimes.getOrDefault(point, java.util.Set.of());
        running.put(
            point,
            evaluators.submit(
                () ->
                    evaluate(
                        current.get(point),
                        copy.forEvaluation(from, to, window),
                        from,
                        to,
                        firsts)));
      }
    }
    Map<String, List<EvaluationRunner.Result>> results = new TreeMap<>();
    List<BinaryCopy> created = new ArrayList<>();
    List<EvaluationRunner.Result> recomputed = new ArrayList<>();
    try {
      readings.copyNew(fresh);
      if (!corrections.isEmpty()) {
        ReadingStore.Counts counts = readings.upsert(corrections);
        if (counts.corrected() != corrections.size()) {
          throw new IllegalStateException(
              "in-memory readings out of step with the database; the batch is retried");
        }
      }
      // the rollups: new readings added to their hours, hours with corrections or readings of
      // the plain path recomputed from reading (one call)
      java.util.Set<ReadingRollups.Hour> touched = ReadingRollups.hours();
      ReadingRollups.hoursOf(corrections, touched);
      for (Pending p : group) {
        if (p.uncovered.isEmpty()) {
          continue;
        }
        ReadingStore.Counts counts = readings.upsert(p.uncovered);
        p.inserted += counts.inserted();
        p.corrected += counts.corrected();
        p.unchanged += counts.unchanged();
        if (counts.inserted() + counts.corrected() > 0) {
          for (ValidReading r : p.uncovered) {
            widen(changed, r.samplePointId(), r.time(), r.time());
            p.changedPerPlant.merge(current.get(r.samplePointId()).plantId(), 1, Integer::sum);
          }
          ReadingRollups.hoursOf(p.uncovered, touched);
        }
      }
      rollups.update(touched, fresh);

      // recompute every evaluation the changes can affect: [first change, last change + window]
      for (Map.Entry<String, Instant[]> e : changed.entrySet()) {
        String point = e.getKey();
        Evaluated done;
        if (running.containsKey(point)) {
          done = join(running.get(point));
        } else {
          Instant from = e.getValue()[0];
          Instant to = e.getValue()[1].plus(window);
          // no copy covers it: a cold history of the point, read back after this group's writes
          RecentReadings.PointHistory cold =
              recent.cold(from.minus(window), readings.between(point, from.minus(window), to));
          done =
              evaluate(
                  current.get(point),
                  cold.forEvaluation(from, to, window),
                  from,
                  to,
                  java.util.Set.of());
        }
        results.put(point, done.all());
        created.add(done.created());
        recomputed.addAll(done.recomputed());
      }
    } catch (RuntimeException e) {
      running.values().forEach(f -> f.cancel(true));
      throw e;
    }
    w.results = results;
    w.created = created;
    w.recomputed = recomputed;
  }

  /** Step 4: writes the evaluations (COPY at new times, upsert elsewhere), counted per batch. */
  private void writeEvaluations(GroupWrite w) {
    List<Pending> group = w.group;
    Duration window = w.window;
    List<BinaryCopy> created = w.created;
    List<EvaluationRunner.Result> recomputed = w.recomputed;
    Map<String, List<EvaluationRunner.Result>> results = w.results;
    evaluations.copyNew(created);
    evaluations.upsert(recomputed);
    List<EvaluationRunner.Result> written = new ArrayList<>();
    results.values().forEach(written::addAll);
    evaluationRollups.mark(written);
    for (Pending p : group) {
      p.ranges.forEach(
          (point, r) -> {
            Instant to = r[1].plus(window);
            for (EvaluationRunner.Result x : results.getOrDefault(point, List.of())) {
              if (!x.time().isBefore(r[0]) && !x.time().isAfter(to)) {
                p.evaluations++;
              }
            }
          });
    }
  }

  /** A point's recomputed evaluations: new ones encoded for COPY, the others to upsert. */
  private record Evaluated(
      List<EvaluationRunner.Result> all,
      BinaryCopy created,
      List<EvaluationRunner.Result> recomputed) {}

  private Evaluated evaluate(
      SamplePointConfigs.Versioned config,
      List<EvaluationRunner.StoredReading> history,
      Instant from,
      Instant to,
      java.util.Set<Instant> firstEvaluated) {
    List<EvaluationRunner.Result> all =
        metrics.timeEvaluation(
            () -> runner.run(config, history, from, to, limits.historyWindow(), limits.maxAge()));
    List<EvaluationRunner.Result> created = new ArrayList<>();
    List<EvaluationRunner.Result> recomputed = new ArrayList<>();
    for (EvaluationRunner.Result x : all) {
      (firstEvaluated.contains(x.time()) ? created : recomputed).add(x);
    }
    return new Evaluated(all, evaluations.encode(created), recomputed);
  }

  private static <T> T join(java.util.concurrent.Future<T> f) {
    try {
      return f.get();
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IllegalStateException("interrupted while evaluating", e);
    } catch (java.util.concurrent.ExecutionException e) {
      if (e.getCause() instanceof RuntimeException r) {
        throw r;
      }
      throw new IllegalStateException(e.getCause());
    }
  }

  /**
   * Validates readings exactly as the ingest would (units converted, every problem listed), and
   * stores nothing: for what-if calculations.
   *
   * @throws InvalidBatchException when any reading is invalid
   */
  public List<ValidReading> validateOnly(List<ReadingInput> inputs) {
    ReadingValidator.Outcome checked = check(inputs);
    if (!checked.rejected().isEmpty()) {
      throw new InvalidBatchException(checked.rejected());
    }
    return checked.valid();
  }

  /** The batch's size checks and the validation of every reading against the registry. */
  private ReadingValidator.Outcome check(List<ReadingInput> inputs) {
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
    return validator.validate(inputs, configs.existing(named));
  }

  /** A validated reading as the evaluation reads it. */
  public static EvaluationRunner.StoredReading asStored(ValidReading r) {
    return stored(r);
  }

  /** Stops the evaluation threads (after the web server has finished its requests). */
  @jakarta.annotation.PreDestroy
  void stop() {
    evaluators.shutdown();
  }

  private static EvaluationRunner.StoredReading stored(ValidReading r) {
    return new EvaluationRunner.StoredReading(
        r.parameter().code(),
        r.time(),
        r.value(),
        r.quality().code(),
        r.sampleTemperatureCel(),
        r.compensated());
  }

  /** As PostgreSQL's IS DISTINCT FROM would judge the stored row (NaN temperature: none). */
  private static boolean same(EvaluationRunner.StoredReading a, EvaluationRunner.StoredReading b) {
    boolean noA = Double.isNaN(a.sampleTemperatureCel());
    boolean noB = Double.isNaN(b.sampleTemperatureCel());
    return a.value() == b.value()
        && a.quality() == b.quality()
        && a.compensated() == b.compensated()
        && (noA ? noB : !noB && a.sampleTemperatureCel() == b.sampleTemperatureCel());
  }

  private static void widen(Map<String, Instant[]> ranges, String point, Instant a, Instant b) {
    ranges.merge(
        point, new Instant[] {a, b}, (x, y) -> new Instant[] {min(x[0], y[0]), max(x[1], y[1])});
  }

  private static Instant min(Instant a, Instant b) {
    return a == null ? b : b == null ? a : a.isBefore(b) ? a : b;
  }

  private static Instant max(Instant a, Instant b) {
    return a == null ? b : b == null ? a : a.isAfter(b) ? a : b;
  }
}
