package org.kwanta.benchmarks;

import java.time.Instant;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import org.kwanta.model.Parameter;
import org.kwanta.model.conductivity.AlkalizerMix;
import org.kwanta.model.conductivity.ForwardConductivity;
import org.kwanta.model.conductivity.Solutes;
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
 * Forward conductivity of an invented Brackenmoor feedwater (1.0 mg/kg NH₃, 2 µg/kg Cl, 20 µg/kg
 * CO₂; demo data): the three channels with each ion's share at 25 °C. And, for the cost of the
 * inverse over all roots, the evaluation of phosphate boiler water whose specific conductivity lies
 * below its cation conductivity (SC 3.82, CACE 4.06 µS/cm, Na 630 µg/kg), against the same
 * phosphate at Na:PO₄ 3.0 (SC above CACE: one root).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SampleTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
public class ConductivityBenchmark {

  private Solutes feedwater;
  private SamplePointConfig drum;
  private Snapshot twoRoots;
  private Snapshot oneRoot;

  @Setup
  public void setUp() {
    feedwater = new Solutes(1.0 / 17.031 / 1000, 0, 2 / 35.453 / 1e6, 0, 20 / 44.009 / 1e6, 0);
    drum =
        SamplePointConfig.of(
            "U2-HP-DRUM", Regime.PHOSPHATE, AlkalizerMix.AMMONIA, 603.15, Double.NaN);
    Instant now = Instant.parse("2025-03-14T10:00:00Z");
    Map<Parameter, List<Reading>> h = new EnumMap<>(Parameter.class);
    h.put(Parameter.SPECIFIC_CONDUCTIVITY, List.of(Reading.raw(now, 3.82, 298.15)));
    h.put(Parameter.CATION_CONDUCTIVITY, List.of(Reading.raw(now, 4.06, 298.15)));
    h.put(Parameter.SODIUM, List.of(Reading.raw(now, 630, 298.15)));
    twoRoots = new Snapshot(now, h);
    // the same phosphate at Na:PO4 3.0 (SC 4.84 µS/cm above CACE): one root, for comparison
    Map<Parameter, List<Reading>> one = new EnumMap<>(Parameter.class);
    one.put(Parameter.SPECIFIC_CONDUCTIVITY, List.of(Reading.raw(now, 4.84, 298.15)));
    one.put(Parameter.CATION_CONDUCTIVITY, List.of(Reading.raw(now, 4.06, 298.15)));
    one.put(Parameter.SODIUM, List.of(Reading.raw(now, 726, 298.15)));
    oneRoot = new Snapshot(now, one);
  }

  @Benchmark
  public ForwardConductivity.Channels forward() {
    return ForwardConductivity.of(feedwater, AlkalizerMix.AMMONIA, 298.15);
  }

  @Benchmark
  public Evaluation phosphateOneRoot() {
    return Evaluator.DEFAULT.evaluate(drum, oneRoot);
  }

  @Benchmark
  public Evaluation phosphateTwoRoots() {
    return Evaluator.DEFAULT.evaluate(drum, twoRoots);
  }
}
