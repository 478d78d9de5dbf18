package org.kwanta.service.metrics;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpResponse;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import java.util.TreeSet;
import java.util.UUID;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.kwanta.service.system.MetricNames;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.web.server.LocalServerPort;

/**
 * The scrape shows the documented metric names with bounded labels, and a sample point above the
 * (example, from memory — verify) AL2 threshold for cation conductivity shows level 2.
 */
@DatabaseTest
class MetricsIT {

  @LocalServerPort int port;
  @Autowired SampleMetrics sampleMetrics;

  @Test
  void scrapeShowsTheDocumentedNamesAndLabels() {
    Http http = Http.admin(port);
    String tag = UUID.randomUUID().toString().substring(0, 8).toLowerCase(Locale.ROOT);
    String point = "M" + tag + "-U2-CPD";
    String plant =
        ("{\"id\":\"metrics-%s\",\"name\":\"Metrics test (fictional)\","
                + "\"units\":[{\"id\":\"U2\",\"name\":\"Unit 2\"}],\"samplePoints\":[{\"id\":\"%s\","
                + "\"unit\":\"U2\",\"name\":\"Unit 2 condensate pump discharge\","
                + "\"cycleLocation\":\"CONDENSATE\",\"treatmentRegime\":\"AVT_O\","
                + "\"operatingTemperatureCel\":40}]}")
            .formatted(tag, point);
    assertThat(http.post("/api/v1/plants", "application/json", plant).statusCode()).isEqualTo(201);
    Instant start = Instant.now().truncatedTo(ChronoUnit.MINUTES).minus(30, ChronoUnit.MINUTES);
    List<String> readings = new ArrayList<>();
    for (int m = 0; m < 30; m++) {
      readings.add(
          String.format(
              Locale.ROOT,
              "{\"samplePoint\":\"%s\",\"parameter\":\"cation_conductivity\",\"time\":\"%s\","
                  + "\"value\":0.5,\"unit\":\"uS/cm\"}",
              point,
              start.plusSeconds(60L * m)));
    }
    HttpResponse<String> ingest =
        http.post(
            "/api/v1/readings",
            "application/json",
            "{\"readings\":[" + String.join(",", readings) + "]}");
    assertThat(ingest.statusCode()).as(ingest.body()).isEqualTo(200);

    sampleMetrics.refresh();
    String scrape = http.get("/actuator/prometheus").body();

    String labels =
        "parameter=\"cation_conductivity\",plant=\"metrics-%s\",sample_point=\"%s\",unit=\"U2\""
            .formatted(tag, point);
    assertThat(scrape)
        .contains("kwanta_sample_level{" + labels + "} 2.0")
        .contains("kwanta_sample_value{" + labels + "} 0.5")
        .contains("kwanta_sample_instrument_in_doubt{" + labels + "} 0.0")
        .contains("kwanta_sample_outside_normal{" + labels + "} 0.0")
        .contains("kwanta_sample_level_held_seconds{" + labels + "}")
        .contains("kwanta_sample_reading_age_seconds{" + labels + "}")
        .contains("kwanta_readings_ingested_total{")
        .contains("kwanta_evaluation_duration_seconds_count")
        .contains("kwanta_ingest_batch_duration_seconds_bucket")
        .contains("hikaricp_connections_active");

    Set<String> kwanta = new TreeSet<>();
    for (String line : scrape.split("\n")) {
      if (line.startsWith("kwanta_")) {
        kwanta.add(line.replaceAll("[{ ].*", ""));
      }
    }
    assertThat(MetricNames.exposedNames()).containsAll(kwanta);
  }
}
