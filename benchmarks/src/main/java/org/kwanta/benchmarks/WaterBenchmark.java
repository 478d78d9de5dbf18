package org.kwanta.benchmarks;

import com.hummeling.if97.IF97;
import java.util.SplittableRandom;
import java.util.concurrent.TimeUnit;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.model.water.Water;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * Cost of one pKw(T, p) evaluation including the IF97 density, against the density alone from
 * com.hummeling:if97 1.0.5 at the same (T, p). Inputs cycle through 1024 precomputed liquid states
 * (0–350 °C, p_s or 0.101325 MPa up to 25 MPa) so the JIT cannot constant-fold them.
 */
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
@State(Scope.Thread)
public class WaterBenchmark {

  private static final int SIZE = 1024;

  private final double[] temperaturesK = new double[SIZE];
  private final double[] pressuresPa = new double[SIZE];
  private IF97 hummeling;
  private int index;

  @Setup(Level.Trial)
  public void setUp() {
    SplittableRandom random = new SplittableRandom(42);
    for (int i = 0; i < SIZE; i++) {
      double t = 273.15 + random.nextDouble(0, 350);
      double low = Math.max(Water.saturationPressurePa(t), Water.ATMOSPHERIC_PRESSURE_PA) * 1.001;
      temperaturesK[i] = t;
      pressuresPa[i] = random.nextDouble(low, 25e6);
    }
    hummeling = new IF97(IF97.UnitSystem.SI);
  }

  private int next() {
    index = (index + 1) & (SIZE - 1);
    return index;
  }

  /** pKw (IAPWS R11-07) with the IF97 density, through the public fast method. */
  @Benchmark
  public double kwantaPkw() {
    int i = next();
    return Water.pKw(temperaturesK[i], pressuresPa[i], IonizationFormulation.R11_07);
  }

  /** IF97 density alone, through the public facade. */
  @Benchmark
  public double kwantaDensity() {
    int i = next();
    return Water.densityKgPerM3(temperaturesK[i], pressuresPa[i]);
  }

  /** The whole water state (density, pKw, ε, Debye–Hückel A and B). */
  @Benchmark
  public Object kwantaState() {
    int i = next();
    return Water.at(temperaturesK[i], pressuresPa[i], IonizationFormulation.R11_07);
  }

  /** IF97 density alone from com.hummeling:if97 1.0.5, SI units. */
  @Benchmark
  public double hummelingDensity() {
    int i = next();
    return hummeling.densityPT(pressuresPa[i], temperaturesK[i]);
  }
}
