package org.kwanta.model.water;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvFileSource;

/**
 * The facade in IF97 regions 2 and 3 against Debian python3-iapws (grid written by {@code
 * model/src/test/python/make_region3_fixture.py}; its header names the version): the same IF97
 * equations, so the region must agree, the density to 1e-7 relative and R11-07 pKw to 1e-6. The
 * tolerances are those of python3-iapws's own region-3 iteration (scipy's Newton, default tolerance
 * 1.48e-8 in ρ between steps), which near the critical point leaves ρ uncertain in the eighth
 * digit; elsewhere the two agree to about 1e-9.
 */
class IapwsPythonRegions23Test {

  @ParameterizedTest
  @CsvFileSource(resources = "/water/iapws-python-regions23.csv", numLinesToSkip = 2)
  void agreesWithPythonIapws(double t, double pMPa, int region, double rho, double pKw) {
    WaterState w = Water.at(t, pMPa * 1e6, IonizationFormulation.R11_07);
    assertThat(w.phase().name()).endsWith("REGION_" + region);
    assertThat(w.densityKgPerM3()).isCloseTo(rho, within(1e-7 * rho));
    assertThat(w.pKw()).isCloseTo(pKw, within(1e-6));
  }
}
