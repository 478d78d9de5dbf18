package org.kwanta.service.water;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpResponse;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.springframework.boot.test.web.server.LocalServerPort;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The water endpoint over HTTP. Chemistry values are checked in the model's tests; here, the
 * contract.
 */
@DatabaseTest
class WaterApiIT {

  private static final JsonMapper JSON = JsonMapper.builder().build();

  @LocalServerPort int port;
  Http http;

  @BeforeEach
  void client() {
    http = Http.admin(port);
  }

  @Test
  void saturationAt300CelMatchesCrcTabulation() {
    // CRC Handbook, "Ionization constant of water" (based on IAPWS R11-07), saturation row: pKw
    // 11.339 at 300 °C
    HttpResponse<String> r = http.get("/api/v1/water?temperatureCel=300");
    assertThat(r.statusCode()).isEqualTo(200);
    JsonNode body = JSON.readTree(r.body());
    assertThat(body.get("pKw").asDouble()).isBetween(11.3385, 11.3395);
    assertThat(body.get("neutralPh").asDouble()).isBetween(5.669, 5.670);
    assertThat(body.get("pressureSource").asString()).isEqualTo("SATURATION");
    assertThat(body.get("phase").asString()).isEqualTo("LIQUID_REGION_1");
    assertThat(body.get("formulations").get("pKw").asString()).isEqualTo("IAPWS R11-07");
  }

  @Test
  void pressureAndFormulationAreSelectable() {
    // CRC tabulation at 25 MPa: pKw 11.125 at 300 °C (R11-07)
    JsonNode at25MPa =
        JSON.readTree(http.get("/api/v1/water?temperatureCel=300&pressureMPa=25").body());
    assertThat(at25MPa.get("pKw").asDouble()).isBetween(11.1245, 11.1255);
    assertThat(at25MPa.get("pressureSource").asString()).isEqualTo("GIVEN");
    JsonNode r1124 =
        JSON.readTree(http.get("/api/v1/water?temperatureCel=300&ionization=R11-24").body());
    assertThat(r1124.get("formulations").get("pKw").asString()).isEqualTo("IAPWS R11-24");
  }

  @Test
  void roomTemperatureUsesTheAtmosphericFloor() {
    JsonNode body = JSON.readTree(http.get("/api/v1/water?temperatureCel=25").body());
    assertThat(body.get("pressureSource").asString()).isEqualTo("ATMOSPHERIC_FLOOR");
    assertThat(body.get("pressureMPa").asDouble()).isEqualTo(0.101325);
  }

  /** No saturation above the critical point: the release's own limit, 647.096 K. */
  @Test
  void saturationAboveTheCriticalPointIs422NamingTheLimit() {
    HttpResponse<String> r = http.get("/api/v1/water?temperatureCel=400");
    assertThat(r.statusCode()).isEqualTo(422);
    JsonNode body = JSON.readTree(r.body());
    assertThat(body.get("type").asString()).isEqualTo("urn:kwanta:problem:out-of-validity-range");
    assertThat(body.get("limit").get("unit").asString()).isEqualTo("K");
    assertThat(body.get("limit").get("max").asDouble()).isEqualTo(647.096);
  }

  /** Above 800 °C the limit is Kwanta's (IF97 region 5 not implemented) and R11-07's. */
  @Test
  void above800CelIs422SayingWhoseLimit() {
    HttpResponse<String> r = http.get("/api/v1/water?temperatureCel=900&pressureMPa=10");
    assertThat(r.statusCode()).isEqualTo(422);
    JsonNode body = JSON.readTree(r.body());
    assertThat(body.get("limit").get("max").asDouble()).isEqualTo(1073.15);
    assertThat(body.get("detail").asString()).contains("region 5 not implemented in Kwanta");
  }

  /**
   * The case, steam at 300 °C and 5 MPa: density and pKw with a notice, no neutral pH and
   * no Debye–Hückel values. Density against IAPWS-IF97 region 2 as computed by Debian python3-iapws
   * 1.5.3, IAPWS97(T=573.15, P=5).rho = 22.0522 kg/m3 (to the digits shown).
   */
  @Test
  void steamHasDensityAndPkwButNoLiquidPhScale() {
    JsonNode body =
        JSON.readTree(http.get("/api/v1/water?temperatureCel=300&pressureMPa=5").body());
    assertThat(body.get("phase").asString()).isEqualTo("VAPOUR_REGION_2");
    assertThat(body.get("densityKgPerM3").asDouble()).isBetween(22.05, 22.06);
    assertThat(body.get("pKw").isNumber()).isTrue();
    assertThat(body.get("neutralPh").isNull()).isTrue();
    assertThat(body.get("debyeHuckelAKgHalfPerMolHalf").isNull()).isTrue();
    assertThat(body.get("notices").get(0).asString()).contains("not a liquid pH");
  }

  /** Liquid at 360 °C and 20 MPa lies in IF97 region 3 and is now computed. */
  @Test
  void liquidAbove350CelIsRegion3() {
    HttpResponse<String> r = http.get("/api/v1/water?temperatureCel=360&pressureMPa=20");
    assertThat(r.statusCode()).isEqualTo(200);
    JsonNode body = JSON.readTree(r.body());
    assertThat(body.get("phase").asString()).isEqualTo("LIQUID_REGION_3");
    assertThat(body.get("formulations").get("density").asString()).endsWith("region 3");
    assertThat(body.get("debyeHuckelAKgHalfPerMolHalf").isNumber()).isTrue();
  }

  @Test
  void badParametersAre400() {
    assertThat(http.get("/api/v1/water").statusCode()).isEqualTo(400);
    assertThat(http.get("/api/v1/water?temperatureCel=abc").statusCode()).isEqualTo(400);
    assertThat(http.get("/api/v1/water?temperatureCel=50&ionization=X").statusCode())
        .isEqualTo(400);
    assertThat(http.get("/api/v1/water/table?fromCel=25&toCel=350&stepCel=0").statusCode())
        .isEqualTo(400);
  }

  @Test
  void tableAsJsonAndCsv() {
    HttpResponse<String> json = http.get("/api/v1/water/table?fromCel=25&toCel=350&stepCel=5");
    assertThat(json.statusCode()).isEqualTo(200);
    assertThat(JSON.readTree(json.body()).size()).isEqualTo(66);
    HttpResponse<String> csv =
        http.get("/api/v1/water/table?fromCel=25&toCel=350&stepCel=5", "Accept", "text/csv");
    assertThat(csv.statusCode()).isEqualTo(200);
    assertThat(csv.headers().firstValue("Content-Type"))
        .hasValueSatisfying(ct -> assertThat(ct).startsWith("text/csv"));
    String[] lines = csv.body().split("\r\n");
    assertThat(lines).hasSize(67);
    assertThat(lines[0]).startsWith("temperature_Cel,temperature_K,pressure_MPa");
  }
}
