package org.kwanta.service.ingest;

import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.TreeSet;
import org.kwanta.model.OutOfValidityRangeException;
import org.kwanta.model.Parameter;
import org.kwanta.model.evaluation.Evaluation;
import org.kwanta.model.evaluation.Evaluator;
import org.kwanta.model.evaluation.Reading;
import org.kwanta.model.evaluation.Snapshot;
import org.kwanta.service.samplepoints.SamplePointConfigs;
import org.kwanta.service.water.WaterProperties;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * Recomputes the evaluations of one sample point over a time range from its stored readings. Pure
 * apart from the input it is given: the same readings always give the same evaluations, whatever
 * order they arrived in.
 */
@org.springframework.stereotype.Component
public final class EvaluationRunner {

  private static final Logger log = LoggerFactory.getLogger(EvaluationRunner.class);

  /**
   * The engine, with the formulation {@code kwanta.water.ionization} names, the amine K_D estimates
   * as {@code kwanta.evaluation.amine-distribution-estimates} says (off by default), and its
   * caches.
   */
  private final Evaluator evaluator;

  /** How old a drum-pressure reading may be to set the operating state ({@code kwanta.process}). */
  private final Duration drumPressureMaxAge;

  /** Whether the history slides from one evaluation time to the next (false: tests only). */
  private final boolean sliding;

  @org.springframework.beans.factory.annotation.Autowired
  EvaluationRunner(
      WaterProperties water, ProcessValueProperties process, EvaluationProperties evaluation) {
    this(
        new Evaluator(water.ionization())
            .withAmineDistributionEstimates(evaluation.amineDistributionEstimates()),
        process.drumPressureMaxAge());
  }

  /** A runner over the given engine (tests, benchmarks), drum pressures up to 10 minutes old. */
  public EvaluationRunner(Evaluator evaluator) {
    this(evaluator, ProcessValueProperties.DEFAULT_DRUM_PRESSURE_MAX_AGE);
  }

  /** A runner over the given engine and maximum age of a drum-pressure reading. */
  public EvaluationRunner(Evaluator evaluator, Duration drumPressureMaxAge) {
    this(evaluator, drumPressureMaxAge, true);
  }

  private EvaluationRunner(Evaluator evaluator, Duration drumPressureMaxAge, boolean sliding) {
    this.evaluator = evaluator;
    this.drumPressureMaxAge = drumPressureMaxAge;
    this.sliding = sliding;
  }

  /**
   * The same runner building every evaluation's history from scratch ({@link #historyFromScratch}):
   * the reference the sliding history is tested against.
   */
  EvaluationRunner fromScratch() {
    return new EvaluationRunner(evaluator, drumPressureMaxAge, false);
  }

  /** The engine this runner evaluates with. */
  public Evaluator evaluator() {
    return evaluator;
  }

  /**
   * A stored reading as the evaluation needs it; {@code sampleTemperatureCel} is NaN when absent.
   */
  public record StoredReading(
      String parameter,
      Instant time,
      double value,
      short quality,
      double sampleTemperatureCel,
      boolean compensated) {}

  /** One evaluation to store. */
  public record Result(String samplePointId, Instant time, EvaluationView view) {}

