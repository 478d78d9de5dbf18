package org.kwanta.service.queries;

import java.time.Duration;
import java.time.Instant;
import tools.jackson.databind.json.JsonMapper;

/**
 * The weak entity tag of a plant's overview: a SHA-256 digest of its JSON without what moves with
 * the clock alone: {@code asOf}, each {@code ageSeconds}, a point's {@code levelsAsOf}, and the
 * {@code since} of a level held (nearly) the whole classification window, which is capped at the
 * window's first value and so slides with it. The tag thus changes with the data (a reading, an
 * evaluation, a level or its onset, a finding, a limit) and not with the clock, and a board asking
 * again with {@code If-None-Match} gets {@code 304 Not Modified} without a body while nothing
 * changed. A client keeping its copy counts the ages on from its own clock. Weak (RFC 9110 §8.8.1):
 * the two answers are equivalent, not byte for byte the same.
 */
final class OverviewTags {

  /**
   * An onset this close to the window's start counts as "held the whole window": the first value in
   * the window, which ages out as the window moves (readings come every few seconds to minutes).
   */
  static final Duration CAPPED = Duration.ofHours(1);

  private OverviewTags() {}

  /**
   * @param window how far back the levels are classified ({@code kwanta.metrics.level-window})
   */
  static String of(JsonMapper mapper, StateController.Overview overview, Duration window) {
    StateController.Overview timeless =
        new StateController.Overview(
            overview.plant(),
            overview.name(),
            null,
            overview.samplePoints().stream().map(s -> timeless(s, window)).toList());
    return org.kwanta.service.system.WeakTags.of(mapper, timeless);
  }

  private static States.State timeless(States.State s, Duration window) {
    Instant capped = s.levelsAsOf() == null ? null : s.levelsAsOf().minus(window).plus(CAPPED);
    return new States.State(
        s.samplePoint(),
        s.name(),
        s.cycleLocation(),
        s.treatmentRegime(),
        null,
        s.readings().stream()
            .map(
                r ->
                    new States.Latest(
                        r.parameter(),
                        r.unit(),
                        r.time(),
                        0,
                        r.value(),
                        r.quality(),
                        r.sampleTemperatureCel(),
                        r.compensated()))
            .toList(),
        s.levels().stream()
            .map(
                l ->
                    capped == null || l.since() == null || l.since().isAfter(capped)
                        ? l
                        : new CurrentLevels.LevelState(
                            l.parameter(),
                            l.level(),
                            l.actionLevel(),
                            null,
                            l.value(),
                            l.valueUnit(),
                            l.instrumentInDoubt(),
                            l.calculatedValue(),
                            l.limitsOrigin()))
            .toList(),
        null,
        s.evaluation() == null
            ? null
            : new States.LatestEvaluation(s.evaluation().time(), 0, s.evaluation().evaluation()),
        s.diagnosis());
  }
}
