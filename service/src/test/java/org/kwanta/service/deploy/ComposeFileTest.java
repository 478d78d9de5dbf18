package org.kwanta.service.deploy;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import tools.jackson.databind.JsonNode;
import tools.jackson.dataformat.yaml.YAMLMapper;

/**
 * There is no Docker engine on the build machines, so docker-compose.yml is checked by parsing it:
 * its services, health checks, and that the environment names it sets are the ones the application
 * reads.
 */
class ComposeFileTest {

  private static final Path ROOT = Path.of("..").toAbsolutePath().normalize();

  @Test
  void composeFileDeclaresDatabaseAndServiceWithHealthChecks() throws Exception {
    JsonNode compose =
        new YAMLMapper().readTree(Files.readString(ROOT.resolve("docker-compose.yml")));
    JsonNode services = compose.get("services");
    assertThat(services.has("postgres")).isTrue();
    assertThat(services.has("kwanta")).isTrue();
    assertThat(services.get("postgres").has("healthcheck")).isTrue();
    assertThat(services.get("kwanta").has("healthcheck")).isTrue();
    assertThat(services.get("kwanta").get("depends_on").get("postgres").get("condition").asString())
        .isEqualTo("service_healthy");
  }

  @Test
  void composeFileRunsPrometheusWithTheRulesAndGrafanaWithTheDashboards() throws Exception {
    JsonNode compose =
        new YAMLMapper().readTree(Files.readString(ROOT.resolve("docker-compose.yml")));
    JsonNode services = compose.get("services");
    String prometheusVolumes = services.get("prometheus").get("volumes").toString();
    assertThat(prometheusVolumes)
        .contains("./deploy/prometheus/prometheus.yml:/etc/prometheus/prometheus.yml")
        .contains("./deploy/prometheus/rules:/etc/prometheus/rules");
    assertThat(services.get("grafana").get("volumes").toString())
        .contains("./deploy/grafana/provisioning:/etc/grafana/provisioning");
    for (JsonNode service : List.of(services.get("prometheus"), services.get("grafana"))) {
      for (JsonNode volume : service.get("volumes")) {
        String source = volume.asString().split(":")[0];
        if (source.startsWith("./")) { // a bind mount; others are named volumes
          assertThat(ROOT.resolve(source)).as(volume.asString()).exists();
        } else {
          assertThat(compose.get("volumes").has(source)).as(volume.asString()).isTrue();
        }
      }
    }
    // The scrape target is the compose service name and the port the service listens on.
    JsonNode prometheus =
        new YAMLMapper()
            .readTree(Files.readString(ROOT.resolve("deploy/prometheus/prometheus.yml")));
    String target =
        prometheus
            .get("scrape_configs")
            .get(0)
            .get("static_configs")
            .get(0)
            .get("targets")
            .get(0)
            .asString();
    assertThat(target)
        .isEqualTo(
            "kwanta:" + services.get("kwanta").get("environment").get("SERVER_PORT").asString());
    // Grafana's provisioned datasource points at the compose service.
    JsonNode datasource =
        new YAMLMapper()
            .readTree(
                Files.readString(
                    ROOT.resolve("deploy/grafana/provisioning/datasources/prometheus.yml")));
    assertThat(datasource.get("datasources").get(0).get("url").asString())
        .isEqualTo("http://prometheus:9090");
  }

