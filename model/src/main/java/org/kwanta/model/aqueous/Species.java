package org.kwanta.model.aqueous;

import org.kwanta.model.Reference;

/**
 * An aqueous species: formula without charge, charge number, the component it belongs to, and its
 * limiting molar conductivity. This one table serves both the speciation and the conductivity
 * model. Within a component the species are declared from the most protonated to the least; each
 * step between neighbours is one {@link Equilibrium}. The water ions H⁺ and OH⁻ belong to no
 * component ({@link #isWaterIon()}).
 *
 * <p>Limiting molar conductivity λ° at 25 °C (S cm² mol⁻¹ per unit charge) are CRC Handbook values
 * ({@link #CRC}); the protonated amines other than dimethylammonium have no published value and
 * carry estimates by structural analogy ({@link #AMINE_ESTIMATE}, ±3 S cm² mol⁻¹). The temperature
 * parameters dw_T (K) are those of {@link #DW_T}; where that database gives none, dw_T = 0 (plain
 * Walden scaling) and the temperature dependence is less certain. Charged species with no λ°
 * carried (HSO₄⁻, B(OH)₄⁻, the charged ion pair and polyborates) have λ° = NaN; neutral species
 * have λ° = 0. Species formed by an {@link Association} ({@link #isAssociated()}) are
 * speciation-only: the conductivity model does not carry them.
 */
