package org.kwanta.service.system;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpResponse;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.springframework.boot.test.web.server.LocalServerPort;

/** Issue 17, fault 7: small inconsistencies of the open page and of problem answers. */
@DatabaseTest
class ProblemConsistencyIT {

  @LocalServerPort int port;

  @Test
  void headOfThePageIsOpenLikeGet() {
    HttpResponse<String> head = new Http(port).method("HEAD", "/");
    assertThat(head.statusCode()).isEqualTo(200);
    assertThat(new Http(port).get("/").statusCode()).isEqualTo(200);
  }

  @Test
  void errorPathRequestedDirectlyIsNotFoundNotAnInternalError() {
    HttpResponse<String> r = Http.admin(port).get("/error");
    assertThat(r.statusCode()).isEqualTo(404);
    assertThat(r.body())
        .contains("urn:kwanta:problem:not-found")
        .contains("\"title\":\"Not found\"")
        .doesNotContain("logged");
  }

  @Test
  void titlesAreSentenceCase() {
    HttpResponse<String> unknown = Http.admin(port).get("/api/v1/nothing-here");
    assertThat(unknown.statusCode()).isEqualTo(404);
    assertThat(unknown.body()).contains("\"title\":\"Not found\"");
    HttpResponse<String> method = Http.admin(port).method("PATCH", "/api/v1/plants");
    assertThat(method.statusCode()).isEqualTo(405);
    assertThat(method.body()).contains("\"title\":\"Method not allowed\"");
    HttpResponse<String> media =
        Http.admin(port).post("/api/v1/readings", "application/xml", "<readings/>");
    assertThat(media.statusCode()).isEqualTo(415);
    assertThat(media.body()).contains("\"title\":\"Unsupported media type\"");
  }

  @Test
  void unacceptableMediaTypeIs406Problem() {
    HttpResponse<String> r = Http.admin(port).get("/api/v1/plants", "Accept", "image/png");
    assertThat(r.statusCode()).isEqualTo(406);
  }
}
