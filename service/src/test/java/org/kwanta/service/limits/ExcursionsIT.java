package org.kwanta.service.limits;

import static org.assertj.core.api.Assertions.assertThat;

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
 * The Brackenmoor condenser-leak story end to end: readings in, excursion out (JSON and CSV),
 * acknowledgement, per-point override. The series is invented (demo only); the default thresholds
 * it crosses are the recalled IAPWS values (0.2 / 0.35 / 0.65 µS/cm, from memory — verify).
 */
@DatabaseTest
class ExcursionsIT {

  private static final JsonMapper JSON = JsonMapper.builder().build();

  @LocalServerPort int port;
  Http http;
  String point;
  Instant day;

  @BeforeEach
  void plant() {
    http = Http.admin(port);
    day = Instant.now().truncatedTo(ChronoUnit.DAYS).minus(1, ChronoUnit.DAYS);
    String tag = UUID.randomUUID().toString().substring(0, 8).toLowerCase(Locale.ROOT);
    point = "L" + tag + "-U2-CPD";
    String body =
        ("{\"id\":\"leak-%s\",\"name\":\"Condenser leak test (fictional)\","
                + "\"blocks\":[{\"id\":\"U2\",\"name\":\"Unit 2\"}],\"samplePoints\":[{\"id\":\"%s\","
                + "\"block\":\"U2\",\"name\":\"Unit 2 condensate pump discharge\","
                + "\"cycleLocation\":\"CONDENSATE\",\"treatmentRegime\":\"AVT(O)\","
                + "\"operatingTemperatureCel\":40,\"operatingPressureMPa\":1.5}]}")
            .formatted(tag, point);
    assertThat(http.post("/api/v1/plants", "application/json", body).statusCode()).isEqualTo(201);
  }

  /** The invented series of the model's ExcursionsTest: see its comments for the arithmetic. */
  static double condenserLeak(int minute) {
    if (minute < 360) {
      return 0.08;
    }
    if (minute < 540) {
      return 0.08 + 0.87 * (minute - 360) / 180.0;
    }
    if (minute < 570) {
      return 0.95;
    }
    if (minute < 810) {
      return 0.95 - 0.87 * (minute - 570) / 240.0;
    }
    return 0.08;
  }

  private void ingestLeak() {
    List<String> readings = new ArrayList<>();
    for (int m = 0; m <= 1080; m++) {
      double cace = condenserLeak(m);
      String t = day.plusSeconds(60L * m).toString();
      readings.add(reading("cation_conductivity", t, cace, "uS/cm"));
      // Brackish-water ingress: sodium rises with cation conductivity (invented proportion).
      readings.add(reading("sodium", t, 0.5 + 8 * (cace - 0.08), "ug/kg"));
    }
    HttpResponse<String> r =
        http.post(
            "/api/v1/readings",
            "application/json",
            "{\"readings\":[" + String.join(",", readings) + "]}");
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
  }

  private String reading(String parameter, String time, double value, String unit) {
    return String.format(
        Locale.ROOT,
        "{\"samplePoint\":\"%s\",\"parameter\":\"%s\",\"time\":\"%s\",\"value\":%s,\"unit\":\"%s\"}",
        point,
        parameter,
        time,
        value,
        unit);
  }

  private String window() {
    return "&from=" + day + "&to=" + day.plus(1, ChronoUnit.DAYS);
  }

  private JsonNode excursions() {
    HttpResponse<String> r =
        http.get(
            "/api/v1/excursions?samplePoint="
                + point
                + "&parameter=cation_conductivity"
                + window());
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    return JSON.readTree(r.body());
  }

  @Test
  void condenserLeakGivesOneExcursionWithStartPeakAndDuration() {
    ingestLeak();
    JsonNode list = excursions();
    assertThat(list).hasSize(1);
    JsonNode e = list.get(0);
    assertThat(Instant.parse(e.get("start").asString())).isEqualTo(day.plusSeconds(60L * 385));
    assertThat(Instant.parse(e.get("end").asString())).isEqualTo(day.plusSeconds(60L * 780));
    assertThat(e.get("peakValue").asDouble()).isEqualTo(0.95);
    assertThat(Instant.parse(e.get("peakTime").asString())).isEqualTo(day.plusSeconds(60L * 540));
    assertThat(e.get("highestLevel").asString()).isEqualTo("AL3");
    assertThat(e.get("durationSeconds").asLong()).isEqualTo(6 * 3600 + 35 * 60);
    assertThat(e.get("allowanceSeconds").asLong()).isEqualTo(4 * 3600);
    assertThat(e.get("limitsOrigin").asString()).isEqualTo("DEFAULT");
    assertThat(e.get("valueUnit").asString()).isEqualTo("uS/cm");
  }

  @Test
  void excursionsExportAsCsv() {
    ingestLeak();
    HttpResponse<String> r =
        http.get("/api/v1/excursions?format=csv&samplePoint=" + point + window());
    assertThat(r.statusCode()).isEqualTo(200);
    assertThat(r.headers().firstValue("Content-Type").orElseThrow()).startsWith("text/csv");
    String[] lines = r.body().split("\r\n");
    assertThat(lines[0]).startsWith("plant,block,sample_point,parameter,value_unit");
    // The shipped defaults (version 4) give a condensate point action levels for cation
    // conductivity and for sodium, so the leak shows in both, one row each, sorted by parameter.
    assertThat(lines).hasSize(3);
    assertThat(lines[1]).contains(point).contains("cation_conductivity").contains(",AL3,");
    assertThat(lines[2]).contains(point).contains("sodium").contains(",AL2,");
  }

