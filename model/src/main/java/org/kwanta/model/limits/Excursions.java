package org.kwanta.model.limits;

import java.time.Duration;
import java.time.Instant;
import java.time.YearMonth;
import java.time.ZoneOffset;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.TreeMap;

/**
 * Builds excursions and monthly hours per level from a classified series.
 *
 * <p>An excursion is a continuous stretch at AL1 or above; time OUTSIDE_NORMAL is never an
 * excursion. Samples whose instrument was in doubt count like any other, and each excursion says
 * how many of its samples were in doubt.
 *
 * <p>The level timeline is back-dated to the onset of each level ({@link
 * Classification#levelSince()}), so an excursion starts when the value first crossed AL1, not when
 * the persistence delay confirmed it. The customary allowances (AL1 one week, AL2 24 hours, AL3
 * four hours) are the IAPWS technical guidance usage, recalled from memory — verify.
 */
public final class Excursions {

  private Excursions() {}

  /**
   * The level timeline: spans of constant confirmed level (OUTSIDE_NORMAL included) from the first
   * sample to {@code asOf}.
   *
   * @param classified a classified series (from {@link Classifier#classify})
   * @param asOf the evaluation time; not before the last sample
   */
  public static List<LevelSpan> timeline(List<Classification> classified, Instant asOf) {
    List<LevelSpan> spans = new ArrayList<>();
    if (classified.isEmpty()) {
      return spans;
    }
    Instant last = classified.get(classified.size() - 1).time();
    if (asOf.isBefore(last)) {
      throw new IllegalArgumentException("asOf " + asOf + " is before the last sample " + last);
    }
    Level level = classified.get(0).level();
    Instant start = classified.get(0).levelSince();
    for (Classification c : classified) {
      if (c.level() != level) {
        spans.add(new LevelSpan(level, start, c.levelSince()));
        level = c.level();
        start = c.levelSince();
      }
    }
    spans.add(new LevelSpan(level, start, asOf));
    return List.copyOf(spans);
  }

  /**
   * The excursions of a classified series, oldest first.
   *
   * @param profile the profile the series was classified with (for the side of the excursion)
   * @param classified the classified series
   * @param asOf the evaluation time, for running excursions; not before the last sample
   */
  public static List<Excursion> of(
      LimitProfile profile, List<Classification> classified, Instant asOf) {
    return of(LimitTimeline.of(profile), classified, asOf);
  }

  /**
   * The excursions of a series classified over changing limits, oldest first.
   *
   * @param limits the limits the series was classified with (each sample's side is read against the
   *     profile in force at its time)
   * @param classified the classified series
   * @param asOf the evaluation time, for running excursions; not before the last sample
   */
  public static List<Excursion> of(
      LimitTimeline limits, List<Classification> classified, Instant asOf) {
    List<LevelSpan> timeline = timeline(classified, asOf);
    List<Excursion> out = new ArrayList<>();
    int i = 0;
    while (i < timeline.size()) {
      if (!timeline.get(i).level().isAction()) {
        i++;
        continue;
      }
      int j = i;
      while (j + 1 < timeline.size() && timeline.get(j + 1).level().isAction()) {
        j++;
      }
      boolean running = j == timeline.size() - 1;
      out.add(build(limits, classified, timeline.subList(i, j + 1), running, asOf));
      i = j + 1;
    }
    return List.copyOf(out);
  }

