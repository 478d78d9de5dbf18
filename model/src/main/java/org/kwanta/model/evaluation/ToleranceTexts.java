package org.kwanta.model.evaluation;

import java.util.Locale;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import org.kwanta.model.Parameter;

/**
 * The configured tolerances as the reader sees them in the parts of the pH-at-temperature band
 * ({@link OperatingPhParts}), e.g. {@code ±2.0 % of the 25 °C value} or {@code ±2.0 K}. They depend
 * only on the {@link Tolerances}, yet every evaluation would print them again, and printing a
 * double costs about as much as a warm speciation step; so they are printed once per distinct
 * tolerance set and shared (immutable, thread-safe). The text is the same as printing it per
 * evaluation.
 *
 * @param specific part (a), the specific-conductivity channel
 * @param cation part (a), the cation-conductivity channels
 * @param temperature part (d), the operating temperature
 * @param pressure part (d), the operating pressure of a liquid point
 * @param condensatePressure part (d), the operating pressure of a steam point
 */
record ToleranceTexts(
    String specific,
    String cation,
    String temperature,
    String pressure,
    String condensatePressure) {

  /**
   * Most distinct tolerance sets kept (a few per plant); beyond, the texts are printed per call.
   */
  static final int CACHE_LIMIT = 256;

  private static final Map<Tolerances, ToleranceTexts> CACHE = new ConcurrentHashMap<>();

  /**
   * The set asked for last, by identity: a point's evaluations share one {@link Tolerances}
   * instance, and hashing its fields per call cost more than the rest of the lookup.
   */
  private record Last(Tolerances tolerances, ToleranceTexts texts) {}

  private static volatile Last LAST;

  /** The source name of each conductivity channel in part (a), by {@link Parameter#ordinal()}. */
  private static final String[] CHANNEL_NAMES = new String[Parameter.values().length];

  static {
    for (Parameter p : Parameter.values()) {
      CHANNEL_NAMES[p.ordinal()] = p.name().toLowerCase(Locale.ROOT);
    }
  }

  /** The texts of a tolerance set. */
  static ToleranceTexts of(Tolerances tol) {
    Last last = LAST;
    if (last != null && last.tolerances() == tol) {
      return last.texts();
    }
    ToleranceTexts t = CACHE.get(tol);
    if (t != null) {
      LAST = new Last(tol, t);
      return t;
    }
    t = print(tol);

    if (CACHE.size() < CACHE_LIMIT) {
      CACHE.putIfAbsent(tol, t);
    }
    return t;
  }

  /** The name a channel goes by in part (a), e.g. {@code specific_conductivity}. */
  static String channelName(Parameter p) {
    return CHANNEL_NAMES[p.ordinal()];
  }

  /** Part (a)'s tolerance text of a conductivity channel. */
  String channel(Parameter p) {
    return p == Parameter.SPECIFIC_CONDUCTIVITY ? specific : cation;
  }

  private static ToleranceTexts print(Tolerances tol) {
    double rel = tol.operatingPressureRelative();
    return new ToleranceTexts(
        "±" + rounded(tol.specificConductivityRelative() * 100) + " % of the 25 °C value",
        "±" + rounded(tol.cationConductivityAbsolute()) + " µS/cm",
        "±" + rounded(tol.operatingTemperatureK()) + " K",
        "±" + rounded(rel * 100) + " %",
        "±" + rounded(rel * 100) + " % (condensation temperature follows)");
  }

  /** A tolerance as shown to the reader: 1e-6 resolution, so 0.07·100 reads 7.0. */
  static double rounded(double x) {
    return Math.round(x * 1e6) / 1e6;
  }
}
