package org.kwanta.model.evaluation;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.Instant;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * The allocation-free time gap of the trend and pH checks equals |Duration.between(a,
 * b).toMillis()| (the JDK's own definition, the outside reference here), on seeded random instants:
 * sub-millisecond and negative differences, both orders, and spans beyond the nanosecond range of a
 * long.
 */
class ChecksGapTest {

  @Test
  void gapEqualsTheAbsoluteDurationInMillis() {
    Random r = new Random(7L);
    for (int i = 0; i < 20_000; i++) {
      long s = 1_741_946_400L + r.nextInt(1_000_000) - 500_000;
      Instant a = Instant.ofEpochSecond(s, r.nextInt(1_000_000_000));
      long span =
          switch (i % 4) {
            case 0 -> r.nextInt(3);
            case 1 -> r.nextInt(100_000);
            case 2 -> r.nextLong() % 20_000_000_000L;
            default -> 0;
          };
      Instant b = Instant.ofEpochSecond(s + span, r.nextInt(1_000_000_000));
      long expected = Math.abs(Duration.between(a, b).toMillis());
      assertThat(Checks.gapMillis(a, b)).as("%s .. %s", a, b).isEqualTo(expected);
      assertThat(Checks.gapMillis(b, a)).as("%s .. %s", b, a).isEqualTo(expected);
    }
  }
}
