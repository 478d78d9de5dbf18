package org.kwanta.service.instruments;

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
 * Online vs grab (issue 14 item 2): a suspect pH electrode (its last buffer calibration FAILED) is
 * cleared by a grab within tolerance and confirmed by one outside, both in the instrument's
 * history; the comparisons over time; the report's section, with a censored grab kept censored.
 *
 * <p>Values invented for the test (fictional plant). Tolerance pH ±0.2 and sodium ±max(0.5 µg/kg,
 * 20 %): common practice, no source (the service's {@link GrabComparisons#TOLERANCES}).
 */
@DatabaseTest
class GrabVsOnlineIT {

  private static final JsonMapper JSON = JsonMapper.builder().build();

  @LocalServerPort int port;
  Http http;
  String plant;
  String point;

  @BeforeEach
  void plant() {
    http = Http.admin(port);
    String tag = UUID.randomUUID().toString().substring(0, 8).toLowerCase(Locale.ROOT);
    plant = "grab-" + tag;
    point = "G" + tag + "-CPD";
    String body =
        ("{\"id\":\"%s\",\"name\":\"Grab test (fictional)\","
                + "\"blocks\":[{\"id\":\"U1\",\"name\":\"Unit 1\"}],\"samplePoints\":[{\"id\":\"%s\","
                + "\"block\":\"U1\",\"name\":\"Condensate\",\"cycleLocation\":\"CONDENSATE\","
                + "\"treatmentRegime\":\"AVT(O)\",\"operatingTemperatureCel\":40,"
                + "\"operatingPressureMPa\":1.5}]}")
            .formatted(plant, point);
    HttpResponse<String> r = http.post("/api/v1/plants", "application/json", body);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(201);
  }

  private void online(String parameter, String unit, Instant from, int minutes, double value) {
    List<String> rows = new ArrayList<>();
    for (int m = 0; m < minutes; m += 5) {
      rows.add(
          String.format(
              Locale.ROOT,
              "{\"samplePoint\":\"%s\",\"parameter\":\"%s\",\"time\":\"%s\",\"value\":%s,"
                  + "\"unit\":\"%s\"}",
              point,
              parameter,
              from.plus(m, ChronoUnit.MINUTES),
              value,
              unit));
    }
    HttpResponse<String> r =
        http.post(
            "/api/v1/readings",
            "application/json",
            "{\"readings\":[" + String.join(",", rows) + "]}");
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
  }

  private void grab(String json) {
    HttpResponse<String> r =
        http.post("/api/v1/lab-results", "application/json", "{\"readings\":[" + json + "]}");
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
  }

  private void failedCalibration(Instant at) {
    HttpResponse<String> r =
        http.post(
            "/api/v1/sample-points/" + point + "/instrument-checks",
            "application/json",
            ("{\"parameter\":\"ph\",\"kind\":\"BUFFER_CALIBRATION\",\"performedAt\":\"%s\","
                    + "\"outcome\":\"FAILED\",\"note\":\"slope low\"}")
                .formatted(at));
    assertThat(r.statusCode()).as(r.body()).isEqualTo(201);
  }

  @Test
  void aGrabWithinToleranceClearsASuspectPhElectrodeAndOneOutsideConfirmsIt() {
    Instant t0 = Instant.now().truncatedTo(ChronoUnit.HOURS).minus(6, ChronoUnit.HOURS);
    online("ph", "[pH]", t0, 240, 9.40);
    failedCalibration(t0.plus(10, ChronoUnit.MINUTES));
    // within: |9.40 - 9.30| = 0.10 <= 0.2
    grab(
        ("{\"samplePoint\":\"%s\",\"parameter\":\"ph\",\"time\":\"%s\",\"value\":9.30,"
                + "\"unit\":\"[pH]\",\"source\":\"grab\",\"sampleId\":\"G-1\"}")
            .formatted(point, t0.plus(60, ChronoUnit.MINUTES)));
    failedCalibration(t0.plus(90, ChronoUnit.MINUTES));
    // outside: |9.40 - 9.05| = 0.35 > 0.2
    grab(
        ("{\"samplePoint\":\"%s\",\"parameter\":\"ph\",\"time\":\"%s\",\"value\":9.05,"
                + "\"unit\":\"[pH]\",\"source\":\"grab\",\"sampleId\":\"G-2\"}")
            .formatted(point, t0.plus(120, ChronoUnit.MINUTES)));

    JsonNode history =
        JSON.readTree(
            http.get("/api/v1/sample-points/" + point + "/instrument-checks?parameter=ph").body());
    List<String> log = new ArrayList<>();
    history.forEach(c -> log.add(c.get("kind").asString() + " " + c.get("outcome").asString()));
    assertThat(log)
        .containsExactly(
            "BUFFER_CALIBRATION FAILED",
            "GRAB_COMPARISON PASSED",
            "BUFFER_CALIBRATION FAILED",
            "GRAB_COMPARISON FAILED");
    assertThat(history.get(1).get("note").asString())
        .startsWith("grab within tolerance: clears the doubt")
        .contains("G-1");
    assertThat(history.get(3).get("note").asString())
        .startsWith("grab outside tolerance: confirms the doubt");
    assertThat(history.get(1).get("results").toString()).contains("common practice, no source");

    JsonNode comparisons =
        JSON.readTree(
            http.get("/api/v1/sample-points/" + point + "/grab-comparisons?parameter=ph").body());
    assertThat(comparisons).hasSize(2);
    assertThat(comparisons.get(0).get("verdict").asString()).isEqualTo("CLEARED");
    assertThat(comparisons.get(0).get("deviation").asDouble()).isCloseTo(0.10, within(1e-9));
    assertThat(comparisons.get(0).get("tolerance").asDouble()).isEqualTo(0.2);
    assertThat(comparisons.get(0).get("toleranceSource").asString())
        .isEqualTo("common practice, no source");
    assertThat(comparisons.get(1).get("verdict").asString()).isEqualTo("CONFIRMED");
    assertThat(comparisons.get(1).get("withinTolerance").asBoolean()).isFalse();

    // the checks schedule ignores grab comparisons: the failed calibration is still the last
    JsonNode due =
        JSON.readTree(http.get("/api/v1/plants/" + plant + "/instrument-checks/due").body());
    assertThat(due.toString()).doesNotContain("GRAB_COMPARISON");
  }

  @Test
  void theReportListsTheComparisonsAndKeepsACensoredGrabCensored() {
    Instant t0 = Instant.now().truncatedTo(ChronoUnit.DAYS).minus(1, ChronoUnit.DAYS);
    online("sodium", "ug/kg", t0, 120, 0.3);
    grab(
        ("{\"samplePoint\":\"%s\",\"parameter\":\"sodium\",\"time\":\"%s\",\"value\":0.5,"
                + "\"unit\":\"ug/kg\",\"censored\":\"below\",\"source\":\"lab\"}")
            .formatted(point, t0.plus(30, ChronoUnit.MINUTES)));
    String month = t0.toString().substring(0, 7);
    HttpResponse<String> r =
        http.get("/api/v1/plants/" + plant + "/reports/monthly?month=" + month);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    JsonNode section = JSON.readTree(r.body()).get("grabVsOnline");
    assertThat(section.get("available").asBoolean()).isTrue();
    assertThat(section.get("toleranceSource").asString()).isEqualTo("common practice, no source");
    JsonNode row = section.get("comparisons").get(0);
    assertThat(row.get("censored").asString()).isEqualTo("below");
    assertThat(row.get("grab").asString()).isEqualTo("< 0.5");
    assertThat(row.get("onlineValue").asDouble()).isEqualTo(0.3);
    // below the limit 0.5 with online 0.3: agrees (online <= limit + tolerance)
    assertThat(row.get("withinTolerance").asBoolean()).isTrue();
    assertThat(section.get("instruments").get(0).get("comparisons").asInt()).isEqualTo(1);
    String csv =
        http.get("/api/v1/plants/" + plant + "/reports/monthly?month=" + month + "&format=csv")
            .body();
    assertThat(csv)
        .contains(
            "grab_vs_online,"
                + point
                + ",sodium,grab "
                + t0.plus(30, ChronoUnit.MINUTES)
                + ",< 0.5,ug/kg");
  }
}
