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
 * technical guidance (from memory — verify) or retrieved from a named public page; these tests
 * check that every value says which, and, for the retrieved drum-water silica table (ASME CRTD-Vol.
 * 34, as copied at the page named in the file), that the bands select the printed values.
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

  /**
   * Every profile of a catalog: for any plant type, for each plant type, for each cooling water,
   * and pressure-banded.
   */
  static List<LimitProfile> all(LimitCatalog catalog) {
    List<LimitProfile> out = new java.util.ArrayList<>(catalog.profiles());
    for (PlantType type : PlantType.values()) {
      out.addAll(catalog.profiles(type));
    }
    for (org.kwanta.model.diagnosis.CoolingWater water :
        org.kwanta.model.diagnosis.CoolingWater.values()) {
      out.addAll(catalog.profiles(water));
    }
    catalog.banded().forEach(b -> out.add(b.profile()));
    return out;
  }

  /** A source text says how far it can be trusted: recalled (verify) or retrieved from a page. */
  static boolean trustStated(String source) {
    return source.contains("from memory — verify") || source.contains("RETRIEVED");
  }

  private static LimitCatalog read(String yaml) throws IOException {
    return LimitCatalog.read(new ByteArrayInputStream(yaml.getBytes(StandardCharsets.UTF_8)));
  }

  @Test
  void defaultsLoadAndSayTheyAreExamples() throws IOException {
    LimitCatalog catalog = defaults();
    assertThat(catalog.version()).isEqualTo(4);
    assertThat(catalog.notice())
        .contains("from memory — verify")
        .contains("not this plant's limits");
    assertThat(catalog.profiles()).hasSizeGreaterThan(40);
  }

  @Test
  void everyDefaultValueCarriesItsSourceAndConfidence() throws IOException {
    for (LimitProfile p : all(defaults())) {
      assertThat(trustStated(p.normal().source())).as(p.key() + " normal").isTrue();
      for (Threshold t : p.thresholds()) {
        assertThat(trustStated(t.source())).as(p.key() + " " + t.level()).isTrue();
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
        // Version 3: make-up water has specific conductivity and silica, no cation conductivity.
        assertThat(catalog.find(new LimitKey(regime(point), location, Parameter.SILICA)))
            .isPresent();
        continue;
      }
      TreatmentRegime regime =
          TreatmentRegime.ofCode(point.get("treatmentRegime").asString()).orElseThrow();
      if (regime == TreatmentRegime.PT && location == CycleLocation.DRUM_WATER) {
        // Phosphate boiler water: cation conductivity includes the treatment's own phosphate, so
        // IAPWS TGD4-11(2015) limits contamination through chloride and sulfate instead (from
        // memory: only the TGD's cover page was read).
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

  private static TreatmentRegime regime(JsonNode point) {
    return TreatmentRegime.ofCode(point.get("treatmentRegime").asString()).orElseThrow();
  }

  private static final LimitKey AVT_DRUM_SILICA =
      new LimitKey(TreatmentRegime.AVT_O, CycleLocation.DRUM_WATER, Parameter.SILICA);

  @Test
  void drumWaterSilicaFollowsTheAsmeDrumPressureBands() throws IOException {
    LimitCatalog v3 = version(3);
    // ASME CRTD-Vol. 34 table, boiler water silica, mg/l, as copied at the page the file
    // names:
    // 0-2.07 MPa < 150, 2.08-3.10 < 90, 3.11-4.14 < 40, 4.15-5.17 < 30, 5.18-6.21 < 20,
    // 6.22-6.89 < 8, 6.90-10.34 < 2, 10.35-13.79 < 1.
    double[][] pressureAndBound = {
      {1.0, 150_000}, {2.07, 150_000}, {2.5, 90_000}, {4.0, 40_000}, {5.0, 30_000},
      {6.0, 20_000}, {6.5, 8_000}, {10.0, 2_000}, {12.86, 1_000}, {13.79, 1_000}
    };
    for (double[] pb : pressureAndBound) {
      for (PlantType type : List.of(PlantType.CONVENTIONAL_DRUM, PlantType.HRSG)) {
        LimitProfile p = v3.find(AVT_DRUM_SILICA, type, pb[0]).orElseThrow();
        assertThat(p.normal().high().getAsDouble()).as(pb[0] + " MPa " + type).isEqualTo(pb[1]);
        assertThat(p.normal().source()).contains("ASME CRTD-Vol. 34").contains("RETRIEVED");
      }
    }
    // Above the table, and with no known drum pressure: no default in version 3.
    assertThat(v3.find(AVT_DRUM_SILICA, PlantType.CONVENTIONAL_DRUM, 15.0)).isEmpty();
    assertThat(v3.find(AVT_DRUM_SILICA, PlantType.CONVENTIONAL_DRUM, null)).isEmpty();
    assertThat(v3.find(AVT_DRUM_SILICA)).isEmpty();
    // Version 2 has no drum-water silica at any pressure.
    assertThat(version(2).find(AVT_DRUM_SILICA, PlantType.CONVENTIONAL_DRUM, 10.0)).isEmpty();
  }

  @Test
  void version3CarriesVersion2sEntriesOver() throws IOException {
    LimitCatalog v2 = version(2);
    LimitCatalog v3 = version(3);
    for (LimitProfile p : v2.profiles()) {
      if (p.key().parameter() == Parameter.DEGASSED_CATION_CONDUCTIVITY) {
        // v3 adds action levels in steam; the normal range stays.
        assertThat(v3.find(p.key()).orElseThrow().normal()).isEqualTo(p.normal());
        continue;
      }
      assertThat(v3.find(p.key())).as(p.key().toString()).contains(p);
    }
    for (PlantType type : PlantType.values()) {
      for (LimitProfile p : v2.profiles(type)) {
        assertThat(v3.find(p.key(), type)).as(type + " " + p.key()).contains(p);
      }
    }
  }

  @Test
  void steamDegassedCationConductivityHasTheSteamActionLevelsInVersion3() throws IOException {
    LimitProfile p =
        version(3)
            .find(
                new LimitKey(
                    TreatmentRegime.AVT_O,
                    CycleLocation.MAIN_STEAM,
                    Parameter.DEGASSED_CATION_CONDUCTIVITY))
            .orElseThrow();
    assertThat(p.thresholds()).extracting(Threshold::value).containsExactly(0.2, 0.35, 0.65);
    assertThat(p.thresholds().get(0).source()).contains("from memory — verify");
  }

  @Test
  void makeUpWaterHasConductivityAndSilicaInVersion3() throws IOException {
    LimitCatalog v3 = version(3);
    LimitKey conductivity =
        new LimitKey(
            TreatmentRegime.MAKE_UP, CycleLocation.MAKE_UP, Parameter.SPECIFIC_CONDUCTIVITY);
    assertThat(v3.find(conductivity).orElseThrow().normal().high().getAsDouble()).isEqualTo(0.1);
    assertThat(
            v3.find(new LimitKey(TreatmentRegime.MAKE_UP, CycleLocation.MAKE_UP, Parameter.SILICA))
                .orElseThrow()
                .normal()
                .high()
                .getAsDouble())
        .isEqualTo(10);
  }

  @Test
  void guidanceWithoutAParameterIsListedWithItsSource() throws IOException {
    List<LimitCatalog.Guidance> guidance = defaults().guidance();
    assertThat(guidance)
        .extracting(LimitCatalog.Guidance::topic)
        .anyMatch(t -> t.contains("Na:PO4"));
    assertThat(guidance)
        .extracting(LimitCatalog.Guidance::topic)
        .anyMatch(t -> t.contains("free sodium hydroxide"));
    for (LimitCatalog.Guidance g : guidance) {
      assertThat(trustStated(g.source())).as(g.topic()).isTrue();
    }
  }

  private static final String BANDED =
      """
      version: 9
      status: EXAMPLE
      notice: test
      profiles:
        - regimes: [AVT_O]
          locations: [DRUM_WATER]
          parameter: chloride
          unit: ug/kg
          normal: {high: 500, source: "s"}
          deadband: {value: 1, source: "s"}
          persistence: {value: PT0S, source: "s"}
        - regimes: [AVT_O]
          locations: [DRUM_WATER]
          drumPressureMPa: {upTo: 10}
          parameter: chloride
          unit: ug/kg
          normal: {high: 300, source: "s"}
          deadband: {value: 1, source: "s"}
          persistence: {value: PT0S, source: "s"}
        - regimes: [AVT_O]
          locations: [DRUM_WATER]
          drumPressureMPa: {above: %s}
          parameter: chloride
          unit: ug/kg
          normal: {high: 100, source: "s"}
          deadband: {value: 1, source: "s"}
          persistence: {value: PT0S, source: "s"}
        - plantTypes: [HRSG]
          regimes: [AVT_O]
          locations: [DRUM_WATER]
          drumPressureMPa: {above: 10}
          parameter: chloride
          unit: ug/kg
          normal: {high: 50, source: "s"}
          deadband: {value: 1, source: "s"}
          persistence: {value: PT0S, source: "s"}
      """;

  private static final LimitKey CHLORIDE =
      new LimitKey(TreatmentRegime.AVT_O, CycleLocation.DRUM_WATER, Parameter.CHLORIDE);

  private static double chlorideBound(LimitCatalog c, PlantType type, Double pressure) {
    return c.find(CHLORIDE, type, pressure).orElseThrow().normal().high().getAsDouble();
  }

  @Test
  void aBandMatchesItsPressuresUpperEndIncludedAndAPlantTypeBandComesFirst() throws IOException {
    LimitCatalog c = read(BANDED.formatted("10"));
    assertThat(chlorideBound(c, PlantType.CONVENTIONAL_DRUM, 10.0)).isEqualTo(300);
    assertThat(chlorideBound(c, PlantType.CONVENTIONAL_DRUM, 10.01)).isEqualTo(100);
    assertThat(chlorideBound(c, PlantType.HRSG, 12.0)).isEqualTo(50);
    assertThat(chlorideBound(c, PlantType.HRSG, 5.0)).isEqualTo(300);
    // Unknown drum pressure: no band matches, the entry without a band applies.
    assertThat(chlorideBound(c, PlantType.CONVENTIONAL_DRUM, null)).isEqualTo(500);
    assertThat(chlorideBound(c, PlantType.HRSG, null)).isEqualTo(500);
  }

  @Test
  void rejectsOverlappingBandsOfOneKey() {
    assertThatThrownBy(() -> read(BANDED.formatted("9")))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("overlap");
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
        .hasMessageContaining("AVT(O)/FEEDWATER/sodium")
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
