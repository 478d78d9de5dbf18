package org.kwanta.model.diagnosis;

import java.time.Duration;
import java.time.Instant;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.EnumMap;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import org.kwanta.model.Instrument;
import org.kwanta.model.evaluation.Finding;
import org.kwanta.model.evaluation.ReasonCode;
import org.kwanta.model.evaluation.Regime;

/**
 * The diagnosis over time: each channel of a sample point against its own robust baseline, and
 * against what the other channels and the neighbouring points on the cycle predict. A pure function
 * of the minute series it is given: the findings at a minute depend only on the minutes up to it
 * (at most {@link Settings#lookback()} back), never on how or in what order the data arrived, nor
 * on the range asked for.
 *
 * <p>Per channel and minute:
 *
 * <ul>
 *   <li><b>baseline</b>: the median of the channel's minute values over {@link
 *       Settings#baselinePeriod()} ending {@link Settings#baselineGap()} before the start of the
 *       current quarter hour (so a change of the last hour never hides in its own baseline, and the
 *       baseline moves in steps of 15 min: cheap and the same for every caller);
 *   <li><b>spread</b>: 1.4826 × the median absolute deviation over the same period (a robust
 *       standard deviation, which includes slow daily wander);
 *   <li><b>now</b>: the median of the last three minutes (robust to a single spike);
 *   <li><b>significant</b>: |now − baseline| beyond the larger of 4 × spread and a floor from the
 *       instrument tolerance (see {@link #threshold}).
 * </ul>
 *
 * The rules that turn deviations into findings, with which evidence blames an instrument and which
 * the process, are in {@code docs/diagnosis.md}. In short: an instrument is blamed only when the
 * physics says the other channels or the neighbouring points should have followed a real change and
 * did not; when the evidence is ambiguous the finding names the process, so a real event is never
 * explained away.
 */
public final class Diagnoser {

  /**
   * A sample point as the diagnosis needs it.
   *
   * @param id sample point id
   * @param regime treatment at the point
   * @param coolingWater the plant's cooling water, or null when not declared (the sea-water
   *     proportions are then used only to size the evidence, never to name a condenser leak)
   * @param upstream ids of the points whose water reaches this one (make-up → condensate →
   *     feedwater → drum → steam), empty when not declared
   */
  public record Point(String id, Regime regime, CoolingWater coolingWater, List<String> upstream) {
    public Point {
      Objects.requireNonNull(id, "id");
      Objects.requireNonNull(regime, "regime");
      upstream = upstream == null ? List.of() : List.copyOf(upstream);
    }
  }

  /** A point and its minutes (time order, at most one per minute; gaps allowed). */
  public record Series(Point point, List<Minute> minutes) {
    public Series {
      Objects.requireNonNull(point, "point");
      minutes = List.copyOf(minutes);
    }
  }

  /** The findings of one minute. */
  public record Diagnosed(Instant time, List<Finding> findings) {
    public Diagnosed {
      findings = List.copyOf(findings);
    }
  }

  /**
   * Settings of the diagnosis (engineering choices, common practice, no source).
   *
   * @param baselinePeriod how much history a baseline is the median of (default 24 h)
   * @param baselineGap the most recent time left out of the baseline (default 60 min)
   * @param cusumWindow how far back the drift test sums (default 8 h)
   * @param processPersistence minutes a process finding's condition must hold (default 3)
   * @param instrumentPersistence minutes an instrument finding's condition must hold (default 10)
   */
  public record Settings(
      Duration baselinePeriod,
      Duration baselineGap,
      Duration cusumWindow,
      int processPersistence,
      int instrumentPersistence) {

    public Settings {
      if (baselinePeriod.toMinutes() < 2L * MINIMUM_BASELINE_MINUTES
          || baselineGap.toMinutes() < 15
          || cusumWindow.toMinutes() < 60
          || processPersistence < 1
          || instrumentPersistence < 1) {
        throw new IllegalArgumentException(
            "diagnosis settings out of range: baseline period ≥ 2 h, gap ≥ 15 min, drift window ≥ 1 h,"
                + " persistences ≥ 1 min");
      }
    }

    public static Settings defaults() {
      return new Settings(Duration.ofHours(24), Duration.ofMinutes(60), Duration.ofHours(8), 3, 10);
    }

    /** How much history before the first minute asked for the diagnosis reads. */
    public Duration lookback() {
      return baselinePeriod.plus(baselineGap).plus(Duration.ofMinutes(15 + 60));
    }
  }

  /** Minutes a baseline needs at least. */
  static final int MINIMUM_BASELINE_MINUTES = 60;

  /** The recent median spans this many minutes. */
  static final int RECENT_MINUTES = 3;

  /** The longest gap between readings that a value still stands across, minutes. */
  static final int MAX_GAP_MINUTES = 10;

  /** Minutes of the medians that decide whether the pH or the conductivity moved. */
  static final int ATTRIBUTION_MINUTES = 9;

