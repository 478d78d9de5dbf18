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
 * Shipping defaults version 3 does not rewrite the record of the past: on a database of its own,
 * version 2 has been in force since two weeks ago and last week's readings are judged by it; then a
 * release with version 3 starts. Last week's excursions, monthly hours and stored evaluations as
 * reported are identical before and after; recomputed with today's limits they differ exactly where
 * version 3 differs (steam degassed cation conductivity now has action levels). Drum-water silica
 * follows the drum pressure band of the point's configuration version in force.
 *
 * <p>The plant is invented (demo only). The thresholds crossed are the recalled IAPWS steam values
 * (0.2 / 0.35 / 0.65 µS/cm, from memory — verify); the drum-water silica bounds checked are the
 * ASME CRTD-Vol. 34 table values as retrieved (see {@code defaults-v3.yaml}).
 */
@org.junit.jupiter.api.Tag(org.kwanta.service.support.Depth.THOROUGH)
class DefaultsVersion3IT {

  private static final JsonMapper JSON = JsonMapper.builder().build();

  private Releases releases;

  @BeforeEach
  void database() throws Exception {
    releases = new Releases("defaults3");
    // An upgraded database: version 1 first (it covers earlier times), version 2 in force since two
    // weeks ago (the migrations record no activation in a database without readings, V54).
    releases.sql(
        "INSERT INTO limit_defaults_activation (version, effective_from)"
            + " VALUES (1, now() - interval '60 days'), (2, now() - interval '14 days')");
  }

  @AfterEach
  void dropDatabase() throws Exception {
    releases.close();
  }

  private static final String PLANT =
      """
      {"id":"defaults3","name":"Defaults v3 test plant (fictional)",
       "blocks":[{"id":"U1","name":"Unit 1"}],
       "samplePoints":[
        {"id":"D3-MS","block":"U1","name":"Main steam","cycleLocation":"MAIN_STEAM",
         "treatmentRegime":"AVT(O)","operatingTemperatureCel":330},
        {"id":"D3-HP-DRUM","block":"U1","name":"HP drum water","cycleLocation":"DRUM_WATER",
         "treatmentRegime":"AVT(O)","operatingTemperatureCel":330},
        {"id":"D3-LP-DRUM","block":"U1","name":"LP drum water","cycleLocation":"DRUM_WATER",
         "treatmentRegime":"AVT(O)","operatingTemperatureCel":150,"operatingPressureMPa":0.5}]}""";

  /** Last week, one hour of main steam at 0.5 µS/cm, cation and degassed cation conductivity. */
  private static String lastWeeksReadings(Instant day) {
    List<String> readings = new ArrayList<>();
    for (int m = 0; m <= 180; m++) {
      double value = m >= 60 && m < 120 ? 0.5 : 0.1;
      for (String parameter : List.of("cation_conductivity", "degassed_cation_conductivity")) {
        readings.add(
            String.format(
                Locale.ROOT,
                "{\"samplePoint\":\"D3-MS\",\"parameter\":\"%s\",\"time\":\"%s\","
                    + "\"value\":%s,\"unit\":\"uS/cm\"}",
                parameter,
                day.plusSeconds(60L * m),
                value));
      }
    }
    return "{\"readings\":[" + String.join(",", readings) + "]}";
  }

  /** What the record says of last week, as reported and as recomputed. */
  private record Record(
      JsonNode cationReported,
      JsonNode degassedReported,
      JsonNode cationRecomputed,
      JsonNode degassedRecomputed,
      JsonNode hoursReported,
      JsonNode hoursRecomputed,
      JsonNode evaluations) {}

  private static JsonNode get(Http http, String path) {
    HttpResponse<String> r = http.get(path);
    assertThat(r.statusCode()).as(path + ": " + r.body()).isEqualTo(200);
    return JSON.readTree(r.body());
  }

