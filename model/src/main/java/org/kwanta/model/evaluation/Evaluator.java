package org.kwanta.model.evaluation;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ConcurrentHashMap;
import org.kwanta.model.OutOfValidityRangeException;
import org.kwanta.model.Parameter;
import org.kwanta.model.aqueous.Composition;
import org.kwanta.model.aqueous.PhSolution;
import org.kwanta.model.aqueous.PhUncertainties;
import org.kwanta.model.aqueous.PhUncertainty;
import org.kwanta.model.aqueous.Speciation;
import org.kwanta.model.aqueous.SpeciationOptions;
import org.kwanta.model.aqueous.Species;
import org.kwanta.model.conductivity.AlkalizerMix;
import org.kwanta.model.conductivity.Conductivity;
import org.kwanta.model.conductivity.Equilibria;
import org.kwanta.model.conductivity.IonConductivities;
import org.kwanta.model.conductivity.Solutes;
import org.kwanta.model.conductivity.Solution;
import org.kwanta.model.conductivity.SolutionModel;
import org.kwanta.model.water.Distribution;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.model.water.Water;
import org.kwanta.model.water.WaterState;

/**
 * Evaluates a sample-point snapshot: compensated conductivities, the inferred composition with its
 * uncertainty, calculated pH at 25 °C, pH at the operating temperature and pressure, and the
 * consistency checks. An evaluator carries its formulation (the ionization constant of water used
 * for the solution models and the operating water) and its caches of solution models and water
 * states; it is immutable apart from those caches and thread-safe. Evaluating is a pure function:
 * the same evaluator, configuration and snapshot always give the same evaluation.
 *
 * <p>The 25 °C trade formula and the pure-water bound of the degassing check use the R11-07 water
 * at 25 °C and 0.101325 MPa ({@link #WATER_25}) whatever the formulation.
 */
public final class Evaluator {

  /** The evaluator with the default ionization constant, IAPWS R11-07. */
  public static final Evaluator DEFAULT = new Evaluator(IonizationFormulation.R11_07);

  private final IonizationFormulation ionization;

  /** The speciation choices of the pH at temperature (the default carries the ion pairs). */
  private final SpeciationOptions speciation;

  /**
   * Whether the amines' estimated vapour–liquid distribution constants ({@code
   * water.AmineDistribution}, from memory, ±100 %) are used for the pH at temperature of
   * amine-dosed steam; off by default (the reference notes: not without the primary data).
   */
  private final boolean amineDistributionEstimates;

  /** Specific conductivity of pure water at 25 °C with this formulation, µS/cm. */
  private final double pureWater25;

  /**
   * An evaluator using the given formulation of the ionization constant of water.
   *
   * @param ionization the pKw formulation (IAPWS R11-07 or R11-24)
   */
  public Evaluator(IonizationFormulation ionization) {
    this(ionization, SpeciationOptions.defaults(), false);
  }

  /**
   * An evaluator using the given formulation of the ionization constant of water and speciation
   * choices for the pH at temperature (e.g. {@link SpeciationOptions#withAssociations} with an
   * empty set to leave out the ion pairs and polyborates).
   *
   * @param ionization the pKw formulation (IAPWS R11-07 or R11-24)
   * @param speciation constant set, activity model and associations of the pH at temperature
   */
  public Evaluator(IonizationFormulation ionization, SpeciationOptions speciation) {
    this(ionization, speciation, false);
  }

  private Evaluator(
      IonizationFormulation ionization,
      SpeciationOptions speciation,
      boolean amineDistributionEstimates) {
    this.speciation = java.util.Objects.requireNonNull(speciation, "speciation");
    this.ionization = java.util.Objects.requireNonNull(ionization, "ionization");
    this.amineDistributionEstimates = amineDistributionEstimates;
    this.pureWater25 =
        Conductivity.at(Water.at(T25_K, Water.ATMOSPHERIC_PRESSURE_PA, ionization)).pureWater();
  }

  /** The formulation of the ionization constant of water this evaluator uses. */
  public IonizationFormulation ionization() {
    return ionization;
  }