  /** The drift test's reference value k (pH) and decision interval h (pH·min). */
  static final double CUSUM_K = 0.05;

  static final double CUSUM_H = 1.5;

  /**
   * A condenser-leak finding needs the cation conductivity rise within this factor of the one the
   * declared cooling water predicts (natural waters vary; common practice, no source).
   */
  static final double COOLING_WATER_FACTOR = 2.5;

  /** How long a neighbour's change counts as concurrent, minutes (transport and mixing). */
  static final int NEIGHBOUR_WINDOW = 60;

  private final Settings settings;

  public Diagnoser(Settings settings) {
    this.settings = Objects.requireNonNull(settings, "settings");
  }

  /** This diagnoser's settings. */
  public Settings settings() {
    return settings;
  }

  /**
   * Diagnoses one point over [from, to] (minute times), using its neighbours' series where given.
   *
   * @param series the point's series and any neighbours' (upstream or downstream), each reaching at
   *     least {@link Settings#lookback()} before {@code from} for full baselines
   * @return one entry per minute of the point in [from, to] that has any value, in time order
   */
  public List<Diagnosed> diagnose(
      Map<String, Series> series, String pointId, Instant from, Instant to) {
    Series target = series.get(pointId);
    if (target == null) {
      throw new IllegalArgumentException("no series for sample point " + pointId);
    }
    long first = minuteOf(from) - settings.instrumentPersistence() - NEIGHBOUR_WINDOW;
    long last = minuteOf(to);
    long gridStart = first - settings.lookback().toMinutes();
    Map<String, Track> tracks = new HashMap<>();
    for (Series s : series.values()) {
      tracks.put(s.point().id(), new Track(s, gridStart, last, settings));
    }
    Track t = tracks.get(pointId);
    List<Track> upstream = neighbours(tracks, target.point(), true);
    List<Track> downstream = neighbours(tracks, target.point(), false);
    List<Track> around = new ArrayList<>(upstream);
    around.addAll(downstream);

    int n = (int) (last - first + 1);
    // conditions per minute, before persistence
    List<List<Finding>> raw = new ArrayList<>(n);
    for (int k = 0; k < n; k++) {
      int i = (int) (first + k - gridStart);
      raw.add(conditions(t, i, upstream, around, tracks));
    }
    List<Diagnosed> out = new ArrayList<>();
    long fromMinute = minuteOf(from);
    for (int k = 0; k < n; k++) {
      long minute = first + k;
      if (minute < fromMinute) {
        continue;
      }
      int i = (int) (minute - gridStart);
      if (!t.hasAny(i)) {
        continue;
      }
      List<Finding> findings = new ArrayList<>();
      for (Finding f : raw.get(k)) {
        int persistence =
            f.pointsAt() == Instrument.PROCESS
                ? settings.processPersistence()
                : isCusum(f.code()) ? 1 : settings.instrumentPersistence();
        if (held(raw, t, first, k, f.code(), persistence)) {
          findings.add(f);
        }
      }
      out.add(new Diagnosed(Instant.ofEpochSecond(minute * 60), findings));
    }
    return out;
  }

  private static boolean isCusum(ReasonCode c) {
    return c == ReasonCode.PH_ELECTRODE_DRIFT || c == ReasonCode.SPECIFIC_CONDUCTIVITY_DRIFT;
  }

  /**
   * True when the finding's condition held at every minute with data over the last {@code minutes}
   * minutes, ending at k: the run of data minutes with the condition, walked back from k, spans at
   * least minutes − 1. Minutes without any data (a gap in the feed, or a point read every few
   * minutes) neither count nor break the run.
   */
  private static boolean held(
      List<List<Finding>> raw, Track t, long first, int k, ReasonCode code, int minutes) {
    for (int j = k; j >= 0 && k - j <= minutes + MAX_GAP_MINUTES; j--) {
      int i = (int) (first + j - t.gridStart);
      if (!t.hasAny(i)) {
        continue;
      }
      boolean found = false;
      for (Finding f : raw.get(j)) {
        if (f.code() == code || sameFamily(f.code(), code)) {
          found = true;
          break;
        }
      }
      if (!found) {
        return false;
      }
      if (k - j >= minutes - 1) {
        return true;
      }
    }
    return false;
  }

  /** Step and drift of one channel hold each other's persistence (one deviation, two shapes). */
  private static boolean sameFamily(ReasonCode a, ReasonCode b) {
    return family(a) != 0 && family(a) == family(b);
  }

  private static int family(ReasonCode c) {
    return switch (c) {
      case PH_ELECTRODE_DRIFT, PH_ELECTRODE_STEP -> 1;
      case SPECIFIC_CONDUCTIVITY_DRIFT, SPECIFIC_CONDUCTIVITY_STEP -> 2;
      default -> 0;
    };
  }

