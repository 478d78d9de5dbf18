package org.kwanta.model.aqueous;

/**
 * An aqueous species carried by the speciation. Within a component the species are declared from
 * the most protonated to the least; each step between neighbours is one {@link Equilibrium}.
 */
public enum Species {
  /** Ammonium, NH4⁺. */
  AMMONIUM("NH4+", 1, Component.AMMONIA),
  /** Ammonia, NH3(aq). */
  AMMONIA("NH3", 0, Component.AMMONIA),
  /** Morpholinium, C4H9NOH⁺. */
  MORPHOLINIUM("C4H9NOH+", 1, Component.MORPHOLINE),
  /** Morpholine, C4H9NO(aq). */
  MORPHOLINE("C4H9NO", 0, Component.MORPHOLINE),
  /** Ethanolammonium, HOC2H4NH3⁺. */
  ETHANOLAMMONIUM("HOC2H4NH3+", 1, Component.ETHANOLAMINE),
  /** Ethanolamine, HOC2H4NH2(aq). */
  ETHANOLAMINE("HOC2H4NH2", 0, Component.ETHANOLAMINE),
  /** Cyclohexylammonium, C6H11NH3⁺. */
  CYCLOHEXYLAMMONIUM("C6H11NH3+", 1, Component.CYCLOHEXYLAMINE),
  /** Cyclohexylamine, C6H11NH2(aq). */
  CYCLOHEXYLAMINE("C6H11NH2", 0, Component.CYCLOHEXYLAMINE),
  /** Dimethylammonium, (CH3)2NH2⁺. */
  DIMETHYLAMMONIUM("(CH3)2NH2+", 1, Component.DIMETHYLAMINE),
  /** Dimethylamine, (CH3)2NH(aq). */
  DIMETHYLAMINE("(CH3)2NH", 0, Component.DIMETHYLAMINE),
  /** 3-Methoxypropylammonium, CH3O(CH2)3NH3⁺. */
  METHOXYPROPYLAMMONIUM("CH3O(CH2)3NH3+", 1, Component.METHOXYPROPYLAMINE),
  /** 3-Methoxypropylamine, CH3O(CH2)3NH2(aq). */
  METHOXYPROPYLAMINE("CH3O(CH2)3NH2", 0, Component.METHOXYPROPYLAMINE),
  /** Protonated 2-diethylaminoethanol, (C2H5)2NHC2H4OH⁺. */
  DIETHYLAMINOETHANOLIUM("(C2H5)2NHC2H4OH+", 1, Component.DIETHYLAMINOETHANOL),
  /** 2-Diethylaminoethanol, (C2H5)2NC2H4OH(aq). */
  DIETHYLAMINOETHANOL("(C2H5)2NC2H4OH", 0, Component.DIETHYLAMINOETHANOL),
  /** Sodium ion, Na⁺. */
  SODIUM_ION("Na+", 1, Component.SODIUM),
  /** Potassium ion, K⁺. */
  POTASSIUM_ION("K+", 1, Component.POTASSIUM),
  /** Lithium ion, Li⁺. */
  LITHIUM_ION("Li+", 1, Component.LITHIUM),
  /** Chloride, Cl⁻. */
  CHLORIDE_ION("Cl-", -1, Component.CHLORIDE),
  /** Bisulfate, HSO4⁻. */
  BISULFATE("HSO4-", -1, Component.SULFATE),
  /** Sulfate, SO4²⁻. */
  SULFATE("SO4-2", -2, Component.SULFATE),
  /** Dissolved carbon dioxide, CO2(aq) (includes H2CO3). */
  CARBON_DIOXIDE("CO2", 0, Component.CARBON_DIOXIDE),
  /** Bicarbonate, HCO3⁻. */
  BICARBONATE("HCO3-", -1, Component.CARBON_DIOXIDE),
  /** Carbonate, CO3²⁻. */
  CARBONATE("CO3-2", -2, Component.CARBON_DIOXIDE),
  /** Phosphoric acid, H3PO4(aq). */
  PHOSPHORIC_ACID("H3PO4", 0, Component.PHOSPHATE),
  /** Dihydrogen phosphate, H2PO4⁻. */
  DIHYDROGEN_PHOSPHATE("H2PO4-", -1, Component.PHOSPHATE),
  /** Hydrogen phosphate, HPO4²⁻. */
  HYDROGEN_PHOSPHATE("HPO4-2", -2, Component.PHOSPHATE),
  /** Phosphate, PO4³⁻. */
  PHOSPHATE("PO4-3", -3, Component.PHOSPHATE),
  /** Acetic acid, CH3COOH(aq). */
  ACETIC_ACID("CH3COOH", 0, Component.ACETATE),
  /** Acetate, CH3COO⁻. */
  ACETATE("CH3COO-", -1, Component.ACETATE),
  /** Formic acid, HCOOH(aq). */
  FORMIC_ACID("HCOOH", 0, Component.FORMATE),
  /** Formate, HCOO⁻. */
  FORMATE("HCOO-", -1, Component.FORMATE),
  /** Boric acid, B(OH)3(aq). */
  BORIC_ACID("B(OH)3", 0, Component.BORON),
  /** Borate, B(OH)4⁻ (monomer; polyborates are not carried). */
  BORATE("B(OH)4-", -1, Component.BORON);

  private final String formula;
  private final int charge;
  private final Component component;

  Species(String formula, int charge, Component component) {
    this.formula = formula;
    this.charge = charge;
    this.component = component;
  }

  /** Formula with charge in database notation, e.g. {@code "SO4-2"}. */
  public String formula() {
    return formula;
  }

  /** Charge number z. */
  public int charge() {
    return charge;
  }

  /** The component this species belongs to. */
  public Component component() {
    return component;
  }
}
