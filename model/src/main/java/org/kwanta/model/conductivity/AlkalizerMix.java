package org.kwanta.model.conductivity;

import java.util.Arrays;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import org.kwanta.model.aqueous.Component;

/**
 * One alkalizer, or a mix of known molar ratio: the molar fraction of each base in the total. An
 * alkalizer is any weak-base {@link Component} ({@link Component#isWeakBase()}): ammonia or an
 * amine.
 *
 * @param molarFractions fractions of the total amount, summing to 1
 */
public record AlkalizerMix(Map<Component, Double> molarFractions) {

  /** Ammonia alone. */
  public static final AlkalizerMix AMMONIA = of(Component.AMMONIA);

  public AlkalizerMix {
    if (molarFractions.isEmpty()) {
      throw new IllegalArgumentException("an alkalizer mix needs at least one alkalizer");
    }
    for (Component c : molarFractions.keySet()) {
      if (!c.isWeakBase()) {
        throw new IllegalArgumentException(c + " is not a weak base and cannot be an alkalizer");
      }
    }
    double sum = 0;
    for (double f : molarFractions.values()) {
      if (!(f >= 0)) {
        throw new IllegalArgumentException("molar fractions must be non-negative: " + f);
      }
      sum += f;
    }
    if (Math.abs(sum - 1) > 1e-9) {
      throw new IllegalArgumentException("molar fractions must sum to 1, got " + sum);
    }
    molarFractions = Map.copyOf(new EnumMap<>(molarFractions));
  }

  /** A single alkalizer. */
  public static AlkalizerMix of(Component a) {
    return new AlkalizerMix(Map.of(a, 1.0));
  }

  /**
   * A mix given by mass ratio (as dosed), converted to molar fractions.
   *
   * @param massParts mass parts of each base (any scale)
   */
  public static AlkalizerMix byMass(Map<Component, Double> massParts) {
    Map<Component, Double> moles = new EnumMap<>(Component.class);
    double total = 0;
    for (Map.Entry<Component, Double> e : massParts.entrySet()) {
      double n = e.getValue() / e.getKey().molarMassGPerMol();
      moles.put(e.getKey(), n);
      total += n;
    }
    for (Map.Entry<Component, Double> e : moles.entrySet()) {
      e.setValue(e.getValue() / total);
    }
    return new AlkalizerMix(moles);
  }

  /** The components that can be alkalizers (the weak bases), in declaration order. */
  public static List<Component> alkalizers() {
    return Arrays.stream(Component.values()).filter(Component::isWeakBase).toList();
  }

  /** True when the mix is a single alkalizer. */
  public boolean isSingle() {
    return molarFractions.size() == 1;
  }

  /** Mean molar mass of the mix, g/mol (converts mol/kg of the total to mass). */
  public double molarMassGPerMol() {
    double m = 0;
    for (Map.Entry<Component, Double> e : molarFractions.entrySet()) {
      m += e.getValue() * e.getKey().molarMassGPerMol();
    }
    return m;
  }
}
