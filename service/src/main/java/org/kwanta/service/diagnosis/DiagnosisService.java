package org.kwanta.service.diagnosis;

import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.concurrent.ConcurrentHashMap;
import org.kwanta.model.diagnosis.CoolingWater;
import org.kwanta.model.diagnosis.Diagnoser;
import org.kwanta.model.diagnosis.Minute;
import org.kwanta.model.evaluation.Finding;
import org.kwanta.service.ingest.EvaluationRunner;
import org.kwanta.service.ingest.EvaluationView;
import org.kwanta.service.ingest.IngestService;
import org.kwanta.service.ingest.ReadingHistory;
import org.kwanta.service.ingest.ReadingInput;
import org.kwanta.service.ingest.ValidReading;
import org.kwanta.service.samplepoints.SamplePointConfigs;
import org.kwanta.service.system.ProblemException;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Service;

/**
 * Runs the diagnosis over time ({@link Diagnoser}) on stored data, and on posted readings for
 * what-if work (stored nowhere). Reads a point's minute series with its neighbours on the cycle.
 */
@Service
public class DiagnosisService {

  /** Longest range one request may diagnose. */
  static final Duration MAX_RANGE = Duration.ofDays(7);

  /** How long the plant-wide current diagnosis is reused (the page and metrics poll it). */
  static final Duration CURRENT_TTL = Duration.ofSeconds(20);

  private final JdbcClient jdbc;
  private final MinuteSeries minutes;
  private final EvaluationRunner runner;
  private final ReadingHistory readings;
  private final SamplePointConfigs configs;
  private final IngestService ingest;
  private final Clock clock;
  private final Diagnoser diagnoser;
  private final Map<String, Current> current = new ConcurrentHashMap<>();
  private final MinuteWindows windows;

  DiagnosisService(
      JdbcClient jdbc,
      MinuteSeries minutes,
      MinuteWindows windows,
      EvaluationRunner runner,
      ReadingHistory readings,
      SamplePointConfigs configs,
      IngestService ingest,
      Clock clock,
      DiagnosisProperties properties) {
    this.diagnoser = new Diagnoser(properties.settings());
    this.jdbc = jdbc;
    this.minutes = minutes;
    this.windows = windows;
    this.runner = runner;
    this.readings = readings;
    this.configs = configs;
    this.ingest = ingest;
    this.clock = clock;
  }

  /** The findings of a point at one minute. */
  public record PointDiagnosis(Instant time, List<Finding> findings) {}

  private record Current(
      Instant computedAt,
      Map<String, Long> generations,
      Map<String, Diagnoser.Point> points,
      Map<String, PointDiagnosis> byPoint) {}

  /** The points of a plant as the diagnosis sees them. */
  Map<String, Diagnoser.Point> points(String plantId) {
    String water =
        jdbc.sql("SELECT cooling_water FROM plant WHERE id = ?")
            .param(plantId)
            .query(String.class)
            .optional()
            .orElse(null);
    CoolingWater coolingWater = water == null ? null : CoolingWater.valueOf(water);
    Map<String, Diagnoser.Point> out = new LinkedHashMap<>();
    jdbc.sql(
            "SELECT id, treatment_regime, upstream FROM sample_point WHERE plant_id = ? ORDER BY id")
        .param(plantId)
        .query(
            rs -> {
              String id = rs.getString(1);
              out.put(
                  id,
                  new Diagnoser.Point(
                      id,
                      SamplePointConfigs.regime(rs.getString(2)),
                      coolingWater,
                      List.of((String[]) rs.getArray(3).getArray())));
            });
    return out;
  }

  private String plantOf(String samplePointId) {
    return jdbc.sql("SELECT plant_id FROM sample_point WHERE id = ?")
        .param(samplePointId)
        .query(String.class)
        .optional()
        .orElseThrow(() -> ProblemException.notFound("sample point", samplePointId));
  }

  /** The point, every point upstream of it, and the points it feeds directly. */
  static List<String> related(Map<String, Diagnoser.Point> points, String id) {
    Set<String> out = new LinkedHashSet<>();
    out.add(id);
    ArrayDeque<String> queue = new ArrayDeque<>(points.get(id).upstream());
    while (!queue.isEmpty()) {
      String u = queue.poll();
      Diagnoser.Point p = points.get(u);
      if (p != null && out.add(u)) {
        queue.addAll(p.upstream());
      }
    }
    for (Diagnoser.Point p : points.values()) {
      if (p.upstream().contains(id)) {
        out.add(p.id());
      }
    }
    return List.copyOf(out);
  }

