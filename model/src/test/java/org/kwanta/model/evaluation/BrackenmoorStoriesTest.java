package org.kwanta.model.evaluation;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

/**
 * The five demo stories of the fictional Brackenmoor Energy Centre, as invented snapshots (demo
 * only): each must give the expected reason codes and suspects, and the normal day none.
 */
class BrackenmoorStoriesTest {

  private static List<ReasonCode> codes(Evaluation e) {
    return e.findings().stream().map(Finding::code).toList();
  }

  /** Story 1: Unit 1 feedwater on ammonia at pH25 ≈ 9.6–9.8, everything green. */
  @Test
  void normalDayYieldsNoFinding() {
    double[] v = Demo.readings(Demo.ammonia(3.5), 0, Demo.chloride(3), Demo.co2(10));
    Map<Parameter, List<Reading>> h = Demo.map();
    h.put(Parameter.SPECIFIC_CONDUCTIVITY, Demo.series(i -> v[0] * Demo.wobble(i, 0.004)));
    h.put(Parameter.CATION_CONDUCTIVITY, Demo.series(i -> v[1] * Demo.wobble(i + 1, 0.01)));
    h.put(
        Parameter.DEGASSED_CATION_CONDUCTIVITY, Demo.series(i -> v[2] * Demo.wobble(i + 2, 0.01)));
    h.put(Parameter.PH, Demo.series(i -> v[3] + 0.02 * Math.sin(i)));
    Evaluation e = Evaluator.evaluate(Demo.u1EcoIn(), Demo.snapshot(h));
    assertThat(v[3]).isBetween(9.6, 9.8);
    assertThat(e.findings()).isEmpty();
    assertThat(e.calculatedPh().orElseThrow().rigorous()).isCloseTo(v[3], within(0.01));
    OperatingPh op = e.operatingPh().orElseThrow();
    assertThat(op.ph()).isBetween(op.low(), op.high());
    assertThat(op.ph()).isGreaterThan(op.neutralPh());
  }

  /** Story 2: condenser leak, Unit 2: sodium and cation conductivity climb at U2-CPD. */
  @Test
  void condenserLeakIsIngressOfTheProcess() {
    Map<Parameter, List<Reading>> h = Demo.map();
    java.util.function.IntToDoubleFunction na = i -> 1.0 + 14.0 * i / (Demo.N - 1);
    java.util.function.IntFunction<double[]> at =
        i ->
            Demo.readings(
                Demo.ammonia(0.8),
                Demo.sodium(na.applyAsDouble(i)),
                Demo.sodium(na.applyAsDouble(i)) + Demo.chloride(1),
                Demo.co2(5));
    h.put(
        Parameter.SPECIFIC_CONDUCTIVITY, Demo.series(i -> at.apply(i)[0] * Demo.wobble(i, 0.003)));
    h.put(Parameter.CATION_CONDUCTIVITY, Demo.series(i -> at.apply(i)[1] * Demo.wobble(i, 0.005)));
    h.put(Parameter.SODIUM, Demo.series(i -> na.applyAsDouble(i) * Demo.wobble(i, 0.02)));
    Evaluation e = Evaluator.evaluate(Demo.u2Cpd(), Demo.snapshot(h));
    assertThat(codes(e)).containsExactly(ReasonCode.INGRESS_SUSPECTED);
    assertThat(e.findings().get(0).suspect()).isEqualTo(Instrument.PROCESS);
  }

