package org.kwanta.benchmarks;

import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import org.kwanta.model.Parameter;
import org.kwanta.model.conductivity.AlkalizerMix;
import org.kwanta.model.evaluation.Evaluation;
import org.kwanta.model.evaluation.Evaluator;
import org.kwanta.model.evaluation.Reading;
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
 * Full evaluation of an invented Brackenmoor U1-ECO-IN snapshot (demo data): three conductivity
 * channels compensated from a 26.3 °C sample, composition with tolerance propagation, calculated pH
 * (rigorous and trade formula), pH at 155 °C / 15 MPa with its band, and all checks over a 2-hour
 * history at 5-minute steps.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SampleTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
public class EvaluationBenchmark {

  private SamplePointConfig config;
  private Snapshot snapshot;

  @Setup
  public void setUp() {
    config = SamplePointConfig.of("U1-ECO-IN", Regime.AVT_O, AlkalizerMix.AMMONIA, 428.15, 15e6);
    snapshot = snapshot();
  }

  /** The invented snapshot: 2 hours of readings at 5-minute steps from a 26.3 °C sample. */
  static Snapshot snapshot() {
    Instant now = Instant.parse("2025-03-14T10:00:00Z");
    Map<Parameter, List<Reading>> h = new EnumMap<>(Parameter.class);
    double[][] base = {{9.85, 0.0}, {0.085, 0.0}, {0.062, 0.0}, {9.68, 0.0}};
    Parameter[] ps = {
      Parameter.SPECIFIC_CONDUCTIVITY,
      Parameter.CATION_CONDUCTIVITY,
      Parameter.DEGASSED_CATION_CONDUCTIVITY,
      Parameter.PH
    };
    for (int p = 0; p < ps.length; p++) {
      List<Reading> r = new ArrayList<>();
      for (int i = 0; i < 25; i++) {
        double v = base[p][0] * (1 + 0.003 * Math.sin(1.7 * i + p));
        r.add(Reading.raw(now.minus(Duration.ofMinutes(5L * (24 - i))), v, 299.45));
      }
      h.put(ps[p], r);
    }
    return new Snapshot(now, h);
  }

  @Benchmark
  public Evaluation evaluate() {
    return Evaluator.DEFAULT.evaluate(config, snapshot);
  }
}
