package org.kwanta.model.aqueous;

import java.util.List;
import org.kwanta.model.Reference;
import org.kwanta.model.Reference.Confidence;
import org.kwanta.model.ValidityRange;
import org.kwanta.model.aqueous.LogKFunction.Analytic;
import org.kwanta.model.aqueous.LogKFunction.DicksonBisulfate;
import org.kwanta.model.aqueous.LogKFunction.EdwardsAmmonia;
import org.kwanta.model.aqueous.LogKFunction.Harned;
import org.kwanta.model.aqueous.LogKFunction.MesmerBoricQ11;
import org.kwanta.model.aqueous.LogKFunction.Sum;
import org.kwanta.model.aqueous.LogKFunction.ThreeTerm;

/**
 * The catalogue of equilibrium constants: every fit the engine knows, as data. Coefficients are as
 * printed by the source; the direction of the printed reaction is kept and turned into the engine's
 * dissociation direction with {@link Sum}. Which fit is used by default, and which alternatives
 * exist, is decided in {@link ConstantSets}.
 *
 * <p>Database analytic form: log10 K = A1 + A2·T + A3/T + A4·log10 T + A5/T², T in K. The databases
 * are those distributed with PHREEQC (public repository usgs-coupled/phreeqc3, folder database):
 * llnl.dat (EQ3/6, SUPCRT92/HKF-based), llnl_organics.dat, phreeqc.dat, minteq.v4.dat (NIST46) and
 * Thermoddem V1.10 (BRGM).
 */
public final class EquilibriumConstants {

  private EquilibriumConstants() {}

  private static ValidityRange celsius(double minC, double maxC, Reference source) {
    return new ValidityRange("temperature", minC + 273.15, maxC + 273.15, "K", source);
  }

  // ---------------------------------------------------------------- references

  /** llnl.dat, the EQ3/6 database as distributed with PHREEQC. */
  public static final Reference LLNL =
      new Reference(
          "llnl.dat",
          "EQ3/6 thermodynamic database llnl.dat (SUPCRT92/HKF-based analytic fits, 0-300 °C),"
              + " as distributed with PHREEQC (usgs-coupled/phreeqc3, database/llnl.dat)",
          Confidence.RETRIEVED);

  /** llnl_organics.dat (Shock 1995 HKF organic acids) as distributed with PHREEQC. */
  public static final Reference LLNL_ORGANICS =
      new Reference(
          "llnl_organics.dat",
          "llnl_organics.dat (HKF-based, Shock 1995), as distributed with PHREEQC"
              + " (usgs-coupled/phreeqc3, database/llnl-organics/llnl_organics.dat)",
          Confidence.RETRIEVED);

  /** Thermoddem V1.10 (BRGM), PHREEQC format. */
  public static final Reference THERMODDEM =
      new Reference(
          "Thermoddem",
          "BRGM Thermoddem V1.10, PHREEQC_ThermoddemV1.10_15Dec2020.dat, as distributed with"
              + " PHREEQC (usgs-coupled/phreeqc3)",
          Confidence.RETRIEVED);

  /** Bates &amp; Pinching 1949, as stored in phreeqc.dat. */
  public static final Reference BATES_PINCHING_1949 =
      new Reference(
          "Bates-Pinching 1949",
          "R. G. Bates, G. D. Pinching, J. Res. Natl. Bur. Stand. 42 (1949) 419; coefficients as"
              + " stored in phreeqc.dat for NH4+ = NH3 + H+ (attribution from memory)",
          Confidence.RETRIEVED);

  /** Edwards, Maurer, Newman &amp; Prausnitz 1978. */
  public static final Reference EDWARDS_1978 =
      new Reference(
          "Edwards 1978",
          "T. J. Edwards, G. Maurer, J. Newman, J. M. Prausnitz, AIChE J. 24 (1978) 966, Table 1",
          Confidence.RETRIEVED);

  /** Plummer &amp; Busenberg 1982 (coefficients as stored in phreeqc.dat). */
  public static final Reference PLUMMER_BUSENBERG_1982 =
      new Reference(
          "Plummer-Busenberg 1982",
          "L. N. Plummer, E. Busenberg, Geochim. Cosmochim. Acta 46 (1982) 1011; coefficients as"
              + " stored in phreeqc.dat",
          Confidence.RETRIEVED);

