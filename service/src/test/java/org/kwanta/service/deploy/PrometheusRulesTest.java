package org.kwanta.service.deploy;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashSet;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.kwanta.service.metrics.MetricNames;
import tools.jackson.databind.JsonNode;
import tools.jackson.dataformat.yaml.YAMLMapper;

/**
 * The Prometheus configuration and alert rules: they name only documented metrics, and promtool
 * (when installed) accepts them and passes the rules' unit tests, among them the Brackenmoor
 * condenser-leak story walking through the action-level alerts.
 */
class PrometheusRulesTest {

  private static final Path ROOT = Path.of("..").toAbsolutePath().normalize();
  private static final Path PROMETHEUS = ROOT.resolve("deploy/prometheus");
  private static final String RULES = "rules/kwanta-alerts.yml";

  @Test
  void alertRulesNameOnlyDocumentedMetrics() throws Exception {
    JsonNode rules = new YAMLMapper().readTree(Files.readString(PROMETHEUS.resolve(RULES)));
    Set<String> used = new HashSet<>();
    Set<String> alerts = new HashSet<>();
    for (JsonNode group : rules.get("groups")) {
      for (JsonNode rule : group.get("rules")) {
        used.addAll(PromQl.metricNames(rule.get("expr").asString()));
        alerts.add(rule.get("alert").asString());
      }
    }
    assertThat(MetricNames.exposedNames()).containsAll(used);
    assertThat(used)
        .contains(
            "kwanta_sample_level",
            "kwanta_sample_instrument_in_doubt",
            "kwanta_sample_outside_normal",
            "kwanta_sample_reading_age_seconds",
            "kwanta_readings_ingested_total");
    assertThat(alerts)
        .contains(
            "KwantaActionLevel1",
            "KwantaInstrumentInDoubt",
            "KwantaOutsideNormalRange",
            "KwantaStaleData",
            "KwantaIngestStopped");
  }

  @Test
  void scrapeConfigurationReadsTheServiceEndpointAndLoadsTheRules() throws Exception {
    JsonNode config =
        new YAMLMapper().readTree(Files.readString(PROMETHEUS.resolve("prometheus.yml")));
    JsonNode job = config.get("scrape_configs").get(0);
    assertThat(job.get("metrics_path").asString()).isEqualTo("/actuator/prometheus");
    assertThat(config.get("rule_files").get(0).asString()).isEqualTo(RULES);
    // /actuator/prometheus needs a read key: the scrape sends the key file's content as a bearer
    assertThat(job.get("authorization").get("type").asString()).isEqualTo("Bearer");
    assertThat(job.get("authorization").get("credentials_file").asString()).isNotBlank();
  }

  @Test
  void promtoolAcceptsTheRulesAndTheConfiguration() throws Exception {
    assertThat(Promtool.run(PROMETHEUS, "check", "rules", RULES)).contains("SUCCESS");
    // syntax only: the credentials files exist only where the service wrote or a Secret mounts them
    assertThat(Promtool.run(PROMETHEUS, "check", "config", "--syntax-only", "prometheus.yml"))
        .contains("SUCCESS");
    assertThat(Promtool.run(PROMETHEUS, "check", "config", "--syntax-only", "kubernetes.yml"))
        .contains("SUCCESS");
  }

  @Test
  void alertRulesPassTheirUnitTests() throws Exception {
    assertThat(Promtool.run(PROMETHEUS.resolve("rules"), "test", "rules", "kwanta-alerts.test.yml"))
        .contains("SUCCESS");
  }
}