  private static Record record(Http http, Instant day) {
    String window = "&from=" + day + "&to=" + day.plus(1, ChronoUnit.DAYS);
    String cation = "/api/v1/excursions?samplePoint=D3-MS&parameter=cation_conductivity" + window;
    String degassed =
        "/api/v1/excursions?samplePoint=D3-MS&parameter=degassed_cation_conductivity" + window;
    String hours =
        "/api/v1/excursions/monthly-hours?samplePoint=D3-MS&parameter=degassed_cation_conductivity"
            + window;
    return new Record(
        get(http, cation),
        get(http, degassed),
        get(http, cation + "&basis=recomputed"),
        get(http, degassed + "&basis=recomputed"),
        get(http, hours),
        get(http, hours + "&basis=recomputed"),
        get(
            http,
            "/api/v1/sample-points/D3-MS/evaluations?from="
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

  @Test
  void lastWeekUnderVersion2IsUnchangedAsReportedAndDiffersAsRecomputedAfterVersion3Ships() {
    Instant day = Instant.now().truncatedTo(ChronoUnit.DAYS).minus(7, ChronoUnit.DAYS);

    // The release with version 2: the plant, last week's readings, the record.
    Http v2 = releases.start("limits/defaults-v2.yaml");
    HttpResponse<String> created = v2.post("/api/v1/plants", "application/json", PLANT);
    assertThat(created.statusCode()).as(created.body()).isEqualTo(201);
    HttpResponse<String> in =
        v2.post("/api/v1/readings", "application/json", lastWeeksReadings(day));
    assertThat(in.statusCode()).as(in.body()).isEqualTo(200);
    Record before = record(v2, day);
    // Under version 2 the steam cation conductivity hour is an AL2 excursion; degassed cation
    // conductivity has a normal range only, so no excursion.
    assertThat(before.cationReported()).hasSize(1);
    assertThat(before.cationReported().get(0).get("highestLevel").asString()).isEqualTo("AL2");
    assertThat(before.cationReported().get(0).get("limitsVersion").asInt()).isEqualTo(2);
    assertThat(before.degassedReported()).isEmpty();
    assertThat(before.degassedRecomputed()).isEmpty();
    assertThat(before.evaluations().get("evaluations")).isNotEmpty();
    assertThat(limitsNow(v2, "D3-HP-DRUM", "silica")).isNull();
    releases.stopOldest();

    // The release with version 3 on the same database (version 4 ships now: DefaultsVersion4IT).
    Http v3 = releases.start("limits/defaults-v3.yaml");
    Record after = record(v3, day);

    // As reported: identical, byte for byte.
    assertThat(after.cationReported()).isEqualTo(before.cationReported());
    assertThat(after.degassedReported()).isEqualTo(before.degassedReported());
    assertThat(after.hoursReported()).isEqualTo(before.hoursReported());
    assertThat(after.evaluations()).isEqualTo(before.evaluations());

    // As recomputed: the cation-conductivity excursion is the same but judged by version 3 (whose
    // steam cation-conductivity limits are version 2's); degassed cation conductivity now has an
    // AL2 excursion over the same hour.
    assertThat(after.cationRecomputed()).hasSize(1);
    assertThat(after.cationRecomputed().get(0).get("limitsVersion").asInt()).isEqualTo(3);
    assertThat(after.cationRecomputed().get(0).get("start"))
        .isEqualTo(before.cationReported().get(0).get("start"));
    assertThat(after.cationRecomputed().get(0).get("highestLevel"))
        .isEqualTo(before.cationReported().get(0).get("highestLevel"));
    assertThat(after.degassedRecomputed()).hasSize(1);
    JsonNode e = after.degassedRecomputed().get(0);
    assertThat(e.get("highestLevel").asString()).isEqualTo("AL2");
    assertThat(e.get("limitsVersion").asInt()).isEqualTo(3);
    assertThat(e.get("start").asString())
        .isEqualTo(after.cationRecomputed().get(0).get("start").asString());
    assertThat(after.hoursRecomputed()).isNotEqualTo(after.hoursReported());

    // The history of the degassed limits: version 1 before version 2's activation, version 2 from
    // two weeks ago, version 3 from this start.
    JsonNode periods =
        get(v3, "/api/v1/sample-points/D3-MS/limits/degassed_cation_conductivity/history")
            .get("periods");
    assertThat(periods).hasSize(3);
    assertThat(periods.get(1).get("limits").get("version").asInt()).isEqualTo(2);
    assertThat(periods.get(2).get("limits").get("version").asInt()).isEqualTo(3);

    // Drum-water silica by drum pressure: the HP drum has no configured pressure, so its drum
    // pressure is the saturation pressure at 330 °C (12.86 MPa, IF97; Debian python3-iapws
    // IAPWS97(T=603.15, x=0).P = 12.8575 MPa): band 10.35-13.79 MPa,
    // < 1 mg/kg. The LP drum is configured at 0.5 MPa: band 0-2.07 MPa, < 150 mg/kg.
    JsonNode hp = limitsNow(v3, "D3-HP-DRUM", "silica");
    assertThat(hp.get("version").asInt()).isEqualTo(3);
    assertThat(hp.get("limits").get("normal").get("high").asDouble()).isEqualTo(1000);
    assertThat(hp.get("limits").get("normal").get("source").asString())
        .contains("ASME CRTD-Vol. 34")
        .contains("10.35-13.79 MPa");
    JsonNode lp = limitsNow(v3, "D3-LP-DRUM", "silica");
    assertThat(lp.get("limits").get("normal").get("high").asDouble()).isEqualTo(150_000);

    // The drum pressure is part of the point's configuration versions: raised to 3.0 MPa (band
    // 2.08-3.10 MPa, < 90 mg/kg) from now on, the earlier period keeps < 150 mg/kg.
    HttpResponse<String> changed =
        v3.send(
            "PUT",
            "/api/v1/sample-points/D3-LP-DRUM",
            "application/json",
            """
            {"id":"D3-LP-DRUM","block":"U1","name":"LP drum water","cycleLocation":"DRUM_WATER",
             "treatmentRegime":"AVT(O)","operatingTemperatureCel":150,"operatingPressureMPa":3.0}""");
    assertThat(changed.statusCode()).as(changed.body()).isEqualTo(200);
    assertThat(
            limitsNow(v3, "D3-LP-DRUM", "silica")
                .get("limits")
                .get("normal")
                .get("high")
                .asDouble())
        .isEqualTo(90_000);
    JsonNode silica =
        get(v3, "/api/v1/sample-points/D3-LP-DRUM/limits/silica/history").get("periods");
    assertThat(silica).hasSize(3);
    assertThat(silica.get(0).get("limits").isNull()).isTrue();
    assertThat(silica.get(1).get("limits").get("limits").get("normal").get("high").asDouble())
        .isEqualTo(150_000);
    assertThat(silica.get(2).get("limits").get("limits").get("normal").get("high").asDouble())
        .isEqualTo(90_000);
  }
}
