package org.kwanta.model.evaluation;

import java.time.Duration;
import java.time.Instant;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import org.kwanta.model.Instrument;
import org.kwanta.model.Parameter;
import org.kwanta.model.conductivity.Conductivity;

/**
 * The consistency checks, as pure functions of the configuration, the snapshot and the values
 * derived from it. Each appends {@link Finding}s in a fixed order. The rules follow the project's
 * reference notes (consistency rules; stale and flat-line signals are engineering practice); the
 * thresholds come from {@link CheckSettings}.
 */
final class Checks {

  /** Fewest readings a trend or correlation is computed from. */
  static final int MIN_TREND_READINGS = 6;

  private Checks() {}

  // ---- signal checks -------------------------------------------------------------------------

  /**
   * Stale, out-of-range, outside-model and flat-lined signals; returns the usable latest readings.
   */
  static Map<Parameter, Reading> signals(
      SamplePointConfig config, Snapshot snapshot, List<Finding> out) {
    CheckSettings cs = config.checks();
    Map<Parameter, Reading> usable = new EnumMap<>(Parameter.class);
    for (Parameter p : Parameter.engine()) {
      Optional<Reading> latest = snapshot.latest(p);
      if (latest.isEmpty()) {
        continue;
      }
      Reading r = latest.get();
      Duration age = Duration.between(r.time(), snapshot.time());
      if (age.compareTo(cs.maximumAge()) > 0) {
        out.add(
            finding(
                ReasonCode.STALE,
                p.instrument().orElseThrow(),
                "%s: latest reading is %d min old (maximum %d min).",
                name(p),
                age.toMinutes(),
                cs.maximumAge().toMinutes()));
        continue;
      }
      if (!inRange(p, r.value(), cs)) {
        out.add(
            finding(
                ReasonCode.OUT_OF_RANGE,
                p.instrument().orElseThrow(),
                "%s: reading %s %s is missing, non-positive or at the range limit.",
                name(p),
                num(r.value()),
                p.symbol()));
        continue;
      }
      if (p != Parameter.SODIUM
          && !r.compensatedByAnalyser()
          && !Conductivity.TEMPERATURE_VALIDITY.contains(r.sampleTemperatureK())) {
        out.add(
            finding(
                ReasonCode.SAMPLE_TEMPERATURE_OUTSIDE_MODEL,
                Instrument.SAMPLE_CONDITIONING,
                "%s: sample temperature %s °C is outside 0–100 °C.",
                name(p),
                num(r.sampleTemperatureK() - 273.15)));
        continue;
      }
      if (isFlat(snapshot.readings(p), cs.flatlineDuration())) {
        out.add(
            finding(
                ReasonCode.FLATLINE,
                p.instrument().orElseThrow(),
                "%s: unchanged at %s %s for at least %d min.",
                name(p),
                num(r.value()),
                p.symbol(),
                cs.flatlineDuration().toMinutes()));
      }
      usable.put(p, r);
    }
    return usable;
  }

  static boolean inRange(Parameter p, double v, CheckSettings cs) {
    if (Double.isNaN(v)) {
      return false;
    }
    return switch (p) {
      case SPECIFIC_CONDUCTIVITY, CATION_CONDUCTIVITY, DEGASSED_CATION_CONDUCTIVITY ->
          v > 0 && v < cs.conductivityRangeMaximum();
      case PH -> v > 0 && v < 14;
      case SODIUM -> v >= 0 && v < cs.sodiumRangeMaximum();
      default -> false; // not an engine parameter
    };
  }

  /** All readings identical over at least the flat-line duration, ending at the latest. */
  static boolean isFlat(List<Reading> h, Duration window) {
    if (h.size() < 2) {
      return false;
    }
    Reading last = h.get(h.size() - 1);
    Instant start = last.time().minus(window);
    for (int i = h.size() - 1; i >= 0; i--) {
      Reading r = h.get(i);
      if (Double.compare(r.value(), last.value()) != 0) {
        return false;
      }
      if (!r.time().isAfter(start)) {
        return true;
      }
    }
    return false;
  }

