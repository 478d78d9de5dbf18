package org.kwanta.model.aqueous;

import org.kwanta.model.Reference;
import org.kwanta.model.Reference.Confidence;
import org.kwanta.model.ValidityRange;
import org.kwanta.model.aqueous.LogKFunction.Analytic;

/**
 * Association constants of sodium ion pairs on the saturation curve, molal, I = 0, from the
 * analytic fits of two open databases (log10 K = A1 + A2·T + A3/T + A4·log10 T + A5/T², T in K):
 *
 * <ul>
 *   <li>NaOH°: Na⁺ + OH⁻ ⇌ NaOH°, from llnl.dat's Na⁺ + H₂O ⇌ NaOH + H⁺ minus llnl.dat's own log Kw
 *       (SUPCRT92/HKF data, Pokrovskii &amp; Helgeson lineage);
 *   <li>NaCl°: Na⁺ + Cl⁻ ⇌ NaCl°, llnl.dat;
 *   <li>NaSO₄⁻: Na⁺ + SO₄²⁻ ⇌ NaSO₄⁻, Thermoddem V1.10 (data key "95pok/sch");
 *   <li>NaHPO₄⁻: Na⁺ + HPO₄²⁻ ⇌ NaHPO₄⁻, Thermoddem V1.10's Na⁺ + H₂PO₄⁻ ⇌ NaHPO₄⁻ + H⁺ (data key
 *       "97smi/mar") less the same file's H₂PO₄⁻ ⇌ HPO₄²⁻ + H⁺ (log K at 25 °C −6.340 − (−7.212) =
 *       0.872); <b>not carried by default</b> (see below).
 * </ul>
 *
 * <p>Databases: usgs-coupled/phreeqc3, database/llnl.dat and
 * database/PHREEQC_ThermoddemV1.10_15Dec2020.dat, commit 8176af0c, as transcribed in the project's
 * reference notes (steam-seawater-and-high-temperature.md §5.1). Validity: the fits' 0-300 °C
 * ({@link #VALIDITY_LLNL}, {@link #VALIDITY_THERMODDEM}); outside it the engine still evaluates
 * them and marks them extrapolated. Confidence per the notes: NaOH° and NaCl° medium (±0.2 in log K
 * at 300 °C; llnl and Thermoddem agree within 0.12 for NaOH°), NaSO₄⁻ medium.
 *
 * <p>NaHPO₄⁻ is low confidence above about 100 °C and therefore opt-in ({@link
 * SpeciationOptions#DEFAULT_ASSOCIATIONS} leaves it out): the only temperature function found in
 * the open databases is Thermoddem's, whose record cites a 25 °C log K and enthalpy (34.94 kJ/mol,
 * Smith &amp; Martell's critical compilation, key "97smi/mar") with the entropy an "internal
 * calculation" and a default volume and no heat-capacity source, so its temperature dependence is
 * an extrapolation from 25 °C data; it gives log K 2.19 at 100 °C and 5.87 at 300 °C, three units
 * above NaSO₄⁻ (2.79), more pairing than any measured 1:2 sodium pair. llnl.dat carries NaHPO₄⁻
 * (log K 0.92, Na⁺ + HPO₄²⁻) at 25 °C only, with "not possible to calculate enthalpy of reaction";
 * Thermoddem's NaH₂PO₄° (log K 0.410) and NaPO₄²⁻ (−18.070 for Na⁺ + H₂PO₄⁻ ⇌ NaPO₄²⁻ + 2 H⁺) are
 * 25 °C values with no temperature function and are not carried. No high-temperature measurement of
 * sodium–phosphate pairing was found.
 */
final class SodiumIonPairs {

  private SodiumIonPairs() {}

  /** llnl.dat, the EQ3/6 database (SUPCRT92/HKF analytic fits). */
  static final Reference LLNL =
      new Reference(
          "llnl.dat ion pairs",
          "EQ3/6 database llnl.dat (SUPCRT92/HKF analytic fits, 0-300 °C), usgs-coupled/phreeqc3"
              + " database/llnl.dat: NaOH (Na+ + H2O = NaOH + H+, minus the file's log Kw) and"
              + " NaCl (Na+ + Cl- = NaCl); medium confidence, ±0.2 in log K at 300 °C",
          Confidence.RETRIEVED);

