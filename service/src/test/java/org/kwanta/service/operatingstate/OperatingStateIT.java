package org.kwanta.service.operatingstate;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.net.http.HttpResponse;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.UUID;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.dao.DataAccessException;
import org.springframework.jdbc.core.JdbcTemplate;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Unit operating state (issue 14 item 4) through the HTTP API: start-up time is not in-service
 * time, so an excursion during start-up adds no excursion hours in service; hold points are
 * reported met or not; the record is append-only and audited.
 *
 * <p>Series invented for the test. The condensate cation conductivity levels crossed are the
 * shipped example limits (AL1 &gt; 0.2, AL2 &gt; 0.35 µS/cm, recalled from IAPWS TGD3-10, from
 * memory — verify); the hold point values are the shipped examples of startup/hold-points-v1.yaml
 * (steam cation conductivity ≤ 0.5 µS/cm before steam to the turbine, ≤ 0.2 before full load; IAPWS
 * TGD5-13 as recalled, from memory — verify).
 */
@DatabaseTest
class OperatingStateIT {

  private static final JsonMapper JSON = JsonMapper.builder().build();

  @LocalServerPort int port;
  @Autowired JdbcTemplate jdbc;
  Http http;
  String plant;
  String cpd;
  String steam;

  @BeforeEach
  void plant() {
    http = Http.admin(port);
    String tag = UUID.randomUUID().toString().substring(0, 8).toLowerCase(Locale.ROOT);
    plant = "state-" + tag;
    cpd = "S" + tag + "-CPD";
    steam = "S" + tag + "-MS";
    String body =
        ("{\"id\":\"%s\",\"name\":\"Operating state test (fictional)\","
                + "\"blocks\":[{\"id\":\"U1\",\"name\":\"Unit 1\"}],\"samplePoints\":["
                + "{\"id\":\"%s\",\"block\":\"U1\",\"name\":\"Condensate pump discharge\","
                + "\"cycleLocation\":\"CONDENSATE\",\"treatmentRegime\":\"AVT(O)\","
                + "\"operatingTemperatureCel\":40,\"operatingPressureMPa\":1.5},"
                + "{\"id\":\"%s\",\"block\":\"U1\",\"name\":\"Main steam\","
                + "\"cycleLocation\":\"MAIN_STEAM\",\"treatmentRegime\":\"AVT(O)\","
                + "\"operatingTemperatureCel\":540,\"operatingPressureMPa\":16}]}")
            .formatted(plant, cpd, steam);
    HttpResponse<String> r = http.post("/api/v1/plants", "application/json", body);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(201);
  }

  private JsonNode state(String state, Instant since) {
    HttpResponse<String> r =
        http.post(
            "/api/v1/plants/" + plant + "/blocks/U1/operating-states",
            "application/json",
            "{\"state\":\"%s\",\"since\":\"%s\",\"note\":\"test\"}".formatted(state, since));
    assertThat(r.statusCode()).as(r.body()).isEqualTo(201);
    return JSON.readTree(r.body());
  }

  private void ingest(String point, List<Instant> times, List<Double> values) {
    List<String> readings = new ArrayList<>();
    for (int i = 0; i < times.size(); i++) {
      readings.add(
          String.format(
              Locale.ROOT,
              "{\"samplePoint\":\"%s\",\"parameter\":\"cation_conductivity\",\"time\":\"%s\","
                  + "\"value\":%s,\"unit\":\"uS/cm\"}",
              point,
              times.get(i),
              values.get(i)));
    }
    HttpResponse<String> r =
        http.post(
            "/api/v1/readings",
            "application/json",
            "{\"readings\":[" + String.join(",", readings) + "]}");
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
  }

  private Map<String, Double> hours(String query) {
    HttpResponse<String> r =
        http.get(
            "/api/v1/excursions/monthly-hours?samplePoint="
                + cpd
                + "&parameter=cation_conductivity"
                + query);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    Map<String, Double> out = new HashMap<>();
    for (JsonNode row : JSON.readTree(r.body())) {
      out.merge(row.get("level").asString(), row.get("hours").asDouble(), Double::sum);
    }
    return out;
  }

