package org.kwanta.benchmarks;

import java.util.concurrent.TimeUnit;
import org.kwanta.model.aqueous.Amounts;
import org.kwanta.model.aqueous.Component;
import org.kwanta.model.aqueous.Composition;
import org.kwanta.model.aqueous.PhSolution;
import org.kwanta.model.aqueous.Speciation;
import org.kwanta.model.aqueous.SpeciationOptions;
import org.kwanta.model.conductivity.AlkalizerMix;
import org.kwanta.model.conductivity.Conductivity;
import org.kwanta.model.conductivity.Equilibria;
import org.kwanta.model.conductivity.Solute;
import org.kwanta.model.conductivity.Solutes;
import org.kwanta.model.conductivity.Solution;
import org.kwanta.model.conductivity.SolutionModel;
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
 * The two charge-balance solvers on the same water at 25 °C (invented Brackenmoor feedwater: 1
 * mg/kg NH3, 5 µg/kg Cl, 50 µg/kg CO2, 3 µg/kg Na): the speciation engine's general solver (pH
 * only, the path the evaluation uses at the operating temperature) against the conductivity model's
 * forward solve, and the conductivity model's inverse fit (the alkalizer that gives a measured κ),
 * which the general solver can only do as a search around repeated forward solves.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SampleTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
public class ChargeBalanceBenchmark {

  private Composition composition;
  private WaterState water25;
  private SpeciationOptions options;
  private SolutionModel model;
  private Solutes solutes;
  private Solutes known;
  private double kappa;

  @Setup
  public void setUp() {
    composition =
        Composition.builder()
            .milligramsPerKilogram(Component.AMMONIA, 1.0)
            .microgramsPerKilogram(Component.CHLORIDE, 5)
            .microgramsPerKilogram(Component.CARBON_DIOXIDE, 50)
            .microgramsPerKilogram(Component.SODIUM, 3)
            .build();
    water25 = Water.at(298.15, Water.ATMOSPHERIC_PRESSURE_PA, IonizationFormulation.R11_07);
    options = SpeciationOptions.defaults();
    model =
        new SolutionModel(Conductivity.at(water25), Equilibria.of(water25), AlkalizerMix.AMMONIA);
    solutes =
        new Solutes(
            Amounts.molalFromMilligramsPerKilogram(Component.AMMONIA, 1.0),
            Amounts.molalFromMicrogramsPerKilogram(Component.SODIUM, 3),
            Amounts.molalFromMicrogramsPerKilogram(Component.CHLORIDE, 5),
            0,
            Amounts.molalFromMicrogramsPerKilogram(Component.CARBON_DIOXIDE, 50),
            0);
    known = solutes.with(Solute.ALKALIZER, 0);
    kappa = model.solve(solutes).kappa();
  }

  /** The speciation engine's general solver, pH only. */
  @Benchmark
  public PhSolution generalSolverPh() {
    return Speciation.ph(composition, water25, options);
  }

  /** The conductivity model's forward solve of the same water (pH and κ). */
  @Benchmark
  public Solution conductivityModelSolve() {
    return model.solve(solutes);
  }

  /** The conductivity model's inverse fit: the ammonia that gives the water's κ. */
  @Benchmark
  public Solution conductivityModelFit() {
    return model.fit(known, Solute.ALKALIZER, kappa);
  }
}
