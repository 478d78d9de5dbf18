package org.kwanta.model.evaluation;

import java.time.Instant;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.kwanta.model.Parameter;
import org.kwanta.model.aqueous.Component;
import org.kwanta.model.aqueous.PhUncertainty;
import org.kwanta.model.conductivity.AlkalizerMix;
import org.kwanta.model.conductivity.Solutes;
import org.kwanta.model.conductivity.SolutionModel;

/**
 * Invented Brackenmoor snapshots (demo data only) whose full evaluations are pinned as regression
 * values, and the flattening of an {@link Evaluation} into named values that the pins compare.
 */
final class RegressionCases {

  private RegressionCases() {}

  /** A named evaluation input. */
  record Case(String name, SamplePointConfig config, Snapshot snapshot) {}

  /** The five demo stories, then variants that reach the other paths of the engine. */
  static List<Case> all() {
    List<Case> cases = new ArrayList<>();
    cases.add(new Case("normal-day", Demo.u1EcoIn(), Demo.snapshot(Demo.normalDay())));
    cases.add(new Case("condenser-leak", Demo.u2Cpd(), Demo.snapshot(Demo.condenserLeak())));
    cases.add(
        new Case("exhausted-column", Demo.u1MainSteam(), Demo.snapshot(Demo.exhaustedColumn())));
    cases.add(
        new Case("drifting-electrode", Demo.u1EcoIn(), Demo.snapshot(Demo.driftingElectrode())));
    cases.add(new Case("air-in-leakage", Demo.u1EcoIn(), Demo.snapshot(Demo.airInLeakage())));
    cases.add(new Case("warm-feedwater", Demo.u1EcoIn(), warmFeedwater()));
    cases.add(new Case("phosphate-drum", u2HpDrum(), phosphateDrum()));
    cases.add(
        new Case(
            "make-up-compensated-by-analyser",
            SamplePointConfig.of(
                "MU-DEMIN", Regime.MAKE_UP, AlkalizerMix.AMMONIA, 298.15, Double.NaN),
            makeUp()));
    cases.add(new Case("alkalizer-mix-warm", mixConfig(), mixSnapshot()));
    return cases;
  }

  /** The benchmark's snapshot: U1-ECO-IN sampled at 26.3 °C. */
  static Snapshot warmFeedwater() {
    Instant now = Demo.NOW;
    Map<Parameter, List<Reading>> h = new EnumMap<>(Parameter.class);
    double[] base = {9.85, 0.085, 0.062, 9.68};
    Parameter[] ps = {
      Parameter.SPECIFIC_CONDUCTIVITY,
      Parameter.CATION_CONDUCTIVITY,
      Parameter.DEGASSED_CATION_CONDUCTIVITY,
      Parameter.PH
    };
    for (int p = 0; p < ps.length; p++) {
      List<Reading> r = new ArrayList<>();
      for (int i = 0; i < Demo.N; i++) {
        double v = base[p] * (1 + 0.003 * Math.sin(1.7 * i + p));
        r.add(Reading.raw(Demo.time(i), v, 299.45));
      }
      h.put(ps[p], r);
    }
    return new Snapshot(now, h);
  }

  /** Unit 2 HP drum on trisodium phosphate, 330 °C at saturation, sample cooled to 35 °C. */
  static SamplePointConfig u2HpDrum() {
    return SamplePointConfig.of(
        "U2-HP-DRUM", Regime.PHOSPHATE, AlkalizerMix.AMMONIA, 603.15, Double.NaN);
  }

  static Snapshot phosphateDrum() {
    double tK = 308.15;
    SolutionModel m = Evaluator.DEFAULT.modelAt(tK, AlkalizerMix.AMMONIA);
    double po4 = 1.5e-3 / 94.971; // 1.5 mg/kg PO4
    double cl = Demo.chloride(20);
    double sc = m.solve(new Solutes(0, 2.8 * po4 + cl, cl, 0, 0, po4)).kappa();
    double cace = m.solve(new Solutes(0, 0, cl, 0, 0, po4)).kappa();
    Map<Parameter, List<Reading>> h = Demo.map();
    h.put(Parameter.SPECIFIC_CONDUCTIVITY, series(i -> sc * Demo.wobble(i, 0.004), tK));
    h.put(Parameter.CATION_CONDUCTIVITY, series(i -> cace * Demo.wobble(i + 1, 0.01), tK));
    return Demo.snapshot(h);
  }

  static Snapshot makeUp() {
    Map<Parameter, List<Reading>> h = Demo.map();
    List<Reading> r = new ArrayList<>();
    for (int i = 0; i < Demo.N; i++) {
      r.add(new Reading(Demo.time(i), 0.072 * Demo.wobble(i, 0.02), 298.15, true));
    }
    h.put(Parameter.SPECIFIC_CONDUCTIVITY, r);
    return Demo.snapshot(h);
  }

