package org.kwanta.model.aqueous;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.concurrent.ConcurrentHashMap;
import org.kwanta.model.aqueous.PhUncertainty.Contribution;
import org.kwanta.model.aqueous.PhUncertainty.Kind;
import org.kwanta.model.aqueous.PhUncertainty.Part;
import org.kwanta.model.water.WaterState;

/**
 * The parts of {@link PhUncertainty} that the speciation engine computes: (b) the spread over the
 * published constant sets, (c) estimated or extrapolated constants, and one contribution of (d),
 * the pH at a shifted operating state.
 *
 * <p>Cost. Parts (b) and (c) start from the sensitivities dpH/d(log10 Ka) at the central solution,
 * which come in closed form from the charge balance (one pass over the species, no extra solve).
 * Part (c) is then √(Σ (dpH/dlog10 Ka · u)²) over the constants with a stated uncertainty u. For
 * part (b), each alternative set's pH is first predicted to first order from its log10 Ka
 * differences; only the sets predicted lowest and highest are solved exactly (at most two warm
 * solves instead of one per set), so low and high are exact pH values of named sets. The log10 K
 * differences between the sets, the fits used and their stated uncertainties depend only on (set,
 * T, pKw, components present) and are cached per water state.
 */
public final class PhUncertainties {

  private PhUncertainties() {}

  /** Most cached water states (a few hundred bytes each). */
  static final int CACHE_LIMIT = 1024;

  /** Parts (b) and (c) of one pH. */
  public record ConstantParts(Part constantSetSpread, Part estimatedConstants) {}

  /** What part (b) says it did when the sets are ranked to first order. */
  static final String SCREENED_BASIS =
      "pH with each published constant set (ConstantSets): the sets ranked by the first-order"
          + " change of pH from their log10 K differences, the lowest and highest then solved"
          + " exactly";

  /** What part (c) says when no constant has a stated uncertainty. */
  static final String NO_ESTIMATED_CONSTANT =
      "every constant used is from a retrieved fit inside its stated range (their doubt is part"
          + " b)";

  /** What part (c) says when it applies. */
  static final String ESTIMATED_BASIS =
      "stated log10 K uncertainty per constant (ConstantUncertainty: estimates grow with the"
          + " distance from 25 °C; retrieved fits 0.05 at the edge of their range plus 0.005 per K"
          + " beyond) times dpH/dlog10 K at the solution, combined by root-sum-square";

  /**
   * The central pH with what parts (b) and (c) need from its solution: {@link
   * Speciation#ph(Composition, WaterState, SpeciationOptions)} and the sensitivities in one solve.
   */
  public static final class Central {
    private final PhSolution solution;
    private final double[] sensitivities;
    private final ConstantsAtState constants;
    private final double pKw;

    private Central(
        PhSolution solution, double[] sensitivities, ConstantsAtState constants, double pKw) {
      this.solution = solution;
      this.sensitivities = sensitivities;
      this.constants = constants;
      this.pKw = pKw;
    }

    /** The central pH and ionic strength. */
    public PhSolution solution() {
      return solution;
    }
  }

  /**
   * Solves the central pH as {@link Speciation#ph(Composition, WaterState, SpeciationOptions)} does
   * (same validation, constants and solver) and keeps the sensitivities for {@link
   * #constantParts(Central, Composition, WaterState, SpeciationOptions)}.
   *
   * @throws org.kwanta.model.OutOfValidityRangeException as the plain solve
   * @throws IllegalArgumentException as the plain solve
   */
  public static Central solve(
      Composition composition, WaterState water, SpeciationOptions options) {
    double t = Speciation.checkInputs(composition, water, options);
    ConstantsAtState k =
        ConstantsAtState.of(options.constants(), t, water.pKw(), composition.totals().keySet());
    ChargeBalanceSolver solver =
        new ChargeBalanceSolver(
            composition.totals(),
            k.kaByEquilibrium(),
            Speciation.carried(k, options),
            water,
            options.activityModel());
    ChargeBalanceSolver.Solution s = solver.solve(Double.NaN, 0);
    Speciation.checkIonicStrength(s.ionicStrength(), options);
    return new Central(
        new PhSolution(-s.log10ActivityH(), s.ionicStrength()),
        solver.phSensitivities(s.log10ActivityH()),
        k,
        water.pKw());
  }

