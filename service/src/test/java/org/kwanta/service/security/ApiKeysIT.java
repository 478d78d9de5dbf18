package org.kwanta.service.security;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.Statement;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.kwanta.service.support.TestDatabase;
import org.kwanta.service.support.TestKeys;
import org.springframework.boot.test.web.server.LocalServerPort;
import tools.jackson.databind.JsonNode;

/** Keys over HTTP: created with the secret shown once, listed without it, revoked. */
@DatabaseTest
class ApiKeysIT {

  @LocalServerPort int port;

  @Test
  void keyIsCreatedUsedListedWithoutSecretAndRevoked() {
    JsonNode created = Keys.create(port, "dashboard", "read");
    String key = created.get("key").asString();
    String id = created.get("id").asString();
    assertThat(key).matches("kw_[a-z0-9]{12}_[A-Za-z0-9_-]{43}").startsWith("kw_" + id + "_");
    assertThat(created.get("role").asString()).isEqualTo("read");

    Http reader = new Http(port).withKey(key);
    assertThat(reader.get("/api/v1/plants").statusCode()).isEqualTo(200);
    HttpResponse<String> write =
        reader.post("/api/v1/plants", "application/json", "{\"id\":\"p\"}");
    assertThat(write.statusCode()).isEqualTo(403);
    assertThat(write.body()).contains("urn:kwanta:problem:forbidden").contains("'read'");

    HttpResponse<String> list = Http.admin(port).get("/api/v1/keys");
    assertThat(list.statusCode()).isEqualTo(200);
    assertThat(list.body()).contains("\"id\":\"" + id + "\"").doesNotContain(key.substring(17));
    assertThat(list.body()).doesNotContain("secret").doesNotContain("\"key\"");

    HttpResponse<String> revoked = Http.admin(port).method("DELETE", "/api/v1/keys/" + id);
    assertThat(revoked.statusCode()).isEqualTo(200);
    assertThat(Keys.JSON.readTree(revoked.body()).get("revokedAt").isNull()).isFalse();
    HttpResponse<String> after = reader.get("/api/v1/plants");
    assertThat(after.statusCode()).isEqualTo(401);
    assertThat(after.body()).contains("urn:kwanta:problem:unauthorized");
  }

  @Test
  void secretIsStoredOnlyAsSaltedSha256() throws Exception {
    String key = Keys.createKey(port, "hash check", "ingest");
    String id = key.substring(3, key.indexOf('_', 3));
    String secret = key.substring(key.indexOf('_', 3) + 1);
    try (Connection c = TestDatabase.get().connect();
        PreparedStatement s =
            c.prepareStatement(
                "SELECT secret_salt, secret_hash, k::text FROM api_key k" + " WHERE id = ?")) {
      s.setString(1, id);
      try (ResultSet rs = s.executeQuery()) {
        assertThat(rs.next()).isTrue();
        byte[] salt = rs.getBytes(1);
        byte[] hash = rs.getBytes(2);
        assertThat(salt).hasSize(16);
        // independent check with the JDK's SHA-256 (FIPS 180-4): hash = SHA-256(salt || secret)
        MessageDigest sha256 = MessageDigest.getInstance("SHA-256");
        sha256.update(salt);
        assertThat(hash).isEqualTo(sha256.digest(secret.getBytes(StandardCharsets.UTF_8)));
        assertThat(rs.getString(3)).doesNotContain(secret);
      }
    }
  }

  @Test
  void keyIsAcceptedInXApiKeyHeader() {
    String key = Keys.createKey(port, "x-api-key", "read");
    assertThat(new Http(port).get("/api/v1/plants", "X-API-Key", key).statusCode()).isEqualTo(200);
  }

