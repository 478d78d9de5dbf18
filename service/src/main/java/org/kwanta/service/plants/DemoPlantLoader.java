package org.kwanta.service.plants;

import java.io.IOException;
import java.io.InputStream;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.boot.ApplicationArguments;
import org.springframework.boot.ApplicationRunner;
import org.springframework.boot.autoconfigure.condition.ConditionalOnBooleanProperty;
import org.springframework.core.io.ClassPathResource;
import org.springframework.stereotype.Component;
import tools.jackson.databind.DeserializationFeature;
import tools.jackson.dataformat.yaml.YAMLMapper;

/**
 * Loads the fictional Brackenmoor demo plant on first start (when it is not in the database yet).
 * Turn off with {@code kwanta.demo.load-plant=false}.
 */
@Component
@ConditionalOnBooleanProperty(name = "kwanta.demo.load-plant", matchIfMissing = true)
class DemoPlantLoader implements ApplicationRunner {

  static final String RESOURCE = "demo/brackenmoor.yaml";
  private static final Logger log = LoggerFactory.getLogger(DemoPlantLoader.class);

  private final Plants plants;

  DemoPlantLoader(Plants plants) {
    this.plants = plants;
  }

  static PlantDeclaration read() throws IOException {
    YAMLMapper mapper =
        YAMLMapper.builder().enable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES).build();
    try (InputStream in = new ClassPathResource(RESOURCE).getInputStream()) {
      return mapper.readValue(in, PlantDeclaration.class);
    }
  }

  @Override
  public void run(ApplicationArguments args) throws IOException {
    PlantDeclaration demo = read();
    if (plants.exists(demo.id())) {
      log.info("Demo plant '{}' already present", demo.id());
      return;
    }
    plants.insert(demo, "demo-file");
    log.info(
        "Loaded demo plant '{}' with {} sample points (fictional data)",
        demo.id(),
        demo.samplePoints().size());
  }
}
