package org.kwanta.model.diagnosis;

import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.function.DoubleUnaryOperator;
import org.kwanta.model.Parameter;
import org.kwanta.model.conductivity.AlkalizerMix;
import org.kwanta.model.conductivity.Conductivity;
import org.kwanta.model.conductivity.Equilibria;
import org.kwanta.model.conductivity.Solutes;
import org.kwanta.model.conductivity.SolutionModel;
import org.kwanta.model.evaluation.Evaluation;
import org.kwanta.model.evaluation.Evaluator;
import org.kwanta.model.evaluation.Reading;
import org.kwanta.model.evaluation.Regime;
import org.kwanta.model.evaluation.SamplePointConfig;
import org.kwanta.model.evaluation.Snapshot;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.model.water.Water;

/**
 * Labelled stories of invented plant data (demo and test only, no real plant): minute readings
 * generated from the solution model, so that healthy channels agree with each other, with realistic
 * noise and a slow daily swing of the ammonia dose, a day of normal operation before each fault,
 * and the calculated pH of each minute from the real evaluator.
 */
final class StoryBench {

  static final double MG_NH3 = 1.0 / 17.031 / 1000;
  static final double UG_CL = 1.0 / 35.453 / 1e6;
  static final double UG_NA = 1.0 / 22.98977 / 1e6;
  static final double UG_CO2 = 1.0 / 44.009 / 1e6;
  static final double UG_SO4 = 1.0 / 96.06 / 1e6;

  /** Faults start this long after the series begins (a day of baseline). */
  static final Duration BASELINE = Duration.ofHours(26);

  static final Instant START = Instant.parse("2026-03-02T00:00:00Z");

  static final SolutionModel M25 =
      new SolutionModel(
          Conductivity.at(
              Water.at(298.15, Water.ATMOSPHERIC_PRESSURE_PA, IonizationFormulation.R11_07)),
          Equilibria.of(
              Water.at(298.15, Water.ATMOSPHERIC_PRESSURE_PA, IonizationFormulation.R11_07)),
          AlkalizerMix.AMMONIA);

  /** What an analyser does to the truth. */
  enum Fault {
    NONE,
    PH_DRIFT,
    SC_FOULING,
    SODIUM_STEP,
    COLUMN,
    PH_STEP,
    SC_STEP
  }

  /** One point of a story: its composition over time (hours after the fault start) and faults. */
  record PointSpec(
      Diagnoser.Point point,
      boolean sc,
      boolean cation,
      boolean degassed,
      boolean ph,
      boolean sodium,
      Composition composition,
      Fault fault,
      double faultRate) {}

  /** Composition of a point at a time, hours relative to the fault start (negative before). */
  @FunctionalInterface
  interface Composition {
    Solutes at(double hours, double dailySwing);
  }

  /** A labelled story. */
  record Story(
      String name,
      List<PointSpec> points,
      String target,
      String expectedCode,
      String expectedPointsAt,
      Duration duration,
      Duration detectWithin) {}

  /** The generated minutes of every point of a story. */
  static Map<String, Diagnoser.Series> generate(Story story, long seed) {
    return generate(story, seed, 1.0);
  }

  /**
   * As {@link #generate(Story, long)} with every instrument's noise multiplied by {@code noise}.
   */
  static Map<String, Diagnoser.Series> generate(Story story, long seed, double noise) {
    return generate(story, seed, noise, 1);
  }

