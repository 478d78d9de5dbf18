package org.kwanta.service.instruments;

import java.sql.Timestamp;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.stream.Collectors;
import org.kwanta.model.Parameter;
import org.kwanta.model.limits.TimeWindow;
import org.kwanta.service.ingest.ReadingHistory;
import org.kwanta.service.operatingstate.OperatingStates;
import org.kwanta.service.operatingstate.ServiceTime;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Service;

/**
 * Core-instrument availability and data completeness over a period, counted in slots of in-service
 * time ({@link InstrumentCareProperties#slot()}, slots aligned on the period start):
 *
 * <pre>
 *   availability = slots in service holding at least one good reading not in doubt
 *                  / slots in service
 *   completeness = slots in service holding at least one reading of any quality
 *                  / slots in service
 * </pre>
 *
 * A reading is good when its quality is "good" (not uncertain, not bad); it is in doubt when the
 * stored evaluation at its time points at its own instrument or the sample conditioning (as {@code
 * limits/ExcursionFinder} reads it). A slot is in service when its start lies in the block's
 * in-service windows ({@link ServiceTime#counted()}).
 *
 * <p>The core instruments are the key online measurements of IAPWS TGD2-09(2015) as recalled (from
 * memory — verify): specific, cation and degassed cation conductivity, pH, sodium and dissolved
 * oxygen, at the sample points that declare them or that hold readings of them in the period.
 *
 * <p>One SQL statement per block ({@link ReadingHistory#slotCounts}), bounded in time on both
 * {@code reading} and {@code evaluation} so that PostgreSQL prunes their daily partitions to the
 * period.
 */
@Service
public class Availability {

  /** The core parameters (IAPWS TGD2-09(2015) key instruments, from memory — verify). */
  public static final Set<Parameter> CORE =
      EnumSet.of(
          Parameter.SPECIFIC_CONDUCTIVITY,
          Parameter.CATION_CONDUCTIVITY,
          Parameter.DEGASSED_CATION_CONDUCTIVITY,
          Parameter.PH,
          Parameter.SODIUM,
          Parameter.DISSOLVED_OXYGEN);

  /** One core instrument's counts over the period. */
  public record Instrument(
      String samplePoint,
      String block,
      Parameter parameter,
      long slotsInService,
      long slotsWithData,
      long slotsGood,
      Duration slot) {

    /** Good slots over in-service slots; null without in-service time. */
    public Double availability() {
      return slotsInService == 0 ? null : (double) slotsGood / slotsInService;
    }

    /** Slots with any reading over in-service slots; null without in-service time. */
    public Double completeness() {
      return slotsInService == 0 ? null : (double) slotsWithData / slotsInService;
    }
  }

  private final JdbcClient jdbc;
  private final ReadingHistory readings;
  private final OperatingStates states;
  private final InstrumentCareProperties properties;

  Availability(
      JdbcClient jdbc,
      ReadingHistory readings,
      OperatingStates states,
      InstrumentCareProperties properties) {
    this.jdbc = jdbc;
    this.readings = readings;
    this.states = states;
    this.properties = properties;
  }

  /** Every core instrument of the plant over [from, to), by sample point then parameter. */
  public List<Instrument> of(String plant, Instant from, Instant to) {
    Duration slot = properties.slot();
    String interval = slot.toSeconds() + " seconds";
    Map<String, List<String[]>> pointsByBlock = new TreeMap<>();
    jdbc.sql(
            "SELECT block_id, id, array_to_string(parameters, ',') FROM sample_point"
                + " WHERE plant_id = ? ORDER BY block_id, id")
        .param(plant)
        .query((rs, i) -> new String[] {rs.getString(1), rs.getString(2), rs.getString(3)})
        .list()
        .forEach(r -> pointsByBlock.computeIfAbsent(r[0], u -> new ArrayList<>()).add(r));
    List<Instrument> out = new ArrayList<>();
    String core = CORE.stream().map(Parameter::code).collect(Collectors.joining(","));
    for (Map.Entry<String, List<String[]>> block : pointsByBlock.entrySet()) {
      ServiceTime service = states.serviceTime(plant, block.getKey(), from, to);
      long inServiceSlots = slotsInService(service, from, to, slot);
      String points = block.getValue().stream().map(r -> r[1]).collect(Collectors.joining(","));
      Map<String, long[]> counts = new LinkedHashMap<>();
      counts.putAll(
          readings.slotCounts(points, core, from, to, interval, multirange(service.counted())));
      for (String[] point : block.getValue()) {
        for (Parameter p : CORE) {
          long[] c = counts.get(point[1] + "|" + p.code());
          boolean declared = point[2] != null && List.of(point[2].split(",")).contains(p.code());
          if (c == null && !declared) {
            continue;
          }
          out.add(
              new Instrument(
                  point[1],
                  block.getKey(),
                  p,
                  inServiceSlots,
                  c == null ? 0 : c[0],
                  c == null ? 0 : c[1],
                  slot));
        }
      }
    }
    return out;
  }

  /** Slots [from + k·slot) before {@code to} whose start lies in service. */
  static long slotsInService(ServiceTime service, Instant from, Instant to, Duration slot) {
    long n = 0;
    for (Instant t = from; t.isBefore(to); t = t.plus(slot)) {
      if (service.inService(t)) {
        n++;
      }
    }
    return n;
  }

  /** A PostgreSQL tstzmultirange literal of the windows ({@code {}} when there are none). */
  static String multirange(List<TimeWindow> windows) {
    return windows.stream()
        .map(w -> "[\"" + w.start() + "\",\"" + w.end() + "\")")
        .collect(Collectors.joining(",", "{", "}"));
  }

  private static Timestamp ts(Instant t) {
    return Timestamp.from(t);
  }
}
