package org.kwanta.service.limits;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.kwanta.model.Parameter;
import org.kwanta.model.diagnosis.CoolingWater;
import org.kwanta.model.limits.CycleLocation;
import org.kwanta.model.limits.Level;
import org.kwanta.model.limits.LimitKey;
import org.kwanta.model.limits.LimitProfile;
import org.kwanta.model.limits.PlantType;
import org.kwanta.model.limits.Threshold;
import org.kwanta.model.limits.TreatmentRegime;

/**
 * Defaults version 4: its content and its lookups by drum pressure band and cooling water.
 *
 * <p>The bounds checked are the file's own: recalled from the IAPWS technical guidance (TGD3-10,
 * TGD4-11, TGD5-13; from memory — verify, confidence L), or derived from those by the stoichiometry
 * each source text states, checked here with IUPAC standard atomic weights (Na 22.990, Cl 35.453, P
 * 30.974, O 15.999, H 1.008; PO4 94.971, NaOH 39.997). The band edges are the file's.
 */
class DefaultsVersion4Test {

  private static final double NA = 22.990;
  private static final double CL = 35.453;
  private static final double PO4 = 94.971;
  private static final double NAOH = 39.997;

  private static LimitCatalog v4() throws IOException {
    return LimitCatalogTest.version(4);
  }

  private static LimitKey drum(TreatmentRegime regime, Parameter parameter) {
    return new LimitKey(regime, CycleLocation.DRUM_WATER, parameter);
  }

  private static double high(LimitCatalog c, LimitKey key, PlantType type, Double pressure) {
    return c.find(key, type, pressure).orElseThrow().normal().high().getAsDouble();
  }

  @Test
  void version4IsTheShippedDefaultAndEveryValueSaysHowFarItCanBeTrusted() throws IOException {
    assertThat(DefaultLimitsConfiguration.DEFAULTS).isEqualTo("limits/defaults-v4.yaml");
    LimitCatalog v4 = v4();
    assertThat(v4.version()).isEqualTo(4);
    assertThat(v4.notice()).contains("from memory — verify").contains("not this plant's limits");
    for (LimitProfile p : LimitCatalogTest.all(v4)) {
      assertThat(LimitCatalogTest.trustStated(p.normal().source()))
          .as(p.key() + " normal")
          .isTrue();
      for (Threshold t : p.thresholds()) {
        assertThat(LimitCatalogTest.trustStated(t.source())).as(p.key() + " " + t.level()).isTrue();
      }
      assertThat(p.deadbandSource()).as(p.key() + " deadband").contains("no source");
      assertThat(p.persistenceSource()).as(p.key() + " persistence").contains("no source");
    }
    for (LimitCatalog.Guidance g : v4.guidance()) {
      assertThat(LimitCatalogTest.trustStated(g.source())).as(g.topic()).isTrue();
    }
  }

  @Test
  void version4CarriesEveryVersion3EntryOverUnchanged() throws IOException {
    LimitCatalog v3 = LimitCatalogTest.version(3);
    LimitCatalog v4 = v4();
    for (LimitProfile p : v3.profiles()) {
      assertThat(v4.find(p.key())).as(p.key().toString()).contains(p);
    }
    for (PlantType type : PlantType.values()) {
      for (LimitProfile p : v3.profiles(type)) {
        assertThat(v4.profiles(type)).as(type + " " + p.key()).contains(p);
      }
    }
    assertThat(v4.banded()).containsAll(v3.banded());
    assertThat(v4.banded().size()).isGreaterThan(v3.banded().size());
  }

  /** Drum-water chloride in the five bands: the band's upper end belongs to it. */
  @ParameterizedTest(name = "{0} MPa: chloride < {1} µg/kg")
  @CsvSource({
    "0.5, 500",
    "4.0, 500",
    "4.01, 250",
    "8.0, 250",
    "10.0, 120",
    "12.86, 60",
    "16.0, 60",
    "16.01, 30",
    "18.5, 30"
  })
  void drumWaterChlorideAndSulfateFollowTheDrumPressureBands(double pressure, double bound)
      throws IOException {
    LimitCatalog v4 = v4();
    for (TreatmentRegime regime : List.of(TreatmentRegime.AVT_O, TreatmentRegime.PT)) {
      for (PlantType type : List.of(PlantType.CONVENTIONAL_DRUM, PlantType.HRSG)) {
        LimitProfile chloride =
            v4.find(drum(regime, Parameter.CHLORIDE), type, pressure).orElseThrow();
        assertThat(chloride.normal().high().getAsDouble()).isEqualTo(bound);
        assertThat(chloride.normal().source()).contains("TGD").contains("from memory — verify");
        assertThat(high(v4, drum(regime, Parameter.SULFATE), type, pressure)).isEqualTo(bound);
        // A normal range only (advisory): no action level is recalled for drum-water contaminants.
        assertThat(chloride.normal().contains(bound * 1.1)).isFalse();
        assertThat(chloride.thresholds()).isEmpty();
      }
    }
  }

