package org.kwanta.service.limits;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.kwanta.model.Parameter;
import org.kwanta.model.limits.CycleLocation;
import org.kwanta.model.limits.Level;
import org.kwanta.model.limits.LimitKey;
import org.kwanta.model.limits.LimitProfile;
import org.kwanta.model.limits.PlantType;
import org.kwanta.model.limits.Side;
import org.kwanta.model.limits.Threshold;
import org.kwanta.model.limits.TreatmentRegime;
import org.springframework.core.io.ClassPathResource;
import tools.jackson.databind.JsonNode;
import tools.jackson.dataformat.yaml.YAMLMapper;

/**
 * The shipped default limits load and validate. The numbers in them are recalled from the IAPWS
 * technical guidance (from memory — verify); these tests check that every value says so, not the
 * numbers themselves.
 */
class LimitCatalogTest {

  static LimitCatalog defaults() throws IOException {
    try (InputStream in =
        new ClassPathResource(DefaultLimitsConfiguration.DEFAULTS).getInputStream()) {
      return LimitCatalog.read(in);
    }
  }

  static LimitCatalog version(int version) throws IOException {
    try (InputStream in =
        new ClassPathResource("limits/defaults-v" + version + ".yaml").getInputStream()) {
      return LimitCatalog.read(in);
    }
  }

  /** Every profile of a catalog, for any plant type and for each plant type. */
  private static List<LimitProfile> all(LimitCatalog catalog) {
    List<LimitProfile> out = new java.util.ArrayList<>(catalog.profiles());
    for (PlantType type : PlantType.values()) {
      out.addAll(catalog.profiles(type));
    }
    return out;
  }

  private static LimitCatalog read(String yaml) throws IOException {
    return LimitCatalog.read(new ByteArrayInputStream(yaml.getBytes(StandardCharsets.UTF_8)));
  }

  @Test
  void defaultsLoadAndSayTheyAreExamples() throws IOException {
    LimitCatalog catalog = defaults();
    assertThat(catalog.version()).isEqualTo(2);
    assertThat(catalog.notice())
        .contains("from memory — verify")
        .contains("not this plant's limits");
    assertThat(catalog.profiles()).hasSizeGreaterThan(40);
  }

  @Test
  void everyDefaultValueCarriesItsSourceAndConfidence() throws IOException {
    for (LimitProfile p : all(defaults())) {
      assertThat(p.normal().source()).as(p.key() + " normal").contains("from memory — verify");
      for (Threshold t : p.thresholds()) {
        assertThat(t.source()).as(p.key() + " " + t.level()).contains("from memory — verify");
      }
      assertThat(p.deadbandSource()).as(p.key() + " deadband").contains("no source");
      assertThat(p.persistenceSource()).as(p.key() + " persistence").contains("no source");
    }
  }

  @Test
  void version1StaysAsReleased() throws IOException {
    LimitCatalog v1 = version(1);
    assertThat(v1.version()).isEqualTo(1);
    LimitKey feedwaterPh =
        new LimitKey(TreatmentRegime.AVT_O, CycleLocation.FEEDWATER, Parameter.PH);
    for (PlantType type : PlantType.values()) {
      assertThat(v1.profiles(type)).as(type.name()).isEmpty();
      // Entries without plant types match any plant type: v1 judges an HRSG as it always did.
      assertThat(v1.find(feedwaterPh, type).orElseThrow().normal().high().getAsDouble())
          .isEqualTo(9.6);
    }
  }

  @Test
  void version2LoadsAndEveryEntryHasASource() throws IOException {
    LimitCatalog v2 = version(2);
    assertThat(v2.version()).isEqualTo(2);
    assertThat(v2.profiles(PlantType.HRSG)).isNotEmpty();
    for (LimitProfile p : all(v2)) {
      assertThat(p.normal().source()).as(p.key() + " normal").isNotBlank();
      assertThat(
              p.normal().source().contains("from memory — verify")
                  || p.normal().source().contains("no source"))
          .as(p.key() + " normal source says how far it can be trusted")
          .isTrue();
      for (Threshold t : p.thresholds()) {
        assertThat(t.source()).as(p.key() + " " + t.level()).contains("from memory — verify");
      }
      assertThat(p.deadbandSource()).as(p.key() + " deadband").contains("no source");
      assertThat(p.persistenceSource()).as(p.key() + " persistence").contains("no source");
    }
  }

  @Test
  void hrsgFeedwaterPh97UnderAvtOIsNormalButNotAtAConventionalDrum() throws IOException {
    LimitCatalog v2 = version(2);
    LimitKey key = new LimitKey(TreatmentRegime.AVT_O, CycleLocation.FEEDWATER, Parameter.PH);
    LimitProfile hrsg = v2.find(key, PlantType.HRSG).orElseThrow();
    assertThat(hrsg.normal().source()).contains("HRSG").contains("from memory — verify");
    assertThat(hrsg.normal().contains(9.7)).isTrue();
    LimitProfile drum = v2.find(key, PlantType.CONVENTIONAL_DRUM).orElseThrow();
    assertThat(drum.normal().contains(9.7)).isFalse();
    // A plant that declares no type is a conventional drum plant.
    assertThat(v2.find(key, null)).contains(drum);
    assertThat(v2.find(key)).contains(drum);
  }

  @Test
  void condensateSodiumHasActionLevelsInVersion2() throws IOException {
    LimitProfile na =
        version(2)
            .find(
                new LimitKey(TreatmentRegime.AVT_O, CycleLocation.CONDENSATE, Parameter.SODIUM),
                PlantType.HRSG)
            .orElseThrow();
    assertThat(na.levelOf(1)).isEqualTo(Level.NORMAL);
    assertThat(na.levelOf(3)).isEqualTo(Level.AL1);
    assertThat(na.levelOf(5)).isEqualTo(Level.AL2);
    assertThat(na.levelOf(9)).isEqualTo(Level.AL3);
  }

