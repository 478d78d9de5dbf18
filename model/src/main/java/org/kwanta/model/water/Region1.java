package org.kwanta.model.water;

import org.kwanta.model.OutOfValidityRangeException;
import org.kwanta.model.Reference;
import org.kwanta.model.ValidityRange;

/**
 * IAPWS-IF97 region 1 (compressed and saturated liquid): specific volume and density from
 * temperature and pressure.
 *
 * <p>Source: IAPWS R7-97(2012), <i>Revised Release on the IAPWS Industrial Formulation 1997 for the
 * Thermodynamic Properties of Water and Steam</i>, section 5: the dimensionless Gibbs energy (Eq.
 * 7) γ(π, τ) = Σ n_i (7.1 − π)^I_i (τ − 1.222)^J_i with π = p/p*, p* = 16.53 MPa, τ = T* / T, T* =
 * 1386 K; coefficients in Table 2; the specific volume from Table 3, v = (R T / p) π γ_π with γ_π =
 * Σ −n_i I_i (7.1 − π)^(I_i − 1) (τ − 1.222)^J_i (Table 4) and R = 0.461526 kJ kg⁻¹ K⁻¹ (Eq. 1).
 * Check values: Table 5.
 *
 * <p>Validity: {@link #VALIDITY} (273.15 K to 623.15 K) with p_s(T) ≤ p ≤ 100 MPa, where p_s is
 * {@link Region4}; {@link #PRESSURE_VALIDITY} gives the upper limit. Units: K, Pa, m³/kg, kg/m³.
 *
 * <p>Evaluation: the release's table is kept as printed ({@link #I}, {@link #J}, {@link #N}) and
 * evaluated term by term with {@code Math.pow} in {@link #gammaPiFromTable}, the oracle; the fast
 * path {@link #gammaPi} evaluates the same terms with the powers built from a few repeated
 * squarings (about 20 times faster). The two agree to rounding (tested).
 */
final class Region1 {

  /** IAPWS-IF97, the revised release of 2007 with the 2012 editorial revision. */
  static final Reference REFERENCE = Region4.REFERENCE;

  /** Temperature range of region 1 (release section 4, Fig. 1), K. */
  static final ValidityRange VALIDITY =
      new ValidityRange("temperature", 273.15, 623.15, "K", REFERENCE);

  /**
   * Upper pressure limit of region 1, 100 MPa, in Pa. The lower limit p_s(T) depends on T and is
   * checked by {@link #density}.
   */
  static final ValidityRange PRESSURE_VALIDITY =
      new ValidityRange("pressure", 0, 100e6, "Pa", REFERENCE);

  /** Specific gas constant, Eq. 1, J kg⁻¹ K⁻¹. */
  static final double R = 461.526;

  /** Reducing pressure p*, Pa (Eq. 7). */
  static final double P_STAR = 16.53e6;

  /** Reducing temperature T*, K (Eq. 7). */
  static final double T_STAR = 1386;

  /** Table 2: exponents I_i, i = 1 … 34, as printed. */
  static final int[] I = {
    0, 0, 0, 0, 0, 0, 0, 0, 1, 1, 1, 1, 1, 1, 2, 2, 2, 2, 2, 3, 3, 3, 4, 4, 4, 5, 8, 8, 21, 23, 29,
    30, 31, 32
  };

  /** Table 2: exponents J_i, i = 1 … 34, as printed. */
  static final int[] J = {
    -2, -1, 0, 1, 2, 3, 4, 5, -9, -7, -1, 0, 1, 3, -3, 0, 1, 3, 17, -4, 0, 6, -5, -2, 10, -8, -11,
    -6, -29, -31, -38, -39, -40, -41
  };

  /** Table 2: coefficients n_i, i = 1 … 34, as printed. */
  static final double[] N = {
    0.14632971213167e0, -0.84548187169114e0, -0.37563603672040e1, 0.33855169168385e1,
    -0.95791963387872e0, 0.15772038513228e0, -0.16616417199501e-1, 0.81214629983568e-3,
    0.28319080123804e-3, -0.60706301565874e-3, -0.18990068218419e-1, -0.32529748770505e-1,
    -0.21841717175414e-1, -0.52838357969930e-4, -0.47184321073267e-3, -0.30001780793026e-3,
    0.47661393906987e-4, -0.44141845330846e-5, -0.72694996297594e-15, -0.31679644845054e-4,
    -0.28270797985312e-5, -0.85205128120103e-9, -0.22425281908000e-5, -0.65171222895601e-6,
    -0.14341729937924e-12, -0.40516996860117e-6, -0.12734301741641e-8, -0.17424871230634e-9,
    -0.68762131295531e-18, 0.14478307828521e-19, 0.26335781662795e-22, -0.11947622640071e-22,
    0.18228094581404e-23, -0.93537087292458e-25
  };

  /** −n_i I_i, i = 1 … 34, the coefficients of γ_π (Table 4), computed from Table 2. */
  private static final double[] GAMMA_PI_COEFFICIENTS = new double[N.length];

  static {
    for (int i = 0; i < N.length; i++) {
      GAMMA_PI_COEFFICIENTS[i] = -N[i] * I[i];
    }
  }

  private Region1() {}