  static void sampleTemperature(
      SamplePointConfig config, Map<Parameter, Reading> usable, List<Finding> out) {
    double band = config.checks().sampleTemperatureBandK();
    for (Map.Entry<Parameter, Reading> e : usable.entrySet()) {
      Reading r = e.getValue();
      if (e.getKey() == Parameter.SODIUM || r.compensatedByAnalyser()) {
        continue;
      }
      double dt = r.sampleTemperatureK() - Evaluator.T25_K;
      if (Math.abs(dt) > band) {
        out.add(
            finding(
                ReasonCode.SAMPLE_TEMPERATURE_OUT_OF_BAND,
                Instrument.SAMPLE_CONDITIONING,
                "%s: sample at %s °C, outside 25 ± %s °C.",
                name(e.getKey()),
                num(r.sampleTemperatureK() - 273.15),
                num(band)));
      }
    }
  }

  static void belowPureWater(Map<Parameter, Boolean> below, List<Finding> out) {
    for (Map.Entry<Parameter, Boolean> e : below.entrySet()) {
      if (e.getValue()) {
        out.add(
            finding(
                ReasonCode.BELOW_PURE_WATER,
                e.getKey().instrument().orElseThrow(),
                "%s reads below theoretical pure water at its sample temperature: cell"
                    + " constant, temperature sensor or upstream compensation.",
                name(e.getKey())));
      }
    }
  }

  // ---- consistency between instruments ------------------------------------------------------

  /** The pH of the inferred composition at a temperature (the pH check's calculated value). */
  @FunctionalInterface
  interface PhOfComposition {
    /**
     * @param temperatureK temperature of the measured pH, K
     * @return the calculated pH there
     */
    double at(double temperatureK);
  }

  static void consistency(
      SamplePointConfig config,
      Snapshot snapshot,
      Map<Parameter, Reading> usable,
      Map<Parameter, Double> at25,
      ChannelFits.Result fitted,
      Optional<CalculatedPh> calculated,
      PhOfComposition calculatedAt,
      List<Finding> out) {
    CheckSettings cs = config.checks();
    Tolerances tol = config.tolerances();
    Double sc = at25.get(Parameter.SPECIFIC_CONDUCTIVITY);
    Double c = at25.get(Parameter.CATION_CONDUCTIVITY);
    Double d = at25.get(Parameter.DEGASSED_CATION_CONDUCTIVITY);

    if (c != null && d != null) {
      double allowance =
          Math.max(cs.degassedAboveCationAbsolute(), cs.degassedAboveCationRelative() * c);
      if (d > c + allowance) {
        out.add(
            finding(
                ReasonCode.DEGASSED_ABOVE_CATION,
                Instrument.DEGASSED_CATION_CONDUCTIVITY,
                "DCACE %s µS/cm exceeds CACE %s µS/cm by more than %s µS/cm.",
                num(d),
                num(c),
                num(allowance)));
      }
    }
    if (sc != null && c != null) {
      double bound = 0.25 * (c - tol.cationConductivityAbsolute() - Evaluator.PURE_WATER_25);
      if (sc * (1 + tol.specificConductivityRelative()) < bound) {
        out.add(
            finding(
                ReasonCode.SPECIFIC_BELOW_PHYSICAL_BOUND,
                Instrument.SPECIFIC_CONDUCTIVITY,
                "SC %s µS/cm is below the physical lower bound %s µS/cm implied by CACE %s µS/cm.",
                num(sc),
                num(bound),
                num(c)));
      }
    }

    Trends t = Trends.of(snapshot, usable, cs, tol);
    if (config.regime().isVolatile()
        && sc != null
        && c != null
        && c - tol.cationConductivityAbsolute() > sc * (1 + tol.specificConductivityRelative())
        && !t.sodiumRising
        && !t.degassedRising) {
      out.add(
          finding(
              ReasonCode.CATION_ABOVE_SPECIFIC,
              Instrument.CATION_CONDUCTIVITY,
              "CACE %s µS/cm exceeds SC %s µS/cm in a volatile-treated sample with no sodium or"
                  + " DCACE rise: swapped channels, compensation or cell constant.",
              num(c),
              num(sc)));
    }
    // Rises over time (ingress, an exhausted column, a sodium analyser step) are judged by the
    // diagnosis over a day of history (org.kwanta.model.diagnosis), not from this hour's window.
    boolean exhausted = t.cationRising && t.sodiumFlat && t.tracking;
    if (c != null && d != null && !exhausted) {
      double co2 = c - d;
      if (co2 > cs.carbonDioxideDifference() && d < 0.5 * c) {
        out.add(
            finding(
                ReasonCode.CARBON_DIOXIDE_INGRESS,
                Instrument.PROCESS,
                "CACE %s µS/cm against DCACE %s µS/cm: about %s µg/kg carbon dioxide, not salts.",
                num(c),
                num(d),
                num(fitted.all().carbonate() * Evaluator.CO2_G_PER_MOL * 1e6)));
      }
    }
    phCheck(config, snapshot, usable, calculated, calculatedAt, out);
  }

