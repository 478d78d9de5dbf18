package org.kwanta.service.ingest;

import java.util.EnumMap;
import java.util.Map;
import java.util.Optional;
import java.util.function.DoubleUnaryOperator;
import org.kwanta.model.Parameter;

/**
 * The units a historian may send a parameter's values in (UCUM codes), by the parameter's kind of
 * quantity in the catalogue ({@link Parameter}), and their conversion to the canonical unit.
 * Volumetric units (ug/L, mg/L) are refused rather than guessed into mass fractions.
 */
final class Units {

  private Units() {}

  private static final Map<Parameter.Quantity, Map<String, DoubleUnaryOperator>> TO_CANONICAL =
      new EnumMap<>(
          Map.of(
              Parameter.Quantity.CONDUCTIVITY,
              Map.of(
                  "uS/cm", Conversions.IDENTITY,
                  "mS/cm", v -> v * 1e3,
                  "S/m", v -> v * 1e4,
                  "mS/m", v -> v * 10,
                  "uS/m", v -> v / 100),
              Parameter.Quantity.PH,
              Map.of("[pH]", Conversions.IDENTITY),
              Parameter.Quantity.MASS_FRACTION,
              Map.of(
                  "ug/kg", Conversions.IDENTITY,
                  "ng/g", Conversions.IDENTITY,
                  "mg/kg", v -> v * 1e3,
                  "ug/g", v -> v * 1e3,
                  "ng/kg", v -> v / 1e3),
              Parameter.Quantity.TEMPERATURE,
              Map.of(
                  "Cel", Conversions.IDENTITY,
                  "K", k -> k - 273.15,
                  "[degF]", f -> (f - 32) * 5 / 9),
              Parameter.Quantity.POTENTIAL,
              Map.of("mV", Conversions.IDENTITY, "V", v -> v * 1e3),
              Parameter.Quantity.POWER,
              Map.of("MW", Conversions.IDENTITY, "kW", v -> v / 1e3, "W", v -> v / 1e6),
              // absolute pressure only: UCUM has no gauge unit (bar is 0.1 MPa, UCUM "bar")
              Parameter.Quantity.PRESSURE,
              Map.of(
                  "MPa", Conversions.IDENTITY,
                  "kPa", v -> v / 1e3,
                  "Pa", v -> v / 1e6,
                  "bar", v -> v / 10),
              Parameter.Quantity.MASS_FLOW,
              // t/h: UCUM "t/h", 1000 kg per 3600 s
              Map.of(
                  "kg/s", Conversions.IDENTITY,
                  "kg/h", v -> v / 3600,
                  "t/h", v -> v / 3.6),
              Parameter.Quantity.STATE_CODE,
              Map.of("{state}", Conversions.IDENTITY)));

  /** Accepted unit codes (UCUM) for a parameter. */
  static java.util.Set<String> accepted(Parameter p) {
    return TO_CANONICAL.get(p.quantity()).keySet();
  }

  /**
   * Converts a value to the canonical unit; empty when the unit is not accepted for this parameter.
   * A converted value is rounded to {@value #SIGNIFICANT_DIGITS} significant digits, so the same
   * value sent in another unit is the same stored number ({@code 7e-6 S/m} is {@code 0.07 uS/cm},
   * not {@code 0.06999999999999999}) and a resend is unchanged rather than a correction. A value in
   * the canonical unit is kept exactly as sent.
   */
  static Optional<Double> toCanonical(Parameter p, double value, String unit) {
    DoubleUnaryOperator f = TO_CANONICAL.get(p.quantity()).get(unit);
    if (f == null) {
      return Optional.empty();
    }
    return Optional.of(f == Conversions.IDENTITY ? value : significant(f.applyAsDouble(value)));
  }

  /**
   * Significant digits kept of a converted value: far more than any analyser resolves (about 4),
   * and few enough that the rounding error of a unit factor (about 1e-16 relative) disappears.
   */
  static final int SIGNIFICANT_DIGITS = 12;

  /** 1e0 to 1e22: every power of ten a double holds exactly. */
  private static final double[] POWERS_OF_TEN = new double[23];

  static {
    POWERS_OF_TEN[0] = 1;
    for (int i = 1; i < POWERS_OF_TEN.length; i++) {
      POWERS_OF_TEN[i] = POWERS_OF_TEN[i - 1] * 10;
    }
  }

  /**
   * The double nearest to {@code v} rounded to {@link #SIGNIFICANT_DIGITS} decimal significant
   * digits: the integer of those digits divided (or multiplied) by an exact power of ten, which
   * IEEE 754 rounds correctly. Values so small or large that the power of ten is not exact (beyond
   * every parameter's bounds) are returned unchanged. No allocation.
   */
  static double significant(double v) {
    if (v == 0 || !Double.isFinite(v)) {
      return v;
    }
    int shift = SIGNIFICANT_DIGITS - 1 - (int) Math.floor(Math.log10(Math.abs(v)));
    if (shift >= 0 && shift < POWERS_OF_TEN.length) {
      return Math.rint(v * POWERS_OF_TEN[shift]) / POWERS_OF_TEN[shift];
    }
    if (shift < 0 && -shift < POWERS_OF_TEN.length) {
      return Math.rint(v / POWERS_OF_TEN[-shift]) * POWERS_OF_TEN[-shift];
    }
    return v;
  }

  private static final class Conversions {
    static final DoubleUnaryOperator IDENTITY = v -> v;
  }
}
