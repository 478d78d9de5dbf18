package org.kwanta.service.reports;

import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.kwanta.model.Parameter;
import org.kwanta.model.limits.Classification;
import org.kwanta.model.limits.Excursions;
import org.kwanta.model.limits.Level;
import org.kwanta.model.limits.MonthlyHours;
import org.kwanta.service.instruments.Availability;
import org.kwanta.service.instruments.CheckSchedule;
import org.kwanta.service.instruments.GrabComparisons;
import org.kwanta.service.instruments.InstrumentLog;
import org.kwanta.service.limits.ExcursionFinder;
import org.kwanta.service.limits.Limits;
import org.kwanta.service.operatingstate.OperatingStates;
import org.kwanta.service.operatingstate.ServiceTime;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Service;

/**
 * Builds a plant's report over a period from what is stored: the blocks' operating states, the
 * readings classified against the limits in force at their time (as reported), excursion events,
 * the instrument log and the availability counts. Nothing is stored; the same period gives the same
 * report until data for it change.
 */
@Service
class Reports {

  /**
   * How far before the period readings are classified, so that a level running into it is whole.
   */
  static final Duration LOOKBACK = Duration.ofDays(8);

  static final String COUNTING =
      "in-service hours: IN_SERVICE time and time before a block's first recorded state";

  static final String ADVISORY =
      "Advisory. Default limits are examples recalled from IAPWS guidance (from memory — verify);"
          + " the plant's own limits and procedures govern.";

  static final String NO_GRABS =
      "no grab or lab result in the period had an online value to compare with (compared: ph, the"
          + " conductivities, sodium, silica, dissolved_oxygen)";

  private final JdbcClient jdbc;
  private final Limits limits;
  private final ExcursionFinder finder;
  private final OperatingStates states;
  private final Availability availability;
  private final CheckSchedule schedule;
  private final InstrumentLog log;
  private final GrabComparisons grabs;
  private final Clock clock;

  Reports(
      JdbcClient jdbc,
      Limits limits,
      ExcursionFinder finder,
      OperatingStates states,
      Availability availability,
      CheckSchedule schedule,
      InstrumentLog log,
      GrabComparisons grabs,
      Clock clock) {
    this.grabs = grabs;
    this.jdbc = jdbc;
    this.limits = limits;
    this.finder = finder;
    this.states = states;
    this.availability = availability;
    this.schedule = schedule;
    this.log = log;
    this.clock = clock;
  }

  /** The report of a plant over [from, to), as reported; see the overload. */
  Report build(
      String plant, String plantName, String period, String label, Instant from, Instant to) {
    return build(plant, plantName, period, label, from, to, ExcursionFinder.Basis.AS_REPORTED);
  }

