package org.kwanta.model.limits;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.OptionalDouble;
import java.util.Random;
import org.junit.jupiter.api.Test;

/** The state machine: deadband, persistence, suspect values, shutdown, ordering, determinism. */
class ClassifierTest {

  private static final Instant T0 = Instant.parse("2025-03-10T00:00:00Z");

  /** A noisy signal centred on the AL1 threshold (0.2 µS/cm), one sample a minute, seeded. */
  private static List<Sample> noisyAtThreshold() {
    Random random = new Random(20250310L);
    List<Sample> samples = new ArrayList<>();
    for (int i = 0; i < 600; i++) {
      double value = i < 60 ? 0.12 : 0.2 + 0.008 * random.nextGaussian();
      samples.add(new Sample(T0.plusSeconds(60L * i), value, false));
    }
    return samples;
  }

  private static int levelChanges(List<Classification> classified) {
    int changes = 0;
    for (int i = 1; i < classified.size(); i++) {
      if (classified.get(i).actionLevel() != classified.get(i - 1).actionLevel()) {
        changes++;
      }
    }
    return changes;
  }

  @Test
  void withoutDeadbandANoisySignalAtTheThresholdFlaps() {
    Classifier classifier =
        new Classifier(Profiles.cationConductivity(CycleLocation.CONDENSATE, 0.0, Duration.ZERO));
    assertThat(levelChanges(classifier.classify(noisyAtThreshold()))).isGreaterThan(50);
  }

  @Test
  void deadbandStopsFlappingOfANoisySignalAtTheThreshold() {
    // Deadband of 0.05 µS/cm is about six standard deviations of the noise: once entered, AL1
    // holds.
    Classifier classifier =
        new Classifier(Profiles.cationConductivity(CycleLocation.CONDENSATE, 0.05, Duration.ZERO));
    List<Classification> classified = classifier.classify(noisyAtThreshold());
    assertThat(levelChanges(classified)).isEqualTo(1);
    assertThat(classified.get(classified.size() - 1).actionLevel()).isEqualTo(Level.AL1);
  }

  @Test
  void persistenceDelaysALevelChangeAndBackDatesItsOnset() {
    Classifier classifier =
        new Classifier(
            Profiles.cationConductivity(CycleLocation.CONDENSATE, 0.01, Duration.ofMinutes(15)));
    List<Sample> samples = new ArrayList<>();
    for (int i = 0; i < 60; i++) {
      samples.add(new Sample(T0.plusSeconds(60L * i), i >= 10 ? 0.25 : 0.1, false));
    }
    List<Classification> classified = classifier.classify(samples);
    // Above 0.2 from minute 10; confirmed once it has held 15 minutes, at minute 25.
    assertThat(classified.get(24).actionLevel()).isEqualTo(Level.NORMAL);
    assertThat(classified.get(25).actionLevel()).isEqualTo(Level.AL1);
    assertThat(classified.get(25).actionLevelSince()).isEqualTo(T0.plusSeconds(600));
  }

  @Test
  void aSpikeShorterThanThePersistenceRaisesNothing() {
    Classifier classifier =
        new Classifier(
            Profiles.cationConductivity(CycleLocation.CONDENSATE, 0.01, Duration.ofMinutes(15)));
    List<Sample> samples = new ArrayList<>();
    for (int i = 0; i < 60; i++) {
      samples.add(new Sample(T0.plusSeconds(60L * i), i >= 10 && i < 20 ? 0.9 : 0.1, false));
    }
    assertThat(classifier.classify(samples)).allMatch(c -> c.level() == Level.NORMAL);
  }

  @Test
  void persistenceAlsoDelaysTheReturn() {
    Classifier classifier =
        new Classifier(
            Profiles.cationConductivity(CycleLocation.CONDENSATE, 0.01, Duration.ofMinutes(10)));
    List<Sample> samples = new ArrayList<>();
    for (int i = 0; i < 60; i++) {
      samples.add(new Sample(T0.plusSeconds(60L * i), i < 30 ? 0.3 : 0.1, false));
    }
    List<Classification> classified = classifier.classify(samples);
    assertThat(classified.get(39).actionLevel()).isEqualTo(Level.AL1);
    assertThat(classified.get(40).actionLevel()).isEqualTo(Level.NORMAL);
    assertThat(classified.get(40).actionLevelSince()).isEqualTo(T0.plusSeconds(60L * 30));
  }

  @Test
  void aFastRiseGoesStraightToTheHighestLevelHeld() {
    Classifier classifier =
        new Classifier(
            Profiles.cationConductivity(CycleLocation.CONDENSATE, 0.01, Duration.ofMinutes(5)));
    List<Sample> samples = new ArrayList<>();
    for (int i = 0; i < 20; i++) {
      samples.add(new Sample(T0.plusSeconds(60L * i), i >= 2 ? 0.8 : 0.1, false));
    }
    List<Classification> classified = classifier.classify(samples);
    assertThat(classified.get(6).actionLevel()).isEqualTo(Level.NORMAL);
    assertThat(classified.get(7).actionLevel()).isEqualTo(Level.AL3);
  }

