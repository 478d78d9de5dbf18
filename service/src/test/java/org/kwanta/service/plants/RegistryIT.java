package org.kwanta.service.plants;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpResponse;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** Configuration as code and versioned sample-point configuration. */
@DatabaseTest
@TestPropertySource(properties = "kwanta.registry.files=classpath:registry/test-plant.yaml")
class RegistryIT {

  private static final JsonMapper JSON = JsonMapper.builder().build();

  @LocalServerPort int port;
  Http http;

  @BeforeEach
  void client() {
    http = Http.admin(port);
  }

  @Test
  void declaredFileIsLoadedAtStart() {
    JsonNode point = JSON.readTree(http.get("/api/v1/sample-points/FW-ECO-IN").body());
    assertThat(point.get("alkalizer").asString()).isEqualTo("MORPHOLINE");
  }

  @Test
  void aChangeIsANewVersionAndEvaluationsRecordTheirVersion() {
    String body =
        """
        {"id":"FW-ECO-IN","block":"U1","name":"Economizer inlet","cycleLocation":"FEEDWATER",
         "treatmentRegime":"AVT(O)","operatingTemperatureCel":160,"operatingPressureMPa":14,
         "alkalizer":"MORPHOLINE"}""";
    HttpResponse<String> r =
        http.send("PUT", "/api/v1/sample-points/FW-ECO-IN", "application/json", body);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    int version = JSON.readTree(r.body()).get("version").asInt();
    assertThat(version).isGreaterThanOrEqualTo(2);
    // the same configuration again changes nothing
    HttpResponse<String> again =
        http.send("PUT", "/api/v1/sample-points/FW-ECO-IN", "application/json", body);
    assertThat(JSON.readTree(again.body()).get("changed").asBoolean()).isFalse();

    JsonNode versions = JSON.readTree(http.get("/api/v1/sample-points/FW-ECO-IN/versions").body());
    assertThat(versions.size()).isEqualTo(version);
    assertThat(versions.get(0).get("config").get("operatingTemperatureCel").asDouble())
        .isEqualTo(150.0);
    assertThat(versions.get(version - 1).get("config").get("operatingTemperatureCel").asDouble())
        .isEqualTo(160.0);

    String t = Instant.now().truncatedTo(ChronoUnit.HOURS).minus(2, ChronoUnit.HOURS).toString();
    String readings =
        "{\"readings\":[{\"samplePoint\":\"FW-ECO-IN\",\"parameter\":\"specific_conductivity\","
            + "\"time\":\""
            + t
            + "\",\"value\":3.1,\"unit\":\"uS/cm\"}]}";
    assertThat(http.post("/api/v1/readings", "application/json", readings).statusCode())
        .isEqualTo(200);
    JsonNode state = JSON.readTree(http.get("/api/v1/sample-points/FW-ECO-IN/state").body());
    assertThat(state.get("evaluation").get("evaluation").get("configVersion").asInt())
        .isEqualTo(version);
  }

  @Test
  void anInvalidChangeIsRefused() {
    String body =
        """
        {"id":"FW-ECO-IN","block":"U1","name":"x","cycleLocation":"FEEDWATER",
         "treatmentRegime":"NONSENSE","alkalizer":"MORPHOLINE"}""";
    HttpResponse<String> r =
        http.send("PUT", "/api/v1/sample-points/FW-ECO-IN", "application/json", body);
    assertThat(r.statusCode()).isEqualTo(400);
    assertThat(r.body()).contains("unknown treatment regime");
  }
}