  @Test
  void missingMalformedAndUnknownKeysAre401ProblemsWithChallenge() {
    List<HttpResponse<String>> answers = new ArrayList<>();
    answers.add(new Http(port).get("/api/v1/plants"));
    answers.add(new Http(port).withKey("not-a-key").get("/api/v1/plants"));
    answers.add(
        new Http(port)
            .withKey("kw_nosuchkey_0123456789abcdefghijABCDEFGHIJ-_012345")
            .get("/api/v1/plants"));
    String wrongSecret = TestKeys.ADMIN.substring(0, TestKeys.ADMIN.length() - 1) + "X";
    answers.add(new Http(port).withKey(wrongSecret).get("/api/v1/plants"));
    for (HttpResponse<String> r : answers) {
      assertThat(r.statusCode()).isEqualTo(401);
      assertThat(r.headers().firstValue("Content-Type"))
          .hasValueSatisfying(ct -> assertThat(ct).startsWith("application/problem+json"));
      assertThat(r.headers().firstValue("WWW-Authenticate")).hasValue("Bearer realm=\"kwanta\"");
      assertThat(r.body()).contains("\"type\":\"urn:kwanta:problem:unauthorized\"");
    }
  }

  @Test
  void prometheusScrapeNeedsAReadKey() {
    assertThat(new Http(port).get("/actuator/prometheus").statusCode()).isEqualTo(401);
    String ingest = Keys.createKey(port, "historian", "ingest");
    assertThat(new Http(port).withKey(ingest).get("/actuator/prometheus").statusCode())
        .isEqualTo(403);
    String read = Keys.createKey(port, "prometheus", "read");
    HttpResponse<String> scrape = new Http(port).withKey(read).get("/actuator/prometheus");
    assertThat(scrape.statusCode()).isEqualTo(200);
    assertThat(scrape.body()).contains("kwanta_ingest_in_flight");
    assertThat(new Http(port).get("/actuator/health").statusCode()).isEqualTo(200);
  }

  @Test
  void createRefusesUnknownRoleUnknownFieldAndControlCharacters() {
    Http admin = Http.admin(port);
    assertThat(
            admin
                .post("/api/v1/keys", "application/json", "{\"name\":\"a\",\"role\":\"root\"}")
                .statusCode())
        .isEqualTo(400);
    HttpResponse<String> unknown =
        admin.post(
            "/api/v1/keys",
            "application/json",
            "{\"name\":\"a\",\"role\":\"read\",\"expires\":\"never\"}");
    assertThat(unknown.statusCode()).isEqualTo(400);
    assertThat(unknown.body()).contains("Unknown field 'expires'");
    assertThat(
            admin
                .post(
                    "/api/v1/keys", "application/json", "{\"name\":\"a\\u0007\",\"role\":\"read\"}")
                .statusCode())
        .isEqualTo(400);
  }

  @Test
  void theLastActiveAdminKeyCannotBeRevoked() throws Exception {
    // other admin keys created by tests are revoked first, so the test admin key is the last one
    try (Connection c = TestDatabase.get().connect();
        Statement s = c.createStatement()) {
      s.executeUpdate(
          "UPDATE api_key SET revoked_at = now() WHERE role = 'admin' AND id <> 'testadmin'"
              + " AND revoked_at IS NULL");
    }
    String second = Keys.createKey(port, "second admin", "admin");
    String secondId = second.substring(3, second.indexOf('_', 3));
    Http admin = Http.admin(port);
    assertThat(admin.method("DELETE", "/api/v1/keys/" + secondId).statusCode()).isEqualTo(200);
    HttpResponse<String> last = admin.method("DELETE", "/api/v1/keys/testadmin");
    assertThat(last.statusCode()).isEqualTo(409);
    assertThat(last.body()).contains("last active admin key");
    assertThat(admin.get("/api/v1/keys").statusCode()).isEqualTo(200);
    assertThat(admin.method("DELETE", "/api/v1/keys/nosuch").statusCode()).isEqualTo(404);
  }

  @Test
  void adminKeyFromTheEnvironmentIsStoredAsAnAdminKey() throws Exception {
    try (Connection c = TestDatabase.get().connect();
        Statement s = c.createStatement();
        ResultSet rs =
            s.executeQuery("SELECT role, name, revoked_at FROM api_key WHERE id = 'testadmin'")) {
      assertThat(rs.next()).isTrue();
      assertThat(rs.getString(1)).isEqualTo("admin");
      assertThat(rs.getString(2)).isEqualTo(AdminKeyBootstrap.FROM_ENVIRONMENT);
      assertThat(rs.getObject(3)).isNull();
    }
  }
}
