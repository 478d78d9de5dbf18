package org.kwanta.model.water;

import java.math.BigDecimal;

/** Tolerances that follow from the digits a publication prints. */
final class Printed {

  private Printed() {}

  /** Half a unit in the last printed digit of {@code printed}, e.g. 5e-7 for "13.906565". */
  static double halfUnitInLastDigit(String printed) {
    return new BigDecimal(printed.trim()).ulp().doubleValue() / 2;
  }
}