  @Test
  void aChemistAcknowledgesAnExcursionWithANote() {
    ingestLeak();
    String start = excursions().get(0).get("start").asString();
    String ack =
        "{\"samplePoint\":\"%s\",\"parameter\":\"cation_conductivity\",\"start\":\"%s\",\"note\":\"Tube leak in condenser half B; half isolated 09:30.\"}"
            .formatted(point, start);
    // Who acknowledged is the key of the request: a "by" in the body is refused, not ignored.
    HttpResponse<String> withBy =
        http.post(
            "/api/v1/excursions/acknowledgements",
            "application/json",
            ack.replace("\"note\":", "\"by\":\"Chemist T1 (invented)\",\"note\":"));
    assertThat(withBy.statusCode()).as(withBy.body()).isEqualTo(400);
    assertThat(withBy.body()).contains("by");
    assertThat(excursions().get(0).get("acknowledgements")).isEmpty();
    HttpResponse<String> r =
        http.post("/api/v1/excursions/acknowledgements", "application/json", ack);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(201);
    JsonNode e = excursions().get(0);
    assertThat(e.get("acknowledgedByKeyId").asString()).isEqualTo("testadmin");
    assertThat(e.toString()).doesNotContain("Chemist T1");
    assertThat(e.get("acknowledgementNote").asString()).contains("half isolated");

    String wrong = ack.replace(start, day.toString());
    HttpResponse<String> missing =
        http.post("/api/v1/excursions/acknowledgements", "application/json", wrong);
    assertThat(missing.statusCode()).isEqualTo(404);
    assertThat(missing.headers().firstValue("Content-Type").orElseThrow())
        .contains("application/problem+json");
  }

  @Test
  void aPlantOverrideReplacesTheExampleDefault() {
    ingestLeak();
    String override =
        """
        {"parameter":"cation_conductivity","unit":"uS/cm",
         "normal":{"high":0.5,"source":"Brackenmoor chemistry manual (fictional), table 3"},
         "thresholds":[{"level":"AL1","side":"HIGH","value":0.5,"source":"Brackenmoor manual (fictional)"}],
         "deadband":{"value":0.01,"source":"site choice"},
         "persistence":{"value":"PT5M","source":"site choice"}}""";
    HttpResponse<String> put =
        http.send(
            "PUT",
            "/api/v1/sample-points/" + point + "/limits/cation_conductivity",
            "application/json",
            override);
    assertThat(put.statusCode()).as(put.body()).isEqualTo(200);
    // Set today, the plant's limits do not rewrite yesterday's record (as reported); applied to
    // the past (recomputed) they replace the example default.
    JsonNode e = excursions().get(0);
    assertThat(e.get("limitsOrigin").asString()).isEqualTo("DEFAULT");
    assertThat(e.get("highestLevel").asString()).isEqualTo("AL3");
    HttpResponse<String> recomputed =
        http.get(
            "/api/v1/excursions?basis=recomputed&samplePoint="
                + point
                + "&parameter=cation_conductivity"
                + window());
    JsonNode r = JSON.readTree(recomputed.body()).get(0);
    assertThat(r.get("limitsOrigin").asString()).isEqualTo("OVERRIDE");
    assertThat(r.get("highestLevel").asString()).isEqualTo("AL1");

    String badUnit = override.replace("\"unit\":\"uS/cm\"", "\"unit\":\"mS/cm\"");
    HttpResponse<String> bad =
        http.send(
            "PUT",
            "/api/v1/sample-points/" + point + "/limits/cation_conductivity",
            "application/json",
            badUnit);
    assertThat(bad.statusCode()).isEqualTo(400);
    assertThat(bad.body()).contains("canonical unit");
  }

  @Test
  void defaultsSayTheyAreExamples() {
    JsonNode defaults = JSON.readTree(http.get("/api/v1/limits/defaults").body());
    assertThat(defaults.get("notice").asString()).contains("not this plant's limits");
    assertThat(defaults.get("profiles").size()).isGreaterThan(40);
    assertThat(defaults.get("version").asInt()).isEqualTo(4);
    assertThat(defaults.get("byPlantType").get("HRSG").toString()).contains("9.6").contains("HRSG");
    // Version 3: drum-water silica by drum pressure band, and guidance without a parameter.
    JsonNode firstBand = defaults.get("byDrumPressure").get(0);
    assertThat(firstBand.get("upToMPa").asDouble()).isEqualTo(2.07);
    assertThat(firstBand.get("limits").get("limits").get("parameter").asString())
        .isEqualTo("silica");
    assertThat(defaults.get("guidance").toString()).contains("Na:PO4").contains("source");
    // Version 4: condensate sodium for sea- and brackish-water cooled plants.
    assertThat(defaults.get("byCoolingWater").get("SEA").toString())
        .contains("CONDENSATE")
        .contains("\"parameter\":\"sodium\"")
        .contains("from memory — verify");
  }
}