  private static List<Track> neighbours(Map<String, Track> tracks, Point p, boolean up) {
    List<Track> out = new ArrayList<>();
    for (Track t : tracks.values()) {
      if (t.point.id().equals(p.id())) {
        continue;
      }
      boolean isUp = p.upstream().contains(t.point.id());
      boolean isDown = t.point.upstream().contains(p.id());
      if (up ? isUp : isDown) {
        out.add(t);
      }
    }
    out.sort((a, b) -> a.point.id().compareTo(b.point.id()));
    return out;
  }

  // ---- the rules ----------------------------------------------------------------------------

  private List<Finding> conditions(
      Track t, int i, List<Track> upstream, List<Track> around, Map<String, Track> tracks) {
    List<Finding> out = new ArrayList<>(2);
    if (!t.hasAny(i)) {
      return out;
    }
    Regime regime = t.point.regime();
    if (regime == Regime.MAKE_UP) {
      makeUp(t, i, out);
      return out;
    }
    int cat = t.sig(Channel.CATION, i);
    int na = t.sig(Channel.SODIUM, i);
    boolean volatileRegime = regime.isVolatile();
    if (cat > 0) {
      cationRise(t, i, na, volatileRegime, upstream, around, tracks, out);
    } else if (na > 0 && volatileRegime && t.has(Channel.CATION, i)) {
      sodiumAlone(t, i, around, out);
    }
    if (cat <= 0) {
      phAndConductivity(t, i, around, out);
    }
    return out;
  }

  private void makeUp(Track t, int i, List<Finding> out) {
    if (t.sig(Channel.SPECIFIC, i) > 0) {
      Track.Stat b = t.baseline(Channel.SPECIFIC, i);
      double now = t.recent(Channel.SPECIFIC, i);
      out.add(
          new Finding(
              ReasonCode.CONTAMINANT_INGRESS,
              Instrument.PROCESS,
              format(
                  "Make-up water conductivity %s µS/cm against a baseline of %s µS/cm: the"
                      + " demineralisation plant is letting salts through.",
                  now, b.median()),
              new Finding.Evidence(
                  "specific conductivity",
                  "uS/cm",
                  b.median(),
                  now,
                  t.threshold(Channel.SPECIFIC, i))));
    }
  }