public enum Species {
  /** Hydrogen ion, H⁺ (water ion). */
  HYDROGEN_ION("H", 1, null, 349.65, 838, Source.CRC),
  /** Hydroxide, OH⁻ (water ion). */
  HYDROXIDE("OH", -1, null, 198.0, 478, Source.CRC),
  /** Ammonium, NH₄⁺. */
  AMMONIUM("NH4", 1, Component.AMMONIA, 73.5, 203, Source.CRC),
  /** Ammonia, NH₃(aq). */
  AMMONIA("NH3", 0, Component.AMMONIA),
  /** Morpholinium, C₄H₉NOH⁺: λ° estimate 37 ± 3 by analogy with piperidinium (37.2). */
  MORPHOLINIUM("C4H9NOH", 1, Component.MORPHOLINE, 37.0, 0, Source.ESTIMATE),
  /** Morpholine, C₄H₉NO(aq). */
  MORPHOLINE("C4H9NO", 0, Component.MORPHOLINE),
  /** Ethanolammonium, HOC₂H₄NH₃⁺: λ° estimate 41 ± 3 (ethylammonium 47.2 less a hydroxyl). */
  ETHANOLAMMONIUM("HOC2H4NH3", 1, Component.ETHANOLAMINE, 41.0, 0, Source.ESTIMATE),
  /** Ethanolamine, HOC₂H₄NH₂(aq). */
  ETHANOLAMINE("HOC2H4NH2", 0, Component.ETHANOLAMINE),
  /** Cyclohexylammonium, C₆H₁₁NH₃⁺: λ° estimate 34 ± 3 (between piperidinium, dipropylammonium). */
  CYCLOHEXYLAMMONIUM("C6H11NH3", 1, Component.CYCLOHEXYLAMINE, 34.0, 0, Source.ESTIMATE),
  /** Cyclohexylamine, C₆H₁₁NH₂(aq). */
  CYCLOHEXYLAMINE("C6H11NH2", 0, Component.CYCLOHEXYLAMINE),
  /** Dimethylammonium, (CH₃)₂NH₂⁺ (CRC organic cations; plain Walden). */
  DIMETHYLAMMONIUM("(CH3)2NH2", 1, Component.DIMETHYLAMINE, 51.5, 0, Source.CRC),
  /** Dimethylamine, (CH₃)₂NH(aq). */
  DIMETHYLAMINE("(CH3)2NH", 0, Component.DIMETHYLAMINE),
  /** 3-Methoxypropylammonium, CH₃O(CH₂)₃NH₃⁺: λ° estimate 36 ± 3 (near propylammonium). */
  METHOXYPROPYLAMMONIUM("CH3O(CH2)3NH3", 1, Component.METHOXYPROPYLAMINE, 36.0, 0, Source.ESTIMATE),
  /** 3-Methoxypropylamine, CH₃O(CH₂)₃NH₂(aq). */
  METHOXYPROPYLAMINE("CH3O(CH2)3NH2", 0, Component.METHOXYPROPYLAMINE),
  /** Protonated 2-diethylaminoethanol, (C₂H₅)₂NHC₂H₄OH⁺: λ° estimate 31 ± 3. */
  DIETHYLAMINOETHANOLIUM(
      "(C2H5)2NHC2H4OH", 1, Component.DIETHYLAMINOETHANOL, 31.0, 0, Source.ESTIMATE),
  /** 2-Diethylaminoethanol, (C₂H₅)₂NC₂H₄OH(aq). */
  DIETHYLAMINOETHANOL("(C2H5)2NC2H4OH", 0, Component.DIETHYLAMINOETHANOL),
  /** Sodium ion, Na⁺. */
  SODIUM_ION("Na", 1, Component.SODIUM, 50.08, 75, Source.CRC),
  /** Potassium ion, K⁺. */
  POTASSIUM_ION("K", 1, Component.POTASSIUM, 73.48, 254, Source.CRC),
  /** Lithium ion, Li⁺. */
  LITHIUM_ION("Li", 1, Component.LITHIUM, 38.66, -14, Source.CRC),
  /** Chloride, Cl⁻. */
  CHLORIDE_ION("Cl", -1, Component.CHLORIDE, 76.31, 216, Source.CRC),
  /** Bisulfate, HSO₄⁻ (no λ° carried). */
  BISULFATE("HSO4", -1, Component.SULFATE, Double.NaN, 0, Source.NONE),
  /** Sulfate, SO₄²⁻ (λ° per unit charge, ½SO₄²⁻). */
  SULFATE("SO4", -2, Component.SULFATE, 80.0, -64.6, Source.CRC),
  /** Dissolved carbon dioxide, CO₂(aq) (includes H₂CO₃). */
  CARBON_DIOXIDE("CO2", 0, Component.CARBON_DIOXIDE),
  /** Bicarbonate, HCO₃⁻. */
  BICARBONATE("HCO3", -1, Component.CARBON_DIOXIDE, 44.5, -250, Source.CRC),
  /** Carbonate, CO₃²⁻ (λ° per unit charge, ½CO₃²⁻). */
  CARBONATE("CO3", -2, Component.CARBON_DIOXIDE, 69.3, -91, Source.CRC),
  /** Phosphoric acid, H₃PO₄(aq). */
  PHOSPHORIC_ACID("H3PO4", 0, Component.PHOSPHATE),
  /** Dihydrogen phosphate, H₂PO₄⁻ (plain Walden). */
  DIHYDROGEN_PHOSPHATE("H2PO4", -1, Component.PHOSPHATE, 36.0, 0, Source.CRC),
  /** Hydrogen phosphate, HPO₄²⁻ (λ° per unit charge, plain Walden). */
  HYDROGEN_PHOSPHATE("HPO4", -2, Component.PHOSPHATE, 57.0, 0, Source.CRC),
  /** Phosphate, PO₄³⁻ (λ° per unit charge, ⅓PO₄³⁻, plain Walden). */
  PHOSPHATE("PO4", -3, Component.PHOSPHATE, 92.8, 0, Source.CRC),
  /** Acetic acid, CH₃COOH(aq). */
  ACETIC_ACID("CH3COOH", 0, Component.ACETATE),
  /** Acetate, CH₃COO⁻ (no dw_T published: plain Walden). */
  ACETATE("CH3COO", -1, Component.ACETATE, 40.9, 0, Source.CRC),
  /** Formic acid, HCOOH(aq). */
  FORMIC_ACID("HCOOH", 0, Component.FORMATE),
  /** Formate, HCOO⁻ (no dw_T published: plain Walden). */
  FORMATE("HCOO", -1, Component.FORMATE, 54.6, 0, Source.CRC),
  /** Boric acid, B(OH)₃(aq). */
  BORIC_ACID("B(OH)3", 0, Component.BORON),
  /** Borate, B(OH)₄⁻ (monomer; no λ° carried). */
  BORATE("B(OH)4", -1, Component.BORON, Double.NaN, 0, Source.NONE),
  /** Ion pair NaOH°, counted with sodium ({@link Association#SODIUM_HYDROXIDE}). */
  SODIUM_HYDROXIDE_PAIR("NaOH", 0, Component.SODIUM, true),
  /** Ion pair NaCl°, counted with sodium ({@link Association#SODIUM_CHLORIDE}). */
  SODIUM_CHLORIDE_PAIR("NaCl", 0, Component.SODIUM, true),
  /** Ion pair NaSO₄⁻, counted with sodium ({@link Association#SODIUM_SULFATE}; no λ° carried). */
  SODIUM_SULFATE_PAIR("NaSO4", -1, Component.SODIUM, true),
  /**
   * Ion pair NaHPO₄⁻, counted with sodium ({@link Association#SODIUM_HYDROGEN_PHOSPHATE}; opt-in;
   * no λ° carried).
   */
  SODIUM_HYDROGEN_PHOSPHATE_PAIR("NaHPO4", -1, Component.SODIUM, true),
  /** Diborate B₂(OH)₇⁻, counted with boron ({@link Association#DIBORATE}; no λ° carried). */
  DIBORATE("B2(OH)7", -1, Component.BORON, true),
  /** Triborate B₃O₃(OH)₄⁻, counted with boron ({@link Association#TRIBORATE}; no λ° carried). */
  TRIBORATE("B3O3(OH)4", -1, Component.BORON, true),
  /** Tetraborate B₄O₅(OH)₄²⁻, counted with boron ({@link Association#TETRABORATE}; no λ°). */
  TETRABORATE("B4O5(OH)4", -2, Component.BORON, true);

