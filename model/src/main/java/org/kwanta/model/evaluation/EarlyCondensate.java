package org.kwanta.model.evaluation;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.kwanta.model.NoConvergenceException;
import org.kwanta.model.aqueous.Component;
import org.kwanta.model.aqueous.Composition;
import org.kwanta.model.aqueous.Speciation;
import org.kwanta.model.aqueous.SpeciationOptions;
import org.kwanta.model.aqueous.SpeciationResult;
import org.kwanta.model.aqueous.Species;
import org.kwanta.model.water.Distribution;
import org.kwanta.model.water.DistributionConstant;
import org.kwanta.model.water.VolatileSolute;
import org.kwanta.model.water.WaterState;

/**
 * The liquid in equilibrium with a steam: the first condensate of a steam sample (early
 * condensate), which is also the liquid of a two-phase region (drum, evaporator, deaerator) whose
 * steam was sampled.
 *
 * <p>Only neutral molecules distribute into the steam; ions stay in the liquid. For a volatile
 * component with distribution constant K_D (steam over liquid, {@link Distribution}) and neutral
 * fraction α₀ in the liquid at its pH, the overall ratio is D = K_D α₀ and the liquid total is
 * m_liquid = m_steam / D (IAPWS G7-04 convention; the shared notes §1.1). α₀ depends on the
 * liquid's pH, so m_liquid and the speciation are iterated to a fixed point.
 *
 * <p>Assumptions, stated with every result: non-volatile solutes (sodium, chloride, sulfate,
 * phosphate) are taken at their steam concentration; their own small volatilities, which make a
 * real early condensate richer in them, are not modelled, so the result is the least concentrated
 * first condensate. The neutralizing amines' distribution constants are order-of-magnitude
 * estimates (from memory, ±100 %; {@code water.AmineDistribution}), used only when the caller opts
 * in ({@code amineEstimates}; the reference notes: not to be shipped as defaults without the
 * primary data). Opted in, a steam sample dosed with an amine gets a pH at temperature whose notes
 * say that it rests on an estimate and give the pH with the amine's K_D multiplied and divided by
 * one plus its stated relative uncertainty; otherwise {@link NoDistributionConstant} is thrown.
 */
final class EarlyCondensate {

  /** Largest number of fixed-point iterations. */
  static final int MAX_ITERATIONS = 60;

  /**
   * Change of ln m of every volatile total at which the iteration stops (1e-9 relative; the pH
   * moves by less than 1e-9).
   */
  static final double TOLERANCE = 1e-9;

  private EarlyCondensate() {}

  /** The liquid's speciation and what the reader must know about it. */
  record Result(
      SpeciationResult liquid, Composition liquidTotals, Composition steam, List<String> notes) {}

  /**
   * Thrown when a weak base (ammonia or an amine) is present whose distribution constant cannot be
   * used: an amine whose estimated constant was not opted in to, or a weak base with no constant at
   * all, which goes into the steam as its neutral molecule and so cannot be taken at its steam
   * concentration.
   */
  static final class NoDistributionConstant extends RuntimeException {
    private static final long serialVersionUID = 1L;

    NoDistributionConstant(Component c) {
      super(
          "no published vapour-liquid distribution constant for "
              + name(c)
              + " retrieved; Kwanta's order-of-magnitude estimate (from memory, about a factor of"
              + " two) is off by default and is used only when opted in to"
              + " (Evaluator.withAmineDistributionEstimates(true), service setting"
              + " kwanta.evaluation.amine-distribution-estimates=true)");
    }

    private NoDistributionConstant(String message) {
      super(message);
    }

    /** For a weak base with no distribution constant, published or estimated. */
    static NoDistributionConstant none(Component c) {
      return new NoDistributionConstant(
          "no vapour-liquid distribution constant for "
              + name(c)
              + ", published or estimated: as a weak base it goes into the steam as its neutral"
              + " molecule, so the liquid in equilibrium with this steam cannot be computed"
              + " without one (taking it as non-volatile would understate it)");
    }

    private static String name(Component c) {
      return c.name().toLowerCase(Locale.ROOT).replace('_', ' ');
    }
  }

