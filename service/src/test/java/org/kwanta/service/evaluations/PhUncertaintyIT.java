package org.kwanta.service.evaluations;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.net.http.HttpResponse;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.UUID;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.springframework.boot.test.web.server.LocalServerPort;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The itemised uncertainty of pH at temperature (issue 16 item 4) end to end: the speciation API
 * and a stored evaluation show the same four labelled parts under the same names, and the stored
 * low/high are their combination, no longer labelled as the constant-set spread. The plant is
 * invented; the readings are the engine's own solution model for 1.5 mg/kg ammonia, 3 µg/kg
 * chloride and 10 µg/kg carbon dioxide at 25 °C (as in LevelRulesIT and SteamPointIT).
 */
@DatabaseTest
class PhUncertaintyIT {

  private static final JsonMapper JSON = JsonMapper.builder().build();

  private static final List<String> PARTS =
      List.of(
          "instrumentTolerances", "constantSetSpread", "estimatedConstants", "operatingConditions");

  @LocalServerPort int port;
  Http http;
  String tag;

  @BeforeEach
  void setUp() {
    http = Http.admin(port);
    tag = UUID.randomUUID().toString().substring(0, 8).toLowerCase(Locale.ROOT);
  }

  private static void hasTheFourLabelledParts(JsonNode u) {
    for (int i = 0; i < PARTS.size(); i++) {
      JsonNode part = u.get(PARTS.get(i));
      assertThat(part).as(PARTS.get(i)).isNotNull();
      assertThat(part.get("label").asString()).startsWith("(" + (char) ('a' + i) + ")");
      assertThat(part.get("belowPh").asDouble()).isGreaterThanOrEqualTo(0);
      assertThat(part.get("abovePh").asDouble()).isGreaterThanOrEqualTo(0);
      assertThat(part.get("basis").asString()).isNotBlank();
    }
    assertThat(u.get("rule").asString()).contains("root-sum-square");
  }

  /**
   * Cyclohexylamine at 300 °C: one estimated fit, no alternative set, so (b) is zero and (c) is
   * not: u(log10 K) = 0.1 + 0.3/275·275 = 0.4 (a confidence judgement, water-and-equilibria.md
   * §10.1; no published source) times |dpH/dlog10 K| ≈ 0.45 gives ≈ 0.18 (PhUncertaintyTest has the
   * hand calculation); never a band of width zero.
   */
  @Test
  void speciationApiShowsTheParts() {
    HttpResponse<String> r =
        http.post(
            "/api/v1/chemistry/speciation",
            "application/json",
            "{\"composition\": [{\"component\": \"cyclohexylamine\", \"amount\": 5, \"unit\":"
                + " \"mg/kg\"}], \"temperatureCel\": 300}");
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    JsonNode result = JSON.readTree(r.body()).get("results").get(0);
    JsonNode u = result.get("uncertainty");
    hasTheFourLabelledParts(u);
    assertThat(u.get("ph").asDouble())
        .isEqualTo(result.get("phAtTemperature").get("ph").asDouble());
    assertThat(u.get("instrumentTolerances").get("belowPh").asDouble()).isZero();
    assertThat(u.get("constantSetSpread").get("belowPh").asDouble()).isZero();
    JsonNode c = u.get("estimatedConstants");
    assertThat(c.get("belowPh").asDouble()).isBetween(0.15, 0.19);
    assertThat(c.get("contributions").get(0).get("source").asString())
        .isEqualTo("cyclohexylammonium");
    assertThat(c.get("contributions").get(0).get("detail").asString()).contains("± 0.400");
    assertThat(u.get("low").asDouble())
        .isCloseTo(u.get("ph").asDouble() - c.get("belowPh").asDouble(), within(1e-12));
    assertThat(u.get("high").asDouble()).isGreaterThan(u.get("ph").asDouble() + 0.15);
  }

  /**
   * A feedwater point at 155 °C / 15 MPa: the stored evaluation carries the same object; (a), (b)
   * (the ammonium fits differ) and (d) (±2 K, ±5 %) apply, and low/high are the parts' root sum of
   * squares on each side.
   */
  @Test
  void storedEvaluationShowsThePartsUnderTheSameNames() {
    String body =
        ("{\"id\":\"unc-%s\",\"name\":\"Uncertainty test (fictional)\","
                + "\"blocks\":[{\"id\":\"U1\",\"name\":\"Unit 1\"}],\"samplePoints\":[{\"id\":\"F%s\","
                + "\"block\":\"U1\",\"name\":\"economizer inlet\",\"cycleLocation\":\"FEEDWATER\","
                + "\"treatmentRegime\":\"AVT(O)\",\"operatingTemperatureCel\":155,"
                + "\"operatingPressureMPa\":15}]}")
            .formatted(tag, tag);
    HttpResponse<String> declared = http.post("/api/v1/plants", "application/json", body);
    assertThat(declared.statusCode()).as(declared.body()).isEqualTo(201);
    String point = "F" + tag;
    Instant t0 = Instant.now().truncatedTo(ChronoUnit.MINUTES).minus(20, ChronoUnit.MINUTES);
    List<String> readings = new ArrayList<>();
    for (int m = 0; m < 10; m++) {
      Instant t = t0.plusSeconds(60L * m);
      readings.add(reading(point, "specific_conductivity", t, 8.55));
      readings.add(reading(point, "cation_conductivity", t, 0.113));
      readings.add(reading(point, "degassed_cation_conductivity", t, 0.0725));
    }
    HttpResponse<String> r =
        http.post(
            "/api/v1/readings",
            "application/json",
            "{\"readings\":[" + String.join(",", readings) + "]}");
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    HttpResponse<String> state = http.get("/api/v1/sample-points/" + point + "/state");
    assertThat(state.body()).doesNotContain("NaN");
    JsonNode t =
        JSON.readTree(state.body()).get("evaluation").get("evaluation").get("phAtTemperature");
    JsonNode u = t.get("uncertainty");
    hasTheFourLabelledParts(u);
    assertThat(t.get("formulation").asString())
        .contains("(a) instrument tolerances")
        .doesNotContain("band over the alternative constant sets");
    assertThat(u.get("instrumentTolerances").get("belowPh").asDouble()).isGreaterThan(0);
    assertThat(u.get("constantSetSpread").get("lowConstantSet").asString()).isNotBlank();
    assertThat(u.get("operatingConditions").get("contributions")).hasSize(2);
    double below = 0;
    double above = 0;
    for (String p : PARTS) {
      below += Math.pow(u.get(p).get("belowPh").asDouble(), 2);
      above += Math.pow(u.get(p).get("abovePh").asDouble(), 2);
    }
    double ph = t.get("ph").asDouble();
    assertThat(t.get("low").asDouble()).isCloseTo(ph - Math.sqrt(below), within(1e-5));
    assertThat(t.get("high").asDouble()).isCloseTo(ph + Math.sqrt(above), within(1e-5));
    assertThat(u.get("low").asDouble()).isEqualTo(t.get("low").asDouble());
  }

  private static String reading(String point, String parameter, Instant time, double value) {
    return String.format(
        Locale.ROOT,
        "{\"samplePoint\":\"%s\",\"parameter\":\"%s\",\"time\":\"%s\",\"value\":%s,"
            + "\"unit\":\"uS/cm\",\"compensated\":true}",
        point,
        parameter,
        time,
        value);
  }
}