  @Test
  void suspectValuesNeverRaiseALevelButAreVisible() {
    Classifier classifier =
        new Classifier(Profiles.cationConductivity(CycleLocation.CONDENSATE, 0.01, Duration.ZERO));
    List<Sample> samples =
        List.of(
            new Sample(T0, 0.1, false),
            new Sample(T0.plusSeconds(60), 5.0, true),
            new Sample(T0.plusSeconds(120), Double.NaN, true),
            new Sample(T0.plusSeconds(180), 0.1, false));
    List<Classification> classified = classifier.classify(samples);
    assertThat(classified)
        .extracting(Classification::level)
        .containsExactly(Level.NORMAL, Level.SUSPECT, Level.SUSPECT, Level.NORMAL);
    assertThat(classified).allMatch(c -> c.actionLevel() == Level.NORMAL);
  }

  @Test
  void suspectValuesDoNotLowerALevelEither() {
    Classifier classifier =
        new Classifier(Profiles.cationConductivity(CycleLocation.CONDENSATE, 0.01, Duration.ZERO));
    List<Classification> classified =
        classifier.classify(
            List.of(
                new Sample(T0, 0.5, false),
                new Sample(T0.plusSeconds(60), 0.05, true),
                new Sample(T0.plusSeconds(120), 0.5, false)));
    assertThat(classified)
        .extracting(Classification::actionLevel)
        .containsExactly(Level.AL2, Level.AL2, Level.AL2);
    assertThat(classified.get(1).level()).isEqualTo(Level.SUSPECT);
  }

  @Test
  void suspectSampleBreaksThePersistenceTimer() {
    Classifier classifier =
        new Classifier(
            Profiles.cationConductivity(CycleLocation.CONDENSATE, 0.01, Duration.ofMinutes(3)));
    List<Classification> classified =
        classifier.classify(
            List.of(
                new Sample(T0, 0.3, false),
                new Sample(T0.plusSeconds(60), 0.3, false),
                new Sample(T0.plusSeconds(120), 0.3, true),
                new Sample(T0.plusSeconds(180), 0.3, false),
                new Sample(T0.plusSeconds(240), 0.3, false)));
    assertThat(classified).allMatch(c -> c.actionLevel() == Level.NORMAL);
  }

  @Test
  void drumWaterPhBelow8IsImmediateShutdown() {
    // Drum water pH(25 °C) < 8.0: immediate shutdown (IAPWS usage as recalled; from memory —
    // verify).
    Classifier classifier = new Classifier(Profiles.drumPh(Duration.ZERO));
    List<Classification> classified =
        classifier.classify(
            List.of(
                new Sample(T0, 9.4, false),
                new Sample(T0.plusSeconds(60), 8.5, false),
                new Sample(T0.plusSeconds(120), 7.9, false),
                new Sample(T0.plusSeconds(180), 8.02, false),
                new Sample(T0.plusSeconds(240), 8.1, false)));
    assertThat(classified)
        .extracting(Classification::level)
        .containsExactly(Level.NORMAL, Level.NORMAL, Level.SHUTDOWN, Level.SHUTDOWN, Level.NORMAL);
  }

  @Test
  void sameInputGivesSameOutput() {
    Classifier classifier =
        new Classifier(
            Profiles.cationConductivity(CycleLocation.CONDENSATE, 0.02, Duration.ofMinutes(5)));
    assertThat(classifier.classify(noisyAtThreshold()))
        .isEqualTo(classifier.classify(noisyAtThreshold()));
  }

  @Test
  void rejectsSamplesOutOfTimeOrder() {
    Classifier classifier =
        new Classifier(Profiles.cationConductivity(CycleLocation.CONDENSATE, 0.0, Duration.ZERO));
    assertThatThrownBy(
            () ->
                classifier.classify(
                    List.of(
                        new Sample(T0.plusSeconds(60), 0.1, false), new Sample(T0, 0.1, false))))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("strictly increasing");
  }

  @Test
  void rejectsAProfileWithThresholdsOutOfOrder() {
    assertThatThrownBy(
            () ->
                new LimitProfile(
                    new LimitKey(TreatmentRegime.AVT_O, CycleLocation.FEEDWATER, Parameter.SODIUM),
                    new NormalRange(OptionalDouble.empty(), OptionalDouble.of(2), "x"),
                    List.of(
                        new Threshold(Level.AL1, Side.HIGH, 4, "x"),
                        new Threshold(Level.AL2, Side.HIGH, 2, "x")),
                    0,
                    "x",
                    Duration.ZERO,
                    "x"))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("AL2");
  }

  @Test
  void rejectsANonSuspectNaN() {
    assertThatThrownBy(() -> new Sample(T0, Double.NaN, false))
        .isInstanceOf(IllegalArgumentException.class);
  }
}
