package org.kwanta.model;

/**
 * A closed interval on one quantity within which a formulation is published as valid.
 *
 * @param quantity the quantity's name, as in error messages ("temperature")
 * @param min lower limit, inclusive, in {@code unit}
 * @param max upper limit, inclusive, in {@code unit}
 * @param unit the unit of {@code min} and {@code max} (UCUM code, e.g. {@code K}, {@code MPa})
 * @param source the reference that states the range
 */
public record ValidityRange(
    String quantity, double min, double max, String unit, Reference source) {

  /** True when {@code value} lies within the closed range; NaN is not within. */
  public boolean contains(double value) {
    return value >= min && value <= max;
  }

  /**
   * Returns {@code value} unchanged when it lies within the range.
   *
   * @throws OutOfValidityRangeException naming quantity, value, limits, unit and source otherwise
   */
  public double check(double value) {
    if (!contains(value)) {
      throw new OutOfValidityRangeException(this, value);
    }
    return value;
  }
}
