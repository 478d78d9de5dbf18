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

/**
 * The forward conductivity endpoints over HTTP: one number checked against its outside source (the
 * model's tests check the tables), the rest the contract (shares, units, errors).
 */
@DatabaseTest
class ConductivityApiIT {

  private static final JsonMapper JSON = JsonMapper.builder().build();
  private static final String CONDUCTIVITY = "/api/v1/chemistry/conductivity";
  private static final String INGRESS = "/api/v1/chemistry/conductivity/ingress";

  @LocalServerPort int port;
  Http http;

  @BeforeEach
  void client() {
    http = Http.admin(port);
  }

  private HttpResponse<String> post(String path, String body) {
    return http.post(path, "application/json", body);
  }

  private JsonNode ok(String path, String body) {
    HttpResponse<String> r = post(path, body);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    return JSON.readTree(r.body());
  }

  @Test
  void sodiumHydroxideOneMilligramPerLitreMatchesAstmD5128() {
    // ASTM D5128 Table 1: 1.0 mg/L NaOH → 6.229 µS/cm, pH 9.40 at 25 °C (model ≈1 % low, held
    // to 1.5 % as in the model's check table). 1.0 mg/L = 0.575 mg/kg Na at ρ 0.997047 kg/L.
    double naMgPerKg = 1.0 / 39.997 * 22.98977 / 0.997047;
    JsonNode b =
        ok(
            CONDUCTIVITY,
            "{\"composition\": [{\"component\": \"sodium\", \"amount\": "
                + naMgPerKg
                + ", \"unit\": \"mg/kg\"}]}");
    JsonNode sc = b.get("at25Cel").get("specific");
    assertThat(sc.get("conductivityUSPerCm").asDouble()).isCloseTo(6.229, within(0.094));
    assertThat(sc.get("ph").asDouble()).isCloseTo(9.40, within(0.02));
    assertThat(b.get("atSampleTemperature").isNull()).isTrue();
    // after the cation exchanger sodium hydroxide is water (0.055 µS/cm, ASTM D4519 §11.5)
    assertThat(b.get("at25Cel").get("cation").get("conductivityUSPerCm").asDouble())
        .isCloseTo(0.055, within(0.0005));
  }

  @Test
  void sharesAddUpAndTheSampleTemperatureIsGiven() {
    JsonNode b =
        ok(
            CONDUCTIVITY,
            """
            {"composition": [
              {"component": "ammonia", "amount": 1.0, "unit": "mg/kg"},
              {"component": "chloride", "amount": 2, "unit": "ug/kg"},
              {"component": "carbon_dioxide", "amount": 20, "unit": "ug/kg"}],
             "sampleTemperatureCel": 40}""");
    JsonNode at40 = b.get("atSampleTemperature");
    assertThat(at40.get("temperatureCel").asDouble()).isEqualTo(40);
    for (String ch : new String[] {"specific", "cation", "degassedCation"}) {
      for (JsonNode c : new JsonNode[] {b.get("at25Cel").get(ch), at40.get(ch)}) {
        double sum = 0;
        for (JsonNode ion : c.get("ions")) {
          sum += ion.get("conductivityUSPerCm").asDouble();
        }
        assertThat(sum).isCloseTo(c.get("conductivityUSPerCm").asDouble(), within(1e-8));
      }
    }
    // ammonia water: hydroxide (λ° 198) carries most, then ammonium (73.5), largest first
    JsonNode ions = b.get("at25Cel").get("specific").get("ions");
    assertThat(ions.get(0).get("species").asString()).isEqualTo("hydroxide");
    assertThat(ions.get(1).get("species").asString()).isEqualTo("ammonium");
    assertThat(at40.get("specific").get("conductivityUSPerCm").asDouble())
        .isGreaterThan(b.get("at25Cel").get("specific").get("conductivityUSPerCm").asDouble());
  }

  @Test
  void ingressGivesTheRiseOfEachChannel() {
    JsonNode b =
        ok(
            INGRESS,
            """
            {"composition": [{"component": "ammonia", "amount": 0.8, "unit": "mg/kg"}],
             "coolingWater": "sea", "sodiumUgPerKg": 10}""");
    assertThat(b.get("coolingWater").asString()).isEqualTo("sea");
    assertThat(b.get("source").asString()).contains("Millero");
    JsonNode rise = b.get("rise");
    assertThat(rise.get("cationConductivityUSPerCm").asDouble()).isGreaterThan(0.1);
    assertThat(rise.get("specificConductivityUSPerCm").asDouble()).isPositive();
    assertThat(
            b.get("after").get("cation").get("conductivityUSPerCm").asDouble()
                - b.get("before").get("cation").get("conductivityUSPerCm").asDouble())
        .isCloseTo(rise.get("cationConductivityUSPerCm").asDouble(), within(1e-12));
  }

  @Test
  void refusesWhatTheModelCannotTake() {
    HttpResponse<String> boron =
        post(
            CONDUCTIVITY,
            "{\"composition\": [{\"component\": \"boron\", \"amount\": 1, \"unit\": \"mg/kg\"}]}");
    assertThat(boron.statusCode()).as(boron.body()).isEqualTo(400);
    assertThat(boron.body()).contains("not in the conductivity model");
    HttpResponse<String> hot =
        post(CONDUCTIVITY, "{\"composition\": [], \"sampleTemperatureCel\": 150}");
    assertThat(hot.statusCode()).as(hot.body()).isEqualTo(422);
    HttpResponse<String> kind =
        post(INGRESS, "{\"composition\": [], \"coolingWater\": \"lake\", \"sodiumUgPerKg\": 1}");
    assertThat(kind.statusCode()).as(kind.body()).isEqualTo(400);
    HttpResponse<String> unknown =
        post(CONDUCTIVITY, "{\"composition\": [], \"temperatureC\": 40}");
    assertThat(unknown.statusCode()).as(unknown.body()).isEqualTo(400);
  }
}
