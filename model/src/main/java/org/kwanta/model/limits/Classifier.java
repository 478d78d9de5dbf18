package org.kwanta.model.limits;

import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;

/**
 * Classifies a time-ordered series of one parameter at one sample point against a {@link
 * LimitProfile}: normal, AL1, AL2, AL3, shutdown, or suspect.
 *
 * <p>A state machine, pure and deterministic (the same series always gives the same answer):
 *
 * <ul>
 *   <li><b>Entering</b> a higher level L needs the value beyond L's threshold (strictly) at every
 *       non-suspect sample for at least the persistence delay; the highest such level wins, so a
 *       fast rise does not climb one step per delay.
 *   <li><b>Leaving</b> the current level needs the value back inside its threshold by more than the
 *       deadband, at every sample for the persistence delay; the new level is the highest lower
 *       level still held with the deadband applied.
 *   <li>A <b>suspect</b> sample never changes the level either way and breaks both timers: it is
 *       reported as SUSPECT with the level in force.
 * </ul>
 *
 * Deadband and persistence are engineering practice (common practice, no source); their values come
 * from the profile.
 */
public final class Classifier {

  private static final Level[] ACTION = {Level.AL1, Level.AL2, Level.AL3, Level.SHUTDOWN};

  private final LimitProfile profile;

  public Classifier(LimitProfile profile) {
    this.profile = Objects.requireNonNull(profile, "profile");
  }

  /**
   * Classifies a series.
   *
   * @param samples samples in strictly increasing time order
   * @return one classification per sample, in the same order
   * @throws IllegalArgumentException when the times are not strictly increasing
   */
  public List<Classification> classify(List<Sample> samples) {
    List<Classification> out = new ArrayList<>(samples.size());
    Duration persistence = profile.persistence();
    Instant[] enterSince = new Instant[ACTION.length + 1];
    Instant[] releaseSince = new Instant[ACTION.length + 1];
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
      if (currentSince == null) {
        currentSince = t;
      }
      if (s.suspect()) {
        Arrays.fill(enterSince, null);
        Arrays.fill(releaseSince, null);
        out.add(new Classification(t, s.value(), Level.SUSPECT, current, currentSince));
        continue;
      }
      double x = s.value();
      for (Level level : ACTION) {
        int i = level.severity();
        enterSince[i] = profile.enters(level, x) ? first(enterSince[i], t) : null;
        releaseSince[i] = profile.holds(level, x) ? null : first(releaseSince[i], t);
      }
      Level raised = null;
      for (int i = ACTION.length; i > current.severity(); i--) {
        if (enterSince[i] != null && held(enterSince[i], t, persistence)) {
          raised = Level.ofSeverity(i);
          currentSince = enterSince[i];
          break;
        }
      }
      if (raised != null) {
        current = raised;
      } else if (current.isAction()) {
        Instant release = releaseSince[current.severity()];
        if (release != null && held(release, t, persistence)) {
          Level lower = Level.NORMAL;
          for (int i = current.severity() - 1; i >= 1; i--) {
            if (releaseSince[i] == null && profile.holds(Level.ofSeverity(i), x)) {
              lower = Level.ofSeverity(i);
              break;
            }
          }
          current = lower;
          currentSince = release;
        }
      }
      out.add(new Classification(t, x, current, current, currentSince));
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
