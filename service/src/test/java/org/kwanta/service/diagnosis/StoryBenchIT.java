package org.kwanta.service.diagnosis;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpResponse;
import java.time.Duration;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.TreeSet;
import java.util.function.DoubleUnaryOperator;
import org.junit.jupiter.api.Test;
import org.kwanta.model.conductivity.AlkalizerMix;
import org.kwanta.model.conductivity.Conductivity;
import org.kwanta.model.conductivity.Equilibria;
import org.kwanta.model.conductivity.Solutes;
import org.kwanta.model.conductivity.SolutionModel;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.model.water.Water;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.springframework.boot.test.web.server.LocalServerPort;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The story bench through the real path: invented plants (demo and test data only) declared over
 * the API, a day of minute readings before each fault sent through {@code POST /api/v1/readings},
 * the evaluations computed by the ingest, and the diagnosis read back from {@code GET .../findings}
 * and {@code GET .../state}; the what-if endpoint must give the same findings without storing
 * anything. Readings are generated from the engine's solution model, so healthy channels agree with
 * each other; noise is seeded. Targets: the right finding at the right point, no wrong blame,
 * process events and steps within 15 min, a drift within 6 h, nothing on a quiet day.
 */
@DatabaseTest
class StoryBenchIT {

  static final double MG_NH3 = 1.0 / 17.031 / 1000;
  static final double UG_CL = 1.0 / 35.453 / 1e6;
  static final double UG_NA = 1.0 / 22.98977 / 1e6;
  static final double UG_CO2 = 1.0 / 44.009 / 1e6;

  static final SolutionModel M25 =
      new SolutionModel(
          Conductivity.at(
              Water.at(298.15, Water.ATMOSPHERIC_PRESSURE_PA, IonizationFormulation.R11_07)),
          Equilibria.of(
              Water.at(298.15, Water.ATMOSPHERIC_PRESSURE_PA, IonizationFormulation.R11_07)),
          AlkalizerMix.AMMONIA);

  static final JsonMapper JSON = JsonMapper.builder().build();

  @LocalServerPort int port;

  /** Minutes of baseline before the fault. */
  static final int BASELINE_MINUTES = 26 * 60;

  interface Composition {
    Solutes at(double hours, double swing);
  }

  record PointSpec(
      String id,
      String upstream,
      boolean sc,
      boolean degassed,
      boolean ph,
      boolean sodium,
      Composition composition,
      String fault,
      double rate) {}

  record Story(
      String plant,
      String name,
      List<PointSpec> points,
      String target,
      String code,
      String pointsAt,
      int faultMinutes,
      Duration within) {}

  static Solutes feedwater(double nh3, double swing) {
    return new Solutes(
        nh3 * (1 + 0.04 * swing) * MG_NH3, 0.3 * UG_NA, 1.5 * UG_CL, 0, 6 * UG_CO2, 0);
  }

  static DoubleUnaryOperator ramp(double from, double to, double hours) {
    return h -> h <= 0 ? from : h >= hours ? to : from + (to - from) * h / hours;
  }

  static Story leak() {
    DoubleUnaryOperator na = ramp(0, 8, 1);
    // brackish water: sea-salt proportions, Millero et al. 2008 (Cl 1.16398 + Br 0.0018, SO4
    // 0.06021
    // mol per mol Na)
    Composition c =
        (h, sw) -> {
          Solutes b = feedwater(1.0, sw);
          double n = na.applyAsDouble(h) * UG_NA;
          return new Solutes(
              b.alkalizer(),
              b.sodium() + n,
              b.chloride() + n * 1.16578,
              n * 0.06021,
              b.carbonate(),
              0);
        };
    return new Story(
        "bench-leak",
        "condenser leak, brackish water",
        List.of(
            new PointSpec("BL-CPD", null, true, false, false, true, c, "none", 0),
            new PointSpec("BL-ECO", "BL-CPD", true, true, true, false, c, "none", 0)),
        "BL-CPD",
        "COOLING_WATER_INGRESS",
        "process",
        120,
        Duration.ofMinutes(15));
  }

  static Story column() {
    Composition c = (h, sw) -> feedwater(1.0, sw);
    return new Story(
        "bench-column",
        "cation column exhaustion",
        List.of(
            new PointSpec("BC-SAT", null, false, false, false, true, c, "none", 0),
            new PointSpec("BC-MS", "BC-SAT", false, true, false, true, c, "column", 0.01),
            new PointSpec("BC-RH", "BC-MS", false, true, false, true, c, "none", 0)),
        "BC-MS",
        "CATION_COLUMN_EXHAUSTED",
        "cation_conductivity",
        240,
        Duration.ofHours(3));
  }

