package org.kwanta.model.conductivity;

import org.kwanta.model.Reference;
import org.kwanta.model.ValidityRange;

/**
 * Dynamic viscosity of water, IAPWS R12-08, without the critical enhancement:
 *
 * <pre>
 *   μ/μ* = μ̄0(T̄) · μ̄1(T̄, ρ̄)                                          (eq. 10, μ̄2 = 1)
 *   μ̄0 = 100 √T̄ / Σ_{i=0..3} H_i / T̄^i                                (eq. 11, Table 1)
 *   μ̄1 = exp[ ρ̄ Σ_i Σ_j H_ij (1/T̄ − 1)^i (ρ̄ − 1)^j ]                   (eq. 12, Table 2)
 * </pre>
 *
 * with T̄ = T/647.096 K, ρ̄ = ρ/322 kg m⁻³ and μ* = 1 µPa·s. The release recommends μ̄2 = 1 for
 * industrial use everywhere except very close to the critical point; this engine uses it only for
 * liquid water at 0–100 °C, far from it.
 *
 * <p>Source: IAPWS R12-08, "Release on the IAPWS Formulation 2008 for the Viscosity of Ordinary
 * Water Substance" (2008). Check values: Table 4 of the release (reproduced in the tests, see
 * {@code WaterViscosityTest}). Validity: {@link #TEMPERATURE_VALIDITY} and {@link
 * #DENSITY_VALIDITY}; the release states its range in pressure (to 1000 MPa at these temperatures),
 * which densities up to 1250 kg/m³ stay within for the liquid.
 */
final class WaterViscosity {

  /** The release. */
  static final Reference IAPWS_R12_08 =
      new Reference(
          "IAPWS R12-08",
          "IAPWS R12-08, Release on the IAPWS Formulation 2008 for the Viscosity of Ordinary Water"
              + " Substance, International Association for the Properties of Water and Steam, 2008",
          Reference.Confidence.VERIFIED_BY_CHECK_TABLE);

  /** Temperature range of the formulation as used here, K (the triple point region to 900 °C). */
  static final ValidityRange TEMPERATURE_VALIDITY =
      new ValidityRange("temperature", 273.15, 1173.15, "K", IAPWS_R12_08);

  /** Density range accepted, kg/m³ (covers the check table's 1200 kg/m³ point). */
  static final ValidityRange DENSITY_VALIDITY =
      new ValidityRange("density", 0.0, 1250.0, "kg/m3", IAPWS_R12_08);

  /** Reference temperature T*, K (release eq. 4). */
  private static final double T_STAR = 647.096;

  /** Reference density ρ*, kg/m³ (release eq. 5). */
  private static final double RHO_STAR = 322.0;

  /** Reference viscosity μ*, Pa·s (release eq. 7). */
  private static final double MU_STAR = 1.00e-6;

  /** Table 1: coefficients H_i of μ̄0, i = 0..3. */
  private static final double[] H = {1.67752, 2.20462, 0.6366564, -0.241605};

  /** Table 2: exponent i of (1/T̄ − 1) for each nonzero H_ij. */
  private static final int[] I = {0, 1, 2, 3, 0, 1, 2, 3, 5, 0, 1, 2, 3, 4, 0, 1, 0, 3, 4, 3, 5};

  /** Table 2: exponent j of (ρ̄ − 1) for each nonzero H_ij. */
  private static final int[] J = {0, 0, 0, 0, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 3, 3, 4, 4, 5, 6, 6};

  /** Table 2: the nonzero coefficients H_ij, in the order of {@link #I} and {@link #J}. */
  private static final double[] HIJ = {
    5.20094e-1,
    8.50895e-2,
    -1.08374,
    -2.89555e-1,
    2.22531e-1,
    9.99115e-1,
    1.88797,
    1.26613,
    1.20573e-1,
    -2.81378e-1,
    -9.06851e-1,
    -7.72479e-1,
    -4.89837e-1,
    -2.57040e-1,
    1.61913e-1,
    2.57399e-1,
    -3.25372e-2,
    6.98452e-2,
    8.72102e-3,
    -4.35673e-3,
    -5.93264e-4
  };

  private WaterViscosity() {}

  /**
   * Viscosity of water.
   *
   * @param temperatureK temperature, K
   * @param densityKgPerM3 density, kg/m³ (for liquid water from IAPWS-IF97)
   * @return dynamic viscosity, Pa·s; NaN in gives NaN out
   * @throws org.kwanta.model.OutOfValidityRangeException outside the ranges above
   */
  static double at(double temperatureK, double densityKgPerM3) {
    if (Double.isNaN(temperatureK) || Double.isNaN(densityKgPerM3)) {
      return Double.NaN;
    }
    TEMPERATURE_VALIDITY.check(temperatureK);
    DENSITY_VALIDITY.check(densityKgPerM3);
    double tBar = temperatureK / T_STAR;
    double rhoBar = densityKgPerM3 / RHO_STAR;
    double sum0 = 0;
    for (int i = 0; i < H.length; i++) {
      sum0 += H[i] / Math.pow(tBar, i);
    }
    double mu0 = 100 * Math.sqrt(tBar) / sum0;
    double x = 1 / tBar - 1;
    double y = rhoBar - 1;
    double sum1 = 0;
    for (int k = 0; k < HIJ.length; k++) {
      sum1 += HIJ[k] * Math.pow(x, I[k]) * Math.pow(y, J[k]);
    }
    double mu1 = Math.exp(rhoBar * sum1);
    return MU_STAR * mu0 * mu1;
  }
}