  /** Story 3: exhausted cation column, Unit 1 main steam: CACE creeps up tracking SC, Na flat. */
  @Test
  void exhaustedColumnPointsAtTheCationInstrument() {
    Map<Parameter, List<Reading>> h = Demo.map();
    // invented: SC follows an ammonia dosing increase; the column lets through a growing
    // fraction of the ammonium, which the cation and degassed cation cells both see
    java.util.function.IntToDoubleFunction sc =
        i -> 4.0 + 0.6 * i / (Demo.N - 1) + 0.05 * Math.sin(i);
    java.util.function.IntToDoubleFunction leak = i -> 0.004 + 0.03 * i / (Demo.N - 1);
    h.put(Parameter.SPECIFIC_CONDUCTIVITY, Demo.series(sc));
    h.put(
        Parameter.CATION_CONDUCTIVITY,
        Demo.series(i -> 0.07 + leak.applyAsDouble(i) * sc.applyAsDouble(i)));
    h.put(
        Parameter.DEGASSED_CATION_CONDUCTIVITY,
        Demo.series(i -> 0.06 + leak.applyAsDouble(i) * sc.applyAsDouble(i)));
    h.put(Parameter.SODIUM, Demo.series(i -> 0.8 * Demo.wobble(i, 0.03)));
    Evaluation e = Evaluator.evaluate(Demo.u1MainSteam(), Demo.snapshot(h));
    assertThat(codes(e)).containsExactly(ReasonCode.CATION_COLUMN_EXHAUSTED);
    assertThat(e.findings().get(0).suspect()).isEqualTo(Instrument.CATION_CONDUCTIVITY);
  }

  /** Story 4: drifting pH electrode, Unit 1 feedwater: measured pH wanders from calculated. */
  @Test
  void driftingElectrodePointsAtThePhInstrument() {
    double[] v = Demo.readings(Demo.ammonia(3.5), 0, Demo.chloride(3), Demo.co2(10));
    Map<Parameter, List<Reading>> h = Demo.map();
    h.put(Parameter.SPECIFIC_CONDUCTIVITY, Demo.series(i -> v[0] * Demo.wobble(i, 0.004)));
    h.put(Parameter.CATION_CONDUCTIVITY, Demo.series(i -> v[1] * Demo.wobble(i + 1, 0.01)));
    h.put(
        Parameter.DEGASSED_CATION_CONDUCTIVITY, Demo.series(i -> v[2] * Demo.wobble(i + 2, 0.01)));
    h.put(Parameter.PH, Demo.series(i -> v[3] - 0.45 * i / (Demo.N - 1)));
    Evaluation e = Evaluator.evaluate(Demo.u1EcoIn(), Demo.snapshot(h));
    assertThat(codes(e)).containsExactly(ReasonCode.PH_MEASURED_VS_CALCULATED);
    assertThat(e.findings().get(0).suspect()).isEqualTo(Instrument.PH);
  }

  /** Story 5: start-up with air in-leakage: CACE high, DCACE normal: carbon dioxide. */
  @Test
  void airInLeakageIsCarbonDioxideNotSalts() {
    double[] v = Demo.readings(Demo.ammonia(1.5), 0, Demo.chloride(2), Demo.co2(400));
    Map<Parameter, List<Reading>> h = Demo.map();
    h.put(Parameter.SPECIFIC_CONDUCTIVITY, Demo.series(i -> v[0] * Demo.wobble(i, 0.004)));
    h.put(Parameter.CATION_CONDUCTIVITY, Demo.series(i -> v[1] * Demo.wobble(i + 1, 0.01)));
    h.put(
        Parameter.DEGASSED_CATION_CONDUCTIVITY, Demo.series(i -> v[2] * Demo.wobble(i + 2, 0.01)));
    h.put(Parameter.PH, Demo.series(i -> v[3] + 0.02 * Math.sin(i)));
    Evaluation e = Evaluator.evaluate(Demo.u1EcoIn(), Demo.snapshot(h));
    assertThat(codes(e)).containsExactly(ReasonCode.CARBON_DIOXIDE_INGRESS);
    assertThat(e.findings().get(0).suspect()).isEqualTo(Instrument.PROCESS);
    assertThat(e.composition().orElseThrow().carbonDioxideUgPerKg()).isCloseTo(400, within(20.0));
    assertThat(e.calculatedPh().orElseThrow().tradeFormulaInWindow()).isFalse();
  }
}
