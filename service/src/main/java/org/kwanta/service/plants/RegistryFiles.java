package org.kwanta.service.plants;

import java.io.IOException;
import java.io.InputStream;
import java.util.ArrayList;
import java.util.List;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.boot.ApplicationArguments;
import org.springframework.boot.ApplicationRunner;
import org.springframework.boot.context.properties.ConfigurationProperties;
import org.springframework.core.env.Environment;
import org.springframework.core.io.Resource;
import org.springframework.core.io.ResourceLoader;
import org.springframework.stereotype.Component;
import tools.jackson.databind.DeserializationFeature;
import tools.jackson.dataformat.yaml.YAMLMapper;

/**
 * Configuration as code: at start, applies the plant declarations named in {@code
 * kwanta.registry.files} (YAML or JSON; Spring resource locations such as {@code
 * file:plants/site.yaml}) and, unless {@code kwanta.demo.load-plant=false}, the fictional
 * Brackenmoor demo plant. A changed sample point gets a new configuration version; nothing is
 * deleted.
 */
@Component
class RegistryFiles implements ApplicationRunner {

  static final String RESOURCE = "classpath:demo/brackenmoor.yaml";
  private static final Logger log = LoggerFactory.getLogger(RegistryFiles.class);

  private final Plants plants;
  private final ResourceLoader resources;
  private final RegistryProperties properties;
  private final Environment environment;

  RegistryFiles(
      Plants plants,
      ResourceLoader resources,
      RegistryProperties properties,
      Environment environment) {
    this.plants = plants;
    this.resources = resources;
    this.properties = properties;
    this.environment = environment;
  }

  /**
   * Registry settings.
   *
   * @param files plant declarations applied at start
   */
  @ConfigurationProperties("kwanta.registry")
  record RegistryProperties(List<String> files) {
    RegistryProperties {
      files = files == null ? List.of() : List.copyOf(files);
    }
  }

  static PlantDeclaration read(Resource resource) throws IOException {
    YAMLMapper mapper =
        YAMLMapper.builder().enable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES).build();
    try (InputStream in = resource.getInputStream()) {
      return mapper.readValue(in, PlantDeclaration.class);
    }
  }

  static PlantDeclaration readDemo() throws IOException {
    return read(new org.springframework.core.io.ClassPathResource("demo/brackenmoor.yaml"));
  }

  @Override
  public void run(ApplicationArguments args) throws IOException {
    List<String> locations = new ArrayList<>();
    if (environment.getProperty("kwanta.demo.load-plant", Boolean.class, true)) {
      locations.add(RESOURCE);
    }
    locations.addAll(properties.files());
    for (String location : locations) {
      Resource resource = resources.getResource(location);
      PlantDeclaration plant = read(resource);
      List<String> problems = new ArrayList<>(Plants.problems(plant));
      problems.addAll(OperatingPhases.conflicts(plant));
      if (!problems.isEmpty()) {
        throw new IllegalStateException(
            "Plant declaration " + location + " is invalid: " + String.join("; ", problems));
      }
      Plants.Applied applied = plants.apply(plant, "file:" + resource.getFilename());
      log.info(
          "Plant '{}' from {}: {}",
          plant.id(),
          location,
          applied.anything()
              ? (applied.plantCreated() ? "created, " : "")
                  + applied.created().size()
                  + " sample point(s) added, "
                  + applied.changed().size()
                  + " changed (new versions)"
              : "unchanged");
    }
  }
}