  /**
   * Start-up from 00:00, in service from 06:00. Cation conductivity 0.5 µS/cm (AL2) from 00:00 to
   * 04:00, 0.30 (AL1) from 08:00 to 09:00, 0.08 otherwise, every 5 minutes to 12:00. By hand: all
   * time counted: AL2 4 h, AL1 1 h, NORMAL 12 − 5 = 7 h; in service (06:00–12:00): AL2 0 h, AL1 1
   * h, NORMAL 5 h. The AL2 excursion lasts 14 400 s, none of it in service; the AL1 one 3 600 s,
   * all in service.
   */
  @Test
  void hoursInStartUpAreNotExcursionHoursInService() {
    Instant day = Instant.now().truncatedTo(ChronoUnit.DAYS).minus(2, ChronoUnit.DAYS);
    state("START_UP", day);
    state("IN_SERVICE", day.plus(6, ChronoUnit.HOURS));
    List<Instant> times = new ArrayList<>();
    List<Double> values = new ArrayList<>();
    for (int m = 0; m < 720; m += 5) {
      times.add(day.plusSeconds(60L * m));
      values.add(m < 240 ? 0.5 : m >= 480 && m < 540 ? 0.30 : 0.08);
    }
    ingest(cpd, times, values);
    String window = "&from=" + day + "&to=" + day.plus(12, ChronoUnit.HOURS);

    Map<String, Double> inService = hours(window);
    assertThat(inService.getOrDefault("AL2", 0.0)).isZero();
    assertThat(inService.get("AL1")).isCloseTo(1.0, org.assertj.core.data.Offset.offset(1e-9));
    assertThat(inService.get("NORMAL")).isCloseTo(5.0, org.assertj.core.data.Offset.offset(1e-9));

    Map<String, Double> all = hours(window + "&time=all");
    assertThat(all.get("AL2")).isCloseTo(4.0, org.assertj.core.data.Offset.offset(1e-9));
    assertThat(all.get("AL1")).isCloseTo(1.0, org.assertj.core.data.Offset.offset(1e-9));
    assertThat(all.get("NORMAL")).isCloseTo(7.0, org.assertj.core.data.Offset.offset(1e-9));

    HttpResponse<String> header =
        http.get(
            "/api/v1/excursions/monthly-hours?samplePoint="
                + cpd
                + "&parameter=cation_conductivity"
                + window);
    assertThat(header.headers().firstValue("Kwanta-Time-Counted")).hasValue("in-service");
    assertThat(JSON.readTree(header.body()).get(0).get("timeCounted").asString())
        .isEqualTo("in-service");

    HttpResponse<String> r =
        http.get(
            "/api/v1/excursions?samplePoint=" + cpd + "&parameter=cation_conductivity" + window);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    JsonNode excursions = JSON.readTree(r.body());
    assertThat(excursions).hasSize(2);
    assertThat(excursions.get(0).get("highestLevel").asString()).isEqualTo("AL2");
    assertThat(excursions.get(0).get("durationSeconds").asLong()).isEqualTo(14_400);
    assertThat(excursions.get(0).get("inServiceSeconds").asLong()).isZero();
    assertThat(excursions.get(1).get("highestLevel").asString()).isEqualTo("AL1");
    assertThat(excursions.get(1).get("inServiceSeconds").asLong()).isEqualTo(3_600);

    JsonNode timeline =
        JSON.readTree(
            http.get(
                    "/api/v1/plants/"
                        + plant
                        + "/blocks/U1/operating-states"
                        + "?"
                        + window.substring(1))
                .body());
    assertThat(timeline.get("hoursByState").get("START_UP").asDouble()).isEqualTo(6.0);
    assertThat(timeline.get("hoursByState").get("IN_SERVICE").asDouble()).isEqualTo(6.0);
    assertThat(timeline.get("hoursCountedInService").asDouble()).isEqualTo(6.0);
  }

