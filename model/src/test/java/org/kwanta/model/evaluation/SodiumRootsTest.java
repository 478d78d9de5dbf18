package org.kwanta.model.evaluation;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.kwanta.model.Instrument;
import org.kwanta.model.Parameter;
import org.kwanta.model.conductivity.AlkalizerMix;
import org.kwanta.model.conductivity.Solute;
import org.kwanta.model.conductivity.Solutes;
import org.kwanta.model.conductivity.Solution;

/**
 * The inverse for phosphate and caustic water over all its roots (internal consistency: the engine
 * against itself). Readings are made by the forward model from an invented composition (the cation
 * channel sees the acids alone, the sodium analyser the sodium), then evaluated: the composition
 * and pH25 come back. The case SC 3.82, CACE 4.06 µS/cm, Na 630 µg/kg (Na:PO₄ 2.6) lies below the
 * acid's own conductivity, where two sodium amounts fit.
 */
class SodiumRootsTest {

  private static final SamplePointConfig DRUM =
      SamplePointConfig.of(
          "U2-HP-DRUM", Regime.PHOSPHATE, AlkalizerMix.AMMONIA, 603.15, Double.NaN);

  private static final SamplePointConfig CAUSTIC =
      SamplePointConfig.of("U2-HP-DRUM", Regime.CAUSTIC, AlkalizerMix.AMMONIA, 603.15, Double.NaN);

  private static Snapshot snapshot(double sc, double cace, double sodiumUgPerKg) {
    Map<Parameter, List<Reading>> h = Demo.map();
    h.put(Parameter.SPECIFIC_CONDUCTIVITY, List.of(Reading.raw(Demo.NOW, sc, Demo.T25)));
    h.put(Parameter.CATION_CONDUCTIVITY, List.of(Reading.raw(Demo.NOW, cace, Demo.T25)));
    if (sodiumUgPerKg > 0) {
      h.put(Parameter.SODIUM, List.of(Reading.raw(Demo.NOW, sodiumUgPerKg, Demo.T25)));
    }
    return new Snapshot(Demo.NOW, h);
  }

  private static double phosphateOfCace(double cace) {
    return Demo.MODEL_25.fit(Solutes.NONE, Solute.PHOSPHORIC_ACID, cace).solutes().phosphate();
  }

  private static List<ReasonCode> codes(Evaluation e) {
    return e.findings().stream().map(Finding::code).toList();
  }

  /**
   * Forward → readings → inverse → the same composition and pH25 (within 0.01), Na:PO₄ 2.6, 3.0.
   */
  @ParameterizedTest
  @CsvSource({"2.6", "3.0", "2.2", "1.5"})
  void phosphateRoundTripsWithTheSodiumReading(double ratio) {
    double po4 = phosphateOfCace(4.06);
    Solutes truth = new Solutes(0, ratio * po4, 0, 0, 0, po4);
    Solution forward = Demo.MODEL_25.solve(truth);
    double naUg = truth.sodium() * Evaluator.NA_G_PER_MOL * 1e6;
    Evaluation e = Evaluator.DEFAULT.evaluate(DRUM, snapshot(forward.kappa(), 4.06, naUg));
    InferredComposition c = e.composition().orElseThrow();
    assertThat(c.solutes().sodium()).isCloseTo(truth.sodium(), within(truth.sodium() * 1e-6));
    assertThat(c.solutes().phosphate()).isCloseTo(po4, within(po4 * 1e-6));
    assertThat(c.sodiumToPhosphateMolarRatio()).isCloseTo(ratio, within(1e-5));
    assertThat(e.calculatedPh().orElseThrow().rigorous()).isCloseTo(forward.pH(), within(0.01));
    assertThat(codes(e))
        .doesNotContain(ReasonCode.TWO_COMPOSITIONS_FIT, ReasonCode.NO_CONSISTENT_COMPOSITION);
  }

  /** The readings of the issue: the sodium reading picks the alkaline root, pH25 8.81. */
  @Test
  void issueCaseGivesTheForwardPh() {
    Evaluation e = Evaluator.DEFAULT.evaluate(DRUM, snapshot(3.82, 4.06, 630));
    InferredComposition c = e.composition().orElseThrow();
    assertThat(c.sodiumUgPerKg()).isCloseTo(630, within(5.0));
    assertThat(c.sodiumToPhosphateMolarRatio()).isCloseTo(2.6, within(0.02));
    assertThat(e.calculatedPh().orElseThrow().rigorous()).isCloseTo(8.81, within(0.01));
    assertThat(e.operatingPh().orElseThrow().ph())
        .isGreaterThan(e.operatingPh().orElseThrow().neutralPh());
    assertThat(codes(e))
        .doesNotContain(ReasonCode.TWO_COMPOSITIONS_FIT, ReasonCode.NO_CONSISTENT_COMPOSITION);
  }

