package org.kwanta.service.water;

import java.util.List;
import java.util.Locale;

/** CSV (RFC 4180) of a water table; the header names the unit of each column. */
final class WaterCsv {

  static final String HEADER =
      "temperature_Cel,temperature_K,pressure_MPa,pressure_source,saturation_pressure_MPa,phase,"
          + "density_kg_per_m3,pKw,neutral_pH,relative_permittivity,debye_huckel_A_kg0.5_per_mol0.5,"
          + "debye_huckel_B_per_angstrom_kg0.5_per_mol0.5,pKw_formulation";

  private WaterCsv() {}

  static String write(List<WaterStateResponse> rows) {
    StringBuilder sb = new StringBuilder(HEADER).append("\r\n");
    for (WaterStateResponse r : rows) {
      sb.append(
              String.format(
                  Locale.ROOT,
                  "%.4f,%.4f,%.9g,%s,%s,%s,%.6f,%.6f,%s,%s,%s,%s,%s",
                  r.temperatureCel(),
                  r.temperatureK(),
                  r.pressureMPa(),
                  r.pressureSource(),
                  r.saturationPressureMPa() == null
                      ? ""
                      : String.format(Locale.ROOT, "%.9g", r.saturationPressureMPa()),
                  r.phase(),
                  r.densityKgPerM3(),
                  r.pKw(),
                  sixDecimals(r.neutralPh()),
                  sixDecimals(r.relativePermittivity()),
                  sixDecimals(r.debyeHuckelAKgHalfPerMolHalf()),
                  sixDecimals(r.debyeHuckelBPerAngstromKgHalfPerMolHalf()),
                  r.formulations().pKw()))
          .append("\r\n");
    }
    return sb.toString();
  }

  /** A value with six decimals, or an empty field for a value that does not apply. */
  private static String sixDecimals(Double v) {
    return v == null ? "" : String.format(Locale.ROOT, "%.6f", v);
  }
}
