package org.kwanta.service.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpResponse;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.springframework.boot.test.web.server.LocalServerPort;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * No lenient input (issue 17, fault 6): numbers as strings, repeated JSON fields and Java-only
 * number forms in CSV are refused with a 400 naming the field or line; a CSV byte-order mark is
 * accepted; every CSV rejection gives the line of the file. Also fault 5: the same value in another
 * unit is unchanged, not a correction.
 */
@DatabaseTest
class StrictInputIT {

  private static final JsonMapper JSON = JsonMapper.builder().build();
  private static final String POINT = "U1-ECO-IN"; // fictional Brackenmoor demo plant

  @LocalServerPort int port;

  private static String time(int minutesAgo) {
    return Instant.now().truncatedTo(ChronoUnit.MINUTES).minus(minutesAgo, ChronoUnit.MINUTES) + "";
  }

  private HttpResponse<String> json(String body) {
    return Http.admin(port).post("/api/v1/readings", "application/json", body);
  }

  private HttpResponse<String> csv(String body) {
    return Http.admin(port).post("/api/v1/readings", "text/csv", body);
  }

  private String reading(String value, String extra) {
    return "{\"readings\":[{\"samplePoint\":\""
        + POINT
        + "\",\"parameter\":\"ph\",\"time\":\""
        + time(300)
        + "\",\"value\":"
        + value
        + ",\"unit\":\"[pH]\""
        + extra
        + "}]}";
  }

  @Test
  void numberAsStringIsRefusedNamingTheField() {
    HttpResponse<String> r = json(reading("\"9.6\"", ""));
    assertThat(r.statusCode()).as(r.body()).isEqualTo(400);
    assertThat(r.body()).contains("readings[0].value").contains("JSON number");
  }

  @Test
  void booleanAsStringOrNumberIsRefused() {
    String body =
        "{\"readings\":[{\"samplePoint\":\""
            + POINT
            + "\",\"parameter\":\"cation_conductivity\",\"time\":\""
            + time(301)
            + "\",\"value\":0.07,\"unit\":\"uS/cm\",\"compensated\":";
    for (String v : new String[] {"\"true\"", "1"}) {
      HttpResponse<String> r = json(body + v + "}]}");
      assertThat(r.statusCode()).as(r.body()).isEqualTo(400);
      assertThat(r.body()).contains("readings[0].compensated");
    }
  }

  @Test
  void repeatedFieldIsRefusedNamingIt() {
    HttpResponse<String> r = json(reading("9.6", ",\"value\":9.7"));
    assertThat(r.statusCode()).as(r.body()).isEqualTo(400);
    assertThat(r.body()).contains("\\\"value\\\" appears twice").contains("readings[0]");
  }

  @Test
  void csvHexAndSuffixedNumbersAreRefusedWithTheirLine() {
    String csv =
        "sample_point,parameter,time,value,unit\n"
            + POINT
            + ",ph,"
            + time(302)
            + ",9.6,[pH]\n\n"
            + POINT
            + ",ph,"
            + time(303)
            + ",0x1p3,[pH]\n"
            + POINT
            + ",ph,"
            + time(304)
            + ",9.6d,[pH]\n";
    HttpResponse<String> r = csv(csv);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(400);
    JsonNode rejected = JSON.readTree(r.body()).get("rejected");
    assertThat(rejected).hasSize(2);
    assertThat(rejected.get(0).get("index").asInt()).isEqualTo(1);
    assertThat(rejected.get(0).get("line").asInt()).isEqualTo(4); // after a blank line
    assertThat(rejected.get(0).get("field").asString()).isEqualTo("value");
    assertThat(rejected.get(0).get("reason").asString()).contains("0x1p3");
    assertThat(rejected.get(1).get("line").asInt()).isEqualTo(5);
  }

  @Test
  void csvRejectionFoundAfterParsingAlsoGivesTheLine() {
    String csv =
        "sample_point,parameter,time,value,unit\r\n"
            + POINT
            + ",ph,"
            + time(305)
            + ",9.6,[pH]\r\n"
            + "\"NOWHERE\",ph,"
            + time(305)
            + ",9.6,[pH]\r\n";
    HttpResponse<String> r = csv(csv);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(400);
    JsonNode rejected = JSON.readTree(r.body()).get("rejected");
    assertThat(rejected.get(0).get("field").asString()).isEqualTo("samplePoint");
    assertThat(rejected.get(0).get("line").asInt()).isEqualTo(3);
  }

  @Test
  void csvWithByteOrderMarkIsAccepted() {
    String csv =
        "\uFEFFsample_point,parameter,time,value,unit\n"
            + POINT
            + ",ph,"
            + time(306)
            + ",9.6,[pH]\n";
    HttpResponse<String> r = csv(csv);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    assertThat(r.body()).contains("\"received\":1");
  }

  @Test
  void jsonRejectionsCarryNoLine() {
    HttpResponse<String> r = json(reading("99", ""));
    assertThat(r.statusCode()).as(r.body()).isEqualTo(400);
    assertThat(r.body()).contains("\"rejected\"").doesNotContain("\"line\"");
  }

  @Test
  void sameValueInAnotherUnitIsUnchanged() {
    String t = time(307);
    String first =
        "{\"readings\":[{\"samplePoint\":\""
            + POINT
            + "\",\"parameter\":\"cation_conductivity\",\"time\":\""
            + t
            + "\",\"value\":0.07,\"unit\":\"uS/cm\"}]}";
    assertThat(json(first).body()).contains("\"inserted\":1");
    HttpResponse<String> again = json(first.replace("0.07", "7e-6").replace("uS/cm", "S/m"));
    assertThat(again.statusCode()).as(again.body()).isEqualTo(200);
    assertThat(again.body()).contains("\"unchanged\":1").contains("\"corrected\":0");
  }
}
