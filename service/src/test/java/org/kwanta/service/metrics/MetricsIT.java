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
 * (example, from memory — verify) AL2 threshold for cation conductivity shows level 2, and the
 * deadline of its running excursion exactly as the excursions endpoint gives it.
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
                + "\"blocks\":[{\"id\":\"U2\",\"name\":\"Unit 2\"}],\"samplePoints\":[{\"id\":\"%s\","
                + "\"block\":\"U2\",\"name\":\"Unit 2 condensate pump discharge\","
                + "\"cycleLocation\":\"CONDENSATE\",\"treatmentRegime\":\"AVT(O)\","
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
    // one value in each of three more units, so that the split by unit shows on the scrape
    // (invented demo values)
    String last = start.plusSeconds(60L * 29).toString();
    for (String[] r :
        new String[][] {
          {"sodium", "2", "ug/kg"}, {"ph", "9.3", "[pH]"}, {"sample_temperature", "25", "Cel"}
        }) {
      readings.add(
          "{\"samplePoint\":\"%s\",\"parameter\":\"%s\",\"time\":\"%s\",\"value\":%s,\"unit\":\"%s\"}"
              .formatted(point, r[0], last, r[1], r[2]));
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
        "block=\"U2\",parameter=\"cation_conductivity\",plant=\"metrics-%s\",sample_point=\"%s\""
            .formatted(tag, point);
    assertThat(scrape)
        .contains("kwanta_sample_level{" + labels + "} 2.0")
        .contains("kwanta_sample_conductivity_microsiemens_per_centimetre{" + labels + "} 0.5")
        .contains(
            "kwanta_sample_concentration_micrograms_per_kilogram{"
                + labels.replace("cation_conductivity", "sodium")
                + "} 2.0")
        .contains("kwanta_sample_ph{" + labels.replace("cation_conductivity", "ph") + "} 9.3")
        .contains(
            "kwanta_sample_temperature_celsius{"
                + labels.replace("cation_conductivity", "sample_temperature")
                + "} 25.0")
        .contains(
            "kwanta_limit_threshold_conductivity_microsiemens_per_centimetre{block=\"U2\","
                + "level=\"AL2\",parameter=\"cation_conductivity\",plant=\"metrics-%s\","
                    .formatted(tag)
                + "sample_point=\"%s\",side=\"HIGH\"}".formatted(point))
        .doesNotContain("kwanta_sample_value{", "kwanta_limit_threshold{")
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

    // one unit per metric name: every series of a metric split by unit is of a parameter in the
    // metric's unit
    int split = 0;
    for (var perUnit :
        java.util.stream.Stream.concat(
                MetricNames.SAMPLE_VALUES.stream(), MetricNames.LIMIT_THRESHOLDS.stream())
            .toList()) {
      String prefix = perUnit.metric().prometheusName() + "{";
      for (String line : scrape.lines().filter(l -> l.startsWith(prefix)).toList()) {
        java.util.regex.Matcher parameter =
            java.util.regex.Pattern.compile("parameter=\"([a-z_]+)\"").matcher(line);
        assertThat(parameter.find()).as(line).isTrue();
        assertThat(org.kwanta.model.Parameter.ofCode(parameter.group(1)).unit())
            .as(line)
            .isEqualTo(perUnit.unit());
        split++;
      }
    }
    assertThat(split).isGreaterThanOrEqualTo(5);

    // the running excursion's deadline on the scrape is the excursions endpoint's deadline
    HttpResponse<String> excursions =
        http.get("/api/v1/excursions?samplePoint=" + point + "&open=true");
    assertThat(excursions.statusCode()).as(excursions.body()).isEqualTo(200);
    java.util.regex.Matcher apiDeadline =
        java.util.regex.Pattern.compile("\"deadline\":\"([^\"]+)\"").matcher(excursions.body());
    assertThat(apiDeadline.find()).as(excursions.body()).isTrue();
    double expected = Instant.parse(apiDeadline.group(1)).toEpochMilli() / 1000.0;
    String gauge = "kwanta_excursion_deadline_timestamp_seconds{" + labels + "} ";
    String line =
        scrape
            .lines()
            .filter(l -> l.startsWith(gauge))
            .findFirst()
            .orElseThrow(() -> new AssertionError("no " + gauge + " in the scrape"));
    assertThat(Double.parseDouble(line.substring(gauge.length()).trim()))
        .isCloseTo(expected, org.assertj.core.api.Assertions.within(0.001));
    // AL2 since about 30 minutes: its deadline lies about 24 hours ahead (AL2's allowance)
    assertThat(expected - Instant.now().getEpochSecond()).isBetween(22.5 * 3600, 24.0 * 3600);
  }
}