  /**
   * Evaluates at every time in [from, to] at which an engine parameter (or the sample temperature)
   * has a reading.
   *
   * @param readings the point's readings from {@code from − historyWindow} to {@code to}, ordered
   *     by time; before the bucket of {@code from}, the latest of each parameter per bucket is
   *     enough (see {@link #HISTORY_BUCKETS})
   */
  public List<Result> run(
      SamplePointConfigs.Versioned config,
      List<StoredReading> readings,
      Instant from,
      Instant to,
      Duration historyWindow,
      Duration maxAge) {
    TreeSet<Instant> times = new TreeSet<>();
    for (StoredReading r : readings) {
      if (!r.time().isBefore(from) && !r.time().isAfter(to) && relevant(r.parameter())) {
        times.add(r.time());
      }
    }
    List<Result> out = new ArrayList<>(times.size());
    long bucketMillis = bucketMillis(historyWindow);
    // per reading, once: its slot (engine parameter or sample temperature; -1: not used) and bucket
    int n = readings.size();
    int[] slot = new int[n];
    long[] bucket = new long[n];
    for (int i = 0; i < n; i++) {
      StoredReading r = readings.get(i);
      slot[i] = r.quality() == 2 ? -1 : slot(r.parameter());
      bucket[i] = bucketOf(r.time(), bucketMillis);
    }
    // The history each evaluation sees is kept as it slides: per slot, the index of the latest
    // reading of each bucket within the window, oldest bucket first (see historyFromScratch for the
    // rule written out; HistoryEquivalenceTest checks the two agree on random feeds).
    int[][] latest = new int[SLOTS][];
    int[] head = new int[SLOTS];
    int[] tail = new int[SLOTS];
    boolean[] needy = new boolean[n];
    Reading[] asRead = new Reading[n];
    int needyInWindow = 0;
    Parameter[] parameters = Parameter.values();
    int added = 0;
    int start = 0;
    int end = 0;
    for (Instant t : times) {
      Instant windowStart = t.minus(historyWindow);
      while (start < n && !readings.get(start).time().isAfter(windowStart)) {
        start++;
      }
      while (end < n && !readings.get(end).time().isAfter(t)) {
        end++;
      }
      // readings that arrived in the window: each becomes its bucket's latest
      for (; added < end; added++) {
        int k = slot[added];
        if (k < 0) {
          continue;
        }
        StoredReading r = readings.get(added);
        Parameter p = parameters[k];
        if (ENGINE_SLOT[k]) {
          if (p.isConductivity() && !r.compensated() && Double.isNaN(r.sampleTemperatureCel())) {
            needy[added] = true;
          } else {
            asRead[added] =
                new Reading(
                    r.time(),
                    r.value(),
                    p.isConductivity() && !r.compensated()
                        ? r.sampleTemperatureCel() + 273.15
                        : 298.15,
                    r.compensated());
          }
        }
        if (latest[k] == null) {
          latest[k] = new int[Math.min(n, HISTORY_BUCKETS + 2)];
        }
        if (tail[k] > head[k] && bucket[latest[k][tail[k] - 1]] == bucket[added]) {
          needyInWindow -= needy[latest[k][tail[k] - 1]] ? 1 : 0;
          latest[k][tail[k] - 1] = added;
        } else {
          if (tail[k] == latest[k].length) {
            int live = tail[k] - head[k];
            if (live * 2 > latest[k].length) {
              latest[k] = java.util.Arrays.copyOf(latest[k], Math.min(n, latest[k].length * 2));
            }
            System.arraycopy(latest[k], head[k], latest[k], 0, live);
            head[k] = 0;
            tail[k] = live;
          }
          latest[k][tail[k]++] = added;
        }
        needyInWindow += needy[added] ? 1 : 0;
      }
      // buckets whose latest reading left the window
      for (int k = 0; k < SLOTS; k++) {
        while (tail[k] > head[k] && latest[k][head[k]] < start) {
          needyInWindow -= needy[latest[k][head[k]]] ? 1 : 0;
          head[k]++;
        }
      }
      List<String> notes = new ArrayList<>();
      Map<Parameter, List<Reading>> history;
      double drumPressureMPa = Double.NaN;
      Instant drumPressureTime = null;
      int drum = Parameter.DRUM_PRESSURE.ordinal();
      if (tail[drum] > head[drum]) {
        StoredReading r = readings.get(latest[drum][tail[drum] - 1]);
        drumPressureMPa = r.value();
        drumPressureTime = r.time();
      }
      if (needyInWindow > 0 || !sliding) {
        // an uncompensated conductivity without its own sample temperature takes the latest sample
        // temperature before it in the history: the rule written out
        history = historyFromScratch(readings, slot, bucket, start, end, t, maxAge, notes);
      } else {
        history = new EnumMap<>(Parameter.class);
        for (int k = 0; k < SLOTS; k++) {
          int size = tail[k] - head[k];
          if (size > 0 && ENGINE_SLOT[k]) {
            Reading[] list = new Reading[size];
            for (int j = 0; j < size; j++) {
              list[j] = asRead[latest[k][head[k] + j]];
            }
            history.put(parameters[k], java.util.Arrays.asList(list));
          }
        }
      }
      OperatingCondition.Choice operating =
          OperatingCondition.choose(
              config.config(),
              config.cycleLocation(),
              drumPressureMPa,
              drumPressureTime,
              t,
              drumPressureMaxAge,
              notes);
      try {
        Evaluation e = evaluator.evaluate(operating.config(), new Snapshot(t, history));
        out.add(
            new Result(
                config.config().id(),
                t,
                EvaluationView.from(config.version(), e, dedupe(notes), operating.condition())));
      } catch (OutOfValidityRangeException e) {
        out.add(
            new Result(
                config.config().id(),
                t,
                new EvaluationView(
                    config.version(),
                    List.of(),
                    null,
                    null,
                    null,
                    List.of(),
                    false,
                    List.of("not evaluated: " + e.getMessage()))));
      } catch (RuntimeException e) {
        log.error("Evaluation of {} at {} failed", config.config().id(), t, e);
        out.add(
            new Result(
                config.config().id(),
                t,
                new EvaluationView(
                    config.version(),
                    List.of(),
                    null,
                    null,
                    null,
                    List.of(),
                    false,
                    List.of("not evaluated: internal error (logged)"))));
      }
    }
    return out;
  }

