package org.kwanta.service.deploy;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeSet;
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

  /** The documents of the applied files (*.yaml), by "Kind/name". */
  private static final Map<String, JsonNode> BY_NAME = new LinkedHashMap<>();

  /** The single document of a kind that has one; the named one otherwise. */
  private static final Map<String, JsonNode> BY_KIND = new HashMap<>();

  /** The documents of one YAML file ("---" between documents). */
  static List<JsonNode> documents(Path file) throws Exception {
    YAMLMapper yaml = new YAMLMapper();
    List<JsonNode> docs = new ArrayList<>();
    for (String part : Files.readString(file).split("(?m)^---\\s*$")) {
      JsonNode doc = yaml.readTree(part);
      if (doc != null && !doc.isMissingNode() && !doc.isNull()) {
        docs.add(doc);
      }
    }
    return docs;
  }

  @BeforeAll
  static void parse() throws Exception {
    Map<String, Integer> kinds = new HashMap<>();
    try (var files = Files.list(K8S)) {
      for (Path file : files.filter(f -> f.toString().endsWith(".yaml")).sorted().toList()) {
        for (JsonNode doc : documents(file)) {
          assertThat(doc.get("apiVersion")).as(file.toString()).isNotNull();
          String kind = doc.get("kind").asString();
          String name = doc.get("metadata").get("name").asString();
          assertThat(BY_NAME.put(kind + "/" + name, doc)).as(file.toString()).isNull();
          kinds.merge(kind, 1, Integer::sum);
        }
      }
    }
    BY_NAME.forEach(
        (key, doc) -> {
          String kind = key.substring(0, key.indexOf('/'));
          if (kinds.get(kind) == 1 || key.endsWith("/kwanta")) {
            BY_KIND.put(kind, doc);
          }
        });
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
  void manifestsDeclareEverythingTheServiceNeedsButTheSecretValues() {
    assertThat(BY_NAME)
        .containsKeys(
            "Deployment/kwanta",
            "Service/kwanta",
            "ConfigMap/kwanta",
            "Ingress/kwanta",
            "NetworkPolicy/kwanta",
            "NetworkPolicy/postgres",
            "PodDisruptionBudget/kwanta",
            "StatefulSet/postgres",
            "Service/postgres");
    // no Secret is applied from the repository: only a template without values
    assertThat(BY_NAME.keySet()).noneMatch(k -> k.startsWith("Secret/"));
  }

  @Test
  void secretTemplateNamesEverySecretReferencedAndHoldsNoValue() throws Exception {
    Path template = K8S.resolve("secrets.yaml.template");
    Map<String, Set<String>> keys = new HashMap<>();
    for (JsonNode doc : documents(template)) {
      assertThat(doc.get("kind").asString()).isEqualTo("Secret");
      Set<String> names = new TreeSet<>();
      doc.get("stringData")
          .properties()
          .forEach(
              e -> {
                assertThat(e.getValue().asString()).as(e.getKey()).isEmpty();
                names.add(e.getKey());
              });
      keys.put(doc.get("metadata").get("name").asString(), names);
    }
    // every secretKeyRef and secret volume of the manifests is in the template
    List<JsonNode> refs = new ArrayList<>();
    for (JsonNode doc : BY_NAME.values()) {
      refs.addAll(doc.findValues("secretKeyRef"));
    }
    assertThat(refs).isNotEmpty();
    for (JsonNode ref : refs) {
      assertThat(keys).containsKey(ref.get("name").asString());
      assertThat(keys.get(ref.get("name").asString())).contains(ref.get("key").asString());
    }
    assertThat(keys).containsKeys("kwanta-database", "kwanta-scrape-key", "kwanta-admin-key");
    String admin = null;
    for (JsonNode env : container().get("env")) {
      if (env.get("name").asString().equals("KWANTA_ADMIN_KEY")) {
        admin = env.get("valueFrom").get("secretKeyRef").get("name").asString();
      }
    }
    assertThat(admin).isEqualTo("kwanta-admin-key");
  }

  @Test
  void twoReplicasOfAPinnedImageWithResourcesAndADisruptionBudget() {
    JsonNode spec = BY_KIND.get("Deployment").get("spec");
    assertThat(spec.get("replicas").asInt()).isEqualTo(2);
    for (JsonNode workload :
        List.of(BY_KIND.get("Deployment"), BY_NAME.get("StatefulSet/postgres"))) {
      JsonNode c = workload.get("spec").get("template").get("spec").get("containers").get(0);
      String image = c.get("image").asString();
      assertThat(image).as(image).matches(".+:[0-9][0-9A-Za-z.-]*").doesNotEndWith(":latest");
      JsonNode resources = c.get("resources");
      assertThat(resources.get("requests").has("cpu")).isTrue();
      assertThat(resources.get("requests").has("memory")).isTrue();
      assertThat(resources.get("limits").has("memory")).isTrue();
      assertThat(resources.get("limits").has("cpu")).isTrue();
    }
    JsonNode pdb = BY_KIND.get("PodDisruptionBudget").get("spec");
    assertThat(pdb.get("minAvailable").asInt()).isBetween(1, spec.get("replicas").asInt() - 1);
    assertThat(pdb.get("selector").get("matchLabels"))
        .isEqualTo(spec.get("template").get("metadata").get("labels"));
  }

  @Test
  void ingressTerminatesTlsForTheService() {
    JsonNode spec = BY_KIND.get("Ingress").get("spec");
    String host = spec.get("rules").get(0).get("host").asString();
    assertThat(spec.get("tls").get(0).get("hosts").toString()).contains(host);
    assertThat(spec.get("tls").get(0).get("secretName").asString()).isNotBlank();
    JsonNode backend =
        spec.get("rules").get(0).get("http").get("paths").get(0).get("backend").get("service");
    assertThat(backend.get("name").asString()).isEqualTo("kwanta");
    assertThat(backend.get("port").get("name").asString())
        .isEqualTo(BY_KIND.get("Service").get("spec").get("ports").get(0).get("name").asString());
    assertThat(
            BY_KIND
                .get("Ingress")
                .get("metadata")
                .get("annotations")
                .get("nginx.ingress.kubernetes.io/force-ssl-redirect")
                .asString())
        .isEqualTo("true");
  }

  @Test
  void onlyTheIngressControllerAndPrometheusReachTheServiceAndOnlyTheServiceTheDatabase() {
    JsonNode service = BY_NAME.get("NetworkPolicy/kwanta").get("spec");
    assertThat(
            service.get("podSelector").get("matchLabels").get("app.kubernetes.io/name").asString())
        .isEqualTo("kwanta");
    assertThat(service.get("policyTypes").toString()).contains("Ingress", "Egress");
    assertThat(service.get("ingress")).hasSize(1);
    List<String> peers = new ArrayList<>();
    for (JsonNode from : service.get("ingress").get(0).get("from")) {
      // each peer is a kind of pod (in a named namespace, or this one), never a whole namespace or
      // an address block
      assertThat(from.has("ipBlock")).isFalse();
      assertThat(from.has("podSelector")).isTrue();
      if (from.has("namespaceSelector")) {
        assertThat(
                from.get("namespaceSelector").get("matchLabels").has("kubernetes.io/metadata.name"))
            .isTrue();
      }
      peers.add(
          from.get("podSelector").get("matchLabels").get("app.kubernetes.io/name").asString());
    }
    assertThat(peers).containsExactlyInAnyOrder("ingress-nginx", "prometheus");
    assertThat(service.get("ingress").get(0).get("ports").get(0).get("port").asInt())
        .isEqualTo(container().get("ports").get(0).get("containerPort").asInt());
    // egress: PostgreSQL, and DNS to find it; nothing else
    List<String> egress = new ArrayList<>();
    for (JsonNode rule : service.get("egress")) {
      for (JsonNode port : rule.get("ports")) {
        egress.add(port.get("port").asString());
      }
    }
    assertThat(egress).containsExactlyInAnyOrder("5432", "53", "53");
    JsonNode database = BY_NAME.get("NetworkPolicy/postgres").get("spec");
    assertThat(
            database.get("podSelector").get("matchLabels").get("app.kubernetes.io/name").asString())
        .isEqualTo("postgres");
    assertThat(database.get("ingress")).hasSize(1);
    JsonNode from = database.get("ingress").get(0).get("from");
    assertThat(from).hasSize(1);
    assertThat(
            from.get(0)
                .get("podSelector")
                .get("matchLabels")
                .get("app.kubernetes.io/name")
                .asString())
        .isEqualTo("kwanta");
    assertThat(database.get("egress")).isEmpty();
    // the policies select the pods the workloads label
    assertThat(
            BY_NAME
                .get("StatefulSet/postgres")
                .get("spec")
                .get("template")
                .get("metadata")
                .get("labels")
                .get("app.kubernetes.io/name")
                .asString())
        .isEqualTo("postgres");
  }

  @Test
  void databaseStatefulSetMatchesTheUrlTheServiceUses() {
    JsonNode set = BY_NAME.get("StatefulSet/postgres").get("spec");
    JsonNode headless = BY_NAME.get("Service/postgres").get("spec");
    assertThat(set.get("serviceName").asString()).isEqualTo("postgres");
    assertThat(headless.get("clusterIP").asString()).isEqualTo("None");
    assertThat(set.get("volumeClaimTemplates")).hasSize(1);
    String db = null;
    for (JsonNode env : set.get("template").get("spec").get("containers").get(0).get("env")) {
      if (env.get("name").asString().equals("POSTGRES_DB")) {
        db = env.get("value").asString();
      }
      if (env.get("name").asString().equals("POSTGRES_PASSWORD")) {
        assertThat(env.get("valueFrom").get("secretKeyRef").get("name").asString())
            .isEqualTo("kwanta-database");
      }
    }
    assertThat(BY_KIND.get("ConfigMap").get("data").get("SPRING_DATASOURCE_URL").asString())
        .isEqualTo(
            "jdbc:postgresql://postgres:"
                + headless.get("ports").get(0).get("port").asInt()
                + "/"
                + db);
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
      if (ref.get("name").asString().equals("kwanta-database")) {
        secretKeys.put(env.get("name").asString(), ref.get("key").asString());
      }
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
