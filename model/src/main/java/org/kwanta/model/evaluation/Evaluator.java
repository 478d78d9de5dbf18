package org.kwanta.model.evaluation;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.kwanta.model.aqueous.Component;
import org.kwanta.model.aqueous.Composition;
import org.kwanta.model.aqueous.Speciation;
import org.kwanta.model.conductivity.Alkalizer;
import org.kwanta.model.conductivity.AlkalizerMix;
import org.kwanta.model.conductivity.Conductivity;
import org.kwanta.model.conductivity.Equilibria;
import org.kwanta.model.conductivity.Ion;
import org.kwanta.model.conductivity.IonConductivities;
import org.kwanta.model.conductivity.Solutes;
import org.kwanta.model.conductivity.Solution;
import org.kwanta.model.conductivity.SolutionModel;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.model.water.Water;
import org.kwanta.model.water.WaterState;

/**
 * Evaluates a sample-point snapshot: compensated conductivities, the inferred composition with its
 * uncertainty, calculated pH at 25 °C, pH at the operating temperature and pressure, and the
 * consistency checks. A pure function: the same configuration and snapshot always give the same
 * evaluation.
 */
public final class Evaluator {

  /** 25 °C, K. */
  static final double T25_K = 298.15;

  /** Molar masses, g/mol (IUPAC standard atomic weights). */
  static final double NA_G_PER_MOL = 22.98977;

  static final double CL_G_PER_MOL = 35.453;
  static final double CO2_G_PER_MOL = 44.009;
  static final double PO4_G_PER_MOL = 94.971;

  /** The trade constant for ammonia, pH ≈ log10(SC − CACE/3) + 8.57 (common practice). */
  static final double TRADE_CONSTANT_AMMONIA = 8.57;

  static final WaterState WATER_25 =
      Water.at(T25_K, Water.ATMOSPHERIC_PRESSURE_PA, IonizationFormulation.R11_07);
  static final IonConductivities IONS_25 = Conductivity.at(WATER_25);
  static final Equilibria EQUILIBRIA_25 = Equilibria.of(WATER_25);
  static final double PURE_WATER_25 = IONS_25.pureWater();

  private Evaluator() {}

