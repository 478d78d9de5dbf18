package org.kwanta.service.deploy;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Set;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;

/**
 * docs/operations.md lists every {@code kwanta.*} setting: the components of each
 * {@code @ConfigurationProperties} record and every {@code ${kwanta.…}} placeholder under
 * service/src/main/java, and the {@code kwanta.*} keys of application.yaml.
 */
class OperationsDocTest {

  private static final Path ROOT = Path.of("..").toAbsolutePath().normalize();
  private static final Pattern RECORD =
      Pattern.compile(
          "@ConfigurationProperties\\(\"(kwanta\\.[a-z.-]+)\"\\)\\s*(?:public\\s+)?record\\s+\\w+\\s*\\(([^)]*)\\)");
  private static final Pattern PLACEHOLDER = Pattern.compile("\\$\\{(kwanta\\.[a-z.-]+)[:}]");

  static Set<String> settingsInCode() throws Exception {
    Set<String> settings = new TreeSet<>();
    try (var files = Files.walk(ROOT.resolve("service/src/main/java"))) {
      for (Path file : files.filter(f -> f.toString().endsWith(".java")).toList()) {
        String java = Files.readString(file).replaceAll("@DefaultValue\\(\"[^\"]*\"\\)", "");
        Matcher record = RECORD.matcher(java);
        while (record.find()) {
          for (String component : record.group(2).split(",")) {
            String[] words = component.trim().split("\\s+");
            String name = words[words.length - 1];
            settings.add(record.group(1) + "." + name.replaceAll("([A-Z])", "-$1").toLowerCase());
          }
        }
        Matcher placeholder = PLACEHOLDER.matcher(java);
        while (placeholder.find()) {
          settings.add(placeholder.group(1));
        }
      }
    }
    return settings;
  }

  @Test
  void everyKwantaSettingHasARowInTheOperationsGuide() throws Exception {
    Set<String> settings = settingsInCode();
    // sanity: the scan finds the records (a change of their shape must not empty this test)
    assertThat(settings)
        .contains(
            "kwanta.ingest.max-batch-size",
            "kwanta.http.max-ingest-body-size",
            "kwanta.security.scrape-key-file",
            "kwanta.diagnosis.instrument-persistence",
            "kwanta.metrics.level-window",
            "kwanta.demo.story-period");
    String guide = Files.readString(ROOT.resolve("docs/operations.md"));
    for (String setting : settings) {
      assertThat(guide).as(setting).contains("| `" + setting + "` |");
    }
    for (String key : applicationYamlKwantaKeys()) {
      assertThat(guide).as(key).contains("| `" + key + "` |");
    }
  }

  /** kwanta.* leaf keys of application.yaml (two levels of nesting below kwanta). */
  private static Set<String> applicationYamlKwantaKeys() throws Exception {
    Set<String> keys = new TreeSet<>();
    var yaml =
        new tools.jackson.dataformat.yaml.YAMLMapper()
            .readTree(Files.readString(ROOT.resolve("service/src/main/resources/application.yaml")))
            .get("kwanta");
    yaml.properties()
        .forEach(
            group ->
                group
                    .getValue()
                    .properties()
                    .forEach(leaf -> keys.add("kwanta." + group.getKey() + "." + leaf.getKey())));
    return keys;
  }
}