  /**
   * The volatile components: those whose name is a {@link VolatileSolute}, the solutes with a
   * distribution constant. Built once; a component missing here is taken as non-volatile unless it
   * is a weak base, which is refused ({@link NoDistributionConstant#none}).
   */
  private static final Map<Component, VolatileSolute> VOLATILE = new EnumMap<>(Component.class);

  /** The neutral species of each volatile component: the one that distributes into the steam. */
  private static final Map<Component, Species> NEUTRAL = new EnumMap<>(Component.class);

  static {
    for (VolatileSolute v : VolatileSolute.values()) {
      Component c = Component.valueOf(v.name());
      VOLATILE.put(c, v);
      NEUTRAL.put(
          c,
          c.species().stream()
              .filter(s -> s.chargeNumber() == 0)
              .findFirst()
              .orElseThrow(() -> new IllegalStateException(c + " has no neutral species")));
    }
  }

  /**
   * The liquid in equilibrium with a steam of the given composition.
   *
   * @param steam totals in the steam (as condensed), mol/kg
   * @param liquidWater saturated liquid at the condensation temperature
   * @param options speciation options
   * @param amineEstimates whether the amines' estimated distribution constants may be used
   * @throws NoDistributionConstant when an amine is present and {@code amineEstimates} is false, or
   *     a weak base with no distribution constant is present
   */
  static Result of(
      Composition steam,
      WaterState liquidWater,
      SpeciationOptions options,
      boolean amineEstimates) {
    return of(steam, liquidWater, options, amineEstimates, null);
  }

  /**
   * As {@link #of(Composition, WaterState, SpeciationOptions, boolean)}, started from the liquid of
   * a nearby steam (the band's perturbed compositions start from the central one); {@code near}
   * changes only the starting point, not the result beyond the tolerance.
   */
  static Result of(
      Composition steam,
      WaterState liquidWater,
      SpeciationOptions options,
      boolean amineEstimates,
      Result near) {
    double t = liquidWater.temperatureK();
    Map<Component, DistributionConstant> kD = new EnumMap<>(Component.class);
    for (Component c : steam.totals().keySet()) {
      VolatileSolute v = VOLATILE.get(c);
      if (v == null) {
        if (c.isWeakBase()) {
          throw NoDistributionConstant.none(c);
        }
        continue;
      }
      if (isAmine(c) && !amineEstimates) {
        throw new NoDistributionConstant(c);
      }
      kD.put(c, Distribution.at(v, t));
    }
    Result r = solve(steam, liquidWater, options, near, kD, 1);
    double u =
        kD.entrySet().stream()
            .filter(e -> isAmine(e.getKey()))
            .mapToDouble(e -> e.getValue().relativeUncertainty())
            .max()
            .orElse(0);
    if (near != null || u == 0) {
      return r;
    }
    // the central result only: what the amine estimate's own uncertainty does to the pH
    double phLow = solve(steam, liquidWater, options, r, kD, 1 + u).liquid().ph();
    double phHigh = solve(steam, liquidWater, options, r, kD, 1 / (1 + u)).liquid().ph();
    List<String> notes = new ArrayList<>(r.notes());
    notes.add(
        String.format(
            Locale.ROOT,
            "with the amine's K_D multiplied or divided by %.2g (its stated uncertainty) this pH"
                + " would lie between %.2f and %.2f; the pH band does not include this",
            1 + u,
            Math.min(phLow, phHigh),
            Math.max(phLow, phHigh)));
    return new Result(r.liquid(), r.liquidTotals(), r.steam(), List.copyOf(notes));
  }