  /**
   * Evaluates one snapshot.
   *
   * @param config the sample point
   * @param snapshot latest readings and recent history
   * @return the evaluation
   * @throws org.kwanta.model.OutOfValidityRangeException when the operating temperature or pressure
   *     lies outside the speciation engine's range
   */
  public static Evaluation evaluate(SamplePointConfig config, Snapshot snapshot) {
    List<Finding> findings = new ArrayList<>();
    Map<Parameter, Reading> usable = Checks.signals(config, snapshot, findings);
    Checks.sampleTemperature(config, usable, findings);

    SolutionModel model25 = new SolutionModel(IONS_25, EQUILIBRIA_25, config.alkalizer());
    Map<Double, SolutionModel> byTemperature = new java.util.HashMap<>();
    byTemperature.put(T25_K, model25);

    Map<Parameter, Double> rawValues = new EnumMap<>(Parameter.class);
    Map<Parameter, SolutionModel> models = new EnumMap<>(Parameter.class);
    Map<Parameter, Boolean> below = new EnumMap<>(Parameter.class);
    for (Parameter p : CONDUCTIVITIES) {
      Reading r = usable.get(p);
      if (r == null) {
        continue;
      }
      double t = r.compensatedByAnalyser() ? T25_K : r.sampleTemperatureK();
      SolutionModel m = byTemperature.computeIfAbsent(t, k -> modelAt(k, config.alkalizer()));
      double pure = m.ions().pureWater();
      boolean isBelow = r.value() < pure * (1 - config.checks().belowPureWaterRelative());
      below.put(p, isBelow);
      rawValues.put(p, isBelow ? pure : r.value());
      models.put(p, m);
    }
    double sodiumMolal =
        usable.containsKey(Parameter.SODIUM)
            ? usable.get(Parameter.SODIUM).value() / NA_G_PER_MOL / 1e6
            : 0;

    Map<Parameter, CompensatedValue> compensated = new EnumMap<>(Parameter.class);
    Optional<InferredComposition> composition = Optional.empty();
    Optional<CalculatedPh> calculated = Optional.empty();
    Optional<OperatingPh> operating = Optional.empty();
    ChannelFits.Result fitted = null;
    Map<Parameter, Double> at25 = new EnumMap<>(Parameter.class);
    if (!rawValues.isEmpty()) {
      fitted = ChannelFits.fit(config.regime(), sodiumMolal, rawValues, models);
      for (Map.Entry<Parameter, Double> e : rawValues.entrySet()) {
        Parameter p = e.getKey();
        Reading r = usable.get(p);
        double k25;
        if (below.get(p)) {
          k25 = PURE_WATER_25;
        } else if (r.compensatedByAnalyser()) {
          k25 = r.value();
        } else {
          k25 = model25.solve(fitted.channelSolutes().get(p)).kappa();
        }
        at25.put(p, k25);
        compensated.put(
            p,
            new CompensatedValue(
                p,
                r.value(),
                r.sampleTemperatureK(),
                k25,
                r.compensatedByAnalyser(),
                below.get(p)));
      }
      Checks.belowPureWater(below, findings);

      // uncertainty: each 25 °C value perturbed by its tolerance, refitted at 25 °C
      Map<Parameter, SolutionModel> models25 = new EnumMap<>(Parameter.class);
      for (Parameter p : at25.keySet()) {
        models25.put(p, model25);
      }
      Solution sc25 = fitted.channelSolutions().get(Parameter.SPECIFIC_CONDUCTIVITY);
      boolean hasSc = sc25 != null;
      double pH25 =
          hasSc
              ? (models.get(Parameter.SPECIFIC_CONDUCTIVITY) == model25
                  ? sc25.pH()
                  : model25.solve(fitted.all()).pH())
              : Double.NaN;
      Tolerances tol = config.tolerances();
      List<Solutes> perturbed = new ArrayList<>(3);
      double[] uncertainty = new double[6];
      double phVariance = 0;
      for (Parameter p : CONDUCTIVITIES) {
        Double v = at25.get(p);
        if (v == null) {
          continue;
        }
        double dv =
            p == Parameter.SPECIFIC_CONDUCTIVITY
                ? v * tol.specificConductivityRelative()
                : tol.cationConductivityAbsolute();
        Map<Parameter, Double> values = new EnumMap<>(at25);
        values.put(p, v + dv);
        ChannelFits.Result alt = ChannelFits.fit(config.regime(), sodiumMolal, values, models25);
        perturbed.add(alt.all());
        addSquares(uncertainty, fitted.all(), alt.all());
        if (hasSc) {
          Solution s = alt.channelSolutions().get(Parameter.SPECIFIC_CONDUCTIVITY);
          double d = s.pH() - pH25;
          phVariance += d * d;
        }
      }
      Solutes u =
          new Solutes(
              Math.sqrt(uncertainty[0]),
              Math.sqrt(uncertainty[1]),
              Math.sqrt(uncertainty[2]),
              Math.sqrt(uncertainty[3]),
              Math.sqrt(uncertainty[4]),
              Math.sqrt(uncertainty[5]));
      composition = Optional.of(inferred(config, fitted.all(), u, hasSc, usable));
      if (hasSc) {
        TradeFormula.Result t = TradeFormula.evaluate(config, at25);
        calculated =
            Optional.of(
                new CalculatedPh(
                    pH25, Math.sqrt(phVariance), t.value(), t.constant(), t.inWindow(), t.note()));
        operating = Optional.of(operatingPh(config, fitted.all(), perturbed));
      }
    }
    Checks.consistency(config, snapshot, usable, at25, fitted, calculated, byTemperature, findings);
    return new Evaluation(config.id(), compensated, composition, calculated, operating, findings);
  }

  static final Parameter[] CONDUCTIVITIES = {
    Parameter.DEGASSED_CATION_CONDUCTIVITY,
    Parameter.CATION_CONDUCTIVITY,
    Parameter.SPECIFIC_CONDUCTIVITY
  };