  /**
   * The pH at a moved state (another temperature or pressure) to first order, without a solve: pH +
   * Σ dpH/dlog10 Ka·Δlog10 Ka + dpH/dlog10 Kw·Δlog10 Kw, the differences between the moved state's
   * constants and pKw and the central ones (activity coefficients held). For part (d), where the
   * moves are a few kelvin or per cent.
   *
   * @param central the central solution
   * @param composition its composition
   * @param moved the moved state (liquid, within the engine's range)
   * @param options its options
   * @throws org.kwanta.model.OutOfValidityRangeException the moved state outside the engine's range
   * @throws IllegalArgumentException the moved state is not liquid
   */
  public static double phAtMovedState(
      Central central, Composition composition, WaterState moved, SpeciationOptions options) {
    double t = Speciation.checkInputs(composition, moved, options);
    ConstantsAtState k =
        ConstantsAtState.of(options.constants(), t, moved.pKw(), composition.totals().keySet());
    double[] s = central.sensitivities;
    int n = s.length - 1;
    double ph = central.solution.ph();
    for (int e = 0; e < n; e++) {
      if (s[e] != 0) {
        ph += s[e] * (k.log10Ka[e] - central.constants.log10Ka[e]);
      }
    }
    // log10 Kw = −pKw
    return ph - s[n] * (moved.pKw() - central.pKw);
  }

  /** Parts (b) and (c) at the state of a {@link #solve} (see the other overload). */
  public static ConstantParts constantParts(
      Central central, Composition composition, WaterState water, SpeciationOptions options) {
    Table table = table(composition, water, options);
    return new ConstantParts(
        screenedSpread(table, central.sensitivities, composition, water, options, central.solution),
        estimated(table, central.sensitivities, central.solution.ph()));
  }

  /**
   * Parts (b) and (c) at a state.
   *
   * @param composition totals, mol/kg
   * @param water the state of the central pH
   * @param options the options of the central pH (its constant set is the reference of (b))
   * @param central the central pH and ionic strength at that state
   */
  public static ConstantParts constantParts(
      Composition composition, WaterState water, SpeciationOptions options, PhSolution central) {
    Table table = table(composition, water, options);
    double[] s = sensitivities(composition, water, options, central);
    return new ConstantParts(
        screenedSpread(table, s, composition, water, options, central),
        estimated(table, s, central.ph()));
  }

  /**
   * Part (b) from an exactly evaluated band (every distinct set solved).
   *
   * @param band the band at the state
   * @param ph the central pH (within the band)
   * @param centralSet id of the central pH's constant set
   */
  public static Part constantSetSpread(PhBand band, double ph, String centralSet) {
    double below = Math.max(0, ph - band.minPh());
    double above = Math.max(0, band.maxPh() - ph);
    return new Part(
        Kind.CONSTANT_SET_SPREAD,
        below,
        above,
        below > 0 ? band.minSet() : centralSet,
        above > 0 ? band.maxSet() : centralSet,
        "pH with each of the "
            + band.members().size()
            + " distinct published constant sets (ConstantSets), each solved exactly",
        List.of());
  }

  /** Part (c) alone (see {@link #constantParts}). */
  public static Part estimatedConstants(
      Composition composition, WaterState water, SpeciationOptions options, PhSolution central) {
    return estimated(
        table(composition, water, options),
        sensitivities(composition, water, options, central),
        central.ph());
  }