  static Story drift() {
    Composition c = (h, sw) -> feedwater(1.0, sw);
    return new Story(
        "bench-drift",
        "pH electrode drift -0.03 pH/h",
        List.of(
            new PointSpec("BD-CPD", null, true, false, false, true, c, "none", 0),
            new PointSpec("BD-ECO", "BD-CPD", true, true, true, false, c, "phdrift", 0.03)),
        "BD-ECO",
        "PH_ELECTRODE_DRIFT",
        "ph",
        420,
        Duration.ofHours(6));
  }

  static Story air() {
    DoubleUnaryOperator co2 = ramp(6, 250, 0.5);
    Composition c =
        (h, sw) -> {
          Solutes b = feedwater(1.0, sw);
          return new Solutes(
              b.alkalizer(), b.sodium(), b.chloride(), 0, co2.applyAsDouble(h) * UG_CO2, 0);
        };
    return new Story(
        "bench-air",
        "air in-leakage",
        List.of(
            new PointSpec("BA-CPD", null, true, true, false, true, c, "none", 0),
            new PointSpec("BA-ECO", "BA-CPD", true, true, true, false, c, "none", 0)),
        "BA-CPD",
        "CARBON_DIOXIDE_INGRESS",
        "process",
        90,
        Duration.ofMinutes(15));
  }

  static Story sodiumStep() {
    Composition c = (h, sw) -> feedwater(1.0, sw);
    return new Story(
        "bench-sodium",
        "sodium analyser step +5 ug/kg",
        List.of(
            new PointSpec("BS-CPD", null, true, false, false, true, c, "sodiumstep", 5),
            new PointSpec("BS-ECO", "BS-CPD", true, true, true, false, c, "none", 0)),
        "BS-CPD",
        "SODIUM_WITHOUT_CATION_RISE",
        "sodium",
        90,
        Duration.ofMinutes(15));
  }

  static Story quiet() {
    Composition c = (h, sw) -> feedwater(1.2, sw);
    return new Story(
        "bench-quiet",
        "quiet day",
        List.of(
            new PointSpec("BQ-CPD", null, true, false, false, true, c, "none", 0),
            new PointSpec("BQ-ECO", "BQ-CPD", true, true, true, false, c, "none", 0)),
        null,
        null,
        null,
        240,
        Duration.ZERO);
  }

  static String declaration(Story s) {
    StringBuilder b = new StringBuilder();
    b.append("{\"id\":\"")
        .append(s.plant())
        .append("\",\"name\":\"Story bench (invented)\",\"coolingWater\":\"BRACKISH\",")
        .append("\"blocks\":[{\"id\":\"U\",\"name\":\"Bench unit\"}],\"samplePoints\":[");
    for (int i = 0; i < s.points().size(); i++) {
      PointSpec p = s.points().get(i);
      b.append(i == 0 ? "" : ",")
          .append("{\"id\":\"")
          .append(p.id())
          .append("\",\"block\":\"U\",\"name\":\"")
          .append(p.id())
          .append("\",\"cycleLocation\":\"FEEDWATER\",\"treatmentRegime\":\"AVT(O)\",")
          .append("\"operatingTemperatureCel\":150")
          .append(p.upstream() == null ? "" : ",\"upstream\":[\"" + p.upstream() + "\"]")
          .append("}");
    }
    return b.append("]}").toString();
  }

