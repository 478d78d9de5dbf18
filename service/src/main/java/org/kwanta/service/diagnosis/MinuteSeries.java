package org.kwanta.service.diagnosis;

import java.time.Instant;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import org.kwanta.model.diagnosis.Minute;
import org.kwanta.service.ingest.Evaluations;
import org.kwanta.service.ingest.ReadingHistory;
import org.springframework.stereotype.Repository;

/**
 * The minute series the diagnosis reads, from the stored evaluations (conductivities at 25 °C and
 * the calculated pH) and readings (measured pH and sodium; readings of quality "bad" left out): the
 * last value of each minute. Depends only on what is stored, never on arrival order.
 */
@Repository
class MinuteSeries {

  private final Evaluations evaluations;
  private final ReadingHistory readings;

  MinuteSeries(Evaluations evaluations, ReadingHistory readings) {
    this.evaluations = evaluations;
    this.readings = readings;
  }

  /** Mutable minute while the two queries fill it. */
  private static final class Row {
    double sc = Double.NaN;
    double cation = Double.NaN;
    double degassed = Double.NaN;
    double calculated = Double.NaN;
    double ph = Double.NaN;
    double sodium = Double.NaN;
  }

  /** Minutes of each point in [from, to), time order. */
  Map<String, List<Minute>> load(List<String> points, Instant from, Instant to) {
    Map<String, TreeMap<Instant, Row>> rows = new HashMap<>();
    for (String p : points) {
      rows.put(p, new TreeMap<>());
    }
    for (Evaluations.MinuteValues v : evaluations.lastPerMinute(points, from, to)) {
      Row r = rows.get(v.samplePointId()).computeIfAbsent(v.minute(), k -> new Row());
      r.sc = v.specificConductivity25();
      r.cation = v.cationConductivity25();
      r.degassed = v.degassedCationConductivity25();
      r.calculated = v.calculatedPh25();
    }
    for (ReadingHistory.PointReading v :
        readings.lastPerMinute(points, List.of("ph", "sodium"), from, to)) {
      Row r = rows.get(v.samplePointId()).computeIfAbsent(v.time(), k -> new Row());
      if ("ph".equals(v.parameter())) {
        r.ph = v.value();
      } else {
        r.sodium = v.value();
      }
    }
    Map<String, List<Minute>> out = new HashMap<>();
    rows.forEach(
        (id, byMinute) -> {
          List<Minute> list = new ArrayList<>(byMinute.size());
          byMinute.forEach(
              (t, r) ->
                  list.add(
                      new Minute(t, r.sc, r.cation, r.degassed, r.ph, r.calculated, r.sodium)));
          out.put(id, list);
        });
    return out;
  }
}
