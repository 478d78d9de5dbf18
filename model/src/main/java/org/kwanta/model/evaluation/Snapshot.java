package org.kwanta.model.evaluation;

import java.time.Instant;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.kwanta.model.Parameter;

/**
 * What is known at a sample point at one instant: for each parameter its recent readings, oldest
 * first, the last one being the latest. The history makes the persistence and trend checks pure
 * functions of the snapshot (same snapshot, same result).
 *
 * @param time the evaluation instant (ages are measured against it)
 * @param history recent readings per parameter, oldest first; parameters without an analyser are
 *     absent
 */
public record Snapshot(Instant time, Map<Parameter, List<Reading>> history) {

  public Snapshot {
    Map<Parameter, List<Reading>> copy = new EnumMap<>(Parameter.class);
    for (Map.Entry<Parameter, List<Reading>> e : history.entrySet()) {
      if (!e.getValue().isEmpty()) {
        copy.put(e.getKey(), List.copyOf(e.getValue()));
      }
    }
    history = java.util.Collections.unmodifiableMap(copy);
  }

  /** The latest reading of a parameter, if there is any. */
  public Optional<Reading> latest(Parameter p) {
    List<Reading> h = history.get(p);
    return h == null ? Optional.empty() : Optional.of(h.get(h.size() - 1));
  }

  /** The readings of a parameter, oldest first (empty when absent). */
  public List<Reading> readings(Parameter p) {
    return history.getOrDefault(p, List.of());
  }
}