  static SolutionModel modelAt(double temperatureK, AlkalizerMix mix) {
    Conductivity.TEMPERATURE_VALIDITY.check(temperatureK);
    WaterState w =
        Water.at(temperatureK, Water.ATMOSPHERIC_PRESSURE_PA, IonizationFormulation.R11_07);
    return new SolutionModel(Conductivity.at(w), Equilibria.of(w), mix);
  }

  private static void addSquares(double[] acc, Solutes a, Solutes b) {
    acc[0] += sq(b.alkalizer() - a.alkalizer());
    acc[1] += sq(b.sodium() - a.sodium());
    acc[2] += sq(b.chloride() - a.chloride());
    acc[3] += sq(b.sulfate() - a.sulfate());
    acc[4] += sq(b.carbonate() - a.carbonate());
    acc[5] += sq(b.phosphate() - a.phosphate());
  }

  private static double sq(double x) {
    return x * x;
  }

  private static InferredComposition inferred(
      SamplePointConfig config, Solutes s, Solutes u, boolean hasSc, Map<Parameter, Reading> r) {
    double alk =
        config.regime().isVolatile() && hasSc
            ? s.alkalizer() * config.alkalizer().molarMassGPerMol() * 1e3
            : Double.NaN;
    double sodium =
        config.regime().isVolatile()
            ? (r.containsKey(Parameter.SODIUM) ? r.get(Parameter.SODIUM).value() : Double.NaN)
            : s.sodium() * NA_G_PER_MOL * 1e6;
    double ratio =
        config.regime() == Regime.PHOSPHATE && s.phosphate() > 0
            ? s.sodium() / s.phosphate()
            : Double.NaN;
    return new InferredComposition(
        s,
        u,
        alk,
        s.chloride() * CL_G_PER_MOL * 1e6,
        s.carbonate() * CO2_G_PER_MOL * 1e6,
        sodium,
        s.phosphate() * PO4_G_PER_MOL * 1e3,
        ratio);
  }

  static Composition toComposition(Solutes s, AlkalizerMix mix) {
    Map<Component, Double> totals = new EnumMap<>(Component.class);
    for (Map.Entry<Alkalizer, Double> e : mix.molarFractions().entrySet()) {
      totals.put(component(e.getKey()), s.alkalizer() * e.getValue());
    }
    totals.put(Component.SODIUM, s.sodium());
    totals.put(Component.CHLORIDE, s.chloride());
    totals.put(Component.SULFATE, s.sulfate());
    totals.put(Component.CARBON_DIOXIDE, s.carbonate());
    totals.put(Component.PHOSPHATE, s.phosphate());
    return new Composition(totals);
  }

  private static Component component(Alkalizer a) {
    return switch (a) {
      case AMMONIA -> Component.AMMONIA;
      case MORPHOLINE -> Component.MORPHOLINE;
      case ETHANOLAMINE -> Component.ETHANOLAMINE;
      case DIMETHYLAMINE -> Component.DIMETHYLAMINE;
      case CYCLOHEXYLAMINE -> Component.CYCLOHEXYLAMINE;
      case METHOXYPROPYLAMINE -> Component.METHOXYPROPYLAMINE;
      case DIETHYLAMINOETHANOL -> Component.DIETHYLAMINOETHANOL;
    };
  }

  private static OperatingPh operatingPh(
      SamplePointConfig config, Solutes central, List<Solutes> perturbed) {
    WaterState w =
        Double.isNaN(config.operatingPressurePa())
            ? Water.atSaturation(config.operatingTemperatureK(), IonizationFormulation.R11_07)
            : Water.at(
                config.operatingTemperatureK(),
                config.operatingPressurePa(),
                IonizationFormulation.R11_07);
    double ph = Speciation.solve(toComposition(central, config.alkalizer()), w).ph();
    double var = 0;
    for (Solutes s : perturbed) {
      double d = Speciation.solve(toComposition(s, config.alkalizer()), w).ph() - ph;
      var += d * d;
    }
    double sd = Math.sqrt(var);
    return new OperatingPh(w.temperatureK(), w.pressurePa(), ph, ph - sd, ph + sd, w.neutralPh());
  }

  /** λ° of an ion at 25 °C (for the trade-formula constant). */
  static double lambda25(Ion ion) {
    return IONS_25.limiting(ion);
  }
}
