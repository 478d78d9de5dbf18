package org.kwanta.model.aqueous;

import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.kwanta.model.NoConvergenceException;
import org.kwanta.model.numeric.Brent;
import org.kwanta.model.water.WaterState;

/**
 * The speciation algorithm (the project's reference notes §8.1).
 *
 * <p>Unknowns x = log10 a(H⁺) and I. For fixed activity coefficients every weak acid/base fraction
 * is a closed-form function of a(H⁺): along a component's chain, m(i)/m(i−1) = Ka_i·γ(i−1)/(γ(i)·
 * a(H⁺)); m(OH⁻) = Kw/(γ(OH⁻)·a(H⁺)) with a(H2O) = 1. The charge balance Σ z m is strictly
 * increasing in x (every ratio falls as a(H⁺) rises, shifting each chain to its more positive
 * species; m(H⁺) rises and m(OH⁻) falls), so it has exactly one root, found by Brent's method on a
 * bracket whose sign change is verified. I is then recomputed from the species and the solve is
 * repeated until |ΔI| &lt; 1e-12 mol/kg.
 *
 * <p>The I tolerance is absolute: it is always reachable in double precision for the accepted
 * totals (≤ 0.1 mol/kg per component, so I ≲ 2 mol/kg and ulp(I) ≤ 4e-16), and it is always small
 * enough, because d(log10 γ)/dI ≤ A·z²/(2√I) and I ≥ m(H⁺) + m(OH⁻) ≥ 2√Kw &gt; 1e-8 mol/kg in
 * 0-350 °C liquid water, so the error it leaves in log10 γ is below 1e-8·z².
 */
final class ChargeBalanceSolver {

  /** Stop the outer iteration when |ΔI| is below this, mol/kg. */
  static final double IONIC_STRENGTH_TOLERANCE = 1e-12;

  /** Tolerance on x = log10 a(H⁺) for the inner root find. */
  static final double LOG_ACTIVITY_TOLERANCE = 1e-14;

  /** Outer-iteration cap (convergence takes fewer than ten at cycle ionic strengths). */
  static final int MAX_OUTER_ITERATIONS = 200;

  /** Inner-iteration cap; bisection alone needs about 60 steps for the bracket widths here. */
  static final int MAX_INNER_ITERATIONS = 300;

  private final WaterState water;
  private final ActivityModel activityModel;
  private final double temperatureK;
  private final double kw;

  private final Component[] components;
  private final double[] totals;
  private final int[][] charges;
  private final double[][] ka;
  private final double cationCapacity;
  private final double anionCapacity;

  /** γ for |z| = 0..3 at the current ionic strength. */
  private final double[] gamma = new double[4];

  /** Conditional step constants Ka·γ(i−1)/γ(i) at the current ionic strength. */
  private final double[][] conditional;

  ChargeBalanceSolver(
      Map<Component, Double> composition,
      double[] log10KaByEquilibrium,
      WaterState water,
      ActivityModel activityModel) {
    this.water = water;
    this.activityModel = activityModel;
    this.temperatureK = water.temperatureK();
    this.kw = Math.pow(10, -water.pKw());
    int n = composition.size();
    components = new Component[n];
    totals = new double[n];
    charges = new int[n][];
    ka = new double[n][];
    conditional = new double[n][];
    double cations = 0;
    double anions = 0;
    int k = 0;
    for (Map.Entry<Component, Double> e : composition.entrySet()) {
      Component c = e.getKey();
      components[k] = c;
      totals[k] = e.getValue();
      List<Species> sp = c.species();
      List<Equilibrium> eq = c.equilibria();
      charges[k] = new int[sp.size()];
      int zMax = Integer.MIN_VALUE;
      int zMin = Integer.MAX_VALUE;
      for (int j = 0; j < sp.size(); j++) {
        charges[k][j] = sp.get(j).charge();
        zMax = Math.max(zMax, charges[k][j]);
        zMin = Math.min(zMin, charges[k][j]);
      }
      ka[k] = new double[eq.size()];
      conditional[k] = new double[eq.size()];
      for (int i = 0; i < eq.size(); i++) {
        ka[k][i] = Math.pow(10, log10KaByEquilibrium[eq.get(i).ordinal()]);
      }
      cations += totals[k] * Math.max(zMax, 0);
      anions += totals[k] * Math.max(-zMin, 0);
      k++;
    }
    cationCapacity = cations;
    anionCapacity = anions;
  }

  /** The solved state: x, I, γ and iteration count. */
  record Solution(double log10ActivityH, double ionicStrength, double[] gamma, int iterations) {}

  Solution solve() {
    double ionicStrength = 0;
    double x = Double.NaN;
    for (int iteration = 1; iteration <= MAX_OUTER_ITERATIONS; iteration++) {
      setActivityCoefficients(ionicStrength);
      x = solveForLogActivity(x);
      double updated = ionicStrengthAt(x);
      double change = Math.abs(updated - ionicStrength);
      ionicStrength = updated;
      if (change < IONIC_STRENGTH_TOLERANCE) {
        return new Solution(x, ionicStrength, gamma.clone(), iteration);
      }
    }
    throw new NoConvergenceException(
        "ionic-strength iteration of the speciation",
        MAX_OUTER_ITERATIONS,
        Math.abs(ionicStrengthAt(x) - ionicStrength));
  }

