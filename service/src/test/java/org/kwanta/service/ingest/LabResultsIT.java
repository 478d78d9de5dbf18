package org.kwanta.service.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.net.http.HttpResponse;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.List;
import java.util.Locale;
import java.util.UUID;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.web.server.LocalServerPort;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Grab and lab results (issue 14 item 1) through the HTTP API: a ug/L result stored in ug/kg with
 * the conversion shown, a censored result kept censored, a grab result never the current online
 * value nor a source of the reading-age gauge behind the stale-data alert. Fictional plant.
 */
@DatabaseTest
class LabResultsIT {

  private static final JsonMapper JSON = JsonMapper.builder().build();

  /**
   * Density of water at 25 °C and 101.325 kPa, kg/m³: Debian python3-iapws 1.5.2,
   * iapws.IAPWS97(T=298.15, P=0.101325).rho = 997.0480319717386 (IAPWS-IF97 region 1).
   */
  static final double RHO_25_PYTHON_IAPWS = 997.0480319717386;

  /** The same at 20 °C: iapws.IAPWS97(T=293.15, P=0.101325).rho (python3-iapws 1.5.2). */
  static final double RHO_20_PYTHON_IAPWS = 998.2060924679477;

  @LocalServerPort int port;
  @Autowired ReadingHistory history;
  Http http;
  String point;

  @BeforeEach
  void plant() {
    http = Http.admin(port);
    String tag = UUID.randomUUID().toString().substring(0, 8).toLowerCase(Locale.ROOT);
    point = "L" + tag + "-ECO";
    String body =
        ("{\"id\":\"lab-%s\",\"name\":\"Lab test (fictional)\","
                + "\"blocks\":[{\"id\":\"U1\",\"name\":\"Unit 1\"}],\"samplePoints\":[{\"id\":\"%s\","
                + "\"block\":\"U1\",\"name\":\"Economiser inlet\",\"cycleLocation\":\"FEEDWATER\","
                + "\"treatmentRegime\":\"AVT(O)\",\"operatingTemperatureCel\":40,"
                + "\"operatingPressureMPa\":1.5}]}")
            .formatted(tag, point);
    HttpResponse<String> r = http.post("/api/v1/plants", "application/json", body);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(201);
  }

  private JsonNode post(String contentType, String body) {
    HttpResponse<String> r = http.post("/api/v1/lab-results", contentType, body);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    return JSON.readTree(r.body());
  }

  private JsonNode list(String parameter) {
    HttpResponse<String> r =
        http.get("/api/v1/sample-points/" + point + "/lab-results?parameter=" + parameter);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    return JSON.readTree(r.body());
  }

  @Test
  void aResultInMicrogramsPerLitreIsStoredInMicrogramsPerKilogramWithTheConversionShown() {
    Instant t = Instant.now().truncatedTo(ChronoUnit.MINUTES).minusSeconds(3600);
    JsonNode out =
        post(
            "application/json",
            ("{\"readings\":[{\"samplePoint\":\"%s\",\"parameter\":\"iron\",\"time\":\"%s\","
                    + "\"value\":12.3,\"unit\":\"ug/L\",\"sampleId\":\"S-1\","
                    + "\"labMethod\":\"ICP-MS\"},"
                    + "{\"samplePoint\":\"%s\",\"parameter\":\"silica\",\"time\":\"%s\","
                    + "\"value\":0.05,\"unit\":\"mg/L\",\"densityTemperatureCel\":20}]}")
                .formatted(point, t, point, t));
    assertThat(out.get("inserted").asInt()).isEqualTo(2);
    JsonNode c = out.get("conversions").get(0);
    assertThat(c.get("fromUnit").asString()).isEqualTo("ug/L");
    assertThat(c.get("toUnit").asString()).isEqualTo("ug/kg");
    assertThat(c.get("temperatureCel").asDouble()).isEqualTo(25.0);
    assertThat(c.get("densityKgPerM3").asDouble()).isCloseTo(RHO_25_PYTHON_IAPWS, within(1e-3));
    assertThat(c.get("factor").asDouble()).isCloseTo(1000 / RHO_25_PYTHON_IAPWS, within(1e-9));
    assertThat(c.get("densitySource").asString()).contains("IAPWS-IF97");
    JsonNode silica = out.get("conversions").get(1);
    assertThat(silica.get("factor").asDouble()).isCloseTo(1e6 / RHO_20_PYTHON_IAPWS, within(1e-6));

    JsonNode iron = list("iron").get(0);
    assertThat(iron.get("unit").asString()).isEqualTo("ug/kg");
    assertThat(iron.get("value").asDouble())
        .isCloseTo(12.3 * 1000 / RHO_25_PYTHON_IAPWS, within(1e-9));
    assertThat(iron.get("sentValue").asDouble()).isEqualTo(12.3);
    assertThat(iron.get("sentUnit").asString()).isEqualTo("ug/L");
    assertThat(iron.get("source").asString()).isEqualTo("lab");
    assertThat(iron.get("sampleId").asString()).isEqualTo("S-1");
    assertThat(iron.get("labMethod").asString()).isEqualTo("ICP-MS");
    assertThat(iron.get("enteredBy").asString()).isNotBlank();
    assertThat(list("silica").get(0).get("value").asDouble())
        .isCloseTo(0.05 * 1e6 / RHO_20_PYTHON_IAPWS, within(1e-6));

    // a correction keeps the value before in the audit log
    JsonNode corrected =
        post(
            "application/json",
            ("{\"readings\":[{\"samplePoint\":\"%s\",\"parameter\":\"iron\",\"time\":\"%s\","
                    + "\"value\":12.0,\"unit\":\"ug/kg\",\"sampleId\":\"S-1\"}]}")
                .formatted(point, t));
    assertThat(corrected.get("corrected").asInt()).isEqualTo(1);
    JsonNode audit =
        JSON.readTree(
            http.get("/api/v1/audit?entity=lab-result&entityId=" + point + "/iron/" + t + "/lab")
                .body());
    List<String> actions = new java.util.ArrayList<>();
    audit.forEach(e -> actions.add(e.get("action").asString()));
    assertThat(actions).containsExactly("lab-result.enter", "lab-result.correct");
    assertThat(audit.get(1).toString()).contains("12.3").contains("12.0");
  }

