package org.kwanta.service.chemistry;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.net.http.HttpResponse;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.springframework.boot.test.web.server.LocalServerPort;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** Dosing advice over HTTP: a round trip through the speciation endpoint, and the contract. */
@DatabaseTest
class DosingApiIT {

  private static final JsonMapper JSON = JsonMapper.builder().build();

  @LocalServerPort int port;
  Http http;

  @BeforeEach
  void client() {
    http = Http.admin(port);
  }

  private JsonNode ok(String path, String body) {
    HttpResponse<String> r = http.post(path, "application/json", body);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    return JSON.readTree(r.body());
  }

  /** dose → pH (the speciation endpoint) → dose; 1 mg/kg NH₃ ≈ pH₂₅ 9.4 (common practice). */
  @Test
  void doseForPh25RoundTripsThroughTheSpeciation() {
    JsonNode d =
        ok(
            "/api/v1/chemistry/dosing",
            """
            {"alkalizers": [{"component": "ammonia"}], "targetPh25": 9.4, "composition": []}""");
    JsonNode dose = d.get("dose");
    double mg = dose.get("totalMgPerKg").asDouble();
    assertThat(mg).isBetween(0.7, 1.4);
    assertThat(d.get("caution").asString()).contains("procedures");
    assertThat(d.get("lowest").get("totalMgPerKg").asDouble()).isLessThanOrEqualTo(mg + 1e-9);
    JsonNode s =
        ok(
            "/api/v1/chemistry/speciation",
            "{\"composition\": [{\"component\": \"ammonia\", \"amount\": "
                + mg
                + ", \"unit\": \"mg/kg\"}], \"temperatureCel\": 25}");
    assertThat(s.get("results").get(0).get("phAt25Cel").asDouble()).isCloseTo(9.4, within(1e-6));
  }

  @Test
  void marginOverNeutralAtTheEconomizerWithAMix() {
    JsonNode d =
        ok(
            "/api/v1/chemistry/dosing",
            """
            {"alkalizers": [{"component": "ammonia", "massPart": 3},
                            {"component": "ethanolamine", "massPart": 1}],
             "composition": [{"component": "carbon_dioxide", "amount": 20, "unit": "ug/kg"}],
             "targetMarginOverNeutral": 1.0, "temperatureCel": 155, "pressureMPa": 15}""");
    JsonNode dose = d.get("dose");
    assertThat(dose.get("phAtTemperature").asDouble() - dose.get("neutralPh").asDouble())
        .isCloseTo(1.0, within(1e-6));
    assertThat(dose.get("alkalizers")).hasSize(2);
    assertThat(d.get("basis").asString()).isEqualTo("margin_over_neutral");
  }

  @Test
  void refusals() {
    HttpResponse<String> both =
        http.post(
            "/api/v1/chemistry/dosing",
            "application/json",
            "{\"alkalizers\": [{\"component\": \"ammonia\"}], \"targetPh25\": 9,"
                + " \"targetMarginOverNeutral\": 1, \"temperatureCel\": 100}");
    assertThat(both.statusCode()).as(both.body()).isEqualTo(400);
    HttpResponse<String> notBase =
        http.post(
            "/api/v1/chemistry/dosing",
            "application/json",
            "{\"alkalizers\": [{\"component\": \"sodium\"}], \"targetPh25\": 9}");
    assertThat(notBase.statusCode()).as(notBase.body()).isEqualTo(400);
    HttpResponse<String> unreachable =
        http.post(
            "/api/v1/chemistry/dosing",
            "application/json",
            "{\"alkalizers\": [{\"component\": \"ammonia\"}], \"targetPh25\": 13.5}");
    assertThat(unreachable.statusCode()).as(unreachable.body()).isEqualTo(422);
  }
}
