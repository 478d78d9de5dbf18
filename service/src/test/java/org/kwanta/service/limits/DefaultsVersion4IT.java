package org.kwanta.service.limits;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpResponse;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.Http;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Defaults version 4, activated later than the record it meets, does not change it: on a database
 * of its own, version 3 has been in force since two weeks ago and a sea-water cooled plant's
 * condensate sodium stood at 1.5 µg/kg for an hour last week (normal under version 3, whose
 * condensate levels are 2 / 4 / 8 µg/kg). A release with version 4 (1 / 2 / 4 µg/kg for sea or
 * brackish cooling) is activated three days ago. Last week as reported is identical before and
 * after; recomputed with today's limits it is an AL1 excursion of version 4. The same hour two days
 * ago, after the activation, is judged by version 4 as reported. Drum-water chloride follows the
 * drum pressure band.
 *
 * <p>The plant and its readings are invented (demo only). The levels are recalled (from memory —
 * verify, see {@code defaults-v3.yaml} and {@code defaults-v4.yaml}).
 */
@org.junit.jupiter.api.Tag(org.kwanta.service.support.Depth.THOROUGH)
class DefaultsVersion4IT {

  private static final JsonMapper JSON = JsonMapper.builder().build();

  private Releases releases;

  @BeforeEach
  void database() throws Exception {
    releases = new Releases("defaults4");
    // An upgraded database: version 1 first (it covers earlier times), version 3 in force since two
    // weeks ago (the migrations record no activation in a database without readings, V54).
    releases.sql(
        "INSERT INTO limit_defaults_activation (version, effective_from)"
            + " VALUES (1, now() - interval '60 days'), (3, now() - interval '14 days')");
  }

  @AfterEach
  void dropDatabase() throws Exception {
    releases.close();
  }

  private static final String PLANT =
      """
      {"id":"defaults4","name":"Defaults v4 test plant (fictional)","coolingWater":"SEA",
       "blocks":[{"id":"U1","name":"Unit 1"}],
       "samplePoints":[
        {"id":"D4-CPD","block":"U1","name":"Condensate pump discharge","cycleLocation":"CONDENSATE",
         "treatmentRegime":"AVT(O)","operatingTemperatureCel":40,"operatingPressureMPa":1.5},
        {"id":"D4-HP-DRUM","block":"U1","name":"HP drum water","cycleLocation":"DRUM_WATER",
         "treatmentRegime":"AVT(O)","operatingTemperatureCel":330},
        {"id":"D4-LP-DRUM","block":"U1","name":"LP drum water","cycleLocation":"DRUM_WATER",
         "treatmentRegime":"AVT(O)","operatingTemperatureCel":150,"operatingPressureMPa":0.5}]}""";

  /** Three hours of condensate sodium from {@code day}: 0.3 µg/kg, 1.5 µg/kg in the second hour. */
  private static String sodiumHour(Instant day) {
    List<String> readings = new ArrayList<>();
    for (int m = 0; m <= 180; m++) {
      double value = m >= 60 && m < 120 ? 1.5 : 0.3;
      readings.add(
          String.format(
              Locale.ROOT,
              "{\"samplePoint\":\"D4-CPD\",\"parameter\":\"sodium\",\"time\":\"%s\","
                  + "\"value\":%s,\"unit\":\"ug/kg\"}",
              day.plusSeconds(60L * m),
              value));
    }
    return "{\"readings\":[" + String.join(",", readings) + "]}";
  }

  private static JsonNode get(Http http, String path) {
    HttpResponse<String> r = http.get(path);
    assertThat(r.statusCode()).as(path + ": " + r.body()).isEqualTo(200);
    return JSON.readTree(r.body());
  }

  /** What the record says of a day's condensate sodium. */
  private record Record(
      JsonNode reported, JsonNode recomputed, JsonNode hoursReported, JsonNode evaluations) {}

  private static Record record(Http http, Instant day) {
    String window = "&from=" + day + "&to=" + day.plus(1, ChronoUnit.DAYS);
    String sodium = "/api/v1/excursions?samplePoint=D4-CPD&parameter=sodium" + window;
    return new Record(
        get(http, sodium),
        get(http, sodium + "&basis=recomputed"),
        get(http, "/api/v1/excursions/monthly-hours?samplePoint=D4-CPD&parameter=sodium" + window),
        get(
            http,
            "/api/v1/sample-points/D4-CPD/evaluations?from="
                + day
                + "&to="
                + day.plus(1, ChronoUnit.DAYS)));
  }

  private static JsonNode limitsNow(Http http, String point, String parameter) {
    for (JsonNode p : get(http, "/api/v1/sample-points/" + point + "/limits")) {
      if (p.get("limits").get("parameter").asString().equals(parameter)) {
        return p;
      }
    }
    return null;
  }

  private static void ingest(Http http, String body) {
    HttpResponse<String> in = http.post("/api/v1/readings", "application/json", body);
    assertThat(in.statusCode()).as(in.body()).isEqualTo(200);
  }

