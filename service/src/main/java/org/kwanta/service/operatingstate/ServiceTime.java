package org.kwanta.service.operatingstate;

import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import org.kwanta.model.limits.TimeWindow;

/**
 * The time of one block over [from, to) split by operating state.
 *
 * @param from start of the period
 * @param to end of the period (exclusive)
 * @param spans the state timeline clipped to the period, oldest first; a span with a null state is
 *     time before the block's first recorded state
 * @param counted the windows that count as in service: {@link OperatingState#IN_SERVICE} time and
 *     time with no recorded state (a block whose state nobody recorded is taken to be in service,
 *     so plants that do not record states keep their hours); no two overlap
 * @param byState time per recorded state
 * @param unrecorded time with no recorded state (counted as in service)
 */
public record ServiceTime(
    Instant from,
    Instant to,
    List<Span> spans,
    List<TimeWindow> counted,
    Map<OperatingState, Duration> byState,
    Duration unrecorded) {

  /**
   * One stretch of constant state; {@code state} null: no state recorded yet. {@code source}: who
   * reported the state that started it (null with no state).
   */
  public record Span(OperatingState state, Instant start, Instant end, Source source) {}

  /** Who reported a state. */
  public enum Source {
    /** Entered by a chemist through the API (wins at the same instant). */
    CHEMIST,
    /** An {@code operating_state} reading from the historian. */
    HISTORIAN
  }

  /** The in-service time (counted windows) in total. */
  public Duration inService() {
    return counted.stream().map(TimeWindow::length).reduce(Duration.ZERO, Duration::plus);
  }

  /** The in-service time within [a, b). */
  public Duration inService(Instant a, Instant b) {
    return TimeWindow.overlap(counted, a, b);
  }

  /** Whether the time {@code t} counts as in service. */
  public boolean inService(Instant t) {
    return counted.stream().anyMatch(w -> w.contains(t));
  }
}