  /** Dickson, Wesolowski, Palmer &amp; Mesmer 1990. */
  public static final Reference DICKSON_1990 =
      new Reference(
          "Dickson 1990",
          "A. G. Dickson, D. J. Wesolowski, D. A. Palmer, R. E. Mesmer, J. Phys. Chem. 94 (1990)"
              + " 7978 (NaCl media to 250 °C); expression as quoted by several public codes"
              + " (also Clegg, Rard & Pitzer 1994 eq. 21); attribution partly from memory",
          Confidence.RETRIEVED);

  /** Harned &amp; Ehlers 1933 (acetic acid), recalled. */
  public static final Reference HARNED_EHLERS_1933 =
      new Reference(
          "Harned-Ehlers 1933",
          "H. S. Harned, R. W. Ehlers, J. Am. Chem. Soc. 55 (1933) 652 (from memory)",
          Confidence.FROM_MEMORY);

  /** Harned &amp; Embree 1934 (formic acid), recalled. */
  public static final Reference HARNED_EMBREE_1934 =
      new Reference(
          "Harned-Embree 1934",
          "H. S. Harned, N. D. Embree, J. Am. Chem. Soc. 56 (1934) 1042 (from memory)",
          Confidence.FROM_MEMORY);

  /** Mesmer, Baes &amp; Sweeton 1972, boric acid Q11. */
  public static final Reference MESMER_1972 =
      new Reference(
          "Mesmer 1972",
          "R. E. Mesmer, C. F. Baes, F. H. Sweeton, Inorg. Chem. 11 (1972) 537, Table III p. 541"
              + " (log Q11 at I = 0); range to about 290 °C from memory",
          Confidence.RETRIEVED);

  /** Ridley et al. 2000, morpholine, 25 °C values and ΔCp. */
  public static final Reference RIDLEY_2000 =
      new Reference(
          "Ridley 2000",
          "M. K. Ridley, C. Xiao, D. A. Palmer, D. J. Wesolowski, J. Chem. Eng. Data 45 (2000)"
              + " 502 (abstract: log K, ΔH, ΔCp at 25 °C); constant-ΔCp extrapolation chosen by"
              + " the project's reference notes",
          Confidence.RETRIEVED);

  /** Bénézeth, Palmer &amp; Wesolowski 2001, dimethylamine 25 °C values. */
  public static final Reference BENEZETH_2001 =
      new Reference(
          "Benezeth 2001",
          "P. Bénézeth, D. A. Palmer, D. J. Wesolowski, J. Chem. Eng. Data (2001), dimethylamine"
              + " ionization 0-290 °C (abstract: 25 °C log K, ΔH, ΔCp)",
          Confidence.RETRIEVED);

  /** NIST46 critical constants via minteq.v4.dat. */
  public static final Reference NIST46 =
      new Reference(
          "NIST46",
          "NIST Critically Selected Stability Constants (NIST46) as stored in minteq.v4.dat"
              + " (usgs-coupled/phreeqc3)",
          Confidence.RETRIEVED);

  /** Ethanolamine: Bates &amp; Pinching 1951 and Goldberg 2002, recalled. */
  public static final Reference ETHANOLAMINE_RECALLED =
      new Reference(
          "ETA Bates-Pinching 1951",
          "R. G. Bates, G. D. Pinching, J. Res. NBS 46 (1951) 349 (log K, ΔH) and Goldberg et al."
              + " 2002 (ΔCp), all from memory",
          Confidence.FROM_MEMORY);

  /** Cyclohexylamine: 25 °C values recalled, ΔCp a class estimate. */
  public static final Reference CYCLOHEXYLAMINE_ESTIMATE =
      new Reference(
          "CHA estimate",
          "Cyclohexylamine log K and ΔH at 25 °C from memory; ΔCp +30 J/(K mol) estimated from"
              + " the primary-amine HKF class value",
          Confidence.ESTIMATED);

  /** 3-Methoxypropylamine: no source found; estimates. */
  public static final Reference METHOXYPROPYLAMINE_ESTIMATE =
      new Reference(
          "MPA estimate",
          "3-Methoxypropylamine log K at 25 °C from memory, unverified (±0.3); ΔH and ΔCp"
              + " estimated by analogy; no source found",
          Confidence.ESTIMATED);

  /** DEAE: 25 °C values recalled, ΔCp a class estimate. */
  public static final Reference DEAE_ESTIMATE =
      new Reference(
          "DEAE estimate",
          "2-Diethylaminoethanol log K and ΔH at 25 °C from memory (literature 9.75-9.87);"
              + " ΔCp +60 J/(K mol) estimated from the tertiary-alkanolamine class",
          Confidence.ESTIMATED);

