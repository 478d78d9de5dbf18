package org.kwanta.model.aqueous;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.stream.LongStream;
import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.kwanta.model.OutOfValidityRangeException;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.model.water.Water;
import org.kwanta.model.water.WaterState;

/**
 * Seeded random property checks (plain parameterised JUnit; each seed is reproducible). The
 * properties are chemistry that holds for any correct solver: adding a strong acid lowers pH,
 * adding a base raises it (Brønsted; the charge balance is monotone in a(H⁺), shown in the class
 * comment of {@code ChargeBalanceSolver}), totals are conserved, and the charge balance closes.
 */
class SpeciationPropertiesTest {

  static LongStream seeds() {
    return LongStream.rangeClosed(1, 150);
  }

  private static final double ADDITION_MOL_PER_KG = 1e-5;

  private static double randomTemperatureK(Random rnd) {
    return 273.15 + 350 * rnd.nextDouble();
  }

  private static Composition randomComposition(Random rnd) {
    Composition.Builder b = Composition.builder();
    for (Component c : Component.values()) {
      if (rnd.nextDouble() < 0.3) {
        b.molal(c, Math.pow(10, -9 + 6 * rnd.nextDouble()));
      }
    }
    return b.build();
  }

  private static WaterState water(double temperatureK) {
    return Water.atSaturation(temperatureK, IonizationFormulation.R11_07);
  }

  @ParameterizedTest(name = "seed {0}")
  @MethodSource("seeds")
  void phFallsWhenStrongAcidIsAddedAndRisesWhenAmmoniaIsAdded(long seed) {
    Random rnd = new Random(seed);
    Composition base = randomComposition(rnd);
    WaterState w = water(randomTemperatureK(rnd));
    double ph = Speciation.solve(base, w).ph();
    Composition acid =
        base.with(Component.CHLORIDE, base.molality(Component.CHLORIDE) + ADDITION_MOL_PER_KG);
    Composition ammonia =
        base.with(Component.AMMONIA, base.molality(Component.AMMONIA) + ADDITION_MOL_PER_KG);
    assertThat(Speciation.solve(acid, w).ph()).as("HCl added, %s", base).isLessThan(ph);
    assertThat(Speciation.solve(ammonia, w).ph()).as("NH3 added, %s", base).isGreaterThan(ph);
  }

  @ParameterizedTest(name = "seed {0}")
  @MethodSource("seeds")
  void chargeBalanceClosesAndTotalsAreConserved(long seed) {
    Random rnd = new Random(seed);
    Composition c = randomComposition(rnd);
    SpeciationResult r = Speciation.solve(c, water(randomTemperatureK(rnd)));
    assertThat(r.chargeBalanceRelativeResidual()).isLessThan(1e-12);
    for (Component comp : c.totals().keySet()) {
      // free species and the ion pairs and polyborates holding the component
      double sum = 0;
      for (SpeciesAmount a : r.species()) {
        sum += a.species().countOf(comp) * a.molalityMolPerKg();
      }
      assertThat(sum).isCloseTo(c.molality(comp), within(1e-14 * c.molality(comp)));
    }
  }

  /**
   * mg/kg → mol/kg → mg/kg (and µg/kg) return the input within 4 ulp: each direction is one
   * multiplication and one division of correctly rounded doubles.
   */
  @ParameterizedTest(name = "seed {0}")
  @MethodSource("seeds")
  void unitConversionsRoundTrip(long seed) {
    Random rnd = new Random(seed);
    Component c = Component.values()[rnd.nextInt(Component.values().length)];
    double mg = Math.pow(10, -6 + 10 * rnd.nextDouble());
    double back =
        Amounts.milligramsPerKilogramFromMolal(c, Amounts.molalFromMilligramsPerKilogram(c, mg));
    assertThat(Math.abs(back - mg)).isLessThanOrEqualTo(4 * Math.ulp(mg));
    double ug = mg * 1000;
    double backUg =
        Amounts.microgramsPerKilogramFromMolal(c, Amounts.molalFromMicrogramsPerKilogram(c, ug));
    assertThat(Math.abs(backUg - ug)).isLessThanOrEqualTo(4 * Math.ulp(ug));
    double molal = Amounts.molalFromMilligramsPerKilogram(c, mg);
    assertThat(Amounts.molalFromMicrogramsPerKilogram(c, ug))
        .isCloseTo(molal, within(4 * Math.ulp(molal)));
  }

