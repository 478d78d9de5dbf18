package org.kwanta.service.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import java.math.BigDecimal;
import java.math.MathContext;
import java.util.Random;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;
import org.kwanta.model.Parameter;

/** Unit conversion on the way in: the same value in another unit is the same stored number. */
class UnitsTest {

  @ParameterizedTest
  @CsvSource({
    // value, unit, canonical value exactly as a historian would write it in the canonical unit
    "7e-6, S/m, 0.07",
    "0.00007, mS/cm, 0.07",
    "0.7, mS/m, 7",
    "7, uS/m, 0.07",
    "0.0000123, S/m, 0.123",
    "300.15, K, 27",
    "80.6, [degF], 27",
    "0.0123, mg/kg, 12.3",
    "4560, ng/kg, 4.56",
    "160, bar, 16",
    "16000, kPa, 16",
    "612, t/h, 170",
    "250000, kW, 250"
  })
  void sameValueInAnotherUnitIsTheSameNumber(double value, String unit, double canonical) {
    Parameter p =
        switch (unit) {
          case "K", "[degF]" -> Parameter.SAMPLE_TEMPERATURE;
          case "mg/kg", "ng/kg" -> Parameter.SODIUM;
          case "bar", "kPa" -> Parameter.DRUM_PRESSURE;
          case "t/h" -> Parameter.STEAM_FLOW;
          case "kW" -> Parameter.LOAD;
          default -> Parameter.CATION_CONDUCTIVITY;
        };
    assertThat(Units.toCanonical(p, value, unit)).hasValue(canonical);
  }

  /** Seeded: values of up to 10 significant digits survive a trip through every other unit. */
  @ParameterizedTest
  @ValueSource(longs = {20261201L, 7L})
  void conductivitiesRoundTripThroughEveryUnit(long seed) {
    Random random = new Random(seed);
    String[][] units = {{"S/m", "-4"}, {"mS/cm", "-3"}, {"mS/m", "-1"}, {"uS/m", "2"}};
    for (int i = 0; i < 20_000; i++) {
      double canonical =
          new BigDecimal(Math.pow(10, random.nextDouble() * 8 - 4))
              .round(new MathContext(1 + random.nextInt(10)))
              .doubleValue();
      for (String[] unit : units) {
        double sent =
            new BigDecimal(Double.toString(canonical))
                .scaleByPowerOfTen(Integer.parseInt(unit[1]))
                .doubleValue();
        assertThat(Units.toCanonical(Parameter.SPECIFIC_CONDUCTIVITY, sent, unit[0]))
            .as("%s %s", sent, unit[0])
            .hasValue(canonical);
      }
    }
  }

  @ParameterizedTest
  @ValueSource(doubles = {0.07, 0.06999999999999999, 123456.789, 1e-30, 0})
  void canonicalUnitKeepsTheValueExactlyAsSent(double value) {
    assertThat(Units.toCanonical(Parameter.CATION_CONDUCTIVITY, value, "uS/cm")).hasValue(value);
  }

  @ParameterizedTest
  @ValueSource(doubles = {1e-300, -2.5e-7, 9.87654321098765e15, Double.MAX_VALUE})
  void roundingNeverFailsAndKeepsTwelveDigits(double value) {
    double rounded = Units.significant(value);
    assertThat(Math.abs(rounded - value)).isLessThanOrEqualTo(Math.abs(value) * 1e-11);
  }

  @org.junit.jupiter.api.Test
  void everyParameterAcceptsItsCanonicalUnitAsIs() {
    for (Parameter p : Parameter.values()) {
      assertThat(Units.accepted(p)).contains(p.unit());
      assertThat(Units.toCanonical(p, 1.25, p.unit())).hasValue(1.25);
    }
  }
}
