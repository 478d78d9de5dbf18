package org.kwanta.service.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.kwanta.model.conductivity.AlkalizerMix;
import org.kwanta.model.evaluation.Evaluator;
import org.kwanta.model.evaluation.Regime;
import org.kwanta.model.evaluation.SamplePointConfig;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.service.ingest.EvaluationRunner.StoredReading;
import org.kwanta.service.samplepoints.SamplePointConfigs;

/**
 * The runner's sliding history (kept from one evaluation time to the next) gives exactly the
 * evaluations of the history built from scratch at each time, on random feeds: bad and uncertain
 * readings, several parameters at one time, uncompensated conductivities with and without their own
 * sample temperature, drum pressures, gaps longer than the window, and windows down to under 30
 * seconds (one-second buckets). No chemistry is checked here, only that the two agree.
 */
class SlidingHistoryTest {

  private static final String[] PARAMETERS = {
    "specific_conductivity",
    "cation_conductivity",
    "degassed_cation_conductivity",
    "ph",
    "sodium",
    "sample_temperature",
    "drum_pressure",
    "silica",
    "load"
  };

  private static final EvaluationRunner RUNNER =
      new EvaluationRunner(new Evaluator(IonizationFormulation.R11_07), Duration.ofMinutes(10));

  @ParameterizedTest
  @ValueSource(ints = {1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12})
  void slidingHistoryEqualsHistoryFromScratch(int seed) {
    Random rnd = new Random(seed);
    boolean withNeedy = seed % 3 == 0;
    Duration window =
        List.of(Duration.ofSeconds(20), Duration.ofMinutes(5), Duration.ofHours(1)).get(seed % 3);
    Duration maxAge = Duration.ofMinutes(2 + rnd.nextInt(10));
    Instant t0 = Instant.parse("2026-11-20T06:00:00Z").plusMillis(rnd.nextInt(100_000));
    List<StoredReading> readings = new ArrayList<>();
    Instant t = t0;
    for (int i = 0; i < 400; i++) {
      t =
          t.plusMillis(
              rnd.nextInt(10) == 0 ? 600_000 + rnd.nextInt(3_600_000) : rnd.nextInt(20_000));
      int count = 1 + rnd.nextInt(4);
      for (int j = 0; j < count; j++) {
        String p = PARAMETERS[rnd.nextInt(PARAMETERS.length)];
        int roll = rnd.nextInt(20);
        short quality = (short) (roll == 0 ? 2 : roll == 1 ? 1 : 0);
        boolean conductivity = p.endsWith("conductivity");
        boolean compensated = !conductivity || rnd.nextInt(4) != 0;
        double temperature =
            compensated || withNeedy && rnd.nextBoolean() ? Double.NaN : 20 + rnd.nextDouble() * 15;
        readings.add(new StoredReading(p, t, value(p, rnd), quality, temperature, compensated));
      }
    }
    readings.sort(Comparator.comparing(StoredReading::time));
    SamplePointConfigs.Versioned config =
        new SamplePointConfigs.Versioned(
            SamplePointConfig.of("S-1", Regime.AVT_O, AlkalizerMix.AMMONIA, 603.15, Double.NaN),
            3,
            seed % 2 == 0 ? "DRUM_WATER" : "FEEDWATER",
            "plant-s");
    Instant from = readings.get(readings.size() / 4).time();
    Instant to = readings.get(readings.size() * 3 / 4).time();

    List<EvaluationRunner.Result> sliding = RUNNER.run(config, readings, from, to, window, maxAge);
    List<EvaluationRunner.Result> scratch =
        RUNNER.fromScratch().run(config, readings, from, to, window, maxAge);

    assertThat(sliding).hasSizeGreaterThan(50);
    assertThat(sliding).isEqualTo(scratch);
  }

  /** Values in each parameter's usual range (invented for this comparison). */
  private static double value(String parameter, Random rnd) {
    return switch (parameter) {
      case "specific_conductivity" -> 3 + rnd.nextDouble() * 6;
      case "cation_conductivity", "degassed_cation_conductivity" -> 0.05 + rnd.nextDouble() * 0.3;
      case "ph" -> 9.0 + rnd.nextDouble() * 0.8;
      case "sodium" -> 0.5 + rnd.nextDouble() * 3;
      case "sample_temperature" -> 20 + rnd.nextDouble() * 15;
      case "drum_pressure" -> 8 + rnd.nextDouble() * 10;
      default -> rnd.nextDouble() * 50;
    };
  }
}
