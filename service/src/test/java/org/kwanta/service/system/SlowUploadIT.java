package org.kwanta.service.system;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.OutputStream;
import java.net.Socket;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.kwanta.service.support.TestKeys;
import org.springframework.boot.test.web.server.LocalServerPort;

/**
 * Issue 17, fault 1: four connections sending a 1 MB ingest body a byte at a time used to take
 * every ingest slot for as long as they liked, and every other historian got 503. Bodies are now
 * read before a slot is taken, so a normal batch goes through while they trickle.
 */
@DatabaseTest
class SlowUploadIT {

  @LocalServerPort int port;

  @Test
  void slowUploadsDoNotBlockOtherIngest() throws Exception {
    List<Socket> slow = new ArrayList<>();
    try {
      for (int i = 0; i < 4; i++) {
        Socket s = new Socket("127.0.0.1", port);
        OutputStream out = s.getOutputStream();
        out.write(
            ("POST /api/v1/readings HTTP/1.1\r\nHost: localhost\r\n"
                    + "Authorization: Bearer "
                    + TestKeys.ADMIN
                    + "\r\nContent-Type: application/json\r\nContent-Length: 1000000\r\n\r\n{")
                .getBytes(StandardCharsets.US_ASCII));
        out.flush();
        slow.add(s);
      }
      // keep them trickling for a while, then send a normal batch from the same key
      for (int k = 0; k < 3; k++) {
        Thread.sleep(500);
        for (Socket s : slow) {
          s.getOutputStream().write(' ');
          s.getOutputStream().flush();
        }
      }
      String time =
          Instant.now().minus(1, ChronoUnit.HOURS).truncatedTo(ChronoUnit.SECONDS).toString();
      HttpResponse<String> r =
          Http.admin(port)
              .post(
                  "/api/v1/readings",
                  "application/json",
                  "{\"readings\":[{\"samplePoint\":\"U1-ECO-IN\",\"parameter\":\"ph\",\"time\":\""
                      + time
                      + "\",\"value\":9.61,\"unit\":\"[pH]\"}]}");
      assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    } finally {
      for (Socket s : slow) {
        s.close();
      }
    }
  }
}
