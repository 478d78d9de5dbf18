package org.kwanta.service.queries;

import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import org.kwanta.model.limits.Classification;
import org.kwanta.service.limits.ExcursionFinder;
import org.kwanta.service.limits.Limits;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.stereotype.Component;

/**
 * The current level of each parameter with limits at a sample point, classified over the same
 * window as the metrics ({@code kwanta.metrics.level-window}, default one day).
 */
@Component
class CurrentLevels {

  /**
   * One parameter's current level.
   *
   * @param parameter parameter code
   * @param level NORMAL, OUTSIDE_NORMAL (advisory, not an action level), AL1, AL2, AL3 or SHUTDOWN;
   *     the level of the values whatever the doubt about the instrument
   * @param actionLevel the action-level number: 0 (NORMAL or OUTSIDE_NORMAL), 1 to 3, 4 shutdown
   * @param since onset of the level (capped at the window)
   * @param value the latest value classified, in {@code valueUnit}
   * @param valueUnit UCUM code of the parameter's canonical unit
   * @param instrumentInDoubt whether the instrument behind the latest value is in doubt
   * @param calculatedValue whether the latest value is the calculated drum water pH standing in for
   *     an electrode in doubt
   * @param limitsOrigin OVERRIDE (the plant's own) or DEFAULT (shipped example)
   */
  record LevelState(
      String parameter,
      String level,
      int actionLevel,
      Instant since,
      double value,
      String valueUnit,
      boolean instrumentInDoubt,
      boolean calculatedValue,
      String limitsOrigin) {

    /** The level of a series' last classification against the limits in force. */
    static LevelState of(Limits.Effective effective, Classification last) {
      var parameter = effective.profile().key().parameter();
      return new LevelState(
          parameter.code(),
          last.level().name(),
          last.level().severity(),
          last.levelSince(),
          last.value(),
          parameter.unit(),
          last.instrumentInDoubt(),
          last.calculatedValue(),
          effective.origin().name());
    }
  }

  private final Limits limits;
  private final ExcursionFinder finder;
  private final Duration window;

  CurrentLevels(
      Limits limits,
      ExcursionFinder finder,
      @Value("${kwanta.metrics.level-window:P1D}") Duration window) {
    this.limits = limits;
    this.finder = finder;
    this.window = window;
  }

  /** How far back the levels are classified: a level held longer shows its onset capped here. */
  Duration window() {
    return window;
  }

  /** The levels of the parameters with limits and readings in the window, by parameter code. */
  List<LevelState> of(String samplePointId, Instant now) {
    List<LevelState> out = new ArrayList<>();
    for (Limits.Point point : limits.points(null, samplePointId)) {
      for (Limits.Effective effective : limits.inForce(point)) {
        List<Classification> classified = finder.classify(effective, now.minus(window), now);
        if (classified.isEmpty()) {
          continue;
        }
        out.add(LevelState.of(effective, classified.get(classified.size() - 1)));
      }
    }
    out.sort(Comparator.comparing(LevelState::parameter));
    return out;
  }
}
