package org.kwanta.model;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

/** The historian's operating-state codes: 1 to 5, whole numbers only. */
class OperatingStateCodeTest {

  @Test
  void mapsTheFiveCodesInTheDocumentedOrder() {
    assertThat(OperatingStateCode.of(1)).hasValue(OperatingStateCode.IN_SERVICE);
    assertThat(OperatingStateCode.of(2)).hasValue(OperatingStateCode.START_UP);
    assertThat(OperatingStateCode.of(3)).hasValue(OperatingStateCode.SHUT_DOWN);
    assertThat(OperatingStateCode.of(4)).hasValue(OperatingStateCode.LAYUP_WET);
    assertThat(OperatingStateCode.of(5)).hasValue(OperatingStateCode.LAYUP_DRY);
  }

  @Test
  void refusesFractionsAndNumbersOutsideTheCodes() {
    assertThat(OperatingStateCode.of(1.5)).isEmpty();
    assertThat(OperatingStateCode.of(0)).isEmpty();
    assertThat(OperatingStateCode.of(6)).isEmpty();
    assertThat(OperatingStateCode.of(Double.NaN)).isEmpty();
  }

  @Test
  void catalogueBoundsAreTheCodes() {
    assertThat(Parameter.OPERATING_STATE.min()).isEqualTo(1);
    assertThat(Parameter.OPERATING_STATE.max()).isEqualTo(OperatingStateCode.values().length);
  }
}