  private static void phCheck(
      SamplePointConfig config,
      Snapshot snapshot,
      Map<Parameter, Reading> usable,
      Optional<CalculatedPh> calculated,
      PhOfComposition calculatedAt,
      List<Finding> out) {
    Reading ph = usable.get(Parameter.PH);
    Reading scNow = usable.get(Parameter.SPECIFIC_CONDUCTIVITY);
    if (ph == null || scNow == null || calculated.isEmpty()) {
      return;
    }
    CheckSettings cs = config.checks();
    double t = ph.compensatedByAnalyser() ? Evaluator.T25_K : ph.sampleTemperatureK();
    double calcNow = calculatedAt.at(t);
    Reading cNow = usable.get(Parameter.CATION_CONDUCTIVITY);
    double argNow = scNow.value() - (cNow == null ? 0 : cNow.value() / 3);
    List<Reading> h = snapshot.readings(Parameter.PH);
    Instant start = snapshot.time().minus(cs.phPersistence());
    if (h.isEmpty() || h.get(0).time().isAfter(start)) {
      return; // history does not cover the persistence time
    }
    NearestReadings scHistory =
        new NearestReadings(snapshot.readings(Parameter.SPECIFIC_CONDUCTIVITY));
    NearestReadings cHistory =
        new NearestReadings(snapshot.readings(Parameter.CATION_CONDUCTIVITY));
    int sign = 0;
    double lastResidual = Double.NaN;
    for (Reading r : h) {
      if (r.time().isBefore(start)) {
        continue;
      }
      // calculated pH at the time of r: anchored at the present rigorous value, shifted as
      // log10(SC − CACE/3) moved (alkaline samples); exact when the conductivities were steady
      double shift = 0;
      Reading scThen = scHistory.at(r.time());
      Reading cThen = cHistory.at(r.time());
      if (scThen != null && argNow > 0) {
        double arg = scThen.value() - (cThen == null ? 0 : cThen.value() / 3);
        if (arg > 0) {
          shift = Math.log10(arg / argNow);
        }
      }
      double residual = r.value() - (calcNow + shift);
      if (Math.abs(residual) <= cs.phBand()) {
        return;
      }
      int s = residual > 0 ? 1 : -1;
      if (sign != 0 && s != sign) {
        return;
      }
      sign = s;
      lastResidual = residual;
    }
    if (sign != 0) {
      out.add(
          finding(
              ReasonCode.PH_MEASURED_VS_CALCULATED,
              Instrument.PH,
              "Measured pH %s differs from calculated %s by %s (band ±%s) for %d min.",
              num(ph.value()),
              num(calcNow),
              num(lastResidual),
              num(cs.phBand()),
              cs.phPersistence().toMinutes()));
    }
  }

  static Reading nearest(List<Reading> h, Instant time) {
    return nearest(h, time, false);
  }

  /**
   * The index of the reading nearest in time (the first of equally near ones) in time-ordered
   * readings, searched from a start index, or −1 when there are none. On time-ordered readings the
   * gap to a time falls and then rises along the list (truncation to whole milliseconds keeps that
   * shape, with flat stretches), and the first nearest reading is the first at the bottom. From any
   * start the search walks back while the gap does not rise, so it stands at or before that first
   * nearest reading with every earlier gap larger, then scans forward as {@link #nearest}: the same
   * reading as the full scan whatever the start, found in a few steps when the start is the answer
   * for a slightly earlier time (successive times of another series).
   *
   * @param sortedHistory readings in non-decreasing time order
   * @param from where to start, e.g. the answer for the previous, earlier time
   */
  static int nearestIndex(List<Reading> sortedHistory, Instant time, int from) {
    int n = sortedHistory.size();
    if (n == 0) {
      return -1;
    }
    int i = Math.max(0, Math.min(n - 1, from));
    long gap = gapMillis(sortedHistory.get(i).time(), time);
    while (i > 0) {
      long before = gapMillis(sortedHistory.get(i - 1).time(), time);
      if (before > gap) {
        break;
      }
      i--;
      gap = before;
    }
    int best = i;
    for (int k = i + 1; k < n; k++) {
      long g = gapMillis(sortedHistory.get(k).time(), time);
      if (g < gap) {
        gap = g;
        best = k;
      } else if (g > gap) {
        break;
      }
    }
    return best;
  }

