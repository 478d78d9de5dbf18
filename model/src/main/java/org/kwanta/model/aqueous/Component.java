package org.kwanta.model.aqueous;

import static org.kwanta.model.aqueous.Amounts.*;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;

/**
 * A conserved component whose total molality is an input: the one description of a solute, shared
 * by the speciation and the conductivity model. Each is counted "as" one formula with its molar
 * mass (the basis for mg/kg conversions in {@link Amounts}); its {@link Species} (charge, limiting
 * conductivity) are listed from the most protonated to the least, linked by its {@link
 * Equilibrium}s (for a weak base, the one step follows from its two species).
 *
 * <p>Molar masses are sums of the standard atomic weights in {@link Amounts}.
 */
public enum Component {
  /** Total ammonia, counted as NH3. */
  AMMONIA("NH3", N + 3 * H),
  /** Morpholine, C4H9NO. */
  MORPHOLINE("C4H9NO", 4 * C + 9 * H + N + O),
  /** Ethanolamine (ETA, MEA), C2H7NO. */
  ETHANOLAMINE("C2H7NO", 2 * C + 7 * H + N + O),
  /** Cyclohexylamine, C6H13N. */
  CYCLOHEXYLAMINE("C6H13N", 6 * C + 13 * H + N),
  /** Dimethylamine, C2H7N. */
  DIMETHYLAMINE("C2H7N", 2 * C + 7 * H + N),
  /** 3-Methoxypropylamine (MPA), C4H11NO. */
  METHOXYPROPYLAMINE("C4H11NO", 4 * C + 11 * H + N + O),
  /** 2-Diethylaminoethanol (DEAE), C6H15NO. */
  DIETHYLAMINOETHANOL("C6H15NO", 6 * C + 15 * H + N + O),
  /** Sodium, as Na (fully dissociated). */
  SODIUM("Na", NA),
  /** Potassium, as K (fully dissociated). */
  POTASSIUM("K", K),
  /** Lithium, as Li (fully dissociated). */
  LITHIUM("Li", LI),
  /** Chloride, as Cl (fully dissociated). */
  CHLORIDE("Cl", CL),
  /** Total sulfate (HSO4⁻ + SO4²⁻), as SO4. */
  SULFATE("SO4", S + 4 * O),
  /** Total inorganic carbon (CO2(aq) + HCO3⁻ + CO3²⁻), as CO2. */
  CARBON_DIOXIDE("CO2", C + 2 * O),
  /** Total orthophosphate, as PO4. */
  PHOSPHATE("PO4", P + 4 * O),
  /** Total acetate (acetic acid + acetate), as acetate CH3COO. */
  ACETATE("CH3COO", 2 * C + 3 * H + 2 * O),
  /** Total formate (formic acid + formate), as formate HCOO. */
  FORMATE("HCOO", C + H + 2 * O),
  /** Total boron (B(OH)3 + B(OH)4⁻), as B. */
  BORON("B", B);

  private final String countedAs;
  private final double molarMassGPerMol;

  Component(String countedAs, double molarMassGPerMol) {
    this.countedAs = countedAs;
    this.molarMassGPerMol = molarMassGPerMol;
  }

  /** The formula the total is counted as (mass basis for mg/kg). */
  public String countedAs() {
    return countedAs;
  }

  /** Molar mass of the formula the total is counted as, g/mol. */
  public double molarMassGPerMol() {
    return molarMassGPerMol;
  }

  /**
   * True for a weak base B taken up as BH⁺ (an alkalizer such as ammonia or an amine): two species,
   * BH⁺ and B.
   */
  public boolean isWeakBase() {
    List<Species> s = species();
    return s.size() == 2 && s.get(0).chargeNumber() == 1 && s.get(1).chargeNumber() == 0;
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
    return Equilibrium.of(this);
  }

  private static final class Chains {
    static final Map<Component, List<Species>> SPECIES = new EnumMap<>(Component.class);

    static {
      for (Component c : Component.values()) {
        List<Species> s = new ArrayList<>();
        for (Species sp : Species.values()) {
          if (sp.belongsTo(c)) {
            s.add(sp);
          }
        }
        SPECIES.put(c, List.copyOf(s));
      }
    }
  }
}
