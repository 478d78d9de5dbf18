package org.kwanta.service.chemistry;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.Parameter;
import io.swagger.v3.oas.annotations.media.Content;
import io.swagger.v3.oas.annotations.media.ExampleObject;
import io.swagger.v3.oas.annotations.media.Schema;
import io.swagger.v3.oas.annotations.responses.ApiResponse;
import io.swagger.v3.oas.annotations.tags.Tag;
import org.kwanta.service.system.ResponseFormats;
import org.kwanta.service.water.WaterProperties;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestHeader;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

@RestController
@RequestMapping("/api/v1/chemistry")
@Tag(
    name = "Chemistry",
    description =
        "Stateless calculations on a water's composition: speciation and pH at temperature over the"
            + " engine in org.kwanta.model.aqueous. Advisory results.")
class SpeciationController {

  static final String CAUTION =
      " **Advisory.** A calculated pH at temperature is a model result: it rests on published"
          + " equilibrium constants that disagree at high temperature (the band shows by how much),"
          + " on the activity model, and on the composition given. It does not replace measurement;"
          + " the plant's own chemistry guidelines, local codes and qualified practice govern.";

  private final StrictJson json;
  private final WaterProperties water;

  SpeciationController(StrictJson json, WaterProperties water) {
    this.json = json;
    this.water = water;
  }

  @PostMapping(
      value = "/speciation",
      consumes = MediaType.APPLICATION_JSON_VALUE,
      produces = MediaType.APPLICATION_JSON_VALUE)
  @Operation(
      summary = "Speciation and pH at temperature of one water",
      description =
          "Totals of the components (each amount with a UCUM unit: mg/kg, ug/kg, mol/kg, mmol/kg,"
              + " umol/kg; mass units count the component as the formula shown in the response) at"
              + " temperatureCel or at each of temperaturesCel, 0–350 °C. Without pressureMPa the"
              + " saturation pressure is used (not below 0.101325 MPa), and each result says which."
              + " Each result: pH at temperature (molal activity scale), pKw, neutral pH, pH minus"
              + " neutral, ionic strength, every species with molality and fraction, every"
              + " equilibrium constant used with its source and an extrapolated flag, notices, the"
              + " 25 °C pH of the same water, and the band of pH at temperature over alternative"
              + " constant sets. Unknown component, unit or field: 400. Outside a validity range"
              + " (temperature above 350 °C, a total above 0.1 mol/kg, B-dot outside 25–300 °C, a"
              + " pressure at which the water would be steam): 422 naming the limit."
              + CAUTION,
      requestBody =
          @io.swagger.v3.oas.annotations.parameters.RequestBody(
              required = true,
              content =
                  @Content(
                      mediaType = MediaType.APPLICATION_JSON_VALUE,
                      schema = @Schema(implementation = SpeciationRequest.class),
                      examples = {
                        @ExampleObject(
                            name = "Brackenmoor U1-HP-DRUM at 330 °C",
                            value =
                                """
                                {"composition": [
                                  {"component": "ammonia", "amount": 0.8, "unit": "mg/kg"},
                                  {"component": "chloride", "amount": 5, "unit": "ug/kg"},
                                  {"component": "sulfate", "amount": 4, "unit": "ug/kg"}
                                ],
                                 "temperatureCel": 330}"""),
                        @ExampleObject(
                            name = "Brackenmoor U2-HP-DRUM, phosphate-treated, at 330 °C",
                            value =
                                """
                                {"composition": [
                                  {"component": "phosphate", "amount": 1.5, "unit": "mg/kg"},
                                  {"component": "sodium", "amount": 1.0, "unit": "mg/kg"},
                                  {"component": "ammonia", "amount": 0.5, "unit": "mg/kg"},
                                  {"component": "chloride", "amount": 20, "unit": "ug/kg"}
                                ],
                                 "temperatureCel": 330, "pressureMPa": 13.0}"""),
                        @ExampleObject(
                            name = "Brackenmoor U1-ECO-IN at economizer and drum temperatures",
                            value =
                                """
                                {"composition": [
                                  {"component": "ammonia", "amount": 1.0, "unit": "mg/kg"}
                                ],
                                 "temperaturesCel": [25, 155, 230, 330], "pressureMPa": 15}""")
                      })))
  SpeciationResponse speciation(@RequestBody String body) {
    SpeciationRequest request = json.read(body, SpeciationRequest.class);
    var temperatures =
        Calculations.temperatures(request.temperatureCel(), request.temperaturesCel());
    SpeciationInputs.Parsed in = SpeciationInputs.parse(request.choices(), water.ionization());
    return SpeciationResponse.from(in, Calculations.reports(in, temperatures));
  }

  @PostMapping(
      value = "/speciation/curve",
      consumes = MediaType.APPLICATION_JSON_VALUE,
      produces = {MediaType.APPLICATION_JSON_VALUE, "text/csv"})
  @Operation(
      summary = "pH at temperature over a temperature range",
      description =
          "The same composition and options as the speciation, with fromCel, toCel and stepCel (at"
              + " most 500 rows) instead of temperatures: per row pH at temperature, neutral pH, pH"
              + " minus neutral, pKw, ionic strength and the band low/high with their constant"
              + " sets. JSON, or CSV with Accept: text/csv or format=csv."
              + CAUTION,
      requestBody =
          @io.swagger.v3.oas.annotations.parameters.RequestBody(
              required = true,
              content =
                  @Content(
                      mediaType = MediaType.APPLICATION_JSON_VALUE,
                      schema = @Schema(implementation = SpeciationCurveRequest.class),
                      examples =
                          @ExampleObject(
                              name = "Brackenmoor U1-ECO-IN feedwater, 25–330 °C at 15 MPa",
                              value =
                                  """
                                  {"composition": [
                                    {"component": "ammonia", "amount": 1.0, "unit": "mg/kg"}
                                  ],
                                   "fromCel": 25, "toCel": 330, "stepCel": 5, "pressureMPa": 15}"""))))
  @ApiResponse(
      responseCode = "200",
      description = "the curve",
      content = {
        @Content(
            mediaType = MediaType.APPLICATION_JSON_VALUE,
            schema = @Schema(implementation = SpeciationCurveResponse.class)),
        @Content(
            mediaType = "text/csv",
            schema = @Schema(type = "string", description = "RFC 4180, header row with units"))
      })
  ResponseEntity<?> curve(
      @RequestBody String body,
      @Parameter(description = "json or csv; overrides the Accept header")
          @RequestParam(required = false)
          String format,
      @RequestHeader(value = "Accept", required = false) String accept) {
    boolean csv = ResponseFormats.csvRequested(format, accept);
    SpeciationCurveRequest request = json.read(body, SpeciationCurveRequest.class);
    SpeciationInputs.Parsed in = SpeciationInputs.parse(request.choices(), water.ionization());
    SpeciationCurveResponse curve =
        Calculations.curve(in, request.fromCel(), request.toCel(), request.stepCel());
    if (csv) {
      return ResponseEntity.ok()
          .contentType(ResponseFormats.TEXT_CSV)
          .body(SpeciationCsv.write(curve));
    }
    return ResponseEntity.ok().contentType(MediaType.APPLICATION_JSON).body(curve);
  }
}