  /**
   * Density of liquid water, 1/v from Table 3.
   *
   * @param temperatureK T, K
   * @param pressurePa p, Pa
   * @return ρ, kg/m³
   * @throws OutOfValidityRangeException if T is outside {@link #VALIDITY}, p above 100 MPa or below
   *     p_s(T), or either is NaN
   */
  static double density(double temperatureK, double pressurePa) {
    VALIDITY.check(temperatureK);
    PRESSURE_VALIDITY.check(pressurePa);
    double ps = Region4.saturationPressurePaUnchecked(temperatureK);
    if (!(pressurePa >= ps)) {
      throw new OutOfValidityRangeException(
          new ValidityRange("pressure", ps, PRESSURE_VALIDITY.max(), "Pa", REFERENCE), pressurePa);
    }
    return densityUnchecked(temperatureK, pressurePa);
  }

  /** Density, kg/m³, without range checks; the caller has checked T and p. */
  static double densityUnchecked(double t, double p) {
    double pi = p / P_STAR;
    double tau = T_STAR / t;
    return p / (R * t * pi * gammaPi(pi, tau));
  }

  /** Specific volume v = 1/ρ, m³/kg, without range checks (Table 3). */
  static double specificVolumeUnchecked(double t, double p) {
    double pi = p / P_STAR;
    return R * t * pi * gammaPi(pi, T_STAR / t) / p;
  }

  /**
   * γ_π (Table 4), fast straight-line evaluation of the same sum as {@link #gammaPiFromTable}: one
   * line per term of Table 2 with I_i &gt; 0 (terms with I_i = 0 vanish in γ_π), in table order,
   * the coefficient −n_i I_i taken from {@link #N} and {@link #I}; the powers (7.1 − π)^(I_i − 1)
   * and (τ − 1.222)^J_i written as products of the binary powers x, x², x⁴, … and y, y², … or u =
   * 1/y, u², …, computed once. The exponents are those of Table 2; a test compares this with the
   * term-by-term table form at thousands of points.
   */
  static double gammaPi(double pi, double tau) {
    final double[] c = GAMMA_PI_COEFFICIENTS;
    final double x = 7.1 - pi;
    final double x2 = x * x;
    final double x4 = x2 * x2;
    final double x8 = x4 * x4;
    final double x16 = x8 * x8;
    final double y = tau - 1.222;
    final double y2 = y * y;
    final double y4 = y2 * y2;
    final double y8 = y4 * y4;
    final double y16 = y8 * y8;
    final double u = 1 / y;
    final double u2 = u * u;
    final double u4 = u2 * u2;
    final double u8 = u4 * u4;
    final double u16 = u8 * u8;
    final double u32 = u16 * u16;
    double s0 = 0;
    double s1 = 0;
    s0 += c[8] * u8 * u; // i = 9: I = 1, J = -9
    s1 += c[9] * u4 * u2 * u; // i = 10: I = 1, J = -7
    s0 += c[10] * u; // i = 11: I = 1, J = -1
    s1 += c[11]; // i = 12: I = 1, J = 0
    s0 += c[12] * y; // i = 13: I = 1, J = 1
    s1 += c[13] * y2 * y; // i = 14: I = 1, J = 3
    s0 += c[14] * x * u2 * u; // i = 15: I = 2, J = -3
    s1 += c[15] * x; // i = 16: I = 2, J = 0
    s0 += c[16] * x * y; // i = 17: I = 2, J = 1
    s1 += c[17] * x * y2 * y; // i = 18: I = 2, J = 3
    s0 += c[18] * x * y16 * y; // i = 19: I = 2, J = 17
    s1 += c[19] * x2 * u4; // i = 20: I = 3, J = -4
    s0 += c[20] * x2; // i = 21: I = 3, J = 0
    s1 += c[21] * x2 * y4 * y2; // i = 22: I = 3, J = 6
    s0 += c[22] * x2 * x * u4 * u; // i = 23: I = 4, J = -5
    s1 += c[23] * x2 * x * u2; // i = 24: I = 4, J = -2
    s0 += c[24] * x2 * x * y8 * y2; // i = 25: I = 4, J = 10
    s1 += c[25] * x4 * u8; // i = 26: I = 5, J = -8
    s0 += c[26] * x4 * x2 * x * u8 * u2 * u; // i = 27: I = 8, J = -11
    s1 += c[27] * x4 * x2 * x * u4 * u2; // i = 28: I = 8, J = -6
    s0 += c[28] * x16 * x4 * u16 * u8 * u4 * u; // i = 29: I = 21, J = -29
    s1 += c[29] * x16 * x4 * x2 * u16 * u8 * u4 * u2 * u; // i = 30: I = 23, J = -31
    s0 += c[30] * x16 * x8 * x4 * u32 * u4 * u2; // i = 31: I = 29, J = -38
    s1 += c[31] * x16 * x8 * x4 * x * u32 * u4 * u2 * u; // i = 32: I = 30, J = -39
    s0 += c[32] * x16 * x8 * x4 * x2 * u32 * u8; // i = 33: I = 31, J = -40
    s1 += c[33] * x16 * x8 * x4 * x2 * x * u32 * u8 * u; // i = 34: I = 32, J = -41
    return s0 + s1;
  }

  /** γ_π (Table 4) evaluated term by term from Table 2 as printed: the oracle for tests. */
  static double gammaPiFromTable(double pi, double tau) {
    double sum = 0;
    for (int i = 0; i < N.length; i++) {
      sum += -N[i] * I[i] * Math.pow(7.1 - pi, I[i] - 1) * Math.pow(tau - 1.222, J[i]);
    }
    return sum;
  }

  /** b^e for e ≥ 0 by repeated squaring. */
  static double power(double b, int e) {
    double result = 1;
    double base = b;
    int n = e;
    while (n != 0) {
      if ((n & 1) != 0) {
        result *= base;
      }
      base *= base;
      n >>>= 1;
    }
    return result;
  }
}
