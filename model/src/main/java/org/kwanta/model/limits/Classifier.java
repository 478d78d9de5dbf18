package org.kwanta.model.limits;

import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;

/**
 * Classifies a time-ordered series of one parameter at one sample point against a {@link
 * LimitProfile}: normal, outside the normal range, AL1, AL2, AL3 or shutdown.
 *
 * <p>A state machine, pure and deterministic (the same series always gives the same answer). The
 * states are ordered as {@link Level} lists them; OUTSIDE_NORMAL is entered and left like a level
 * whose threshold is the normal range's bound.
 *
 * <ul>
 *   <li><b>Entering</b> a higher state S needs the value beyond S's threshold (strictly) at every
 *       sample for at least the persistence delay; the highest such state wins, so a fast rise does
 *       not climb one step per delay.
 *   <li><b>Leaving</b> the current state needs the value back inside its threshold by more than the
 *       deadband, at every sample for the persistence delay; the new state is the highest lower
 *       state still held with the deadband applied.
 *   <li>A sample whose instrument is in doubt counts like any other: doubt never holds back, raises
 *       or lowers a level. It is reported beside the level ({@link
 *       Classification#instrumentInDoubt()}).
 * </ul>
 *
 * Deadband and persistence are engineering practice (common practice, no source); their values come
 * from the profile and apply to the normal range as to the action levels.
 */
public final class Classifier {

  /** Every state, in increasing order of concern; index = ordinal. */
  private static final Level[] STATES = Level.values();

  private final LimitTimeline limits;

  /** A classifier for one profile in force at every time. */
  public Classifier(LimitProfile profile) {
    this(LimitTimeline.of(Objects.requireNonNull(profile, "profile")));
  }

  /**
   * A classifier for limits that change over time: each sample is judged by the profile in force at
   * its time (its thresholds, deadband and persistence). The state carries across a change of
   * profile. A sample at a time without limits is left out of the answer, and the state starts
   * again from NORMAL after such a gap.
   */
  public Classifier(LimitTimeline limits) {
    this.limits = Objects.requireNonNull(limits, "limits");
  }

  /**
   * Classifies a series.
   *
   * @param samples samples in strictly increasing time order
   * @return one classification per sample with limits in force, in the same order
   * @throws IllegalArgumentException when the times are not strictly increasing
   */
  public List<Classification> classify(List<Sample> samples) {
    List<Classification> out = new ArrayList<>(samples.size());
    Instant[] enterSince = new Instant[STATES.length];
    Instant[] releaseSince = new Instant[STATES.length];
    Level current = Level.NORMAL;
    Instant currentSince = null;
    Instant previous = null;
    for (Sample s : samples) {
      Instant t = s.time();
      if (previous != null && !t.isAfter(previous)) {
        throw new IllegalArgumentException(
            "Samples must be in strictly increasing time order: " + t + " after " + previous);
      }
      previous = t;
      LimitProfile profile = limits.at(t).orElse(null);
      if (profile == null) {
        current = Level.NORMAL;
        currentSince = null;
        java.util.Arrays.fill(enterSince, null);
        java.util.Arrays.fill(releaseSince, null);
        continue;
      }
      Duration persistence = profile.persistence();
      if (currentSince == null) {
        currentSince = t;
      }
      double x = s.value();
      for (int i = 1; i < STATES.length; i++) {
        enterSince[i] = profile.enters(STATES[i], x) ? first(enterSince[i], t) : null;
        releaseSince[i] = profile.holds(STATES[i], x) ? null : first(releaseSince[i], t);
      }
      Level raised = null;
      for (int i = STATES.length - 1; i > current.ordinal(); i--) {
        if (enterSince[i] != null && held(enterSince[i], t, persistence)) {
          raised = STATES[i];
          currentSince = enterSince[i];
          break;
        }
      }
      if (raised != null) {
        current = raised;
      } else if (current != Level.NORMAL) {
        Instant release = releaseSince[current.ordinal()];
        if (release != null && held(release, t, persistence)) {
          Level lower = Level.NORMAL;
          for (int i = current.ordinal() - 1; i >= 1; i--) {
            if (releaseSince[i] == null && profile.holds(STATES[i], x)) {
              lower = STATES[i];
              break;
            }
          }
          current = lower;
          currentSince = release;
        }
      }
      out.add(
          new Classification(
              t, x, current, currentSince, s.instrumentInDoubt(), s.calculatedValue()));
    }
    return List.copyOf(out);
  }

  private static Instant first(Instant since, Instant now) {
    return since == null ? now : since;
  }

  private static boolean held(Instant since, Instant now, Duration persistence) {
    return Duration.between(since, now).compareTo(persistence) >= 0;
  }
}
