package org.kwanta.service.instruments;

import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import org.kwanta.model.Parameter;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Service;

/**
 * When each check of each instrument is next due: the last check that passed or was adjusted plus
 * the interval of its kind ({@link InstrumentCareProperties}). A failed check does not restart the
 * interval. The instruments of a sample point are the parameters it declares plus any with a logged
 * check.
 */
@Service
public class CheckSchedule {

  /** Where a check stands at a time. */
  public enum Status {
    /** Done within its interval. */
    IN_DATE,
    /** Its interval has run out. */
    OVERDUE,
    /** Never done successfully (in this log). */
    NEVER_DONE
  }

  /** One check kind of one instrument at a time. */
  public record Due(
      String samplePoint,
      Parameter parameter,
      CheckKind kind,
      long intervalDays,
      Instant lastDone,
      Outcome lastOutcome,
      Instant lastPerformed,
      Instant nextDue,
      Status status) {}

  private final JdbcClient jdbc;
  private final InstrumentLog log;
  private final InstrumentCareProperties properties;

  CheckSchedule(JdbcClient jdbc, InstrumentLog log, InstrumentCareProperties properties) {
    this.jdbc = jdbc;
    this.log = log;
    this.properties = properties;
  }

  /** Every check of every instrument of a plant, as it stood at {@code at}. */
  public List<Due> at(String plant, Instant at) {
    List<InstrumentLog.Check> checks = log.plantChecks(plant, at);
    List<Due> out = new ArrayList<>();
    for (Instrument instrument : instruments(plant, checks)) {
      for (CheckKind kind : CheckKind.values()) {
        if (!kind.scheduled() || !kind.appliesTo(instrument.parameter())) {
          continue;
        }
        InstrumentLog.Check lastDone = null;
        InstrumentLog.Check last = null;
        for (InstrumentLog.Check c : checks) {
          if (c.samplePoint().equals(instrument.samplePoint())
              && c.parameter() == instrument.parameter()
              && c.kind() == kind) {
            last = c;
            if (c.outcome() != Outcome.FAILED) {
              lastDone = c;
            }
          }
        }
        java.time.Duration interval = properties.interval(kind);
        Instant next = lastDone == null ? null : lastDone.performedAt().plus(interval);
        Status status =
            next == null ? Status.NEVER_DONE : at.isBefore(next) ? Status.IN_DATE : Status.OVERDUE;
        out.add(
            new Due(
                instrument.samplePoint(),
                instrument.parameter(),
                kind,
                interval.toDays(),
                lastDone == null ? null : lastDone.performedAt(),
                last == null ? null : last.outcome(),
                last == null ? null : last.performedAt(),
                next,
                status));
      }
    }
    return out;
  }

  /** An instrument: a sample point and the parameter it measures. */
  public record Instrument(String samplePoint, Parameter parameter)
      implements Comparable<Instrument> {
    @Override
    public int compareTo(Instrument o) {
      int c = samplePoint.compareTo(o.samplePoint);
      return c != 0 ? c : parameter.compareTo(o.parameter);
    }
  }

  /** The declared parameters of the plant's points, plus those with a logged check. */
  private Set<Instrument> instruments(String plant, List<InstrumentLog.Check> checks) {
    Set<Instrument> out = new TreeSet<>();
    jdbc.sql("SELECT s.id, p FROM sample_point s, unnest(s.parameters) p WHERE s.plant_id = ?")
        .param(plant)
        .query((rs, i) -> new String[] {rs.getString(1), rs.getString(2)})
        .list()
        .forEach(
            r -> {
              try {
                out.add(new Instrument(r[0], Parameter.ofCode(r[1])));
              } catch (IllegalArgumentException e) {
                // a declared parameter without limits support (e.g. temperature): no checks here
              }
            });
    checks.forEach(c -> out.add(new Instrument(c.samplePoint(), c.parameter())));
    return out;
  }
}
