package org.kwanta.service.chemistry;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.media.Content;
import io.swagger.v3.oas.annotations.media.ExampleObject;
import io.swagger.v3.oas.annotations.media.Schema;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import org.kwanta.model.aqueous.Component;
import org.kwanta.model.conductivity.ForwardConductivity;
import org.kwanta.model.diagnosis.CoolingWater;
import org.kwanta.model.diagnosis.LeakChannels;
import org.kwanta.service.water.WaterProperties;
import org.springframework.http.MediaType;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RestController;

@RestController
@RequestMapping("/api/v1/chemistry")
@Tag(name = "Chemistry")
class ConductivityController {

  static final String CAUTION =
      " **Advisory.** Calculated conductivities assume an ideal cation exchanger and degasser and"
          + " the composition given; they do not replace measurement, and the plant's own"
          + " procedures govern.";

  private final StrictJson json;
  private final WaterProperties water;

  ConductivityController(StrictJson json, WaterProperties water) {
    this.json = json;
    this.water = water;
  }

  @PostMapping(
      value = "/conductivity",
      consumes = MediaType.APPLICATION_JSON_VALUE,
      produces = MediaType.APPLICATION_JSON_VALUE)
  @Operation(
      summary = "Specific, cation and degassed cation conductivity of a water",
      description =
          "Totals of the components (alkalizers, sodium, chloride, sulfate, carbon_dioxide,"
              + " phosphate; units as for the speciation) → at 25 °C and, with"
              + " sampleTemperatureCel (0–100 °C), at the sample temperature: each channel's"
              + " conductivity, the pH of the water it sees, and each ion's share. Other"
              + " components: 400. A temperature outside 0–100 °C: 422."
              + CAUTION,
      requestBody =
          @io.swagger.v3.oas.annotations.parameters.RequestBody(
              required = true,
              content =
                  @Content(
                      mediaType = MediaType.APPLICATION_JSON_VALUE,
                      schema = @Schema(implementation = ConductivityRequest.class),
                      examples =
                          @ExampleObject(
                              name = "Brackenmoor U1-ECO-IN feedwater",
                              value =
                                  """
                                  {"composition": [
                                    {"component": "ammonia", "amount": 1.0, "unit": "mg/kg"},
                                    {"component": "chloride", "amount": 2, "unit": "ug/kg"},
                                    {"component": "carbon_dioxide", "amount": 20, "unit": "ug/kg"}
                                  ],
                                   "sampleTemperatureCel": 40}"""))))
  ConductivityResponse conductivity(@RequestBody String body) {
    ConductivityRequest request = json.read(body, ConductivityRequest.class);
    Parsed in = parse(request.composition());
    ForwardConductivity.Channels at25 = ForwardConductivity.of(in.solutes(), in.mix(), 298.15);
    ForwardConductivity.Channels atSample = null;
    if (request.sampleTemperatureCel() != null) {
      double t = finite(request.sampleTemperatureCel(), "sampleTemperatureCel");
      atSample = ForwardConductivity.of(in.solutes(), in.mix(), t + 273.15);
    }
    return ConductivityResponse.from(in.totals(), at25, atSample);
  }

  @PostMapping(
      value = "/conductivity/ingress",
      consumes = MediaType.APPLICATION_JSON_VALUE,
      produces = MediaType.APPLICATION_JSON_VALUE)
  @Operation(
      summary = "Expected rise of each conductivity channel from a cooling-water leak",
      description =
          "A water (as for the conductivity calculation), the declared cooling water (sea,"
              + " brackish, fresh, hard_fresh) and the sodium the leak brings (µg/kg) → the"
              + " channels before and after, and the rise of specific, cation and degassed"
              + " cation conductivity, at temperatureCel (default 25 °C)."
              + CAUTION,
      requestBody =
          @io.swagger.v3.oas.annotations.parameters.RequestBody(
              required = true,
              content =
                  @Content(
                      mediaType = MediaType.APPLICATION_JSON_VALUE,
                      schema = @Schema(implementation = IngressRequest.class),
                      examples =
                          @ExampleObject(
                              name = "Brackenmoor U2-CPD, river-water condenser",
                              value =
                                  """
                                  {"composition": [
                                    {"component": "ammonia", "amount": 0.8, "unit": "mg/kg"}
                                  ],
                                   "coolingWater": "fresh", "sodiumUgPerKg": 5}"""))))
  IngressResponse ingress(@RequestBody String body) {
    IngressRequest request = json.read(body, IngressRequest.class);
    Parsed in = parse(request.composition());
    CoolingWater kind = coolingWater(request.coolingWater());
    if (request.sodiumUgPerKg() == null) {
      throw org.kwanta.service.system.ProblemException.of("sodiumUgPerKg is required");
    }
    double na = finite(request.sodiumUgPerKg(), "sodiumUgPerKg");
    if (na < 0) {
      throw org.kwanta.service.system.ProblemException.of("sodiumUgPerKg must be ≥ 0, not " + na);
    }
    double t =
        request.temperatureCel() == null ? 25 : finite(request.temperatureCel(), "temperatureCel");
    LeakChannels.Rise r = LeakChannels.of(in.solutes(), in.mix(), t + 273.15, kind, na);
    return IngressResponse.from(kind, na, r, in.totals());
  }

  private record Parsed(
      org.kwanta.model.conductivity.Solutes solutes,
      org.kwanta.model.conductivity.AlkalizerMix mix,
      List<ComponentTotal> totals) {}

  private Parsed parse(List<AmountInput> composition) {
    SpeciationInputs.Parsed in =
        SpeciationInputs.parse(
            new SpeciationInputs.Choices(composition, null, null, null, null, null, null),
            water.ionization());
    for (Component c : in.composition().totals().keySet()) {
      if (!ForwardConductivity.isModelled(c)) {
        List<String> known =
            Arrays.stream(Component.values())
                .filter(ForwardConductivity::isModelled)
                .map(SpeciationInputs::apiName)
                .toList();
        throw org.kwanta.service.system.ProblemException.of(
            SpeciationInputs.apiName(c)
                + " is not in the conductivity model; it knows "
                + String.join(", ", known));
      }
    }
    ForwardConductivity.Input input = ForwardConductivity.Input.of(in.composition());
    return new Parsed(input.solutes(), input.mix(), in.totals());
  }

  private static double finite(double v, String field) {
    if (!Double.isFinite(v)) {
      throw org.kwanta.service.system.ProblemException.of(field + " must be a finite number");
    }
    return v;
  }

  static String apiName(CoolingWater w) {
    return w.name().toLowerCase(Locale.ROOT);
  }

  private static CoolingWater coolingWater(String name) {
    if (name != null) {
      String n = name.trim().toLowerCase(Locale.ROOT).replace('-', '_').replace(' ', '_');
      for (CoolingWater w : CoolingWater.values()) {
        if (apiName(w).equals(n)) {
          return w;
        }
      }
    }
    List<String> known =
        Arrays.stream(CoolingWater.values()).map(ConductivityController::apiName).toList();
    throw org.kwanta.service.system.ProblemException.of(
        "coolingWater must be one of " + String.join(", ", known) + ", not '" + name + "'");
  }
}
