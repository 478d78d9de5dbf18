package org.kwanta.model.conductivity;

import org.kwanta.model.Reference;

/**
 * The ions the conductivity model knows: charge, limiting molar conductivity per unit charge at 25
 * °C and the temperature parameter dw_T of {@link LimitingConductivity}.
 *
 * <p>λ° at 25 °C (S cm² mol⁻¹ per unit charge) are CRC Handbook values ({@link #CRC}); the
 * protonated amines other than dimethylammonium have no published value and carry estimates by
 * structural analogy ({@link #AMINE_ESTIMATE}, ±3 S cm² mol⁻¹). dw_T (K) are the {@code
 * phreeqc.dat} values ({@link #PHREEQC}); where {@code phreeqc.dat} gives none, dw_T = 0 (plain
 * Walden scaling) and the temperature dependence is less certain.
 */
public enum Ion {
  /** Hydrogen ion. */
  H("H+", 1, 349.65, 838, Source.CRC),
  /** Hydroxide. */
  OH("OH-", -1, 198.0, 478, Source.CRC),
  /** Sodium. */
  NA("Na+", 1, 50.08, 75, Source.CRC),
  /** Potassium. */
  K("K+", 1, 73.48, 254, Source.CRC),
  /** Lithium. */
  LI("Li+", 1, 38.66, -14, Source.CRC),
  /** Ammonium. */
  NH4("NH4+", 1, 73.5, 203, Source.CRC),
  /** Chloride. */
  CL("Cl-", -1, 76.31, 216, Source.CRC),
  /** Sulfate (λ° per unit charge, ½SO₄²⁻). */
  SO4("SO4-2", -2, 80.0, -64.6, Source.CRC),
  /** Nitrate (CRC value as listed in the project's reference notes, there marked from memory). */
  NO3("NO3-", -1, 71.42, 104, Source.CRC_FROM_MEMORY),
  /** Bicarbonate. */
  HCO3("HCO3-", -1, 44.5, -250, Source.CRC),
  /** Carbonate (per unit charge, ½CO₃²⁻). */
  CO3("CO3-2", -2, 69.3, -91, Source.CRC),
  /** Acetate (no dw_T published: plain Walden). */
  ACETATE("CH3COO-", -1, 40.9, 0, Source.CRC),
  /** Formate (no dw_T published: plain Walden). */
  FORMATE("HCOO-", -1, 54.6, 0, Source.CRC),
  /** Dihydrogen phosphate (plain Walden). */
  H2PO4("H2PO4-", -1, 36.0, 0, Source.CRC),
  /** Hydrogen phosphate (per unit charge, plain Walden). */
  HPO4("HPO4-2", -2, 57.0, 0, Source.CRC),
  /** Phosphate (per unit charge, ⅓PO₄³⁻, plain Walden). */
  PO4("PO4-3", -3, 92.8, 0, Source.CRC),
  /** Dimethylammonium (CRC organic cations; plain Walden). */
  DIMETHYLAMMONIUM("(CH3)2NH2+", 1, 51.5, 0, Source.CRC),
  /** Morpholinium: estimate 37 ± 3 by analogy with piperidinium (37.2). */
  MORPHOLINIUM("MorH+", 1, 37.0, 0, Source.ESTIMATE),
  /** Ethanolammonium: estimate 41 ± 3 (ethylammonium 47.2 less a hydroxyl penalty). */
  ETHANOLAMMONIUM("EtaH+", 1, 41.0, 0, Source.ESTIMATE),
  /** Cyclohexylammonium: estimate 34 ± 3 (between piperidinium and dipropylammonium). */
  CYCLOHEXYLAMMONIUM("ChaH+", 1, 34.0, 0, Source.ESTIMATE),
  /** 3-Methoxypropylammonium: estimate 36 ± 3 (near isobutyl- and propylammonium). */
  METHOXYPROPYLAMMONIUM("MpaH+", 1, 36.0, 0, Source.ESTIMATE),
  /** Protonated 2-diethylaminoethanol: estimate 31 ± 3 (diethylammonium with hydroxyethyl). */
  DIETHYLAMINOETHANOLIUM("DeaeH+", 1, 31.0, 0, Source.ESTIMATE);

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

  /** The temperature parameters dw_T of the PHREEQC database. */
  public static final Reference PHREEQC =
      new Reference(
          "phreeqc.dat dw_T",
          "PHREEQC database phreeqc.dat (C.A.J. Appelo version), -dw parameters, and PHREEQC 3"
              + " function calc_SC",
          Reference.Confidence.RETRIEVED);

  private enum Source {
    CRC,
    CRC_FROM_MEMORY,
    ESTIMATE
  }

  private final String formula;
  private final int charge;
  private final double lambda25;
  private final double dwT;
  private final Source source;

  Ion(String formula, int charge, double lambda25, double dwT, Source source) {
    this.formula = formula;
    this.charge = charge;
    this.lambda25 = lambda25;
    this.dwT = dwT;
    this.source = source;
  }

  /** Formula as written in output, e.g. {@code "SO4-2"}. */
  public String formula() {
    return formula;
  }

  /** Charge number z. */
  public int charge() {
    return charge;
  }

  /** Limiting molar conductivity per unit charge at 25 °C, S cm² mol⁻¹. */
  public double lambda25() {
    return lambda25;
  }

  /** Temperature parameter dw_T of the Arrhenius-type correction, K (0 = plain Walden). */
  public double dwT() {
    return dwT;
  }

  /** Where λ° at 25 °C comes from. */
  public Reference lambdaSource() {
    return switch (source) {
      case CRC -> CRC;
      case CRC_FROM_MEMORY ->
          new Reference(CRC.id(), CRC.citation(), Reference.Confidence.FROM_MEMORY);
      case ESTIMATE -> AMINE_ESTIMATE;
    };
  }
}