  /** The readings of a story as JSON batches. */
  static List<String> batches(Story s, Instant start, long seed) {
    Random random = new Random(seed);
    List<String> out = new ArrayList<>();
    StringBuilder batch = new StringBuilder();
    int count = 0;
    int minutes = BASELINE_MINUTES + s.faultMinutes();
    for (int m = 0; m < minutes; m++) {
      Instant t = start.plus(Duration.ofMinutes(m));
      double hours = (m - BASELINE_MINUTES) / 60.0;
      double swing = Math.sin(2 * Math.PI * m / 1440.0);
      for (PointSpec p : s.points()) {
        Solutes x = p.composition().at(hours, swing);
        double sc = M25.solve(x).kappa() * (1 + 0.004 * random.nextGaussian());
        double cation =
            M25.solve(new Solutes(0, 0, x.chloride(), x.sulfate(), x.carbonate(), 0)).kappa()
                + 0.002 * random.nextGaussian();
        double degassed =
            M25.solve(new Solutes(0, 0, x.chloride(), x.sulfate(), 0, 0)).kappa()
                + 0.002 * random.nextGaussian();
        double ph = M25.solve(x).pH() + 0.01 * random.nextGaussian();
        double sodium = x.sodium() / UG_NA * (1 + 0.03 * random.nextGaussian()) + 0.02;
        double after = Math.max(0, hours);
        switch (p.fault()) {
          case "phdrift" -> ph -= p.rate() * after;
          case "sodiumstep" -> sodium += hours >= 0 ? p.rate() : 0;
          case "column" -> {
            double leak = p.rate() * after * M25.solve(x).kappa();
            cation += leak;
            degassed += leak;
          }
          default -> {}
        }
        List<String> rows = new ArrayList<>();
        if (p.sc()) {
          rows.add(reading(p.id(), "specific_conductivity", t, sc, "uS/cm", true));
        }
        rows.add(reading(p.id(), "cation_conductivity", t, cation, "uS/cm", true));
        if (p.degassed()) {
          rows.add(reading(p.id(), "degassed_cation_conductivity", t, degassed, "uS/cm", true));
        }
        if (p.ph()) {
          rows.add(reading(p.id(), "ph", t, ph, "[pH]", false));
        }
        if (p.sodium()) {
          rows.add(reading(p.id(), "sodium", t, sodium, "ug/kg", false));
        }
        for (String r : rows) {
          batch.append(count == 0 ? "" : ",").append(r);
          if (++count == 5000) {
            out.add("{\"readings\":[" + batch + "]}");
            batch.setLength(0);
            count = 0;
          }
        }
      }
    }
    if (count > 0) {
      out.add("{\"readings\":[" + batch + "]}");
    }
    return out;
  }

  private static String reading(
      String point, String parameter, Instant t, double value, String unit, boolean compensated) {
    return String.format(
        Locale.ROOT,
        "{\"samplePoint\":\"%s\",\"parameter\":\"%s\",\"time\":\"%s\",\"value\":%.6g,\"unit\":\"%s\"%s}",
        point,
        parameter,
        t,
        value,
        unit,
        compensated ? ",\"compensated\":true" : "");
  }

  record Row(String story, String expected, String detected, String wrong) {}

  @Test
  void storiesThroughTheIngestPathAreDiagnosedRight() throws Exception {
    Http http = Http.admin(port);
    List<Story> stories = List.of(leak(), column(), drift(), air(), sodiumStep(), quiet());
    List<Row> rows = new ArrayList<>();
    List<String> failures = new ArrayList<>();
    long seed = 7;
    for (Story s : stories) {
      HttpResponse<String> declared =
          http.send("PUT", "/api/v1/plants/" + s.plant(), "application/json", declaration(s));
      assertThat(declared.statusCode()).as(declared.body()).isIn(200, 201);
      Instant end = Instant.now().truncatedTo(ChronoUnit.MINUTES).minus(Duration.ofMinutes(1));
      Instant start = end.minus(Duration.ofMinutes(BASELINE_MINUTES + s.faultMinutes() - 1));
      Instant faultStart = start.plus(Duration.ofMinutes(BASELINE_MINUTES));
      for (String batch : batches(s, start, seed++)) {
        HttpResponse<String> r = http.post("/api/v1/readings", "application/json", batch);
        assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
      }
      Instant detected = null;
      TreeSet<String> wrong = new TreeSet<>();
      for (PointSpec p : s.points()) {
        JsonNode f =
            JSON.readTree(
                http.get(
                        "/api/v1/sample-points/"
                            + p.id()
                            + "/findings?from="
                            + faultStart
                            + "&to="
                            + end)
                    .body());
        for (JsonNode m : f.get("minutes")) {
          for (JsonNode finding : m.get("findings")) {
            String code = finding.get("code").asString();
            String at = finding.get("pointsAt").asString();
            boolean right =
                p.id().equals(s.target()) && code.equals(s.code()) && at.equals(s.pointsAt());
            if (right) {
              if (detected == null) {
                detected = Instant.parse(m.get("time").asString());
              }
            } else if (s.code() == null
                || !at.equals("process")
                || !s.pointsAt().equals("process")) {
              if (s.code() == null || !at.equals(s.pointsAt())) {
                wrong.add(p.id() + ":" + code + "/" + at);
              }
            }
          }
        }
      }
      Duration after = detected == null ? null : Duration.between(faultStart, detected);
      rows.add(
          new Row(
              s.name(),
              s.code() == null ? "none" : s.code() + " -> " + s.pointsAt(),
              s.code() == null ? "-" : after == null ? "NO" : after.toMinutes() + " min",
              wrong.isEmpty() ? "none" : String.join(" ", wrong)));
      if (s.code() != null && (after == null || after.compareTo(s.within()) > 0)) {
        failures.add(s.name() + ": detected after " + after);
      }
      if (!wrong.isEmpty()) {
        failures.add(s.name() + ": wrong " + wrong);
      }
      if (s.code() != null) {
        // the current state shows it too, and the what-if endpoint agrees on the latest minute
        JsonNode state =
            JSON.readTree(http.get("/api/v1/sample-points/" + s.target() + "/state").body());
        List<String> now = new ArrayList<>();
        state.get("diagnosis").get("findings").forEach(x -> now.add(x.get("code").asString()));
        if (!now.contains(s.code())) {
          failures.add(s.name() + ": state shows " + now);
        }
      }
    }
    StringBuilder table =
        new StringBuilder("\nStory bench through the ingest path (invented data)\n");
    for (Row r : rows) {
      table.append(
          String.format(
              Locale.ROOT,
              "| %-32s | %-46s | %-8s | %s |%n",
              r.story(),
              r.expected(),
              r.detected(),
              r.wrong()));
    }
    System.out.println(table);
    assertThat(failures).isEmpty();
  }