  // ---------------------------------------------------------------- ammonia

  /**
   * llnl.dat, NH3 + H⁺ = NH4⁺ (association, as printed); 0-300 °C. The default (SUPCRT92/HKF with
   * Shock &amp; Helgeson 1988 and Shock et al. 1989 parameters).
   */
  public static final Fit AMMONIUM_LLNL =
      new Fit(
          "ammonium-1",
          Equilibrium.AMMONIUM,
          Sum.reverse(Analytic.of(-14.527, -5.0518e-3, 3044.7, 6.0865, 47.515)),
          LLNL,
          celsius(0, 300, LLNL));

  /** Thermoddem, NH3 + H⁺ = NH4⁺ (association, as printed); 0-300 °C. */
  public static final Fit AMMONIUM_THERMODDEM =
      new Fit(
          "ammonium-2",
          Equilibrium.AMMONIUM,
          Sum.reverse(Analytic.of(37.494408, -1.5452368e-3, -695.60062, -11.496355, 265549.9)),
          THERMODDEM,
          celsius(0, 300, THERMODDEM));

  /** Bates &amp; Pinching 1949, NH4⁺ = NH3 + H⁺ as stored in phreeqc.dat; 0-50 °C. */
  public static final Fit AMMONIUM_BATES_PINCHING =
      new Fit(
          "ammonium-3",
          Equilibrium.AMMONIUM,
          new Analytic(0.6322, -0.001225, -2835.76, 0, 0, 0),
          BATES_PINCHING_1949,
          celsius(0, 50, BATES_PINCHING_1949));

  /** Edwards et al. 1978 base constant with their own Kw; 0-225 °C. */
  public static final Fit AMMONIUM_EDWARDS =
      new Fit(
          "ammonium-4",
          Equilibrium.AMMONIUM,
          new EdwardsAmmonia(-3335.7, 1.4971, -0.0370566, 2.76, -13445.9, -22.4773, 140.932),
          EDWARDS_1978,
          celsius(0, 225, EDWARDS_1978));

  // ---------------------------------------------------------------- amines (three-term)

  /** Morpholine, log K(25 °C) −8.491, ΔH 39 kJ/mol, ΔCp +40 J/(K mol); 0-300 °C. */
  public static final Fit MORPHOLINIUM_RIDLEY =
      new Fit(
          "morpholinium-1",
          Equilibrium.ofWeakBase(Component.MORPHOLINE),
          new ThreeTerm(-8.491, 39_000, 40),
          RIDLEY_2000,
          celsius(0, 300, RIDLEY_2000));

  /** Morpholine with ΔCp = 0 (lower bound); 0-300 °C. */
  public static final Fit MORPHOLINIUM_ZERO_CP =
      new Fit(
          "morpholinium-2",
          Equilibrium.ofWeakBase(Component.MORPHOLINE),
          new ThreeTerm(-8.491, 39_000, 0),
          RIDLEY_2000,
          celsius(0, 300, RIDLEY_2000));

  /** Ethanolamine, −9.498, ΔH 50.5 kJ/mol, ΔCp +26 J/(K mol) [M]; 0-300 °C. */
  public static final Fit ETHANOLAMMONIUM_RECOMMENDED =
      new Fit(
          "ethanolammonium-1",
          Equilibrium.ofWeakBase(Component.ETHANOLAMINE),
          new ThreeTerm(-9.498, 50_500, 26),
          ETHANOLAMINE_RECALLED,
          celsius(0, 300, ETHANOLAMINE_RECALLED));

  /** Ethanolamine with ΔCp = 0 (lower bound) [M]; 0-300 °C. */
  public static final Fit ETHANOLAMMONIUM_ZERO_CP =
      new Fit(
          "ethanolammonium-2",
          Equilibrium.ofWeakBase(Component.ETHANOLAMINE),
          new ThreeTerm(-9.498, 50_500, 0),
          ETHANOLAMINE_RECALLED,
          celsius(0, 300, ETHANOLAMINE_RECALLED));

  /** Cyclohexylamine, −10.64 [M], ΔH 54.6 kJ/mol [M], ΔCp +30 [E]; 0-300 °C. */
  public static final Fit CYCLOHEXYLAMMONIUM_ESTIMATE =
      new Fit(
          "cyclohexylammonium-1",
          Equilibrium.ofWeakBase(Component.CYCLOHEXYLAMINE),
          new ThreeTerm(-10.64, 54_600, 30),
          CYCLOHEXYLAMINE_ESTIMATE,
          celsius(0, 300, CYCLOHEXYLAMINE_ESTIMATE));

