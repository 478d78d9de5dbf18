package org.kwanta.model.conductivity;

import java.util.ArrayList;
import java.util.List;
import org.kwanta.model.numeric.Brent;

/**
 * Every amount of one solute, the others held, at which a solution has a given conductivity: the
 * inverse problem when κ is not monotonic in the amount. Sodium hydroxide added to an acid (the
 * cation-exchanged phosphate or caustic boiler water) first lowers κ, as Na⁺ (λ° 50 S·cm²/mol)
 * replaces H⁺ (350), until the first equivalence point, and raises it after; a target below the
 * acid's own κ then has two amounts (or none, below the dip). {@link SolutionModel#fit} finds one
 * root and assumes κ rises with the amount; this class scans [0, upper] for brackets with a sign
 * change of κ − target, refines the lowest point when the scan finds none (golden section), and
 * solves each bracket with Brent's method.
 */
public final class FitRoots {

  /** Points of the bracket scan over [0, upper]. */
  static final int SCAN_POINTS = 32;

  /** Relative tolerance on the amount (of the scan's upper end). */
  public static final double AMOUNT_TOLERANCE = 1e-12;

  private static final int BRENT_ITERATIONS = 200;
  private static final int GOLDEN_ITERATIONS = 60;
  private static final double GOLDEN = (Math.sqrt(5) - 1) / 2;

  private FitRoots() {}

  /**
   * The roots and the solution of least κ found.
   *
   * @param roots the solutions with κ equal to the target, by increasing amount (empty: none); with
   *     a preferred amount, only the root of the bracket nearest to it
   * @param lowest the solution of the lowest κ found on [0, upper] (the closest approach when there
   *     is no root)
   * @param count how many roots there are (the brackets found)
   */
  public record Result(List<Solution> roots, Solution lowest, int count) {

    /** Whether every root was solved. */
    public boolean complete() {
      return roots.size() == count;
    }
  }

  /**
   * All roots of κ(amount) = target for amounts in [0, upper].
   *
   * @param model the solution model
   * @param known the other amounts, mol/kg (the unknown's own amount is ignored)
   * @param unknown the solute whose amount varies (not {@link Solute#SODIUM_CHLORIDE})
   * @param kappaTarget conductivity at the model's temperature, µS/cm
   * @param upper upper end of the amounts searched, mol/kg (positive)
   */
  public static Result all(
      SolutionModel model, Solutes known, Solute unknown, double kappaTarget, double upper) {
    return all(model, known, unknown, kappaTarget, upper, Double.POSITIVE_INFINITY);
  }

  /**
   * {@link #all(SolutionModel, Solutes, Solute, double, double)} for a κ known to rise with the
   * amount beyond {@code risingBeyond} (sodium hydroxide past the acids' last equivalence point
   * only adds Na⁺ and OH⁻): the scan stops at its first point beyond that amount where κ is above
   * the target, as no root lies further.
   *
   * @param risingBeyond amount beyond which κ rises monotonically, mol/kg
   */
  public static Result all(
      SolutionModel model,
      Solutes known,
      Solute unknown,
      double kappaTarget,
      double upper,
      double risingBeyond) {
    return all(model, known, unknown, kappaTarget, upper, risingBeyond, 0);
  }

