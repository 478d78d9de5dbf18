package org.kwanta.service.readings;

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
   */
  public Optional<Double> toCanonical(double value, String unit) {
    Function<Double, Double> f = toCanonical.get(unit);
    return f == null ? Optional.empty() : Optional.of(f.apply(value));
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
