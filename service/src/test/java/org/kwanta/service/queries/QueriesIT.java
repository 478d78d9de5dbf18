package org.kwanta.service.queries;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpResponse;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestInstance;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.springframework.boot.test.web.server.LocalServerPort;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** Series (raw, paged, bucketed, CSV), state and overview over stored readings and evaluations. */
@DatabaseTest
@TestInstance(TestInstance.Lifecycle.PER_CLASS)
class QueriesIT {

  private static final JsonMapper JSON = JsonMapper.builder().build();

  @LocalServerPort int port;
  Http http;
  String point;
  Instant start;

  @BeforeAll
  void data() {
    http = Http.admin(port);
    String tag = Long.toString(System.nanoTime(), 36).toUpperCase(Locale.ROOT);
    point = "Q" + tag;
    String plant =
        "{\"id\":\"q-"
            + tag.toLowerCase(Locale.ROOT)
            + "\",\"name\":\"Query test plant (invented)\",\"blocks\":[{\"id\":\"U1\",\"name\":\"u\"}],"
            + "\"samplePoints\":[{\"id\":\""
            + point
            + "\",\"block\":\"U1\",\"name\":\"p\",\"cycleLocation\":\"FEEDWATER\","
            + "\"treatmentRegime\":\"AVT(O)\",\"operatingTemperatureCel\":150}]}";
    assertThat(http.post("/api/v1/plants", "application/json", plant).statusCode()).isEqualTo(201);
    start = Instant.now().truncatedTo(ChronoUnit.DAYS).minus(1, ChronoUnit.DAYS);
    List<String> readings = new ArrayList<>();
    for (int i = 0; i < 120; i++) { // two hours at one-minute steps; value = minute index
      String t = start.plusSeconds(60L * i).toString();
      readings.add(
          String.format(
              Locale.ROOT,
              "{\"samplePoint\":\"%s\",\"parameter\":\"cation_conductivity\",\"time\":\"%s\","
                  + "\"value\":%s,\"unit\":\"uS/cm\"}",
              point,
              t,
              0.05 + i * 0.001));
      readings.add(
          String.format(
              Locale.ROOT,
              "{\"samplePoint\":\"%s\",\"parameter\":\"specific_conductivity\",\"time\":\"%s\","
                  + "\"value\":5.4,\"unit\":\"uS/cm\"}",
              point,
              t));
    }
    HttpResponse<String> r =
        http.post(
            "/api/v1/readings",
            "application/json",
            "{\"readings\":[" + String.join(",", readings) + "]}");
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
  }

  private String range(int fromMinute, int toMinute) {
    return "&from="
        + start.plusSeconds(60L * fromMinute)
        + "&to="
        + start.plusSeconds(60L * toMinute);
  }

  @Test
  void rawSeriesIsPagedWithACursor() {
    String base =
        "/api/v1/sample-points/" + point + "/series?parameter=cation_conductivity" + range(0, 120);
    JsonNode first = JSON.readTree(http.get(base + "&limit=50").body());
    assertThat(first.get("unit").asString()).isEqualTo("uS/cm");
    assertThat(first.get("points")).hasSize(50);
    String next = first.get("next").asString();
    JsonNode second = JSON.readTree(http.get(base + "&limit=100&after=" + next).body());
    assertThat(second.get("points")).hasSize(70);
    assertThat(second.get("next").isNull()).isTrue();
    assertThat(second.get("points").get(0).get("value").asDouble())
        .isCloseTo(0.1, org.assertj.core.data.Offset.offset(1e-12));
  }

  @Test
  void bucketsCarryMinMeanMaxLastAndCount() {
    JsonNode r =
        JSON.readTree(
            http.get(
                    "/api/v1/sample-points/"
                        + point
                        + "/series?parameter=cation_conductivity&bucket=PT10M"
                        + range(0, 120))
                .body());
    assertThat(r.get("bucketSeconds").asLong()).isEqualTo(600);
    JsonNode buckets = r.get("buckets");
    assertThat(buckets).hasSize(12);
    JsonNode b0 = buckets.get(0);
    assertThat(b0.get("count").asLong()).isEqualTo(10);
    assertThat(b0.get("min").asDouble())
        .isCloseTo(0.050, org.assertj.core.data.Offset.offset(1e-12));
    assertThat(b0.get("max").asDouble())
        .isCloseTo(0.059, org.assertj.core.data.Offset.offset(1e-12));
    assertThat(b0.get("last").asDouble())
        .isCloseTo(0.059, org.assertj.core.data.Offset.offset(1e-12));
    assertThat(b0.get("mean").asDouble())
        .isCloseTo(0.0545, org.assertj.core.data.Offset.offset(1e-12));
  }

  @Test
  void maxPointsChoosesABucket() {
    JsonNode r =
        JSON.readTree(
            http.get(
                    "/api/v1/sample-points/"
                        + point
                        + "/series?parameter=cation_conductivity&maxPoints=7"
                        + range(0, 120))
                .body());
    assertThat(r.get("buckets").size()).isLessThanOrEqualTo(7);
  }

  @Test
  void derivedSeriesAndCsvExport() {
    HttpResponse<String> csv =
        http.get(
            "/api/v1/sample-points/"
                + point
                + "/series?parameter=cation_conductivity_25&format=csv"
                + range(0, 120));
    assertThat(csv.statusCode()).isEqualTo(200);
    assertThat(csv.headers().firstValue("Content-Type").orElseThrow()).startsWith("text/csv");
    String[] lines = csv.body().split("\r\n");
    assertThat(lines[0]).isEqualTo("time,cation_conductivity_25_uS_per_cm,quality");
    assertThat(lines).hasSize(121);
  }

  @Test
  void stateAndOverview() {
    JsonNode state = JSON.readTree(http.get("/api/v1/sample-points/" + point + "/state").body());
    assertThat(state.get("readings")).hasSize(2);
    assertThat(state.get("readings").get(0).get("ageSeconds").asDouble()).isPositive();
    assertThat(http.get("/api/v1/plants/brackenmoor/overview").statusCode()).isEqualTo(200);
  }

  @Test
  void badQueriesAreProblems() {
    String base = "/api/v1/sample-points/" + point + "/series?parameter=";
    assertThat(http.get(base + "colour" + range(0, 1)).statusCode()).isEqualTo(400);
    assertThat(http.get(base + "ph&from=yesterday&to=today").statusCode()).isEqualTo(400);
    assertThat(http.get(base + "ph" + range(5, 1)).statusCode()).isEqualTo(400);
    assertThat(http.get(base + "ph&bucket=PT0S" + range(0, 1)).statusCode()).isEqualTo(400);
    assertThat(http.get(base + "ph&limit=0" + range(0, 1)).statusCode()).isEqualTo(400);
    assertThat(
            http.get("/api/v1/sample-points/NOPE/series?parameter=ph" + range(0, 1)).statusCode())
        .isEqualTo(404);
  }
}
