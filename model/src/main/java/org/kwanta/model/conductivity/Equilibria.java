package org.kwanta.model.conductivity;

import java.util.EnumMap;
import java.util.Map;
import org.kwanta.model.aqueous.Component;
import org.kwanta.model.aqueous.ConstantSet;
import org.kwanta.model.aqueous.ConstantSets;
import org.kwanta.model.aqueous.Equilibrium;
import org.kwanta.model.water.WaterState;

/**
 * Equilibrium constants at one water state, molal, infinite-dilution standard state, as supplied by
 * the speciation engine. Acid constants are written HA ⇌ A⁻ + H⁺ and BH⁺ ⇌ B + H⁺.
 *
 * @param water the state (Kw from its pKw, Davies A from its Debye–Hückel A)
 * @param basePKa pKa of each weak base's BH⁺ ({@link Component#isWeakBase()}) at this state; bases
 *     absent cannot be used
 * @param carbonicPK1 pK1 of CO₂(aq) + H₂O ⇌ HCO₃⁻ + H⁺
 * @param carbonicPK2 pK2 of HCO₃⁻ ⇌ CO₃²⁻ + H⁺
 * @param phosphoricPK1 pK1 of H₃PO₄
 * @param phosphoricPK2 pK2 of H₂PO₄⁻
 * @param phosphoricPK3 pK3 of HPO₄²⁻
 */
public record Equilibria(
    WaterState water,
    Map<Component, Double> basePKa,
    double carbonicPK1,
    double carbonicPK2,
    double phosphoricPK1,
    double phosphoricPK2,
    double phosphoricPK3) {

  public Equilibria {
    basePKa = Map.copyOf(basePKa);
  }

  /**
   * The constants of the speciation engine's default constant set at a water state (an adapter onto
   * {@link ConstantSets#DEFAULT}, so the conductivity fits and the speciation use the same
   * numbers).
   */
  public static Equilibria of(WaterState water) {
    return of(water, ConstantSets.DEFAULT);
  }

  /** The constants of a given constant set of the speciation engine at a water state. */
  public static Equilibria of(WaterState water, ConstantSet set) {
    double t = water.temperatureK();
    double pKw = water.pKw();
    Map<Component, Double> pka = new EnumMap<>(Component.class);
    for (Component c : Component.values()) {
      if (c.isWeakBase()) {
        pka.put(c, -set.fitAt(c.equilibria().get(0), t).log10K(t, pKw));
      }
    }
    return new Equilibria(
        water,
        pka,
        -set.fitAt(Equilibrium.CARBONIC_FIRST, t).log10K(t, pKw),
        -set.fitAt(Equilibrium.CARBONIC_SECOND, t).log10K(t, pKw),
        -set.fitAt(Equilibrium.PHOSPHORIC_FIRST, t).log10K(t, pKw),
        -set.fitAt(Equilibrium.PHOSPHORIC_SECOND, t).log10K(t, pKw),
        -set.fitAt(Equilibrium.PHOSPHORIC_THIRD, t).log10K(t, pKw));
  }

  /** Convenience builder for one alkalizer. */
  public static Map<Component, Double> pKa(Component a, double pKa) {
    Map<Component, Double> m = new EnumMap<>(Component.class);
    m.put(a, pKa);
    return m;
  }
}