  @Test
  void serviceEnvironmentMatchesApplicationConfiguration() throws Exception {
    JsonNode compose =
        new YAMLMapper().readTree(Files.readString(ROOT.resolve("docker-compose.yml")));
    JsonNode postgres = compose.get("services").get("postgres").get("environment");
    JsonNode kwanta = compose.get("services").get("kwanta").get("environment");
    // Spring's relaxed binding: SPRING_DATASOURCE_URL -> spring.datasource.url, which switches off
    // the
    // embedded database (EmbeddedDatabaseConfiguration) and is what Flyway migrates.
    assertThat(kwanta.get("SPRING_DATASOURCE_URL").asString())
        .isEqualTo("jdbc:postgresql://postgres:5432/" + postgres.get("POSTGRES_DB").asString());
    assertThat(kwanta.get("SPRING_DATASOURCE_USERNAME").asString())
        .isEqualTo(postgres.get("POSTGRES_USER").asString());
    assertThat(kwanta.get("SPRING_DATASOURCE_PASSWORD").asString())
        .isEqualTo(postgres.get("POSTGRES_PASSWORD").asString());
    String healthcheck =
        compose.get("services").get("kwanta").get("healthcheck").get("test").toString();
    assertThat(healthcheck).contains("/actuator/health/readiness");
    Map<String, String> application =
        Map.of(
            "SPRING_DATASOURCE_URL", "spring.datasource.url",
            "SERVER_PORT", "server.port");
    JsonNode yaml =
        new YAMLMapper()
            .readTree(
                Files.readString(ROOT.resolve("service/src/main/resources/application.yaml")));
    assertThat(yaml.get("server").get("port").asInt())
        .isEqualTo(Integer.parseInt(kwanta.get("SERVER_PORT").asString()));
    assertThat(application).containsKey("SPRING_DATASOURCE_URL");
  }

  @Test
  void prometheusScrapesWithTheKeyFileTheServiceWrites() throws Exception {
    JsonNode compose =
        new YAMLMapper().readTree(Files.readString(ROOT.resolve("docker-compose.yml")));
    JsonNode services = compose.get("services");
    // the service writes its scrape key into KWANTA_SCRAPE_KEY_FILE
    // (kwanta.security.scrape-key-file)
    String keyFile =
        services.get("kwanta").get("environment").get("KWANTA_SCRAPE_KEY_FILE").asString();
    JsonNode yaml =
        new YAMLMapper()
            .readTree(
                Files.readString(ROOT.resolve("service/src/main/resources/application.yaml")));
    assertThat(yaml.get("kwanta").get("security").get("scrape-key-file").asString())
        .isEqualTo("${KWANTA_SCRAPE_KEY_FILE:}");
    Path keyDir = Path.of(keyFile).getParent();
    String volume = mountOf(services.get("kwanta"), keyDir.toString());
    assertThat(compose.get("volumes").has(volume)).isTrue();
    // Prometheus mounts the same volume read-only and reads the key from there
    String prometheusDir = null;
    for (JsonNode v : services.get("prometheus").get("volumes")) {
      String[] parts = v.asString().split(":");
      if (parts[0].equals(volume)) {
        assertThat(parts).hasSize(3);
        assertThat(parts[2]).isEqualTo("ro");
        prometheusDir = parts[1];
      }
    }
    assertThat(prometheusDir).as("prometheus mounts volume " + volume).isNotNull();
    JsonNode job =
        new YAMLMapper()
            .readTree(Files.readString(ROOT.resolve("deploy/prometheus/prometheus.yml")))
            .get("scrape_configs")
            .get(0);
    assertThat(job.get("authorization").get("type").asString()).isEqualTo("Bearer");
    assertThat(job.get("authorization").get("credentials_file").asString())
        .isEqualTo(prometheusDir + "/" + Path.of(keyFile).getFileName());
    // the image creates the mount point owned by the service's user, so it can write the file
    assertThat(Files.readString(ROOT.resolve("Dockerfile")))
        .contains("mkdir -p " + keyDir + " && chown kwanta " + keyDir);
  }

  private static JsonNode compose() throws Exception {
    return new YAMLMapper().readTree(Files.readString(ROOT.resolve("docker-compose.yml")));
  }

  /** A value as compose would interpolate it with the defaults of ${VAR:-default}. */
  private static String withDefaults(String value) {
    return value.replaceAll("\\$\\{[A-Z_]+:-([^}]*)}", "$1");
  }

  @Test
  void everyPublishedPortIsBoundToLoopbackByDefault() throws Exception {
    int published = 0;
    for (var service : compose().get("services").properties()) {
      JsonNode ports = service.getValue().get("ports");
      if (ports == null) {
        continue;
      }
      for (JsonNode port : ports) {
        assertThat(withDefaults(port.asString()))
            .as(service.getKey() + " " + port.asString())
            .matches("127\\.0\\.0\\.1:\\d+:\\d+");
        published++;
      }
    }
    assertThat(published).isGreaterThanOrEqualTo(4);
  }