  private void cationRise(
      Track t,
      int i,
      int na,
      boolean volatileRegime,
      List<Track> upstream,
      List<Track> around,
      Map<String, Track> tracks,
      List<Finding> out) {
    double dCat = t.dev(Channel.CATION, i);
    double tolCat = t.threshold(Channel.CATION, i);
    double baseCat = t.baseline(Channel.CATION, i).median();
    String origin = origin(t, i, tracks);
    if (na > 0 && volatileRegime) {
      double dNa = t.dev(Channel.SODIUM, i);
      CoolingWater water = t.point.coolingWater();
      double predicted = Ingress.cationRise(dNa, baseCat, water == null ? CoolingWater.SEA : water);
      double ratio = dCat / predicted;
      Finding.Evidence evidence =
          new Finding.Evidence(
              "cation conductivity rise",
              "uS/cm",
              predicted,
              dCat,
              Math.max(tolCat, predicted * (1 - 1 / COOLING_WATER_FACTOR)));
      if (water != null
          && ratio >= 1 / COOLING_WATER_FACTOR
          && ratio <= COOLING_WATER_FACTOR
          && !upstreamMakeUp(upstream, i, tracks)) {
        out.add(
            new Finding(
                ReasonCode.COOLING_WATER_INGRESS,
                Instrument.PROCESS,
                format(
                        "Sodium +%s µg/kg and cation conductivity +%s µS/cm over their baselines;"
                            + " %s cooling water with that sodium would give +%s µS/cm",
                        dNa, dCat, name(water), predicted)
                    + ": a condenser leak"
                    + origin
                    + ".",
                evidence));
      } else {
        out.add(
            new Finding(
                ReasonCode.CONTAMINANT_INGRESS,
                Instrument.PROCESS,
                format(
                        "Sodium +%s µg/kg and cation conductivity +%s µS/cm over their baselines"
                            + " (cooling water%s would give +%s µS/cm)",
                        dNa,
                        dCat,
                        water == null ? " of sea-water proportions" : " as declared",
                        predicted)
                    + ": contamination entering the cycle"
                    + origin
                    + ".",
                evidence));
      }
      return;
    }
    // a cation conductivity rise without sodium
    int deg = t.sig(Channel.DEGASSED, i);
    if (t.has(Channel.DEGASSED, i)) {
      double dDeg = t.dev(Channel.DEGASSED, i);
      if (deg <= 0 && dDeg < 0.3 * dCat) {
        out.add(
            new Finding(
                ReasonCode.CARBON_DIOXIDE_INGRESS,
                Instrument.PROCESS,
                format(
                        "Cation conductivity +%s µS/cm over its baseline while degassed cation"
                            + " conductivity moved %s µS/cm: a volatile acid, carbon dioxide"
                            + " (air in-leakage)",
                        dCat, dDeg)
                    + origin
                    + ".",
                new Finding.Evidence(
                    "degassed cation conductivity rise if salts",
                    "uS/cm",
                    dCat,
                    dDeg,
                    t.threshold(Channel.DEGASSED, i))));
        return;
      }
    }
    boolean neighbourRising = false;
    int neighboursWithCation = 0;
    for (Track nb : around) {
      if (nb.baseline(Channel.CATION, i).valid()) {
        neighboursWithCation++;
        if (nb.recentlySignificant(Channel.CATION, i, NEIGHBOUR_WINDOW)
            || nb.recentlySignificant(Channel.SODIUM, i, NEIGHBOUR_WINDOW)) {
          neighbourRising = true;
        }
      }
    }
    boolean makeUp = upstreamMakeUp(upstream, i, tracks);
    int instrumentEvidence = 0;
    List<String> why = new ArrayList<>();
    if (neighboursWithCation > 0 && !neighbourRising && !makeUp) {
      instrumentEvidence++;
      why.add("the neighbouring points stayed put");
    }
    if (t.has(Channel.SODIUM, i) && na == 0) {
      instrumentEvidence++;
      why.add("sodium stayed flat");
    }
    if (t.gradual(Channel.CATION, i)) {
      instrumentEvidence++;
      why.add("the rise is a slow creep, not a step");
    }
    if (!neighbourRising && !makeUp && instrumentEvidence >= 2) {
      double predicted =
          t.has(Channel.SODIUM, i)
              ? Ingress.cationRise(
                  Math.max(0, t.dev(Channel.SODIUM, i)), baseCat, waterOrSea(t.point))
              : 0;
      out.add(
          new Finding(
              ReasonCode.CATION_COLUMN_EXHAUSTED,
              Instrument.CATION_CONDUCTIVITY,
              format("Cation conductivity +%s µS/cm over its baseline, but ", dCat)
                  + String.join(", ", why)
                  + ": replace the cation exchanger (the alarm stays until the value is"
                  + " confirmed).",
              new Finding.Evidence(
                  "cation conductivity rise explained by sodium",
                  "uS/cm",
                  predicted,
                  dCat,
                  tolCat)));
    } else {
      out.add(
          new Finding(
              ReasonCode.CONTAMINANT_INGRESS,
              Instrument.PROCESS,
              format(
                      "Cation conductivity +%s µS/cm over its baseline %s",
                      dCat,
                      t.has(Channel.SODIUM, i)
                          ? "without a sodium rise"
                          : "(no sodium analyser here)")
                  + (neighbourRising
                      ? ", and neighbouring points changed too"
                      : makeUp ? ", after a make-up water upset" : "")
                  + ": acid or organic contamination"
                  + origin
                  + ".",
              new Finding.Evidence(
                  "cation conductivity", "uS/cm", baseCat, baseCat + dCat, tolCat)));
    }
  }

  private static CoolingWater waterOrSea(Point p) {
    return p.coolingWater() == null ? CoolingWater.SEA : p.coolingWater();
  }

  private void sodiumAlone(Track t, int i, List<Track> around, List<Finding> out) {
    double dNa = t.dev(Channel.SODIUM, i);
    double dCat = t.dev(Channel.CATION, i);
    double tolCat = t.threshold(Channel.CATION, i);
    double baseCat = t.baseline(Channel.CATION, i).median();
    if (Double.isNaN(dCat) || Double.isNaN(baseCat)) {
      return;
    }
    double predicted = Ingress.cationRise(dNa, baseCat, waterOrSea(t.point));
    if (predicted < 3 * tolCat || dCat > 0.25 * predicted) {
      return; // the physics cannot tell: the level classification still reports the sodium
    }
    boolean neighbour = false;
    for (Track nb : around) {
      if (nb.recentlySignificant(Channel.SODIUM, i, NEIGHBOUR_WINDOW)) {
        neighbour = true;
      }
    }
    Finding.Evidence evidence =
        new Finding.Evidence("cation conductivity rise", "uS/cm", predicted, dCat, tolCat);
    if (neighbour) {
      out.add(
          new Finding(
              ReasonCode.CONTAMINANT_INGRESS,
              Instrument.PROCESS,
              format(
                  "Sodium +%s µg/kg here and at a neighbouring point, without the acid anions"
                      + " cooling water brings (+%s µS/cm expected, %s read): sodium hydroxide,"
                      + " e.g. regenerant or carry-over.",
                  dNa, predicted, dCat),
              evidence));
    } else {
      out.add(
          new Finding(
              ReasonCode.SODIUM_WITHOUT_CATION_RISE,
              Instrument.SODIUM,
              format(
                  "Sodium +%s µg/kg over its baseline; with any cooling water cation conductivity"
                      + " would have risen by about %s µS/cm, it moved %s µS/cm and no neighbouring"
                      + " point followed: check the sodium analyser (the sodium level stays"
                      + " classified).",
                  dNa, predicted, dCat),
              evidence));
    }
  }

