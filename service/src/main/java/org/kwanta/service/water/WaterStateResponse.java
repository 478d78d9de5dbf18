package org.kwanta.service.water;

import io.swagger.v3.oas.annotations.media.Schema;
import org.kwanta.model.water.Phase;
import org.kwanta.model.water.PressureSource;
import org.kwanta.model.water.WaterState;

/** Water at one (T, p), units in every field name, and the formulation behind each number. */
@Schema(description = "Properties of water at one temperature and pressure")
record WaterStateResponse(
    @Schema(example = "300") double temperatureCel,
    @Schema(example = "573.15") double temperatureK,
    @Schema(example = "8.587708") double pressureMPa,
    @Schema(description = "GIVEN, SATURATION, or ATMOSPHERIC_FLOOR (saturation below 0.101325 MPa)")
        PressureSource pressureSource,
    @Schema(example = "8.587708") Double saturationPressureMPa,
    Phase phase,
    @Schema(example = "712.14") double densityKgPerM3,
    @Schema(example = "11.339") double pKw,
    @Schema(example = "5.670", description = "pKw/2, molal activity scale") double neutralPh,
    @Schema(example = "20.14") double relativePermittivity,
    @Schema(
            description = "Debye–Hückel A, molal, log10, unit kg^(1/2)·mol^(-1/2)",
            example = "1.242")
        double debyeHuckelAKgHalfPerMolHalf,
    @Schema(
            description = "Debye–Hückel B, molal, unit Å^(-1)·kg^(1/2)·mol^(-1/2)",
            example = "0.395")
        double debyeHuckelBPerAngstromKgHalfPerMolHalf,
    Formulations formulations) {

  /** Which published formulation produced each number. */
  record Formulations(
      String density,
      String saturationPressure,
      String pKw,
      String relativePermittivity,
      String debyeHuckel) {}

  static WaterStateResponse from(WaterState s) {
    boolean liquid = s.phase() == Phase.LIQUID_REGION_1;
    return new WaterStateResponse(
        s.temperatureK() - 273.15,
        s.temperatureK(),
        s.pressurePa() / 1e6,
        s.pressureSource(),
        Double.isFinite(s.saturationPressurePa()) ? s.saturationPressurePa() / 1e6 : null,
        s.phase(),
        s.densityKgPerM3(),
        s.pKw(),
        s.neutralPh(),
        s.relativePermittivity(),
        s.debyeHuckelA(),
        s.debyeHuckelB(),
        new Formulations(
            liquid ? "IAPWS-IF97 (R7-97(2012)) region 1" : "IAPWS-IF97 (R7-97(2012)) region 2",
            "IAPWS-IF97 (R7-97(2012)) region 4",
            IonizationNames.label(s.ionization()),
            "IAPWS R8-97",
            "Debye–Hückel A and B from IAPWS R8-97 permittivity, IF97 density and CODATA 2018 constants"));
  }
}
