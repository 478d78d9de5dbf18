package org.kwanta.model.conductivity;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.kwanta.model.aqueous.Component;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.model.water.Water;
import org.kwanta.model.water.WaterState;

/**
 * Internal consistency, not an outside source: the optimised {@link SolutionModel} (Newton on pH,
 * secant-accelerated ionic strength) against the unoptimised nested-Brent model of commit 51e8942
 * ({@link BrentSolutionModel}), on seeded random compositions over 0–100 °C and every fit the
 * evaluation uses. They must agree to numerical noise.
 */
class SolutionModelAgreesWithBrentTest {

  private static final AlkalizerMix[] MIXES = {
    AlkalizerMix.AMMONIA,
    AlkalizerMix.of(Component.MORPHOLINE),
    AlkalizerMix.of(Component.ETHANOLAMINE),
    new AlkalizerMix(Map.of(Component.AMMONIA, 0.6, Component.ETHANOLAMINE, 0.4)),
    new AlkalizerMix(
        Map.of(Component.AMMONIA, 0.5, Component.MORPHOLINE, 0.3, Component.DIMETHYLAMINE, 0.2))
  };

  record Sample(double temperatureK, AlkalizerMix mix, Solutes solutes, Solute unknown) {}

  static Stream<Arguments> samples() {
    Random r = new Random(20250314L);
    List<Arguments> out = new ArrayList<>();
    Solute[] fitted = {
      Solute.HYDROCHLORIC_ACID,
      Solute.CARBON_DIOXIDE,
      Solute.ALKALIZER,
      Solute.SODIUM_HYDROXIDE,
      Solute.PHOSPHORIC_ACID,
      Solute.SULFURIC_ACID,
      Solute.SODIUM_CHLORIDE
    };
    for (int i = 0; i < 120; i++) {
      double t = 273.65 + 99 * r.nextDouble();
      AlkalizerMix mix = MIXES[r.nextInt(MIXES.length)];
      Solute unknown = fitted[i % fitted.length];
      Solutes s =
          new Solutes(
              maybe(r, 1e-6, 1e-3),
              maybe(r, 1e-9, 1e-5),
              maybe(r, 1e-9, 1e-5),
              maybe(r, 1e-9, 1e-6),
              maybe(r, 1e-8, 1e-4),
              maybe(r, 1e-7, 1e-4));
      out.add(Arguments.of(i, new Sample(t, mix, s, unknown)));
    }
    return out.stream();
  }

  /** A log-uniform amount in [lo, hi], mol/kg, or zero one time in three. */
  private static double maybe(Random r, double lo, double hi) {
    if (r.nextInt(3) == 0) {
      return 0;
    }
    return lo * Math.pow(hi / lo, r.nextDouble());
  }

  @ParameterizedTest(name = "sample {0}")
  @MethodSource("samples")
  void solveAndFitAgreeWithTheBrentModel(int index, Sample c) {
    WaterState w =
        Water.at(c.temperatureK(), Water.ATMOSPHERIC_PRESSURE_PA, IonizationFormulation.R11_07);
    IonConductivities ions = Conductivity.at(w);
    Equilibria eq = Equilibria.of(w);
    SolutionModel fast = new SolutionModel(ions, eq, c.mix());
    BrentSolutionModel oracle = new BrentSolutionModel(ions, eq, c.mix());

    Solution a = fast.solve(c.solutes());
    Solution b = oracle.solve(c.solutes());
    same(a, b);

    // the fit recovers the unknown from the conductivity of the full composition
    double target = b.kappa();
    Solutes known = c.solutes().with(c.unknown(), 0);
    Solution fa = fast.fit(known, c.unknown(), target);
    Solution fb = oracle.fit(known, c.unknown(), target);
    same(fa, fb);
    // started from a nearby solution, the same decisions and the same result
    same(fast.fit(known, c.unknown(), target, fast.solve(c.solutes())), fb);
    // targets just above the background, where the original decides between the background
    // alone and an amount of the unknown at the activity iterates themselves
    double background = oracle.solve(known).kappa();
    for (double above : new double[] {1e-5, 1e-4, 1e-3, 3e-3, 1e-2, 3e-2}) {
      double k = background * (1 + above);
      Solution expected = oracle.fit(known, c.unknown(), k);
      same(fast.fit(known, c.unknown(), k), expected);
      same(fast.fit(known, c.unknown(), k, fa), expected);
    }
    // and from a slightly higher conductivity, started near the first fit
    Solution ga = fast.fit(known, c.unknown(), target * 1.02, fa);
    Solution gb = oracle.fit(known, c.unknown(), target * 1.02);
    same(ga, gb);
  }

  /**
   * Same pH, κ and I within 1e-10–1e-9, and the same amounts within 1e-9 relative or, for an amount
   * that is itself at the noise level of the charge balance, 1e-12 of the largest amount present.
   */
  private static void same(Solution a, Solution b) {
    assertThat(a.pH()).isCloseTo(b.pH(), within(1e-10));
    assertThat(a.kappa()).isCloseTo(b.kappa(), within(1e-10 * b.kappa()));
    assertThat(a.ionicStrength()).isCloseTo(b.ionicStrength(), within(1e-9 * b.ionicStrength()));
    Solutes x = a.solutes();
    Solutes y = b.solutes();
    double floor =
        1e-12
            * Math.max(
                Math.max(y.alkalizer(), y.sodium()),
                Math.max(
                    Math.max(y.chloride(), y.sulfate()), Math.max(y.carbonate(), y.phosphate())));
    for (Solute s : Solute.values()) {
      assertThat(x.amount(s))
          .as(s.name())
          .isCloseTo(y.amount(s), within(1e-9 * y.amount(s) + floor));
    }
  }
}
