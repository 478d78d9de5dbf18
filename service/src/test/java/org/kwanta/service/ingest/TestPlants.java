package org.kwanta.service.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.List;
import java.util.Locale;
import java.util.UUID;
import java.util.stream.Collectors;
import org.kwanta.service.support.Http;

/**
 * Invented test plants (fictional, like the Brackenmoor demo), one per test, so tests do not share
 * rows.
 */
final class TestPlants {

  private TestPlants() {}

  /**
   * Declares a plant with feedwater sample points (AVT(O), ammonia, 155 °C, 15 MPa); returns their
   * ids.
   */
  static List<String> feedwaterPoints(Http http, int count) {
    String tag = UUID.randomUUID().toString().substring(0, 8).toUpperCase(Locale.ROOT);
    List<String> ids =
        java.util.stream.IntStream.range(0, count).mapToObj(i -> "T" + tag + "-FW" + i).toList();
    String points =
        ids.stream()
            .map(
                id ->
                    String.format(
                        Locale.ROOT,
                        "{\"id\":\"%s\",\"block\":\"U1\",\"name\":\"Test feedwater %s\","
                            + "\"cycleLocation\":\"FEEDWATER\",\"treatmentRegime\":\"AVT(O)\","
                            + "\"operatingTemperatureCel\":155,\"operatingPressureMPa\":15}",
                        id,
                        id))
            .collect(Collectors.joining(","));
    String body =
        "{\"id\":\"test-"
            + tag.toLowerCase(Locale.ROOT)
            + "\",\"name\":\"Test plant\",\"blocks\":[{\"id\":\"U1\",\"name\":\"Unit 1\"}],"
            + "\"samplePoints\":["
            + points
            + "]}";
    assertThat(http.post("/api/v1/plants", "application/json", body).statusCode()).isEqualTo(201);
    return ids;
  }
}
