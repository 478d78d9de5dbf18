package org.kwanta.model.numeric;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

class BrentTest {

  @Test
  void findsSquareRootOfTwo() {
    double x = Brent.solve(v -> v * v - 2, 0, 2, 1e-15, 200);
    assertThat(x).isCloseTo(Math.sqrt(2), within(1e-14));
  }

  @Test
  void findsRootOfSteepMonotoneFunction() {
    // a charge-balance-like function: exponentials of pH over 14 decades
    double x = Brent.solve(v -> Math.pow(10, -v) - 1e-7 * Math.pow(10, v - 7), -2, 16, 1e-13, 300);
    assertThat(x).isCloseTo(7.0, within(1e-10));
  }

  @Test
  void rejectsUnbracketedInterval() {
    assertThatThrownBy(() -> Brent.solve(v -> v * v + 1, -1, 1, 1e-12, 100))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("not bracketed");
  }
}