  /**
   * One contribution to part (d): the change of pH when the state is moved by its tolerance, to
   * first order ({@link #phAtMovedState}).
   *
   * @param source what is moved, e.g. {@code temperature}
   * @param tolerance the tolerance as the reader should see it, e.g. {@code ±2 K}
   * @param shiftedPh the pH at the moved state
   * @param ph the central pH
   */
  public static Contribution shifted(String source, String tolerance, double shiftedPh, double ph) {
    double d = Math.abs(shiftedPh - ph);
    return new Contribution(source, d, tolerance + " moves the pH by " + round(shiftedPh - ph, 4));
  }

  /** Part (d) from its contributions, root-sum-square, symmetric. */
  public static Part operatingConditions(List<Contribution> contributions, String basis) {
    double sum = 0;
    for (Contribution c : contributions) {
      sum += c.halfWidthPh() * c.halfWidthPh();
    }
    return Part.symmetric(Kind.OPERATING_CONDITIONS, Math.sqrt(sum), basis, contributions);
  }

  // ---------------------------------------------------------------- internals

  private static double[] sensitivities(
      Composition composition, WaterState water, SpeciationOptions options, PhSolution central) {
    ConstantsAtState k =
        ConstantsAtState.of(
            options.constants(), water.temperatureK(), water.pKw(), composition.totals().keySet());
    ChargeBalanceSolver solver =
        new ChargeBalanceSolver(
            composition.totals(),
            k.kaByEquilibrium(),
            Speciation.carried(k, options),
            water,
            options.activityModel());
    ChargeBalanceSolver.Solution s = solver.solve(-central.ph(), central.ionicStrengthMolPerKg());
    return solver.phSensitivities(s.log10ActivityH());
  }

  private static Part screenedSpread(
      Table table,
      double[] s,
      Composition composition,
      WaterState water,
      SpeciationOptions options,
      PhSolution central) {
    double ph = central.ph();
    String centralSet = options.constants().id();
    if (table.alternatives.isEmpty()) {
      return new Part(
          Kind.CONSTANT_SET_SPREAD,
          0,
          0,
          centralSet,
          centralSet,
          "no published alternative to the constants of the components present (one fit each)",
          List.of());
    }
    Alternative lowest = null;
    Alternative highest = null;
    double minPredicted = 0;
    double maxPredicted = 0;
    for (Alternative a : table.alternatives) {
      double predicted = 0;
      for (int i = 0; i < a.delta.length; i++) {
        predicted += s[table.equilibria[i]] * a.delta[i];
      }
      if (predicted < minPredicted) {
        minPredicted = predicted;
        lowest = a;
      }
      if (predicted > maxPredicted) {
        maxPredicted = predicted;
        highest = a;
      }
    }
    double below = 0;
    double above = 0;
    String lowSet = centralSet;
    String highSet = centralSet;
    if (lowest != null) {
      double d = exactPh(lowest.set, composition, water, options, central) - ph;
      if (d < 0) {
        below = -d;
        lowSet = lowest.set.id();
      }
    }
    if (highest != null) {
      double d = exactPh(highest.set, composition, water, options, central) - ph;
      if (d > 0) {
        above = d;
        highSet = highest.set.id();
      }
    }
    return new Part(
        Kind.CONSTANT_SET_SPREAD, below, above, lowSet, highSet, SCREENED_BASIS, List.of());
  }

  private static double exactPh(
      ConstantSet set,
      Composition composition,
      WaterState water,
      SpeciationOptions options,
      PhSolution central) {
    ConstantsAtState k =
        ConstantsAtState.of(set, water.temperatureK(), water.pKw(), composition.totals().keySet());
    return -new ChargeBalanceSolver(
            composition.totals(),
            k.kaByEquilibrium(),
            Speciation.carried(k, options),
            water,
            options.activityModel())
        .solve(-central.ph(), central.ionicStrengthMolPerKg())
        .log10ActivityH();
  }

