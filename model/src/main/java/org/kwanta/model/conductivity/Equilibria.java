package org.kwanta.model.conductivity;

import java.util.EnumMap;
import java.util.Map;
import org.kwanta.model.aqueous.ConstantSet;
import org.kwanta.model.aqueous.ConstantSets;
import org.kwanta.model.aqueous.Equilibrium;
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

  private static final Map<Alkalizer, Equilibrium> BASE_EQUILIBRIA =
      Map.of(
          Alkalizer.AMMONIA, Equilibrium.AMMONIUM,
          Alkalizer.MORPHOLINE, Equilibrium.MORPHOLINIUM,
          Alkalizer.ETHANOLAMINE, Equilibrium.ETHANOLAMMONIUM,
          Alkalizer.DIMETHYLAMINE, Equilibrium.DIMETHYLAMMONIUM,
          Alkalizer.CYCLOHEXYLAMINE, Equilibrium.CYCLOHEXYLAMMONIUM,
          Alkalizer.METHOXYPROPYLAMINE, Equilibrium.METHOXYPROPYLAMMONIUM,
          Alkalizer.DIETHYLAMINOETHANOL, Equilibrium.DIETHYLAMINOETHANOLIUM);

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
    Map<Alkalizer, Double> pka = new EnumMap<>(Alkalizer.class);
    for (Map.Entry<Alkalizer, Equilibrium> e : BASE_EQUILIBRIA.entrySet()) {
      pka.put(e.getKey(), -set.fitAt(e.getValue(), t).log10K(t, pKw));
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
  public static Map<Alkalizer, Double> pKa(Alkalizer a, double pKa) {
    Map<Alkalizer, Double> m = new EnumMap<>(Alkalizer.class);
    m.put(a, pKa);
    return m;
  }
}