  @Test
  void anEntryForAPlantTypeWinsOnlyForThatType() throws IOException {
    String general = ENTRY.formatted("ug/kg", "general");
    String hrsg =
        general
            .substring(general.indexOf("  - regimes"))
            .replace("  - regimes", "  - plantTypes: [HRSG]\n    regimes")
            .replace("general", "hrsg");
    LimitCatalog catalog = read(general + hrsg);
    LimitKey key = new LimitKey(TreatmentRegime.AVT_O, CycleLocation.FEEDWATER, Parameter.SODIUM);
    assertThat(catalog.find(key, PlantType.HRSG).orElseThrow().normal().source()).isEqualTo("hrsg");
    assertThat(catalog.find(key, PlantType.ONCE_THROUGH).orElseThrow().normal().source())
        .isEqualTo("general");
    assertThatThrownBy(() -> read(general + hrsg + hrsg.substring(hrsg.indexOf("  - plantTypes"))))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("(HRSG) are given twice");
  }

  @Test
  void drumWaterPhBelow8IsAnImmediateShutdownForEveryDrumRegime() throws IOException {
    LimitCatalog catalog = defaults();
    for (TreatmentRegime regime :
        List.of(
            TreatmentRegime.AVT_R, TreatmentRegime.AVT_O, TreatmentRegime.PT, TreatmentRegime.CT)) {
      LimitProfile ph =
          catalog.find(new LimitKey(regime, CycleLocation.DRUM_WATER, Parameter.PH)).orElseThrow();
      assertThat(ph.thresholds())
          .singleElement()
          .satisfies(
              t -> {
                assertThat(t.level()).isEqualTo(Level.SHUTDOWN);
                assertThat(t.side()).isEqualTo(Side.LOW);
                assertThat(t.value()).isEqualTo(8.0);
              });
      assertThat(ph.levelOf(7.9)).isEqualTo(Level.SHUTDOWN);
    }
  }

  @Test
  void steamCationConductivityHasThreeActionLevels() throws IOException {
    LimitProfile steam =
        defaults()
            .find(
                new LimitKey(
                    TreatmentRegime.AVT_O, CycleLocation.MAIN_STEAM, Parameter.CATION_CONDUCTIVITY))
            .orElseThrow();
    assertThat(steam.levelOf(0.1)).isEqualTo(Level.NORMAL);
    assertThat(steam.levelOf(0.3)).isEqualTo(Level.AL1);
    assertThat(steam.levelOf(0.5)).isEqualTo(Level.AL2);
    assertThat(steam.levelOf(0.7)).isEqualTo(Level.AL3);
  }

  @Test
  void everyCycleSamplePointOfTheDemoPlantHasCationConductivityDefaults() throws IOException {
    LimitCatalog catalog = defaults();
    JsonNode plant;
    try (InputStream in = new ClassPathResource("demo/brackenmoor.yaml").getInputStream()) {
      plant = new YAMLMapper().readTree(in);
    }
    int checked = 0;
    for (JsonNode point : plant.get("samplePoints")) {
      CycleLocation location = CycleLocation.valueOf(point.get("cycleLocation").asString());
      if (location == CycleLocation.MAKE_UP) {
        continue; // section 6 of the reference notes gives no make-up water values
      }
      TreatmentRegime regime = TreatmentRegime.valueOf(point.get("treatmentRegime").asString());
      if (regime == TreatmentRegime.PT && location == CycleLocation.DRUM_WATER) {
        // Phosphate boiler water: cation conductivity includes the treatment's own phosphate, so
        // guidance limits contamination through chloride and sulfate instead (reference notes 6.5).
        assertThat(catalog.find(new LimitKey(regime, location, Parameter.PH))).isPresent();
        checked++;
        continue;
      }
      assertThat(catalog.find(new LimitKey(regime, location, Parameter.CATION_CONDUCTIVITY)))
          .as(point.get("id").asString())
          .isPresent();
      checked++;
    }
    assertThat(checked).isEqualTo(16);
  }

  private static final String ENTRY =
      """
      version: 1
      status: EXAMPLE
      notice: test
      profiles:
        - regimes: [AVT_O]
          locations: [FEEDWATER]
          parameter: sodium
          unit: %s
          normal: {high: 2, source: "%s"}
          thresholds:
            - {level: AL1, side: HIGH, value: 2, source: "s"}
          deadband: {value: 0.2, source: "s"}
          persistence: {value: PT5M, source: "s"}
      """;

  @Test
  void rejectsAUnitThatIsNotTheCanonicalUnit() {
    assertThatThrownBy(() -> read(ENTRY.formatted("mg/kg", "s")))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("AVT_O/FEEDWATER/sodium")
        .hasMessageContaining("ug/kg");
  }

  @Test
  void rejectsAValueWithoutSource() {
    assertThatThrownBy(() -> read(ENTRY.formatted("ug/kg", " ")))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("normal range has no source");
  }

  @Test
  void rejectsTheSameKeyTwice() {
    String twice = ENTRY.formatted("ug/kg", "s");
    String entry = twice.substring(twice.indexOf("  - regimes"));
    assertThatThrownBy(() -> read(twice + entry))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("given twice");
  }

  @Test
  void aCleanEntryLoads() throws IOException {
    assertThat(read(ENTRY.formatted("ug/kg", "s")).profiles()).hasSize(1);
  }
}