  /**
   * The report of a plant over [from, to); a period reaching past now is reported up to now. The
   * hours per level judge each value by the limits in force at its time ({@code AS_REPORTED}) or by
   * today's ({@code RECOMPUTED}), as the excursions endpoint does.
   */
  Report build(
      String plant,
      String plantName,
      String period,
      String label,
      Instant from,
      Instant to,
      ExcursionFinder.Basis basis) {
    Instant now = clock.instant();
    Instant asOf = to.isAfter(now) ? now : to;
    List<Report.BlockTime> blocks = new ArrayList<>();
    Map<String, ServiceTime> service = new TreeMap<>();
    for (String block : blocks(plant)) {
      ServiceTime t = states.serviceTime(plant, block, from, asOf.isAfter(from) ? asOf : from);
      service.put(block, t);
      Map<String, Double> byState = new TreeMap<>();
      t.byState().forEach((s, d) -> byState.put(s.name(), hours(d)));
      blocks.add(new Report.BlockTime(block, hours(t.inService()), hours(t.unrecorded()), byState));
    }
    List<Report.Channel> channels = new ArrayList<>();
    List<Map<Level, Double>> channelHours = new ArrayList<>();
    for (Limits.Point point : limits.points(plant, null)) {
      ServiceTime t = service.get(point.block());
      if (!asOf.isAfter(from)) {
        continue;
      }
      for (Map.Entry<Parameter, Limits.History> limitsOf :
          finder.histories(point, basis).entrySet()) {
        Parameter p = limitsOf.getKey();
        List<Classification> classified =
            finder.classify(point, limitsOf.getValue(), p, from.minus(LOOKBACK), asOf);
        if (classified.isEmpty()) {
          continue;
        }
        Map<Level, Double> byLevel = new EnumMap<>(Level.class);
        for (MonthlyHours h : Excursions.monthlyHours(classified, asOf, t.counted())) {
          byLevel.merge(h.level(), h.hours(), Double::sum);
        }
        double total = byLevel.values().stream().mapToDouble(Double::doubleValue).sum();
        if (total == 0) {
          continue;
        }
        Map<String, Double> named = new LinkedHashMap<>();
        for (Level l : Level.values()) {
          if (l == l.actionLevel()) {
            named.put(l.name(), byLevel.getOrDefault(l, 0.0));
          }
        }
        channelHours.add(byLevel);
        channels.add(
            new Report.Channel(
                point.id(),
                point.block(),
                p.code(),
                p.unit(),
                total,
                named,
                PerformanceIndex.penalty(byLevel)));
      }
    }
    List<Report.Instrument> instruments =
        availability.of(plant, from, asOf.isAfter(from) ? asOf : from).stream()
            .map(
                i ->
                    new Report.Instrument(
                        i.samplePoint(),
                        i.block(),
                        i.parameter().code(),
                        i.slot().toSeconds(),
                        i.slotsInService(),
                        i.slotsWithData(),
                        i.slotsGood(),
                        i.availability(),
                        i.completeness()))
            .toList();
    List<InstrumentLog.Check> checks = log.plantChecks(plant, asOf);
    List<Report.CheckStatus> calibration =
        schedule.at(plant, asOf).stream()
            .map(
                d ->
                    new Report.CheckStatus(
                        d.samplePoint(),
                        d.parameter().code(),
                        d.kind().name(),
                        d.lastDone(),
                        d.nextDue(),
                        d.status().name(),
                        (int)
                            checks.stream()
                                .filter(
                                    c ->
                                        c.samplePoint().equals(d.samplePoint())
                                            && c.parameter() == d.parameter()
                                            && c.kind() == d.kind()
                                            && !c.performedAt().isBefore(from))
                                .count()))
            .toList();
    PerformanceIndex.Result index =
        PerformanceIndex.of(
            channelHours, instruments.stream().map(Report.Instrument::availability).toList());
    return new Report(
        plant,
        plantName,
        period,
        label,
        from,
        to,
        asOf,
        COUNTING,
        ADVISORY,
        blocks,
        channels,
        events(plant, from, to),
        instruments,
        calibration,
        grabVsOnline(plant, from, to),
        new Report.Index(
            index.index(),
            index.chemistryScore(),
            index.availabilityScore(),
            index.channels(),
            index.instruments(),
            "I = 100·(0.8·S + 0.2·A), S = 1 − mean channel penalty, penalty = (0.25·h_AL1 +"
                + " 0.5·h_AL2 + h_AL3 + h_SHUTDOWN) / in-service hours, A = mean core-instrument"
                + " availability (docs/report.md)"),
        basis.code());
  }

  private List<String> blocks(String plant) {
    return jdbc.sql("SELECT id FROM plant_block WHERE plant_id = ? ORDER BY id")
        .param(plant)
        .query(String.class)
        .list();
  }

