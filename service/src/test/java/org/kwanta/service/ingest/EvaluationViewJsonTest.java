package org.kwanta.service.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
import tools.jackson.databind.DeserializationFeature;
import tools.jackson.databind.json.JsonMapper;

/** No "NaN" in JSON: a trade formula that cannot be computed is null beside its reason. */
class EvaluationViewJsonTest {

  @Test
  void nanTradeFormulaIsNullWithItsNote() {
    EvaluationView.CalculatedPh c =
        new EvaluationView.CalculatedPh(
            8.8, 0.01, Double.NaN, Double.NaN, false, "phosphate water");
    assertThat(c.tradeFormula()).isNull();
    assertThat(c.tradeFormulaConstant()).isNull();
    String json = JsonMapper.builder().build().writeValueAsString(c);
    assertThat(json).doesNotContain("NaN").contains("\"tradeFormula\":null");
  }

  /** Rows stored before the rule carried the string "NaN": they read back as null. */
  @Test
  void storedNanStringReadsBackAsNull() {
    String stored =
        "{\"rigorous\":8.8,\"rigorousUncertainty\":0.01,\"tradeFormula\":\"NaN\","
            + "\"tradeFormulaConstant\":\"NaN\",\"tradeFormulaInWindow\":false,"
            + "\"tradeFormulaNote\":\"phosphate water\"}";
    EvaluationView.CalculatedPh c =
        JsonMapper.builder().build().readValue(stored, EvaluationView.CalculatedPh.class);
    assertThat(c.tradeFormula()).isNull();
  }

  /**
   * A pH at temperature stored before the operating condition was recorded reads back with no
   * source (configured); a measured one keeps its drum pressure and time.
   */
  @Test
  void phAtTemperatureWithoutOperatingConditionReadsBackAsNulls() {
    JsonMapper json = JsonMapper.builder().build();
    String stored =
        "{\"temperatureCel\":330.0,\"pressureMPa\":12.85,\"ph\":7.1,\"low\":7.0,\"high\":7.2,"
            + "\"neutralPh\":5.7,\"formulation\":\"f\",\"basis\":\"LIQUID\",\"notes\":[]}";
    EvaluationView.PhAtTemperature old =
        json.readValue(stored, EvaluationView.PhAtTemperature.class);
    assertThat(old.operatingConditionSource()).isNull();
    assertThat(old.measuredDrumPressureMPa()).isNull();
    assertThat(old.measuredAt()).isNull();
    EvaluationView.PhAtTemperature measured =
        new EvaluationView.PhAtTemperature(
            311.0,
            10.0,
            7.2,
            7.1,
            7.3,
            "INSTRUMENT_TOLERANCES",
            5.6,
            "f",
            "LIQUID",
            java.util.List.of(),
            "MEASURED",
            10.0,
            java.time.Instant.parse("2026-12-01T10:00:00Z"),
            null);
    String written = json.writeValueAsString(measured);
    assertThat(written)
        .contains("\"operatingConditionSource\":\"MEASURED\"")
        .contains("\"measuredAt\":\"2026-12-01T10:00:00Z\"");
    assertThat(json.readValue(written, EvaluationView.PhAtTemperature.class)).isEqualTo(measured);
  }

