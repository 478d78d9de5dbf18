package org.kwanta.service.chemistry;

import java.util.ArrayList;
import java.util.List;
import org.kwanta.model.aqueous.Speciation;
import org.kwanta.model.aqueous.SpeciationReport;
import org.kwanta.model.aqueous.SpeciationResult;
import org.kwanta.model.water.Water;
import org.kwanta.model.water.WaterState;
import org.kwanta.service.system.ProblemException;

/** The engine calls behind the endpoints, with the request-size bounds. Stateless. */
final class Calculations {

  /** Most temperatures in one speciation request (each result lists species and constants). */
  static final int MAX_TEMPERATURES = 50;

  /** Most rows of one curve. */
  static final int MAX_CURVE_ROWS = 500;

  private Calculations() {}

  /** The temperatures of a request: exactly one of a single value and a list. */
  static List<Double> temperatures(Double single, List<Double> list) {
    if ((single == null) == (list == null)) {
      throw ProblemException.of("give exactly one of temperatureCel and temperaturesCel");
    }
    if (single != null) {
      return List.of(single);
    }
    if (list.isEmpty() || list.size() > MAX_TEMPERATURES) {
      throw ProblemException.of(
          "temperaturesCel must hold 1 to " + MAX_TEMPERATURES + " values, not " + list.size());
    }
    for (int i = 0; i < list.size(); i++) {
      if (list.get(i) == null) {
        throw ProblemException.of("temperaturesCel[" + i + "] is null");
      }
    }
    return list;
  }

  /** Report (speciation, 25 °C pH, band) at each temperature. */
  static List<SpeciationReport> reports(SpeciationInputs.Parsed in, List<Double> temperaturesCel) {
    List<SpeciationReport> out = new ArrayList<>(temperaturesCel.size());
    for (double t : temperaturesCel) {
      out.add(Speciation.report(in.composition(), in.water(t), in.options()));
    }
    return out;
  }

  /** Curve rows from fromCel to toCel in stepCel steps. */
  static SpeciationCurveResponse curve(
      SpeciationInputs.Parsed in, Double fromCel, Double toCel, Double stepCel) {
    if (fromCel == null || toCel == null || stepCel == null) {
      throw ProblemException.of("fromCel, toCel and stepCel are required");
    }
    if (!(stepCel > 0)
        || !Double.isFinite(stepCel)
        || !Double.isFinite(fromCel)
        || !Double.isFinite(toCel)
        || toCel < fromCel) {
      throw ProblemException.of("need finite fromCel <= toCel and stepCel > 0");
    }
    double rows = Math.floor((toCel - fromCel) / stepCel + 1e-9) + 1;
    if (rows > MAX_CURVE_ROWS) {
      throw ProblemException.of(
          "curve of " + (long) rows + " rows exceeds the limit of " + MAX_CURVE_ROWS);
    }
    // Both ends are checked before any work, so a range reaching past 350 °C fails at once.
    in.water(fromCel);
    in.water(toCel);
    List<SpeciationCurveResponse.Row> out = new ArrayList<>();
    for (int i = 0; i < (int) rows; i++) {
      // Rounding of fromCel + i·stepCel can pass toCel by an ulp on the last row; the grid ends
      // at toCel.
      double t = Math.min(fromCel + i * stepCel, toCel);
      WaterState w = in.water(t);
      SpeciationResult r = Speciation.solve(in.composition(), w, in.options());
      out.add(
          SpeciationCurveResponse.Row.from(r, Speciation.band(in.composition(), w, in.options())));
    }
    WaterState water25 =
        Water.at(
            Speciation.REFERENCE_TEMPERATURE_K, Water.ATMOSPHERIC_PRESSURE_PA, in.ionization());
    return SpeciationCurveResponse.from(
        in, Speciation.solve(in.composition(), water25, in.options()), out);
  }
}