  @Test
  void theBandsCoverEveryPressureAndNoneMatchesAnUnknownOne() throws IOException {
    LimitCatalog v4 = v4();
    LimitKey chloride = drum(TreatmentRegime.AVT_O, Parameter.CHLORIDE);
    for (double p = 0.05; p < 25; p += 0.05) {
      assertThat(v4.find(chloride, PlantType.CONVENTIONAL_DRUM, p)).as(p + " MPa").isPresent();
    }
    assertThat(v4.find(chloride, PlantType.CONVENTIONAL_DRUM, null)).isEmpty();
    // Version 3 had no drum-water chloride at any pressure.
    assertThat(LimitCatalogTest.version(3).find(chloride, PlantType.CONVENTIONAL_DRUM, 10.0))
        .isEmpty();
  }

  @Test
  void volatileTreatmentDrumSodiumIsTheSodiumOfSodiumChlorideAtTheChlorideBound()
      throws IOException {
    LimitCatalog v4 = v4();
    for (double p : new double[] {1, 6, 10, 14, 18}) {
      for (TreatmentRegime regime :
          List.of(TreatmentRegime.AVT_R, TreatmentRegime.AVT_O, TreatmentRegime.OT)) {
        double chloride = high(v4, drum(regime, Parameter.CHLORIDE), null, p);
        LimitProfile sodium = v4.find(drum(regime, Parameter.SODIUM), null, p).orElseThrow();
        assertThat(sodium.normal().high().getAsDouble())
            .as(regime + " " + p + " MPa")
            .isCloseTo(chloride * NA / CL, within(0.5));
        assertThat(sodium.normal().source()).startsWith("derived").contains("22.990/35.453");
      }
    }
  }

  @ParameterizedTest(name = "{0} MPa: phosphate 300-{1} µg/kg")
  @CsvSource({"2.0, 10000", "6.0, 6000", "10.0, 4000", "12.86, 3000", "18.0, 2000"})
  void phosphateTreatmentHasAnUpperPhosphateBoundAndTheSodiumOfTrisodiumPhosphate(
      double pressure, double phosphate) throws IOException {
    LimitCatalog v4 = v4();
    LimitProfile po4 =
        v4.find(drum(TreatmentRegime.PT, Parameter.PHOSPHATE), null, pressure).orElseThrow();
    assertThat(po4.normal().low().getAsDouble()).isEqualTo(300);
    assertThat(po4.normal().high().getAsDouble()).isEqualTo(phosphate);
    assertThat(po4.normal().contains(phosphate * 1.1)).isFalse();
    assertThat(po4.normal().contains(200)).isFalse();
    assertThat(po4.normal().contains(phosphate * 0.9)).isTrue();
    // Na:PO4 = 3.0 at the upper phosphate bound.
    assertThat(high(v4, drum(TreatmentRegime.PT, Parameter.SODIUM), null, pressure))
        .isCloseTo(phosphate * 3 * NA / PO4, within(0.5));
  }

  @Test
  void phosphateWithoutAKnownDrumPressureKeepsVersion3sLowerBoundOnly() throws IOException {
    LimitProfile po4 =
        v4().find(drum(TreatmentRegime.PT, Parameter.PHOSPHATE), null, null).orElseThrow();
    assertThat(po4.normal().low().getAsDouble()).isEqualTo(300);
    assertThat(po4.normal().high()).isEmpty();
  }

  @Test
  void causticTreatmentBoundsFreeNaohThroughDrumWaterSodium() throws IOException {
    LimitCatalog v4 = v4();
    for (Double p : new Double[] {null, 3.0, 18.0}) {
      LimitProfile sodium = v4.find(drum(TreatmentRegime.CT, Parameter.SODIUM), null, p).get();
      assertThat(sodium.normal().high().getAsDouble()).isCloseTo(1000 * NA / NAOH, within(0.5));
      assertThat(sodium.normal().source()).contains("1 mg/kg NaOH");
    }
    assertThat(v4.guidance())
        .anyMatch(g -> g.topic().contains("free sodium hydroxide") && g.value().contains("575"));
  }