  @Test
  void noPasswordIsWrittenInTheComposeFileAndAMissingEnvFileStopsCompose() throws Exception {
    String example = Files.readString(ROOT.resolve("deploy/compose.env.example"));
    Set<String> required = new TreeSet<>();
    for (var service : compose().get("services").properties()) {
      JsonNode environment = service.getValue().get("environment");
      if (environment == null) {
        continue;
      }
      for (var variable : environment.properties()) {
        String name = variable.getKey();
        String value = variable.getValue().asString();
        if (name.matches(".*(PASSWORD|SECRET|_KEY)$")) {
          // ${VAR:?message} fails with the message when VAR is unset or empty; ${VAR:-} is optional
          Matcher m = Pattern.compile("^\\$\\{([A-Z_]+)(:\\?.+|:-)}$").matcher(value);
          assertThat(m.matches()).as(service.getKey() + " " + name + ": " + value).isTrue();
          assertThat(example).as(m.group(1)).containsPattern("(?m)^" + m.group(1) + "=$");
          if (m.group(2).startsWith(":?")) {
            assertThat(m.group(2)).contains(".env", "deploy/compose.env.example");
            required.add(m.group(1));
          }
        }
      }
    }
    assertThat(required).contains("POSTGRES_PASSWORD", "GRAFANA_ADMIN_PASSWORD");
    assertThat(Files.readAllLines(ROOT.resolve(".gitignore"))).contains(".env");
  }

  @Test
  void grafanaHasNoAnonymousAccess() throws Exception {
    JsonNode grafana = compose().get("services").get("grafana").get("environment");
    assertThat(grafana.get("GF_AUTH_ANONYMOUS_ENABLED").asString()).isEqualTo("false");
    assertThat(grafana.get("GF_SECURITY_ADMIN_PASSWORD").asString())
        .startsWith("${GRAFANA_ADMIN_PASSWORD:?");
  }

  @Test
  void serviceHealthCheckUsesOnlyWhatTheImageHas() throws Exception {
    String dockerfile = Files.readString(ROOT.resolve("Dockerfile"));
    // eclipse-temurin is Ubuntu: bash is there, curl and wget are not promised
    assertThat(dockerfile).containsPattern("(?m)^FROM eclipse-temurin:17-jre");
    String test = compose().get("services").get("kwanta").get("healthcheck").get("test").toString();
    assertThat(test).contains("bash", "/dev/tcp/127.0.0.1/8080", "/actuator/health/readiness");
    assertThat(test).doesNotContain("curl", "wget");
  }

  @Test
  void alertmanagerSendsToTheDemoReceiverOnAnInternalNetworkOnly() throws Exception {
    JsonNode compose = compose();
    JsonNode services = compose.get("services");
    assertThat(services.get("alertmanager").get("volumes").toString())
        .contains("./deploy/alertmanager/alertmanager.yml:/etc/alertmanager/alertmanager.yml");
    JsonNode receiver = services.get("webhook-log");
    assertThat(receiver.has("ports")).isFalse();
    assertThat(receiver.get("networks").toString()).isEqualTo("[\"alerting\"]");
    assertThat(compose.get("networks").get("alerting").get("internal").asBoolean()).isTrue();
    assertThat(services.get("alertmanager").get("networks").toString()).contains("alerting");
    assertThat(receiver.get("volumes").get(0).asString().split(":")[0])
        .satisfies(source -> assertThat(ROOT.resolve(source)).exists());
    JsonNode alertmanager =
        new YAMLMapper()
            .readTree(Files.readString(ROOT.resolve("deploy/alertmanager/alertmanager.yml")));
    String url =
        alertmanager.get("receivers").get(0).get("webhook_configs").get(0).get("url").asString();
    assertThat(url)
        .startsWith(
            "http://webhook-log:" + receiver.get("environment").get("WEBHOOK_LOG_PORT").asString());
  }

  /** The named volume a service mounts at this path. */
  private static String mountOf(JsonNode service, String path) {
    for (JsonNode v : service.get("volumes")) {
      String[] parts = v.asString().split(":");
      if (parts[1].equals(path)) {
        return parts[0];
      }
    }
    throw new AssertionError("nothing mounted at " + path);
  }
}
