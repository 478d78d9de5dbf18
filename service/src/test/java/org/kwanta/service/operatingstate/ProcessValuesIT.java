package org.kwanta.service.operatingstate;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

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
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.model.water.Water;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.springframework.boot.test.web.server.LocalServerPort;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Process values from the historian through the real path (ingest, evaluation, API, embedded
 * PostgreSQL): a drum-pressure reading sets the operating state of a drum-water point's pH at
 * temperature while it is recent, and the historian's operating_state readings make the block's
 * state timeline with the chemist's entries, so start-up hours are not excursion hours in service.
 *
 * <p>Saturation temperature: T_s(10 MPa) = 584.149488 K, IAPWS-IF97 (IAPWS R7-97(2012)) Table 35,
 * copied as printed (python3-iapws 1.5.2 {@code _TSat_P(10)} = 584.1494879985282 K agrees). The
 * readings are those of SteamPointIT (the engine's own solution model for 1.5 mg/kg ammonia, 3
 * µg/kg chloride, 10 µg/kg carbon dioxide at 25 °C). The cation conductivity levels crossed are the
 * shipped example limits (AL1 &gt; 0.2, AL2 &gt; 0.35 µS/cm, recalled from IAPWS TGD3-10, from
 * memory — verify). Plant and series invented for the test.
 */
@DatabaseTest
class ProcessValuesIT {

  private static final JsonMapper JSON = JsonMapper.builder().build();

  /** T_s(10 MPa), K: IAPWS-IF97 Table 35. */
  private static final double SATURATION_10_MPA_K = 584.149488;

  @LocalServerPort int port;
  Http http;
  String plant;
  String drum;
  String cpd;

  @BeforeEach
  void plant() {
    http = Http.admin(port);
    String tag = UUID.randomUUID().toString().substring(0, 8).toLowerCase(Locale.ROOT);
    plant = "process-" + tag;
    drum = "P" + tag + "-DRUM";
    cpd = "P" + tag + "-CPD";
    String body =
        ("{\"id\":\"%s\",\"name\":\"Process values test (fictional)\","
                + "\"blocks\":[{\"id\":\"B1\",\"name\":\"Block 1\"}],\"samplePoints\":["
                + "{\"id\":\"%s\",\"block\":\"B1\",\"name\":\"HP drum water\","
                + "\"cycleLocation\":\"DRUM_WATER\",\"treatmentRegime\":\"AVT(O)\","
                + "\"operatingTemperatureCel\":330},"
                + "{\"id\":\"%s\",\"block\":\"B1\",\"name\":\"Condensate pump discharge\","
                + "\"cycleLocation\":\"CONDENSATE\",\"treatmentRegime\":\"AVT(O)\","
                + "\"operatingTemperatureCel\":40,\"operatingPressureMPa\":1.5}]}")
            .formatted(plant, drum, cpd);
    HttpResponse<String> r = http.post("/api/v1/plants", "application/json", body);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(201);
  }

  private static String reading(
      String point, String parameter, Instant time, double value, String unit, String extra) {
    return String.format(
        Locale.ROOT,
        "{\"samplePoint\":\"%s\",\"parameter\":\"%s\",\"time\":\"%s\",\"value\":%s,"
            + "\"unit\":\"%s\"%s}",
        point,
        parameter,
        time,
        value,
        unit,
        extra);
  }

  private JsonNode post(List<String> readings) {
    HttpResponse<String> r =
        http.post(
            "/api/v1/readings",
            "application/json",
            "{\"readings\":[" + String.join(",", readings) + "]}");
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    return JSON.readTree(r.body());
  }

  /** The stored pH at temperature of the drum point per evaluated time. */
  private Map<Instant, JsonNode> phAtTemperature(Instant from, Instant to) {
    HttpResponse<String> r =
        http.get("/api/v1/sample-points/" + drum + "/evaluations?from=" + from + "&to=" + to);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    assertThat(r.body()).doesNotContain("NaN");
    Map<Instant, JsonNode> out = new HashMap<>();
    for (JsonNode e : JSON.readTree(r.body()).get("evaluations")) {
      JsonNode t = e.get("evaluation").get("phAtTemperature");
      assertThat(t).as(e.toString()).isNotNull();
      JsonNode withNotes = JSON.createObjectNode().set("t", t);
      ((tools.jackson.databind.node.ObjectNode) withNotes)
          .set("notes", e.get("evaluation").get("notes"));
      out.put(Instant.parse(e.get("time").asString()), withNotes);
    }
    return out;
  }