  private void phAndConductivity(Track t, int i, List<Track> around, List<Finding> out) {
    if (!t.has(Channel.PH, i) || !t.has(Channel.PH_CALCULATED, i)) {
      return;
    }
    double dMeas = t.dev(Channel.PH, i);
    double dCalc = t.dev(Channel.PH_CALCULATED, i);
    double dRes = t.dev(Channel.PH_RESIDUAL, i);
    double tolRes = t.threshold(Channel.PH_RESIDUAL, i);
    if (Double.isNaN(dMeas) || Double.isNaN(dCalc) || Double.isNaN(dRes)) {
      return;
    }
    // both moved together and agree: the dose changed
    if (Math.abs(dMeas) >= 0.2
        && Math.abs(dCalc) >= 0.2
        && Math.signum(dMeas) == Math.signum(dCalc)
        && Math.abs(dRes) < tolRes) {
      out.add(
          new Finding(
              ReasonCode.DOSING_CHANGE,
              Instrument.PROCESS,
              format(
                  "Measured pH %s and calculated pH %s from their baselines, in agreement: the"
                      + " alkalizer dose changed.",
                  signed(dMeas), signed(dCalc)),
              new Finding.Evidence("measured pH change", "[pH]", dCalc, dMeas, tolRes)));
      return;
    }
    double cusum = t.cusum(i, settings.cusumWindow());
    boolean step = Math.abs(dRes) > tolRes && t.stepLike(Channel.PH_RESIDUAL, i);
    boolean drift = cusum > CUSUM_H;
    if (!step && !drift) {
      return;
    }
    if (!step && Math.abs(dRes) <= CUSUM_K) {
      return; // the sum still remembers an earlier excursion that has ended
    }
    // which channel moved: the one that left its own baseline, judged on 9-minute medians so
    // that the noise of either does not decide; while neither clearly moved more, blame nobody
    double mMeas = Math.abs(t.devOver(Channel.PH, i, ATTRIBUTION_MINUTES));
    double mCalc = Math.abs(t.devOver(Channel.PH_CALCULATED, i, ATTRIBUTION_MINUTES));
    boolean scMoved = mCalc > 2 * mMeas && mCalc > CUSUM_K;
    boolean phMoved = mMeas > 2 * mCalc && mMeas > CUSUM_K;
    boolean neighboursAgree = false;
    for (Track nb : around) {
      double nbCalc = nb.dev(Channel.PH_CALCULATED, i);
      double nbSc = nb.logDev(Channel.SPECIFIC, i);
      double here = t.logDev(Channel.SPECIFIC, i);
      double nbShift = !Double.isNaN(nbCalc) ? nbCalc : nbSc;
      if (!Double.isNaN(nbShift) && !Double.isNaN(here) && Math.abs(nbShift - here) < 0.03) {
        neighboursAgree = true; // the conductivity change is real: the neighbours saw it too
      }
    }
    if (!scMoved && !phMoved && !neighboursAgree) {
      return; // the evidence does not say which; the instant check still compares the two
    }
    Instrument pointsAt =
        scMoved && !neighboursAgree ? Instrument.SPECIFIC_CONDUCTIVITY : Instrument.PH;
    double measured = t.recent(Channel.PH, i);
    double calculated = t.recent(Channel.PH_CALCULATED, i);
    double offset = t.baseline(Channel.PH_RESIDUAL, i).median();
    if (pointsAt == Instrument.PH) {
      out.add(
          new Finding(
              step ? ReasonCode.PH_ELECTRODE_STEP : ReasonCode.PH_ELECTRODE_DRIFT,
              Instrument.PH,
              format(
                  "Measured pH %s where specific and cation conductivity give %s (usual offset"
                      + " %s): %s %s pH while the calculated pH moved %s.",
                  measured,
                  calculated,
                  signed(offset),
                  step ? "a step of" : "a drift of",
                  signed(dRes),
                  signed(dCalc)),
              new Finding.Evidence("measured pH", "[pH]", calculated + offset, measured, tolRes)));
    } else {
      double sc = t.recent(Channel.SPECIFIC, i);
      double expected = sc * Math.pow(10, dRes);
      out.add(
          new Finding(
              step ? ReasonCode.SPECIFIC_CONDUCTIVITY_STEP : ReasonCode.SPECIFIC_CONDUCTIVITY_DRIFT,
              Instrument.SPECIFIC_CONDUCTIVITY,
              format(
                  "Specific conductivity %s µS/cm where the measured pH and cation conductivity"
                      + " give about %s µS/cm, while the measured pH stayed within %s of its"
                      + " baseline: cell fouling or cell constant.",
                  sc, expected, Math.abs(dMeas)),
              new Finding.Evidence(
                  "specific conductivity",
                  "uS/cm",
                  expected,
                  sc,
                  expected * (Math.pow(10, tolRes) - 1))));
    }
  }

