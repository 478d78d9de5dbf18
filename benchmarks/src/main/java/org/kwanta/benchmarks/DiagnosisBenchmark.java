package org.kwanta.benchmarks;

import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.concurrent.TimeUnit;
import org.kwanta.model.diagnosis.CoolingWater;
import org.kwanta.model.diagnosis.Diagnoser;
import org.kwanta.model.diagnosis.Minute;
import org.kwanta.model.evaluation.Regime;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/**
 * The diagnosis over time of one point with an upstream and a downstream neighbour, on 27 h of
 * invented minute data (demo only) with a condenser leak in the last hour: the latest minute (what
 * the state, the overview and the metrics ask for) and a whole day (GET .../findings).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SampleTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
public class DiagnosisBenchmark {

  private Map<String, Diagnoser.Series> series;
  private Diagnoser diagnoser;
  private Instant last;

  @Setup
  public void setUp() {
    diagnoser = new Diagnoser(Diagnoser.Settings.defaults());
    Instant start = Instant.parse("2026-03-02T00:00:00Z");
    int minutes = 27 * 60;
    last = start.plus(Duration.ofMinutes(minutes - 1));
    series =
        Map.of(
            "CPD",
                series(
                    new Diagnoser.Point("CPD", Regime.AVT_O, CoolingWater.BRACKISH, List.of()),
                    start,
                    minutes,
                    1),
            "ECO",
                series(
                    new Diagnoser.Point("ECO", Regime.AVT_O, CoolingWater.BRACKISH, List.of("CPD")),
                    start,
                    minutes,
                    2),
            "DRUM",
                series(
                    new Diagnoser.Point(
                        "DRUM", Regime.AVT_O, CoolingWater.BRACKISH, List.of("ECO")),
                    start,
                    minutes,
                    3));
  }

  private static Diagnoser.Series series(Diagnoser.Point p, Instant start, int minutes, long seed) {
    Random r = new Random(seed);
    List<Minute> out = new ArrayList<>(minutes);
    for (int m = 0; m < minutes; m++) {
      double leak = Math.max(0, m - (minutes - 60)) / 60.0;
      double swing = Math.sin(2 * Math.PI * m / 1440.0);
      double sc = 8.5 * (1 + 0.03 * swing) * (1 + 0.004 * r.nextGaussian());
      out.add(
          new Minute(
              start.plus(Duration.ofMinutes(m)),
              sc,
              0.09 + 0.19 * leak + 0.002 * r.nextGaussian(),
              0.06 + 0.19 * leak + 0.002 * r.nextGaussian(),
              9.6 + 0.013 * swing + 0.01 * r.nextGaussian(),
              9.6 + 0.013 * swing,
              0.3 + 8 * leak + 0.01 * r.nextGaussian()));
    }
    return new Diagnoser.Series(p, out);
  }

  @Benchmark
  public List<Diagnoser.Diagnosed> latestMinute() {
    return diagnoser.diagnose(series, "ECO", last, last);
  }

  @Benchmark
  public List<Diagnoser.Diagnosed> wholeDay() {
    return diagnoser.diagnose(series, "ECO", last.minus(Duration.ofHours(24)), last);
  }
}