  /** CRC Handbook, "Ionic conductivity and diffusion at infinite dilution" (P. Vanýsek). */
  public static final Reference CRC =
      new Reference(
          "CRC ionic conductivity",
          "CRC Handbook of Chemistry and Physics, Ionic conductivity and diffusion at infinite"
              + " dilution (P. Vanysek); diffusion coefficients of the 92nd edition",
          Reference.Confidence.RETRIEVED);

  /** Estimates for protonated amines by structural analogy with CRC organic cations. */
  public static final Reference AMINE_ESTIMATE =
      new Reference(
          "Kwanta amine conductivity estimate",
          "Estimated by structural analogy with CRC organic cations (piperidinium 37.2,"
              + " ethylammonium 47.2, diethylammonium 42.0, dipropylammonium 30.1); ±3 S cm2/mol",
          Reference.Confidence.ESTIMATED);

  /** The temperature parameters dw_T of limiting conductivities. */
  public static final Reference DW_T =
      new Reference(
          "dw_T temperature parameters",
          "PHREEQC database phreeqc.dat (C.A.J. Appelo version), -dw parameters, and PHREEQC 3"
              + " function calc_SC (D. L. Parkhurst, C. A. J. Appelo, USGS Techniques and Methods"
              + " 6-A43, 2013; manual citation from memory)",
          Reference.Confidence.RETRIEVED);

  /** Where λ° at 25 °C comes from. */
  private enum Source {
    CRC,
    ESTIMATE,
    NONE
  }

  private final String formula;
  private final int chargeNumber;
  private final Component component;
  private final double lambda25;
  private final double dwT;
  private final Source source;
  private final String symbol;
  private final boolean associated;

  Species(String formula, int chargeNumber, Component component) {
    this(formula, chargeNumber, component, 0, 0, Source.NONE);
  }

  /** An associated species (ion pair or polyborate), counted with the given component. */
  Species(String formula, int chargeNumber, Component component, boolean associated) {
    this(
        formula,
        chargeNumber,
        component,
        chargeNumber == 0 ? 0 : Double.NaN,
        0,
        Source.NONE,
        associated);
  }

