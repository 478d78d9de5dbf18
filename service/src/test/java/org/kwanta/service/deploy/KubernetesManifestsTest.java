package org.kwanta.service.deploy;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.Map;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import tools.jackson.databind.JsonNode;
import tools.jackson.dataformat.yaml.YAMLMapper;

/**
 * There is no cluster on the build machines, so the Kubernetes manifests are checked by parsing
 * them: the Deployment's probes use the service's health groups, the Service and the ConfigMap
 * match it, the database credentials come from a Secret reference, and the settings are ones the
 * application reads.
 */
class KubernetesManifestsTest {

  private static final Path ROOT = Path.of("..").toAbsolutePath().normalize();
  private static final Path K8S = ROOT.resolve("deploy/k8s");
  private static final Map<String, JsonNode> BY_KIND = new HashMap<>();

  @BeforeAll
  static void parse() throws Exception {
    YAMLMapper yaml = new YAMLMapper();
    try (var files = Files.list(K8S)) {
      for (Path file : files.filter(f -> f.toString().endsWith(".yaml")).sorted().toList()) {
        JsonNode doc = yaml.readTree(Files.readString(file));
        assertThat(doc.get("apiVersion")).as(file.toString()).isNotNull();
        assertThat(BY_KIND.put(doc.get("kind").asString(), doc)).as(file.toString()).isNull();
      }
    }
  }

  private static JsonNode container() {
    return BY_KIND
        .get("Deployment")
        .get("spec")
        .get("template")
        .get("spec")
        .get("containers")
        .get(0);
  }

  @Test
  void manifestsDeclareDeploymentServiceAndConfigMap() {
    assertThat(BY_KIND).containsKeys("Deployment", "Service", "ConfigMap");
    assertThat(BY_KIND).doesNotContainKey("Secret");
  }

  @Test
  void probesUseTheLivenessAndReadinessHealthGroups() {
    JsonNode c = container();
    assertThat(c.get("livenessProbe").get("httpGet").get("path").asString())
        .isEqualTo("/actuator/health/liveness");
    assertThat(c.get("readinessProbe").get("httpGet").get("path").asString())
        .isEqualTo("/actuator/health/readiness");
    assertThat(c.get("livenessProbe").get("httpGet").get("port").asString()).isEqualTo("http");
  }

  @Test
  void serviceSelectsThePodsAndTargetsTheContainerPort() throws Exception {
    JsonNode deployment = BY_KIND.get("Deployment");
    JsonNode service = BY_KIND.get("Service");
    JsonNode podLabels = deployment.get("spec").get("template").get("metadata").get("labels");
    service
        .get("spec")
        .get("selector")
        .properties()
        .forEach(e -> assertThat(podLabels.get(e.getKey())).isEqualTo(e.getValue()));
    assertThat(deployment.get("spec").get("selector").get("matchLabels")).isEqualTo(podLabels);
    JsonNode port = container().get("ports").get(0);
    assertThat(service.get("spec").get("ports").get(0).get("targetPort").asString())
        .isEqualTo(port.get("name").asString());
    JsonNode application =
        new YAMLMapper()
            .readTree(
                Files.readString(ROOT.resolve("service/src/main/resources/application.yaml")));
    int serverPort = application.get("server").get("port").asInt();
    assertThat(port.get("containerPort").asInt()).isEqualTo(serverPort);
    JsonNode config = BY_KIND.get("ConfigMap").get("data");
    assertThat(Integer.parseInt(config.get("SERVER_PORT").asString())).isEqualTo(serverPort);
    // prometheus.io/* annotations cannot carry the scrape key: a target found by them would be down
    assertThat(service.get("metadata").has("annotations")).isFalse();
  }

  @Test
  void scrapeKeyComesFromASecretMountedAsTheFileTheServiceReads() throws Exception {
    JsonNode podSpec = BY_KIND.get("Deployment").get("spec").get("template").get("spec");
    JsonNode volume = null;
    for (JsonNode v : podSpec.get("volumes")) {
      if (v.has("secret")) {
        volume = v;
      }
    }
    assertThat(volume).isNotNull();
    String secret = volume.get("secret").get("secretName").asString();
    assertThat(secret).isEqualTo("kwanta-scrape-key");
    String mountPath = null;
    for (JsonNode m : container().get("volumeMounts")) {
      if (m.get("name").asString().equals(volume.get("name").asString())) {
        assertThat(m.get("readOnly").asBoolean()).isTrue();
        mountPath = m.get("mountPath").asString();
      }
    }
    assertThat(mountPath).isNotNull();
    // the file is readable by the pod's user through its group
    assertThat(podSpec.get("securityContext").get("fsGroup").asInt())
        .isEqualTo(podSpec.get("securityContext").get("runAsUser").asInt());
    String keyFile = BY_KIND.get("ConfigMap").get("data").get("KWANTA_SCRAPE_KEY_FILE").asString();
    assertThat(keyFile).isEqualTo(mountPath + "/key");
    // Prometheus reads the same Secret key through the documented mount
    JsonNode job =
        new YAMLMapper()
            .readTree(Files.readString(ROOT.resolve("deploy/prometheus/kubernetes.yml")))
            .get("scrape_configs")
            .get(0);
    assertThat(job.get("metrics_path").asString()).isEqualTo("/actuator/prometheus");
    assertThat(job.get("authorization").get("credentials_file").asString())
        .isEqualTo("/etc/prometheus/secrets/" + secret + "/key");
    assertThat(Files.readString(K8S.resolve("configmap.yaml")))
        .contains("kubectl create secret generic " + secret + " --from-literal=key=");
  }

  @Test
  void settingsComeFromTheConfigMapAndCredentialsFromASecretReference() {
    JsonNode c = container();
    assertThat(c.get("envFrom").get(0).get("configMapRef").get("name").asString())
        .isEqualTo(BY_KIND.get("ConfigMap").get("metadata").get("name").asString());
    Map<String, String> secretKeys = new HashMap<>();
    for (JsonNode env : c.get("env")) {
      JsonNode ref = env.get("valueFrom").get("secretKeyRef");
      assertThat(ref.get("name").asString()).isEqualTo("kwanta-database");
      secretKeys.put(env.get("name").asString(), ref.get("key").asString());
    }
    assertThat(secretKeys)
        .containsEntry("SPRING_DATASOURCE_USERNAME", "username")
        .containsEntry("SPRING_DATASOURCE_PASSWORD", "password");
    JsonNode config = BY_KIND.get("ConfigMap").get("data");
    assertThat(config.get("SPRING_DATASOURCE_URL").asString()).startsWith("jdbc:postgresql://");
    assertThat(config.has("SPRING_DATASOURCE_PASSWORD")).isFalse();
    // Relaxed binding: dots to underscores, dashes dropped (kwanta.demo.load-plant).
    assertThat(config.get("KWANTA_DEMO_LOADPLANT").asString()).isEqualTo("false");
  }
}
