package org.kwanta.model.conductivity;

import org.kwanta.model.aqueous.ActivityModel;

/** Davies activity coefficients, as the speciation engine computes them ({@link ActivityModel}). */
final class Davies {

  private static final double LN10 = Math.log(10);

  private Davies() {}

  /**
   * @param a Debye–Hückel A (log10, molal) at the temperature
   * @param z charge number
   * @param ionicStrength molal ionic strength, mol/kg
   * @return activity coefficient γ
   */
  static double gamma(double a, int z, double ionicStrength) {
    return Math.exp(LN10 * ActivityModel.DAVIES.log10Gamma(z, ionicStrength, a, 0, 298.15));
  }
}