  /**
   * Rows stored before the names of docs/names.md carry suspect (the doubt and each finding's
   * target) and rawUSPerCm, and no bandFrom: they read back under the new names, with unknown
   * fields refused as the application does.
   */
  @Test
  void storedOldNamesReadBackUnderTheNewOnes() {
    String stored =
        "{\"configVersion\":1,\"compensated\":[{\"parameter\":\"cation_conductivity\","
            + "\"rawUSPerCm\":0.2,\"sampleTemperatureCel\":30.0,\"at25USPerCm\":0.18,"
            + "\"compensatedByAnalyser\":false,\"belowPureWater\":false}],"
            + "\"composition\":null,\"calculatedPh\":null,"
            + "\"phAtTemperature\":{\"temperatureCel\":155.0,\"pressureMPa\":15.0,\"ph\":6.1,"
            + "\"low\":6.0,\"high\":6.2,\"neutralPh\":5.7,\"formulation\":\"f\","
            + "\"basis\":\"LIQUID\",\"notes\":[]},"
            + "\"findings\":[{\"code\":\"PH_MEASURED_VS_CALCULATED\",\"suspect\":\"PH\","
            + "\"explanation\":\"e\"}],\"suspect\":true,\"notes\":[]}";
    JsonMapper strict =
        JsonMapper.builder().enable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES).build();
    EvaluationView v = strict.readValue(stored, EvaluationView.class);
    assertThat(v.instrumentInDoubt()).isTrue();
    assertThat(v.findings().get(0).pointsAt()).isEqualTo("PH");
    assertThat(v.compensated().get(0).asReadUSPerCm()).isEqualTo(0.2);
    assertThat(v.phAtTemperature().bandFrom()).isEqualTo("INSTRUMENT_TOLERANCES");
    String written = strict.writeValueAsString(v);
    assertThat(written)
        .contains("\"instrumentInDoubt\":true", "\"pointsAt\":\"PH\"", "\"asReadUSPerCm\":0.2")
        .doesNotContain("suspect", "rawUSPerCm");
  }

  /**
   * Rows stored before the itemised uncertainty called their instrument-tolerance band the spread
   * over the constant sets: read back, the formulation says what the band is.
   */
  @Test
  void storedBandOfOldRowsReadsBackAsTheInstrumentBand() {
    String stored =
        "{\"temperatureCel\":155,\"pressureMPa\":15,\"ph\":7.5,\"low\":7.49,\"high\":7.51,"
            + "\"neutralPh\":5.9,\"formulation\":\""
            + EvaluationView.FORMULATION_BEFORE_ITEMISED
            + "\",\"basis\":\"LIQUID\",\"notes\":[]}";
    EvaluationView.PhAtTemperature t =
        JsonMapper.builder().build().readValue(stored, EvaluationView.PhAtTemperature.class);
    assertThat(t.uncertainty()).isNull();
    assertThat(t.formulation())
        .doesNotContain("band over the alternative constant sets")
        .endsWith(
            "band from the instrument tolerances only (stored before the itemised uncertainty)");
  }

  /**
   * The uncertainty is stored compact (no labels, rule, texts or per-part low/high; half-widths to
   * 1e-6 pH) and read back with labels, rule and low/high filled in; the set names and the
   * contributions' sources and half-widths are kept.
   */
  @Test
  void theUncertaintyIsStoredCompactAndReadBackWithItsLabels() {
    org.kwanta.service.chemistry.PhUncertaintyView.PartView a =
        new org.kwanta.service.chemistry.PhUncertaintyView.PartView(
            "(a) instrument tolerances",
            7.0 - 0.0123456789,
            7.0 + 0.0123456789,
            0.0123456789,
            0.0123456789,
            null,
            null,
            "each conductivity moved by its tolerance",
            java.util.List.of(
                new org.kwanta.service.chemistry.PhUncertaintyView.ContributionView(
                    "specific_conductivity", 0.0123456789, "±2.0 % of the 25 °C value")));
    org.kwanta.service.chemistry.PhUncertaintyView.PartView b =
        new org.kwanta.service.chemistry.PhUncertaintyView.PartView(
            "(b) spread over the published constant sets",
            6.99,
            7.02,
            0.01,
            0.02,
            "ammonium-2",
            "ammonium-3",
            "each published set",
            java.util.List.of());
    org.kwanta.service.chemistry.PhUncertaintyView full =
        new org.kwanta.service.chemistry.PhUncertaintyView(
            7.0, 6.98, 7.03, "root-sum-square", a, b, b, a);
    JsonMapper json = JsonMapper.builder().build();
    String stored = json.writeValueAsString(full.compact());
    assertThat(stored)
        .doesNotContain("label", "basis", "rule", "detail", "instrument tolerances")
        .contains("\"belowPh\":0.012346", "\"lowConstantSet\":\"ammonium-2\"")
        .contains("\"source\":\"specific_conductivity\"");
    assertThat(stored.length()).isLessThan(json.writeValueAsString(full).length() * 6 / 10);
    org.kwanta.service.chemistry.PhUncertaintyView back =
        json.readValue(stored, org.kwanta.service.chemistry.PhUncertaintyView.class).filled();
    assertThat(back.rule()).isEqualTo(org.kwanta.model.aqueous.PhUncertainty.RULE);
    assertThat(back.instrumentTolerances().label())
        .isEqualTo(org.kwanta.model.aqueous.PhUncertainty.Kind.INSTRUMENT_TOLERANCES.label());
    assertThat(back.constantSetSpread().low())
        .isCloseTo(6.99, org.assertj.core.data.Offset.offset(1e-12));
    assertThat(back.constantSetSpread().highConstantSet()).isEqualTo("ammonium-3");
    assertThat(back.instrumentTolerances().basis())
        .isEqualTo(org.kwanta.service.chemistry.PhUncertaintyView.STORED_BASIS);
    assertThat(back.instrumentTolerances().contributions().get(0).halfWidthPh())
        .isEqualTo(0.012346);
  }
}
