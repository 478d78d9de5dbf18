package org.kwanta.service.security;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.PosixFilePermissions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.web.server.LocalServerPort;

/**
 * The scraper's key from {@code KWANTA_SCRAPE_KEY_FILE}: generated into a missing file (docker
 * compose, check-alert.sh) or installed from an existing one (a Kubernetes Secret), and in both
 * cases accepted by {@code /actuator/prometheus} with the read role only.
 */
@DatabaseTest
class ScrapeKeyIT {

  @LocalServerPort int port;
  @Autowired ApiKeys keys;

  private void start(Path file) throws Exception {
    new ScrapeKeyBootstrap(keys, new ApiKeyProperties(null, file.toString())).run(null);
  }

  private HttpResponse<String> scrape(String key) {
    return new Http(port).withKey(key).get("/actuator/prometheus");
  }

  @Test
  void missingFileGetsAGeneratedReadKeyThatScrapes(@TempDir Path dir) throws Exception {
    Path file = dir.resolve("key");
    start(file);
    String key = Files.readString(file).trim();
    assertThat(key).matches("kw_[a-z0-9]{12}_[A-Za-z0-9_-]{43}");
    assertThat(Files.getPosixFilePermissions(file))
        .isEqualTo(PosixFilePermissions.fromString("rw-r--r--"));
    assertThat(scrape(key).statusCode()).isEqualTo(200);
    assertThat(scrape(key).body()).contains("kwanta_ingest_in_flight");
    // read role only: no configuration
    assertThat(
            new Http(port)
                .withKey(key)
                .post("/api/v1/plants", "application/json", "{\"id\":\"p\"}")
                .statusCode())
        .isEqualTo(403);
    // a restart reads the same file and stores nothing new
    int before = keys.list().size();
    start(file);
    assertThat(Files.readString(file).trim()).isEqualTo(key);
    assertThat(keys.list()).hasSize(before);
  }

  @Test
  void existingFileIsInstalledAsReadKey(@TempDir Path dir) throws Exception {
    Path file = dir.resolve("key");
    String key = "kw_promsecret_0123456789abcdefghijABCDEFGHIJ-_scrape";
    Files.writeString(file, key + "\n");
    assertThat(scrape(key).statusCode()).isEqualTo(401);
    start(file);
    assertThat(scrape(key).statusCode()).isEqualTo(200);
    assertThat(keys.find("promsecret").orElseThrow().role()).isEqualTo(Role.READ);
    assertThat(keys.find("promsecret").orElseThrow().name()).isEqualTo(ScrapeKeyBootstrap.NAME);
  }

  @Test
  void sameIdWithAnotherSecretOrAMalformedFileRefusesTheStart(@TempDir Path dir) throws Exception {
    Path file = dir.resolve("key");
    Files.writeString(file, "kw_promclash_0123456789abcdefghijABCDEFGHIJ-_first");
    start(file);
    Files.writeString(file, "kw_promclash_0123456789abcdefghijABCDEFGHIJ-_second");
    assertThatThrownBy(() -> start(file))
        .hasMessageContaining("promclash")
        .hasMessageContaining("different secret");
    Files.writeString(file, "not a key");
    assertThatThrownBy(() -> start(file))
        .hasMessageContaining("must hold one key")
        .hasMessageNotContaining("not a key");
  }
}
