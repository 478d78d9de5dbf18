package org.kwanta.service.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;
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
}
