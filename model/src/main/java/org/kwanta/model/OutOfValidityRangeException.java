package org.kwanta.model;

import java.util.Locale;

/**
 * An input lies outside the published validity range of a formulation. The engine never clamps or
 * silently extrapolates; it throws this instead.
 */
public final class OutOfValidityRangeException extends IllegalArgumentException {

  private static final long serialVersionUID = 1L;

  private final transient ValidityRange range;
  private final double value;

  public OutOfValidityRangeException(ValidityRange range, double value) {
    super(
        String.format(
            Locale.ROOT,
            "%s %s %s is outside the validity range [%s, %s] %s of %s",
            range.quantity(),
            format(value),
            range.unit(),
            format(range.min()),
            format(range.max()),
            range.unit(),
            range.source().id()));
    this.range = range;
    this.value = value;
  }

  private static String format(double v) {
    return Double.isNaN(v)
        ? "NaN"
        : String.format(Locale.ROOT, "%.6g", v)
            .replaceAll("(\\.\\d*?)0+(e|$)", "$1$2")
            .replaceAll("\\.(e|$)", "$1");
  }

  public ValidityRange range() {
    return range;
  }

  public double value() {
    return value;
  }
}
