package org.kwanta.model.conductivity;

import java.util.EnumMap;
import java.util.Map;
import org.kwanta.model.water.WaterState;

/**
 * Equilibrium constants at one water state, molal, infinite-dilution standard state, as supplied by
 * the speciation engine. Acid constants are written HA = A⁻ + H⁺ and BH⁺ = B + H⁺.
 *
 * @param water the state (Kw from its pKw, Davies A from its Debye–Hückel A)
 * @param basePKa pKa of each alkalizer's BH⁺ at this state; alkalizers absent cannot be used
 * @param carbonicPK1 pK1 of CO₂(aq) + H₂O = HCO₃⁻ + H⁺
 * @param carbonicPK2 pK2 of HCO₃⁻ = CO₃²⁻ + H⁺
 * @param phosphoricPK1 pK1 of H₃PO₄
 * @param phosphoricPK2 pK2 of H₂PO₄⁻
 * @param phosphoricPK3 pK3 of HPO₄²⁻
 */
public record Equilibria(
    WaterState water,
    Map<Alkalizer, Double> basePKa,
    double carbonicPK1,
    double carbonicPK2,
    double phosphoricPK1,
    double phosphoricPK2,
    double phosphoricPK3) {

  public Equilibria {
    basePKa = Map.copyOf(basePKa);
  }

  /**
   * Ka of an alkalizer's BH⁺, as an array indexed by {@link Alkalizer#ordinal()} (NaN if absent).
   */
  double[] baseKaArray() {
    double[] ka = new double[Alkalizer.values().length];
    for (Alkalizer a : Alkalizer.values()) {
      Double pk = basePKa.get(a);
      ka[a.ordinal()] = pk == null ? Double.NaN : Math.pow(10, -pk);
    }
    return ka;
  }

  /** Convenience builder for one alkalizer. */
  public static Map<Alkalizer, Double> pKa(Alkalizer a, double pKa) {
    Map<Alkalizer, Double> m = new EnumMap<>(Alkalizer.class);
    m.put(a, pKa);
    return m;
  }
}
