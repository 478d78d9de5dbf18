package org.kwanta.service.ingest;

import java.util.Arrays;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.function.Function;
import java.util.stream.Collectors;
import org.kwanta.model.evaluation.Parameter;

/**
 * The parameters a historian may push, in the trade's words, each with its canonical unit (a UCUM
 * code), the units accepted and converted on the way in, and the physical bounds of a plausible
 * value in the canonical unit. Volumetric units (ug/L, mg/L) are refused rather than guessed into
 * mass fractions.
 */
public enum MeasuredParameter {
  SPECIFIC_CONDUCTIVITY("uS/cm", conductivityUnits(), 0, 20_000, Parameter.SPECIFIC_CONDUCTIVITY),
  CATION_CONDUCTIVITY("uS/cm", conductivityUnits(), 0, 20_000, Parameter.CATION_CONDUCTIVITY),
  DEGASSED_CATION_CONDUCTIVITY(
      "uS/cm", conductivityUnits(), 0, 20_000, Parameter.DEGASSED_CATION_CONDUCTIVITY),
  PH("[pH]", Map.of("[pH]", Conversions.IDENTITY), 0, 14, Parameter.PH),
  SODIUM("ug/kg", massFractionUnits(), 0, 1e7, Parameter.SODIUM),
  DISSOLVED_OXYGEN("ug/kg", massFractionUnits(), 0, 1e5, null),
  SAMPLE_TEMPERATURE(
      "Cel",
      Map.of(
          "Cel",
          Conversions.IDENTITY,
          "K",
          (Function<Double, Double>) k -> k - 273.15,
          "[degF]",
          (Function<Double, Double>) f -> (f - 32) * 5 / 9),
      -10,
      400,
      null),
  PHOSPHATE("ug/kg", massFractionUnits(), 0, 1e7, null),
  SILICA("ug/kg", massFractionUnits(), 0, 1e7, null),
  IRON("ug/kg", massFractionUnits(), 0, 1e7, null),
  COPPER("ug/kg", massFractionUnits(), 0, 1e7, null),
  CHLORIDE("ug/kg", massFractionUnits(), 0, 1e7, null),
  SULFATE("ug/kg", massFractionUnits(), 0, 1e7, null);

  private static final Map<String, MeasuredParameter> BY_CODE =
      Arrays.stream(values())
          .collect(Collectors.toUnmodifiableMap(MeasuredParameter::code, p -> p));

  private final String canonicalUnit;
  private final Map<String, Function<Double, Double>> toCanonical;
  private final double min;
  private final double max;
  private final Parameter engineParameter;

  MeasuredParameter(
      String canonicalUnit,
      Map<String, Function<Double, Double>> toCanonical,
      double min,
      double max,
      Parameter engineParameter) {
    this.canonicalUnit = canonicalUnit;
    this.toCanonical = toCanonical;
    this.min = min;
    this.max = max;
    this.engineParameter = engineParameter;
  }

  private static Map<String, Function<Double, Double>> conductivityUnits() {
    return Map.of(
        "uS/cm", Conversions.IDENTITY,
        "mS/cm", v -> v * 1e3,
        "S/m", v -> v * 1e4,
        "mS/m", v -> v * 10,
        "uS/m", v -> v / 100);
  }

  private static Map<String, Function<Double, Double>> massFractionUnits() {
    return Map.of(
        "ug/kg", Conversions.IDENTITY,
        "ng/g", Conversions.IDENTITY,
        "mg/kg", v -> v * 1e3,
        "ug/g", v -> v * 1e3,
        "ng/kg", v -> v / 1e3);
  }

  /** The code used in the API: lower snake case, e.g. {@code cation_conductivity}. */
  public String code() {
    return name().toLowerCase(Locale.ROOT);
  }

  public String canonicalUnit() {
    return canonicalUnit;
  }

  public double min() {
    return min;
  }

  public double max() {
    return max;
  }

  /** The engine's parameter, when the engine uses this one. */
  public Optional<Parameter> engineParameter() {
    return Optional.ofNullable(engineParameter);
  }

  public boolean isConductivity() {
    return engineParameter != null && engineParameter.isConductivity();
  }

  /** Accepted unit codes (UCUM) for this parameter. */
  public java.util.Set<String> acceptedUnits() {
    return toCanonical.keySet();
  }

  /**
   * Converts a value to the canonical unit; empty when the unit is not accepted for this parameter.
   * A converted value is rounded to {@value #SIGNIFICANT_DIGITS} significant digits, so the same
   * value sent in another unit is the same stored number ({@code 7e-6 S/m} is {@code 0.07 uS/cm},
   * not {@code 0.06999999999999999}) and a resend is unchanged rather than a correction. A value in
   * the canonical unit is kept exactly as sent.
   */
  public Optional<Double> toCanonical(double value, String unit) {
    Function<Double, Double> f = toCanonical.get(unit);
    if (f == null) {
      return Optional.empty();
    }
    return Optional.of(f == Conversions.IDENTITY ? value : significant(f.apply(value)));
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

  public static Optional<MeasuredParameter> byCode(String code) {
    return Optional.ofNullable(code == null ? null : BY_CODE.get(code));
  }

  /** Parameter codes, for messages. */
  /** Every parameter's code, in declaration order (a new array each call). */
  public static String[] codeArray() {
    return Arrays.stream(values()).map(MeasuredParameter::code).toArray(String[]::new);
  }

  public static String codes() {
    return Arrays.stream(values()).map(MeasuredParameter::code).collect(Collectors.joining(", "));
  }

  private static final class Conversions {
    static final Function<Double, Double> IDENTITY = v -> v;
  }
}