  /** The fixed point, with the amines' K_D multiplied by {@code amineScale}. */
  private static Result solve(
      Composition steam,
      WaterState liquidWater,
      SpeciationOptions options,
      Result near,
      Map<Component, DistributionConstant> constants,
      double amineScale) {
    Map<Component, Double> kD = new EnumMap<>(Component.class);
    constants.forEach((c, k) -> kD.put(c, isAmine(c) ? k.kD() * amineScale : k.kD()));
    // Fixed point x = F(x) per volatile component, x = ln m_liquid, F(x) = ln(m_steam / (K_D
    // α₀(x))); accelerated by a secant estimate of F'(x) from the previous iterate (Steffensen's
    // idea), falling back to the plain update when the estimate is not usable.
    Component[] volatiles = kD.keySet().toArray(new Component[0]);
    int n = volatiles.length;
    double[] x = new double[n];
    double[] previousX = new double[n];
    double[] previousF = new double[n];
    Composition liquid = steam;
    for (int i = 0; i < n; i++) {
      Component c = volatiles[i];
      // start: the near liquid's ratio to its steam, or all neutral (α₀ = 1)
      x[i] =
          near != null && near.steam().molality(c) > 0
              ? Math.log(
                  steam.molality(c) * near.liquidTotals().molality(c) / near.steam().molality(c))
              : Math.log(steam.molality(c) / kD.get(c));
      previousX[i] = Double.NaN;
      liquid = liquid.with(c, Math.exp(x[i]));
    }
    SpeciationResult r =
        near == null
            ? Speciation.solve(liquid, liquidWater, options)
            : Speciation.solve(liquid, liquidWater, options, near.liquid());
    for (int k = 0; k < MAX_ITERATIONS; k++) {
      double change = 0;
      Composition next = steam;
      for (int i = 0; i < n; i++) {
        Component c = volatiles[i];
        double alpha0 = r.molality(neutral(c)) / liquid.molality(c);
        double f = Math.log(steam.molality(c) / (kD.get(c) * alpha0));
        double step = f - x[i];
        change = Math.max(change, Math.abs(step));
        double slope = (f - previousF[i]) / (x[i] - previousX[i]);
        double xNext = Double.isFinite(slope) && slope < 0.9 ? x[i] + step / (1 - slope) : f;
        previousX[i] = x[i];
        previousF[i] = f;
        x[i] = xNext;
        next = next.with(c, Math.exp(xNext));
      }
      if (change <= TOLERANCE) {
        return new Result(r, liquid, steam, notes(constants));
      }
      liquid = next;
      r = Speciation.solve(liquid, liquidWater, options, r);
    }
    throw new NoConvergenceException("early-condensate distribution", MAX_ITERATIONS, Double.NaN);
  }

  private static List<String> notes(Map<Component, DistributionConstant> kD) {
    List<String> notes = new ArrayList<>();
    notes.add(
        "pH of the first condensate (liquid in equilibrium with the steam) at the saturation"
            + " temperature; non-volatile solutes taken at their steam concentration (a lower"
            + " bound for a real early condensate)");
    if (kD.keySet().stream().anyMatch(EarlyCondensate::isAmine)) {
      notes.add(
          "the amine's vapour-liquid distribution constant is an order-of-magnitude estimate"
              + " recalled from memory (no published correlation retrieved; about a factor of two"
              + " either way): this pH at temperature is an estimate");
    }
    for (DistributionConstant k : kD.values()) {
      notes.add(
          String.format(
              Locale.ROOT,
              "K_D(%s) = %.3g ± %.0f %% at %.1f °C from %s (%s)%s",
              k.solute().name().toLowerCase(Locale.ROOT).replace('_', ' '),
              k.kD(),
              100 * k.relativeUncertainty(),
              k.temperatureK() - 273.15,
              k.source().id(),
              k.source().confidence().name().toLowerCase(Locale.ROOT).replace('_', ' '),
              k.extrapolated()
                  ? String.format(
                      Locale.ROOT,
                      ", extrapolated beyond the fit's %.0f-%.0f K",
                      k.fitRange().min(),
                      k.fitRange().max())
                  : ""));
    }
    return notes;
  }

  /** An amine: a weak base other than ammonia (its distribution constant is an estimate). */
  private static boolean isAmine(Component c) {
    return c.isWeakBase() && c != Component.AMMONIA;
  }

  /** The neutral species of a volatile component: the one that distributes into the steam. */
  private static Species neutral(Component c) {
    Species s = NEUTRAL.get(c);
    if (s == null) {
      throw new IllegalArgumentException(c + " is not volatile");
    }
    return s;
  }
}
