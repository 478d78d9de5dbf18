package org.kwanta.model.water;

import org.kwanta.model.OutOfValidityRangeException;
import org.kwanta.model.Reference;
import org.kwanta.model.ValidityRange;

/**
 * IAPWS-IF97 region 2 (vapour): specific volume and density of steam from temperature and pressure.
 *
 * <p>Source: IAPWS R7-97(2012), <i>Revised Release on the IAPWS Industrial Formulation 1997 for the
 * Thermodynamic Properties of Water and Steam</i>, section 6.1: γ = γ° + γ^r (Eq. 15) with the
 * ideal-gas part γ° = ln π + Σ n°_i τ^J°_i (Eq. 16) and the residual part γ^r = Σ n_i π^I_i (τ −
 * 0.5)^J_i (Eq. 17), π = p/p*, p* = 1 MPa, τ = T* / T, T* = 540 K, R = 0.461526 kJ kg⁻¹ K⁻¹. The
 * specific volume (Table 12) is v = (R T / p) π (γ°_π + γ^r_π), with γ°_π = 1/π and γ^r_π = Σ n_i
 * I_i π^(I_i − 1) (τ − 0.5)^J_i (Tables 13 and 14). Only γ_π is needed for v, so the ideal-gas
 * coefficients of Table 10 do not appear here. Residual coefficients: Table 11. Check values: Table
 * 15.
 *
 * <p>Coefficient provenance: Table 11 was transcribed from the Debian {@code python3-iapws} 1.5.2
 * module {@code iapws97} (function {@code _Region2}), which stores the values as binary-float
 * renderings with 17 significant digits; they are written here with the 14 significant digits the
 * release prints (each rounds back to the identical double, checked when they were transcribed). An
 * implementation of them reproduces the release's Table 15 to its 9 printed digits (tested).
 *
 * <p>Validity (release section 4, Fig. 1): {@link #VALIDITY}, 273.15 K to 1073.15 K, with 0 &lt; p
 * ≤ p_s(T) up to 623.15 K ({@link Region4}), 0 &lt; p ≤ p_B23(T) from 623.15 K to 863.15 K ({@link
 * Boundary23}) and 0 &lt; p ≤ 100 MPa above; {@link #maxPressurePa} gives the upper limit. The same
 * 43-term equation covers the whole range (check values of Table 15 at 700 K, tested). Units: K,
 * Pa, m³/kg, kg/m³.
 */
final class Region2 {

  /** IAPWS-IF97, the revised release of 2007 with the 2012 editorial revision. */
  static final Reference REFERENCE = Region4.REFERENCE;

  /** Temperature range of region 2 (release section 4), K. */
  static final ValidityRange VALIDITY =
      new ValidityRange("temperature", 273.15, 1073.15, "K", REFERENCE);

  /** Specific gas constant, Eq. 1, J kg⁻¹ K⁻¹. */
  static final double R = 461.526;

  /** Reducing pressure p*, Pa (Eq. 15). */
  static final double P_STAR = 1e6;

  /** Reducing temperature T*, K (Eq. 15). */
  static final double T_STAR = 540;

  /** Table 11: exponents I_i, i = 1 … 43, as printed. */
  static final int[] I = {
    1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 3, 3, 3, 3, 3, 4, 4, 4, 5, 6, 6, 6, 7, 7, 7, 8, 8, 9, 10, 10, 10,
    16, 16, 18, 20, 20, 20, 21, 22, 23, 24, 24, 24
  };

  /** Table 11: exponents J_i, i = 1 … 43, as printed. */
  static final int[] J = {
    0, 1, 2, 3, 6, 1, 2, 4, 7, 36, 0, 1, 3, 6, 35, 1, 2, 3, 7, 3, 16, 35, 0, 11, 25, 8, 36, 13, 4,
    10, 14, 29, 50, 57, 20, 35, 48, 21, 53, 39, 26, 40, 58
  };

  /** Table 11: coefficients n_i, i = 1 … 43, as printed (see provenance above). */
  static final double[] N = {
    -0.17731742473213e-2, -0.17834862292358e-1, -0.45996013696365e-1, -0.57581259083432e-1,
    -0.50325278727930e-1, -0.33032641670203e-4, -0.18948987516315e-3, -0.39392777243355e-2,
    -0.43797295650573e-1, -0.26674547914087e-4, 0.20481737692309e-7, 0.43870667284435e-6,
    -0.32277677238570e-4, -0.15033924542148e-2, -0.40668253562649e-1, -0.78847309559367e-9,
    0.12790717852285e-7, 0.48225372718507e-6, 0.22922076337661e-5, -0.16714766451061e-10,
    -0.21171472321355e-2, -0.23895741934104e2, -0.59059564324270e-17, -0.12621808899101e-5,
    -0.38946842435739e-1, 0.11256211360459e-10, -0.82311340897998e1, 0.19809712802088e-7,
    0.10406965210174e-18, -0.10234747095929e-12, -0.10018179379511e-8, -0.80882908646985e-10,
    0.10693031879409e0, -0.33662250574171e0, 0.89185845355421e-24, 0.30629316876232e-12,
    -0.42002467698208e-5, -0.59056029685639e-25, 0.37826947613457e-5, -0.12768608934681e-14,
    0.73087610595061e-28, 0.55414715350778e-16, -0.94369707241210e-6
  };

  private Region2() {}

  /**
   * Density of steam, 1/v from Table 12.
   *
   * @param temperatureK T, K
   * @param pressurePa p, Pa
   * @return ρ, kg/m³
   * @throws OutOfValidityRangeException if T is outside {@link #VALIDITY}, p is not in (0, {@link
   *     #maxPressurePa}(T)], or either is NaN
   */
  static double density(double temperatureK, double pressurePa) {
    VALIDITY.check(temperatureK);
    double pMax = maxPressurePa(temperatureK);
    if (!(pressurePa > 0 && pressurePa <= pMax)) {
      throw new OutOfValidityRangeException(
          new ValidityRange("pressure", Double.MIN_VALUE, pMax, "Pa", REFERENCE), pressurePa);
    }
    return densityUnchecked(temperatureK, pressurePa);
  }

  /**
   * Upper pressure limit of region 2 at a temperature within {@link #VALIDITY}: p_s(T) to 623.15 K,
   * p_B23(T) to 863.15 K, 100 MPa above, Pa.
   */
  static double maxPressurePa(double t) {
    if (t <= 623.15) {
      return Region4.saturationPressurePaUnchecked(t);
    }
    return t <= 863.15 ? Boundary23.pressurePaUnchecked(t) : 100e6;
  }

  /** Density, kg/m³, without range checks; the caller has checked T and p. */
  static double densityUnchecked(double t, double p) {
    return 1 / specificVolumeUnchecked(t, p);
  }

  /** Specific volume, m³/kg, without range checks (Table 12). */
  static double specificVolumeUnchecked(double t, double p) {
    double pi = p / P_STAR;
    double y = T_STAR / t - 0.5;
    double gammaRPi = 0;
    for (int i = 0; i < N.length; i++) {
      gammaRPi += N[i] * I[i] * Region1.power(pi, I[i] - 1) * Region1.power(y, J[i]);
    }
    return R * t / p * pi * (1 / pi + gammaRPi);
  }
}
