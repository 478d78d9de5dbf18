package org.kwanta.model.evaluation;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Locale;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * {@link ThreeDigits} writes what the JDK's {@code java.util.Formatter} writes for {@code "%.3g"}
 * (the reference here: the JDK's own formatter), on edge values and on random doubles of every
 * magnitude.
 */
class ThreeDigitsTest {

  private static void same(double v) {
    assertThat(ThreeDigits.of(v))
        .as("%s", Double.toString(v))
        .isEqualTo(String.format(Locale.ROOT, "%.3g", v));
  }

  @Test
  void edgeValuesAsTheFormatterWritesThem() {
    double[] values = {
      0.0,
      -0.0,
      1,
      -1,
      9.995,
      9.994999,
      99.95,
      999.4,
      999.5,
      1000,
      0.0001,
      0.00009995,
      0.000099949,
      0.00099995,
      0.125,
      2.675,
      1.005,
      0.3130000001,
      0.2,
      9.60,
      9.29,
      25.0,
      1e-300,
      4.9e-324,
      Double.MAX_VALUE,
      -Double.MAX_VALUE,
      Double.MIN_NORMAL,
      123456789,
      1e21,
      1e-21,
      0.5,
      5e-5
    };
    for (double v : values) {
      same(v);
      same(-v);
    }
  }

  @Test
  void randomDoublesOfEveryMagnitudeAsTheFormatterWritesThem() {
    Random random = new Random(20261203);
    for (int i = 0; i < 200_000; i++) {
      double v;
      switch (i % 4) {
        case 0 -> v = Double.longBitsToDouble(random.nextLong());
        case 1 -> v = (random.nextDouble() - 0.5) * Math.pow(10, random.nextInt(12) - 6);
        // values on a decimal grid, where half-up rounding ties occur
        case 2 -> v = random.nextInt(2_000_000) / Math.pow(10, random.nextInt(9));
        default -> v = Math.round(random.nextGaussian() * 1e4) / 1e4;
      }
      if (!Double.isNaN(v)) {
        same(v);
      }
    }
  }
}