  @Test
  void drumWaterSilicaContinuesAboveTheAsmeTable() throws IOException {
    LimitCatalog v4 = v4();
    LimitKey silica = drum(TreatmentRegime.AVT_O, Parameter.SILICA);
    assertThat(high(v4, silica, PlantType.CONVENTIONAL_DRUM, 12.86)).isEqualTo(1000);
    assertThat(high(v4, silica, PlantType.CONVENTIONAL_DRUM, 13.79)).isEqualTo(1000);
    assertThat(high(v4, silica, PlantType.CONVENTIONAL_DRUM, 13.8)).isEqualTo(200);
    assertThat(high(v4, silica, PlantType.HRSG, 18.0)).isEqualTo(200);
  }

  @Test
  void condensateSodiumIsTighterForSeaAndBrackishCooling() throws IOException {
    LimitCatalog v4 = v4();
    LimitKey key = new LimitKey(TreatmentRegime.AVT_O, CycleLocation.CONDENSATE, Parameter.SODIUM);
    for (CoolingWater water : List.of(CoolingWater.SEA, CoolingWater.BRACKISH)) {
      LimitProfile na = v4.find(key, PlantType.HRSG, null, water).orElseThrow();
      assertThat(na.thresholds()).extracting(Threshold::value).containsExactly(1.0, 2.0, 4.0);
      assertThat(na.levelOf(1.5)).isEqualTo(Level.AL1);
      assertThat(na.levelOf(3)).isEqualTo(Level.AL2);
      assertThat(na.levelOf(5)).isEqualTo(Level.AL3);
    }
    for (CoolingWater water : new CoolingWater[] {CoolingWater.FRESH, CoolingWater.HARD_FRESH}) {
      LimitProfile na = v4.find(key, PlantType.HRSG, null, water).orElseThrow();
      assertThat(na.thresholds()).extracting(Threshold::value).containsExactly(2.0, 4.0, 8.0);
      assertThat(na.levelOf(1.5)).isEqualTo(Level.NORMAL);
    }
    // A plant that declares no cooling water keeps the general levels.
    assertThat(v4.find(key, PlantType.HRSG, null, null)).isEqualTo(v4.find(key));
  }

  @Test
  void onceThroughFeedwaterIronUnderOtIsTighter() throws IOException {
    LimitCatalog v4 = v4();
    LimitKey iron = new LimitKey(TreatmentRegime.OT, CycleLocation.FEEDWATER, Parameter.IRON);
    assertThat(high(v4, iron, PlantType.ONCE_THROUGH, null)).isEqualTo(1);
    assertThat(high(v4, iron, PlantType.CONVENTIONAL_DRUM, null)).isEqualTo(2);
  }

  private static final String COOLED =
      """
      version: 9
      status: EXAMPLE
      notice: test
      profiles:
        - coolingWaters: [SEA]
          %s
          regimes: [AVT_O]
          locations: [CONDENSATE]
          parameter: sodium
          unit: ug/kg
          normal: {high: 1, source: "s"}
          deadband: {value: 0.1, source: "s"}
          persistence: {value: PT0S, source: "s"}
      """;

  private static LimitCatalog read(String yaml) throws IOException {
    return LimitCatalog.read(new ByteArrayInputStream(yaml.getBytes(StandardCharsets.UTF_8)));
  }

  @Test
  void aCoolingWaterEntryNamesNeitherPlantTypesNorABand() throws IOException {
    assertThat(read(COOLED.formatted("")).profiles(CoolingWater.SEA)).hasSize(1);
    assertThatThrownBy(() -> read(COOLED.formatted("plantTypes: [HRSG]")))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("coolingWaters");
    assertThatThrownBy(() -> read(COOLED.formatted("drumPressureMPa: {upTo: 4}")))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("coolingWaters");
    String twice = COOLED.formatted("");
    assertThatThrownBy(() -> read(twice + twice.substring(twice.indexOf("  - coolingWaters"))))
        .isInstanceOf(IllegalArgumentException.class)
        .hasMessageContaining("(SEA cooling water) are given twice");
  }
}
