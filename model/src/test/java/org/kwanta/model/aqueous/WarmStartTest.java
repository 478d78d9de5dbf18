package org.kwanta.model.aqueous;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.EnumMap;
import java.util.Map;
import java.util.Random;
import java.util.stream.LongStream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.model.water.Water;
import org.kwanta.model.water.WaterState;

/**
 * The warm-started and pH-only paths of {@link Speciation} against the plain {@link
 * Speciation#solve(Composition, WaterState, SpeciationOptions)}, over seeded random compositions at
 * 0-350 °C. A consistency check between two paths of this engine (not an outside source): the start
 * must only change where the search begins, never the root beyond the solver tolerances.
 */
class WarmStartTest {

  /** Agreement required in pH: far above the solver tolerances (1e-14 in x, 1e-12 mol/kg in I). */
  private static final double PH_AGREEMENT = 1e-10;

  static LongStream seeds() {
    return LongStream.rangeClosed(1, 200);
  }

  private static Composition randomComposition(Random rnd) {
    Composition.Builder b = Composition.builder();
    for (Component c : Component.values()) {
      if (rnd.nextDouble() < 0.3) {
        b.molal(c, Math.pow(10, -9 + 7 * rnd.nextDouble()));
      }
    }
    return b.build();
  }

  /** Every total scaled by an independent factor within ±10 %, as a tolerance band does. */
  private static Composition perturbed(Composition c, Random rnd) {
    Map<Component, Double> m = new EnumMap<>(Component.class);
    c.totals().forEach((k, v) -> m.put(k, v * (1 + 0.2 * (rnd.nextDouble() - 0.5))));
    return new Composition(m);
  }

  private static SpeciationOptions randomOptions(Random rnd, double temperatureK) {
    SpeciationOptions o =
        SpeciationOptions.defaults()
            .withConstants(ConstantSets.all().get(rnd.nextInt(ConstantSets.all().size())));
    boolean bDotApplies = temperatureK >= 298.15 && temperatureK <= 573.15;
    return bDotApplies && rnd.nextBoolean() ? o.withActivityModel(ActivityModel.B_DOT) : o;
  }

  @ParameterizedTest(name = "seed {0}")
  @MethodSource("seeds")
  void warmStartedAndPhOnlyPathsAgreeWithPlainSolve(long seed) {
    Random rnd = new Random(seed);
    double t = 273.15 + 350 * rnd.nextDouble();
    WaterState w = Water.atSaturation(t, IonizationFormulation.R11_07);
    SpeciationOptions options = randomOptions(rnd, t);
    Composition central = randomComposition(rnd);
    Composition nearby = perturbed(central, rnd);

    SpeciationResult plainCentral = Speciation.solve(central, w, options);
    SpeciationResult plainNearby = Speciation.solve(nearby, w, options);

    // The pH-only path without a start runs the same solver from the same cold bracket.
    PhSolution leanCentral = Speciation.ph(central, w, options);
    assertThat(leanCentral.ph()).isEqualTo(plainCentral.ph());
    assertThat(leanCentral.ionicStrengthMolPerKg()).isEqualTo(plainCentral.ionicStrengthMolPerKg());

    // Warm starts from the central solution, as the evaluator's perturbed solves do.
    assertThat(Speciation.ph(nearby, w, options, leanCentral).ph())
        .as("pH-only, warm, %s at %s K", nearby, t)
        .isCloseTo(plainNearby.ph(), within(PH_AGREEMENT));
    SpeciationResult warm = Speciation.solve(nearby, w, options, plainCentral);
    assertThat(warm.ph())
        .as("full, warm, %s at %s K", nearby, t)
        .isCloseTo(plainNearby.ph(), within(PH_AGREEMENT));
    assertThat(warm.chargeBalanceRelativeResidual()).isLessThan(1e-12);
    assertThat(warm.constants()).isEqualTo(plainNearby.constants());
    assertThat(warm.notices()).isEqualTo(plainNearby.notices());
    for (SpeciesAmount a : plainNearby.species()) {
      assertThat(warm.molality(a.species()))
          .isCloseTo(a.molalityMolPerKg(), within(1e-9 * a.molalityMolPerKg()));
    }
  }

  @ParameterizedTest(name = "seed {0}")
  @MethodSource("seeds")
  void aDistantStartStillFindsTheSameRoot(long seed) {
    Random rnd = new Random(seed);
    double t = 273.15 + 350 * rnd.nextDouble();
    WaterState w = Water.atSaturation(t, IonizationFormulation.R11_07);
    Composition c = randomComposition(rnd);
    // A start from an unrelated sample at another temperature: the verified bracket must widen.
    PhSolution far =
        Speciation.ph(
            randomComposition(rnd),
            Water.atSaturation(273.15 + 350 * rnd.nextDouble(), IonizationFormulation.R11_07),
            SpeciationOptions.defaults());
    assertThat(Speciation.ph(c, w, SpeciationOptions.defaults(), far).ph())
        .as("%s at %s K from %s", c, t, far)
        .isCloseTo(Speciation.solve(c, w).ph(), within(PH_AGREEMENT));
  }

  @ParameterizedTest(name = "seed {0}")
  @MethodSource("seeds")
  void bandMembersAgreeWithFullSolvesOfTheirSets(long seed) {
    Random rnd = new Random(seed);
    double t = 273.15 + 350 * rnd.nextDouble();
    WaterState w = Water.atSaturation(t, IonizationFormulation.R11_07);
    Composition c = randomComposition(rnd);
    SpeciationOptions options = SpeciationOptions.defaults();
    PhBand band = Speciation.band(c, w, options);
    assertThat(band.members()).isNotEmpty();
    for (PhBand.Member m : band.members()) {
      SpeciationResult full =
          Speciation.solve(c, w, options.withConstants(ConstantSets.byId(m.constantSet())));
      assertThat(m.ph())
          .as("%s, %s at %s K", m.constantSet(), c, t)
          .isCloseTo(full.ph(), within(PH_AGREEMENT));
      assertThat(m.extrapolated()).isEqualTo(full.anyExtrapolated());
    }
  }
}