  /** As {@link #generate(Story, long, double)} with a reading every {@code every} minutes. */
  static Map<String, Diagnoser.Series> generate(Story story, long seed, double noise, int every) {
    Random random = new Random(seed);
    Map<String, Diagnoser.Series> out = new LinkedHashMap<>();
    int minutes = (int) (BASELINE.toMinutes() + story.duration().toMinutes());
    for (PointSpec p : story.points()) {
      List<Minute> list = new ArrayList<>(minutes);
      SamplePointConfig config =
          SamplePointConfig.of(
              p.point().id(),
              p.point().regime() == Regime.MAKE_UP ? Regime.MAKE_UP : Regime.AVT_O,
              AlkalizerMix.AMMONIA,
              423.15,
              15e6);
      for (int m = 0; m < minutes; m++) {
        Instant t = START.plus(Duration.ofMinutes(m));
        double hours = (m - BASELINE.toMinutes()) / 60.0;
        double swing = Math.sin(2 * Math.PI * m / 1440.0);
        Solutes s = p.composition().at(hours, swing);
        double sc = M25.solve(s).kappa() * (1 + noise * 0.004 * random.nextGaussian());
        double cation =
            M25.solve(new Solutes(0, 0, s.chloride(), s.sulfate(), s.carbonate(), 0)).kappa()
                + noise * 0.002 * random.nextGaussian();
        double degassed =
            M25.solve(new Solutes(0, 0, s.chloride(), s.sulfate(), 0, 0)).kappa()
                + noise * 0.002 * random.nextGaussian();
        double ph = M25.solve(s).pH() + noise * 0.01 * random.nextGaussian();
        double sodium = s.sodium() / UG_NA * (1 + noise * 0.03 * random.nextGaussian()) + 0.02;
        double after = Math.max(0, hours);
        switch (p.fault()) {
          case PH_DRIFT -> ph -= p.faultRate() * after;
          case PH_STEP -> ph += hours >= 0 ? p.faultRate() : 0;
          case SC_STEP -> sc *= hours >= 0 ? 1 + p.faultRate() : 1;
          case SC_FOULING -> sc *= Math.max(0.2, 1 - p.faultRate() * after);
          case SODIUM_STEP -> sodium += hours >= 0 ? p.faultRate() : 0;
          case COLUMN -> {
            double leak = p.faultRate() * after;
            double sc25 = M25.solve(s).kappa();
            cation += leak * sc25;
            degassed += leak * sc25;
          }
          case NONE -> {}
        }
        Map<Parameter, List<Reading>> h = new EnumMap<>(Parameter.class);
        if (p.sc()) {
          h.put(Parameter.SPECIFIC_CONDUCTIVITY, List.of(new Reading(t, sc, 298.15, true)));
        }
        if (p.cation()) {
          h.put(Parameter.CATION_CONDUCTIVITY, List.of(new Reading(t, cation, 298.15, true)));
        }
        double phCalc = Double.NaN;
        if (p.sc()) {
          Evaluation e = Evaluator.DEFAULT.evaluate(config, new Snapshot(t, h));
          phCalc = e.calculatedPh().map(c -> c.rigorous()).orElse(Double.NaN);
        }
        if (m % every != 0) {
          continue;
        }
        list.add(
            new Minute(
                t,
                p.sc() ? sc : Double.NaN,
                p.cation() ? cation : Double.NaN,
                p.degassed() ? degassed : Double.NaN,
                p.ph() ? ph : Double.NaN,
                p.ph() ? phCalc : Double.NaN,
                p.sodium() ? sodium : Double.NaN));
      }
      out.put(p.point().id(), new Diagnoser.Series(p.point(), list));
    }
    return out;
  }

  // ---- the stories --------------------------------------------------------------------------

  static Diagnoser.Point point(String id, CoolingWater water, String... upstream) {
    return new Diagnoser.Point(id, Regime.AVT_O, water, List.of(upstream));
  }

  static Solutes feedwater(double nh3MgPerKg, double swing) {
    return new Solutes(
        nh3MgPerKg * (1 + 0.04 * swing) * MG_NH3, 0.3 * UG_NA, 1.5 * UG_CL, 0, 6 * UG_CO2, 0);
  }

  static DoubleUnaryOperator ramp(double from, double to, double hours) {
    return h -> h <= 0 ? from : h >= hours ? to : from + (to - from) * h / hours;
  }

  /** A quiet condensate → feedwater pair for a day. */
  static Story quietDay(int day) {
    Composition c = (h, sw) -> feedwater(1.0 + 0.1 * day, sw);
    return new Story(
        "quiet day " + day,
        List.of(
            new PointSpec(
                point("CPD", CoolingWater.BRACKISH),
                true,
                true,
                true,
                false,
                true,
                c,
                Fault.NONE,
                0),
            new PointSpec(
                point("ECO", CoolingWater.BRACKISH, "CPD"),
                true,
                true,
                true,
                true,
                false,
                c,
                Fault.NONE,
                0)),
        "ECO",
        null,
        null,
        Duration.ofHours(24),
        Duration.ZERO);
  }

