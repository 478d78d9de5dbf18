package org.kwanta.model.numeric;

import java.util.function.DoubleUnaryOperator;
import org.kwanta.model.NoConvergenceException;

/**
 * Brent's bracketed root finder (R. P. Brent, <i>Algorithms for Minimization without
 * Derivatives</i>, Prentice-Hall 1973, ch. 4): inverse quadratic interpolation and secant steps,
 * falling back to bisection, so it always converges on a bracket with a sign change.
 */
public final class Brent {

  private Brent() {}

  /**
   * Finds x in [a, b] with f(x) = 0.
   *
   * @param f a continuous function with f(a)·f(b) ≤ 0
   * @param a one end of the bracket
   * @param b the other end
   * @param absoluteTolerance tolerance on x
   * @param maxIterations iteration cap; bisection alone needs log2((b − a)/tol) steps
   * @return the root
   * @throws IllegalArgumentException when f(a) and f(b) have the same sign
   * @throws NoConvergenceException when the cap is reached (impossible with a cap above the
   *     bisection count)
   */
  public static double solve(
      DoubleUnaryOperator f, double a, double b, double absoluteTolerance, int maxIterations) {
    double fa = f.applyAsDouble(a);
    double fb = f.applyAsDouble(b);
    if (fa == 0) {
      return a;
    }
    if (fb == 0) {
      return b;
    }
    if (Math.signum(fa) == Math.signum(fb)) {
      throw new IllegalArgumentException(
          "root not bracketed: f(" + a + ") = " + fa + ", f(" + b + ") = " + fb);
    }
    double c = a;
    double fc = fa;
    double d = b - a;
    double e = d;
    for (int i = 0; i < maxIterations; i++) {
      if (Math.signum(fb) == Math.signum(fc)) {
        c = a;
        fc = fa;
        d = b - a;
        e = d;
      }
      if (Math.abs(fc) < Math.abs(fb)) {
        a = b;
        b = c;
        c = a;
        fa = fb;
        fb = fc;
        fc = fa;
      }
      double tol = 2 * Math.ulp(b) + 0.5 * absoluteTolerance;
      double m = 0.5 * (c - b);
      if (Math.abs(m) <= tol || fb == 0) {
        return b;
      }
      if (Math.abs(e) < tol || Math.abs(fa) <= Math.abs(fb)) {
        d = m;
        e = m;
      } else {
        double s = fb / fa;
        double p;
        double q;
        if (a == c) {
          p = 2 * m * s;
          q = 1 - s;
        } else {
          double qq = fa / fc;
          double r = fb / fc;
          p = s * (2 * m * qq * (qq - r) - (b - a) * (r - 1));
          q = (qq - 1) * (r - 1) * (s - 1);
        }
        if (p > 0) {
          q = -q;
        } else {
          p = -p;
        }
        if (2 * p < Math.min(3 * m * q - Math.abs(tol * q), Math.abs(e * q))) {
          e = d;
          d = p / q;
        } else {
          d = m;
          e = m;
        }
      }
      a = b;
      fa = fb;
      b += Math.abs(d) > tol ? d : (m > 0 ? tol : -tol);
      fb = f.applyAsDouble(b);
    }
    throw new NoConvergenceException("Brent root finder", maxIterations, fb);
  }
}