  @Test
  void aCensoredResultStaysCensoredFromJsonAndFromCsvAndInTheSeries() {
    Instant t = Instant.now().truncatedTo(ChronoUnit.MINUTES).minusSeconds(7200);
    post(
        "application/json",
        ("{\"readings\":[{\"samplePoint\":\"%s\",\"parameter\":\"copper\",\"time\":\"%s\","
                + "\"value\":2,\"unit\":\"ug/kg\",\"censored\":\"below\"}]}")
            .formatted(point, t));
    post(
        "text/csv",
        "sample_point,parameter,time,value,unit,source,sample_id\n"
            + point
            + ",chloride,"
            + t
            + ",<0.5,ug/kg,grab,G-7\n");
    JsonNode copper = list("copper").get(0);
    assertThat(copper.get("censored").asString()).isEqualTo("below");
    assertThat(copper.get("value").asDouble()).isEqualTo(2.0);
    assertThat(copper.get("display").asString()).isEqualTo("< 2.0 ug/kg");
    JsonNode series =
        JSON.readTree(
            http.get(
                    "/api/v1/sample-points/"
                        + point
                        + "/series?parameter=copper&from="
                        + t.minusSeconds(3600)
                        + "&to="
                        + t.plusSeconds(3600))
                .body());
    assertThat(series.get("points")).isEmpty();
    assertThat(series.get("labResults").get(0).get("censored").asString()).isEqualTo("below");
    assertThat(series.get("labResults").get(0).get("value").asDouble()).isEqualTo(2.0);
    JsonNode chloride = list("chloride").get(0);
    assertThat(chloride.get("censored").asString()).isEqualTo("below");
    assertThat(chloride.get("value").asDouble()).isEqualTo(0.5);
    assertThat(chloride.get("source").asString()).isEqualTo("grab");
  }

  @Test
  void aGrabResultIsNeverTheCurrentOnlineValueNorAReadingForTheStaleDataAlarm() {
    Instant online = Instant.now().truncatedTo(ChronoUnit.SECONDS).minusSeconds(1800);
    HttpResponse<String> r =
        http.post(
            "/api/v1/readings",
            "application/json",
            ("{\"readings\":[{\"samplePoint\":\"%s\",\"parameter\":\"sodium\",\"time\":\"%s\","
                    + "\"value\":1.5,\"unit\":\"ug/kg\"}]}")
                .formatted(point, online));
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    Instant grab = online.plusSeconds(1500);
    post(
        "application/json",
        ("{\"readings\":[{\"samplePoint\":\"%s\",\"parameter\":\"sodium\",\"time\":\"%s\","
                + "\"value\":3.0,\"unit\":\"ug/kg\",\"source\":\"grab\"},"
                + "{\"samplePoint\":\"%s\",\"parameter\":\"ammonia\",\"time\":\"%s\","
                + "\"value\":500,\"unit\":\"ug/kg\",\"source\":\"grab\"}]}")
            .formatted(point, grab, point, grab));

    JsonNode state = JSON.readTree(http.get("/api/v1/sample-points/" + point + "/state").body());
    String text = state.toString();
    assertThat(text).doesNotContain("ammonia");
    assertThat(text).contains("1.5").doesNotContain("\"value\":3.0");
    // the reading-age gauge behind KwantaStaleData reads ReadingHistory.latestSince: online only
    assertThat(history.latestSince(online.minusSeconds(60)))
        .filteredOn(p -> p.samplePointId().equals(point))
        .extracting(ReadingHistory.PointReading::parameter, ReadingHistory.PointReading::time)
        .containsExactly(org.assertj.core.groups.Tuple.tuple("sodium", online));
  }

  @Test
  void theReadingsEndpointRefusesAGrabResultAndPointsToTheLabEndpoint() {
    HttpResponse<String> r =
        http.post(
            "/api/v1/readings",
            "application/json",
            ("{\"readings\":[{\"samplePoint\":\"%s\",\"parameter\":\"sodium\",\"time\":\"%s\","
                    + "\"value\":3.0,\"unit\":\"ug/kg\",\"source\":\"grab\"}]}")
                .formatted(point, Instant.now().minusSeconds(60)));
    assertThat(r.statusCode()).isEqualTo(400);
    assertThat(r.body()).contains("/api/v1/lab-results");
  }

  @Test
  void aLabResultWithAQualityOrAnUncompensatedConductivityIsRefused() {
    HttpResponse<String> r =
        http.post(
            "/api/v1/lab-results",
            "application/json",
            ("{\"readings\":[{\"samplePoint\":\"%s\",\"parameter\":\"sodium\",\"time\":\"%s\","
                    + "\"value\":3.0,\"unit\":\"ug/kg\",\"quality\":\"bad\"},"
                    + "{\"samplePoint\":\"%s\",\"parameter\":\"specific_conductivity\","
                    + "\"time\":\"%s\",\"value\":5.0,\"unit\":\"uS/cm\","
                    + "\"sampleTemperatureCel\":30}]}")
                .formatted(
                    point, Instant.now().minusSeconds(60), point, Instant.now().minusSeconds(60)));
    assertThat(r.statusCode()).isEqualTo(400);
    assertThat(r.body()).contains("carry no quality").contains("at 25 °C");
  }
}
