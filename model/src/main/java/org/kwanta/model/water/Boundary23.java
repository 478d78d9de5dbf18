package org.kwanta.model.water;

import org.kwanta.model.Reference;
import org.kwanta.model.ValidityRange;

/**
 * IAPWS-IF97 boundary between regions 2 and 3 (the B23 equation): pressure from temperature and
 * temperature from pressure.
 *
 * <p>Source: IAPWS R7-97(2012), <i>Revised Release on the IAPWS Industrial Formulation 1997 for the
 * Thermodynamic Properties of Water and Steam</i>, section 4: π = n1 + n2 θ + n3 θ² (Eq. 5) and θ =
 * n4 + [(π − n5)/n3]^½ (Eq. 6), π = p/p*, p* = 1 MPa, θ = T/T*, T* = 1 K, with the five
 * coefficients of Table 1. Check value (release section 4): θ = 0.623150000e3 ↔ π = 0.165291643e2.
 *
 * <p>Validity: {@link #VALIDITY}, 623.15 K to 863.15 K, equivalently {@link #PRESSURE_VALIDITY},
 * 16.5291643 MPa to 100 MPa. Units: K and Pa at the methods (the release works in MPa; converted at
 * entry).
 *
 * <p>Coefficient provenance: transcribed from two open implementations that agree (Debian {@code
 * python3-iapws} 1.5.3, {@code _P23_T}/{@code _t_P}, which prints n5 with 13 digits, and the
 * project's shared reference notes, 14 digits 0.13918839778870e2); the 14-digit value is used.
 */
final class Boundary23 {

  /** IAPWS-IF97. */
  static final Reference REFERENCE = Region4.REFERENCE;

  /** Temperature range of the B23 line (release section 4), K. */
  static final ValidityRange VALIDITY =
      new ValidityRange("temperature", 623.15, 863.15, "K", REFERENCE);

  /** Pressure range of the B23 line: p_B23(623.15 K) to 100 MPa, Pa. */
  static final ValidityRange PRESSURE_VALIDITY =
      new ValidityRange("pressure", 16.5291643e6, 100e6, "Pa", REFERENCE);

  /** Table 1: n1 … n5, as printed. */
  static final double[] N = {
    0.34805185628969e3,
    -0.11671859879975e1,
    0.10192970039326e-2,
    0.57254459862746e3,
    0.13918839778870e2
  };

  private Boundary23() {}

  /**
   * Pressure on the B23 line, Eq. 5.
   *
   * @param temperatureK T, K
   * @return p_B23(T), Pa
   * @throws org.kwanta.model.OutOfValidityRangeException outside {@link #VALIDITY} or NaN
   */
  static double pressurePa(double temperatureK) {
    VALIDITY.check(temperatureK);
    return pressurePaUnchecked(temperatureK);
  }

  /** Eq. 5 without the range check. */
  static double pressurePaUnchecked(double t) {
    return (N[0] + N[1] * t + N[2] * t * t) * 1e6;
  }

  /**
   * Temperature on the B23 line, Eq. 6.
   *
   * @param pressurePa p, Pa
   * @return T_B23(p), K
   * @throws org.kwanta.model.OutOfValidityRangeException outside {@link #PRESSURE_VALIDITY} or NaN
   */
  static double temperatureK(double pressurePa) {
    PRESSURE_VALIDITY.check(pressurePa);
    return N[3] + Math.sqrt((pressurePa / 1e6 - N[4]) / N[2]);
  }
}