  Species(
      String formula,
      int chargeNumber,
      Component component,
      double lambda25,
      double dwT,
      Source source) {
    this(formula, chargeNumber, component, lambda25, dwT, source, false);
  }

  Species(
      String formula,
      int chargeNumber,
      Component component,
      double lambda25,
      double dwT,
      Source source,
      boolean associated) {
    this.associated = associated;
    this.formula = formula;
    this.chargeNumber = chargeNumber;
    this.component = component;
    this.lambda25 = lambda25;
    this.dwT = dwT;
    this.source = source;
    this.symbol = Typography.symbol(formula, chargeNumber);
  }

  /**
   * Formula without charge, ASCII, e.g. {@code "SO4"} for sulfate (see {@link #chargeNumber()}).
   */
  public String formula() {
    return formula;
  }

  /** Charge number z. */
  public int chargeNumber() {
    return chargeNumber;
  }

  /** The formula in chemical typography with its charge, e.g. {@code "SO₄²⁻"}. */
  public String symbol() {
    return symbol;
  }

  /**
   * The component this species belongs to.
   *
   * @throws IllegalStateException for H⁺ and OH⁻, which belong to water ({@link #isWaterIon()})
   */
  public Component component() {
    if (component == null) {
      throw new IllegalStateException(this + " belongs to no component");
    }
    return component;
  }

  /** True for H⁺ and OH⁻, which belong to water rather than to a component. */
  public boolean isWaterIon() {
    return component == null;
  }

  /**
   * Limiting molar conductivity per unit charge at 25 °C, S cm² mol⁻¹: 0 for neutral species, NaN
   * for charged species without a value.
   */
  public double lambda25() {
    return lambda25;
  }

  /** Temperature parameter dw_T of the Arrhenius-type correction, K (0 = plain Walden). */
  public double dwT() {
    return dwT;
  }

  /** Where λ° at 25 °C comes from: {@link #CRC}, {@link #AMINE_ESTIMATE}, or empty. */
  public java.util.Optional<Reference> lambdaSource() {
    return switch (source) {
      case CRC -> java.util.Optional.of(CRC);
      case ESTIMATE -> java.util.Optional.of(AMINE_ESTIMATE);
      case NONE -> java.util.Optional.empty();
    };
  }

  /**
   * True for a species formed by association ({@link Association}): an ion pair or a polyborate. It
   * is counted with one component ({@link #component()}: sodium for the pairs, boron for the
   * polyborates) but is not part of that component's dissociation chain ({@link
   * Component#species()}).
   */
  public boolean isAssociated() {
    return associated;
  }

  /**
   * How many units of a component's total one unit of this species holds: 1 for a species of the
   * component's chain, 1 for sodium and for the anion of an ion pair, the boron atoms of a
   * polyborate, 0 otherwise. The mass balance of a component is Σ countOf(c)·m over all species.
   */
  public int countOf(Component c) {
    return switch (this) {
      case SODIUM_HYDROXIDE_PAIR -> c == Component.SODIUM ? 1 : 0;
      case SODIUM_CHLORIDE_PAIR -> c == Component.SODIUM || c == Component.CHLORIDE ? 1 : 0;
      case SODIUM_SULFATE_PAIR -> c == Component.SODIUM || c == Component.SULFATE ? 1 : 0;
      case SODIUM_HYDROGEN_PHOSPHATE_PAIR ->
          c == Component.SODIUM || c == Component.PHOSPHATE ? 1 : 0;
      case DIBORATE -> c == Component.BORON ? 2 : 0;
      case TRIBORATE -> c == Component.BORON ? 3 : 0;
      case TETRABORATE -> c == Component.BORON ? 4 : 0;
      default -> belongsTo(c) ? 1 : 0;
    };
  }

  /**
   * True when the species is in the given component's dissociation chain (never for water ions or
   * associated species).
   */
  boolean belongsTo(Component c) {
    return component == c && !associated;
  }
}
