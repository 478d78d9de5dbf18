package org.kwanta.service.plants;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Set;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;

/** The demo file parses, and every sample point belongs to a declared unit. */
class DemoPlantFileTest {

  @Test
  void demoFileIsConsistent() throws Exception {
    PlantDeclaration plant = RegistryFiles.readDemo();
    assertThat(plant.id()).isEqualTo("brackenmoor");
    Set<String> units =
        plant.units().stream()
            .map(PlantDeclaration.UnitDeclaration::id)
            .collect(Collectors.toSet());
    assertThat(plant.samplePoints())
        .allSatisfy(p -> assertThat(units).contains(p.unit()))
        .extracting(PlantDeclaration.SamplePointDeclaration::id)
        .doesNotHaveDuplicates()
        .contains("U1-CPD", "U1-ECO-IN", "U1-HP-DRUM", "U1-MS", "U2-CPD", "MU-DEMIN");
  }
}