  private static Part estimated(Table table, double[] s, double ph) {
    List<Contribution> contributions = null;
    double sum = 0;
    for (int i = 0; i < table.equilibria.length; i++) {
      double u = table.uncertainty[i];
      if (u == 0) {
        continue;
      }
      double sensitivity = s[table.equilibria[i]];
      double d = Math.abs(sensitivity) * u;
      sum += d * d;
      if (contributions == null) {
        contributions = new ArrayList<>(2);
      }
      contributions.add(
          new Contribution(
              table.names[i], d, table.details[i] + "; dpH/dlog10 K " + round(sensitivity, 4)));
    }
    if (contributions == null) {
      return Part.notApplicable(Kind.ESTIMATED_CONSTANTS, NO_ESTIMATED_CONSTANT);
    }
    return Part.symmetric(Kind.ESTIMATED_CONSTANTS, Math.sqrt(sum), ESTIMATED_BASIS, contributions);
  }

  static double round(double x, int digits) {
    double f = Math.pow(10, digits);
    return Math.round(x * f) / f;
  }

  /** An alternative set that differs for the components present, and its log10 K differences. */
  private record Alternative(ConstantSet set, double[] delta) {}

  /**
   * What depends only on the state: the equilibria present, their stated uncertainties, and the
   * alternative sets' log10 K differences (by position in {@code equilibria}).
   */
  private record Table(
      int[] equilibria,
      double[] uncertainty,
      String[] names,
      String[] details,
      List<Alternative> alternatives) {}

  private static final Map<ConstantsAtState.Key, Table> CACHE = new ConcurrentHashMap<>();

  private static Table table(Composition composition, WaterState water, SpeciationOptions options) {
    Objects.requireNonNull(options, "options");
    ConstantsAtState.Key key =
        ConstantsAtState.Key.of(
            options.constants(), water.temperatureK(), water.pKw(), composition.totals().keySet());
    Table t = CACHE.get(key);
    if (t != null) {
      return t;
    }
    t = build(composition, water, options.constants());
    if (CACHE.size() < CACHE_LIMIT) {
      CACHE.putIfAbsent(key, t);
    }
    return t;
  }

  private static Table build(Composition composition, WaterState water, ConstantSet base) {
    double t = water.temperatureK();
    double pKw = water.pKw();
    List<Equilibrium> present = new ArrayList<>();
    for (Component c : composition.totals().keySet()) {
      present.addAll(c.equilibria());
    }
    int n = present.size();
    int[] eq = new int[n];
    double[] u = new double[n];
    String[] names = new String[n];
    String[] details = new String[n];
    double[] baseLogK = new double[n];
    List<Fit> baseSelection = new ArrayList<>(n);
    for (int i = 0; i < n; i++) {
      Equilibrium e = present.get(i);
      Fit fit = base.fitAt(e, t);
      baseSelection.add(fit);
      eq[i] = e.ordinal();
      u[i] = ConstantUncertainty.of(fit, t);
      names[i] = e.name().toLowerCase(Locale.ROOT);
      details[i] =
          u[i] == 0
              ? ""
              : String.format(
                  Locale.ROOT,
                  "fit %s, log10 K %.3f ± %.3f: %s",
                  fit.id(),
                  fit.log10K(t, pKw),
                  u[i],
                  ConstantUncertainty.reason(fit, t));
      baseLogK[i] = fit.log10K(t, pKw);
    }
    List<List<Fit>> seen = new ArrayList<>();
    seen.add(baseSelection);
    List<Alternative> alternatives = new ArrayList<>();
    for (ConstantSet set : ConstantSets.all()) {
      List<Fit> selection = new ArrayList<>(n);
      for (Equilibrium e : present) {
        selection.add(set.fitAt(e, t));
      }
      if (seen.contains(selection)) {
        continue;
      }
      seen.add(selection);
      double[] delta = new double[n];
      for (int i = 0; i < n; i++) {
        delta[i] = selection.get(i).log10K(t, pKw) - baseLogK[i];
      }
      alternatives.add(new Alternative(set, delta));
    }
    return new Table(eq, u, names, details, List.copyOf(alternatives));
  }
}
