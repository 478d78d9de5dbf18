package org.kwanta.service.security;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpResponse;
import org.kwanta.service.support.Http;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** Creates keys over HTTP for tests, with the test admin key. */
final class Keys {

  static final JsonMapper JSON = JsonMapper.builder().build();

  private Keys() {}

  /** Creates a key of this role and returns the created-key response. */
  static JsonNode create(int port, String name, String role) {
    HttpResponse<String> r =
        Http.admin(port)
            .post(
                "/api/v1/keys",
                "application/json",
                "{\"name\":\"" + name + "\",\"role\":\"" + role + "\"}");
    assertThat(r.statusCode()).as(r.body()).isEqualTo(201);
    return JSON.readTree(r.body());
  }

  static String createKey(int port, String name, String role) {
    return create(port, name, role).get("key").asString();
  }
}