  /** The diagnosis of a stored point, minute by minute over [from, to]. */
  public List<Diagnoser.Diagnosed> overTime(String samplePointId, Instant from, Instant to) {
    if (to.isBefore(from) || Duration.between(from, to).compareTo(MAX_RANGE) > 0) {
      throw ProblemException.of("from must be before to, at most " + MAX_RANGE.toDays() + " days");
    }
    Map<String, Diagnoser.Point> points = points(plantOf(samplePointId));
    List<String> ids = related(points, samplePointId);
    Instant start = from.minus(diagnoser.settings().lookback());
    Map<String, List<Minute>> series = minutes.load(ids, start, to.plusSeconds(60));
    Map<String, Diagnoser.Series> input = new HashMap<>();
    for (String id : ids) {
      input.put(id, new Diagnoser.Series(points.get(id), series.getOrDefault(id, List.of())));
    }
    return diagnoser.diagnose(input, samplePointId, from, to);
  }

  /**
   * The current diagnosis of every point of a plant: the findings at each point's latest minute
   * with data in the last hour. Computed for the whole plant at once and reused while no new
   * readings of the plant arrive: as is for {@link #CURRENT_TTL}, then checked against the plant's
   * points (a changed declaration recomputes) and cut to the points with data in the last hour.
   */
  public Map<String, PointDiagnosis> current(String plantId) {
    Instant now = clock.instant();
    // every ingest transaction gives the points it wrote a new generation (migration V31): a
    // cached answer is reused only while no new data came in
    Map<String, Long> generations = readings.generationsByPoint(plantId);
    Current c = current.get(plantId);
    if (c != null
        && c.generations().equals(generations)
        && Duration.between(c.computedAt(), now).compareTo(CURRENT_TTL) < 0) {
      return c.byPoint();
    }
    Map<String, Diagnoser.Point> points = points(plantId);
    if (c != null && c.generations().equals(generations) && c.points().equals(points)) {
      // No new reading and the same points since it was computed: the diagnosis at each point's
      // latest minute depends only on the minutes up to it (Diagnoser is a pure function of
      // them), so it is the same; only the points whose latest minute has left the last hour
      // drop out. The 200-point board spent seconds recomputing this every CURRENT_TTL.
      Instant cutOff = now.minus(Duration.ofHours(1));
      Map<String, PointDiagnosis> kept = new HashMap<>();
      c.byPoint()
          .forEach(
              (id, d) -> {
                if (!d.time().isBefore(cutOff)) {
                  kept.put(id, d);
                }
              });
      Map<String, PointDiagnosis> result = Map.copyOf(kept);
      current.put(plantId, new Current(now, generations, points, result));
      return result;
    }
    // whole minutes, read again only from where something changed (MinuteWindows)
    Instant start =
        now.minus(diagnoser.settings().lookback())
            .minus(Duration.ofHours(1))
            .truncatedTo(ChronoUnit.MINUTES);
    Map<String, List<Minute>> series =
        windows.load(
            plantId, List.copyOf(points.keySet()), generations, start, now.plusSeconds(60));
    Map<String, Diagnoser.Series> input = new HashMap<>();
    points.forEach(
        (id, p) -> input.put(id, new Diagnoser.Series(p, series.getOrDefault(id, List.of()))));
    Map<String, PointDiagnosis> out = new HashMap<>();
    for (String id : points.keySet()) {
      List<Minute> own = series.getOrDefault(id, List.of());
      if (own.isEmpty()) {
        continue;
      }
      Instant last = own.get(own.size() - 1).time();
      if (last.isBefore(now.minus(Duration.ofHours(1)))) {
        continue;
      }
      // only the series the point's diagnosis reads (as overTime): the Diagnoser builds a track of
      // every series it is given, so the whole plant for each point grew with its square
      Map<String, Diagnoser.Series> read = new HashMap<>();
      for (String r : related(points, id)) {
        read.put(r, input.get(r));
      }
      List<Diagnoser.Diagnosed> d = diagnoser.diagnose(read, id, last, last);
      if (!d.isEmpty()) {
        Diagnoser.Diagnosed latest = d.get(d.size() - 1);
        out.put(id, new PointDiagnosis(latest.time(), latest.findings()));
      }
    }
    Map<String, PointDiagnosis> result = Map.copyOf(out);
    current.put(plantId, new Current(now, generations, points, result));
    return result;
  }

  /** The current diagnosis of one point, if it has recent data. */
  public java.util.Optional<PointDiagnosis> currentOf(String plantId, String samplePointId) {
    return java.util.Optional.ofNullable(current(plantId).get(samplePointId));
  }

  /** One minute of a what-if run: the instant checks of its last evaluation and the diagnosis. */
  public record WhatIfMinute(
      Instant time,
      Double specificConductivity25,
      Double cationConductivity25,
      Double degassedCationConductivity25,
      Double phMeasured,
      Double phCalculated25,
      Double sodium,
      List<EvaluationView.FindingView> instantChecks,
      List<Finding> diagnosis) {}

