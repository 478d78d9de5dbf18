package org.kwanta.service.deploy;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.kwanta.service.system.MetricNames;
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
  private static final Path ALERTMANAGER = ROOT.resolve("deploy/alertmanager");
  private static final String RULES = "rules/kwanta-alerts.yml";

  @Test
  void alertRulesNameOnlyDocumentedMetrics() throws Exception {
    JsonNode rules = new YAMLMapper().readTree(Files.readString(PROMETHEUS.resolve(RULES)));
    Set<String> used = new HashSet<>();
    Set<String> alerts = new HashSet<>();
    Set<String> recorded = new HashSet<>();
    for (JsonNode group : rules.get("groups")) {
      for (JsonNode rule : group.get("rules")) {
        used.addAll(PromQl.metricNames(rule.get("expr").asString()));
        if (rule.has("record")) {
          recorded.add(rule.get("record").asString());
        } else {
          alerts.add(rule.get("alert").asString());
        }
      }
    }
    used.removeAll(recorded);
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
    // the allowance overrun on the service's deadline gauge
    assertThat(
            Promtool.run(
                PROMETHEUS.resolve("rules"), "test", "rules", "kwanta-allowances.test.yml"))
        .contains("SUCCESS");
  }

  private static Map<String, JsonNode> alertRules() throws Exception {
    JsonNode rules = new YAMLMapper().readTree(Files.readString(PROMETHEUS.resolve(RULES)));
    Map<String, JsonNode> byName = new LinkedHashMap<>();
    for (JsonNode group : rules.get("groups")) {
      for (JsonNode rule : group.get("rules")) {
        if (rule.has("alert")) {
          byName.put(rule.get("alert").asString(), rule);
        }
      }
    }
    return byName;
  }

  @Test
  void annotationsAndGroupingUseOnlyLabelsTheMetricsCarry() throws Exception {
    Map<String, List<String>> labelsOf = new LinkedHashMap<>();
    MetricNames.METRICS.forEach(m -> m.exposedNames().forEach(n -> labelsOf.put(n, m.labels())));
    // added by the scrape (job, instance, pod) and by the rules (severity)
    Set<String> scrape = Set.of("job", "instance", "pod", "severity");
    Set<String> every = new HashSet<>(scrape);
    labelsOf.values().forEach(every::addAll);
    java.util.regex.Pattern label = java.util.regex.Pattern.compile("\\$labels\\.([a-z_]+)");
    int checked = 0;
    for (Map.Entry<String, JsonNode> alert : alertRules().entrySet()) {
      Set<String> carried = new HashSet<>(scrape);
      boolean known = true;
      for (String metric : PromQl.metricNames(alert.getValue().get("expr").asString())) {
        if (labelsOf.containsKey(metric)) {
          carried.addAll(labelsOf.get(metric));
        } else {
          known = false; // a platform metric: its labels are not catalogued
        }
      }
      if (!known) {
        continue;
      }
      java.util.regex.Matcher m = label.matcher(alert.getValue().get("annotations").toString());
      while (m.find()) {
        assertThat(carried).as(alert.getKey()).contains(m.group(1));
        checked++;
      }
    }
    assertThat(checked).isPositive();
    JsonNode route =
        new YAMLMapper()
            .readTree(Files.readString(ALERTMANAGER.resolve("alertmanager.yml")))
            .get("route");
    for (JsonNode groupBy : route.get("group_by")) {
      if (!groupBy.asString().equals("alertname")) {
        assertThat(every).as("group_by").contains(groupBy.asString());
      }
    }
  }

  @Test
  void everyAlertLinksItsRunbookSection() throws Exception {
    String runbook = Files.readString(ROOT.resolve("docs/runbook.md"));
    Set<String> anchors = new HashSet<>();
    for (String line : runbook.split("\n")) {
      if (line.startsWith("## ")) {
        // GitHub's anchors: lower case, spaces to dashes, other punctuation dropped
        anchors.add(
            line.substring(3).trim().toLowerCase().replaceAll("[^a-z0-9 -]", "").replace(' ', '-'));
      }
    }
    for (Map.Entry<String, JsonNode> alert : alertRules().entrySet()) {
      String url = alert.getValue().get("annotations").get("runbook_url").asString();
      assertThat(url)
          .as(alert.getKey())
          .isEqualTo("docs/runbook.md#" + alert.getKey().toLowerCase());
      assertThat(anchors).as(alert.getKey()).contains(url.substring(url.indexOf('#') + 1));
    }
  }

  @Test
  void chemistryAlertsSayTheyAreAdvisory() throws Exception {
    JsonNode rules = new YAMLMapper().readTree(Files.readString(PROMETHEUS.resolve(RULES)));
    int checked = 0;
    for (JsonNode group : rules.get("groups")) {
      if (group.get("name").asString().equals("kwanta-chemistry")) {
        for (JsonNode rule : group.get("rules")) {
          assertThat(rule.get("annotations").get("description").asString())
              .as(rule.get("alert").asString())
              .contains("Advisory", "the plant's own procedures govern");
          checked++;
        }
      }
    }
    assertThat(checked).isGreaterThanOrEqualTo(10);
  }

  @Test
  void staleDataWatchesOnlyOnlineParametersAndServiceDownCoversAVanishedTarget() throws Exception {
    Map<String, JsonNode> alerts = alertRules();
    String stale = alerts.get("KwantaStaleData").get("expr").asString();
    for (String periodic :
        List.of("iron", "copper", "chloride", "sulfate", "silica", "phosphate")) {
      assertThat(stale).contains(periodic);
    }
    assertThat(stale).contains("parameter!~");
    assertThat(alerts.get("KwantaDown").get("expr").asString())
        .contains("absent(up{job=\"kwanta\"})");
    // the overrun is the service's own excursion deadline passed, not a level history that
    // Prometheus would have to keep for a week (nor the held seconds, capped at a day)
    assertThat(alerts.get("KwantaActionLevelAllowanceOverrun").get("expr").asString())
        .contains("kwanta_excursion_deadline_timestamp_seconds", "time()")
        .doesNotContain("held_seconds", "[168h]");
  }

  @Test
  void prometheusSendsToTheAlertmanagerWhoseInhibitRulesNameRealAlerts() throws Exception {
    JsonNode config =
        new YAMLMapper().readTree(Files.readString(PROMETHEUS.resolve("prometheus.yml")));
    assertThat(
            config
                .get("alerting")
                .get("alertmanagers")
                .get(0)
                .get("static_configs")
                .get(0)
                .get("targets")
                .get(0)
                .asString())
        .isEqualTo("alertmanager:9093");
    JsonNode alertmanager =
        new YAMLMapper().readTree(Files.readString(ALERTMANAGER.resolve("alertmanager.yml")));
    Set<String> names = alertRules().keySet();
    boolean al3InhibitsAl1AndAl2 = false;
    for (JsonNode rule : alertmanager.get("inhibit_rules")) {
      String source = rule.get("source_matchers").toString();
      String target = rule.get("target_matchers").toString();
      java.util.regex.Matcher m =
          java.util.regex.Pattern.compile("Kwanta[A-Za-z0-9]+").matcher(source + target);
      while (m.find()) {
        assertThat(names).contains(m.group());
      }
      if (source.contains("KwantaActionLevel3")
          && source.contains("KwantaImmediateShutdown")
          && target.contains("KwantaActionLevel1")
          && target.contains("KwantaActionLevel2")) {
        assertThat(rule.get("equal").toString()).contains("sample_point", "parameter");
        al3InhibitsAl1AndAl2 = true;
      }
    }
    assertThat(al3InhibitsAl1AndAl2).isTrue();
  }

  @Test
  void amtoolAcceptsTheAlertmanagerConfiguration() throws Exception {
    assertThat(Amtool.run(ALERTMANAGER, "check-config", "alertmanager.yml")).contains("SUCCESS");
  }
}
