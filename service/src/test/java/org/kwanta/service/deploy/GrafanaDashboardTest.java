package org.kwanta.service.deploy;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.kwanta.model.Parameter;
import org.kwanta.service.system.MetricNames;
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
      if (variable.get("type").asString().equals("query")) {
        queries.add(variable.get("query").get("query").asString());
      }
    }
    return queries;
  }

  private static List<JsonNode> panels(JsonNode dashboard, String type) {
    List<JsonNode> panels = new ArrayList<>();
    dashboard
        .get("panels")
        .forEach(
            p -> {
              if (p.get("type").asString().equals(type)) {
                panels.add(p);
              }
            });
    return panels;
  }

  private static JsonNode panel(JsonNode dashboard, String title) {
    for (JsonNode p : dashboard.get("panels")) {
      if (p.get("title").asString().equals(title)) {
        return p;
      }
    }
    throw new AssertionError("no panel " + title);
  }

  /** The level legend of the chemist page: level text to colour, from its style sheet. */
  private static Map<String, String> pageLevelColours() throws Exception {
    String css = Files.readString(ROOT.resolve("service/src/main/resources/static/css/style.css"));
    Map<String, String> classes =
        Map.of(
            "normal", "lvl-normal",
            "outside normal", "lvl-outside-normal",
            "AL1", "lvl-al1",
            "AL2", "lvl-al2",
            "AL3", "lvl-al3",
            "SHUTDOWN", "lvl-shutdown");
    Map<String, String> colours = new TreeMap<>();
    classes.forEach(
        (text, cls) -> {
          Matcher rule = Pattern.compile("\\." + cls + "\\s*\\{([^}]*)}").matcher(css);
          assertThat(rule.find()).as(cls).isTrue();
          // the badge colour: its background, or its text colour where it has none (normal)
          Matcher background =
              Pattern.compile("background:\\s*(#[0-9a-f]{6})").matcher(rule.group(1));
          Matcher color = Pattern.compile("(?<!-)color:\\s*(#[0-9a-f]{6})").matcher(rule.group(1));
          colours.put(
              text, background.find() ? background.group(1) : color.find() ? color.group(1) : null);
        });
    return colours;
  }

  /** The value mappings of a level panel (its defaults, or its override of the level column). */
  private static JsonNode levelMappings(JsonNode panel) {
    JsonNode defaults = panel.get("fieldConfig").get("defaults").get("mappings");
    if (defaults != null) {
      return defaults.get(0).get("options");
    }
    for (JsonNode override : panel.get("fieldConfig").get("overrides")) {
      for (JsonNode property : override.get("properties")) {
        if (property.get("id").asString().equals("mappings")) {
          return property.get("value").get(0).get("options");
        }
      }
    }
    throw new AssertionError("no level mappings in " + panel.get("title"));
  }

  @Test
  void everyQueryNamesOnlyDocumentedMetrics() throws Exception {
    Set<String> used = new TreeSet<>();
    queries(dashboard()).forEach(q -> used.addAll(PromQl.metricNames(q)));
    assertThat(MetricNames.exposedNames()).containsAll(used);
    assertThat(used)
        .contains(
            "kwanta_sample_level",
            "kwanta_sample_conductivity_microsiemens_per_centimetre",
            "kwanta_sample_concentration_micrograms_per_kilogram",
            "kwanta_sample_ph",
            "kwanta_limit_threshold_conductivity_microsiemens_per_centimetre",
            "kwanta_limit_threshold_concentration_micrograms_per_kilogram",
            "kwanta_limit_threshold_ph",
            "kwanta_sample_ph_at_temperature",
            "kwanta_sample_instrument_in_doubt",
            "kwanta_diagnosis_finding",
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
        .contains(
            "pH at operating temperature and neutral pH", "Cation conductivity (µS/cm at 25 °C)");
    assertThat(dashboard.get("uid").asString()).isEqualTo("kwanta-overview");
  }

  @Test
  void panelsUseTheDatasourceOfATemplateVariableDefaultingToTheProvisionedOne() throws Exception {
    JsonNode datasources =
        new YAMLMapper()
            .readTree(Files.readString(GRAFANA.resolve("provisioning/datasources/prometheus.yml")));
    String uid = datasources.get("datasources").get(0).get("uid").asString();
    JsonNode dashboard = dashboard();
    JsonNode variable = dashboard.get("templating").get("list").get(0);
    assertThat(variable.get("type").asString()).isEqualTo("datasource");
    assertThat(variable.get("query").asString()).isEqualTo("prometheus");
    assertThat(variable.get("current").get("value").asString()).isEqualTo(uid);
    String chosen = "${" + variable.get("name").asString() + "}";
    for (JsonNode panel : dashboard.get("panels")) {
      String type = panel.get("type").asString();
      if (!type.equals("row") && !type.equals("text")) {
        assertThat(panel.get("datasource").get("uid").asString())
            .as(panel.get("title").asString())
            .isEqualTo(chosen);
        panel
            .get("targets")
            .forEach(
                t ->
                    assertThat(t.get("datasource").get("uid").asString())
                        .as(panel.get("title").asString())
                        .isEqualTo(chosen));
      }
    }
    for (JsonNode v : dashboard.get("templating").get("list")) {
      if (v.get("type").asString().equals("query")) {
        assertThat(v.get("datasource").get("uid").asString()).isEqualTo(chosen);
      }
    }
  }

  @Test
  void countsAreOfSamplePointsNotOfSeries() throws Exception {
    int counts = 0;
    for (JsonNode stat : panels(dashboard(), "stat")) {
      for (JsonNode target : stat.get("targets")) {
        String expr = target.get("expr").asString();
        if (expr.startsWith("count(")) {
          assertThat(expr)
              .as(stat.get("title").asString())
              .startsWith("count(count by (plant, sample_point) (");
          assertThat(stat.get("title").asString()).startsWith("Sample points");
          counts++;
        }
      }
    }
    assertThat(counts).isGreaterThanOrEqualTo(4);
  }

  @Test
  void levelPanelsUseThePageLegendAndNeverShowAnInstrumentInDoubtAsPlainNormal() throws Exception {
    JsonNode dashboard = dashboard();
    Map<String, String> page = pageLevelColours();
    List<String> levels = List.of("normal", "outside normal", "AL1", "AL2", "AL3", "SHUTDOWN");
    for (String title : List.of("Worst level per sample point", "Current state", "Level history")) {
      JsonNode panel = panel(dashboard, title);
      assertThat(panel.get("targets").get(0).get("expr").asString())
          .as(title)
          .contains(
              "kwanta_sample_level",
              "0.5 * kwanta_sample_outside_normal",
              "0.25 * kwanta_sample_instrument_in_doubt");
      JsonNode mappings = levelMappings(panel);
      for (int i = 0; i < levels.size(); i++) {
        String level = levels.get(i);
        double code = i == 0 ? 0 : i == 1 ? 0.5 : i - 1;
        JsonNode plain = mappings.get(number(code));
        JsonNode doubt = mappings.get(number(code + 0.25));
        assertThat(plain.get("text").asString()).as(title).isEqualTo(level);
        assertThat(plain.get("color").asString())
            .as(title + " " + level)
            .isEqualTo(page.get(level));
        assertThat(doubt.get("text").asString()).as(title).startsWith(level + " ?");
      }
      // a normal value from a doubtful instrument is not painted like a normal one
      assertThat(mappings.get("0.25").get("color").asString())
          .isNotEqualTo(mappings.get("0").get("color").asString());
    }
    String legend = panel(dashboard, "Levels").get("options").get("content").asString();
    levels.forEach(l -> assertThat(legend).contains(">" + l + "<", page.get(l)));
  }

  private static String number(double code) {
    return code == Math.rint(code) ? Long.toString((long) code) : Double.toString(code);
  }

  @Test
  void levelCodeOfTheDashboardRanksDoubtAboveNormal(@TempDir Path dir) throws Exception {
    // promtool evaluates the dashboard's own level expression on invented Brackenmoor series
    String expr =
        panel(dashboard(), "Level history")
            .get("targets")
            .get(0)
            .get("expr")
            .asString()
            .replace("$plant", "brackenmoor") // plant="$plant": an equality matcher
            .replaceAll("\\$[a-zA-Z_]+", ".*");
    Files.writeString(
        dir.resolve("level.yml"),
        "groups:\n  - name: level\n    rules:\n      - record: level_code\n        expr: '"
            + expr.replace("'", "''")
            + "'\n");
    String series =
        """
        rule_files: [level.yml]
        evaluation_interval: 1m
        tests:
          - interval: 1m
            input_series:
        """;
    String[][] points = {
      // sample point, level, outside normal, in doubt, expected code
      {"U1-CPD", "0", "0", "0", "0"},
      {"U1-ECO-IN", "0", "0", "1", "0.25"},
      {"U1-MS", "0", "1", "0", "0.5"},
      {"U2-CPD", "2", "0", "1", "2.25"},
      {"U2-DRUM", "4", "0", "0", "4"},
    };
    StringBuilder test = new StringBuilder(series);
    StringBuilder expected = new StringBuilder();
    for (String[] p : points) {
      String labels =
          "{plant=\"brackenmoor\",block=\""
              + p[0].substring(0, 2)
              + "\",sample_point=\""
              + p[0]
              + "\",parameter=\"sodium\"}";
      test.append("      - series: 'kwanta_sample_level")
          .append(labels)
          .append("'\n        values: '")
          .append(p[1])
          .append("x5'\n");
      test.append("      - series: 'kwanta_sample_outside_normal")
          .append(labels)
          .append("'\n        values: '")
          .append(p[2])
          .append("x5'\n");
      test.append("      - series: 'kwanta_sample_instrument_in_doubt")
          .append(labels)
          .append("'\n        values: '")
          .append(p[3])
          .append("x5'\n");
      expected
          .append("          - labels: 'level_code")
          .append(labels)
          .append("'\n            value: ")
          .append(p[4])
          .append("\n");
    }
    test.append(
            "    promql_expr_test:\n      - expr: level_code\n        eval_time: 2m\n        exp_samples:\n")
        .append(expected);
    Files.writeString(dir.resolve("level.test.yml"), test.toString());
    assertThat(Promtool.run(dir, "test", "rules", "level.test.yml")).contains("SUCCESS");
  }

  /** The Grafana unit of each canonical unit the dashboard shows. */
  private static final Map<String, String> GRAFANA_UNIT =
      Map.of("uS/cm", "µS/cm", "ug/kg", "µg/kg", "[pH]", "pH", "Cel", "°C", "mV", "mV");

  /** The canonical unit of each metric split by unit, by its Prometheus name. */
  private static Map<String, String> unitOfMetric() {
    Map<String, String> units = new TreeMap<>();
    for (List<MetricNames.PerUnit> split :
        List.of(MetricNames.SAMPLE_VALUES, MetricNames.LIMIT_THRESHOLDS)) {
      split.forEach(m -> units.put(m.metric().prometheusName(), m.unit()));
    }
    return units;
  }

  @Test
  void oneUnitPerAxisAndNoFixedLimitLines() throws Exception {
    Map<String, String> unitOfMetric = unitOfMetric();
    Pattern parameter = Pattern.compile("parameter=\"([a-z_]+)\"");
    for (JsonNode panel : panels(dashboard(), "timeseries")) {
      String title = panel.get("title").asString();
      JsonNode defaults = panel.get("fieldConfig").get("defaults");
      assertThat(defaults.get("unit").asString()).as(title).isNotBlank();
      assertThat(panel.get("fieldConfig").get("overrides").toString())
          .as(title + ": a second unit needs a second panel")
          .doesNotContain("\"unit\"");
      Set<String> units = new TreeSet<>();
      for (JsonNode target : panel.get("targets")) {
        String expr = target.get("expr").asString();
        for (String metric : PromQl.metricNames(expr)) {
          if (unitOfMetric.containsKey(metric)) {
            units.add(GRAFANA_UNIT.get(unitOfMetric.get(metric)));
            // a parameter matcher, if any, names a parameter of the metric's unit
            Matcher m = parameter.matcher(expr);
            while (m.find()) {
              assertThat(Parameter.ofCode(m.group(1)).unit())
                  .as(title + ": " + expr)
                  .isEqualTo(unitOfMetric.get(metric));
            }
          }
        }
        if (expr.contains("kwanta_sample_ph_at_temperature")) {
          units.add("pH");
        }
      }
      assertThat(units).as(title).hasSizeLessThanOrEqualTo(1);
      if (!units.isEmpty()) {
        assertThat(defaults.get("unit").asString()).as(title).isEqualTo(units.iterator().next());
      }
      // no limit lines of fixed numbers: the limits in force are per point, drawn from the
      // service's kwanta_limit_threshold_<quantity>_<unit>
      assertThat(defaults.has("thresholds")).as(title).isFalse();
    }
  }

  @Test
  void currentStateShowsTheLatestValuesOneColumnPerUnitEachWithItsUnit() throws Exception {
    Map<String, String> unitOfMetric = unitOfMetric();
    JsonNode panel = panel(dashboard(), "Current state");
    JsonNode renamed = panel.get("transformations").get(1).get("options").get("renameByName");
    Map<String, String> columnUnit = new TreeMap<>();
    for (JsonNode override : panel.get("fieldConfig").get("overrides")) {
      for (JsonNode property : override.get("properties")) {
        if (property.get("id").asString().equals("unit")) {
          columnUnit.put(
              override.get("matcher").get("options").asString(), property.get("value").asString());
        }
      }
    }
    Set<String> shown = new TreeSet<>();
    for (JsonNode target : panel.get("targets")) {
      for (String metric : PromQl.metricNames(target.get("expr").asString())) {
        if (unitOfMetric.containsKey(metric)) {
          String unit = GRAFANA_UNIT.get(unitOfMetric.get(metric));
          String column = renamed.get("Value #" + target.get("refId").asString()).asString();
          assertThat(column).as(metric).isEqualTo("value " + unit);
          assertThat(columnUnit.get(column)).as(column).isEqualTo(unit);
          shown.add(unitOfMetric.get(metric));
        }
      }
    }
    assertThat(shown).contains("uS/cm", "ug/kg", "[pH]");
  }

  @Test
  void limitLinesComeFromTheLimitsInForceAndPhIsShownMeasuredAndCalculated() throws Exception {
    JsonNode dashboard = dashboard();
    Map<String, String> panels =
        Map.of(
            "pH at 25 °C", "ph",
            "Cation conductivity (µS/cm at 25 °C)", "cation_conductivity",
            "Specific conductivity (µS/cm at 25 °C)", "specific_conductivity",
            "Degassed cation conductivity (µS/cm at 25 °C)", "degassed_cation_conductivity",
            "Sodium (µg/kg)", "sodium");
    for (Map.Entry<String, String> e : panels.entrySet()) {
      boolean hasLimits = false;
      for (JsonNode t : panel(dashboard, e.getKey()).get("targets")) {
        String expr = t.get("expr").asString();
        Parameter parameter = Parameter.ofCode(e.getValue());
        if (expr.startsWith(MetricNames.limitThreshold(parameter).prometheusName() + "{")) {
          hasLimits = true;
          assertThat(expr).as(e.getKey()).contains("parameter=\"" + e.getValue() + "\"");
        }
      }
      assertThat(hasLimits).as(e.getKey() + " draws the limits in force").isTrue();
    }
    String ph =
        panel(dashboard, "pH at 25 °C: measured and calculated from the conductivities")
            .get("targets")
            .toString();
    assertThat(ph).contains("kwanta_sample_ph{").contains("kwanta_sample_ph_calculated{");
    assertThat(
            panel(dashboard, "pH at operating temperature and neutral pH")
                .get("targets")
                .toString())
        .contains("kwanta_sample_neutral_ph_at_temperature{");
  }

  @Test
  void diagnosisFindingsAreListedPerPointCodeAndTarget() throws Exception {
    JsonNode panel = panel(dashboard(), "Diagnosis findings");
    assertThat(panel.get("type").asString()).isEqualTo("table");
    assertThat(panel.get("targets").get(0).get("expr").asString())
        .startsWith("kwanta_diagnosis_finding{")
        .endsWith("== 1");
    JsonNode excluded = panel.get("transformations").get(0).get("options").get("excludeByName");
    for (String label : List.of("sample_point", "reason_code", "points_at")) {
      assertThat(excluded.has(label)).as(label).isFalse();
    }
    assertThat(panel.get("description").asString()).contains("the plant's own procedures govern");
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
