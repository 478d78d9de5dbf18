package org.kwanta.service.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;
import java.util.TreeMap;
import java.util.function.Supplier;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.jdbc.core.JdbcTemplate;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ArrayNode;
import tools.jackson.databind.node.ObjectNode;

/**
 * Seeded random and mutated payloads against {@code POST /api/v1/readings} (JSON and CSV) and
 * {@code POST /api/v1/plants}. For every request: never a 5xx; and when refused, nothing stored
 * (the row counts of readings, revisions, plants, blocks and sample points are unchanged). The
 * random seed is fixed so a failure reproduces; {@code -Dkwanta.fuzz.seed=<n>} and {@code
 * -Dkwanta.fuzz.cases=<n>} explore further.
 */
@DatabaseTest
class IngestFuzzIT {

  private static final Logger log = LoggerFactory.getLogger(IngestFuzzIT.class);
  private static final JsonMapper JSON = JsonMapper.builder().build();
  private static final long SEED = Long.getLong("kwanta.fuzz.seed", 20261201L);
  private static final int CASES = Integer.getInteger("kwanta.fuzz.cases", 300);

  private static final String[][] PARAMETERS = {
    {"specific_conductivity", "uS/cm", "5.4"},
    {"cation_conductivity", "uS/cm", "0.08"},
    {"degassed_cation_conductivity", "uS/cm", "0.06"},
    {"ph", "[pH]", "9.6"},
    {"sodium", "ug/kg", "0.4"}
  };

  /** Replacement values a mutation puts in place of a field. */
  private static final List<Supplier<Object>> ODD_VALUES =
      List.of(
          () -> null,
          () -> "",
          () -> "x".repeat(70_000),
          () -> "a\u0000b",
          () -> "\u0007\u001b[31m",
          () -> "NaN",
          () -> "Infinity",
          () -> "-1e400",
          () -> 1e308,
          () -> -1e308,
          () -> 4.9e-324,
          () -> -5.0,
          () -> 1e12,
          () -> 0,
          () -> Long.MAX_VALUE,
          () -> true,
          () -> List.of(1, 2),
          () -> Map.of("nested", "object"),
          () -> "2026-13-01T00:00:00Z",
          () -> "2026-11-30T10:00:00",
          () -> "9999-12-31T23:59:59Z",
          () -> "1970-01-01T00:00:00Z",
          () -> "2026-06-30T23:59:60Z",
          () -> "+275760-09-13T00:00:00Z",
          () -> "U1-ECO-IN",
          () -> "mS/m",
          () -> "uncertain",
          () -> "\uD800",
          () -> "é🙂漢字");

  @LocalServerPort int port;
  @Autowired JdbcTemplate jdbc;
  Http http;
  Random random;
  List<String> points;
  final Map<String, Integer> statuses = new TreeMap<>();
  final List<String> failures = new ArrayList<>();
  int sent;

  @BeforeEach
  void setUp() {
    http = Http.admin(port);
    random = new Random(SEED);
    points = TestPlants.feedwaterPoints(http, 3);
  }

  @Test
  void mutatedPayloadsNeverCause5xxOrPartialWrites() {
    for (int i = 0; i < CASES; i++) {
      byte[] json = mutateJson(validJsonBatch());
      send("/api/v1/readings", random.nextInt(20) == 0 ? "text/csv" : "application/json", json);
      send("/api/v1/readings", "text/csv", mutateCsv(validCsvBatch()));
      send("/api/v1/plants", "application/json", mutateJson(validPlant()));
    }
    log.info(
        "Fuzz (seed {}): {} requests (JSON batches, CSV batches, plant declarations), statuses {}",
        SEED,
        sent,
        statuses);
    assertThat(failures).as("fuzz failures (seed " + SEED + ")").isEmpty();
    assertThat(statuses.keySet()).as("some valid payloads got through").contains("200");
  }

