package org.kwanta.model.conductivity;

/**
 * Volatile alkalizing agents (weak bases B, protonated to BH⁺) and the ion each forms. Molar
 * masses, g/mol, from IUPAC standard atomic weights (C 12.011, H 1.008, N 14.007, O 15.999).
 */
public enum Alkalizer {
  /** Ammonia, NH₃. */
  AMMONIA(Ion.NH4, 17.031),
  /** Morpholine, C₄H₉NO. */
  MORPHOLINE(Ion.MORPHOLINIUM, 87.122),
  /** Ethanolamine (ETA), C₂H₇NO. */
  ETHANOLAMINE(Ion.ETHANOLAMMONIUM, 61.084),
  /** Dimethylamine, C₂H₇N. */
  DIMETHYLAMINE(Ion.DIMETHYLAMMONIUM, 45.085),
  /** Cyclohexylamine, C₆H₁₃N. */
  CYCLOHEXYLAMINE(Ion.CYCLOHEXYLAMMONIUM, 99.177),
  /** 3-Methoxypropylamine (MPA), C₄H₁₁NO. */
  METHOXYPROPYLAMINE(Ion.METHOXYPROPYLAMMONIUM, 89.138),
  /** 2-Diethylaminoethanol (DEAE), C₆H₁₅NO. */
  DIETHYLAMINOETHANOL(Ion.DIETHYLAMINOETHANOLIUM, 117.192);

  private final Ion cation;
  private final double molarMassGPerMol;

  Alkalizer(Ion cation, double molarMassGPerMol) {
    this.cation = cation;
    this.molarMassGPerMol = molarMassGPerMol;
  }

  /** The protonated form BH⁺. */
  public Ion cation() {
    return cation;
  }

  /** Molar mass of the free base, g/mol. */
  public double molarMassGPerMol() {
    return molarMassGPerMol;
  }
}