  /**
   * Random, partly invalid input: the only exceptions are the documented ones
   * (OutOfValidityRangeException for temperature or totals out of range; IllegalArgumentException
   * for a vapour state). NoConvergenceException, NaN or anything else fails the test.
   */
  @ParameterizedTest(name = "seed {0}")
  @MethodSource("seeds")
  void nothingThrowsButTheDocumentedExceptions(long seed) {
    Random rnd = new Random(seed);
    double t = 200 + 500 * rnd.nextDouble();
    double p = rnd.nextBoolean() ? Double.NaN : Math.pow(10, 3 + 5 * rnd.nextDouble());
    try {
      Composition.Builder b = Composition.builder();
      for (Component c : Component.values()) {
        if (rnd.nextDouble() < 0.4) {
          double m =
              switch (rnd.nextInt(6)) {
                case 0 -> 0;
                case 1 -> -1e-6;
                case 2 -> 0.1;
                case 3 -> 0.2;
                default -> Math.pow(10, -12 + 11 * rnd.nextDouble());
              };
          b.molal(c, m);
        }
      }
      Composition comp = b.build();
      WaterState w =
          Double.isNaN(p)
              ? Water.atSaturation(t, IonizationFormulation.R11_07)
              : Water.at(t, p, IonizationFormulation.R11_07);
      ActivityModel model = rnd.nextBoolean() ? ActivityModel.DAVIES : ActivityModel.B_DOT;
      SpeciationResult r =
          Speciation.solve(comp, w, SpeciationOptions.defaults().withActivityModel(model));
      assertThat(r.ph()).isFinite();
      assertThat(r.chargeBalanceRelativeResidual()).isLessThan(1e-12);
    } catch (OutOfValidityRangeException expected) {
      assertThat(expected.getMessage()).contains(expected.range().unit());
    } catch (IllegalArgumentException vapour) {
      assertThat(vapour.getMessage()).contains("liquid");
    }
  }

  static Stream<Arguments> sweep() {
    List<Composition> compositions = new ArrayList<>();
    compositions.add(Composition.PURE_WATER);
    for (Component c : Component.values()) {
      compositions.add(Composition.of(c, 1e-12));
      compositions.add(Composition.of(c, 1e-1));
    }
    Composition.Builder all = Composition.builder();
    Composition.Builder traces = Composition.builder();
    for (Component c : Component.values()) {
      all.molal(c, 1e-1);
      traces.molal(c, 1e-12);
    }
    compositions.add(all.build());
    compositions.add(traces.build());
    compositions.add(
        Composition.builder()
            .molal(Component.CHLORIDE, 0.1)
            .molal(Component.AMMONIA, 1e-12)
            .build());
    compositions.add(
        Composition.builder().molal(Component.SODIUM, 0.1).molal(Component.SULFATE, 1e-12).build());
    compositions.add(
        Composition.builder().molal(Component.PHOSPHATE, 0.1).molal(Component.SODIUM, 0.1).build());
    compositions.add(
        Composition.builder().molal(Component.BORON, 0.1).molal(Component.LITHIUM, 1e-3).build());
    List<Arguments> args = new ArrayList<>();
    for (int t = 0; t <= 350; t += 25) {
      double tk = t == 0 ? 273.16 : t + 273.15;
      for (Composition c : compositions) {
        args.add(Arguments.of(tk, c));
      }
    }
    return args.stream();
  }

  /**
   * Convergence across the engine's range for extreme compositions: pure water, every component
   * alone at 1e-12 and 0.1 mol/kg, all at once, strong acid and base at 0.1 mol/kg. A solution
   * whose converged ionic strength exceeds the activity model's 0.1 mol/kg is refused, naming the
   * converged value (the check follows the solve, so the refusal shows convergence too).
   */
  @ParameterizedTest(name = "{0} K, {1}")
  @MethodSource("sweep")
  void solverConvergesAcrossTheRange(double temperatureK, Composition composition) {
    SpeciationResult r;
    try {
      r = Speciation.solve(composition, water(temperatureK));
    } catch (OutOfValidityRangeException e) {
      assertThat(e.range().quantity()).isEqualTo("ionic strength");
      assertThat(e.value()).isGreaterThan(e.range().max()).isFinite();
      return;
    }
    assertThat(r.ph()).isFinite();
    assertThat(r.chargeBalanceRelativeResidual()).isLessThan(1e-12);
    assertThat(r.ionicStrengthIterations()).isLessThan(ChargeBalanceSolver.MAX_OUTER_ITERATIONS);
  }
}