  /** Thermoddem V1.10. */
  static final Reference THERMODDEM =
      new Reference(
          "Thermoddem NaSO4-",
          "BRGM Thermoddem V1.10 (PHREEQC_ThermoddemV1.10_15Dec2020.dat, usgs-coupled/phreeqc3):"
              + " Na+ + SO4-2 = NaSO4- (data key 95pok/sch, Pokrovski, Schott et al. 1995 — key"
              + " decoded from memory); medium confidence",
          Confidence.RETRIEVED);

  /** Thermoddem V1.10, NaHPO₄⁻ (low confidence above about 100 °C; opt-in). */
  static final Reference THERMODDEM_PHOSPHATE =
      new Reference(
          "Thermoddem NaHPO4-",
          "BRGM Thermoddem V1.10 (PHREEQC_ThermoddemV1.10_15Dec2020.dat, usgs-coupled/phreeqc3):"
              + " Na+ + H2PO4- = NaHPO4- + H+ (log_k -6.340, delta_h 34.940 kJ/mol, data key"
              + " 97smi/mar, Smith & Martell critical stability constants - key decoded from"
              + " memory; S internal calculation, V default) less H2PO4- = HPO4-2 + H+ (log_k"
              + " -7.212, 89cox/wag); temperature dependence extrapolated from 25 °C data: low"
              + " confidence above about 100 °C",
          Confidence.ESTIMATED);

  /** The llnl.dat fits' range, K (0-300 °C). */
  static final ValidityRange VALIDITY_LLNL =
      new ValidityRange("temperature", 273.15, 573.15, "K", LLNL);

  /** The Thermoddem fit's range, K (0-300 °C). */
  static final ValidityRange VALIDITY_THERMODDEM =
      new ValidityRange("temperature", 273.15, 573.15, "K", THERMODDEM);

  /**
   * The range in which Thermoddem's NaHPO₄⁻ function rests on its 25 °C data, K (0-100 °C): beyond
   * it the value is marked extrapolated.
   */
  static final ValidityRange VALIDITY_THERMODDEM_PHOSPHATE =
      new ValidityRange("temperature", 273.15, 373.15, "K", THERMODDEM_PHOSPHATE);

  /** llnl.dat, Na⁺ + H₂O ⇌ NaOH + H⁺, A1..A5 as printed. */
  static final Analytic LLNL_NAOH_HYDROLYSIS =
      Analytic.of(8.7326e1, 2.3555e-2, -5.477e3, -3.6678e1, -8.5489e1);

  /** llnl.dat, H₂O ⇌ OH⁻ + H⁺, A1..A5 as printed. */
  static final Analytic LLNL_WATER =
      Analytic.of(-6.7506e1, -3.0619e-2, -1.9901e3, 2.8004e1, -3.1033e1);

  /** llnl.dat, Na⁺ + Cl⁻ ⇌ NaCl°, A1..A5 as printed. */
  static final Analytic LLNL_NACL =
      Analytic.of(1.1398e2, 3.6386e-2, -3.0847e3, -4.6571e1, -4.8167e1);

  /** Thermoddem, Na⁺ + SO₄²⁻ ⇌ NaSO₄⁻, A1..A5 as printed. */
  static final Analytic THERMODDEM_NASO4 =
      Analytic.of(9.358708e2, 1.4438495e-1, -5.3022649e4, -3.3839614e2, 3.3063776e6);

  /** Thermoddem, Na⁺ + H₂PO₄⁻ ⇌ NaHPO₄⁻ + H⁺, A1..A5 as printed. */
  static final Analytic THERMODDEM_NAHPO4_FORMATION =
      Analytic.of(8.9613811e2, 1.3295816e-1, -5.061644e4, -3.2469905e2, 2.7641778e6);

  /** Thermoddem, H₂PO₄⁻ ⇌ HPO₄²⁻ + H⁺, A1..A5 as printed. */
  static final Analytic THERMODDEM_DIHYDROGEN_PHOSPHATE =
      Analytic.of(-7.466061e2, -1.2024182e-1, 4.0983107e4, 2.6925857e2, -2.5313893e6);

  /** Na⁺ + HPO₄²⁻ ⇌ NaHPO₄⁻: the printed formation less the same file's second phosphoric step. */
  static final LogKFunction NAHPO4 =
      LogKFunction.Sum.difference(THERMODDEM_NAHPO4_FORMATION, THERMODDEM_DIHYDROGEN_PHOSPHATE);

  /** Na⁺ + OH⁻ ⇌ NaOH°: the printed hydrolysis less the same file's water constant. */
  static final LogKFunction NAOH = LogKFunction.Sum.difference(LLNL_NAOH_HYDROLYSIS, LLNL_WATER);
}