  @Test
  void version4ActivatedLaterLeavesEarlierExcursionsAndJudgesAfterItsActivation() throws Exception {
    Instant today = Instant.now().truncatedTo(ChronoUnit.DAYS);
    Instant lastWeek = today.minus(7, ChronoUnit.DAYS);
    Instant twoDaysAgo = today.minus(2, ChronoUnit.DAYS);

    // The release with version 3: the plant, last week's readings, the record.
    Http v3 = releases.start("limits/defaults-v3.yaml");
    HttpResponse<String> created = v3.post("/api/v1/plants", "application/json", PLANT);
    assertThat(created.statusCode()).as(created.body()).isEqualTo(201);
    ingest(v3, sodiumHour(lastWeek));
    Record before = record(v3, lastWeek);
    assertThat(before.reported()).isEmpty();
    assertThat(before.recomputed()).isEmpty();
    assertThat(before.evaluations().get("evaluations")).isNotEmpty();
    assertThat(limitsNow(v3, "D4-HP-DRUM", "chloride")).isNull();
    releases.stopOldest();

    // Version 4 came into force three days ago (as if its release had first started then).
    releases.sql(
        "INSERT INTO limit_defaults_activation (version, effective_from)"
            + " VALUES (4, now() - interval '3 days')");
    Http v4 = releases.start(null);
    Record after = record(v4, lastWeek);

    // Before the activation, as reported: identical, byte for byte.
    assertThat(after.reported()).isEqualTo(before.reported());
    assertThat(after.hoursReported()).isEqualTo(before.hoursReported());
    assertThat(after.evaluations()).isEqualTo(before.evaluations());
    // Recomputed with today's limits: the hour at 1.5 µg/kg is AL1 under version 4 (sea water).
    assertThat(after.recomputed()).hasSize(1);
    JsonNode recomputed = after.recomputed().get(0);
    assertThat(recomputed.get("highestLevel").asString()).isEqualTo("AL1");
    assertThat(recomputed.get("limitsVersion").asInt()).isEqualTo(4);
    assertThat(recomputed.get("start").asString())
        .isGreaterThanOrEqualTo(lastWeek.plus(60, ChronoUnit.MINUTES).toString());

    // After the activation, as reported: the same hour two days ago is judged by version 4.
    ingest(v4, sodiumHour(twoDaysAgo));
    Record later = record(v4, twoDaysAgo);
    assertThat(later.reported()).hasSize(1);
    assertThat(later.reported().get(0).get("highestLevel").asString()).isEqualTo("AL1");
    assertThat(later.reported().get(0).get("limitsVersion").asInt()).isEqualTo(4);
    assertThat(later.reported().get(0).get("basis").asString()).isEqualTo("as-reported");

    // The history of condensate sodium: version 3 from two weeks ago, version 4 from three days
    // ago.
    JsonNode periods = get(v4, "/api/v1/sample-points/D4-CPD/limits/sodium/history").get("periods");
    JsonNode last = periods.get(periods.size() - 1);
    JsonNode previous = periods.get(periods.size() - 2);
    assertThat(last.get("limits").get("version").asInt()).isEqualTo(4);
    assertThat(previous.get("limits").get("version").asInt()).isEqualTo(3);
    assertThat(Instant.parse(last.get("from").asString()))
        .isBetween(today.minus(4, ChronoUnit.DAYS), Instant.now().minus(2, ChronoUnit.DAYS));
    assertThat(last.get("limits").get("limits").get("thresholds").get(0).get("value").asDouble())
        .isEqualTo(1.0);

    // Drum-water chloride by drum pressure band: the HP drum at the saturation pressure of 330 °C
    // (12.86 MPa, IF97; Debian python3-iapws IAPWS97(T=603.15, x=0).P = 12.8575 MPa) is in the
    // 12-16 MPa band, < 60 µg/kg; the LP drum configured at 0.5 MPa in the first band, < 500 µg/kg.
    JsonNode hp = limitsNow(v4, "D4-HP-DRUM", "chloride");
    assertThat(hp.get("version").asInt()).isEqualTo(4);
    assertThat(hp.get("limits").get("normal").get("high").asDouble()).isEqualTo(60);
    assertThat(hp.get("limits").get("normal").get("source").asString())
        .contains("12-16 MPa")
        .contains("from memory — verify");
    assertThat(
            limitsNow(v4, "D4-LP-DRUM", "chloride")
                .get("limits")
                .get("normal")
                .get("high")
                .asDouble())
        .isEqualTo(500);
    // Before version 4's activation no chloride limit was in force at the drum.
    JsonNode chloride =
        get(v4, "/api/v1/sample-points/D4-HP-DRUM/limits/chloride/history").get("periods");
    assertThat(chloride.get(0).get("limits").isNull()).isTrue();
    assertThat(chloride.get(chloride.size() - 1).get("limits").get("version").asInt()).isEqualTo(4);
  }
}
