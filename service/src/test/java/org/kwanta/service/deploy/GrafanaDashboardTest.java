package org.kwanta.service.deploy;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.TreeSet;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.kwanta.service.metrics.MetricNames;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.dataformat.yaml.YAMLMapper;

/**
 * Grafana is not installed on the build machines, so the provisioned dashboard is checked here: it
 * parses, uses the provisioned datasource, and every query names only documented metrics and (when
 * promtool is installed) is valid PromQL.
 */
class GrafanaDashboardTest {

  private static final Path ROOT = Path.of("..").toAbsolutePath().normalize();
  private static final Path GRAFANA = ROOT.resolve("deploy/grafana");

  private static JsonNode dashboard() throws Exception {
    return JsonMapper.builder()
        .build()
        .readTree(Files.readString(GRAFANA.resolve("dashboards/kwanta-overview.json")));
  }

  /** Every PromQL query: panel targets and template variables. */
  private static List<String> queries(JsonNode dashboard) {
    List<String> queries = new ArrayList<>();
    for (JsonNode panel : dashboard.get("panels")) {
      JsonNode targets = panel.get("targets");
      if (targets != null) {
        targets.forEach(t -> queries.add(t.get("expr").asString()));
      }
    }
    for (JsonNode variable : dashboard.get("templating").get("list")) {
      queries.add(variable.get("query").get("query").asString());
    }
    return queries;
  }

  @Test
  void everyQueryNamesOnlyDocumentedMetrics() throws Exception {
    Set<String> used = new TreeSet<>();
    queries(dashboard()).forEach(q -> used.addAll(PromQl.metricNames(q)));
    assertThat(MetricNames.exposedNames()).containsAll(used);
    assertThat(used)
        .contains(
            "kwanta_sample_level",
            "kwanta_sample_value",
            "kwanta_sample_ph_at_temperature",
            "kwanta_readings_ingested_total");
  }

  @Test
  void dashboardHasTheOverviewTrendAndExcursionSections() throws Exception {
    JsonNode dashboard = dashboard();
    List<String> rows = new ArrayList<>();
    List<String> titles = new ArrayList<>();
    for (JsonNode panel : dashboard.get("panels")) {
      (panel.get("type").asString().equals("row") ? rows : titles)
          .add(panel.get("title").asString());
    }
    assertThat(rows).contains("Plant overview", "pH and conductivity", "Excursions");
    assertThat(titles)
        .contains("pH at operating temperature", "Cation conductivity (µS/cm at 25 °C)");
    assertThat(dashboard.get("uid").asString()).isEqualTo("kwanta-overview");
  }

  @Test
  void panelsUseTheProvisionedDatasource() throws Exception {
    JsonNode datasources =
        new YAMLMapper()
            .readTree(Files.readString(GRAFANA.resolve("provisioning/datasources/prometheus.yml")));
    String uid = datasources.get("datasources").get(0).get("uid").asString();
    for (JsonNode panel : dashboard().get("panels")) {
      if (!panel.get("type").asString().equals("row")) {
        assertThat(panel.get("datasource").get("uid").asString())
            .as(panel.get("title").asString())
            .isEqualTo(uid);
      }
    }
  }

  @Test
  void providerPathIsWhereComposeMountsTheDashboards() throws Exception {
    JsonNode provider =
        new YAMLMapper()
            .readTree(Files.readString(GRAFANA.resolve("provisioning/dashboards/kwanta.yml")));
    String path = provider.get("providers").get(0).get("options").get("path").asString();
    JsonNode compose =
        new YAMLMapper().readTree(Files.readString(ROOT.resolve("docker-compose.yml")));
    assertThat(compose.get("services").get("grafana").get("volumes").toString())
        .contains("./deploy/grafana/dashboards:" + path);
  }

  @Test
  void everyQueryIsValidPromQl(@TempDir Path dir) throws Exception {
    // promtool has no "check query"; a recording-rule file holding every query serves instead.
    StringBuilder rules = new StringBuilder("groups:\n  - name: dashboard\n    rules:\n");
    int i = 0;
    for (String q : queries(dashboard())) {
      String expr =
          q.replaceAll("^label_values\\((.*),\\s*[a-zA-Z_]+\\s*\\)$", "$1")
              .replace("$__rate_interval", "5m")
              .replaceAll("\\$[a-zA-Z_]+", ".*");
      rules
          .append("      - record: dashboard_query_")
          .append(i++)
          .append("\n        expr: '")
          .append(expr.replace("'", "''"))
          .append("'\n");
    }
    Files.writeString(dir.resolve("queries.yml"), rules);
    assertThat(Promtool.run(dir, "check", "rules", "queries.yml")).contains("SUCCESS");
  }
}