  /**
   * The reading nearest in time (the first of equally near ones).
   *
   * @param sorted true when the readings are in non-decreasing time order: the gaps then fall and
   *     rise again, so the scan stops at the first gap above the best (same answer, fewer steps)
   */
  static Reading nearest(List<Reading> h, Instant time, boolean sorted) {
    Reading best = null;
    long bestGap = Long.MAX_VALUE;
    for (Reading r : h) {
      long gap = gapMillis(r.time(), time);
      if (gap < bestGap) {
        bestGap = gap;
        best = r;
      } else if (sorted && gap > bestGap) {
        break;
      }
    }
    return best;
  }

  /**
   * The reading of one history nearest to each of a series of times (the first of equally near
   * ones, as {@link #nearest}); on a time-ordered history each search starts where the previous one
   * ended, so a series of increasing times costs about one pass over the history.
   */
  static final class NearestReadings {
    private final List<Reading> history;
    private final boolean sorted;
    private int last;

    NearestReadings(List<Reading> history) {
      this.history = history;
      this.sorted = isSorted(history);
    }

    /** The reading nearest to a time, or null when the history is empty. */
    Reading at(Instant time) {
      if (!sorted) {
        return nearest(history, time, false);
      }
      int i = nearestIndex(history, time, last);
      if (i < 0) {
        return null;
      }
      last = i;
      return history.get(i);
    }
  }

  /** True when the readings are in non-decreasing time order. */
  static boolean isSorted(List<Reading> h) {
    for (int i = 1; i < h.size(); i++) {
      if (h.get(i).time().isBefore(h.get(i - 1).time())) {
        return false;
      }
    }
    return true;
  }

  /**
   * |Duration.between(a, b).toMillis()| without creating the Duration: the absolute difference in
   * whole milliseconds, truncated (as toMillis truncates toward zero).
   */
  static long gapMillis(Instant a, Instant b) {
    long seconds = b.getEpochSecond() - a.getEpochSecond();
    if (Math.abs(seconds) >= 9_000_000_000L) {
      return Math.abs(Duration.between(a, b).toMillis()); // beyond the nanosecond range of a long
    }
    long nanos = seconds * 1_000_000_000L + (b.getNano() - a.getNano());
    return Math.abs(nanos) / 1_000_000L;
  }

  /** Trends over the snapshot's history: rise = median of the last three − of the first three. */
  private static final class Trends {
    boolean hasCationTrend;
    boolean cationRising;
    double cationRise;
    boolean sodiumRising;
    boolean sodiumFlat;
    double sodiumRise;
    boolean degassedRising;
    double degassedRise;
    boolean tracking;

    /** CACE against SC; NaN when not needed (no cation rise with flat sodium). */
    double correlation = Double.NaN;

