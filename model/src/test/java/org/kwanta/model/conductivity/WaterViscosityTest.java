package org.kwanta.model.conductivity;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.kwanta.model.OutOfValidityRangeException;

class WaterViscosityTest {

  /** IAPWS R12-08 Table 4 (values confirmed by python3-iapws 1.5.2, see the CSV header). */
  @Test
  void matchesReleaseTable4() {
    for (double[] row : CsvRows.read("/conductivity/iapws-r12-08-table4.csv")) {
      double muMicro = WaterViscosity.at(row[0], row[1]) * 1e6;
      assertThat(muMicro).as("T=%s rho=%s", row[0], row[1]).isCloseTo(row[2], within(5e-7));
    }
  }

  /** python3-iapws 1.5.2 at 0–100 °C on the IF97 liquid density (outside reference library). */
  @Test
  void matchesPythonIapwsOnTheLiquidGrid() {
    for (double[] row : CsvRows.read("/conductivity/iapws-viscosity-liquid-grid.csv")) {
      double mu = WaterViscosity.at(row[0], row[1]);
      assertThat(mu).as("T=%s", row[0]).isCloseTo(row[2], within(row[2] * 1e-9));
    }
  }

  @Test
  void rejectsTemperatureBelowValidity() {
    assertThatThrownBy(() -> WaterViscosity.at(250.0, 999.0))
        .isInstanceOf(OutOfValidityRangeException.class)
        .hasMessageContaining("temperature")
        .hasMessageContaining("IAPWS R12-08");
  }

  @Test
  void nanInGivesNanOut() {
    assertThat(WaterViscosity.at(Double.NaN, 999.0)).isNaN();
  }
}
