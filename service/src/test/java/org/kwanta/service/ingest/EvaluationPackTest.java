package org.kwanta.service.ingest;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.time.Instant;
import java.util.Arrays;
import java.util.HexFormat;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.kwanta.service.chemistry.PhUncertaintyView;
import tools.jackson.databind.DeserializationFeature;
import tools.jackson.databind.json.JsonMapper;

/**
 * The compact stored form of an evaluation reads back to the same view, and so to the same API
 * JSON, for the demo's own evaluations (every shape the demo feed wrote in 26 h: liquid and early
 * condensate, phosphate water, findings) and for edge cases; it is a fraction of the JSON's size.
 */
class EvaluationPackTest {

  private static final JsonMapper JSON =
      JsonMapper.builder().enable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES).build();

  private static List<EvaluationView> demoViews() throws IOException {
    try (var in =
        EvaluationPackTest.class.getResourceAsStream("/evaluation-pack/demo-evaluations.jsonl")) {
      return new String(in.readAllBytes(), StandardCharsets.UTF_8)
          .lines()
          .filter(l -> !l.isBlank())
          .map(l -> JSON.readValue(l, EvaluationView.class).fromStorage())
          .toList();
    }
  }

  @Test
  void demoEvaluationsRoundTripToTheSameJson() throws IOException {
    List<EvaluationView> views = demoViews();
    assertThat(views).hasSizeGreaterThanOrEqualTo(20);
    long packed = 0;
    long json = 0;
    for (EvaluationView v : views) {
      EvaluationView stored = v.forStorage();
      byte[] pack = EvaluationPack.encode(stored);
      assertThat(EvaluationPack.decode(pack)).isEqualTo(stored);
      assertThat(JSON.writeValueAsString(EvaluationPack.decode(pack).fromStorage()))
          .isEqualTo(JSON.writeValueAsString(v));
      packed += pack.length;
      json += JSON.writeValueAsBytes(stored).length;
    }
    assertThat(packed / views.size()).as("mean packed bytes").isLessThan(320);
    assertThat(packed * 5).as("packed against JSON").isLessThan(json);
  }

  @Test
  void edgeCasesRoundTrip() {
    PhUncertaintyView.PartView part =
        new PhUncertaintyView.PartView(
            null,
            null,
            null,
            0.012346,
            -0.0,
            "a set not in the word list",
            null,
            null,
            List.of(new PhUncertaintyView.ContributionView("µ-source ⇌", 1e300, "détail")));
    EvaluationView v =
        new EvaluationView(
            70000,
            List.of(
                new EvaluationView.Compensated(
                    "a_parameter_not_listed", -1.5, null, Double.MIN_VALUE, true, true)),
            new EvaluationView.Composition(null, 0.0, -0.0, 1e-9, Double.MAX_VALUE, 2.6),
            new EvaluationView.CalculatedPh(8.8, 0.01, null, 3.1, true, ""),
            new EvaluationView.PhAtTemperature(
                330.0,
                12.85,
                Double.NaN,
                Double.NEGATIVE_INFINITY,
                Double.POSITIVE_INFINITY,
                "COMBINED_PARTS",
                5.6,
                "a formulation not in the list",
                "LIQUID",
                List.of("note one", ""),
                "MEASURED",
                12.9,
                Instant.parse("1969-12-31T23:59:59.123456789Z"),
                new PhUncertaintyView(7.0, 6.9, 7.1, null, part, null, part, null)),
            List.of(new EvaluationView.FindingView("NEW_CODE", "PROCESS", "explained, 1.2 µS/cm")),
            true,
            List.of());
    assertThat(EvaluationPack.decode(EvaluationPack.encode(v))).isEqualTo(v);
    EvaluationView bare =
        new EvaluationView(1, List.of(), null, null, null, List.of(), false, null);
    assertThat(EvaluationPack.decode(EvaluationPack.encode(bare))).isEqualTo(bare);
  }

  @Test
  void aDamagedPackFailsLoudly() throws IOException {
    byte[] pack = EvaluationPack.encode(demoViews().get(0).forStorage());
    for (int cut : new int[] {0, 1, pack.length / 2, pack.length - 1}) {
      byte[] shorter = Arrays.copyOf(pack, cut);
      assertThatThrownBy(() -> EvaluationPack.decode(shorter))
          .isInstanceOf(IllegalStateException.class);
    }
    byte[] longer = Arrays.copyOf(pack, pack.length + 1);
    assertThatThrownBy(() -> EvaluationPack.decode(longer))
        .hasMessageContaining("after its last field");
    byte[] otherFormat = pack.clone();
    otherFormat[0] = 9;
    assertThatThrownBy(() -> EvaluationPack.decode(otherFormat)).hasMessageContaining("format 9");
  }

  /**
   * A word's position is its code in rows already written: the list may grow at its end but its
   * first 112 words (format 1 as first shipped) never change.
   */
  @Test
  void theWordListOnlyGrowsAtItsEnd() throws Exception {
    List<String> words = EvaluationPack.WORDS;
    assertThat(words).hasSizeGreaterThanOrEqualTo(112).doesNotHaveDuplicates();
    String first = String.join("\n", words.subList(0, 112)) + "\n";
    byte[] digest =
        MessageDigest.getInstance("SHA-256").digest(first.getBytes(StandardCharsets.UTF_8));
    assertThat(HexFormat.of().formatHex(digest))
        .isEqualTo("90e16917ffc3bb9b8c786d5aeef83200ac5357b41c48169f1111fabdc8f58aae");
  }
}
