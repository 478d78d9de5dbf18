package org.kwanta.service.limits;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.URLEncoder;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.time.Duration;
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
 * A treatment regime changed at a given time (issue: the chemistry record): readings before it are
 * judged by the AVT(O) limits, readings after by the OT limits. Feedwater cation conductivity 0.25
 * µS/cm is above the AVT(O) action level 1 (0.2 µS/cm) of the shipped defaults and has no action
 * level under OT (whose normal bound is 0.15); both values are the defaults' IAPWS TGD3-10 figures,
 * recalled from memory — verify (see defaults-v3.yaml). The plant and its readings are invented.
 */
@DatabaseTest
class RegimeChangeIT {

  private static final JsonMapper JSON = JsonMapper.builder().build();

  @LocalServerPort int port;
  Http http;
  String point;
  String declaration;
  Instant day;

  @BeforeEach
  void plant() {
    http = Http.admin(port);
    day = Instant.now().truncatedTo(ChronoUnit.DAYS).minus(3, ChronoUnit.DAYS);
    String tag = UUID.randomUUID().toString().substring(0, 8).toLowerCase(Locale.ROOT);
    point = "G" + tag + "-FW";
    HttpResponse<String> r =
        http.post(
            "/api/v1/plants",
            "application/json",
            ("{\"id\":\"regime-%s\",\"name\":\"Regime change test (invented)\","
                    + "\"blocks\":[{\"id\":\"U1\",\"name\":\"Unit 1\"}],\"samplePoints\":[%s]}")
                .formatted(tag, samplePoint("AVT(O)")));
    assertThat(r.statusCode()).as(r.body()).isEqualTo(201);
    List<String> readings = new ArrayList<>();
    for (int m = 0; m <= 360; m++) {
      readings.add(
          String.format(
              Locale.ROOT,
              "{\"samplePoint\":\"%s\",\"parameter\":\"cation_conductivity\",\"time\":\"%s\","
                  + "\"value\":0.25,\"unit\":\"uS/cm\"}",
              point,
              day.plusSeconds(60L * m)));
    }
    HttpResponse<String> ingest =
        http.post(
            "/api/v1/readings",
            "application/json",
            "{\"readings\":[" + String.join(",", readings) + "]}");
    assertThat(ingest.statusCode()).as(ingest.body()).isEqualTo(200);
  }

  private String samplePoint(String regime) {
    return ("{\"id\":\"%s\",\"block\":\"U1\",\"name\":\"Economizer inlet\","
            + "\"cycleLocation\":\"FEEDWATER\",\"treatmentRegime\":\"%s\","
            + "\"operatingTemperatureCel\":250,\"operatingPressureMPa\":18}")
        .formatted(point, regime);
  }

  private HttpResponse<String> changeRegime(Http as, String regime, Instant from, String reason) {
    String query =
        "?effectiveFrom=" + enc(from.toString()) + (reason == null ? "" : "&reason=" + enc(reason));
    return as.send(
        "PUT", "/api/v1/sample-points/" + point + query, "application/json", samplePoint(regime));
  }

  private JsonNode excursions() {
    HttpResponse<String> r =
        http.get(
            "/api/v1/excursions?samplePoint="
                + point
                + "&parameter=cation_conductivity&from="
                + day
                + "&to="
                + day.plus(1, ChronoUnit.DAYS));
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    return JSON.readTree(r.body());
  }

  private static String enc(String s) {
    return URLEncoder.encode(s, StandardCharsets.UTF_8);
  }

  @Test
  void readingsBeforeTheChangeAreJudgedByAvtOAndAfterByOt() {
    // Before any change, all six hours are one AL1 excursion under AVT(O).
    JsonNode before = excursions();
    assertThat(before).hasSize(1);
    assertThat(before.get(0).get("highestLevel").asString()).isEqualTo("AL1");
    assertThat(before.get(0).get("durationSeconds").asLong()).isGreaterThan(5 * 3600);

    Instant change = day.plus(3, ChronoUnit.HOURS);
    HttpResponse<String> put =
        changeRegime(http, "OT", change, "Oxygen dosing started (invented shift log)");
    assertThat(put.statusCode()).as(put.body()).isEqualTo(200);
    assertThat(JSON.readTree(put.body()).get("version").asInt()).isEqualTo(2);

    // After: the excursion ends where OT took over, and nothing after it is an excursion.
    JsonNode after = excursions();
    assertThat(after).hasSize(1);
    JsonNode e = after.get(0);
    assertThat(e.get("highestLevel").asString()).isEqualTo("AL1");
    assertThat(Instant.parse(e.get("start").asString())).isBefore(day.plus(10, ChronoUnit.MINUTES));
    Instant end = Instant.parse(e.get("end").asString());
    assertThat(end).isBetween(change, change.plus(Duration.ofMinutes(10)));

    // The configuration record shows both versions with the change's time and reason.
    JsonNode versions =
        JSON.readTree(http.get("/api/v1/sample-points/" + point + "/versions").body());
    assertThat(versions).hasSize(2);
    assertThat(versions.get(1).get("config").get("treatmentRegime").asString()).isEqualTo("OT");
    assertThat(Instant.parse(versions.get(1).get("validFrom").asString())).isEqualTo(change);
    assertThat(versions.get(1).get("reason").asString()).contains("Oxygen dosing");
  }

  @Test
  void aPastChangeIsForAdminsWithAReasonAndNeverBeforeALaterVersion() {
    Instant change = day.plus(3, ChronoUnit.HOURS);
    HttpResponse<String> noReason = changeRegime(http, "OT", change, null);
    assertThat(noReason.statusCode()).as(noReason.body()).isEqualTo(400);
    assertThat(noReason.body()).contains("reason");

    JsonNode key =
        JSON.readTree(
            http.post(
                    "/api/v1/keys",
                    "application/json",
                    "{\"name\":\"Shift chemist (invented)\",\"role\":\"chemist\"}")
                .body());
    Http chemist = http.withKey(key.get("key").asString());
    HttpResponse<String> byChemist = changeRegime(chemist, "OT", change, "shift log");
    assertThat(byChemist.statusCode()).as(byChemist.body()).isEqualTo(403);

    assertThat(changeRegime(http, "OT", change, "shift log").statusCode()).isEqualTo(200);
    HttpResponse<String> earlier =
        changeRegime(http, "AVT(O)", change.minus(1, ChronoUnit.HOURS), "earlier still");
    assertThat(earlier.statusCode()).as(earlier.body()).isEqualTo(409);
    assertThat(earlier.body()).contains("cannot be in force from an earlier time");
  }
}
