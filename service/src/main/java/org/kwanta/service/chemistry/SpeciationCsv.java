package org.kwanta.service.chemistry;

import java.util.Locale;

/** CSV (RFC 4180) of a pH curve; the header names the unit of each column. */
final class SpeciationCsv {

  static final String HEADER =
      "temperature_Cel,pressure_MPa,pressure_source,pH_at_temperature,neutral_pH,"
          + "pH_minus_neutral,pKw,ionic_strength_mol_per_kg,band_low_pH,band_high_pH,"
          + "band_low_constant_set,band_high_constant_set,extrapolated_constant,pH_at_25_Cel";

  private SpeciationCsv() {}

  static String write(SpeciationCurveResponse curve) {
    StringBuilder sb = new StringBuilder(HEADER).append("\r\n");
    for (SpeciationCurveResponse.Row r : curve.rows()) {
      sb.append(
              String.format(
                  Locale.ROOT,
                  "%.4f,%.9g,%s,%.4f,%.4f,%.4f,%.4f,%.6g,%.4f,%.4f,%s,%s,%s,%.4f",
                  r.temperatureCel(),
                  r.pressureMPa(),
                  r.pressureSource(),
                  r.phAtTemperature().ph(),
                  r.neutralPh(),
                  r.phMinusNeutral(),
                  r.pKw(),
                  r.ionicStrengthMolPerKg(),
                  r.phAtTemperature().low(),
                  r.phAtTemperature().high(),
                  field(r.phAtTemperature().lowConstantSet()),
                  field(r.phAtTemperature().highConstantSet()),
                  r.extrapolatedConstant(),
                  curve.phAt25Cel()))
          .append("\r\n");
    }
    return sb.toString();
  }

  /** A text field, quoted when it holds a comma, quote or line break (RFC 4180). */
  static String field(String s) {
    if (s.indexOf(',') < 0 && s.indexOf('"') < 0 && s.indexOf('\n') < 0 && s.indexOf('\r') < 0) {
      return s;
    }
    return '"' + s.replace("\"", "\"\"") + '"';
  }
}
