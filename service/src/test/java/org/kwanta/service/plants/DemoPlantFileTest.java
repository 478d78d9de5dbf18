package org.kwanta.service.plants;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Set;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;

/** The demo file parses, and every sample point belongs to a declared block. */
class DemoPlantFileTest {

  @Test
  void demoFileIsConsistent() throws Exception {
    PlantDeclaration plant = RegistryFiles.readDemo();
    assertThat(plant.id()).isEqualTo("brackenmoor");
    Set<String> blocks =
        plant.blocks().stream()
            .map(PlantDeclaration.BlockDeclaration::id)
            .collect(Collectors.toSet());
    assertThat(plant.samplePoints())
        .allSatisfy(p -> assertThat(blocks).contains(p.block()))
        .extracting(PlantDeclaration.SamplePointDeclaration::id)
        .doesNotHaveDuplicates()
        .contains("U1-CPD", "U1-ECO-IN", "U1-HP-DRUM", "U1-MS", "U2-CPD", "MU-DEMIN");
  }
}