  private void send(String path, String contentType, byte[] body) {
    long[] before = counts();
    HttpResponse<String> r =
        http.send(
            HttpRequest.newBuilder(http.uri(path))
                .header("Content-Type", contentType)
                .POST(HttpRequest.BodyPublishers.ofByteArray(body)));
    sent++;
    statuses.merge(Integer.toString(r.statusCode()), 1, Integer::sum);
    String sample = new String(body, 0, Math.min(body.length, 300), StandardCharsets.UTF_8);
    if (r.statusCode() >= 500) {
      failures.add(
          r.statusCode() + " for " + path + " " + contentType + ": " + sample + " -> " + r.body());
    } else if (r.statusCode() >= 300) {
      long[] after = counts();
      if (!java.util.Arrays.equals(before, after)) {
        failures.add(
            "partial write on "
                + r.statusCode()
                + " for "
                + path
                + ": "
                + java.util.Arrays.toString(before)
                + " -> "
                + java.util.Arrays.toString(after)
                + " body "
                + sample);
      }
      if (!r.headers()
          .firstValue("Content-Type")
          .orElse("")
          .startsWith("application/problem+json")) {
        failures.add(r.statusCode() + " without problem details for " + path + ": " + sample);
      }
    }
  }

  private long[] counts() {
    return jdbc.queryForObject(
        // every write of a point's readings (new, corrected or replaced) moves its generation;
        // cheaper than counting every reading the other tests in this database stored
        "SELECT (SELECT coalesce(sum(generation), 0) FROM reading_head),"
            + " (SELECT count(*) FROM reading_revision),"
            + " (SELECT count(*) FROM plant), (SELECT count(*) FROM plant_block),"
            + " (SELECT count(*) FROM sample_point)",
        (rs, i) ->
            new long[] {rs.getLong(1), rs.getLong(2), rs.getLong(3), rs.getLong(4), rs.getLong(5)});
  }

  // ---- valid payloads

  private Instant time() {
    return Instant.now()
        .truncatedTo(ChronoUnit.SECONDS)
        .minusSeconds(60 + random.nextInt(7 * 24 * 3600));
  }

  private ObjectNode validJsonBatch() {
    ObjectNode root = JSON.createObjectNode();
    ArrayNode readings = root.putArray("readings");
    int n = 1 + random.nextInt(20);
    for (int i = 0; i < n; i++) {
      String[] p = PARAMETERS[random.nextInt(PARAMETERS.length)];
      ObjectNode r = readings.addObject();
      r.put("samplePoint", points.get(random.nextInt(points.size())));
      r.put("parameter", p[0]);
      r.put("time", time().toString());
      r.put("value", Double.parseDouble(p[2]) * (0.8 + 0.4 * random.nextDouble()));
      r.put("unit", p[1]);
      if (random.nextBoolean()) {
        r.put("quality", random.nextBoolean() ? "good" : "uncertain");
      }
    }
    return root;
  }

  private String validCsvBatch() {
    StringBuilder csv = new StringBuilder("sample_point,parameter,time,value,unit\r\n");
    int n = 1 + random.nextInt(20);
    for (int i = 0; i < n; i++) {
      String[] p = PARAMETERS[random.nextInt(PARAMETERS.length)];
      csv.append(points.get(random.nextInt(points.size())))
          .append(',')
          .append(p[0])
          .append(',')
          .append(time())
          .append(',')
          .append(
              String.format(
                  Locale.ROOT,
                  "%.4f",
                  Double.parseDouble(p[2]) * (0.8 + 0.4 * random.nextDouble())))
          .append(',')
          .append(p[1])
          .append("\r\n");
    }
    return csv.toString();
  }

  private ObjectNode validPlant() {
    String id = "fuzz-" + Long.toString(random.nextLong() & Long.MAX_VALUE, 36);
    ObjectNode plant = JSON.createObjectNode();
    plant.put("id", id);
    plant.put("name", "Fuzz plant");
    plant.putArray("blocks").addObject().put("id", "U1").put("name", "Unit 1");
    ArrayNode sps = plant.putArray("samplePoints");
    for (int i = 0; i < 1 + random.nextInt(3); i++) {
      ObjectNode sp = sps.addObject();
      sp.put("id", id.toUpperCase(Locale.ROOT) + "-SP" + i);
      sp.put("block", "U1");
      sp.put("name", "Fuzz point " + i);
      sp.put("cycleLocation", "FEEDWATER");
      sp.put("treatmentRegime", "AVT(O)");
      sp.put("operatingTemperatureCel", 155);
      sp.put("operatingPressureMPa", 15);
    }
    return plant;
  }

  // ---- mutations

  private byte[] mutateJson(ObjectNode valid) {
    int kind = random.nextInt(12);
    if (kind == 0) {
      return JSON.writeValueAsBytes(valid); // unchanged: the valid path must keep working
    }
    if (kind <= 5) {
      for (int m = 0; m < 1 + random.nextInt(3); m++) {
        mutateTree(valid);
      }
      return JSON.writeValueAsBytes(valid);
    }
    byte[] text = JSON.writeValueAsBytes(valid);
    return mutateBytes(text, kind);
  }