  /** Dimethylamine, Bénézeth 2001: −10.77, ΔH 50.8 kJ/mol, ΔCp +116 J/(K mol); 0-290 °C. */
  public static final Fit DIMETHYLAMMONIUM_BENEZETH =
      new Fit(
          "dimethylammonium-1",
          Equilibrium.ofWeakBase(Component.DIMETHYLAMINE),
          new ThreeTerm(-10.77, 50_800, 116),
          BENEZETH_2001,
          celsius(0, 290, BENEZETH_2001));

  /**
   * Dimethylamine, NIST46 protonation log K 10.774 and ΔH −50.208 kJ/mol, reversed, ΔCp = 0 (the
   * old row, 1.1 too low at 300 °C); range stated as 25 °C data only, so any other temperature is
   * flagged.
   */
  public static final Fit DIMETHYLAMMONIUM_NIST46_ZERO_CP =
      new Fit(
          "dimethylammonium-2",
          Equilibrium.ofWeakBase(Component.DIMETHYLAMINE),
          new ThreeTerm(-10.774, 50_208, 0),
          NIST46,
          celsius(25, 25, NIST46));

  /** 3-Methoxypropylamine, −10.4 [M, unverified], ΔH 55 [E], ΔCp +30 [E]; 25 °C only. */
  public static final Fit METHOXYPROPYLAMMONIUM_ESTIMATE =
      new Fit(
          "methoxypropylammonium-1",
          Equilibrium.ofWeakBase(Component.METHOXYPROPYLAMINE),
          new ThreeTerm(-10.4, 55_000, 30),
          METHOXYPROPYLAMINE_ESTIMATE,
          celsius(25, 25, METHOXYPROPYLAMINE_ESTIMATE));

  /** DEAE, −9.8 [M], ΔH 44.6 [M], ΔCp +60 [E]; 0-300 °C. */
  public static final Fit DIETHYLAMINOETHANOLIUM_ESTIMATE =
      new Fit(
          "diethylaminoethanolium-1",
          Equilibrium.ofWeakBase(Component.DIETHYLAMINOETHANOL),
          new ThreeTerm(-9.8, 44_600, 60),
          DEAE_ESTIMATE,
          celsius(0, 300, DEAE_ESTIMATE));

  // ---------------------------------------------------------------- bisulfate

  /** Dickson et al. 1990, HSO4⁻ = SO4²⁻ + H⁺; 0-250 °C. */
  public static final Fit BISULFATE_DICKSON =
      new Fit(
          "bisulfate-1",
          Equilibrium.BISULFATE,
          new DicksonBisulfate(562.69486, -102.5154, -1.117033e-4, 0.2477538, -13273.75),
          DICKSON_1990,
          celsius(0, 250, DICKSON_1990));

  /** llnl.dat, SO4²⁻ + H⁺ = HSO4⁻ (association, as printed); 0-300 °C. */
  public static final Fit BISULFATE_LLNL =
      new Fit(
          "bisulfate-2",
          Equilibrium.BISULFATE,
          Sum.reverse(Analytic.of(49.619, 3.0368e-2, -1155.8, -21.335, -18.051)),
          LLNL,
          celsius(0, 300, LLNL));

  // ---------------------------------------------------------------- carbonic acid

  /** Plummer &amp; Busenberg 1982 K1, CO2(aq) + H2O = HCO3⁻ + H⁺; 0-250 °C. */
  public static final Fit CARBONIC_FIRST_PLUMMER_BUSENBERG =
      new Fit(
          "carbonic-first-1",
          Equilibrium.CARBONIC_FIRST,
          Analytic.of(-356.3094, -0.06091964, 21834.37, 126.8339, -1684915),
          PLUMMER_BUSENBERG_1982,
          celsius(0, 250, PLUMMER_BUSENBERG_1982));

  /** Plummer &amp; Busenberg 1982 K2, HCO3⁻ = CO3²⁻ + H⁺; 0-250 °C. */
  public static final Fit CARBONIC_SECOND_PLUMMER_BUSENBERG =
      new Fit(
          "carbonic-second-1",
          Equilibrium.CARBONIC_SECOND,
          Analytic.of(-107.8871, -0.03252849, 5151.79, 38.92561, -563713.9),
          PLUMMER_BUSENBERG_1982,
          celsius(0, 250, PLUMMER_BUSENBERG_1982));

