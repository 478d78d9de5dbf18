package org.kwanta.model.evaluation;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.kwanta.model.Instrument;

/**
 * The five demo stories of the fictional Brackenmoor Energy Centre, as invented snapshots (demo
 * only): each must give the expected reason codes and what they point at, and the normal day none.
 */
class BrackenmoorStoriesTest {

  private static List<ReasonCode> codes(Evaluation e) {
    return e.findings().stream().map(Finding::code).toList();
  }

  /** Story 1: Unit 1 feedwater on ammonia at pH25 ≈ 9.6–9.8, everything green. */
  @Test
  void normalDayYieldsNoFinding() {
    double[] v = Demo.normalDayReadings();
    Evaluation e = Evaluator.DEFAULT.evaluate(Demo.u1EcoIn(), Demo.snapshot(Demo.normalDay()));
    assertThat(v[3]).isBetween(9.6, 9.8);
    assertThat(e.findings()).isEmpty();
    assertThat(e.calculatedPh().orElseThrow().rigorous()).isCloseTo(v[3], within(0.01));
    OperatingPh op = e.operatingPh().orElseThrow();
    assertThat(op.ph()).isBetween(op.low(), op.high());
    assertThat(op.ph()).isGreaterThan(op.neutralPh());
  }

  /**
   * Story 2: condenser leak, Unit 2: sodium and cation conductivity climb at U2-CPD. The rise is
   * judged over a day of history by the diagnosis (StoryBenchTest); the instant checks blame no
   * instrument.
   */
  @Test
  void condenserLeakBlamesNoInstrumentInTheInstantChecks() {
    Evaluation e = Evaluator.DEFAULT.evaluate(Demo.u2Cpd(), Demo.snapshot(Demo.condenserLeak()));
    assertThat(e.findings()).isEmpty();
  }

  /** Story 3: exhausted cation column, Unit 1 main steam: CACE creeps up tracking SC, Na flat. */
  @Test
  void exhaustedColumnIsLeftToTheDiagnosisOverTime() {
    // judged over a day of history with the neighbouring points (StoryBenchTest)
    Evaluation e =
        Evaluator.DEFAULT.evaluate(Demo.u1MainSteam(), Demo.snapshot(Demo.exhaustedColumn()));
    assertThat(codes(e)).doesNotContain(ReasonCode.CATION_ABOVE_SPECIFIC);
  }

  /** Story 4: drifting pH electrode, Unit 1 feedwater: measured pH wanders from calculated. */
  @Test
  void driftingElectrodePointsAtThePhInstrument() {
    Evaluation e =
        Evaluator.DEFAULT.evaluate(Demo.u1EcoIn(), Demo.snapshot(Demo.driftingElectrode()));
    assertThat(codes(e)).containsExactly(ReasonCode.PH_MEASURED_VS_CALCULATED);
    assertThat(e.findings().get(0).pointsAt()).isEqualTo(Instrument.PH);
  }

  /** Story 5: start-up with air in-leakage: CACE high, DCACE normal: carbon dioxide. */
  @Test
  void airInLeakageIsCarbonDioxideNotSalts() {
    Evaluation e = Evaluator.DEFAULT.evaluate(Demo.u1EcoIn(), Demo.snapshot(Demo.airInLeakage()));
    assertThat(codes(e)).containsExactly(ReasonCode.CARBON_DIOXIDE_INGRESS);
    assertThat(e.findings().get(0).pointsAt()).isEqualTo(Instrument.PROCESS);
    assertThat(e.composition().orElseThrow().carbonDioxideUgPerKg()).isCloseTo(400, within(20.0));
    assertThat(e.calculatedPh().orElseThrow().tradeFormulaInWindow()).isFalse();
  }
}
