package org.kwanta.model.water;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.junit.jupiter.api.Test;

/**
 * Grid cross-check against the Debian python3-iapws 1.5.2 reference library: 710 liquid (T, p)
 * points, 0–350 °C, from max(p_s, 0.101325 MPa) to 25 MPa (file header: functions used; script
 * make_water_fixture.py in src/test/python).
 *
 * <p>Tolerances: both sides evaluate the same published equations in IEEE double precision, so the
 * differences are rounding only (the order of summation differs; python-iapws sums 34 terms with
 * powers, this code regroups them). A relative 1e-11 for ρ and ε and 1e-10 absolute for pKw allow a
 * few hundred ulps of rounding and are still five orders of magnitude tighter than the 9
 * significant digits of the release tables: any coefficient or formula slip would show.
 */
class IapwsPythonGridTest {

  record Row(double t, double pMPa, double rho, double pKw, double epsilon) {}

  static List<Row> rows() throws IOException {
    List<Row> rows = new ArrayList<>();
    try (BufferedReader reader =
        new BufferedReader(
            new InputStreamReader(
                Objects.requireNonNull(
                    IapwsPythonGridTest.class.getResourceAsStream("/water/iapws-python-grid.csv")),
                StandardCharsets.UTF_8))) {
      String line;
      boolean header = true;
      while ((line = reader.readLine()) != null) {
        if (line.startsWith("#")) {
          continue;
        }
        if (header) {
          header = false;
          continue;
        }
        String[] f = line.split(",");
        rows.add(
            new Row(
                Double.parseDouble(f[0]),
                Double.parseDouble(f[1]),
                Double.parseDouble(f[2]),
                Double.parseDouble(f[3]),
                Double.parseDouble(f[4])));
      }
    }
    return rows;
  }

  @Test
  void matchesPythonIapwsOnTheWholeGrid() throws IOException {
    List<Row> rows = rows();
    assertThat(rows).hasSizeGreaterThanOrEqualTo(500);
    for (Row row : rows) {
      String where = "T=" + row.t() + " K, p=" + row.pMPa() + " MPa";
      double p = row.pMPa() * 1e6;
      double ps = Water.saturationPressurePa(row.t());
      // Saturation rows: python-iapws' p_s may be an ulp below ours, which would read as vapour.
      boolean onSaturation = Math.abs(p - ps) <= ps * 1e-12;
      WaterState state =
          onSaturation
              ? Water.atSaturation(row.t(), IonizationFormulation.R11_07)
              : Water.at(row.t(), p, IonizationFormulation.R11_07);
      assertThat(state.phase()).as(where).isEqualTo(Phase.LIQUID_REGION_1);
      assertThat(state.densityKgPerM3()).as(where).isCloseTo(row.rho(), within(row.rho() * 1e-11));
      assertThat(state.pKw()).as(where).isCloseTo(row.pKw(), within(1e-10));
      assertThat(state.relativePermittivity())
          .as(where)
          .isCloseTo(row.epsilon(), within(row.epsilon() * 1e-11));
    }
  }
}