  /** True when an upstream make-up point shows a conductivity rise (now or in the last hour). */
  private static boolean upstreamMakeUp(List<Track> upstream, int i, Map<String, Track> tracks) {
    for (Track u : ancestors(upstream, tracks)) {
      if (u.point.regime() == Regime.MAKE_UP
          && u.recentlySignificant(Channel.SPECIFIC, i, 6 * NEIGHBOUR_WINDOW)) {
        return true;
      }
    }
    return false;
  }

  /** ", first seen at X at hh:mm" when an upstream point changed first; empty otherwise. */
  private static String origin(Track t, int i, Map<String, Track> tracks) {
    List<Track> up = new ArrayList<>();
    for (String id : t.point.upstream()) {
      Track u = tracks.get(id);
      if (u != null) {
        up.add(u);
      }
    }
    int ownOnset = t.onset(i);
    Track first = null;
    int firstOnset = ownOnset;
    for (Track u : ancestors(up, tracks)) {
      int onset = u.onset(i);
      if (onset >= 0
          && onset <= firstOnset + NEIGHBOUR_WINDOW / 4
          && (first == null || onset < firstOnset)) {
        first = u;
        firstOnset = onset;
      }
    }
    if (first == null) {
      return "";
    }
    return ", first seen upstream at "
        + first.point.id()
        + " ("
        + first.timeOf(firstOnset).toString().substring(11, 16)
        + " UTC)";
  }

  /** Every point upstream of the given ones, nearest first, each once. */
  private static List<Track> ancestors(List<Track> start, Map<String, Track> tracks) {
    List<Track> out = new ArrayList<>();
    Set<String> seen = new HashSet<>();
    ArrayDeque<Track> queue = new ArrayDeque<>(start);
    while (!queue.isEmpty()) {
      Track u = queue.poll();
      if (!seen.add(u.point.id())) {
        continue;
      }
      out.add(u);
      for (String id : u.point.upstream()) {
        Track v = tracks.get(id);
        if (v != null) {
          queue.add(v);
        }
      }
    }
    return out;
  }

  // ---- formatting ---------------------------------------------------------------------------

  private static String name(CoolingWater w) {
    return w.name().toLowerCase(Locale.ROOT).replace('_', ' ');
  }

  /** Formats with numbers to three significant digits (strings pass through). */
  static String format(String fmt, Object... args) {
    Object[] o = new Object[args.length];
    for (int k = 0; k < args.length; k++) {
      o[k] = args[k] instanceof Double d ? num(d) : args[k];
    }
    return String.format(Locale.ROOT, fmt, o);
  }

  private static String num(double v) {
    if (Double.isNaN(v)) {
      return "NaN";
    }
    return String.format(Locale.ROOT, "%.3g", v);
  }

  private static String signed(double v) {
    return (v >= 0 ? "+" : "") + num(v);
  }

  static long minuteOf(Instant t) {
    return Math.floorDiv(t.getEpochSecond(), 60);
  }

  // ---- one point's series on the minute grid ------------------------------------------------

  /** A point's channels on a minute grid, with baselines and deviations computed on demand. */
  static final class Track {
    final Point point;
    final long gridStart;
    final int size;
    final Map<Channel, double[]> values = new EnumMap<>(Channel.class);
    private final Map<Channel, Map<Integer, Stat>> baselines = new EnumMap<>(Channel.class);
    private final Map<Channel, double[]> recentCache = new EnumMap<>(Channel.class);
    private final boolean[] any;
    private final Map<Channel, byte[]> sigCache = new EnumMap<>(Channel.class);

    private final int baselineMinutes;
    private final int baselineGapMinutes;

    Track(Series s, long gridStart, long last, Settings settings) {
      this.baselineMinutes = (int) settings.baselinePeriod().toMinutes();
      this.baselineGapMinutes = (int) settings.baselineGap().toMinutes();
      this.point = s.point();
      this.gridStart = gridStart;
      this.size = (int) (last - gridStart + 1);
      this.any = new boolean[size];
      for (Channel c : Channel.values()) {
        double[] v = new double[size];
        Arrays.fill(v, Double.NaN);
        values.put(c, v);
      }
      for (Minute m : s.minutes()) {
        long minute = minuteOf(m.time());
        if (minute < gridStart || minute > last) {
          continue;
        }
        int i = (int) (minute - gridStart);
        for (Channel c : Channel.values()) {
          double x = m.value(c);
          if (Double.isFinite(x)) {
            values.get(c)[i] = x;
            any[i] = true;
          }
        }
      }
    }

    Instant timeOf(int i) {
      return Instant.ofEpochSecond((gridStart + i) * 60);
    }

