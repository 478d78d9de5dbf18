package org.kwanta.service.water;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.Parameter;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.util.ArrayList;
import java.util.List;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.model.water.Water;
import org.kwanta.model.water.WaterState;
import org.kwanta.service.system.ProblemException;
import org.kwanta.service.system.ResponseFormats;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

@RestController
@RequestMapping("/api/v1/water")
@Tag(
    name = "Water",
    description =
        "Water at temperature: IAPWS-IF97 density, ionization constant (IAPWS R11-07 or R11-24), static"
            + " dielectric constant (IAPWS R8-97), Debye–Hückel parameters. Advisory results.")
class WaterController {

  static final int MAX_TABLE_ROWS = 2000;

  private final WaterProperties properties;

  WaterController(WaterProperties properties) {
    this.properties = properties;
  }

  @GetMapping
  @Operation(
      summary = "Water properties at one temperature and optional pressure",
      description =
          "Give the temperature in °C (temperatureCel) or K (temperatureK), 0–800 °C. Without"
              + " pressureMPa the saturation pressure is used, not below 0.101325 MPa, and the"
              + " result says so (saturation ends at the critical point, 373.946 °C). IF97 regions"
              + " 1, 2 and 3. In steam (states less dense than 322 kg/m3) density and pKw come with"
              + " a notice, without neutral pH or Debye–Hückel values. Outside a formulation's"
              + " validity range: 422 naming the limit and whose it is.")
  WaterStateResponse at(
      @Parameter(description = "temperature, °C", example = "300") @RequestParam(required = false)
          Double temperatureCel,
      @Parameter(description = "temperature, K") @RequestParam(required = false)
          Double temperatureK,
      @Parameter(description = "pressure, MPa (absolute); omit for saturation")
          @RequestParam(required = false)
          Double pressureMPa,
      @Parameter(description = "R11-07 (default) or R11-24") @RequestParam(required = false)
          String ionization) {
    return WaterStateResponse.from(
        state(kelvin(temperatureCel, temperatureK), pressureMPa, formulation(ionization)));
  }

  @GetMapping(
      value = "/table",
      produces = {MediaType.APPLICATION_JSON_VALUE, "text/csv"})
  @Operation(
      summary = "Water properties over a temperature range",
      description =
          "Rows from fromCel to toCel in stepCel steps, at saturation or at a fixed pressure. JSON, or CSV"
              + " with Accept: text/csv or format=csv.")
  ResponseEntity<?> table(
      @Parameter(example = "25") @RequestParam double fromCel,
      @Parameter(example = "350") @RequestParam double toCel,
      @Parameter(example = "5") @RequestParam(defaultValue = "5") double stepCel,
      @RequestParam(required = false) Double pressureMPa,
      @RequestParam(required = false) String ionization,
      @Parameter(description = "json or csv; overrides the Accept header")
          @RequestParam(required = false)
          String format,
      @org.springframework.web.bind.annotation.RequestHeader(value = "Accept", required = false)
          String accept) {
    if (!(stepCel > 0) || !Double.isFinite(fromCel) || !Double.isFinite(toCel) || toCel < fromCel) {
      throw ProblemException.of("need finite fromCel <= toCel and stepCel > 0");
    }
    double rows = Math.floor((toCel - fromCel) / stepCel + 1e-9) + 1;
    if (rows > MAX_TABLE_ROWS) {
      throw ProblemException.of(
          "table of " + (long) rows + " rows exceeds the limit of " + MAX_TABLE_ROWS);
    }
    IonizationFormulation f = formulation(ionization);
    List<WaterStateResponse> out = new ArrayList<>();
    for (int i = 0; i < (int) rows; i++) {
      double t = fromCel + i * stepCel;
      out.add(WaterStateResponse.from(state(t + 273.15, pressureMPa, f)));
    }
    boolean csv = ResponseFormats.csvRequested(format, accept);
    if (csv) {
      return ResponseEntity.ok().contentType(ResponseFormats.TEXT_CSV).body(WaterCsv.write(out));
    }
    return ResponseEntity.ok().contentType(MediaType.APPLICATION_JSON).body(out);
  }

  private static WaterState state(double kelvin, Double pressureMPa, IonizationFormulation f) {
    if (pressureMPa == null) {
      return Water.atSaturation(kelvin, f);
    }
    if (!Double.isFinite(pressureMPa)) {
      throw ProblemException.of("pressureMPa must be a finite number");
    }
    return Water.at(kelvin, pressureMPa * 1e6, f);
  }

  private static double kelvin(Double celsius, Double kelvin) {
    if ((celsius == null) == (kelvin == null)) {
      throw ProblemException.of("give exactly one of temperatureCel and temperatureK");
    }
    double k = celsius != null ? celsius + 273.15 : kelvin;
    if (!Double.isFinite(k)) {
      throw ProblemException.of("temperature must be a finite number");
    }
    return k;
  }

  private IonizationFormulation formulation(String name) {
    return IonizationNames.parse(name, properties.ionization());
  }
}
