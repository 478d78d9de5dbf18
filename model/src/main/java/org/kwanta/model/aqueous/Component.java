package org.kwanta.model.aqueous;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;

/**
 * A conserved component whose total molality is an input. Each is counted "as" one formula (the
 * basis for mg/kg conversions in {@link Amounts}); its species are listed from the most protonated
 * to the least.
 */
public enum Component {
  /** Total ammonia, counted as NH3. */
  AMMONIA("NH3"),
  /** Morpholine, C4H9NO. */
  MORPHOLINE("C4H9NO"),
  /** Ethanolamine (ETA, MEA), C2H7NO. */
  ETHANOLAMINE("C2H7NO"),
  /** Cyclohexylamine, C6H13N. */
  CYCLOHEXYLAMINE("C6H13N"),
  /** Dimethylamine, C2H7N. */
  DIMETHYLAMINE("C2H7N"),
  /** 3-Methoxypropylamine (MPA), C4H11NO. */
  METHOXYPROPYLAMINE("C4H11NO"),
  /** 2-Diethylaminoethanol (DEAE), C6H15NO. */
  DIETHYLAMINOETHANOL("C6H15NO"),
  /** Sodium, as Na (fully dissociated). */
  SODIUM("Na"),
  /** Potassium, as K (fully dissociated). */
  POTASSIUM("K"),
  /** Lithium, as Li (fully dissociated). */
  LITHIUM("Li"),
  /** Chloride, as Cl (fully dissociated). */
  CHLORIDE("Cl"),
  /** Total sulfate (HSO4⁻ + SO4²⁻), as SO4. */
  SULFATE("SO4"),
  /** Total inorganic carbon (CO2(aq) + HCO3⁻ + CO3²⁻), as CO2. */
  CARBON_DIOXIDE("CO2"),
  /** Total orthophosphate, as PO4. */
  PHOSPHATE("PO4"),
  /** Total acetate (acetic acid + acetate), as acetate CH3COO. */
  ACETATE("CH3COO"),
  /** Total formate (formic acid + formate), as formate HCOO. */
  FORMATE("HCOO"),
  /** Total boron (B(OH)3 + B(OH)4⁻), as B. */
  BORON("B");

  private final String countedAs;

  Component(String countedAs) {
    this.countedAs = countedAs;
  }

  /** The formula the total is counted as (mass basis for mg/kg). */
  public String countedAs() {
    return countedAs;
  }

  /** The species of this component, from the most protonated (highest charge) to the least. */
  public List<Species> species() {
    return Chains.SPECIES.get(this);
  }

  /**
   * The dissociation steps linking consecutive {@link #species()}: step i turns species i into
   * species i + 1 and releases one H⁺. Empty for fully dissociated ions.
   */
  public List<Equilibrium> equilibria() {
    return Chains.EQUILIBRIA.get(this);
  }

  private static final class Chains {
    static final Map<Component, List<Species>> SPECIES = new EnumMap<>(Component.class);
    static final Map<Component, List<Equilibrium>> EQUILIBRIA = new EnumMap<>(Component.class);

    static {
      for (Component c : Component.values()) {
        List<Species> s = new ArrayList<>();
        for (Species sp : Species.values()) {
          if (sp.component() == c) {
            s.add(sp);
          }
        }
        List<Equilibrium> e = new ArrayList<>();
        for (Equilibrium eq : Equilibrium.values()) {
          if (eq.component() == c) {
            e.add(eq);
          }
        }
        SPECIES.put(c, List.copyOf(s));
        EQUILIBRIA.put(c, List.copyOf(e));
      }
    }
  }
}
