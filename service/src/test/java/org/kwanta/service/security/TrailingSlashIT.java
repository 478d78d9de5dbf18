package org.kwanta.service.security;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpResponse;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.springframework.boot.test.web.server.LocalServerPort;

/**
 * Issue 17, fault 7: the actuator answers its endpoints with a trailing slash too, so the access
 * rules must treat {@code /actuator/prometheus/} as {@code /actuator/prometheus} (it was 403 for a
 * read key, falling to the admin-only {@code /actuator/**} rule).
 */
@DatabaseTest
class TrailingSlashIT {

  @LocalServerPort int port;

  @Test
  void prometheusWithATrailingSlashAnswersAReadKeyAsWithout() {
    Http read = new Http(port).withKey(Keys.createKey(port, "slash scraper", "read"));
    HttpResponse<String> plain = read.get("/actuator/prometheus");
    HttpResponse<String> slash = read.get("/actuator/prometheus/");
    assertThat(plain.statusCode()).isEqualTo(200);
    assertThat(slash.statusCode()).as(slash.body()).isEqualTo(200);
    assertThat(slash.body()).contains("kwanta_");
    assertThat(new Http(port).get("/actuator/prometheus/").statusCode()).isEqualTo(401);
    Http ingest = new Http(port).withKey(Keys.createKey(port, "slash historian", "ingest"));
    assertThat(ingest.get("/actuator/prometheus/").statusCode()).isEqualTo(403);
  }

  @Test
  void infoWithATrailingSlashIsOpenAsWithout() {
    assertThat(new Http(port).get("/actuator/info").statusCode()).isEqualTo(200);
    assertThat(new Http(port).get("/actuator/info/").statusCode()).isEqualTo(200);
  }
}