  /** llnl.dat K1 from HCO3⁻ + H⁺ = CO2 + H2O (association, as printed); 0-300 °C. */
  public static final Fit CARBONIC_FIRST_LLNL =
      new Fit(
          "carbonic-first-2",
          Equilibrium.CARBONIC_FIRST,
          Sum.reverse(Analytic.of(-10.534, 0.021746, 2521.6, 0.79125, 39.351)),
          LLNL,
          celsius(0, 300, LLNL));

  /** llnl.dat K2, HCO3⁻ = CO3²⁻ + H⁺ (as printed); 0-300 °C. */
  public static final Fit CARBONIC_SECOND_LLNL =
      new Fit(
          "carbonic-second-2",
          Equilibrium.CARBONIC_SECOND,
          Analytic.of(-69.958, -0.033526, -70.846, 28.224, -1.0849),
          LLNL,
          celsius(0, 300, LLNL));

  // ---------------------------------------------------------------- phosphoric acid

  /** llnl.dat HPO4²⁻ + H⁺ = H2PO4⁻, as printed. */
  private static final Analytic LLNL_H2PO4_FORMATION =
      Analytic.of(82.149, 0.034077, -1043.1, -32.97, -16.301);

  /** llnl.dat HPO4²⁻ + 2H⁺ = H3PO4, as printed. */
  private static final Analytic LLNL_H3PO4_FORMATION =
      Analytic.of(183.8, 0.06732, -3779.2, -73.463, -59.025);

  /** llnl.dat K1 = log K(HPO4²⁻ + H⁺ = H2PO4⁻) − log K(HPO4²⁻ + 2H⁺ = H3PO4); 0-300 °C. */
  public static final Fit PHOSPHORIC_FIRST_LLNL =
      new Fit(
          "phosphoric-first-1",
          Equilibrium.PHOSPHORIC_FIRST,
          Sum.difference(LLNL_H2PO4_FORMATION, LLNL_H3PO4_FORMATION),
          LLNL,
          celsius(0, 300, LLNL));

  /** llnl.dat K2, the reverse of HPO4²⁻ + H⁺ = H2PO4⁻; 0-300 °C. */
  public static final Fit PHOSPHORIC_SECOND_LLNL =
      new Fit(
          "phosphoric-second-1",
          Equilibrium.PHOSPHORIC_SECOND,
          Sum.reverse(LLNL_H2PO4_FORMATION),
          LLNL,
          celsius(0, 300, LLNL));

  /** llnl.dat K3, HPO4²⁻ = PO4³⁻ + H⁺ (as printed); 0-300 °C. */
  public static final Fit PHOSPHORIC_THIRD_LLNL =
      new Fit(
          "phosphoric-third-1",
          Equilibrium.PHOSPHORIC_THIRD,
          Analytic.of(-76.17, -0.033574, 134.05, 29.658, 2.114),
          LLNL,
          celsius(0, 300, LLNL));

  /** Thermoddem H2PO4⁻ = HPO4²⁻ + H⁺, as printed. */
  private static final Analytic THERMODDEM_H2PO4_TO_HPO4 =
      Analytic.of(-746.6061, -0.12024182, 40983.107, 269.25857, -2531389.3);

  /** Thermoddem K1, the reverse of H2PO4⁻ + H⁺ = H3PO4; 0-300 °C. */
  public static final Fit PHOSPHORIC_FIRST_THERMODDEM =
      new Fit(
          "phosphoric-first-2",
          Equilibrium.PHOSPHORIC_FIRST,
          Sum.reverse(Analytic.of(710.25502, 0.11203519, -39337.065, -256.90201, 2320664.1)),
          THERMODDEM,
          celsius(0, 300, THERMODDEM));

  /** Thermoddem K2, H2PO4⁻ = HPO4²⁻ + H⁺ (as printed); 0-300 °C. */
  public static final Fit PHOSPHORIC_SECOND_THERMODDEM =
      new Fit(
          "phosphoric-second-2",
          Equilibrium.PHOSPHORIC_SECOND,
          THERMODDEM_H2PO4_TO_HPO4,
          THERMODDEM,
          celsius(0, 300, THERMODDEM));

  /** Thermoddem K3 = log K(H2PO4⁻ = PO4³⁻ + 2H⁺) − log K(H2PO4⁻ = HPO4²⁻ + H⁺); 0-300 °C. */
  public static final Fit PHOSPHORIC_THIRD_THERMODDEM =
      new Fit(
          "phosphoric-third-2",
          Equilibrium.PHOSPHORIC_THIRD,
          Sum.difference(
              Analytic.of(-1484.1595, -0.240379, 81179.531, 534.08042, -5116368.6),
              THERMODDEM_H2PO4_TO_HPO4),
          THERMODDEM,
          celsius(0, 300, THERMODDEM));