  static Story condenserLeak(CoolingWater water) {
    DoubleUnaryOperator na = ramp(0.3, 8.0, 1.0);
    Composition c =
        (h, sw) -> {
          double addedNa = na.applyAsDouble(h) - 0.3;
          double nNa = addedNa * UG_NA;
          Solutes base = feedwater(1.0, sw);
          return new Solutes(
              base.alkalizer(),
              0.3 * UG_NA + nNa,
              base.chloride() + nNa * water.chloridePerSodium(),
              nNa * water.sulfatePerSodium(),
              base.carbonate(),
              0);
        };
    return new Story(
        "condenser leak, " + water.name().toLowerCase(java.util.Locale.ROOT) + " water",
        List.of(
            new PointSpec(point("CPD", water), true, true, false, false, true, c, Fault.NONE, 0),
            new PointSpec(
                point("ECO", water, "CPD"), true, true, true, true, false, c, Fault.NONE, 0)),
        "CPD",
        "COOLING_WATER_INGRESS",
        "PROCESS",
        Duration.ofHours(4),
        Duration.ofMinutes(15));
  }

  static Story columnExhaustion() {
    Composition c = (h, sw) -> feedwater(1.0, sw);
    return new Story(
        "cation column exhaustion",
        List.of(
            new PointSpec(point("SAT", null), false, true, false, false, true, c, Fault.NONE, 0),
            new PointSpec(
                point("MS", null, "SAT"), false, true, true, false, true, c, Fault.COLUMN, 0.01),
            new PointSpec(
                point("RH", null, "MS"), false, true, true, false, true, c, Fault.NONE, 0)),
        "MS",
        "CATION_COLUMN_EXHAUSTED",
        "CATION_CONDUCTIVITY",
        Duration.ofHours(6),
        Duration.ofHours(3));
  }

  /**
   * The usual pair: condensate (SC, CACE, sodium) feeding the economizer inlet (SC, CACE, DCACE,
   * pH), both brackish-water cooled, with a fault at one of them.
   */
  static List<PointSpec> condensateAndFeedwater(
      Composition c,
      Fault atCondensate,
      double condensateRate,
      Fault atFeedwater,
      double feedwaterRate) {
    return List.of(
        new PointSpec(
            point("CPD", CoolingWater.BRACKISH),
            true,
            true,
            false,
            false,
            true,
            c,
            atCondensate,
            condensateRate),
        new PointSpec(
            point("ECO", CoolingWater.BRACKISH, "CPD"),
            true,
            true,
            true,
            true,
            false,
            c,
            atFeedwater,
            feedwaterRate));
  }

  static Story electrodeDrift() {
    Composition c = (h, sw) -> feedwater(1.0, sw);
    return new Story(
        "pH electrode drift −0.03 pH/h",
        condensateAndFeedwater(c, Fault.NONE, 0, Fault.PH_DRIFT, 0.03),
        "ECO",
        "PH_ELECTRODE_DRIFT",
        "PH",
        Duration.ofHours(8),
        Duration.ofHours(6));
  }

  static Story sodiumStep() {
    Composition c = (h, sw) -> feedwater(1.0, sw);
    return new Story(
        "sodium analyser step +5 µg/kg",
        condensateAndFeedwater(c, Fault.SODIUM_STEP, 5.0, Fault.NONE, 0),
        "CPD",
        "SODIUM_WITHOUT_CATION_RISE",
        "SODIUM",
        Duration.ofHours(3),
        Duration.ofMinutes(15));
  }

  static Story cellFouling() {
    Composition c = (h, sw) -> feedwater(1.0, sw);
    return new Story(
        "specific conductivity cell fouling −6 %/h",
        condensateAndFeedwater(c, Fault.NONE, 0, Fault.SC_FOULING, 0.06),
        "ECO",
        "SPECIFIC_CONDUCTIVITY_DRIFT",
        "SPECIFIC_CONDUCTIVITY",
        Duration.ofHours(8),
        Duration.ofHours(6));
  }