  /**
   * Conductivities every minute for 20 minutes, then (a second batch, as a historian sends its own
   * tags) one drum pressure of 100 bar = 10 MPa at minute 5. Before it: the configured 330 °C. From
   * minute 5 to 15: saturated liquid at T_s(10 MPa) = 310.999488 °C, MEASURED with the value and
   * its time. From minute 16 the reading is older than 10 minutes: configured again, with a note.
   */
  @Test
  void aDrumPressureReadingSetsThePhAtTemperatureWhileItIsRecent() {
    Instant t0 = Instant.now().truncatedTo(ChronoUnit.MINUTES).minus(40, ChronoUnit.MINUTES);
    List<String> readings = new ArrayList<>();
    for (int m = 0; m < 20; m++) {
      Instant t = t0.plusSeconds(60L * m);
      readings.add(
          reading(drum, "specific_conductivity", t, 8.55, "uS/cm", ",\"compensated\":true"));
      readings.add(
          reading(drum, "cation_conductivity", t, 0.113, "uS/cm", ",\"compensated\":true"));
    }
    post(readings);
    Instant end = t0.plusSeconds(20 * 60);
    Map<Instant, JsonNode> before = phAtTemperature(t0, end);
    assertThat(before).hasSize(20);
    JsonNode configured9 = before.get(t0.plusSeconds(9 * 60)).get("t");
    assertThat(configured9.get("operatingConditionSource").asString()).isEqualTo("CONFIGURED");
    assertThat(configured9.get("temperatureCel").asDouble()).isCloseTo(330, within(1e-9));

    JsonNode outcome =
        post(List.of(reading(drum, "drum_pressure", t0.plusSeconds(300), 100, "bar", "")));
    assertThat(outcome.get("inserted").asInt()).isEqualTo(1);

    Map<Instant, JsonNode> after = phAtTemperature(t0, end);
    assertThat(after).hasSize(20);
    for (int m = 0; m < 20; m++) {
      JsonNode e = after.get(t0.plusSeconds(60L * m));
      JsonNode t = e.get("t");
      if (m >= 5 && m <= 15) {
        assertThat(t.get("operatingConditionSource").asString())
            .as("minute %d", m)
            .isEqualTo("MEASURED");
        assertThat(t.get("measuredDrumPressureMPa").asDouble()).isEqualTo(10.0);
        assertThat(Instant.parse(t.get("measuredAt").asString())).isEqualTo(t0.plusSeconds(300));
        assertThat(t.get("temperatureCel").asDouble())
            .as("T_s(10 MPa), IF97 Table 35")
            .isCloseTo(SATURATION_10_MPA_K - 273.15, within(0.5e-6));
        assertThat(t.get("basis").asString()).isEqualTo("LIQUID");
      } else {
        assertThat(t.get("operatingConditionSource").asString())
            .as("minute %d", m)
            .isEqualTo("CONFIGURED");
        assertThat(t.get("measuredDrumPressureMPa").isNull()).isTrue();
        assertThat(t.get("temperatureCel").asDouble()).isCloseTo(330, within(1e-9));
      }
      if (m > 15) {
        assertThat(e.get("notes").toString())
            .contains("drum_pressure 10.0 MPa")
            .contains("older than PT10M");
      }
    }
    // same chemistry, another temperature: the pH at temperature moves with it, and the neutral
    // pH is that of saturated water at T_s(10 MPa) (the model's IF97 water and R11-07 pKw)
    JsonNode measured = after.get(t0.plusSeconds(9 * 60)).get("t");
    assertThat(measured.get("ph").asDouble())
        .isNotCloseTo(configured9.get("ph").asDouble(), within(0.005));
    double neutral =
        Water.atSaturation(
                measured.get("temperatureCel").asDouble() + 273.15, IonizationFormulation.R11_07)
            .neutralPh();
    assertThat(measured.get("neutralPh").asDouble()).isCloseTo(neutral, within(1e-9));
    assertThat(measured.get("neutralPh").asDouble())
        .isNotCloseTo(configured9.get("neutralPh").asDouble(), within(0.005));
  }

  @Test
  void processValuesAreReadingsInTheirCanonicalUnits() {
    Instant t = Instant.now().truncatedTo(ChronoUnit.MINUTES).minus(5, ChronoUnit.MINUTES);
    JsonNode outcome =
        post(
            List.of(
                reading(cpd, "load", t, 250000, "kW", ""),
                reading(cpd, "feedwater_flow", t, 612, "t/h", ""),
                reading(cpd, "steam_flow", t, 170, "kg/s", ""),
                reading(cpd, "make_up_flow", t, 1.5, "kg/s", ""),
                reading(cpd, "operating_state", t, 1, "{state}", "")));
    assertThat(outcome.get("inserted").asInt()).isEqualTo(5);
    HttpResponse<String> bad =
        http.post(
            "/api/v1/readings",
            "application/json",
            "{\"readings\":[" + reading(cpd, "operating_state", t, 1.5, "{state}", "") + "]}");
    assertThat(bad.statusCode()).isEqualTo(400);
    assertThat(bad.body()).contains("not a state code");
    HttpResponse<String> series =
        http.get(
            "/api/v1/sample-points/"
                + cpd
                + "/series?parameter=feedwater_flow&from="
                + t.minusSeconds(60)
                + "&to="
                + t.plusSeconds(60));
    assertThat(series.statusCode()).as(series.body()).isEqualTo(200);
    assertThat(series.body()).contains("170");
  }

