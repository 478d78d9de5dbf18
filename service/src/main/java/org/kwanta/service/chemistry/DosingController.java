package org.kwanta.service.chemistry;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.media.Content;
import io.swagger.v3.oas.annotations.media.ExampleObject;
import io.swagger.v3.oas.annotations.media.Schema;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import org.kwanta.model.aqueous.Component;
import org.kwanta.model.aqueous.Dosing;
import org.kwanta.model.conductivity.AlkalizerMix;
import org.kwanta.model.water.Water;
import org.kwanta.model.water.WaterState;
import org.kwanta.service.system.ProblemException;
import org.kwanta.service.water.WaterProperties;
import org.springframework.http.MediaType;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RestController;

@RestController
@RequestMapping("/api/v1/chemistry")
@Tag(name = "Chemistry")
class DosingController {

  private final StrictJson json;
  private final WaterProperties water;

  DosingController(StrictJson json, WaterProperties water) {
    this.json = json;
    this.water = water;
  }

  @PostMapping(
      value = "/dosing",
      consumes = MediaType.APPLICATION_JSON_VALUE,
      produces = MediaType.APPLICATION_JSON_VALUE)
  @Operation(
      summary = "Dosing advice: the alkalizer amount for a target pH",
      description =
          "The water before dosing, the alkalizers dosed (one, or a mix by mass parts) and either"
              + " targetPh25 or targetMarginOverNeutral at temperatureCel (and pressureMPa;"
              + " omitted: saturation) → the total and each alkalizer's amount, the pH reached,"
              + " and the smallest and largest dose over the published constant sets. A target"
              + " the background already meets: dose 0. A target not reached below 0.1 mol/kg:"
              + " 422. **Advisory:** "
              + DosingResponse.CAUTION,
      requestBody =
          @io.swagger.v3.oas.annotations.parameters.RequestBody(
              required = true,
              content =
                  @Content(
                      mediaType = MediaType.APPLICATION_JSON_VALUE,
                      schema = @Schema(implementation = DosingRequest.class),
                      examples =
                          @ExampleObject(
                              name = "Brackenmoor U1 feedwater, pH25 9.6 with ammonia",
                              value =
                                  """
                                  {"composition": [
                                    {"component": "carbon_dioxide", "amount": 20, "unit": "ug/kg"}
                                  ],
                                   "alkalizers": [{"component": "ammonia"}],
                                   "targetPh25": 9.6}"""))))
  DosingResponse dosing(@RequestBody String body) {
    DosingRequest r = json.read(body, DosingRequest.class);
    SpeciationInputs.Parsed in =
        SpeciationInputs.parse(
            new SpeciationInputs.Choices(
                r.composition() == null ? List.of() : r.composition(),
                r.pressureMPa(),
                null,
                null,
                null,
                null,
                null),
            water.ionization());
    Map<Component, Double> mix = mix(r.alkalizers());
    WaterState at25 = Water.at(298.15, Water.ATMOSPHERIC_PRESSURE_PA, in.ionization());
    Dosing.Basis basis;
    double target;
    WaterState location = at25;
    if ((r.targetPh25() == null) == (r.targetMarginOverNeutral() == null)) {
      throw ProblemException.of("give exactly one of targetPh25 and targetMarginOverNeutral");
    }
    if (r.targetPh25() != null) {
      basis = Dosing.Basis.PH_25;
      target = finite(r.targetPh25(), "targetPh25");
    } else {
      basis = Dosing.Basis.MARGIN_OVER_NEUTRAL;
      target = finite(r.targetMarginOverNeutral(), "targetMarginOverNeutral");
      if (r.temperatureCel() == null) {
        throw ProblemException.of("temperatureCel is required with targetMarginOverNeutral");
      }
      location = in.water(r.temperatureCel());
    }
    Dosing.Advice advice;
    try {
      advice = Dosing.advise(in.composition(), mix, basis, target, at25, location, in.options());
    } catch (org.kwanta.model.OutOfValidityRangeException e) {
      throw e; // 422 naming the range, from the problem handler
    } catch (IllegalArgumentException e) {
      throw new ProblemException(
          org.springframework.http.HttpStatus.UNPROCESSABLE_CONTENT,
          org.kwanta.service.system.ProblemTypes.OUT_OF_VALIDITY_RANGE,
          "Target not reachable",
          e.getMessage(),
          Map.of());
    }
    return DosingResponse.from(basis, target, advice);
  }

  private static Map<Component, Double> mix(List<DosingRequest.AlkalizerPart> parts) {
    if (parts == null || parts.isEmpty()) {
      throw ProblemException.of("alkalizers is required: a list of {component, massPart}");
    }
    Map<Component, Double> mass = new EnumMap<>(Component.class);
    for (int index = 0; index < parts.size(); index++) {
      int i = index;
      DosingRequest.AlkalizerPart p = parts.get(i);
      if (p == null || p.component() == null) {
        throw ProblemException.of("alkalizers[" + i + "].component is required");
      }
      String n = p.component().trim().toLowerCase(java.util.Locale.ROOT).replace('-', '_');
      Component c =
          AlkalizerMix.alkalizers().stream()
              .filter(a -> SpeciationInputs.apiName(a).equals(n))
              .findFirst()
              .orElseThrow(
                  () ->
                      ProblemException.of(
                          "alkalizers["
                              + i
                              + "]: '"
                              + p.component()
                              + "' is not an alkalizer; known: "
                              + String.join(
                                  ", ",
                                  AlkalizerMix.alkalizers().stream()
                                      .map(SpeciationInputs::apiName)
                                      .toList())));
      double part = p.massPart() == null ? 1 : p.massPart();
      if (!(part > 0) || Double.isInfinite(part)) {
        throw ProblemException.of("alkalizers[" + i + "].massPart must be > 0");
      }
      if (mass.put(c, part) != null) {
        throw ProblemException.of("alkalizers[" + i + "]: " + n + " is listed twice");
      }
    }
    return AlkalizerMix.byMass(mass).molarFractions();
  }

  private static double finite(double v, String field) {
    if (!Double.isFinite(v)) {
      throw ProblemException.of(field + " must be a finite number");
    }
    return v;
  }
}