  static Story airInLeakage() {
    DoubleUnaryOperator co2 = ramp(6, 250, 0.5);
    Composition c =
        (h, sw) -> {
          Solutes b = feedwater(1.0, sw);
          return new Solutes(
              b.alkalizer(), b.sodium(), b.chloride(), 0, co2.applyAsDouble(h) * UG_CO2, 0);
        };
    return new Story(
        "air in-leakage",
        List.of(
            new PointSpec(
                point("CPD", CoolingWater.BRACKISH),
                true,
                true,
                true,
                false,
                true,
                c,
                Fault.NONE,
                0),
            new PointSpec(
                point("ECO", CoolingWater.BRACKISH, "CPD"),
                true,
                true,
                true,
                true,
                false,
                c,
                Fault.NONE,
                0)),
        "CPD",
        "CARBON_DIOXIDE_INGRESS",
        "PROCESS",
        Duration.ofHours(3),
        Duration.ofMinutes(15));
  }

  static Story alkalizerOverdose() {
    DoubleUnaryOperator nh3 = ramp(1.0, 4.0, 0.25);
    Composition c = (h, sw) -> feedwater(nh3.applyAsDouble(h), sw);
    return new Story(
        "alkalizer overdose",
        condensateAndFeedwater(c, Fault.NONE, 0, Fault.NONE, 0),
        "ECO",
        "DOSING_CHANGE",
        "PROCESS",
        Duration.ofHours(3),
        Duration.ofMinutes(15));
  }

  /** Mixed-bed breakthrough: sodium chloride and sulfate in the make-up, then in the condensate. */
  static Story makeUpUpset() {
    DoubleUnaryOperator salt = ramp(0, 1.0, 0.5);
    Composition mu =
        (h, sw) -> {
          double x = salt.applyAsDouble(h);
          return new Solutes(
              0,
              (0.02 + 60 * x) * UG_NA,
              (0.03 + 60 * x) * UG_CL,
              20 * x * UG_SO4,
              0.5 * UG_CO2,
              0);
        };
    // 5 % make-up into the condensate, arriving 10 min later
    Composition cpd =
        (h, sw) -> {
          Solutes b = feedwater(1.0, sw);
          double x = salt.applyAsDouble(h - 1.0 / 6) * 0.05;
          return new Solutes(
              b.alkalizer(),
              b.sodium() + 60 * x * UG_NA,
              b.chloride() + 60 * x * UG_CL,
              20 * x * UG_SO4,
              b.carbonate(),
              0);
        };
    return new Story(
        "make-up water upset",
        List.of(
            new PointSpec(
                new Diagnoser.Point("MU", Regime.MAKE_UP, CoolingWater.BRACKISH, List.of()),
                true,
                false,
                false,
                false,
                false,
                mu,
                Fault.NONE,
                0),
            new PointSpec(
                point("CPD", CoolingWater.BRACKISH, "MU"),
                true,
                true,
                false,
                false,
                true,
                cpd,
                Fault.NONE,
                0)),
        "MU",
        "CONTAMINANT_INGRESS",
        "PROCESS",
        Duration.ofHours(3),
        Duration.ofMinutes(15));
  }

  static Story electrodeStep() {
    Story d = electrodeDrift();
    PointSpec eco = d.points().get(1);
    return new Story(
        "pH electrode step −0.3",
        List.of(
            d.points().get(0),
            new PointSpec(
                eco.point(),
                true,
                true,
                true,
                true,
                false,
                eco.composition(),
                Fault.PH_STEP,
                -0.3)),
        "ECO",
        "PH_ELECTRODE_STEP",
        "PH",
        Duration.ofHours(2),
        Duration.ofMinutes(15));
  }

  static Story cellStep() {
    Story d = electrodeDrift();
    PointSpec eco = d.points().get(1);
    return new Story(
        "specific conductivity cell step −20 %",
        List.of(
            d.points().get(0),
            new PointSpec(
                eco.point(),
                true,
                true,
                true,
                true,
                false,
                eco.composition(),
                Fault.SC_STEP,
                -0.2)),
        "ECO",
        "SPECIFIC_CONDUCTIVITY_STEP",
        "SPECIFIC_CONDUCTIVITY",
        Duration.ofHours(2),
        Duration.ofMinutes(15));
  }

  static List<Story> faults() {
    return List.of(
        condenserLeak(CoolingWater.BRACKISH),
        condenserLeak(CoolingWater.FRESH),
        columnExhaustion(),
        electrodeDrift(),
        electrodeStep(),
        sodiumStep(),
        cellFouling(),
        cellStep(),
        airInLeakage(),
        alkalizerOverdose(),
        makeUpUpset());
  }
}
