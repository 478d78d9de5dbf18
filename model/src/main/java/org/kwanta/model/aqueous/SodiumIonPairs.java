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
 *   <li>NaSO₄⁻: Na⁺ + SO₄²⁻ ⇌ NaSO₄⁻, Thermoddem V1.10 (data key "95pok/sch").
 * </ul>
 *
 * <p>Databases: usgs-coupled/phreeqc3, database/llnl.dat and
 * database/PHREEQC_ThermoddemV1.10_15Dec2020.dat, commit 8176af0c, as transcribed in the project's
 * reference notes (steam-seawater-and-high-temperature.md §5.1). Validity: the fits' 0-300 °C
 * ({@link #VALIDITY_LLNL}, {@link #VALIDITY_THERMODDEM}); outside it the engine still evaluates
 * them and marks them extrapolated. Confidence per the notes: NaOH° and NaCl° medium (±0.2 in log K
 * at 300 °C; llnl and Thermoddem agree within 0.12 for NaOH°), NaSO₄⁻ medium. NaHPO₄⁻ is not
 * carried: the only temperature function found (Thermoddem) is derived from a 25 °C enthalpy with
 * default heat capacity and implies more pairing at 300 °C than any measured 1:2 sodium pair.
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

  /** The llnl.dat fits' range, K (0-300 °C). */
  static final ValidityRange VALIDITY_LLNL =
      new ValidityRange("temperature", 273.15, 573.15, "K", LLNL);

  /** The Thermoddem fit's range, K (0-300 °C). */
  static final ValidityRange VALIDITY_THERMODDEM =
      new ValidityRange("temperature", 273.15, 573.15, "K", THERMODDEM);

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

  /** Na⁺ + OH⁻ ⇌ NaOH°: the printed hydrolysis less the same file's water constant. */
  static final LogKFunction NAOH = LogKFunction.Sum.difference(LLNL_NAOH_HYDROLYSIS, LLNL_WATER);
}