    static Trends of(Snapshot s, Map<Parameter, Reading> usable, CheckSettings cs, Tolerances tol) {
      Trends t = new Trends();
      List<Reading> c =
          usable.containsKey(Parameter.CATION_CONDUCTIVITY)
              ? s.readings(Parameter.CATION_CONDUCTIVITY)
              : List.of();
      if (c.size() >= MIN_TREND_READINGS) {
        t.hasCationTrend = true;
        t.cationRise = rise(c);
        t.cationRising = t.cationRise > cs.trendCationRise();
      }
      List<Reading> na =
          usable.containsKey(Parameter.SODIUM) ? s.readings(Parameter.SODIUM) : List.of();
      if (na.size() >= MIN_TREND_READINGS) {
        t.sodiumRise = rise(na);
        double threshold = Math.max(cs.trendSodiumRise(), tol.sodiumRelative() * median3(na, 0));
        t.sodiumRising = t.sodiumRise > threshold;
        t.sodiumFlat = !t.sodiumRising;
      }
      List<Reading> d =
          usable.containsKey(Parameter.DEGASSED_CATION_CONDUCTIVITY)
              ? s.readings(Parameter.DEGASSED_CATION_CONDUCTIVITY)
              : List.of();
      if (d.size() >= MIN_TREND_READINGS && t.cationRising) {
        t.degassedRise = rise(d);
        t.degassedRising = t.degassedRise > 0.5 * t.cationRise;
      }
      List<Reading> sc =
          usable.containsKey(Parameter.SPECIFIC_CONDUCTIVITY)
              ? s.readings(Parameter.SPECIFIC_CONDUCTIVITY)
              : List.of();
      // tracking only matters for an exhausted column (a cation rise with flat sodium), so the
      // correlation, a pass over both histories, is computed only then
      if (t.hasCationTrend && t.cationRising && t.sodiumFlat && sc.size() >= MIN_TREND_READINGS) {
        t.correlation = correlation(c, sc);
        t.tracking = t.correlation >= cs.trackingCorrelation();
      }
      return t;
    }

    static double rise(List<Reading> h) {
      return median3(h, h.size() - 3) - median3(h, 0);
    }

    static double median3(List<Reading> h, int from) {
      double a = h.get(from).value();
      double b = h.get(from + 1).value();
      double c = h.get(from + 2).value();
      return Math.max(Math.min(a, b), Math.min(Math.max(a, b), c));
    }

    /** Pearson correlation of x with y, y taken at the reading nearest in time to each x. */
    static double correlation(List<Reading> x, List<Reading> y) {
      int n = x.size();
      double sx = 0;
      double sy = 0;
      double[] ys = new double[n];
      NearestReadings yNear = new NearestReadings(y);
      for (int i = 0; i < n; i++) {
        ys[i] = yNear.at(x.get(i).time()).value();
        sx += x.get(i).value();
        sy += ys[i];
      }
      double mx = sx / n;
      double my = sy / n;
      double sxy = 0;
      double sxx = 0;
      double syy = 0;
      for (int i = 0; i < n; i++) {
        double dx = x.get(i).value() - mx;
        double dy = ys[i] - my;
        sxy += dx * dy;
        sxx += dx * dx;
        syy += dy * dy;
      }
      return sxx > 0 && syy > 0 ? sxy / Math.sqrt(sxx * syy) : 0;
    }
  }

  // ---- formatting ---------------------------------------------------------------------------

  private static Finding finding(ReasonCode code, Instrument pointsAt, String fmt, Object... args) {
    return new Finding(code, pointsAt, format(fmt, args));
  }

  /**
   * {@code String.format(Locale.ROOT, fmt, args)} for the findings' templates, which use only
   * {@code %s} and {@code %d} (of whole numbers): written directly, which gives the same text
   * without parsing the template every time ({@code ChecksFormatTest}); anything else goes to the
   * formatter.
   */
  static String format(String fmt, Object... args) {
    StringBuilder out = new StringBuilder(fmt.length() + 16 * args.length);
    int next = 0;
    for (int i = 0; i < fmt.length(); i++) {
      char c = fmt.charAt(i);
      if (c != '%') {
        out.append(c);
        continue;
      }
      char spec = i + 1 < fmt.length() ? fmt.charAt(i + 1) : 0;
      if (spec == 's' && next < args.length) {
        out.append(args[next++]);
      } else if (spec == 'd'
          && next < args.length
          && (args[next] instanceof Integer || args[next] instanceof Long)) {
        out.append(args[next++]);
      } else {
        return String.format(Locale.ROOT, fmt, args);
      }
      i++;
    }
    return next == args.length ? out.toString() : String.format(Locale.ROOT, fmt, args);
  }

  private static String name(Parameter p) {
    return switch (p) {
      case SPECIFIC_CONDUCTIVITY -> "SC";
      case CATION_CONDUCTIVITY -> "CACE";
      case DEGASSED_CATION_CONDUCTIVITY -> "DCACE";
      case PH -> "pH";
      case SODIUM -> "Na";
      default -> p.code();
    };
  }

  private static String num(double v) {
    return ThreeDigits.of(v);
  }
}
