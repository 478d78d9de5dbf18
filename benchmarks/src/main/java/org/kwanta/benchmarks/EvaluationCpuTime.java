package org.kwanta.benchmarks;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.util.Arrays;
import java.util.Locale;
import org.kwanta.model.conductivity.AlkalizerMix;
import org.kwanta.model.evaluation.Evaluation;
import org.kwanta.model.evaluation.Evaluator;
import org.kwanta.model.evaluation.Regime;
import org.kwanta.model.evaluation.SamplePointConfig;
import org.kwanta.model.evaluation.Snapshot;

/**
 * A companion to {@link EvaluationBenchmark} for shared machines, as {@link WaterCpuTime} is to
 * {@link WaterBenchmark}: the same evaluation of the same snapshot, timed in thread CPU time rather
 * than wall time, so that time lost to other processes is not counted (time lost to caches they
 * share is). It is warmed up for eight rounds of 20 000 evaluations; the best, lower quartile and
 * median of sixteen further rounds are printed. Compare two builds in alternating fresh JVMs.
 *
 * <p>Usage: {@code java -cp <benchmark classpath> org.kwanta.benchmarks.EvaluationCpuTime}
 */
public final class EvaluationCpuTime {

  private static final int WARM_UP_ROUNDS = 8;
  private static final int ROUNDS = 16;
  private static final int CALLS = 20_000;

  private EvaluationCpuTime() {}

  public static void main(String[] args) {
    SamplePointConfig config =
        SamplePointConfig.of("U1-ECO-IN", Regime.AVT_O, AlkalizerMix.AMMONIA, 428.15, 15e6);
    Snapshot snapshot = EvaluationBenchmark.snapshot();
    ThreadMXBean threads = ManagementFactory.getThreadMXBean();
    double[] microseconds = new double[ROUNDS];
    int checksum = 0;
    for (int round = 0; round < WARM_UP_ROUNDS + ROUNDS; round++) {
      long start = threads.getCurrentThreadCpuTime();
      for (int k = 0; k < CALLS; k++) {
        Evaluation e = Evaluator.DEFAULT.evaluate(config, snapshot);
        checksum += e.findings().size();
      }
      long end = threads.getCurrentThreadCpuTime();
      if (round >= WARM_UP_ROUNDS) {
        microseconds[round - WARM_UP_ROUNDS] = (end - start) / 1e3 / CALLS;
      }
    }
    Arrays.sort(microseconds);
    System.out.printf(
        Locale.ROOT,
        "evaluation %.2f µs CPU best, %.2f lower quartile, %.2f median of %d rounds (checksum %d)%n",
        microseconds[0],
        microseconds[ROUNDS / 4],
        (microseconds[ROUNDS / 2 - 1] + microseconds[ROUNDS / 2]) / 2,
        ROUNDS,
        checksum);
  }
}
