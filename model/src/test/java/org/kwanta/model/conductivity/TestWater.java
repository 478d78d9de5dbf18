package org.kwanta.model.conductivity;

import java.util.List;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.model.water.Phase;
import org.kwanta.model.water.PressureSource;
import org.kwanta.model.water.WaterState;

/**
 * Water states built from the outside reference library python3-iapws 1.5.2 (IF97 density, R11-07
 * pKw, R8-97 permittivity; see the CSV header), so the conductivity tests do not depend on the
 * engine's own water code. Debye–Hückel A = 1.8248×10⁶ ρ^½/(ε T)^{3/2} (ρ in g/cm³), the textbook
 * form (recalled from memory).
 */
final class TestWater {

  private static final List<double[]> ROWS =
      CsvRows.read("/conductivity/water-states-python-iapws.csv");

  private TestWater() {}

  /** The tabulated state at a temperature in °C (must be one of the tabulated ones). */
  static WaterState atCelsius(double celsius) {
    double t = celsius == 0 ? 273.16 : 273.15 + celsius;
    for (double[] r : ROWS) {
      if (Math.abs(r[0] - t) < 1e-6) {
        return state(r);
      }
    }
    throw new IllegalArgumentException("no tabulated water state at " + celsius + " °C");
  }

  static List<WaterState> all() {
    return ROWS.stream().map(TestWater::state).toList();
  }

  private static WaterState state(double[] r) {
    double t = r[0];
    double rho = r[2];
    double eps = r[4];
    double et = eps * t;
    double a = 1.8248e6 * Math.sqrt(rho / 1000) / (et * Math.sqrt(et));
    double b = 50.29 * Math.sqrt(rho / 1000) / Math.sqrt(et);
    return new WaterState(
        t,
        r[1],
        PressureSource.GIVEN,
        Phase.LIQUID_REGION_1,
        Double.NaN,
        rho,
        IonizationFormulation.R11_07,
        r[3],
        eps,
        a,
        b);
  }
}