  private void setActivityCoefficients(double ionicStrength) {
    gamma[0] = 1;
    for (int z = 1; z <= 3; z++) {
      gamma[z] =
          Math.pow(
              10,
              activityModel.log10Gamma(
                  z, ionicStrength, water.debyeHuckelA(), water.debyeHuckelB(), temperatureK));
    }
    for (int k = 0; k < components.length; k++) {
      for (int i = 0; i < ka[k].length; i++) {
        conditional[k][i] =
            ka[k][i] * gamma[Math.abs(charges[k][i])] / gamma[Math.abs(charges[k][i + 1])];
      }
    }
  }

  /** Σ z m at x, mol/kg. */
  double chargeBalance(double x) {
    double aH = Math.pow(10, x);
    double inverse = 1 / aH;
    double sum = aH / gamma[1] - kw * inverse / gamma[1];
    for (int k = 0; k < components.length; k++) {
      double[] c = conditional[k];
      int[] z = charges[k];
      double r = 1;
      double s = 1;
      double q = z[0];
      for (int i = 0; i < c.length; i++) {
        r *= c[i] * inverse;
        s += r;
        q += z[i + 1] * r;
      }
      sum += totals[k] * q / s;
    }
    return sum;
  }

  /** Σ |z| m at x, mol/kg (the scale for the relative residual). */
  double chargeScale(double x) {
    double aH = Math.pow(10, x);
    double inverse = 1 / aH;
    double sum = aH / gamma[1] + kw * inverse / gamma[1];
    for (int k = 0; k < components.length; k++) {
      double[] c = conditional[k];
      int[] z = charges[k];
      double r = 1;
      double s = 1;
      double q = Math.abs(z[0]);
      for (int i = 0; i < c.length; i++) {
        r *= c[i] * inverse;
        s += r;
        q += Math.abs(z[i + 1]) * r;
      }
      sum += totals[k] * q / s;
    }
    return sum;
  }

  private double ionicStrengthAt(double x) {
    double aH = Math.pow(10, x);
    double inverse = 1 / aH;
    double sum = aH / gamma[1] + kw * inverse / gamma[1];
    for (int k = 0; k < components.length; k++) {
      double[] c = conditional[k];
      int[] z = charges[k];
      double r = 1;
      double s = 1;
      double q = z[0] * z[0];
      for (int i = 0; i < c.length; i++) {
        r *= c[i] * inverse;
        s += r;
        q += z[i + 1] * z[i + 1] * r;
      }
      sum += totals[k] * q / s;
    }
    return sum / 2;
  }

  private double solveForLogActivity(double previous) {
    double lo;
    double hi;
    if (Double.isNaN(previous)) {
      // m(H+) <= m(OH-) + anion capacity and m(OH-) <= m(H+) + cation capacity at the root;
      // 2·√Kw covers the water contribution; ±1 covers activity coefficients.
      double root = 2 * Math.sqrt(kw);
      hi = Math.log10(anionCapacity + root) + 1;
      lo = -water.pKw() - Math.log10(cationCapacity + root) - 1;
    } else {
      lo = previous - 0.05;
      hi = previous + 0.05;
    }
    double fLo = chargeBalance(lo);
    int widen = 0;
    while (fLo > 0) {
      lo -= 2 << Math.min(widen, 4);
      fLo = chargeBalance(lo);
      if (++widen > 40) {
        throw new NoConvergenceException("charge-balance bracket (low side)", widen, fLo);
      }
    }
    double fHi = chargeBalance(hi);
    widen = 0;
    while (fHi < 0) {
      hi += 2 << Math.min(widen, 4);
      fHi = chargeBalance(hi);
      if (++widen > 40) {
        throw new NoConvergenceException("charge-balance bracket (high side)", widen, fHi);
      }
    }
    return Brent.solve(this::chargeBalance, lo, hi, LOG_ACTIVITY_TOLERANCE, MAX_INNER_ITERATIONS);
  }

  /** Builds the species list at a solution (γ of the solution must be current). */
  List<SpeciesAmount> species(Solution solution) {
    double inverse = Math.pow(10, -solution.log10ActivityH());
    List<SpeciesAmount> out = new ArrayList<>();
    for (Component c : Component.values()) {
      for (int k = 0; k < components.length; k++) {
        if (components[k] != c) {
          continue;
        }
        double[] cc = conditional[k];
        int[] z = charges[k];
        double[] r = new double[z.length];
        r[0] = 1;
        double s = 1;
        for (int i = 0; i < cc.length; i++) {
          r[i + 1] = r[i] * cc[i] * inverse;
          s += r[i + 1];
        }
        List<Species> sp = c.species();
        for (int j = 0; j < z.length; j++) {
          double fraction = r[j] / s;
          out.add(
              new SpeciesAmount(
                  sp.get(j), totals[k] * fraction, fraction, solution.gamma()[Math.abs(z[j])]));
        }
      }
    }
    return out;
  }

  double kw() {
    return kw;
  }

  Set<Component> components() {
    Set<Component> s = EnumSet.noneOf(Component.class);
    for (Component c : components) {
      s.add(c);
    }
    return s;
  }
}
