package org.kwanta.model.aqueous;

/**
 * A dissociation equilibrium, always written in the direction HA = A⁻ + H⁺ or BH⁺ = B + H⁺ (log10
 * Ka negative, pKa = −log10 Ka), whatever direction the source database prints. Molal, infinite
 * dilution, a(H2O) = 1.
 */
public enum Equilibrium {
  /** NH4⁺ = NH3 + H⁺. */
  AMMONIUM("NH4+ = NH3 + H+", Species.AMMONIUM, Species.AMMONIA),
  /** Morpholinium = morpholine + H⁺. */
  MORPHOLINIUM("C4H9NOH+ = C4H9NO + H+", Species.MORPHOLINIUM, Species.MORPHOLINE),
  /** Ethanolammonium = ethanolamine + H⁺. */
  ETHANOLAMMONIUM("HOC2H4NH3+ = HOC2H4NH2 + H+", Species.ETHANOLAMMONIUM, Species.ETHANOLAMINE),
  /** Cyclohexylammonium = cyclohexylamine + H⁺. */
  CYCLOHEXYLAMMONIUM(
      "C6H11NH3+ = C6H11NH2 + H+", Species.CYCLOHEXYLAMMONIUM, Species.CYCLOHEXYLAMINE),
  /** Dimethylammonium = dimethylamine + H⁺. */
  DIMETHYLAMMONIUM("(CH3)2NH2+ = (CH3)2NH + H+", Species.DIMETHYLAMMONIUM, Species.DIMETHYLAMINE),
  /** 3-Methoxypropylammonium = 3-methoxypropylamine + H⁺. */
  METHOXYPROPYLAMMONIUM(
      "CH3O(CH2)3NH3+ = CH3O(CH2)3NH2 + H+",
      Species.METHOXYPROPYLAMMONIUM,
      Species.METHOXYPROPYLAMINE),
  /** Protonated DEAE = DEAE + H⁺. */
  DIETHYLAMINOETHANOLIUM(
      "(C2H5)2NHC2H4OH+ = (C2H5)2NC2H4OH + H+",
      Species.DIETHYLAMINOETHANOLIUM,
      Species.DIETHYLAMINOETHANOL),
  /** HSO4⁻ = SO4²⁻ + H⁺. */
  BISULFATE("HSO4- = SO4-2 + H+", Species.BISULFATE, Species.SULFATE),
  /** CO2(aq) + H2O = HCO3⁻ + H⁺ (K1). */
  CARBONIC_FIRST("CO2 + H2O = HCO3- + H+", Species.CARBON_DIOXIDE, Species.BICARBONATE),
  /** HCO3⁻ = CO3²⁻ + H⁺ (K2). */
  CARBONIC_SECOND("HCO3- = CO3-2 + H+", Species.BICARBONATE, Species.CARBONATE),
  /** H3PO4 = H2PO4⁻ + H⁺ (K1). */
  PHOSPHORIC_FIRST("H3PO4 = H2PO4- + H+", Species.PHOSPHORIC_ACID, Species.DIHYDROGEN_PHOSPHATE),
  /** H2PO4⁻ = HPO4²⁻ + H⁺ (K2). */
  PHOSPHORIC_SECOND(
      "H2PO4- = HPO4-2 + H+", Species.DIHYDROGEN_PHOSPHATE, Species.HYDROGEN_PHOSPHATE),
  /** HPO4²⁻ = PO4³⁻ + H⁺ (K3). */
  PHOSPHORIC_THIRD("HPO4-2 = PO4-3 + H+", Species.HYDROGEN_PHOSPHATE, Species.PHOSPHATE),
  /** CH3COOH = CH3COO⁻ + H⁺. */
  ACETIC("CH3COOH = CH3COO- + H+", Species.ACETIC_ACID, Species.ACETATE),
  /** HCOOH = HCOO⁻ + H⁺. */
  FORMIC("HCOOH = HCOO- + H+", Species.FORMIC_ACID, Species.FORMATE),
  /** B(OH)3 + H2O = B(OH)4⁻ + H⁺. */
  BORIC("B(OH)3 + H2O = B(OH)4- + H+", Species.BORIC_ACID, Species.BORATE);

  private final String reaction;
  private final Species acid;
  private final Species base;

  Equilibrium(String reaction, Species acid, Species base) {
    this.reaction = reaction;
    this.acid = acid;
    this.base = base;
  }

  /** The reaction in the dissociation direction used throughout the engine. */
  public String reaction() {
    return reaction;
  }

  /** The proton donor (left side). */
  public Species acid() {
    return acid;
  }

  /** The conjugate base (right side, with H⁺). */
  public Species base() {
    return base;
  }

  /** The component both species belong to. */
  public Component component() {
    return acid.component();
  }
}
