package org.kwanta.benchmarks;

import com.hummeling.if97.IF97;
import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.util.Locale;
import java.util.SplittableRandom;
import java.util.function.DoubleBinaryOperator;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.model.water.Water;

/**
 * A companion to {@link WaterBenchmark} for shared machines: the same operations on the same
 * inputs, timed in thread CPU time rather than wall time, so that time lost to other processes is
 * not counted. Each operation runs in a fresh JVM (pass its name) to keep call sites monomorphic;
 * it is warmed up for four rounds and the best of eight further rounds is printed.
 *
 * <p>Usage: {@code java -cp <benchmark classpath> org.kwanta.benchmarks.WaterCpuTime
 * kwantaPkw|kwantaDensity|kwantaState|hummelingDensity}
 */
public final class WaterCpuTime {

  private static final int SIZE = 1024;

  private WaterCpuTime() {}

  public static void main(String[] args) {
    double[] temperaturesK = new double[SIZE];
    double[] pressuresPa = new double[SIZE];
    SplittableRandom random = new SplittableRandom(42);
    for (int i = 0; i < SIZE; i++) {
      double t = 273.15 + random.nextDouble(0, 350);
      double low = Math.max(Water.saturationPressurePa(t), Water.ATMOSPHERIC_PRESSURE_PA) * 1.001;
      temperaturesK[i] = t;
      pressuresPa[i] = random.nextDouble(low, 25e6);
    }
    IF97 hummeling = new IF97(IF97.UnitSystem.SI);
    String name = args.length > 0 ? args[0] : "kwantaPkw";
    DoubleBinaryOperator operation =
        switch (name) {
          case "kwantaPkw" -> (t, p) -> Water.pKw(t, p, IonizationFormulation.R11_07);
          case "kwantaDensity" -> Water::densityKgPerM3;
          case "kwantaState" -> (t, p) -> Water.at(t, p, IonizationFormulation.R11_07).pKw();
          case "hummelingDensity" -> (t, p) -> hummeling.densityPT(p, t);
          default -> throw new IllegalArgumentException("unknown operation " + name);
        };
    int calls = name.startsWith("hummeling") ? 50_000 : 2_000_000;
    ThreadMXBean threads = ManagementFactory.getThreadMXBean();
    double best = Double.MAX_VALUE;
    double sink = 0;
    for (int round = 0; round < 12; round++) {
      long start = threads.getCurrentThreadCpuTime();
      for (int k = 0; k < calls; k++) {
        int i = k & (SIZE - 1);
        sink += operation.applyAsDouble(temperaturesK[i], pressuresPa[i]);
      }
      long end = threads.getCurrentThreadCpuTime();
      if (round >= 4) {
        best = Math.min(best, (end - start) / (double) calls);
      }
    }
    System.out.printf(
        Locale.ROOT,
        "%-18s %8.1f ns CPU per call (best of 8 rounds; checksum %.3e)%n",
        name,
        best,
        sink);
  }
}
