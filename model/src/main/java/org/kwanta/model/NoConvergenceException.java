package org.kwanta.model;

import java.util.Locale;

/**
 * An iterative solution did not converge. Documented as impossible within validity; tests show it.
 */
public final class NoConvergenceException extends RuntimeException {

  private static final long serialVersionUID = 1L;

  private final int iterations;
  private final double residual;

  public NoConvergenceException(String what, int iterations, double residual) {
    super(
        String.format(
            Locale.ROOT,
            "%s did not converge after %d iterations (residual %.3e)",
            what,
            iterations,
            residual));
    this.iterations = iterations;
    this.residual = residual;
  }

  public int iterations() {
    return iterations;
  }

  public double residual() {
    return residual;
  }
}
