package org.kwanta.service.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.kwanta.model.conductivity.AlkalizerMix;
import org.kwanta.model.evaluation.Regime;
import org.kwanta.model.evaluation.SamplePointConfig;

/**
 * The operating state of the pH at temperature: a recent drum pressure at a drum point gives the
 * saturation temperature, otherwise the configured state.
 */
class OperatingConditionTest {

  private static final Instant T = Instant.parse("2026-12-01T10:00:00Z");
  private static final Duration MAX_AGE = Duration.ofMinutes(10);

  /** HP drum water configured at 330 °C (saturation, no pressure), as Brackenmoor's U1-HP-DRUM. */
  private static final SamplePointConfig DRUM =
      SamplePointConfig.of("D", Regime.AVT_O, AlkalizerMix.AMMONIA, 603.15, Double.NaN);

  /**
   * T_s(p) for drum pressures. 0.1, 1 and 10 MPa: IAPWS-IF97 (IAPWS R7-97(2012)) Table 35, the
   * check values of Eq. 31, printed to 9 digits (372.755919, 453.035632, 584.149488 K); 16 MPa:
   * python3-iapws 1.5.2 {@code iapws.iapws97._TSat_P(16)} = 620.5065344459691 K. Tolerance: half a
   * unit of the ninth digit of the table.
   */
  @ParameterizedTest
  @CsvSource({"0.1, 372.755919", "1, 453.035632", "10, 584.149488", "16, 620.506534"})
  void aRecentDrumPressureSetsTheSaturationTemperature(double mpa, double saturationK) {
    List<String> notes = new ArrayList<>();
    OperatingCondition.Choice c =
        OperatingCondition.choose(DRUM, "DRUM_WATER", mpa, T.minusSeconds(300), T, MAX_AGE, notes);
    assertThat(c.condition().source()).isEqualTo(OperatingCondition.Source.MEASURED);
    assertThat(c.condition().drumPressureMPa()).isEqualTo(mpa);
    assertThat(c.condition().measuredAt()).isEqualTo(T.minusSeconds(300));
    assertThat(c.config().operatingTemperatureK()).isCloseTo(saturationK, within(0.5e-6));
    assertThat(c.config().operatingPressurePa()).isNaN();
    assertThat(notes).isEmpty();
  }

  @Test
  void aSaturatedSteamPointCondensesAtTheMeasuredPressure() {
    OperatingCondition.Choice c =
        OperatingCondition.choose(
            DRUM.asSteam(), "SATURATED_STEAM", 10, T, T, MAX_AGE, new ArrayList<>());
    assertThat(c.config().operatingPressurePa()).isEqualTo(10e6);
    assertThat(c.config().steam()).isTrue();
  }

  @Test
  void aStalePressureFallsBackToTheConfiguredStateAndSaysWhy() {
    List<String> notes = new ArrayList<>();
    OperatingCondition.Choice c =
        OperatingCondition.choose(
            DRUM, "DRUM_WATER", 10, T.minus(MAX_AGE).minusSeconds(1), T, MAX_AGE, notes);
    assertThat(c.condition()).isEqualTo(OperatingCondition.CONFIGURED);
    assertThat(c.config()).isSameAs(DRUM);
    assertThat(notes).singleElement().asString().contains("older than PT10M");
  }

  @Test
  void aPressureAtTheMaximumAgeIsStillUsed() {
    OperatingCondition.Choice c =
        OperatingCondition.choose(
            DRUM, "DRUM_WATER", 10, T.minus(MAX_AGE), T, MAX_AGE, new ArrayList<>());
    assertThat(c.condition().source()).isEqualTo(OperatingCondition.Source.MEASURED);
  }

  @Test
  void pointsNotAtDrumConditionsKeepTheirConfiguredState() {
    OperatingCondition.Choice c =
        OperatingCondition.choose(DRUM, "FEEDWATER", 10, T, T, MAX_AGE, new ArrayList<>());
    assertThat(c.condition()).isEqualTo(OperatingCondition.CONFIGURED);
  }

  @Test
  void aPressureAboveTheCriticalPointFallsBackWithANote() {
    List<String> notes = new ArrayList<>();
    OperatingCondition.Choice c =
        OperatingCondition.choose(DRUM, "DRUM_WATER", 23, T, T, MAX_AGE, notes);
    assertThat(c.condition()).isEqualTo(OperatingCondition.CONFIGURED);
    assertThat(notes).singleElement().asString().contains("no saturation temperature");
  }
}
