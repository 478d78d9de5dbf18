package org.kwanta.model.limits;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.kwanta.model.Parameter;

/**
 * Classification over limits that change in time: each sample against the profile in force at its
 * time, the state carried across the change. Profiles are the test examples of {@link Profiles}
 * (recalled IAPWS numbers, from memory — verify) and an invented plant profile.
 */
class ClassifierTimelineTest {

  private static final Instant T0 = Instant.parse("2025-03-10T00:00:00Z");
  private static final Duration FIVE_MINUTES = Duration.ofMinutes(5);

  private static List<Sample> constant(double value, int minutes) {
    List<Sample> samples = new ArrayList<>();
    for (int i = 0; i < minutes; i++) {
      samples.add(new Sample(T0.plusSeconds(60L * i), value, false));
    }
    return samples;
  }

  /** An invented plant profile: AL1 above 0.5 µS/cm only. */
  private static LimitProfile plant() {
    return new LimitProfile(
        new LimitKey(
            TreatmentRegime.AVT_O, CycleLocation.CONDENSATE, Parameter.CATION_CONDUCTIVITY),
        new NormalRange(OptionalDouble.empty(), OptionalDouble.of(0.5), "invented"),
        List.of(new Threshold(Level.AL1, Side.HIGH, 0.5, "invented")),
        0.01,
        Profiles.ENGINEERING,
        FIVE_MINUTES,
        Profiles.ENGINEERING);
  }

  @Test
  void oneProfileTimelineClassifiesAsTheProfile() {
    LimitProfile p = Profiles.cationConductivity(CycleLocation.CONDENSATE, 0.01, FIVE_MINUTES);
    List<Sample> samples = constant(0.4, 120);
    assertThat(new Classifier(LimitTimeline.of(p)).classify(samples))
        .isEqualTo(new Classifier(p).classify(samples));
  }

  @Test
  void aLaterChangeDoesNotAlterTheEarlierClassification() {
    LimitProfile old = Profiles.cationConductivity(CycleLocation.CONDENSATE, 0.01, FIVE_MINUTES);
    Instant change = T0.plusSeconds(60L * 300);
    LimitTimeline timeline =
        LimitTimeline.of(
            List.of(
                new LimitTimeline.Period(Instant.MIN, Optional.of(old)),
                new LimitTimeline.Period(change, Optional.of(plant()))));
    List<Sample> samples = constant(0.4, 600);
    List<Classification> changed = new Classifier(timeline).classify(samples);
    List<Classification> before = new Classifier(old).classify(samples);
    for (int i = 0; i < 300; i++) {
      assertThat(changed.get(i)).isEqualTo(before.get(i));
    }
    assertThat(changed.get(299).level()).isEqualTo(Level.AL2);
    // 0.4 is inside the new normal range by more than the deadband: back to NORMAL after the new
    // profile's persistence, counted from the first sample under it.
    assertThat(changed.get(304).level()).isEqualTo(Level.AL2);
    assertThat(changed.get(305).level()).isEqualTo(Level.NORMAL);
    assertThat(changed.get(305).levelSince()).isEqualTo(change);
    List<Excursion> excursions = Excursions.of(timeline, changed, T0.plusSeconds(60L * 600));
    assertThat(excursions).hasSize(1);
    assertThat(excursions.get(0).end()).contains(change);
    assertThat(excursions.get(0).highestLevel()).isEqualTo(Level.AL2);
  }

  @Test
  void anExcursionStillBeyondTheNewLimitGoesOn() {
    LimitProfile old = Profiles.cationConductivity(CycleLocation.CONDENSATE, 0.01, FIVE_MINUTES);
    Instant change = T0.plusSeconds(60L * 300);
    LimitTimeline timeline =
        LimitTimeline.of(
            List.of(
                new LimitTimeline.Period(Instant.MIN, Optional.of(old)),
                new LimitTimeline.Period(change, Optional.of(plant()))));
    List<Classification> c = new Classifier(timeline).classify(constant(0.7, 600));
    assertThat(c.get(299).level()).isEqualTo(Level.AL3);
    // AL3 no longer exists: released after the persistence, to the highest level still held.
    assertThat(c.get(305).level()).isEqualTo(Level.AL1);
    List<Excursion> excursions = Excursions.of(timeline, c, T0.plusSeconds(60L * 600));
    assertThat(excursions).hasSize(1);
    assertThat(excursions.get(0).open()).isTrue();
  }

  @Test
  void samplesWithoutLimitsAreLeftOut() {
    Instant start = T0.plusSeconds(60L * 100);
    LimitTimeline timeline =
        LimitTimeline.of(List.of(new LimitTimeline.Period(start, Optional.of(plant()))));
    List<Classification> c = new Classifier(timeline).classify(constant(0.7, 200));
    assertThat(c).hasSize(100);
    assertThat(c.get(0).time()).isEqualTo(start);
    assertThat(c.get(0).levelSince()).isEqualTo(start);
  }

  @Test
  void refusesPeriodsOutOfOrder() {
    LimitProfile p = plant();
    assertThatThrownBy(
            () ->
                LimitTimeline.of(
                    List.of(
                        new LimitTimeline.Period(T0, Optional.of(p)),
                        new LimitTimeline.Period(T0, Optional.of(p)))))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("strictly increasing");
  }
}
