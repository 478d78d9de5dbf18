package org.kwanta.model.conductivity;

/**
 * Davies activity coefficients: log10 γ = −A z² (√I/(1 + √I) − 0.3 I), I molal. Source: C. W.
 * Davies, Ion Association, Butterworths 1962 (form as in the project's reference notes); adequate
 * for I ≤ 0.01 mol/kg, far above cycle-water strengths.
 */
final class Davies {

  private Davies() {}

  /**
   * @param a Debye–Hückel A (log10, molal) at the temperature
   * @param z charge number
   * @param ionicStrength molal ionic strength, mol/kg
   * @return activity coefficient γ
   */
  static double gamma(double a, int z, double ionicStrength) {
    double s = Math.sqrt(ionicStrength);
    return Math.pow(10, -a * z * z * (s / (1 + s) - 0.3 * ionicStrength));
  }
}
