package org.kwanta.service.chemistry;

import io.swagger.v3.oas.annotations.media.Schema;
import java.util.List;
import org.kwanta.model.aqueous.PhBand;
import org.kwanta.model.aqueous.SpeciationResult;
import org.kwanta.model.water.PressureSource;
import org.kwanta.model.water.WaterState;
import org.kwanta.service.water.IonizationNames;

/** pH at temperature over a temperature range, with the band of each row. */
@Schema(description = "pH at temperature over a temperature range (advisory)")
record SpeciationCurveResponse(
    List<ComponentTotal> composition,
    @Schema(example = "davies") String activityModel,
    @Schema(example = "default") String constantSet,
    @Schema(example = "liquid") String sampleOrigin,
    @Schema(example = "IAPWS R11-07") String pKwFormulation,
    @Schema(description = "pH at 25 °C and 0.101325 MPa of the same water", example = "9.38")
        double phAt25Cel,
    List<Row> rows) {

  /** One temperature. */
  @Schema(name = "SpeciationCurveRow")
  record Row(
      @Schema(example = "300") double temperatureCel,
      @Schema(example = "15") double pressureMPa,
      PressureSource pressureSource,
      @Schema(description = "pH at temperature with its band over the constant sets")
          SpeciationResponse.PhAtTemperature phAtTemperature,
      @Schema(example = "5.67") double neutralPh,
      @Schema(example = "0.28") double phMinusNeutral,
      @Schema(example = "11.339") double pKw,
      double ionicStrengthMolPerKg,
      @Schema(
              description =
                  "true when a constant of the main result (the chosen set) was evaluated outside"
                      + " its fit's stated range; band members may be extrapolated independently")
          boolean extrapolatedConstant) {

    static Row from(SpeciationResult r, PhBand band) {
      WaterState w = r.water();
      return new Row(
          w.temperatureK() - 273.15,
          w.pressurePa() / 1e6,
          w.pressureSource(),
          SpeciationResponse.PhAtTemperature.of(r.ph(), band, false),
          r.neutralPh(),
          r.phMinusNeutral(),
          r.pKw(),
          r.ionicStrengthMolPerKg(),
          r.anyExtrapolated());
    }
  }

  static SpeciationCurveResponse from(
      SpeciationInputs.Parsed in, SpeciationResult at25, List<Row> rows) {
    return new SpeciationCurveResponse(
        in.totals(),
        SpeciationInputs.apiName(in.options().activityModel()),
        in.options().constants().id(),
        SpeciationInputs.apiName(in.options().sampleOrigin()),
        IonizationNames.label(in.ionization()),
        at25.ph(),
        rows);
  }
}
