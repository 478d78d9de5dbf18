package org.kwanta.service.system;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpResponse;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.springframework.boot.test.web.server.LocalServerPort;

/**
 * The service's front door: health groups, metrics, OpenAPI, and problem details for bad requests.
 */
@DatabaseTest
class FoundationIT {

  @LocalServerPort int port;
  Http http;

  @BeforeEach
  void client() {
    http = Http.admin(port);
  }

  @Test
  void healthIsUpWithDatabaseUp() {
    HttpResponse<String> health = http.get("/actuator/health");
    assertThat(health.statusCode()).isEqualTo(200);
    assertThat(health.body()).contains("\"status\":\"UP\"").contains("\"db\":{\"status\":\"UP\"}");
  }

  @Test
  void readinessIncludesDatabaseAndLivenessDoesNot() {
    HttpResponse<String> readiness = http.get("/actuator/health/readiness");
    assertThat(readiness.statusCode()).isEqualTo(200);
    assertThat(readiness.body()).contains("\"db\"").contains("readinessState");
    HttpResponse<String> liveness = http.get("/actuator/health/liveness");
    assertThat(liveness.statusCode()).isEqualTo(200);
    assertThat(liveness.body()).doesNotContain("\"db\"");
  }

  @Test
  void prometheusScrapeAnswers() {
    HttpResponse<String> scrape = http.get("/actuator/prometheus");
    assertThat(scrape.statusCode()).isEqualTo(200);
    assertThat(scrape.body()).contains("jvm_memory_used_bytes").contains("hikaricp_connections");
  }

  @Test
  void infoShowsTheBuildVersionAndTheAdvisoryCaution() {
    HttpResponse<String> info = http.get("/actuator/info");
    assertThat(info.statusCode()).isEqualTo(200);
    // spring-boot-maven-plugin's build-info goal (service/pom.xml)
    assertThat(info.body())
        .containsPattern("\"build\":\\{[^}]*\"version\":\"\\d+\\.\\d+\\.\\d+[^\"]*\"")
        .contains("\"artifact\":\"kwanta-service\"")
        .contains("Results are advisory");
  }

  @Test
  void openApiDocumentCarriesTheAdvisoryCaution() {
    HttpResponse<String> docs = http.get("/v3/api-docs");
    assertThat(docs.statusCode()).isEqualTo(200);
    assertThat(docs.body()).contains("Results are advisory").contains("/api/v1/plants");
    assertThat(http.get("/swagger-ui/index.html").statusCode()).isEqualTo(200);
  }

  @Test
  void unknownPathIsProblemJsonEvenForBrowsers() {
    HttpResponse<String> r = http.get("/no/such/path", "Accept", "text/html");
    assertThat(r.statusCode()).isEqualTo(404);
    assertThat(r.headers().firstValue("Content-Type"))
        .hasValueSatisfying(ct -> assertThat(ct).startsWith("application/problem+json"));
    assertThat(r.body())
        .contains("\"type\":\"urn:kwanta:problem:not-found\"")
        .doesNotContain("<html");
  }

  @Test
  void wrongMethodIsProblemJson() {
    HttpResponse<String> r = http.method("DELETE", "/api/v1/plants");
    assertThat(r.statusCode()).isEqualTo(405);
    assertThat(r.body()).contains("urn:kwanta:problem:method-not-allowed");
  }

  @Test
  void malformedBodyIsProblemJson() {
    HttpResponse<String> r = http.post("/api/v1/plants", "application/json", "{\"id\": ");
    assertThat(r.statusCode()).isEqualTo(400);
    assertThat(r.headers().firstValue("Content-Type"))
        .hasValueSatisfying(ct -> assertThat(ct).startsWith("application/problem+json"));
    assertThat(r.body()).contains("urn:kwanta:problem:bad-request").doesNotContain("Exception");
  }

  @Test
  void invalidDeclarationIsProblemJson() {
    HttpResponse<String> r =
        http.post(
            "/api/v1/plants",
            "application/json",
            "{\"id\":\"\",\"name\":\"x\",\"blocks\":[],\"samplePoints\":[]}");
    assertThat(r.statusCode()).isEqualTo(400);
    assertThat(r.body()).contains("urn:kwanta:problem:bad-request");
  }

  @Test
  void wrongMediaTypeIsProblemJson() {
    HttpResponse<String> r = http.post("/api/v1/plants", "text/plain", "hello");
    assertThat(r.statusCode()).isEqualTo(415);
    assertThat(r.body()).contains("urn:kwanta:problem:unsupported-media-type");
  }
}