  /**
   * {@link #all(SolutionModel, Solutes, Solute, double, double, double)} solving only the root
   * whose bracket lies nearest (on a log scale) to a preferred amount, when there are several (the
   * others are counted, not solved).
   *
   * @param preferred the preferred amount, mol/kg (≤ 0: solve every root)
   */
  public static Result all(
      SolutionModel model,
      Solutes known,
      Solute unknown,
      double kappaTarget,
      double upper,
      double risingBeyond,
      double preferred) {
    Curve c = new Curve(model, known, unknown, kappaTarget);
    double tol = upper * AMOUNT_TOLERANCE;
    List<Solution> roots = new ArrayList<>(2);
    double[] x = new double[SCAN_POINTS + 1];
    double[] f = new double[SCAN_POINTS + 1];
    Solution[] at = new Solution[SCAN_POINTS + 1];
    int lowest = 0;
    int last = SCAN_POINTS;
    for (int i = 0; i <= SCAN_POINTS; i++) {
      x[i] = upper * i / SCAN_POINTS;
      at[i] = c.at(x[i]);
      f[i] = at[i].kappa() - kappaTarget;
      if (f[i] < f[lowest]) {
        lowest = i;
      }
      if (x[i] >= risingBeyond && f[i] > 0) {
        last = i;
        break;
      }
    }
    List<double[]> brackets = new ArrayList<>(2);
    for (int i = 0; i < last; i++) {
      if (f[i] == 0) {
        brackets.add(new double[] {x[i], x[i]});
      } else if (f[i] * f[i + 1] < 0) {
        brackets.add(new double[] {x[i], x[i + 1]});
      }
    }
    if (f[last] == 0) {
      brackets.add(new double[] {x[last], x[last]});
    }
    double xLow = x[lowest];
    Solution low = null;
    if (brackets.isEmpty() && f[lowest] > 0) {
      // a dip narrower than the scan step: find the least κ between the neighbouring points
      double a = x[Math.max(0, lowest - 1)];
      double b = x[Math.min(last, lowest + 1)];
      xLow = golden(c, a, b, tol);
      low = c.at(xLow);
      if (low.kappa() < kappaTarget) {
        brackets.add(new double[] {a, xLow});
        brackets.add(new double[] {xLow, b});
      }
    }
    if (low == null) {
      low = at[lowest];
    }
    int only = preferred > 0 && brackets.size() > 1 ? nearest(brackets, preferred) : -1;
    for (int k = 0; k < brackets.size(); k++) {
      if (only < 0 || k == only) {
        double[] b = brackets.get(k);
        roots.add(
            b[0] == b[1] ? c.at(b[0]) : c.at(Brent.solve(c, b[0], b[1], tol, BRENT_ITERATIONS)));
      }
    }
    return new Result(List.copyOf(roots), low, brackets.size());
  }

  /** Index of the bracket nearest to an amount on a log scale (0 inside it). */
  private static int nearest(List<double[]> brackets, double amount) {
    int best = 0;
    double bestDistance = Double.POSITIVE_INFINITY;
    for (int k = 0; k < brackets.size(); k++) {
      double[] b = brackets.get(k);
      double d;
      if (amount >= b[0] && amount <= b[1]) {
        d = 0;
      } else if (amount > b[1]) {
        d = b[1] > 0 ? Math.log(amount / b[1]) : Double.MAX_VALUE;
      } else {
        d = Math.log(b[0] / amount);
      }
      if (d < bestDistance) {
        bestDistance = d;
        best = k;
      }
    }
    return best;
  }

  /**
   * The one root of κ(amount) = target between two amounts whose κ lie on either side of the target
   * (for refitting a chosen root after a small change of the target).
   *
   * @throws IllegalArgumentException when κ − target has the same sign at both ends
   */
  public static Solution between(
      SolutionModel model,
      Solutes known,
      Solute unknown,
      double kappaTarget,
      double from,
      double to,
      double tolerance) {
    Curve c = new Curve(model, known, unknown, kappaTarget);
    return c.at(Brent.solve(c, from, to, tolerance, BRENT_ITERATIONS));
  }

  /** Golden-section search for the least κ on [a, b]. */
  private static double golden(Curve c, double a, double b, double tol) {
    double x1 = b - GOLDEN * (b - a);
    double x2 = a + GOLDEN * (b - a);
    double f1 = c.applyAsDouble(x1);
    double f2 = c.applyAsDouble(x2);
    for (int i = 0; i < GOLDEN_ITERATIONS && b - a > tol; i++) {
      if (f1 < f2) {
        b = x2;
        x2 = x1;
        f2 = f1;
        x1 = b - GOLDEN * (b - a);
        f1 = c.applyAsDouble(x1);
      } else {
        a = x1;
        x1 = x2;
        f1 = f2;
        x2 = a + GOLDEN * (b - a);
        f2 = c.applyAsDouble(x2);
      }
    }
    return f1 < f2 ? x1 : x2;
  }

  /** κ(amount) − target, each solve started from the previous solution. */
  private static final class Curve implements java.util.function.DoubleUnaryOperator {
    private final SolutionModel model;
    private final Solutes known;
    private final Solute unknown;
    private final double target;
    private Solution last;

    Curve(SolutionModel model, Solutes known, Solute unknown, double target) {
      this.model = model;
      this.known = known;
      this.unknown = unknown;
      this.target = target;
    }

    Solution at(double amount) {
      last = model.solve(known.with(unknown, amount), last);
      return last;
    }

    @Override
    public double applyAsDouble(double amount) {
      return at(amount).kappa() - target;
    }
  }
}
