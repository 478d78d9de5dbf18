package org.kwanta.model.evaluation;

import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.function.IntToDoubleFunction;
import org.kwanta.model.Parameter;
import org.kwanta.model.conductivity.AlkalizerMix;
import org.kwanta.model.conductivity.Solute;
import org.kwanta.model.conductivity.Solutes;
import org.kwanta.model.conductivity.Solution;
import org.kwanta.model.conductivity.SolutionModel;

/**
 * Invented demo snapshots at the fictional Brackenmoor Energy Centre (demo data only, not plant
 * data). Conductivities are generated with the engine's own 25 °C model from an invented
 * composition, readings every 5 min over 2 h, samples conditioned to 25.0 °C.
 */
final class Demo {

  static final Instant NOW = Instant.parse("2025-03-14T10:00:00Z");
  static final int N = 25;
  static final Duration STEP = Duration.ofMinutes(5);
  static final double T25 = 298.15;

  static final SolutionModel MODEL_25 =
      new SolutionModel(Evaluator.IONS_25, Evaluator.EQUILIBRIA_25, AlkalizerMix.AMMONIA);

  private Demo() {}

  /** Feedwater at the Unit 1 economizer inlet: AVT(O), ammonia, HP economizer at 155 °C, 15 MPa. */
  static SamplePointConfig u1EcoIn() {
    return SamplePointConfig.of("U1-ECO-IN", Regime.AVT_O, AlkalizerMix.AMMONIA, 428.15, 15e6);
  }

  static SamplePointConfig u2Cpd() {
    return SamplePointConfig.of("U2-CPD", Regime.AVT_O, AlkalizerMix.AMMONIA, 313.15, 1.5e6);
  }

  static SamplePointConfig u1MainSteam() {
    // steam sampled as condensate; the at-temperature pH is of the condensate at 40 °C
    return SamplePointConfig.of("U1-MS", Regime.AVT_O, AlkalizerMix.AMMONIA, 313.15, Double.NaN);
  }

  static Instant time(int i) {
    return NOW.minus(STEP.multipliedBy(N - 1 - i));
  }

  static double ammonia(double mgPerKg) {
    return mgPerKg / 17.031 / 1000;
  }

  static double chloride(double ugPerKg) {
    return ugPerKg / 35.453 / 1e6;
  }

  static double co2(double ugPerKg) {
    return ugPerKg / 44.009 / 1e6;
  }

  static double sodium(double ugPerKg) {
    return ugPerKg / 22.98977 / 1e6;
  }

  /** SC, CACE, DCACE, pH25 of a volatile-treated sample at 25 °C. */
  static double[] readings(double nh3Mol, double naMol, double clMol, double co2Mol) {
    Solutes all = new Solutes(nh3Mol, naMol, clMol, 0, co2Mol, 0);
    Solution sc = MODEL_25.solve(all);
    double cace = MODEL_25.solve(new Solutes(0, 0, clMol, 0, co2Mol, 0)).kappa();
    double dcace = MODEL_25.solve(new Solutes(0, 0, clMol, 0, 0, 0)).kappa();
    return new double[] {sc.kappa(), cace, dcace, sc.pH()};
  }

  /** A small deterministic wobble so that no signal is flat-lined. */
  static double wobble(int i, double relative) {
    return 1 + relative * Math.sin(1.7 * i + 0.3);
  }

  static List<Reading> series(IntToDoubleFunction value) {
    List<Reading> h = new ArrayList<>();
    for (int i = 0; i < N; i++) {
      h.add(Reading.raw(time(i), value.applyAsDouble(i), T25));
    }
    return h;
  }

  static Snapshot snapshot(Map<Parameter, List<Reading>> history) {
    return new Snapshot(NOW, history);
  }

  static Map<Parameter, List<Reading>> map() {
    return new EnumMap<>(Parameter.class);
  }

  // ---- the five demo stories (histories; see BrackenmoorStoriesTest) -------------------------

  /** Story 1: Unit 1 feedwater on ammonia at pH25 ≈ 9.6–9.8, everything green. */
  static Map<Parameter, List<Reading>> normalDay() {
    double[] v = normalDayReadings();
    Map<Parameter, List<Reading>> h = map();
    h.put(Parameter.SPECIFIC_CONDUCTIVITY, series(i -> v[0] * wobble(i, 0.004)));
    h.put(Parameter.CATION_CONDUCTIVITY, series(i -> v[1] * wobble(i + 1, 0.01)));
    h.put(Parameter.DEGASSED_CATION_CONDUCTIVITY, series(i -> v[2] * wobble(i + 2, 0.01)));
    h.put(Parameter.PH, series(i -> v[3] + 0.02 * Math.sin(i)));
    return h;
  }

