package org.kwanta.model.water;

import org.kwanta.model.Reference;
import org.kwanta.model.ValidityRange;

/**
 * IAPWS-IF97 region 4: the saturation line of water, saturation pressure from temperature and
 * saturation temperature from pressure.
 *
 * <p>Source: IAPWS R7-97(2012), <i>Revised Release on the IAPWS Industrial Formulation 1997 for the
 * Thermodynamic Properties of Water and Steam</i>, section 8: the basic equation (Eq. 29), the
 * saturation-pressure equation (Eq. 30) and the saturation-temperature equation (Eq. 31), with the
 * coefficients of Table 34. Check values: Table 35 (p_s) and Table 36 (T_s).
 *
 * <p>With ϑ = T + n9/(T − n10), A = ϑ² + n1 ϑ + n2, B = n3 ϑ² + n4 ϑ + n5, C = n6 ϑ² + n7 ϑ + n8:
 * p_s/p* = [2C / (−B + (B² − 4AC)^½)]⁴, p* = 1 MPa. Backwards, with β = (p/p*)^¼, E = β² + n3 β +
 * n6, F = n1 β² + n4 β + n7, G = n2 β² + n5 β + n8, D = 2G / (−F − (F² − 4EG)^½): T_s/T* = [n10 + D
 * − ((n10 + D)² − 4(n9 + n10 D))^½] / 2, T* = 1 K.
 *
 * <p>Validity: {@link #VALIDITY}, 273.15 K to the critical temperature 647.096 K; equivalently
 * {@link #PRESSURE_VALIDITY} for the backward equation. Units: K and Pa at the methods (the release
 * works in MPa; converted at entry).
 */
final class Region4 {

  /** IAPWS-IF97, the revised release of 2007 with the 2012 editorial revision. */
  static final Reference REFERENCE =
      new Reference(
          "IAPWS R7-97(2012)",
          "IAPWS, Revised Release on the IAPWS Industrial Formulation 1997 for the Thermodynamic"
              + " Properties of Water and Steam, R7-97(2012); W. Wagner et al., J. Eng. Gas"
              + " Turbines Power 122 (2000) 150",
          Reference.Confidence.VERIFIED_BY_CHECK_TABLE);

  /** Temperature range of Eqs. 30 and 31 (release section 8.1), K. */
  static final ValidityRange VALIDITY =
      new ValidityRange("temperature", 273.15, 647.096, "K", REFERENCE);

  /**
   * Pressure range of Eq. 31 (release section 8.2): p_s(273.15 K) = 611.213 Pa to the critical
   * pressure 22.064 MPa, Pa.
   */
  static final ValidityRange PRESSURE_VALIDITY =
      new ValidityRange("pressure", 611.213, 22.064e6, "Pa", REFERENCE);

  /** Table 34: coefficients n1 … n10 of Eqs. 29–31, as printed. */
  static final double[] N = {
    0.11670521452767e4, -0.72421316703206e6, -0.17073846940092e2, 0.12020824702470e5,
    -0.32325550322333e7, 0.14915108613530e2, -0.48232657361591e4, 0.40511340542057e6,
    -0.23855557567849e0, 0.65017534844798e3
  };

  private static final double N1 = N[0];
  private static final double N2 = N[1];
  private static final double N3 = N[2];
  private static final double N4 = N[3];
  private static final double N5 = N[4];
  private static final double N6 = N[5];
  private static final double N7 = N[6];
  private static final double N8 = N[7];
  private static final double N9 = N[8];
  private static final double N10 = N[9];

  private Region4() {}

  /**
   * Saturation pressure, Eq. 30.
   *
   * @param temperatureK T, K
   * @return p_s(T), Pa
   * @throws org.kwanta.model.OutOfValidityRangeException if T is outside {@link #VALIDITY} or NaN
   */
  static double saturationPressurePa(double temperatureK) {
    VALIDITY.check(temperatureK);
    return saturationPressurePaUnchecked(temperatureK);
  }

  /** Eq. 30 without the range check; the caller has checked T. */
  static double saturationPressurePaUnchecked(double t) {
    double theta = t + N9 / (t - N10);
    double a = (theta + N1) * theta + N2;
    double b = (N3 * theta + N4) * theta + N5;
    double c = (N6 * theta + N7) * theta + N8;
    double x = 2 * c / (-b + Math.sqrt(b * b - 4 * a * c));
    double x2 = x * x;
    return x2 * x2 * 1e6;
  }

  /**
   * Saturation temperature, Eq. 31.
   *
   * @param pressurePa p, Pa
   * @return T_s(p), K
   * @throws org.kwanta.model.OutOfValidityRangeException if p is outside {@link #PRESSURE_VALIDITY}
   *     or NaN
   */
  static double saturationTemperatureK(double pressurePa) {
    PRESSURE_VALIDITY.check(pressurePa);
    double beta = Math.sqrt(Math.sqrt(pressurePa / 1e6));
    double e = (beta + N3) * beta + N6;
    double f = (N1 * beta + N4) * beta + N7;
    double g = (N2 * beta + N5) * beta + N8;
    double d = 2 * g / (-f - Math.sqrt(f * f - 4 * e * g));
    double s = N10 + d;
    return (s - Math.sqrt(s * s - 4 * (N9 + N10 * d))) / 2;
  }
}