    boolean hasAny(int i) {
      return i >= 0 && i < size && any[i];
    }

    /** Baseline and spread. */
    record Stat(double median, double spread, int count) {
      boolean valid() {
        return count >= MINIMUM_BASELINE_MINUTES && !Double.isNaN(median);
      }
    }

    private static final Stat NONE = new Stat(Double.NaN, Double.NaN, 0);

    Stat baseline(Channel c, int i) {
      if (i < 0 || i >= size) {
        return NONE;
      }
      long minute = gridStart + i;
      long quarter = Math.floorDiv(minute, 15) * 15;
      int end = (int) (quarter - gridStart - baselineGapMinutes); // exclusive
      return baselines
          .computeIfAbsent(c, k -> new HashMap<>())
          .computeIfAbsent(end, e -> stat(values.get(c), e - baselineMinutes, e));
    }

    private static Stat stat(double[] v, int from, int to) {
      from = Math.max(0, from);
      to = Math.min(v.length, to);
      if (to <= from) {
        return NONE;
      }
      double[] xs = new double[to - from];
      int n = 0;
      for (int k = from; k < to; k++) {
        if (!Double.isNaN(v[k])) {
          xs[n++] = v[k];
        }
      }
      if (n == 0) {
        return NONE;
      }
      double median = median(xs, n);
      for (int k = 0; k < n; k++) {
        xs[k] = Math.abs(xs[k] - median);
      }
      double mad = median(xs, n);
      return new Stat(median, 1.4826 * mad, n);
    }

    static double median(double[] xs, int n) {
      Arrays.sort(xs, 0, n);
      return n % 2 == 1 ? xs[n / 2] : 0.5 * (xs[n / 2 - 1] + xs[n / 2]);
    }

    boolean has(Channel c, int i) {
      return !Double.isNaN(recent(c, i)) && baseline(c, i).valid();
    }

    /**
     * Median of the last three minutes' values; without any, the latest value of the last ten
     * minutes; NaN when none.
     */
    double recent(Channel c, int i) {
      if (i < 0 || i >= size) {
        return Double.NaN;
      }
      double[] cache =
          recentCache.computeIfAbsent(
              c,
              k -> {
                double[] a = new double[size];
                Arrays.fill(a, Double.MIN_VALUE);
                return a;
              });
      if (cache[i] != Double.MIN_VALUE) {
        return cache[i];
      }
      double[] v = values.get(c);
      double[] xs = new double[RECENT_MINUTES];
      int n = 0;
      for (int k = Math.max(0, i - RECENT_MINUTES + 1); k <= i; k++) {
        if (!Double.isNaN(v[k])) {
          xs[n++] = v[k];
        }
      }
      double r = n == 0 ? Double.NaN : median(xs, n);
      if (n == 0) {
        // a point read every few minutes: its latest value stands until the next one
        for (int k = i - RECENT_MINUTES; k >= Math.max(0, i - MAX_GAP_MINUTES); k--) {
          if (!Double.isNaN(v[k])) {
            r = v[k];
            break;
          }
        }
      }
      cache[i] = r;
      return r;
    }

    /** recent − baseline, NaN without both. */
    double dev(Channel c, int i) {
      Stat b = baseline(c, i);
      if (!b.valid()) {
        return Double.NaN;
      }
      return recent(c, i) - b.median();
    }

    /** Median of the last n minutes' values minus the baseline (NaN without both). */
    double devOver(Channel c, int i, int n) {
      Stat b = baseline(c, i);
      if (!b.valid() || i < 0 || i >= size) {
        return Double.NaN;
      }
      double[] v = values.get(c);
      double[] xs = new double[n];
      int k = 0;
      for (int j = Math.max(0, i - n + 1); j <= i; j++) {
        if (!Double.isNaN(v[j])) {
          xs[k++] = v[j];
        }
      }
      return k == 0 ? Double.NaN : median(xs, k) - b.median();
    }

    /** log10(recent / baseline) of a positive channel. */
    double logDev(Channel c, int i) {
      Stat b = baseline(c, i);
      double r = recent(c, i);
      if (!b.valid() || !(r > 0) || !(b.median() > 0)) {
        return Double.NaN;
      }
      return Math.log10(r / b.median());
    }

    /** The deviation beyond which a change counts (see the class notes). */
    double threshold(Channel c, int i) {
      Stat b = baseline(c, i);
      double spread = 4 * b.spread();
      double base = Math.abs(b.median());
      double floor =
          switch (c) {
            case SPECIFIC ->
                point.regime() == Regime.MAKE_UP
                    ? Math.max(0.03, 0.3 * base)
                    : Math.max(0.02, 0.03 * base); // SC tolerance ±2 %
            case CATION, DEGASSED -> Math.max(0.02, 0.1 * base); // ±0.01 µS/cm tolerance
            case SODIUM -> Math.max(0.5, 0.2 * base); // ±10 % tolerance, analyser resolution
            // measured ±0.05 pH and calculated ±0.01 (SC ±2 %) with a margin
            case PH, PH_CALCULATED, PH_RESIDUAL -> 0.08;
          };
      return Math.max(spread, floor);
    }