  private static Excursion build(
      LimitTimeline limits,
      List<Classification> classified,
      List<LevelSpan> spans,
      boolean running,
      Instant asOf) {
    Instant start = spans.get(0).start();
    Instant stop = spans.get(spans.size() - 1).end();
    Side side = null;
    Classification peak = null;
    int samples = 0;
    int inDoubt = 0;
    int calculated = 0;
    for (Classification c : classified) {
      if (c.time().isBefore(start) || !c.time().isBefore(stop) && !running) {
        continue;
      }
      samples++;
      inDoubt += c.instrumentInDoubt() ? 1 : 0;
      calculated += c.calculatedValue() ? 1 : 0;
      if (side == null) {
        side = limits.at(c.time()).flatMap(p -> p.sideOf(c.value())).orElse(null);
        if (side == null) {
          continue;
        }
      }
      if (peak == null
          || (side == Side.HIGH ? c.value() > peak.value() : c.value() < peak.value())) {
        peak = c;
      }
    }
    if (peak == null) {
      // The onset sample lies beyond a threshold, so this cannot happen for a series from the
      // Classifier; guard against hand-made input.
      throw new IllegalArgumentException("No sample beyond a threshold in " + spans);
    }
    Level highest = Level.NORMAL;
    for (LevelSpan s : spans) {
      if (s.level().severity() > highest.severity()) {
        highest = s.level();
      }
    }
    Level current = running ? spans.get(spans.size() - 1).level() : Level.NORMAL;
    boolean exceeded = false;
    Instant deadline = null;
    for (int l = 1; l <= highest.severity(); l++) {
      Level level = Level.ofSeverity(l);
      Duration allowance = level.allowance().orElseThrow();
      Instant stintStart = null;
      for (LevelSpan s : spans) {
        if (s.level().severity() >= l) {
          if (stintStart == null) {
            stintStart = s.start();
          }
          if (Duration.between(stintStart, s.end()).compareTo(allowance) > 0) {
            exceeded = true;
          }
        } else {
          stintStart = null;
        }
      }
      if (running && l <= current.severity() && stintStart != null) {
        Instant d = stintStart.plus(allowance);
        if (deadline == null || d.isBefore(deadline)) {
          deadline = d;
        }
      }
    }
    return new Excursion(
        start,
        running ? Optional.empty() : Optional.of(stop),
        side,
        peak.value(),
        peak.time(),
        highest,
        current,
        Duration.between(start, stop),
        highest.allowance().orElseThrow(),
        Optional.ofNullable(deadline),
        Optional.ofNullable(deadline).map(d -> Duration.between(asOf, d)),
        exceeded,
        spans,
        samples,
        inDoubt,
        calculated);
  }

  /**
   * Time per action level per calendar month (UTC), from the level timeline, split at month
   * boundaries. Time OUTSIDE_NORMAL counts as NORMAL here: it is not excursion time. Months and
   * levels with no time are left out.
   */
  public static List<MonthlyHours> monthlyHours(List<Classification> classified, Instant asOf) {
    return monthlyHours(classified, asOf, null);
  }

  /**
   * Time per action level per calendar month (UTC) as {@link #monthlyHours(List, Instant)},
   * counting only the time inside {@code counted} (for instance the stretches the block was in
   * service).
   *
   * @param counted windows that do not overlap one another; null counts all time
   */
  public static List<MonthlyHours> monthlyHours(
      List<Classification> classified, Instant asOf, List<TimeWindow> counted) {
    Map<YearMonth, Map<Level, Duration>> sums = new TreeMap<>();
    for (LevelSpan span : timeline(classified, asOf)) {
      Instant from = span.start();
      while (from.isBefore(span.end())) {
        YearMonth month = YearMonth.from(from.atOffset(ZoneOffset.UTC));
        Instant monthEnd = month.plusMonths(1).atDay(1).atStartOfDay().toInstant(ZoneOffset.UTC);
        Instant to = monthEnd.isBefore(span.end()) ? monthEnd : span.end();
        Duration time =
            counted == null ? Duration.between(from, to) : TimeWindow.overlap(counted, from, to);
        if (!time.isZero()) {
          sums.computeIfAbsent(month, m -> new EnumMap<>(Level.class))
              .merge(span.level().actionLevel(), time, Duration::plus);
        }
        from = to;
      }
    }
    List<MonthlyHours> out = new ArrayList<>();
    sums.forEach((m, byLevel) -> byLevel.forEach((l, d) -> out.add(new MonthlyHours(m, l, d))));
    return List.copyOf(out);
  }
}
