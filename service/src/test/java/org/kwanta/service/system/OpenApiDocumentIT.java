package org.kwanta.service.system;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.springframework.boot.test.web.server.LocalServerPort;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Issue 17, fault 7: the OpenAPI document names the API key as an HTTP bearer scheme applied to
 * every operation under {@code /api/} (Swagger UI's "try it out" can then authenticate), and every
 * such operation references the common problem-detail error responses.
 */
@DatabaseTest
class OpenApiDocumentIT {

  private static final JsonMapper JSON = JsonMapper.builder().build();
  private static final List<String> COMMON =
      List.of("400", "401", "403", "404", "406", "422", "503");
  private static final List<String> WITH_BODY = List.of("413", "415");

  @LocalServerPort int port;

  private JsonNode document() {
    return JSON.readTree(new Http(port).get("/v3/api-docs").body());
  }

  @Test
  void declaresTheApiKeyAsABearerSchemeRequiredUnderApi() {
    JsonNode docs = document();
    JsonNode scheme = docs.at("/components/securitySchemes/API key");
    assertThat(scheme.get("type").asString()).isEqualTo("http");
    assertThat(scheme.get("scheme").asString()).isEqualTo("bearer");
    List<String> without = new ArrayList<>();
    forEachApiOperation(
        docs,
        (name, op) -> {
          JsonNode security = op.get("security");
          if (security == null || !security.toString().contains("\"API key\"")) {
            without.add(name);
          }
        });
    assertThat(without).isEmpty();
  }

  @Test
  void everyApiOperationReferencesTheProblemResponses() {
    JsonNode docs = document();
    JsonNode responses = docs.at("/components/responses");
    List<String> missing = new ArrayList<>();
    int[] operations = {0};
    forEachApiOperation(
        docs,
        (name, op) -> {
          operations[0]++;
          List<String> expected = op.has("requestBody") ? concat(COMMON, WITH_BODY) : COMMON;
          for (String status : expected) {
            JsonNode r = op.at("/responses/" + status + "/$ref");
            String prefix = "#/components/responses/";
            if (!r.isString()
                || !r.asString().startsWith(prefix)
                || !responses
                    .at(
                        "/"
                            + r.asString().substring(prefix.length())
                            + "/content/application~1problem+json/schema/$ref")
                    .asString("")
                    .equals("#/components/schemas/Problem")) {
              missing.add(name + " " + status);
            }
          }
        });
    assertThat(operations[0]).isGreaterThan(20);
    assertThat(missing).isEmpty();
  }

  private static List<String> concat(List<String> a, List<String> b) {
    List<String> out = new ArrayList<>(a);
    out.addAll(b);
    return out;
  }

  /**
   * Issue 18 item 4: a path variable is named for what it holds ({@code {samplePoint}}, {@code
   * {event}}, {@code {key}}, ...), never a bare {@code {id}}, and the document declares each one
   * under that name; the excursion event and the API key say what their number or id is.
   */
  @Test
  void pathVariablesAreNamedForWhatTheyHold() {
    JsonNode docs = document();
    java.util.regex.Pattern variable = java.util.regex.Pattern.compile("\\{([A-Za-z]+)}");
    List<String> variables = new ArrayList<>();
    forEachApiOperation(
        docs,
        (operation, op) -> {
          java.util.regex.Matcher m = variable.matcher(operation);
          while (m.find()) {
            String name = m.group(1);
            variables.add(name);
            List<String> declared = new ArrayList<>();
            op.path("parameters")
                .forEach(
                    p -> {
                      if (p.get("in").asString().equals("path")) {
                        declared.add(p.get("name").asString());
                      }
                    });
            assertThat(declared).as(operation).contains(name);
          }
        });
    assertThat(variables)
        .doesNotContain("id")
        .contains("plant", "block", "samplePoint", "parameter", "event", "key");
    for (String path :
        List.of(
            "/api/v1/excursion-events/{event}",
            "/api/v1/excursion-events/{event}/entries",
            "/api/v1/excursion-events/{event}/excursions",
            "/api/v1/keys/{key}")) {
      JsonNode ops = docs.get("paths").get(path);
      assertThat(ops).as(path).isNotNull();
      ops.properties()
          .forEach(
              op ->
                  assertThat(op.getValue().get("parameters").get(0).path("description").asString())
                      .as(path)
                      .isNotBlank());
    }
  }

  private static void forEachApiOperation(
      JsonNode docs, java.util.function.BiConsumer<String, JsonNode> action) {
    for (Map.Entry<String, JsonNode> path : docs.get("paths").properties()) {
      if (!path.getKey().startsWith("/api/")) {
        continue;
      }
      for (Map.Entry<String, JsonNode> op : path.getValue().properties()) {
        action.accept(
            op.getKey().toUpperCase(java.util.Locale.ROOT) + " " + path.getKey(), op.getValue());
      }
    }
  }
}