  // ---------------------------------------------------------------- organic acids

  /** Harned &amp; Ehlers 1933 acetic acid [M]; 0-60 °C. */
  public static final Fit ACETIC_HARNED =
      new Fit(
          "acetic-1",
          Equilibrium.ACETIC,
          new Harned(-1170.48, 3.1649, -0.013399),
          HARNED_EHLERS_1933,
          celsius(0, 60, HARNED_EHLERS_1933));

  /** llnl.dat HAcetate = Acetate⁻ + H⁺ (as printed); 0-300 °C. */
  public static final Fit ACETIC_LLNL =
      new Fit(
          "acetic-2",
          Equilibrium.ACETIC,
          Analytic.of(-96.597, -0.034535, 1975.3, 38.593, 30.85),
          LLNL,
          celsius(0, 300, LLNL));

  /** Harned &amp; Embree 1934 formic acid [M]; 0-60 °C. */
  public static final Fit FORMIC_HARNED =
      new Fit(
          "formic-1",
          Equilibrium.FORMIC,
          new Harned(-1342.85, 5.2743, -0.015168),
          HARNED_EMBREE_1934,
          celsius(0, 60, HARNED_EMBREE_1934));

  /** llnl_organics.dat HCOOH = HCOO⁻ + H⁺ (as printed); 0-300 °C. */
  public static final Fit FORMIC_LLNL =
      new Fit(
          "formic-2",
          Equilibrium.FORMIC,
          Analytic.of(-94.187, -0.034616, 1891.8, 38.145, 29.547),
          LLNL_ORGANICS,
          celsius(0, 300, LLNL_ORGANICS));

  // ---------------------------------------------------------------- boric acid

  /**
   * Mesmer, Baes &amp; Sweeton 1972 log Q11 at I = 0 (B(OH)3 + OH⁻ = B(OH)4⁻), as the acid constant
   * log Ka = log K11 − pKw with pKw of the water state in use; 0-290 °C.
   */
  public static final Fit BORIC_MESMER =
      new Fit(
          "boric-1",
          Equilibrium.BORIC,
          new MesmerBoricQ11(1573.21, 28.6059, 0.012078, -13.2258),
          MESMER_1972,
          celsius(0, 290, MESMER_1972));

  /** Every fit in the catalogue. */
  public static List<Fit> all() {
    return List.of(
        AMMONIUM_LLNL,
        AMMONIUM_THERMODDEM,
        AMMONIUM_BATES_PINCHING,
        AMMONIUM_EDWARDS,
        MORPHOLINIUM_RIDLEY,
        MORPHOLINIUM_ZERO_CP,
        ETHANOLAMMONIUM_RECOMMENDED,
        ETHANOLAMMONIUM_ZERO_CP,
        CYCLOHEXYLAMMONIUM_ESTIMATE,
        DIMETHYLAMMONIUM_BENEZETH,
        DIMETHYLAMMONIUM_NIST46_ZERO_CP,
        METHOXYPROPYLAMMONIUM_ESTIMATE,
        DIETHYLAMINOETHANOLIUM_ESTIMATE,
        BISULFATE_DICKSON,
        BISULFATE_LLNL,
        CARBONIC_FIRST_PLUMMER_BUSENBERG,
        CARBONIC_SECOND_PLUMMER_BUSENBERG,
        CARBONIC_FIRST_LLNL,
        CARBONIC_SECOND_LLNL,
        PHOSPHORIC_FIRST_LLNL,
        PHOSPHORIC_SECOND_LLNL,
        PHOSPHORIC_THIRD_LLNL,
        PHOSPHORIC_FIRST_THERMODDEM,
        PHOSPHORIC_SECOND_THERMODDEM,
        PHOSPHORIC_THIRD_THERMODDEM,
        ACETIC_HARNED,
        ACETIC_LLNL,
        FORMIC_HARNED,
        FORMIC_LLNL,
        BORIC_MESMER);
  }

  /** The fit with a given {@link Fit#id()}. */
  public static Fit byId(String id) {
    for (Fit fit : all()) {
      if (fit.id().equals(id)) {
        return fit;
      }
    }
    throw new IllegalArgumentException("no equilibrium-constant fit with id " + id);
  }
}
