package org.kwanta.model.limits;

import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.Optional;

/**
 * A continuous stretch at AL1 or above (time OUTSIDE_NORMAL alone is never an excursion).
 *
 * @param start onset of the first action level
 * @param end onset of the return to normal; empty while the excursion is running
 * @param side which way the value left the normal range
 * @param peakValue most extreme value on that side (canonical unit), whatever the doubt about the
 *     instrument
 * @param peakTime when the peak was measured
 * @param highestLevel highest level reached
 * @param currentLevel level at the evaluation time (NORMAL once ended, also when the value is still
 *     outside the normal range)
 * @param duration from start to end, or to the evaluation time while running
 * @param allowance customary allowance of the highest level reached (AL1 168 h, AL2 24 h, AL3 4 h,
 *     shutdown 0; from memory — verify)
 * @param deadline while running: the earliest of, for each level L up to the current one, the onset
 *     of the running stretch at L or above plus L's allowance
 * @param timeRemaining while running: from the evaluation time to the deadline (negative when
 *     overrun)
 * @param allowanceExceeded whether any stretch at a level L or above lasted longer than L's
 *     allowance
 * @param spans the levels passed through, in order
 * @param samples number of samples within the excursion
 * @param inDoubtSamples how many of them had their instrument in doubt
 * @param calculatedSamples how many of them were classified on a calculated value in place of the
 *     measured one
 */
public record Excursion(
    Instant start,
    Optional<Instant> end,
    Side side,
    double peakValue,
    Instant peakTime,
    Level highestLevel,
    Level currentLevel,
    Duration duration,
    Duration allowance,
    Optional<Instant> deadline,
    Optional<Duration> timeRemaining,
    boolean allowanceExceeded,
    List<LevelSpan> spans,
    int samples,
    int inDoubtSamples,
    int calculatedSamples) {

  public Excursion {
    spans = List.copyOf(spans);
    if (samples < 1 || inDoubtSamples < 0 || inDoubtSamples > samples) {
      throw new IllegalArgumentException(
          "In-doubt samples " + inDoubtSamples + " must lie between 0 and samples " + samples);
    }
  }

  /** The share of the excursion's samples whose instrument was in doubt, 0 to 1. */
  public double inDoubtFraction() {
    return (double) inDoubtSamples / samples;
  }

  /** True while the excursion has not returned to normal. */
  public boolean open() {
    return end.isEmpty();
  }
}