  /** Changes one field somewhere in the tree: removed, replaced by an odd value, or added. */
  private void mutateTree(ObjectNode root) {
    List<ObjectNode> objects = new ArrayList<>();
    collectObjects(root, objects);
    ObjectNode target = objects.get(random.nextInt(objects.size()));
    List<String> names = new ArrayList<>(target.propertyNames());
    int action = random.nextInt(4);
    if (action == 0 && !names.isEmpty()) {
      target.remove(names.get(random.nextInt(names.size())));
    } else if (action == 1) {
      target.set("unexpected" + random.nextInt(3), JSON.valueToTree(odd()));
    } else if (action == 2 && target.has("readings") && target.get("readings").size() > 0) {
      ArrayNode readings = (ArrayNode) target.get("readings");
      JsonNode first = readings.get(0);
      int copies = random.nextBoolean() ? 10_001 : 1 + random.nextInt(5);
      for (int i = 0; i < copies; i++) {
        readings.add(first.deepCopy());
      }
    } else if (!names.isEmpty()) {
      target.set(names.get(random.nextInt(names.size())), JSON.valueToTree(odd()));
    }
  }

  private static void collectObjects(JsonNode node, List<ObjectNode> out) {
    if (node instanceof ObjectNode o) {
      out.add(o);
    }
    for (JsonNode child : node) {
      collectObjects(child, out);
    }
  }

  private Object odd() {
    return ODD_VALUES.get(random.nextInt(ODD_VALUES.size())).get();
  }

  private byte[] mutateCsv(String valid) {
    int kind = random.nextInt(14);
    String csv =
        switch (kind) {
          case 0 -> valid;
          case 1 -> valid.substring(valid.indexOf('\n') + 1); // no header
          case 2 -> valid.replace("value,unit", "unit,value"); // columns swapped
          case 3 -> valid.replaceFirst("\r\n", ",extra\r\n"); // unknown column
          case 4 -> valid.replace(",", ";");
          case 5 -> "\uFEFF" + valid.replace("\r\n", "\r");
          case 6 -> valid.replaceFirst("(\r\n[^,]*),", "$1,\"unbalanced,");
          case 7 -> valid + valid.substring(valid.indexOf('\n') + 1).repeat(600); // > 10,000 rows
          case 8 -> valid.replaceAll(",(\\d+\\.\\d+),", random.nextBoolean() ? ",NaN," : ",1e400,");
          case 9 -> valid.replaceFirst("\r\n([^,]*),([^,]*),([^,]*),", "\r\n$1,$2,,");
          case 10 -> valid + "U1-ECO-IN,ph,\"" + "9".repeat(100_000) + "\",1,[pH]\r\n";
          case 11 -> valid.replace("\r\n", "\r\n\u0000");
          default -> null;
        };
    byte[] bytes = (csv == null ? valid : csv).getBytes(StandardCharsets.UTF_8);
    return csv == null ? mutateBytes(bytes, 6 + random.nextInt(6)) : bytes;
  }

  /** Byte-level damage: truncation, flipped bytes, invalid UTF-8, inserted garbage, nesting. */
  private byte[] mutateBytes(byte[] text, int kind) {
    byte[] out = text.clone();
    switch (kind % 6) {
      case 0 -> out = java.util.Arrays.copyOf(out, random.nextInt(Math.max(1, out.length)));
      case 1 -> {
        for (int i = 0; i < 1 + random.nextInt(5); i++) {
          out[random.nextInt(out.length)] = (byte) random.nextInt(256);
        }
      }
      case 2 -> out[random.nextInt(out.length)] = (byte) 0xC3; // a lone UTF-8 lead byte
      case 3 -> {
        int at = random.nextInt(out.length);
        String garbage =
            List.of("{", "}", "[", "]", ",", ":", "\"", "\\", "NaN", "null")
                .get(random.nextInt(10));
        byte[] g = garbage.getBytes(StandardCharsets.UTF_8);
        byte[] joined = new byte[out.length + g.length];
        System.arraycopy(out, 0, joined, 0, at);
        System.arraycopy(g, 0, joined, at, g.length);
        System.arraycopy(out, at, joined, at + g.length, out.length - at);
        out = joined;
      }
      case 4 -> out = ("[".repeat(5_000) + "]".repeat(5_000)).getBytes(StandardCharsets.UTF_8);
      default -> out = new byte[0];
    }
    return out;
  }
}
