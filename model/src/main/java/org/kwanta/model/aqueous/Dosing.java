package org.kwanta.model.aqueous;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import org.kwanta.model.numeric.Brent;
import org.kwanta.model.water.WaterState;

/**
 * Dosing advice, the inverse of the speciation: the amount of an alkalizer (one weak base, or a mix
 * of fixed molar proportions) that, added to a background water, gives a target pH — the pH at 25
 * °C, or a margin of the pH at a location's temperature and pressure over neutral there. pH rises
 * monotonically with the amount of a base, so the amount is the single root of pH(x) − target,
 * found by Brent's method on ln x. The band is the spread of that amount over the published
 * constant sets ({@link ConstantSets#all()}), as the pH band of the speciation is. Advisory: the
 * plant's procedures govern.
 */
public final class Dosing {

  /** Smallest amount searched, mol/kg (far below any dose that moves the pH). */
  static final double MIN_AMOUNT = 1e-10;

  /** Tolerance on ln x (relative 1e-10 on the amount). */
  static final double LN_TOLERANCE = 1e-10;

  private static final int BRENT_ITERATIONS = 200;

  private Dosing() {}

  /** What the pH target refers to. */
  public enum Basis {
    /** The pH at 25 °C. */
    PH_25,
    /** pH at the location's temperature and pressure minus the neutral pH there. */
    MARGIN_OVER_NEUTRAL
  }

  /**
   * One dose.
   *
   * @param amountMolPerKg total of the alkalizer, mol/kg
   * @param totals each alkalizer's total, mol/kg
   * @param ph25 pH at 25 °C of the dosed water
   * @param phAtLocation pH at the location (NaN for a 25 °C target)
   * @param neutralPhAtLocation neutral pH at the location (NaN for a 25 °C target)
   * @param constantSet the constant set used
   */
  public record Dose(
      double amountMolPerKg,
      Map<Component, Double> totals,
      double ph25,
      double phAtLocation,
      double neutralPhAtLocation,
      String constantSet) {}

  /**
   * The advice: the dose with the default constants and its band over the constant sets.
   *
   * @param dose with the default constant set
   * @param lowest the smallest dose over the sets
   * @param highest the largest dose over the sets
   * @param alreadyAtTarget whether the background water already meets the target (dose 0)
   */
  public record Advice(Dose dose, Dose lowest, Dose highest, boolean alreadyAtTarget) {}

  /**
   * The dose giving a target.
   *
   * @param background the water before dosing (its own alkalizer counts as background)
   * @param mix molar proportions of the alkalizers dosed (weak bases; summing to 1)
   * @param basis what the target refers to
   * @param target pH at 25 °C, or the margin over neutral at the location, pH units
   * @param at25 the water at 25 °C (0.101325 MPa)
   * @param location the water state at the location (used for {@link Basis#MARGIN_OVER_NEUTRAL})
   * @param options activity model and sample origin (the constant set is varied for the band)
   * @throws IllegalArgumentException when the mix is not of weak bases, or the target cannot be
   *     reached with a total below {@link Composition#TOTAL_MOLALITY_RANGE}'s maximum
   */
  public static Advice advise(
      Composition background,
      Map<Component, Double> mix,
      Basis basis,
      double target,
      WaterState at25,
      WaterState location,
      SpeciationOptions options) {
    for (Component c : mix.keySet()) {
      if (!c.isWeakBase()) {
        throw new IllegalArgumentException(c + " is not an alkalizer (weak base)");
      }
    }
    if (!Double.isFinite(target)) {
      throw new IllegalArgumentException("target must be a finite pH, not " + target);
    }
    Dose central = null;
    Dose lowest = null;
    Dose highest = null;
    boolean atTarget = false;
    List<ConstantSet> sets = new ArrayList<>();
    sets.add(options.constants());
    for (ConstantSet s : ConstantSets.all()) {
      if (!s.id().equals(options.constants().id())) {
        sets.add(s);
      }
    }
    for (ConstantSet set : sets) {
      SpeciationOptions o = options.withConstants(set);
      Problem p = new Problem(background, mix, basis, target, at25, location, o);
      double x;
      if (p.applyAsDouble(Math.log(MIN_AMOUNT)) >= 0) {
        x = 0;
        atTarget |= central == null;
      } else {
        x = Math.exp(p.solve());
      }
      Dose d = p.dose(x, set.id());
      if (central == null) {
        central = d;
      }
      if (lowest == null || d.amountMolPerKg() < lowest.amountMolPerKg()) {
        lowest = d;
      }
      if (highest == null || d.amountMolPerKg() > highest.amountMolPerKg()) {
        highest = d;
      }
    }
    return new Advice(central, lowest, highest, atTarget);
  }

  /** pH(ln x) − target for one constant set. */
  private static final class Problem implements java.util.function.DoubleUnaryOperator {
    private final Composition background;
    private final Map<Component, Double> mix;
    private final Basis basis;
    private final double target;
    private final WaterState at25;
    private final WaterState location;
    private final SpeciationOptions options;

    Problem(
        Composition background,
        Map<Component, Double> mix,
        Basis basis,
        double target,
        WaterState at25,
        WaterState location,
        SpeciationOptions options) {
      this.background = background;
      this.mix = mix;
      this.basis = basis;
      this.target = target;
      this.at25 = at25;
      this.location = location;
      this.options = options;
    }

    Composition dosed(double x) {
      Composition c = background;
      for (Map.Entry<Component, Double> e : mix.entrySet()) {
        c = c.with(e.getKey(), background.molality(e.getKey()) + x * e.getValue());
      }
      return c;
    }

    double value(Composition c) {
      return basis == Basis.PH_25
          ? Speciation.ph(c, at25, options).ph()
          : Speciation.ph(c, location, options).ph() - location.neutralPh();
    }

    @Override
    public double applyAsDouble(double lnX) {
      return value(dosed(Math.exp(lnX))) - target;
    }

    double solve() {
      double hi = Math.log(1e-6);
      double max = Math.log(Composition.TOTAL_MOLALITY_RANGE.max() * (1 - 1e-9));
      while (applyAsDouble(hi) < 0) {
        if (hi >= max) {
          throw new IllegalArgumentException(
              "the target "
                  + target
                  + " is not reached with "
                  + Composition.TOTAL_MOLALITY_RANGE.max()
                  + " mol/kg of the alkalizer");
        }
        hi = Math.min(max, hi + Math.log(10));
      }
      return Brent.solve(this, Math.log(MIN_AMOUNT), hi, LN_TOLERANCE, BRENT_ITERATIONS);
    }

    Dose dose(double x, String set) {
      Composition c = dosed(x);
      Map<Component, Double> totals = new EnumMap<>(Component.class);
      for (Map.Entry<Component, Double> e : mix.entrySet()) {
        totals.put(e.getKey(), x * e.getValue());
      }
      double ph25 = Speciation.ph(c, at25, options).ph();
      double phT = Double.NaN;
      double neutral = Double.NaN;
      if (basis == Basis.MARGIN_OVER_NEUTRAL) {
        phT = Speciation.ph(c, location, options).ph();
        neutral = location.neutralPh();
      }
      return new Dose(x, Map.copyOf(totals), ph25, phT, neutral, set);
    }
  }
}