  /**
   * Steam cation conductivity 0.8 µS/cm: the steam-to-turbine hold point (≤ 0.5) is not met; at 0.3
   * it is, while the full-load one (≤ 0.2) is still not met.
   */
  @Test
  void holdPointIsReportedMetOrNot() {
    Instant now = Instant.now().truncatedTo(ChronoUnit.SECONDS);
    state("START_UP", now.minus(1, ChronoUnit.HOURS));
    ingest(steam, List.of(now.minus(20, ChronoUnit.MINUTES)), List.of(0.8));
    JsonNode before = holdPoints(now.minus(19, ChronoUnit.MINUTES));
    assertThat(before.get("state").asString()).isEqualTo("START_UP");
    assertThat(status(before, "steam-to-turbine-cation-conductivity")).isEqualTo("NOT_MET");
    assertThat(status(before, "full-load-cation-conductivity")).isEqualTo("NOT_MET");

    ingest(steam, List.of(now.minus(10, ChronoUnit.MINUTES)), List.of(0.3));
    JsonNode after = holdPoints(now.minus(9, ChronoUnit.MINUTES));
    assertThat(status(after, "steam-to-turbine-cation-conductivity")).isEqualTo("MET");
    assertThat(status(after, "full-load-cation-conductivity")).isEqualTo("NOT_MET");
    JsonNode met = find(after, "steam-to-turbine-cation-conductivity");
    assertThat(met.get("met").asBoolean()).isTrue();
    assertThat(met.get("measured").asDouble()).isEqualTo(0.3);
    assertThat(met.get("holdValue").asDouble()).isEqualTo(0.5);
    assertThat(met.get("source").asString()).contains("IAPWS TGD5-13").contains("from memory");
    assertThat(met.get("fromMemory").asBoolean()).isTrue();

    // nothing within the last 30 minutes: no data, never "met"
    JsonNode later = holdPoints(now.plus(2, ChronoUnit.HOURS));
    assertThat(status(later, "steam-to-turbine-cation-conductivity")).isEqualTo("NO_DATA");
  }

  private JsonNode holdPoints(Instant at) {
    HttpResponse<String> r =
        http.get("/api/v1/plants/" + plant + "/blocks/U1/hold-points?at=" + at);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    return JSON.readTree(r.body());
  }

  private static JsonNode find(JsonNode response, String id) {
    for (JsonNode h : response.get("holdPoints")) {
      if (h.get("id").asString().equals(id)) {
        return h;
      }
    }
    throw new AssertionError("no hold point " + id + " in " + response);
  }

  private static String status(JsonNode response, String id) {
    return find(response, id).get("status").asString();
  }

  @Test
  void entriesAreAppendOnlyByKeyAndAudited() {
    Instant since = Instant.now().truncatedTo(ChronoUnit.HOURS).minus(3, ChronoUnit.HOURS);
    JsonNode first = state("SHUT_DOWN", since);
    JsonNode correction = state("LAYUP_WET", since);
    assertThat(correction.get("recordedByKeyId").asString()).isNotBlank();
    JsonNode timeline =
        JSON.readTree(
            http.get(
                    "/api/v1/plants/"
                        + plant
                        + "/blocks/U1/operating-states?from="
                        + since
                        + "&to="
                        + since.plus(1, ChronoUnit.HOURS))
                .body());
    assertThat(timeline.get("entries")).hasSize(2);
    assertThat(timeline.get("timeline").get(0).get("state").asString()).isEqualTo("LAYUP_WET");
    assertThat(
            jdbc.queryForObject(
                "SELECT count(*) FROM audit_event WHERE entity_type = 'block-operating-state'"
                    + " AND entity_id = ?",
                Integer.class,
                plant + "/U1"))
        .isEqualTo(2);
    assertThatThrownBy(
            () ->
                jdbc.update(
                    "UPDATE block_operating_state SET state = 'IN_SERVICE' WHERE id = ?",
                    first.get("id").asLong()))
        .isInstanceOf(DataAccessException.class)
        .rootCause()
        .hasMessageContaining("append-only");

    HttpResponse<String> unknown =
        http.post(
            "/api/v1/plants/" + plant + "/blocks/U9/operating-states",
            "application/json",
            "{\"state\":\"IN_SERVICE\",\"since\":\"" + since + "\"}");
    assertThat(unknown.statusCode()).isEqualTo(404);
    assertThat(unknown.headers().firstValue("Content-Type"))
        .hasValueSatisfying(t -> assertThat(t).startsWith("application/problem+json"));
    HttpResponse<String> bad =
        http.post(
            "/api/v1/plants/" + plant + "/blocks/U1/operating-states",
            "application/json",
            "{\"state\":\"WARMING\",\"since\":\"" + since + "\"}");
    assertThat(bad.statusCode()).isEqualTo(400);
  }
}