  /**
   * The history an evaluation at {@code t} sees, written out: the latest good or uncertain reading
   * of each parameter in each bucket of the window [{@code start}, {@code end}). So the trend,
   * flat-line and persistence checks cost the same at 1-second or 1-minute resolution, the database
   * need only return the latest reading per bucket for the older part of a window, and an
   * evaluation depends only on the stored readings, whatever their arrival order. An uncompensated
   * conductivity reading without its own sample temperature takes the latest sample temperature
   * before it in that history, if it is at most {@code maxAge} older; else it is not used (noted).
   */
  static Map<Parameter, List<Reading>> historyFromScratch(
      List<StoredReading> readings,
      int[] slot,
      long[] bucket,
      int start,
      int end,
      Instant t,
      Duration maxAge,
      List<String> notes) {
    long[] lastBucket = new long[SLOTS];
    java.util.Arrays.fill(lastBucket, Long.MIN_VALUE);
    List<StoredReading> seen = new ArrayList<>();
    for (int i = end - 1; i >= start; i--) {
      int k = slot[i];
      if (k >= 0 && lastBucket[k] != bucket[i]) {
        lastBucket[k] = bucket[i];
        seen.add(readings.get(i));
      }
    }
    Map<Parameter, List<Reading>> history = new EnumMap<>(Parameter.class);
    double lastSampleTemperatureCel = Double.NaN;
    Instant lastSampleTemperatureTime = null;
    for (int j = seen.size() - 1; j >= 0; j--) {
      StoredReading r = seen.get(j);
      if ("sample_temperature".equals(r.parameter())) {
        lastSampleTemperatureCel = r.value();
        lastSampleTemperatureTime = r.time();
        continue;
      }
      Parameter p = engineParameter(r.parameter());
      if (p == null) {
        continue;
      }
      double temperatureK;
      boolean compensated = r.compensated();
      if (!p.isConductivity() || compensated) {
        temperatureK = 298.15;
      } else if (!Double.isNaN(r.sampleTemperatureCel())) {
        temperatureK = r.sampleTemperatureCel() + 273.15;
      } else if (lastSampleTemperatureTime != null
          && Duration.between(lastSampleTemperatureTime, r.time()).compareTo(maxAge) <= 0) {
        temperatureK = lastSampleTemperatureCel + 273.15;
      } else {
        if (!r.time().isBefore(t.minus(maxAge))) {
          notes.add(
              r.parameter()
                  + " at "
                  + r.time()
                  + " is uncompensated and has no sample temperature: not used");
        }
        continue;
      }
      history
          .computeIfAbsent(p, k -> new ArrayList<>())
          .add(new Reading(r.time(), r.value(), temperatureK, compensated));
    }
    return history;
  }

  /**
   * History buckets per window: an evaluation sees at most this many readings (+1) per parameter.
   */
  public static final int HISTORY_BUCKETS = 30;

  /**
   * Bucket length for a history window: window / {@value #HISTORY_BUCKETS}, at least one second.
   */
  public static long bucketMillis(Duration historyWindow) {
    return Math.max(1000, historyWindow.toMillis() / HISTORY_BUCKETS);
  }

  /** The bucket of a time: floor(epoch millis / bucket millis). */
  public static long bucketOf(Instant t, long bucketMillis) {
    return Math.floorDiv(t.toEpochMilli(), bucketMillis);
  }

  private static List<String> dedupe(List<String> notes) {
    return notes.isEmpty() ? List.of() : List.copyOf(new java.util.LinkedHashSet<>(notes));
  }

  /** Whether readings of this parameter make evaluation times. */
  public static boolean relevant(String parameter) {
    return "sample_temperature".equals(parameter) || engineParameter(parameter) != null;
  }

  /** The drum pressure's code: read by the evaluation (operating state) but makes no times. */
  static final String DRUM_PRESSURE = Parameter.DRUM_PRESSURE.code();

  /**
   * Whether an evaluation reads this parameter: those that make evaluation times and the drum
   * pressure (a change of it re-evaluates the times after it, as any stored reading does, but a
   * drum-pressure reading alone makes no evaluation).
   */
  public static boolean readByEvaluation(String parameter) {
    return relevant(parameter) || DRUM_PRESSURE.equals(parameter);
  }

  /** One slot per catalogue parameter (the sample temperature has its own). */
  private static final int SLOTS = Parameter.values().length;

  /**
   * The slots whose readings go into the engine's history (not the sample temperature or the drum
   * pressure, which are read on the side).
   */
  private static final boolean[] ENGINE_SLOT = new boolean[SLOTS];

  static {
    for (Parameter p : Parameter.values()) {
      ENGINE_SLOT[p.ordinal()] =
          p.usedByEngine() && p != Parameter.SAMPLE_TEMPERATURE && p != Parameter.DRUM_PRESSURE;
    }
  }

  /** Index of a parameter the evaluation uses (engine parameters and sample temperature), or -1. */
  private static int slot(String code) {
    Parameter p = Parameter.byCode(code).orElse(null);
    return p != null
            && (p.usedByEngine()
                || p == Parameter.SAMPLE_TEMPERATURE
                || p == Parameter.DRUM_PRESSURE)
        ? p.ordinal()
        : -1;
  }

  /** The catalogue parameter with this code when the evaluation engine reads it, else null. */
  static Parameter engineParameter(String code) {
    Parameter p = Parameter.byCode(code).orElse(null);
    return p != null && p.usedByEngine() ? p : null;
  }
}
