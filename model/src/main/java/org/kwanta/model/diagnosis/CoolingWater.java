package org.kwanta.model.diagnosis;

import org.kwanta.model.Reference;

/**
 * The cooling water a condenser leak would bring into the cycle, as the amounts of strong-acid
 * anions that arrive with each mole of sodium. After the cation exchanger of a cation-conductivity
 * analyser every cation has become H⁺, so a leak raises cation conductivity by the acids of these
 * anions while the sodium analyser sees only the sodium: the ratio of the two rises tells cooling
 * water from other causes.
 *
 * <p>Bromide is counted with chloride (both strong acids of almost equal conductivity); bicarbonate
 * is left out (carbonic acid is weak and is mostly removed by degassing).
 */
public enum CoolingWater {
  /**
   * Reference-Composition sea water: Cl⁻ 1.16398, Br⁻ 0.00180, SO₄²⁻ 0.06021 mol per mol Na⁺
   * (Millero et al. 2008, Deep-Sea Res. I 55, 50–72, Table 4; TEOS-10 Manual Table D.3).
   */
  SEA(1.16398 + 0.00180, 0.06021, "Millero et al. 2008 Reference Composition (TEOS-10 Table D.3)"),
  /**
   * Estuarine water: a mixture of sea and river water; above a salinity fraction of about 0.1 its
   * Cl/Na ratio is within 2 % of sea water, so the sea-water ratios are used (mixing-line model of
   * the project's reference notes; river end member Livingstone 1963).
   */
  BRACKISH(
      1.16398 + 0.00180,
      0.06021,
      "sea-water ratios (Millero et al. 2008); valid for salinity fraction above about 0.1"),
  /**
   * World-average river water, Livingstone 1963 (USGS Prof. Paper 440-G) as commonly quoted: Na⁺
   * 6.3, Cl⁻ 7.8, SO₄²⁻ 11.2 mg/L, i.e. Cl/Na 0.803 and SO₄/Na 0.425 mol/mol (values from memory —
   * verify; natural waters vary by a factor 3–10).
   */
  FRESH(0.803, 0.425, "Livingstone 1963 world-average river water (from memory — verify)"),
  /**
   * Hard fresh water after Baldwin 1948 (secondary: a handbook appendix): Na 0.021, Cl 0.041, SO₄
   * 0.025 g/L, i.e. Cl/Na 1.267 and SO₄/Na 0.285 mol/mol.
   */
  HARD_FRESH(1.267, 0.285, "Baldwin 1948 hard fresh water (secondary source)");

  private final double chloridePerSodium;
  private final double sulfatePerSodium;
  private final String source;

  CoolingWater(double chloridePerSodium, double sulfatePerSodium, String source) {
    this.chloridePerSodium = chloridePerSodium;
    this.sulfatePerSodium = sulfatePerSodium;
    this.source = source;
  }

  /** Chloride (with bromide) per sodium, mol/mol. */
  public double chloridePerSodium() {
    return chloridePerSodium;
  }

  /** Sulfate per sodium, mol/mol. */
  public double sulfatePerSodium() {
    return sulfatePerSodium;
  }

  /** Where the proportions come from. */
  public String source() {
    return source;
  }

  /** The reference behind the sea-water proportions. */
  public static final Reference MILLERO_2008 =
      new Reference(
          "Millero2008",
          "Millero, Feistel, Wright & McDougall, The composition of Standard Seawater and the"
              + " definition of the Reference-Composition Salinity Scale, Deep-Sea Research I 55"
              + " (2008) 50-72",
          Reference.Confidence.RETRIEVED);
}
