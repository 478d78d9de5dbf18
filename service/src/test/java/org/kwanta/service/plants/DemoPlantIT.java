package org.kwanta.service.plants;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpResponse;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.springframework.boot.test.web.server.LocalServerPort;

/** The fictional Brackenmoor plant is loaded as demo configuration on first start. */
@DatabaseTest
class DemoPlantIT {

  @LocalServerPort int port;

  @Test
  void brackenmoorIsLoadedWithItsSamplePoints() {
    HttpResponse<String> r = Http.admin(port).get("/api/v1/plants/brackenmoor");
    assertThat(r.statusCode()).isEqualTo(200);
    assertThat(r.body()).contains("U1-ECO-IN").contains("U2-HP-DRUM").contains("MU-DEMIN");
  }

  @Test
  void unknownPlantIs404Problem() {
    HttpResponse<String> r = Http.admin(port).get("/api/v1/plants/nowhere");
    assertThat(r.statusCode()).isEqualTo(404);
    assertThat(r.body()).contains("urn:kwanta:problem:not-found");
  }
}
