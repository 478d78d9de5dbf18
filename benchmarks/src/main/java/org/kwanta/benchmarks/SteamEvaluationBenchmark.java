package org.kwanta.benchmarks;

import java.util.concurrent.TimeUnit;
import org.kwanta.model.conductivity.AlkalizerMix;
import org.kwanta.model.evaluation.Evaluation;
import org.kwanta.model.evaluation.Evaluator;
import org.kwanta.model.evaluation.Regime;
import org.kwanta.model.evaluation.SamplePointConfig;
import org.kwanta.model.evaluation.Snapshot;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/**
 * The snapshot of {@link EvaluationBenchmark} evaluated as an invented main-steam point at 540 °C
 * and 16 MPa (demo data): the same 25 °C work, then the pH of the first condensate at T_s(16 MPa)
 * with its band (a distribution fixed point with the full speciation, four times).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SampleTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
public class SteamEvaluationBenchmark {

  private SamplePointConfig config;
  private Snapshot snapshot;

  @Setup
  public void setUp() {
    config =
        SamplePointConfig.of("U1-MS", Regime.AVT_O, AlkalizerMix.AMMONIA, 813.15, 16e6).asSteam();
    snapshot = EvaluationBenchmark.snapshot();
  }

  @Benchmark
  public Evaluation evaluate() {
    return Evaluator.DEFAULT.evaluate(config, snapshot);
  }
}