  /** A process value in a lab CSV is refused: the historian sends it as an online reading. */
  @Test
  void aLabCsvWithAProcessValueIsRefused() {
    Instant t = Instant.now().truncatedTo(ChronoUnit.MINUTES).minusSeconds(3600);
    HttpResponse<String> r =
        http.post(
            "/api/v1/lab-results",
            "text/csv",
            "sample_point,parameter,time,value,unit,source,sample_id\n"
                + drum
                + ",drum_pressure,"
                + t
                + ",16,MPa,lab,L-1\n"
                + drum
                + ",silica,"
                + t
                + ",4,ug/kg,lab,L-1\n");
    assertThat(r.statusCode()).as(r.body()).isEqualTo(400);
    assertThat(r.body()).contains("drum_pressure is a process value").doesNotContain("silica");
  }

  private void ingestCationConductivity(Instant day) {
    List<String> readings = new ArrayList<>();
    for (int m = 0; m < 720; m += 5) {
      double v = m < 240 ? 0.5 : m >= 480 && m < 540 ? 0.30 : 0.08;
      readings.add(reading(cpd, "cation_conductivity", day.plusSeconds(60L * m), v, "uS/cm", ""));
    }
    post(readings);
  }

  /**
   * The historian reports start-up (2) every 30 minutes from 00:00 and in service (1) from 06:00;
   * the chemist enters START_UP at 06:00, which wins over the historian's reading of the same
   * instant; the historian's next reading (06:30) puts the block in service. By hand: start-up
   * 00:00–06:30 (6.5 h), in service 06:30–12:00 (5.5 h). Cation conductivity 0.5 µS/cm (AL2)
   * 00:00–04:00, 0.30 (AL1) 08:00–09:00, 0.08 otherwise: in service AL2 0 h, AL1 1 h, NORMAL 4.5 h.
   */
  @Test
  void historianStatesCountForHoursInServiceAndTheChemistWinsAtTheSameInstant() {
    Instant day = Instant.now().truncatedTo(ChronoUnit.DAYS).minus(2, ChronoUnit.DAYS);
    List<String> states = new ArrayList<>();
    for (int m = 0; m < 720; m += 30) {
      // the historian sends the state at the drum point: any point of the block counts
      states.add(
          reading(
              drum, "operating_state", day.plusSeconds(60L * m), m < 360 ? 2 : 1, "{state}", ""));
    }
    post(states);
    HttpResponse<String> entry =
        http.post(
            "/api/v1/plants/" + plant + "/blocks/B1/operating-states",
            "application/json",
            "{\"state\":\"START_UP\",\"since\":\"%s\",\"note\":\"still warming\"}"
                .formatted(day.plus(6, ChronoUnit.HOURS)));
    assertThat(entry.statusCode()).as(entry.body()).isEqualTo(201);
    ingestCationConductivity(day);
    String window = "from=" + day + "&to=" + day.plus(12, ChronoUnit.HOURS);

    JsonNode timeline =
        JSON.readTree(
            http.get("/api/v1/plants/" + plant + "/blocks/B1/operating-states?" + window).body());
    assertThat(timeline.get("timeline")).hasSize(2);
    JsonNode startUp = timeline.get("timeline").get(0);
    assertThat(startUp.get("state").asString()).isEqualTo("START_UP");
    assertThat(startUp.get("source").asString()).isEqualTo("HISTORIAN");
    assertThat(startUp.get("hours").asDouble()).isEqualTo(6.5);
    JsonNode inService = timeline.get("timeline").get(1);
    assertThat(inService.get("state").asString()).isEqualTo("IN_SERVICE");
    assertThat(inService.get("source").asString()).isEqualTo("HISTORIAN");
    assertThat(inService.get("start").asString()).isEqualTo(day.plusSeconds(390 * 60).toString());
    assertThat(timeline.get("hoursCountedInService").asDouble()).isEqualTo(5.5);

    HttpResponse<String> r =
        http.get(
            "/api/v1/excursions/monthly-hours?samplePoint="
                + cpd
                + "&parameter=cation_conductivity&"
                + window);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    Map<String, Double> hours = new HashMap<>();
    for (JsonNode row : JSON.readTree(r.body())) {
      hours.merge(row.get("level").asString(), row.get("hours").asDouble(), Double::sum);
    }
    assertThat(hours.getOrDefault("AL2", 0.0)).isZero();
    assertThat(hours.get("AL1")).isCloseTo(1.0, within(1e-9));
    assertThat(hours.get("NORMAL")).isCloseTo(4.5, within(1e-9));

    JsonNode hold =
        JSON.readTree(
            http.get(
                    "/api/v1/plants/"
                        + plant
                        + "/blocks/B1/hold-points?at="
                        + day.plus(3, ChronoUnit.HOURS))
                .body());
    assertThat(hold.get("state").asString()).isEqualTo("START_UP");
  }
}