  /**
   * Events with an excursion at the plant that started in the period, and events still not closed
   * with one that started before the period's end; status and cause as they stand now.
   */
  private List<Report.Event> events(String plant, Instant from, Instant to) {
    return jdbc
        .sql(
            """
            SELECT ev.id, ev.title, ev.created_at,
                   (SELECT x.status FROM excursion_event_entry x
                    WHERE x.event_id = ev.id AND x.status IS NOT NULL ORDER BY x.id DESC LIMIT 1),
                   (SELECT x.cause_category FROM excursion_event_entry x
                    WHERE x.event_id = ev.id AND x.cause_category IS NOT NULL ORDER BY x.id DESC LIMIT 1),
                   (SELECT string_agg(m.sample_point_id || '/' || m.parameter || '@'
                                      || to_char(m.excursion_start AT TIME ZONE 'UTC',
                                                 'YYYY-MM-DD"T"HH24:MI:SS"Z"'), ' '
                                      ORDER BY m.excursion_start)
                    FROM excursion_event_member m WHERE m.event_id = ev.id),
                   bool_or(m.excursion_start >= ?)
            FROM excursion_event ev
            JOIN excursion_event_member m ON m.event_id = ev.id
            JOIN sample_point s ON s.id = m.sample_point_id
            WHERE s.plant_id = ? AND m.excursion_start < ?
            GROUP BY ev.id, ev.title, ev.created_at
            ORDER BY ev.id""")
        .params(java.sql.Timestamp.from(from), plant, java.sql.Timestamp.from(to))
        .query(
            (rs, i) -> {
              String status = rs.getString(4);
              boolean inPeriod = rs.getBoolean(7);
              if (!inPeriod && "CLOSED".equals(status)) {
                return null;
              }
              String members = rs.getString(6);
              return new Report.Event(
                  rs.getLong(1),
                  rs.getString(2),
                  rs.getTimestamp(3).toInstant(),
                  status,
                  rs.getString(5),
                  members == null ? List.of() : List.of(members.split(" ")));
            })
        .list()
        .stream()
        .filter(java.util.Objects::nonNull)
        .toList();
  }

  private static double hours(Duration d) {
    return d.toMillis() / 3_600_000.0;
  }

  /** The grab vs online section: every comparison in [from, to) and a summary per instrument. */
  Report.GrabVsOnline grabVsOnline(String plant, Instant from, Instant to) {
    List<GrabComparisons.Comparison> all = grabs.plantBetween(plant, from, to);
    List<Report.GrabRow> rows =
        all.stream()
            .map(
                c ->
                    new Report.GrabRow(
                        c.samplePoint(),
                        c.parameter().code(),
                        c.parameter().unit(),
                        c.grabTime(),
                        c.source(),
                        c.sampleId(),
                        c.grabValue(),
                        c.censored(),
                        (c.censored() == null ? "" : "< ") + c.grabValue(),
                        c.onlineValue(),
                        c.deviation(),
                        c.tolerance(),
                        c.withinTolerance(),
                        c.verdict().name()))
            .toList();
    java.util.Map<String, List<GrabComparisons.Comparison>> byInstrument =
        new java.util.TreeMap<>();
    for (GrabComparisons.Comparison c : all) {
      byInstrument
          .computeIfAbsent(
              c.samplePoint() + "\u0000" + c.parameter().code(), k -> new java.util.ArrayList<>())
          .add(c);
    }
    List<Report.GrabAgreement> instruments = new java.util.ArrayList<>();
    for (List<GrabComparisons.Comparison> cs : byInstrument.values()) {
      GrabComparisons.Comparison first = cs.get(0);
      instruments.add(
          new Report.GrabAgreement(
              first.samplePoint(),
              first.parameter().code(),
              first.parameter().unit(),
              cs.size(),
              (int) cs.stream().filter(GrabComparisons.Comparison::withinTolerance).count(),
              cs.stream().mapToDouble(GrabComparisons.Comparison::deviation).average().orElse(0),
              cs.stream().mapToDouble(c -> Math.abs(c.deviation())).max().orElse(0),
              cs.get(cs.size() - 1).verdict().name()));
    }
    String note =
        rows.isEmpty()
            ? NO_GRABS
            : rows.size()
                + " grab or lab results compared with the online instrument at their point"
                + " (online value: the latest in the 15 minutes up to the grab; deviation = online"
                + " − grab)";
    return new Report.GrabVsOnline(true, note, GrabComparisons.TOLERANCE_SOURCE, instruments, rows);
  }
}
