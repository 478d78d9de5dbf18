package org.kwanta.model.aqueous;

import java.util.Optional;

/**
 * The units an amount of a component may be given in, each with its UCUM code. Mass units are
 * converted through {@link Amounts} (mass of the formula of {@link Component#countedAs()} per kg of
 * water); molal units are SI prefixes of mol/kg.
 */
public enum AmountUnit {
  /** Milligrams of the counted formula per kg of water, UCUM {@code mg/kg}. */
  MILLIGRAMS_PER_KILOGRAM("mg/kg"),
  /** Micrograms of the counted formula per kg of water, UCUM {@code ug/kg}. */
  MICROGRAMS_PER_KILOGRAM("ug/kg"),
  /** Moles per kg of water (molality), UCUM {@code mol/kg}. */
  MOLES_PER_KILOGRAM("mol/kg"),
  /** Millimoles per kg of water, UCUM {@code mmol/kg}. */
  MILLIMOLES_PER_KILOGRAM("mmol/kg"),
  /** Micromoles per kg of water, UCUM {@code umol/kg}. */
  MICROMOLES_PER_KILOGRAM("umol/kg");

  private final String ucum;

  AmountUnit(String ucum) {
    this.ucum = ucum;
  }

  /** The UCUM code (case-sensitive form), e.g. {@code mg/kg}. */
  public String ucum() {
    return ucum;
  }

  /** The unit with a UCUM code, compared exactly (UCUM codes are case-sensitive). */
  public static Optional<AmountUnit> fromUcum(String code) {
    for (AmountUnit u : values()) {
      if (u.ucum.equals(code)) {
        return Optional.of(u);
      }
    }
    return Optional.empty();
  }

  /**
   * An amount of a component in this unit as a molality.
   *
   * @param component the component, for the molar mass of mass units
   * @param value the amount in this unit
   * @return molality, mol/kg
   */
  public double toMolPerKg(Component component, double value) {
    return switch (this) {
      case MILLIGRAMS_PER_KILOGRAM -> Amounts.molalFromMilligramsPerKilogram(component, value);
      case MICROGRAMS_PER_KILOGRAM -> Amounts.molalFromMicrogramsPerKilogram(component, value);
      case MOLES_PER_KILOGRAM -> value;
      case MILLIMOLES_PER_KILOGRAM -> value / 1_000;
      case MICROMOLES_PER_KILOGRAM -> value / 1_000_000;
    };
  }

  /**
   * A molality expressed in this unit.
   *
   * @param component the component, for the molar mass of mass units
   * @param molPerKg molality, mol/kg
   * @return the amount in this unit
   */
  public double fromMolPerKg(Component component, double molPerKg) {
    return switch (this) {
      case MILLIGRAMS_PER_KILOGRAM -> Amounts.milligramsPerKilogramFromMolal(component, molPerKg);
      case MICROGRAMS_PER_KILOGRAM -> Amounts.microgramsPerKilogramFromMolal(component, molPerKg);
      case MOLES_PER_KILOGRAM -> molPerKg;
      case MILLIMOLES_PER_KILOGRAM -> molPerKg * 1_000;
      case MICROMOLES_PER_KILOGRAM -> molPerKg * 1_000_000;
    };
  }
}