  @Test
  void whatIfDiagnosesPostedReadingsAndStoresNothing() throws Exception {
    Http http = Http.admin(port);
    Story s =
        new Story(
            "bench-whatif",
            "condenser leak, what-if",
            List.of(
                new PointSpec(
                    "BW-CPD",
                    null,
                    true,
                    false,
                    false,
                    true,
                    leak().points().get(0).composition(),
                    "none",
                    0),
                new PointSpec(
                    "BW-ECO",
                    "BW-CPD",
                    true,
                    true,
                    true,
                    false,
                    leak().points().get(0).composition(),
                    "none",
                    0)),
            "BW-CPD",
            "COOLING_WATER_INGRESS",
            "process",
            60,
            Duration.ofMinutes(15));
    assertThat(
            http.send("PUT", "/api/v1/plants/" + s.plant(), "application/json", declaration(s))
                .statusCode())
        .isIn(200, 201);
    Instant end = Instant.now().truncatedTo(ChronoUnit.MINUTES).minus(Duration.ofMinutes(1));
    Instant start = end.minus(Duration.ofMinutes(BASELINE_MINUTES + s.faultMinutes() - 1));
    List<String> batches = batches(s, start, 99);
    // one request with every reading (the what-if takes a window, up to the batch limit)
    List<String> all = new ArrayList<>();
    for (String b : batches) {
      all.add(b.substring("{\"readings\":[".length(), b.length() - 2));
    }
    String body = "{\"readings\":[" + String.join(",", all) + "]}";
    long readings = body.chars().filter(ch -> ch == '{').count() - 1;
    if (readings > 10_000) {
      // keep to the batch limit: the last 10,000 readings are enough for the last hours
      List<String> parts = List.of(String.join(",", all).split("(?<=\\}),(?=\\{)"));
      body =
          "{\"readings\":["
              + String.join(",", parts.subList(parts.size() - 10_000, parts.size()))
              + "]}";
    }
    HttpResponse<String> r =
        http.post("/api/v1/sample-points/BW-CPD/diagnosis", "application/json", body);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    JsonNode answer = JSON.readTree(r.body());
    List<String> codes = new ArrayList<>();
    answer
        .get("minutes")
        .forEach(m -> m.get("diagnosis").forEach(f -> codes.add(f.get("code").asString())));
    assertThat(codes)
        .contains("COOLING_WATER_INGRESS")
        .doesNotContain("SODIUM_WITHOUT_CATION_RISE");
    // nothing stored
    HttpResponse<String> state = http.get("/api/v1/sample-points/BW-CPD/state");
    assertThat(JSON.readTree(state.body()).get("evaluation").isNull()).isTrue();
  }
}