  /**
   * This evaluator with the amines' estimated distribution constants switched on or off. Off (the
   * default), a steam point dosed with a neutralizing amine gets no pH at temperature and a note
   * saying why (no published K_D retrieved) and how to opt in. On, it gets the pH of its first
   * condensate from order-of-magnitude K_D recalled from memory (about a factor of two; {@code
   * water.AmineDistribution}), with notes saying that it is an estimate and giving the pH with the
   * K_D doubled and halved.
   *
   * @param on whether to use the estimates
   * @return an evaluator with the same formulation and this choice (new caches)
   */
  public Evaluator withAmineDistributionEstimates(boolean on) {
    return on == amineDistributionEstimates ? this : new Evaluator(ionization, speciation, on);
  }

  /** Whether the amines' estimated distribution constants are used (off by default). */
  public boolean amineDistributionEstimates() {
    return amineDistributionEstimates;
  }

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

  /**
   * Evaluates one snapshot.
   *
   * @param config the sample point
   * @param snapshot latest readings and recent history
   * @return the evaluation; when the pH at temperature cannot be evaluated (an operating state
   *     outside the engine's range, a steam sample with no condensate, or an amine-dosed steam
   *     sample while the amine estimates are off) the 25 °C results stand and {@link
   *     Evaluation#notes()} says why
   */
  public Evaluation evaluate(SamplePointConfig config, Snapshot snapshot) {
    List<Finding> findings = new ArrayList<>();
    List<String> notes = new ArrayList<>(1);
    Map<Parameter, Reading> usable = Checks.signals(config, snapshot, findings);
    Checks.sampleTemperature(config, usable, findings);

    SolutionModel model25 = modelAt(T25_K, config.alkalizer());

    Map<Parameter, Double> rawValues = new EnumMap<>(Parameter.class);
    Map<Parameter, SolutionModel> models = new EnumMap<>(Parameter.class);
    Map<Parameter, Boolean> below = new EnumMap<>(Parameter.class);
    for (Parameter p : CONDUCTIVITIES) {
      Reading r = usable.get(p);
      if (r == null) {
        continue;
      }
      double t = r.compensatedByAnalyser() ? T25_K : r.sampleTemperatureK();
      SolutionModel m = t == T25_K ? model25 : modelAt(t, config.alkalizer());
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
    // each channel's fitted composition as a solution at 25 °C
    Map<Parameter, Solution> solutions25 = new EnumMap<>(Parameter.class);
    if (!rawValues.isEmpty()) {
      fitted = ChannelFits.fit(config.regime(), sodiumMolal, rawValues, models);
      for (Map.Entry<Parameter, Double> e : rawValues.entrySet()) {
        Parameter p = e.getKey();
        Reading r = usable.get(p);
        Solution fit = fitted.channelSolutions().get(p);
        // a channel fitted at 25 °C is its own 25 °C solution
        Solution s25 = models.get(p) == model25 ? fit : model25.solve(fit.solutes(), fit);
        solutions25.put(p, s25);
        double k25;
        if (below.get(p)) {
          k25 = pureWater25;
        } else if (r.compensatedByAnalyser()) {
          k25 = r.value();
        } else {
          k25 = s25.kappa();
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
      Double scValue = rawValues.get(Parameter.SPECIFIC_CONDUCTIVITY);
      if (scValue != null) {
        SodiumRoots.findings(fitted.sodiumChoice(), scValue, config.tolerances(), findings);
      }

      // uncertainty: each 25 °C value perturbed by its tolerance, refitted at 25 °C (the
      // channels before the perturbed one in the fitting chain keep their central amounts)
      Solution sc25 = solutions25.get(Parameter.SPECIFIC_CONDUCTIVITY);
      boolean hasSc = sc25 != null;
      double pH25 = hasSc ? sc25.pH() : Double.NaN;
      Tolerances tol = config.tolerances();
      List<Solutes> perturbed = new ArrayList<>(3);
      List<Parameter> perturbedChannels = new ArrayList<>(3);
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
        ChannelFits.Result alt =
            ChannelFits.refit(
                config.regime(), sodiumMolal, values, model25, fitted, p, solutions25);
        perturbed.add(alt.all());
        perturbedChannels.add(p);
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
        try {
          operating = Optional.of(operatingPh(config, fitted.all(), perturbed, perturbedChannels));
        } catch (OutOfValidityRangeException
            | OperatingStateException
            | EarlyCondensate.NoDistributionConstant e) {
          notes.add("pH at temperature not evaluated: " + e.getMessage());
        }
      }
    }
    ChannelFits.Result central = fitted;
    Solution sc25 = solutions25.get(Parameter.SPECIFIC_CONDUCTIVITY);
    Checks.PhOfComposition calculatedAt =
        t -> {
          // the composition is the specific-conductivity fit: reuse its solutions where the
          // temperature matches, otherwise solve it at t
          Solution scFit = central.channelSolutions().get(Parameter.SPECIFIC_CONDUCTIVITY);
          if (scFit != null && t == scFit.temperatureK()) {
            return scFit.pH();
          }
          if (sc25 != null && t == T25_K) {
            return sc25.pH();
          }
          return modelAt(t, config.alkalizer()).solve(central.all(), sc25).pH();
        };
    Checks.consistency(config, snapshot, usable, at25, fitted, calculated, calculatedAt, findings);
    return new Evaluation(
        config.id(), compensated, composition, calculated, operating, findings, notes);
  }

  static final Parameter[] CONDUCTIVITIES = {
    Parameter.DEGASSED_CATION_CONDUCTIVITY,
    Parameter.CATION_CONDUCTIVITY,
    Parameter.SPECIFIC_CONDUCTIVITY
  };

  /**
   * The solution model at a temperature (0.101325 MPa, this evaluator's formulation) for an
   * alkalizer mix. Models are immutable and a pure function of (temperature, mix), so they are
   * shared across evaluations and threads; the cache is keyed by the exact temperature (no
   * rounding, so a cached model is the one that would be built) and stops growing at {@link
   * #MODEL_CACHE_LIMIT} entries, after which further models are built per call.
   *
   * @throws org.kwanta.model.OutOfValidityRangeException outside 0–100 °C
   */
  SolutionModel modelAt(double temperatureK, AlkalizerMix mix) {
    ModelKey key = new ModelKey(temperatureK, mix);
    SolutionModel m = models.get(key);
    if (m != null) {
      return m;
    }
    Conductivity.TEMPERATURE_VALIDITY.check(temperatureK);
    WaterState w = Water.at(temperatureK, Water.ATMOSPHERIC_PRESSURE_PA, ionization);
    m = new SolutionModel(Conductivity.at(w), Equilibria.of(w), mix);
    if (models.size() < MODEL_CACHE_LIMIT) {
      SolutionModel earlier = models.putIfAbsent(key, m);
      return earlier == null ? m : earlier;
    }
    return m;
  }

  /** Largest number of cached solution models (a few kB each). */
  static final int MODEL_CACHE_LIMIT = 2048;

  private record ModelKey(double temperatureK, AlkalizerMix mix) {}

  private final ConcurrentHashMap<ModelKey, SolutionModel> models = new ConcurrentHashMap<>();

  /** Largest number of cached operating water states. */
  static final int WATER_CACHE_LIMIT = 2048;

  private record StateKey(double temperatureK, double pressurePa) {}

  private final ConcurrentHashMap<StateKey, WaterState> operatingWaterStates =
      new ConcurrentHashMap<>();

  /**
   * The water state at an operating point (NaN pressure: saturation), this evaluator's formulation;
   * cached by the exact (T, p) like {@link #modelAt}.
   */
  WaterState operatingWater(double temperatureK, double pressurePa) {
    StateKey key = new StateKey(temperatureK, pressurePa);
    WaterState w = operatingWaterStates.get(key);
    if (w != null) {
      return w;
    }
    w =
        Double.isNaN(pressurePa)
            ? Water.atSaturation(temperatureK, ionization)
            : Water.at(temperatureK, pressurePa, ionization);
    if (operatingWaterStates.size() < WATER_CACHE_LIMIT) {
      operatingWaterStates.putIfAbsent(key, w);
    }
    return w;
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

  /** The operating state does not allow a pH at temperature; the message says why. */
  static final class OperatingStateException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    OperatingStateException(String message) {
      super(message);
    }
  }

  private OperatingPh operatingPh(
      SamplePointConfig config,
      Solutes central,
      List<Solutes> perturbed,
      List<Parameter> perturbedChannels) {
    if (config.steam()) {
      return earlyCondensatePh(config, central, perturbed, perturbedChannels);
    }
    WaterState w = operatingWater(config.operatingTemperatureK(), config.operatingPressurePa());
    if (!w.liquidLike()) {
      throw new OperatingStateException(
          String.format(
              Locale.ROOT,
              "the operating state %.2f °C, %.4g MPa is %s, not liquid-like; a steam sample point"
                  + " is evaluated as its first condensate",
              w.temperatureK() - 273.15,
              w.pressurePa() / 1e6,
              w.phase()));
    }
    SpeciationOptions options = speciation;
    Composition composition = central.composition(config.alkalizer());
    PhUncertainties.Central solved = PhUncertainties.solve(composition, w, options);
    PhSolution centralPh = solved.solution();
    double ph = centralPh.ph();
    double[] shifts = new double[perturbed.size()];
    for (int i = 0; i < shifts.length; i++) {
      // The perturbed totals are near the central ones: start from the central solution.
      shifts[i] =
          Speciation.ph(perturbed.get(i).composition(config.alkalizer()), w, options, centralPh)
                  .ph()
              - ph;
    }
    PhUncertainties.ConstantParts constants =
        PhUncertainties.constantParts(solved, composition, w, options);
    PhUncertainty u =
        PhUncertainty.combine(
            ph,
            List.of(
                OperatingPhParts.instrumentPart(config.tolerances(), perturbedChannels, shifts),
                constants.constantSetSpread(),
                constants.estimatedConstants(),
                OperatingPhParts.liquidOperatingConditions(
                    this, config, composition, options, solved)));
    return new OperatingPh(
        w.temperatureK(),
        w.pressurePa(),
        ph,
        u.low(),
        u.high(),
        w.neutralPh(),
        OperatingPh.Basis.LIQUID,
        List.of(),
        u);
  }

  /**
   * A steam sample: the liquid in equilibrium with the steam at the saturation temperature of the
   * operating pressure (or at the operating temperature on the saturation line when no pressure is
   * declared).
   */
  private OperatingPh earlyCondensatePh(
      SamplePointConfig config,
      Solutes central,
      List<Solutes> perturbed,
      List<Parameter> perturbedChannels) {
    double p = config.operatingPressurePa();
    double tSat;
    if (Double.isNaN(p)) {
      double t = config.operatingTemperatureK();
      if (!Water.SATURATION_VALIDITY.contains(t)) {
        throw new OperatingStateException(
            String.format(
                Locale.ROOT,
                "a steam sample at %.2f °C, above the critical temperature, needs its operating"
                    + " pressure to find where it condenses",
                t - 273.15));
      }
      tSat = t;
    } else if (p >= CRITICAL_PRESSURE_PA) {
      throw new OperatingStateException(
          String.format(
              Locale.ROOT,
              "steam at %.4g MPa, at or above the critical pressure 22.064 MPa (IAPWS-IF97), has no"
                  + " first condensate",
              p / 1e6));
    } else {
      tSat = Water.saturationTemperatureK(p);
    }
    // the liquid limit of the distribution constants and the speciation engine, Kwanta's
    Distribution.ENGINE_LIMIT.check(tSat);
    WaterState w = operatingWater(tSat, Double.NaN);
    SpeciationOptions options = speciation;
    Composition steam = central.composition(config.alkalizer());
    EarlyCondensate.Result r = EarlyCondensate.of(steam, w, options, amineDistributionEstimates);
    double ph = r.liquid().ph();
    double[] shifts = new double[perturbed.size()];
    for (int i = 0; i < shifts.length; i++) {
      shifts[i] =
          EarlyCondensate.of(
                      perturbed.get(i).composition(config.alkalizer()),
                      w,
                      options,
                      amineDistributionEstimates,
                      r)
                  .liquid()
                  .ph()
              - ph;
    }
    // (b) and (c) on the condensate's own totals (the distribution held as computed)
    PhSolution centralPh = new PhSolution(ph, r.liquid().ionicStrengthMolPerKg());
    PhUncertainties.ConstantParts constants =
        PhUncertainties.constantParts(r.liquidTotals(), w, options, centralPh);
    PhUncertainty u =
        PhUncertainty.combine(
            ph,
            List.of(
                OperatingPhParts.instrumentPart(config.tolerances(), perturbedChannels, shifts),
                constants.constantSetSpread(),
                constants.estimatedConstants(),
                OperatingPhParts.condensateOperatingConditions(
                    this, config, steam, options, r, tSat)));
    return new OperatingPh(
        w.temperatureK(),
        w.pressurePa(),
        ph,
        u.low(),
        u.high(),
        w.neutralPh(),
        OperatingPh.Basis.EARLY_CONDENSATE,
        r.notes(),
        u);
  }

  /** Critical pressure of water, IAPWS-IF97, Pa. */
  static final double CRITICAL_PRESSURE_PA = 22.064e6;

  /** λ° of an ion at 25 °C (for the trade-formula constant). */
  static double lambda25(Species ion) {
    return IONS_25.limiting(ion);
  }
}