    /** +1 / −1 when the recent value is significantly above / below its baseline, else 0. */
    int sig(Channel c, int i) {
      if (i < 0 || i >= size) {
        return 0;
      }
      byte[] cache = sigCache.computeIfAbsent(c, k -> new byte[size]);
      if (cache[i] != 0) {
        return cache[i] - 2;
      }
      double d = dev(c, i);
      int s = 0;
      if (!Double.isNaN(d)) {
        double thr = threshold(c, i);
        s = d > thr ? 1 : d < -thr ? -1 : 0;
      }
      cache[i] = (byte) (s + 2);
      return s;
    }

    /** Significantly above its baseline at any minute of the last {@code window} minutes. */
    boolean recentlySignificant(Channel c, int i, int window) {
      for (int k = Math.max(0, i - window); k <= i && k < size; k++) {
        if (sig(c, k) > 0) {
          return true;
        }
      }
      return false;
    }

    /** The first minute of the current run of significant change in any channel, or −1. */
    int onset(int i) {
      int found = -1;
      for (Channel c :
          new Channel[] {Channel.CATION, Channel.SODIUM, Channel.SPECIFIC, Channel.DEGASSED}) {
        if (c == Channel.SPECIFIC && point.regime() != Regime.MAKE_UP) {
          continue;
        }
        int k = i;
        boolean inRun = false;
        // allow the change to have ended a little before i (transport lag to downstream points)
        for (int back = 0; back <= NEIGHBOUR_WINDOW && k - back >= 0; back++) {
          if (sig(c, k - back) > 0) {
            k = k - back;
            inRun = true;
            break;
          }
        }
        if (!inRun) {
          continue;
        }
        while (k - 1 >= 0 && sig(c, k - 1) > 0) {
          k--;
        }
        if (found < 0 || k < found) {
          found = k;
        }
      }
      return found;
    }

    /**
     * True when the deviation built up slowly: fifteen minutes after the run of significant change
     * began, less than half of today's deviation was there.
     */
    boolean gradual(Channel c, int i) {
      int k = i;
      while (k - 1 >= 0 && sig(c, k - 1) > 0 && i - k < 24 * 60) {
        k--;
      }
      // k: first significant minute of the run; look back to where the rise began
      int start = k;
      while (start - 1 >= 0
          && dev(c, start - 1) > 0.25 * threshold(c, start - 1)
          && k - start < 24 * 60) {
        start--;
      }
      double now = dev(c, i);
      double early = dev(c, Math.min(i, start + 15));
      return i - start >= 30 && !Double.isNaN(early) && early < 0.5 * now;
    }

    /**
     * True when the latest change of the channel happened within fifteen minutes: its five-minute
     * median moved by at least 60 % of today's deviation within some fifteen minutes of the last
     * eight hours.
     */
    boolean stepLike(Channel c, int i) {
      double now = dev(c, i);
      if (Double.isNaN(now)) {
        return false;
      }
      for (int k = i; k >= Math.max(15, i - 8 * 60); k--) {
        double a = recent(c, k);
        double b = recent(c, k - 15);
        if (!Double.isNaN(a)
            && !Double.isNaN(b)
            && Math.abs(a - b) >= 0.6 * Math.abs(now)
            && Math.signum(a - b) == Math.signum(now)) {
          return true;
        }
      }
      return false;
    }

    /**
     * Two-sided Page cumulative sum of the pH residual's minute values against today's baseline
     * over the window, reference value {@link #CUSUM_K}; the larger side (pH·min).
     */
    double cusum(int i, Duration window) {
      Stat b = baseline(Channel.PH_RESIDUAL, i);
      if (!b.valid()) {
        return 0;
      }
      double k = Math.max(CUSUM_K, 3 * b.spread());
      double[] v = values.get(Channel.PH_RESIDUAL);
      double hi = 0;
      double lo = 0;
      int previous = -1;
      for (int j = Math.max(0, i - (int) window.toMinutes()); j <= i; j++) {
        double x = v[j];
        if (Double.isNaN(x)) {
          continue;
        }
        // each value stands for the minutes since the previous one (at most 10), so readings every
        // 5 min sum as fast as readings every minute
        int minutes = previous < 0 ? 1 : Math.min(10, j - previous);
        previous = j;
        x -= b.median();
        hi = Math.min(2 * CUSUM_H, Math.max(0, hi + minutes * (x - k)));
        lo = Math.min(2 * CUSUM_H, Math.max(0, lo + minutes * (-x - k)));
      }
      return Math.max(hi, lo);
    }
  }
}
