package org.kwanta.model.aqueous;

import java.util.Map;
import org.kwanta.model.Reference.Confidence;

/**
 * The stated standard uncertainty of log10 Ka for a constant that is an estimate or is evaluated
 * beyond its fit's stated range: part (c) of the itemised pH uncertainty ({@link PhUncertainty}).
 * Fits taken from a retrieved source and used inside their stated range have none here: their doubt
 * is the spread over the published constant sets, part (b). The one exception is a retrieved fit
 * with no alternative in any constant set, where (b) is zero by construction: boric acid (Mesmer
 * 1972) is given ±0.04 inside its range, the agreement of the Thermoddem fit with it to 300 °C
 * stated in the reference notes §7 (that fit is not in the catalogue).
 *
 * <p>Two rules, added when both apply:
 *
 * <ul>
 *   <li><b>Estimate</b> (a fit whose {@link Confidence} is {@code ESTIMATED}: cyclohexylamine,
 *       3-methoxypropylamine, DEAE): u = u₂₅ + {@link #ESTIMATE_GROWTH_PER_K}·|T − 298.15 K|,
 *       counted from 25 °C, where the only data of these estimates are. u₂₅ and the growth are the
 *       project's reference notes §10.1 (water-and-equilibria.md, row cyclohexylamine: "±0.1 at 25
 *       °C; ±0.4 at 300 °C", a growth of 0.3 over 275 K); 3-methoxypropylamine "25 °C value itself
 *       ±0.3"; DEAE is marked "Low" there without a number and takes the cyclohexylamine values
 *       (our assumption; same three-term form, ΔCp also a class estimate).
 *   <li><b>Beyond the range</b> (any fit evaluated outside its stated range, other than an estimate
 *       whose range is only where its estimate is stated): u = {@link #BEYOND_RANGE_AT_EDGE} +
 *       {@link #BEYOND_RANGE_GROWTH_PER_K}·d, d the distance from the nearer end of the range, K.
 *       Never zero: at the edge the fits of one equilibrium agree to about ±0.05-0.15 (reference
 *       notes §10: NH4⁺ ±0.1 at 250 °C; HSO4⁻ ±0.15 to 300 °C), and three-term extrapolations drift
 *       by up to 0.8 over 275 K (§10, ≈0.003 per K); we take 0.05 at the edge and 0.005 per K
 *       beyond, deliberately generous (our choice, not a published figure).
 * </ul>
 *
 * Example (hand calculation, checked in {@code ConstantUncertaintyTest}): cyclohexylammonium at
 * 573.15 K: 0.1 + 0.3/275·275 = 0.4; boric acid (Mesmer 1972, 0-290 °C) at 573.15 K: 0.05 +
 * 0.005·10 = 0.10, and 0.04 at 523.15 K (inside, single source).
 */
public final class ConstantUncertainty {

  private ConstantUncertainty() {}

  /** log10 K uncertainty of an estimate at 25 °C, by fit id (reference notes §10.1). */
  static final Map<String, Double> ESTIMATE_AT_25_CELSIUS =
      Map.of(
          EquilibriumConstants.CYCLOHEXYLAMMONIUM_ESTIMATE.id(), 0.1,
          EquilibriumConstants.METHOXYPROPYLAMMONIUM_ESTIMATE.id(), 0.3,
          EquilibriumConstants.DIETHYLAMINOETHANOLIUM_ESTIMATE.id(), 0.1);

  /**
   * log10 K uncertainty inside the stated range of a retrieved fit that has no alternative in any
   * constant set, by fit id (reference notes §7: Thermoddem agrees with Mesmer 1972 within 0.04).
   */
  static final Map<String, Double> SINGLE_SOURCE_IN_RANGE =
      Map.of(EquilibriumConstants.BORIC_MESMER.id(), 0.04);

  /** Used for an estimate not in {@link #ESTIMATE_AT_25_CELSIUS} (log10 units; our choice). */
  static final double ESTIMATE_AT_25_CELSIUS_OTHERWISE = 0.3;

  /** Growth of an estimate's uncertainty with distance from 25 °C, log10 units per K (0.3/275). */
  public static final double ESTIMATE_GROWTH_PER_K = 0.3 / 275;

  /** Uncertainty of a retrieved fit at the edge of its stated range, log10 units (our choice). */
  public static final double BEYOND_RANGE_AT_EDGE = 0.05;

  /** Growth beyond a fit's stated range, log10 units per K (our choice, see class comment). */
  public static final double BEYOND_RANGE_GROWTH_PER_K = 0.005;

  private static final double T25_K = 298.15;

  /**
   * The stated log10 K uncertainty of a fit at a temperature.
   *
   * @param fit the fit as used
   * @param temperatureK temperature, K
   * @return standard uncertainty of log10 Ka, log10 units; 0 only for a retrieved fit inside its
   *     range that has an alternative in some constant set
   */
  public static double of(Fit fit, double temperatureK) {
    if (fit.reference().confidence() == Confidence.ESTIMATED) {
      double u25 = ESTIMATE_AT_25_CELSIUS.getOrDefault(fit.id(), ESTIMATE_AT_25_CELSIUS_OTHERWISE);
      return u25 + ESTIMATE_GROWTH_PER_K * Math.abs(temperatureK - T25_K);
    }
    double d = distanceBeyond(fit, temperatureK);
    return d > 0 || fit.isExtrapolatedAt(temperatureK)
        ? BEYOND_RANGE_AT_EDGE + BEYOND_RANGE_GROWTH_PER_K * d
        : SINGLE_SOURCE_IN_RANGE.getOrDefault(fit.id(), 0.0);
  }

  /** Why a fit has an uncertainty at a temperature, for the reader (empty when it has none). */
  public static String reason(Fit fit, double temperatureK) {
    if (fit.reference().confidence() == Confidence.ESTIMATED) {
      return "estimate ("
          + fit.reference().id()
          + "): growing with the distance from 25 °C, where its only data are";
    }
    double d = distanceBeyond(fit, temperatureK);
    if (d > 0 || fit.isExtrapolatedAt(temperatureK)) {
      return String.format(
          java.util.Locale.ROOT,
          "extrapolated %.1f K beyond the fit's stated range %.0f-%.0f °C (%s)",
          d,
          fit.validity().min() - 273.15,
          fit.validity().max() - 273.15,
          fit.reference().id());
    }
    if (SINGLE_SOURCE_IN_RANGE.containsKey(fit.id())) {
      return "single source, no alternative constant set ("
          + fit.reference().id()
          + "): the agreement of the other database fit stated in the reference notes";
    }
    return "";
  }

  /** Distance from the nearer end of the fit's stated range, K (0 inside). */
  static double distanceBeyond(Fit fit, double temperatureK) {
    double min = fit.validity().min();
    double max = fit.validity().max();
    if (temperatureK > max) {
      return temperatureK - max;
    }
    if (temperatureK < min) {
      return min - temperatureK;
    }
    return 0;
  }
}
