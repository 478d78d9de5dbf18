package org.kwanta.model.aqueous;

/**
 * A dissociation equilibrium, always written in the direction HA ⇌ A⁻ + H⁺ or BH⁺ ⇌ B + H⁺ (log10
 * Ka negative, pKa = −log10 Ka), whatever direction the source prints. Molal, infinite dilution,
 * a(H₂O) = 1. The reaction text is built from the species' symbols ({@link #reaction()}).
 */
public enum Equilibrium {
  /** NH4⁺ ⇌ NH3 + H⁺. */
  AMMONIUM(Species.AMMONIUM, Species.AMMONIA),
  /** Morpholinium ⇌ morpholine + H⁺. */
  MORPHOLINIUM(Species.MORPHOLINIUM, Species.MORPHOLINE),
  /** Ethanolammonium ⇌ ethanolamine + H⁺. */
  ETHANOLAMMONIUM(Species.ETHANOLAMMONIUM, Species.ETHANOLAMINE),
  /** Cyclohexylammonium ⇌ cyclohexylamine + H⁺. */
  CYCLOHEXYLAMMONIUM(Species.CYCLOHEXYLAMMONIUM, Species.CYCLOHEXYLAMINE),
  /** Dimethylammonium ⇌ dimethylamine + H⁺. */
  DIMETHYLAMMONIUM(Species.DIMETHYLAMMONIUM, Species.DIMETHYLAMINE),
  /** 3-Methoxypropylammonium ⇌ 3-methoxypropylamine + H⁺. */
  METHOXYPROPYLAMMONIUM(Species.METHOXYPROPYLAMMONIUM, Species.METHOXYPROPYLAMINE),
  /** Protonated DEAE ⇌ DEAE + H⁺. */
  DIETHYLAMINOETHANOLIUM(Species.DIETHYLAMINOETHANOLIUM, Species.DIETHYLAMINOETHANOL),
  /** HSO4⁻ ⇌ SO4²⁻ + H⁺. */
  BISULFATE(Species.BISULFATE, Species.SULFATE),
  /** CO2(aq) + H2O ⇌ HCO3⁻ + H⁺ (K1). */
  CARBONIC_FIRST(Species.CARBON_DIOXIDE, Species.BICARBONATE, Equilibrium.WITH_WATER),
  /** HCO3⁻ ⇌ CO3²⁻ + H⁺ (K2). */
  CARBONIC_SECOND(Species.BICARBONATE, Species.CARBONATE),
  /** H3PO4 ⇌ H2PO4⁻ + H⁺ (K1). */
  PHOSPHORIC_FIRST(Species.PHOSPHORIC_ACID, Species.DIHYDROGEN_PHOSPHATE),
  /** H2PO4⁻ ⇌ HPO4²⁻ + H⁺ (K2). */
  PHOSPHORIC_SECOND(Species.DIHYDROGEN_PHOSPHATE, Species.HYDROGEN_PHOSPHATE),
  /** HPO4²⁻ ⇌ PO4³⁻ + H⁺ (K3). */
  PHOSPHORIC_THIRD(Species.HYDROGEN_PHOSPHATE, Species.PHOSPHATE),
  /** CH3COOH ⇌ CH3COO⁻ + H⁺. */
  ACETIC(Species.ACETIC_ACID, Species.ACETATE),
  /** HCOOH ⇌ HCOO⁻ + H⁺. */
  FORMIC(Species.FORMIC_ACID, Species.FORMATE),
  /** B(OH)3 + H2O ⇌ B(OH)4⁻ + H⁺. */
  BORIC(Species.BORIC_ACID, Species.BORATE, Equilibrium.WITH_WATER);

  /** Marks a step written with a water molecule on the left, e.g. CO₂ + H₂O ⇌ HCO₃⁻ + H⁺. */
  private static final boolean WITH_WATER = true;

  private final Species acid;
  private final Species base;
  private final String reaction;

  Equilibrium(Species acid, Species base) {
    this(acid, base, false);
  }

  Equilibrium(Species acid, Species base, boolean withWater) {
    this.acid = acid;
    this.base = base;
    this.reaction = acid.symbol() + (withWater ? " + H₂O" : "") + " ⇌ " + base.symbol() + " + H⁺";
  }

  /**
   * The reaction in the dissociation direction used throughout the engine, in chemical typography,
   * e.g. {@code "HSO₄⁻ ⇌ SO₄²⁻ + H⁺"}.
   */
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