  /** SC, CACE, DCACE, pH25 of the normal day (3.5 mg/kg NH₃, 3 µg/kg Cl, 10 µg/kg CO₂). */
  static double[] normalDayReadings() {
    return readings(ammonia(3.5), 0, chloride(3), co2(10));
  }

  /** Story 2: condenser leak, Unit 2: sodium and cation conductivity climb at U2-CPD. */
  static Map<Parameter, List<Reading>> condenserLeak() {
    Map<Parameter, List<Reading>> h = map();
    IntToDoubleFunction na = i -> 1.0 + 14.0 * i / (N - 1);
    java.util.function.IntFunction<double[]> at =
        i ->
            readings(
                ammonia(0.8),
                sodium(na.applyAsDouble(i)),
                sodium(na.applyAsDouble(i)) + chloride(1),
                co2(5));
    h.put(Parameter.SPECIFIC_CONDUCTIVITY, series(i -> at.apply(i)[0] * wobble(i, 0.003)));
    h.put(Parameter.CATION_CONDUCTIVITY, series(i -> at.apply(i)[1] * wobble(i, 0.005)));
    h.put(Parameter.SODIUM, series(i -> na.applyAsDouble(i) * wobble(i, 0.02)));
    return h;
  }

  /** Story 3: exhausted cation column, Unit 1 main steam: CACE creeps up tracking SC, Na flat. */
  static Map<Parameter, List<Reading>> exhaustedColumn() {
    Map<Parameter, List<Reading>> h = map();
    // invented: SC follows an ammonia dosing increase; the column lets through a growing
    // fraction of the ammonium, which the cation and degassed cation cells both see
    IntToDoubleFunction sc = i -> 4.0 + 0.6 * i / (N - 1) + 0.05 * Math.sin(i);
    IntToDoubleFunction leak = i -> 0.004 + 0.03 * i / (N - 1);
    h.put(Parameter.SPECIFIC_CONDUCTIVITY, series(sc));
    h.put(
        Parameter.CATION_CONDUCTIVITY,
        series(i -> 0.07 + leak.applyAsDouble(i) * sc.applyAsDouble(i)));
    h.put(
        Parameter.DEGASSED_CATION_CONDUCTIVITY,
        series(i -> 0.06 + leak.applyAsDouble(i) * sc.applyAsDouble(i)));
    h.put(Parameter.SODIUM, series(i -> 0.8 * wobble(i, 0.03)));
    return h;
  }

  /** Story 4: drifting pH electrode, Unit 1 feedwater: measured pH wanders from calculated. */
  static Map<Parameter, List<Reading>> driftingElectrode() {
    double[] v = normalDayReadings();
    Map<Parameter, List<Reading>> h = map();
    h.put(Parameter.SPECIFIC_CONDUCTIVITY, series(i -> v[0] * wobble(i, 0.004)));
    h.put(Parameter.CATION_CONDUCTIVITY, series(i -> v[1] * wobble(i + 1, 0.01)));
    h.put(Parameter.DEGASSED_CATION_CONDUCTIVITY, series(i -> v[2] * wobble(i + 2, 0.01)));
    h.put(Parameter.PH, series(i -> v[3] - 0.45 * i / (N - 1)));
    return h;
  }

  /** Story 5: start-up with air in-leakage: CACE high, DCACE normal: carbon dioxide. */
  static Map<Parameter, List<Reading>> airInLeakage() {
    double[] v = readings(ammonia(1.5), 0, chloride(2), co2(400));
    Map<Parameter, List<Reading>> h = map();
    h.put(Parameter.SPECIFIC_CONDUCTIVITY, series(i -> v[0] * wobble(i, 0.004)));
    h.put(Parameter.CATION_CONDUCTIVITY, series(i -> v[1] * wobble(i + 1, 0.01)));
    h.put(Parameter.DEGASSED_CATION_CONDUCTIVITY, series(i -> v[2] * wobble(i + 2, 0.01)));
    h.put(Parameter.PH, series(i -> v[3] + 0.02 * Math.sin(i)));
    return h;
  }

  static Solute unused() {
    return Solute.ALKALIZER;
  }
}
