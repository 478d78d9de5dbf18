package org.kwanta.model.water;

import org.kwanta.model.Reference;
import org.kwanta.model.ValidityRange;

/**
 * Vapour–liquid distribution constants K_D (steam over liquid, neutral molecule) of the
 * neutralizing amines on the saturation line: order-of-magnitude <b>estimates</b>, not a published
 * correlation.
 *
 * <p>No K_D(T) correlation or data table for morpholine, ethanolamine, cyclohexylamine,
 * dimethylamine, 3-methoxypropylamine or 2-diethylaminoethanol could be retrieved (searched: IAPWS
 * guidance, the EPRI amine measurements of Cobble and Turner, the open literature, the open
 * geochemical databases; searched again in December 2026 with the same result; the shared notes
 * §1.5 record the same). What was retrieved is qualitative: P. V. Balakrishnan, <i>Volatility of
 * morpholine and cyclohexylamine</i>, Can. J. Chem. 56 (1978) 2620 (abstract, 150–300 °C):
 * cyclohexylamine strongly prefers the steam; morpholine's volatility is close to that of water and
 * it forms a maximum-pressure azeotrope with water (K_D &gt; 1) only above 175 °C. The numbers
 * below are indicative magnitudes recalled from memory (from memory — verify), shaped to that
 * abstract, to the ordering cyclohexylamine &gt; dimethylamine ≈ diethylaminoethanol &gt;
 * methoxypropylamine ≈ morpholine &gt; ethanolamine, and to K_D → 1 toward the critical temperature
 * (both phases become one):
 *
 * <pre>
 *   t / °C              100    150    200    250    300    350
 *   morpholine          0.40   0.75   1.25   1.5    1.5    1.3
 *   ethanolamine        0.05   0.08   0.13   0.22   0.35   0.6
 *   cyclohexylamine     10     7.5    5.5    4.0    3.0    2.0
 *   dimethylamine       15     10     6.5    4.5    3.0    1.8
 *   methoxypropylamine  0.8    1.0    1.1    1.15   1.15   1.1
 *   diethylaminoethanol 2.0    2.2    2.2    2.0    1.8    1.4
 * </pre>
 *
 * log10 K_D is interpolated linearly in 1/T between the rows, and extrapolated from the end segment
 * below 100 °C.
 *
 * <p>Confidence: {@link Reference.Confidence#ESTIMATED}; {@link #relativeUncertainty} is 1.0 (a
 * factor of about two) in {@link #VALIDITY}, 150–300 °C, the range the indicative magnitudes speak
 * for, growing by 0.1 per 10 K beyond it, where the value is marked extrapolated. Replace a row by
 * its primary data as soon as they are at hand. Units: K; K_D dimensionless.
 */
final class AmineDistribution {

  /** The estimate, with its one retrieved qualitative anchor. */
  static final Reference REFERENCE =
      new Reference(
          "amine K_D estimate (from memory - verify)",
          "Indicative K_D of neutralizing amines recalled from memory, not a published"
              + " correlation (from memory - verify); shaped to P. V. Balakrishnan, Volatility of"
              + " morpholine and cyclohexylamine, Can. J. Chem. 56 (1978) 2620 (abstract:"
              + " morpholine-water azeotrope only above 175 °C) and to K_D -> 1 at Tc",
          Reference.Confidence.ESTIMATED);

  /** The range the indicative magnitudes speak for, 150–300 °C, K. */
  static final ValidityRange VALIDITY =
      new ValidityRange("temperature", 423.15, 573.15, "K", REFERENCE);

  /** Relative standard uncertainty taken inside {@link #VALIDITY} (a factor of about two). */
  static final double RELATIVE_UNCERTAINTY = 1.0;

  /** Row temperatures of the table, °C. */
  static final double[] T_CELSIUS = {100, 150, 200, 250, 300, 350};

  /** K_D of morpholine at {@link #T_CELSIUS} (from memory — verify). */
  static final double[] MORPHOLINE = {0.40, 0.75, 1.25, 1.5, 1.5, 1.3};

  /** K_D of ethanolamine at {@link #T_CELSIUS} (from memory — verify). */
  static final double[] ETHANOLAMINE = {0.05, 0.08, 0.13, 0.22, 0.35, 0.6};

  /** K_D of cyclohexylamine at {@link #T_CELSIUS} (from memory — verify). */
  static final double[] CYCLOHEXYLAMINE = {10, 7.5, 5.5, 4.0, 3.0, 2.0};

  /** K_D of dimethylamine at {@link #T_CELSIUS} (from memory — verify). */
  static final double[] DIMETHYLAMINE = {15, 10, 6.5, 4.5, 3.0, 1.8};

  /** K_D of 3-methoxypropylamine at {@link #T_CELSIUS} (from memory — verify). */
  static final double[] METHOXYPROPYLAMINE = {0.8, 1.0, 1.1, 1.15, 1.15, 1.1};

  /** K_D of 2-diethylaminoethanol at {@link #T_CELSIUS} (from memory — verify). */
  static final double[] DIETHYLAMINOETHANOL = {2.0, 2.2, 2.2, 2.0, 1.8, 1.4};

  private AmineDistribution() {}

  /** The table row of an amine. */
  static double[] row(VolatileSolute amine) {
    return switch (amine) {
      case MORPHOLINE -> MORPHOLINE;
      case ETHANOLAMINE -> ETHANOLAMINE;
      case CYCLOHEXYLAMINE -> CYCLOHEXYLAMINE;
      case DIMETHYLAMINE -> DIMETHYLAMINE;
      case METHOXYPROPYLAMINE -> METHOXYPROPYLAMINE;
      case DIETHYLAMINOETHANOL -> DIETHYLAMINOETHANOL;
      case AMMONIA, CARBON_DIOXIDE ->
          throw new IllegalArgumentException(amine + " is not an amine of this table");
    };
  }

  /**
   * K_D without range check: log10 K_D linear in 1/T between the rows, extrapolated from the end
   * segment outside them.
   *
   * @param amine one of the six amines
   * @param t T, K
   * @return K_D, dimensionless; NaN for NaN
   */
  static double kD(VolatileSolute amine, double t) {
    double[] k = row(amine);
    int i = 0;
    while (i < T_CELSIUS.length - 2 && t > T_CELSIUS[i + 1] + 273.15) {
      i++;
    }
    double x0 = 1 / (T_CELSIUS[i] + 273.15);
    double x1 = 1 / (T_CELSIUS[i + 1] + 273.15);
    double y0 = Math.log10(k[i]);
    double y1 = Math.log10(k[i + 1]);
    return Math.pow(10, y0 + (y1 - y0) * (1 / t - x0) / (x1 - x0));
  }

  /** The relative standard uncertainty taken for K_D at T (see class comment). */
  static double relativeUncertainty(double t) {
    double beyond = Math.max(VALIDITY.min() - t, t - VALIDITY.max());
    return beyond > 0 ? RELATIVE_UNCERTAINTY + 0.1 * beyond / 10 : RELATIVE_UNCERTAINTY;
  }
}
