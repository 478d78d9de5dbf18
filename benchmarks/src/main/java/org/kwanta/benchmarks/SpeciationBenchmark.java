package org.kwanta.benchmarks;

import java.util.concurrent.TimeUnit;
import org.kwanta.model.aqueous.Component;
import org.kwanta.model.aqueous.Composition;
import org.kwanta.model.aqueous.PhBand;
import org.kwanta.model.aqueous.Speciation;
import org.kwanta.model.aqueous.SpeciationOptions;
import org.kwanta.model.aqueous.SpeciationResult;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.model.water.Water;
import org.kwanta.model.water.WaterState;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/**
 * Speciation at 300 °C on saturation of an ammonia-treated feedwater with a chloride, sulfate, CO2
 * and sodium ingress (Brackenmoor-style numbers): one speciation with the water state precomputed
 * outside the timed part (target ≤ 5 µs), and the full pH band over the alternative constant sets.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SampleTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
public class SpeciationBenchmark {

  private Composition composition;
  private WaterState water300;
  private SpeciationOptions options;
  private SpeciationOptions withoutAssociations;

  @Setup
  public void setUp() {
    composition =
        Composition.builder()
            .milligramsPerKilogram(Component.AMMONIA, 1.0)
            .microgramsPerKilogram(Component.CHLORIDE, 5)
            .microgramsPerKilogram(Component.SULFATE, 5)
            .microgramsPerKilogram(Component.CARBON_DIOXIDE, 50)
            .microgramsPerKilogram(Component.SODIUM, 3)
            .build();
    water300 = Water.atSaturation(573.15, IonizationFormulation.R11_07);
    options = SpeciationOptions.defaults();
    withoutAssociations = options.withAssociations(java.util.Set.of());
  }

  /** One speciation; the WaterState is precomputed in setUp. */
  @Benchmark
  public SpeciationResult singleSpeciationAt300Celsius() {
    return Speciation.solve(composition, water300, options);
  }

  /**
   * The same speciation without the sodium ion pairs (the plain dissociation chains): the cost of
   * the pairs is the difference to {@link #singleSpeciationAt300Celsius()}.
   */
  @Benchmark
  public SpeciationResult singleSpeciationAt300CelsiusWithoutAssociations() {
    return Speciation.solve(composition, water300, withoutAssociations);
  }

  /** pH at 300 °C over every distinct alternative constant set (the default included). */
  @Benchmark
  public PhBand bandOverAlternativeSetsAt300Celsius() {
    return Speciation.band(composition, water300, options);
  }
}