  /** A sodium reading near the lower root chooses it (acidic phosphate water, pH25 ≈ 5). */
  @Test
  void sodiumReadingChoosesTheLowerRoot() {
    Evaluation e = Evaluator.DEFAULT.evaluate(DRUM, snapshot(3.82, 4.06, 20));
    InferredComposition c = e.composition().orElseThrow();
    assertThat(c.sodiumUgPerKg()).isBetween(10.0, 30.0);
    assertThat(e.calculatedPh().orElseThrow().rigorous()).isBetween(4.9, 5.1);
  }

  /** Without a sodium reading both roots are named and the alkaline one is reported. */
  @Test
  void withoutSodiumBothRootsAreAFinding() {
    Evaluation e = Evaluator.DEFAULT.evaluate(DRUM, snapshot(3.82, 4.06, 0));
    assertThat(e.calculatedPh().orElseThrow().rigorous()).isCloseTo(8.81, within(0.01));
    Finding f =
        e.findings().stream()
            .filter(x -> x.code() == ReasonCode.TWO_COMPOSITIONS_FIT)
            .findFirst()
            .orElseThrow();
    assertThat(f.explanation()).contains("pH25 8.81").contains("pH25 5.01");
  }

  /** A sodium reading far from both roots is a finding against the sodium analyser. */
  @Test
  void sodiumMatchingNeitherRootIsAFinding() {
    Evaluation e = Evaluator.DEFAULT.evaluate(DRUM, snapshot(3.82, 4.06, 200));
    assertThat(e.findings())
        .extracting(Finding::code, Finding::pointsAt)
        .contains(
            org.assertj.core.groups.Tuple.tuple(
                ReasonCode.NO_CONSISTENT_COMPOSITION, Instrument.SODIUM));
  }

  /** SC below the dip (≈ 1.20 µS/cm at Na:PO₄ 1.1 for CACE 4.06): no composition fits. */
  @Test
  void specificBelowTheDipHasNoConsistentComposition() {
    Evaluation e = Evaluator.DEFAULT.evaluate(DRUM, snapshot(0.9, 4.06, 630));
    assertThat(e.findings())
        .extracting(Finding::code, Finding::pointsAt)
        .contains(
            org.assertj.core.groups.Tuple.tuple(
                ReasonCode.NO_CONSISTENT_COMPOSITION, Instrument.SPECIFIC_CONDUCTIVITY));
    double ratio = e.composition().orElseThrow().sodiumToPhosphateMolarRatio();
    assertThat(ratio).isBetween(0.9, 1.3);
  }

  /**
   * Caustic water with chloride: NaOH at 1.5 and 3 times the chloride (SC below and above the
   * cation conductivity of the hydrochloric acid) round-trips.
   */
  @ParameterizedTest
  @CsvSource({"1.5", "3.0", "1.1", "0.5"})
  void causticRoundTripsWithTheSodiumReading(double naPerCl) {
    double cl = Demo.chloride(100);
    Solutes truth = new Solutes(0, naPerCl * cl, cl, 0, 0, 0);
    Solution forward = Demo.MODEL_25.solve(truth);
    double cace = Demo.MODEL_25.solve(new Solutes(0, 0, cl, 0, 0, 0)).kappa();
    double naUg = truth.sodium() * Evaluator.NA_G_PER_MOL * 1e6;
    Evaluation e = Evaluator.DEFAULT.evaluate(CAUSTIC, snapshot(forward.kappa(), cace, naUg));
    InferredComposition c = e.composition().orElseThrow();
    assertThat(c.solutes().sodium()).isCloseTo(truth.sodium(), within(truth.sodium() * 1e-6));
    assertThat(c.solutes().chloride()).isCloseTo(cl, within(cl * 1e-6));
    assertThat(e.calculatedPh().orElseThrow().rigorous()).isCloseTo(forward.pH(), within(0.01));
    assertThat(codes(e))
        .doesNotContain(ReasonCode.TWO_COMPOSITIONS_FIT, ReasonCode.NO_CONSISTENT_COMPOSITION);
  }
}