  /** An invented variant of U1-ECO-IN dosed with ammonia and ethanolamine (regression only). */
  static SamplePointConfig mixConfig() {
    return SamplePointConfig.of(
        "U1-ECO-IN",
        Regime.AVT_O,
        new AlkalizerMix(Map.of(Component.AMMONIA, 0.7, Component.ETHANOLAMINE, 0.3)),
        428.15,
        15e6);
  }

  static Snapshot mixSnapshot() {
    Map<Parameter, List<Reading>> h = Demo.map();
    h.put(Parameter.SPECIFIC_CONDUCTIVITY, series(i -> 6.2 * Demo.wobble(i, 0.004), 303.55));
    h.put(Parameter.CATION_CONDUCTIVITY, series(i -> 0.11 * Demo.wobble(i + 1, 0.01), 303.55));
    h.put(
        Parameter.DEGASSED_CATION_CONDUCTIVITY,
        series(i -> 0.071 * Demo.wobble(i + 2, 0.01), 303.55));
    h.put(Parameter.SODIUM, series(i -> 0.9 * Demo.wobble(i + 3, 0.03), Double.NaN));
    h.put(Parameter.PH, series(i -> 9.4 + 0.02 * Math.sin(i), 303.55));
    return Demo.snapshot(h);
  }

  private static List<Reading> series(java.util.function.IntToDoubleFunction v, double tK) {
    List<Reading> h = new ArrayList<>();
    for (int i = 0; i < Demo.N; i++) {
      h.add(Reading.raw(Demo.time(i), v.applyAsDouble(i), tK));
    }
    return h;
  }

  /** Every number, flag and finding of an evaluation, by a stable name. */
  static Map<String, String> flatten(Evaluation e) {
    Map<String, String> out = new LinkedHashMap<>();
    for (Parameter p : Parameter.values()) {
      CompensatedValue c = e.compensated().get(p);
      if (c != null) {
        out.put("compensated." + p + ".raw", num(c.raw()));
        out.put("compensated." + p + ".at25", num(c.at25()));
        out.put("compensated." + p + ".belowPureWater", String.valueOf(c.belowPureWater()));
      }
    }
    e.composition()
        .ifPresent(
            c -> {
              solutes(out, "composition.solutes.", c.solutes());
              solutes(out, "composition.uncertainty.", c.uncertainty());
              out.put("composition.alkalizerMgPerKg", num(c.alkalizerMgPerKg()));
              out.put("composition.chlorideUgPerKg", num(c.chlorideEquivalentUgPerKg()));
              out.put("composition.carbonDioxideUgPerKg", num(c.carbonDioxideUgPerKg()));
              out.put("composition.sodiumUgPerKg", num(c.sodiumUgPerKg()));
              out.put("composition.phosphateMgPerKg", num(c.phosphateMgPerKg()));
              out.put("composition.naToPo4", num(c.sodiumToPhosphateMolarRatio()));
            });
    e.calculatedPh()
        .ifPresent(
            c -> {
              out.put("calculatedPh.rigorous", num(c.rigorous()));
              out.put("calculatedPh.rigorousUncertainty", num(c.rigorousUncertainty()));
              out.put("calculatedPh.tradeFormula", num(c.tradeFormula()));
              out.put("calculatedPh.tradeFormulaConstant", num(c.tradeFormulaConstant()));
              out.put("calculatedPh.inWindow", String.valueOf(c.tradeFormulaInWindow()));
            });
    e.operatingPh()
        .ifPresent(
            o -> {
              out.put("operatingPh.temperatureK", num(o.temperatureK()));
              out.put("operatingPh.pressurePa", num(o.pressurePa()));
              out.put("operatingPh.ph", num(o.ph()));
              // The pinned low/high are the instrument-tolerance band of the engine at 51e8942,
              // which is now part (a) of the itemised uncertainty; the stored low/high combine
              // all four parts (checked in PhUncertaintyTest and EvaluatorUncertaintyTest).
              PhUncertainty.Part a = o.uncertainty().part(PhUncertainty.Kind.INSTRUMENT_TOLERANCES);
              out.put("operatingPh.low", num(o.ph() - a.below()));
              out.put("operatingPh.high", num(o.ph() + a.above()));
              out.put("operatingPh.neutralPh", num(o.neutralPh()));
            });
    for (int i = 0; i < e.findings().size(); i++) {
      Finding f = e.findings().get(i);
      out.put("finding." + i, f.code() + "/" + f.pointsAt());
    }
    return out;
  }

  private static void solutes(Map<String, String> out, String prefix, Solutes s) {
    out.put(prefix + "alkalizer", num(s.alkalizer()));
    out.put(prefix + "sodium", num(s.sodium()));
    out.put(prefix + "chloride", num(s.chloride()));
    out.put(prefix + "sulfate", num(s.sulfate()));
    out.put(prefix + "carbonate", num(s.carbonate()));
    out.put(prefix + "phosphate", num(s.phosphate()));
  }

  private static String num(double v) {
    return Double.toString(v);
  }
}
