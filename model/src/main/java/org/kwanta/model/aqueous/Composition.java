package org.kwanta.model.aqueous;

import java.util.Collections;
import java.util.EnumMap;
import java.util.Map;
import org.kwanta.model.Reference;
import org.kwanta.model.Reference.Confidence;
import org.kwanta.model.ValidityRange;

/**
 * Total molalities of the components of one water sample, mol per kg of water. Absent components
 * are zero. Totals are conserved on heating a closed liquid sample, so the same composition serves
 * at 25 °C and at temperature.
 *
 * @param totals total molality per component, mol/kg (only non-zero entries are stored)
 */
public record Composition(Map<Component, Double> totals) {

  /**
   * Range accepted for each total, mol/kg: zero to 0.1 mol/kg, the ionic-strength level to which
   * the Davies model is customarily adequate at 25 °C (reference below). Cycle water is µmol/kg to
   * mmol/kg.
   */
  public static final ValidityRange TOTAL_MOLALITY_RANGE =
      new ValidityRange(
          "total molality",
          0,
          0.1,
          "mol/kg",
          new Reference(
              "Davies adequacy",
              "Davies equation customarily adequate to I ≈ 0.1 mol/kg at 25 °C (the project's"
                  + " reference notes §2.3); per-component input limit of the speciation engine",
              Confidence.RETRIEVED));

  /** Pure water: no component. */
  public static final Composition PURE_WATER = new Composition(Map.of());

  public Composition {
    EnumMap<Component, Double> copy = new EnumMap<>(Component.class);
    // by key and get, which on an enum map walks its array without an entry object per total
    for (Component c : totals.keySet()) {
      if (c == null) {
        throw new IllegalArgumentException("null component");
      }
      Double total = totals.get(c);
      // the checked value is the given one: keep its box rather than box it again
      if (TOTAL_MOLALITY_RANGE.check(total) > 0) {
        copy.put(c, total);
      }
    }
    totals = Collections.unmodifiableMap(copy);
  }

  /** Total molality of a component, mol/kg (0 when absent). */
  public double molality(Component component) {
    return totals.getOrDefault(component, 0.0);
  }

  /** A copy with one component's total replaced, mol/kg. */
  public Composition with(Component component, double molPerKg) {
    EnumMap<Component, Double> m = new EnumMap<>(Component.class);
    m.putAll(totals);
    m.put(component, molPerKg);
    return new Composition(m);
  }

  /** A composition of one component, mol/kg. */
  public static Composition of(Component component, double molPerKg) {
    return PURE_WATER.with(component, molPerKg);
  }

  /** A new builder. */
  public static Builder builder() {
    return new Builder();
  }

  /** Collects totals, in mol/kg or in mass units converted through {@link Amounts}. */
  public static final class Builder {
    private final EnumMap<Component, Double> totals = new EnumMap<>(Component.class);

    private Builder() {}

    /** Adds to a component's total, mol/kg. */
    public Builder molal(Component component, double molPerKg) {
      totals.merge(component, molPerKg, Double::sum);
      return this;
    }

    /** Adds to a component's total, mg of the counted formula per kg of water. */
    public Builder milligramsPerKilogram(Component component, double mgPerKg) {
      return molal(component, Amounts.molalFromMilligramsPerKilogram(component, mgPerKg));
    }

    /** Adds to a component's total, µg of the counted formula per kg of water. */
    public Builder microgramsPerKilogram(Component component, double ugPerKg) {
      return molal(component, Amounts.molalFromMicrogramsPerKilogram(component, ugPerKg));
    }

    /** Adds to a component's total, in any {@link AmountUnit}. */
    public Builder amount(Component component, double value, AmountUnit unit) {
      return molal(component, unit.toMolPerKg(component, value));
    }

    /**
     * The composition.
     *
     * @throws org.kwanta.model.OutOfValidityRangeException a total outside {@link
     *     #TOTAL_MOLALITY_RANGE} (negative, NaN or above 0.1 mol/kg)
     */
    public Composition build() {
      return new Composition(totals);
    }
  }
}