  /**
   * Evaluates and diagnoses posted readings (the point's own and optionally its neighbours') with
   * the stored configuration, storing nothing.
   */
  public List<WhatIfMinute> whatIf(String samplePointId, List<ReadingInput> inputs) {
    String plant = plantOf(samplePointId);
    List<ValidReading> valid = ingest.validateOnly(inputs);
    Map<String, List<EvaluationRunner.StoredReading>> byPoint = new TreeMap<>();
    for (ValidReading r : valid) {
      byPoint
          .computeIfAbsent(r.samplePointId(), k -> new ArrayList<>())
          .add(IngestService.asStored(r));
    }
    if (!byPoint.containsKey(samplePointId)) {
      throw ProblemException.of("no readings of sample point " + samplePointId);
    }
    Map<String, Diagnoser.Point> points = points(plant);
    Map<String, SamplePointConfigs.Versioned> config = configs.current(byPoint.keySet());
    Map<String, Diagnoser.Series> input = new HashMap<>();
    Map<String, TreeMap<Instant, double[]>> rowsByPoint = new HashMap<>();
    Map<String, Map<Instant, List<EvaluationView.FindingView>>> checksByPoint = new HashMap<>();
    for (Map.Entry<String, List<EvaluationRunner.StoredReading>> e : byPoint.entrySet()) {
      String id = e.getKey();
      if (!points.containsKey(id)) {
        throw ProblemException.of("sample point " + id + " is not of plant " + plant);
      }
      List<EvaluationRunner.StoredReading> readings = e.getValue();
      readings.sort(
          Comparator.comparing(EvaluationRunner.StoredReading::time)
              .thenComparing(EvaluationRunner.StoredReading::parameter));
      Instant first = readings.get(0).time();
      Instant last = readings.get(readings.size() - 1).time();
      List<EvaluationRunner.Result> results =
          runner.run(
              config.get(id),
              readings,
              first,
              last,
              Duration.ofMinutes(60),
              Duration.ofMinutes(10));
      // per minute: sc, cation, degassed, calculated pH, measured pH, sodium (last of the minute)
      TreeMap<Instant, double[]> rows = new TreeMap<>();
      Map<Instant, List<EvaluationView.FindingView>> checks = new HashMap<>();
      for (EvaluationRunner.Result r : results) {
        Instant m = r.time().truncatedTo(ChronoUnit.MINUTES);
        double[] row = rows.computeIfAbsent(m, k -> nanRow());
        for (EvaluationView.Compensated c : r.view().compensated()) {
          switch (c.parameter()) {
            case "specific_conductivity" -> row[0] = c.at25USPerCm();
            case "cation_conductivity" -> row[1] = c.at25USPerCm();
            case "degassed_cation_conductivity" -> row[2] = c.at25USPerCm();
            default -> {}
          }
        }
        if (r.view().calculatedPh() != null) {
          row[3] = r.view().calculatedPh().rigorous();
        }
        checks.put(m, r.view().findings());
      }
      for (EvaluationRunner.StoredReading r : readings) {
        if (r.quality() == ValidReading.Quality.BAD.code()) {
          continue;
        }
        Instant m = r.time().truncatedTo(ChronoUnit.MINUTES);
        if ("ph".equals(r.parameter())) {
          rows.computeIfAbsent(m, k -> nanRow())[4] = r.value();
        } else if ("sodium".equals(r.parameter())) {
          rows.computeIfAbsent(m, k -> nanRow())[5] = r.value();
        }
      }
      List<Minute> list = new ArrayList<>(rows.size());
      rows.forEach((t, v) -> list.add(new Minute(t, v[0], v[1], v[2], v[4], v[3], v[5])));
      input.put(id, new Diagnoser.Series(points.get(id), list));
      rowsByPoint.put(id, rows);
      checksByPoint.put(id, checks);
    }
    TreeMap<Instant, double[]> own = rowsByPoint.get(samplePointId);
    List<Diagnoser.Diagnosed> diagnosed =
        diagnoser.diagnose(input, samplePointId, own.firstKey(), own.lastKey());
    List<WhatIfMinute> out = new ArrayList<>(diagnosed.size());
    for (Diagnoser.Diagnosed d : diagnosed) {
      double[] v = own.get(d.time());
      out.add(
          new WhatIfMinute(
              d.time(),
              finite(v[0]),
              finite(v[1]),
              finite(v[2]),
              finite(v[4]),
              finite(v[3]),
              finite(v[5]),
              checksByPoint.get(samplePointId).getOrDefault(d.time(), List.of()),
              d.findings()));
    }
    return out;
  }

  private static double[] nanRow() {
    double[] r = new double[6];
    java.util.Arrays.fill(r, Double.NaN);
    return r;
  }

  private static Double finite(double v) {
    return Double.isFinite(v) ? v : null;
  }

  /** Lower-case name of an enum constant, for JSON. */
  static String wire(Enum<?> e) {
    return e.name().toLowerCase(Locale.ROOT);
  }
}
