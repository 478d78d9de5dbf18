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
    long packed1 = 0;
    long packed3 = 0;
    MapShapes shapes = new MapShapes();
    for (EvaluationView v : views) {
      EvaluationView stored = v.forStorage();
      EvaluationPack.Columns columns = EvaluationPack.Columns.of(v);
      byte[] pack = EvaluationPack.encode(stored, columns);
      assertThat(pack[0]).isEqualTo((byte) 2);
      assertThat(EvaluationPack.decode(pack, columns)).isEqualTo(stored);
      assertThat(JSON.writeValueAsString(EvaluationPack.decode(pack, columns).fromStorage()))
          .isEqualTo(JSON.writeValueAsString(v));
      byte[] pack1 = EvaluationPack.encodeFormat1(stored);
      assertThat(pack1[0]).isEqualTo((byte) 1);
      assertThat(EvaluationPack.decode(pack1, columns)).isEqualTo(stored);
      assertThat(EvaluationPack.decode(pack1)).isEqualTo(stored);
      byte[] pack3 = EvaluationPack.encode(stored, columns, shapes);
      assertThat(pack3[0]).isEqualTo((byte) 3);
      assertThat(
              JSON.writeValueAsString(EvaluationPack.decode(pack3, columns, shapes).fromStorage()))
          .isEqualTo(JSON.writeValueAsString(v));
      packed += pack.length;
      packed1 += pack1.length;
      packed3 += pack3.length;
      json += JSON.writeValueAsBytes(stored).length;
    }
    assertThat(packed / views.size()).as("mean packed bytes").isLessThan(200);
    assertThat(packed * 3).as("format 2 against format 1").isLessThan(packed1 * 2);
    assertThat(packed * 10).as("packed against JSON").isLessThan(json);
    assertThat(packed3 * 10).as("format 3 against format 2").isLessThan(packed * 7);
    assertThat(shapes.size()).as("shapes").isLessThan(views.size());
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
                List.of("note one", "", "µ".repeat(3000)),
                "MEASURED",
                12.9,
                Instant.parse("1969-12-31T23:59:59.123456789Z"),
                new PhUncertaintyView(7.0, 6.9, 7.1, null, part, null, part, null)),
            List.of(new EvaluationView.FindingView("NEW_CODE", "PROCESS", "explained, 1.2 µS/cm")),
            true,
            List.of());
    roundTrips(v);
    EvaluationView bare =
        new EvaluationView(1, List.of(), null, null, null, List.of(), false, null);
    roundTrips(bare);
    assertThat(EvaluationPack.encode(bare)).hasSizeLessThan(12);
  }

  /**
   * Both formats read back to an equal view, with the row's columns and with none of its numbers:
   * records compare their doubles by {@link Double#compare}, bit for bit but for NaN's payload.
   */
  private static void roundTrips(EvaluationView v) {
    EvaluationPack.Columns own = EvaluationPack.Columns.of(v);
    assertThat(EvaluationPack.decode(EvaluationPack.encode(v, own), own)).isEqualTo(v);
    EvaluationPack.Columns none =
        new EvaluationPack.Columns(
            Double.NaN,
            Double.NaN,
            Double.NaN,
            Double.NaN,
            Double.NaN,
            Double.NaN,
            Double.NaN,
            Double.NaN,
            v.configVersion(),
            v.instrumentInDoubt());
    assertThat(EvaluationPack.decode(EvaluationPack.encode(v, none), none)).isEqualTo(v);
    assertThat(EvaluationPack.decode(EvaluationPack.encodeFormat1(v))).isEqualTo(v);
    byte[] three = EvaluationPack.encode(v, own, SHAPES);
    assertThat(three[0]).isEqualTo((byte) 3);
    assertThat(EvaluationPack.decode(three, own, SHAPES)).isEqualTo(v);
    assertThat(EvaluationPack.decode(EvaluationPack.encode(v, none, SHAPES), none, SHAPES))
        .isEqualTo(v);
  }

  private static final MapShapes SHAPES = new MapShapes();

  /**
   * Format 3 keeps a view's values in the row and its shape (the fields' structure, codes and
   * words) once in the shapes: rows that differ only in their numbers share one shape. When the
   * shapes take no more, the pack is written in format 2.
   */
  @Test
  void rowsThatDifferOnlyInTheirNumbersShareOneShape() throws IOException {
    EvaluationView v = demoViews().get(0).forStorage();
    MapShapes shapes = new MapShapes(1);
    EvaluationPack.Columns columns = EvaluationPack.Columns.of(v);
    byte[] first = EvaluationPack.encode(v, columns, shapes);
    EvaluationView.PhAtTemperature t = v.phAtTemperature();
    EvaluationView other =
        new EvaluationView(
            v.configVersion(),
            v.compensated(),
            v.composition(),
            v.calculatedPh(),
            new EvaluationView.PhAtTemperature(
                t.temperatureCel() + 1.5,
                t.pressureMPa(),
                t.ph(),
                t.low(),
                t.high(),
                t.bandFrom(),
                t.neutralPh(),
                t.formulation(),
                t.basis(),
                t.notes(),
                t.operatingConditionSource(),
                t.measuredDrumPressureMPa(),
                t.measuredAt(),
                t.uncertainty()),
            v.findings(),
            v.instrumentInDoubt(),
            v.notes());
    byte[] second = EvaluationPack.encode(other, columns, shapes);
    assertThat(shapes.size()).isEqualTo(1);
    assertThat(second[0]).isEqualTo((byte) 3);
    assertThat(second).isNotEqualTo(first);
    assertThat(EvaluationPack.decode(second, columns, shapes)).isEqualTo(other);
    EvaluationView third =
        new EvaluationView(
            v.configVersion(),
            v.compensated(),
            v.composition(),
            v.calculatedPh(),
            v.phAtTemperature(),
            List.of(new EvaluationView.FindingView("A_NEW_CODE", "PROCESS", null)),
            v.instrumentInDoubt(),
            v.notes());
    byte[] two = EvaluationPack.encode(third, columns, shapes);
    assertThat(two[0]).as("no room for a second shape: format 2").isEqualTo((byte) 2);
    assertThat(EvaluationPack.decode(two, columns, shapes)).isEqualTo(third);
    assertThatThrownBy(() -> EvaluationPack.decode(first, columns))
        .hasMessageContaining("without its shapes");
    assertThatThrownBy(() -> EvaluationPack.decode(first, columns, new MapShapes()))
        .hasMessageContaining("no evaluation shape 1");
  }

  /**
   * Random views: numbers of every kind (short decimals, whole numbers, results of a calculation,
   * zeros of both signs, infinities, NaN, the columns' own values), nulls, words and other strings,
   * explanations from the listed sentences with random slots and others.
   */
  @Test
  void randomEvaluationsRoundTripInBothFormats() {
    java.util.Random rnd = new java.util.Random(19);
    for (int k = 0; k < 3000; k++) {
      EvaluationView v = randomView(rnd);
      roundTrips(v);
      roundTrips(v.forStorage());
    }
  }

  private static EvaluationView randomView(java.util.Random r) {
    List<EvaluationView.Compensated> compensated = new java.util.ArrayList<>();
    for (String p :
        List.of("specific_conductivity", "cation_conductivity", "degassed_cation_conductivity")) {
      if (r.nextInt(4) > 0) {
        double at25 = number(r);
        compensated.add(
            new EvaluationView.Compensated(
                r.nextInt(10) == 0 ? "µ-other" : p,
                r.nextBoolean() ? at25 : number(r),
                r.nextBoolean() ? Double.valueOf(25.0) : nullable(r),
                at25,
                r.nextBoolean(),
                r.nextBoolean()));
      }
    }
    double ph = number(r);
    double below = r.nextBoolean() ? r.nextInt(100000) / 1e6 : number(r);
    double above = r.nextBoolean() ? below : number(r);
    PhUncertaintyView u =
        r.nextInt(5) == 0
            ? null
            : new PhUncertaintyView(
                ph,
                r.nextBoolean() ? ph - below : number(r),
                r.nextBoolean() ? ph + above : number(r),
                r.nextInt(4) == 0 ? string(r) : null,
                part(r, ph),
                part(r, ph),
                part(r, ph),
                part(r, ph));
    EvaluationView.PhAtTemperature t =
        r.nextInt(5) == 0
            ? null
            : new EvaluationView.PhAtTemperature(
                number(r),
                number(r),
                ph,
                u == null ? number(r) : u.low(),
                u == null ? number(r) : u.high(),
                r.nextBoolean() ? null : string(r),
                number(r),
                string(r),
                string(r),
                r.nextBoolean() ? List.of() : Arrays.asList(string(r), string(r)),
                string(r),
                nullable(r),
                r.nextBoolean()
                    ? null
                    : Instant.ofEpochSecond(r.nextInt() * 10L, r.nextInt(1_000_000_000)),
                u);
    List<EvaluationView.FindingView> findings = new java.util.ArrayList<>();
    for (int k = r.nextInt(4); k > 0; k--) {
      findings.add(new EvaluationView.FindingView(string(r), string(r), explanation(r)));
    }
    return new EvaluationView(
        r.nextInt(100000),
        compensated,
        r.nextInt(3) == 0
            ? null
            : new EvaluationView.Composition(
                nullable(r), nullable(r), nullable(r), nullable(r), nullable(r), nullable(r)),
        r.nextInt(3) == 0
            ? null
            : new EvaluationView.CalculatedPh(
                number(r), number(r), nullable(r), nullable(r), r.nextBoolean(), string(r)),
        t,
        findings,
        r.nextBoolean(),
        r.nextBoolean() ? List.of() : r.nextBoolean() ? null : Arrays.asList(string(r)));
  }

  private static PhUncertaintyView.PartView part(java.util.Random r, double ph) {
    if (r.nextInt(6) == 0) {
      return null;
    }
    double below = r.nextBoolean() ? r.nextInt(100000) / 1e6 : number(r);
    double above = r.nextBoolean() ? below : number(r);
    boolean full = r.nextInt(3) == 0;
    List<PhUncertaintyView.ContributionView> contributions = new java.util.ArrayList<>();
    for (int k = r.nextInt(4); k > 0; k--) {
      contributions.add(
          new PhUncertaintyView.ContributionView(
              string(r), number(r), r.nextInt(4) == 0 ? string(r) : null));
    }
    return new PhUncertaintyView.PartView(
        full ? string(r) : null,
        full ? (r.nextBoolean() ? Double.valueOf(ph - below) : nullable(r)) : null,
        full ? (r.nextBoolean() ? Double.valueOf(ph + above) : nullable(r)) : null,
        below,
        above,
        r.nextBoolean() ? null : string(r),
        r.nextBoolean() ? null : string(r),
        full ? string(r) : null,
        r.nextInt(8) == 0 ? null : contributions);
  }

  private static double number(java.util.Random r) {
    return switch (r.nextInt(12)) {
      case 0 -> 0.0;
      case 1 -> -0.0;
      case 2 -> r.nextInt(2000) - 1000;
      case 3 -> (r.nextInt(2_000_000) - 1_000_000) / Math.pow(10, r.nextInt(8));
      case 4 -> Double.longBitsToDouble(r.nextLong());
      case 5 ->
          new double[] {
                Double.NaN,
                Double.POSITIVE_INFINITY,
                Double.NEGATIVE_INFINITY,
                Double.MIN_VALUE,
                Double.MAX_VALUE,
                9007199254740993.0,
                1e300,
                -1e-300
              }
              [r.nextInt(8)];
      case 6 -> r.nextLong() / 1e6;
      default -> r.nextGaussian() * Math.pow(10, r.nextInt(12) - 6);
    };
  }

  private static Double nullable(java.util.Random r) {
    return r.nextInt(4) == 0 ? null : number(r);
  }

  private static String string(java.util.Random r) {
    return switch (r.nextInt(6)) {
      case 0 -> null;
      case 1 -> "";
      case 2 -> "µ-text ⇌ " + r.nextInt(1000);
      default -> EvaluationPack.WORDS.get(r.nextInt(EvaluationPack.WORDS.size()));
    };
  }

  private static String explanation(java.util.Random r) {
    if (r.nextInt(5) == 0) {
      return string(r);
    }
    String sentence = EvaluationPack.SENTENCES.get(r.nextInt(EvaluationPack.SENTENCES.size()));
    StringBuilder out = new StringBuilder();
    String[] pieces = sentence.split("%s", -1);
    for (int k = 0; k < pieces.length; k++) {
      out.append(pieces[k]);
      if (k < pieces.length - 1) {
        out.append(
            switch (r.nextInt(6)) {
              case 0 -> "";
              case 1 -> String.valueOf(number(r));
              case 2 -> String.format(java.util.Locale.ROOT, "%.3g", number(r));
              case 3 -> pieces[(k + 1) % pieces.length];
              case 4 -> String.valueOf(string(r));
              default -> String.valueOf(r.nextInt(1000));
            });
      }
    }
    return out.toString();
  }

  /**
   * A pack that main wrote in format 1 (an ingest load run, 2026-12-03) still reads back, and
   * format 1's writer still writes its bytes.
   */
  @Test
  void aFormatOnePackOfALoadRunStillReadsBack() {
    byte[] pack = HexFormat.of().parseHex(LOAD_RUN_PACK);
    EvaluationView v = EvaluationPack.decode(pack);
    assertThat(EvaluationPack.encodeFormat1(v)).isEqualTo(pack);
    assertThat(v.findings()).hasSize(1);
    assertThat(v.findings().get(0).explanation())
        .isEqualTo(
            "Measured pH 9.76 differs from calculated 9.30 by 0.461 (band ±0.200) for 10 min.");
    assertThat(v.phAtTemperature().temperatureCel()).isEqualTo(155.0);
    EvaluationPack.Columns columns = EvaluationPack.Columns.of(v);
    byte[] two = EvaluationPack.encode(v, columns);
    assertThat(EvaluationPack.decode(two, columns)).isEqualTo(v);
    assertThat(two.length).as("format 2 bytes").isLessThan(pack.length * 6 / 10);
    assertThatThrownBy(() -> EvaluationPack.decode(two, EvaluationPack.Columns.NONE))
        .hasMessageContaining("without its row's columns");
    EvaluationPack.Columns otherVersion =
        new EvaluationPack.Columns(
            columns.sc25(),
            columns.cc25(),
            columns.dcc25(),
            columns.ph25(),
            columns.phAtTemperature(),
            columns.low(),
            columns.high(),
            columns.neutral(),
            v.configVersion() + 1,
            v.instrumentInDoubt());
    assertThatThrownBy(() -> EvaluationPack.encode(v, otherVersion))
        .isInstanceOf(IllegalArgumentException.class);
  }

  private static final String LOAD_RUN_PACK =
      "0101040102e0e29905014015d0e5604189460280e1eb1700000302c0ee0902c0ee090280e1eb1701000502f0b20702f0b2070280e1eb17010001013fe7881d1042fa42013ff26aad439143e8014016fbf2bde7d76f02c0a8310200000101402297587d4dc41d013f81b364dc49c2190140229beff6d59cd202a09296080102010280f3e89301028087a70e01401adb438525708101401abeed714ac0be01401b02240c87ddb57701401712a77a3af1227d7301790000010303030303030001000000013f8018e757928e0d0300000000040502fc060003028e030001013f80110a137f38c5000100000002e4da0102aacd037f81010001010000000200020000000001010000000292e0020292e002000000037b02fcde0200850102d21c0002396ba4014d6561737572656420704820392e373620646966666572732066726f6d2063616c63756c6174656420392e333020627920302e343631202862616e6420c2b1302e3230302920666f72203130206d696e2e0101";

  @Test
  void aDamagedPackFailsLoudly() throws IOException {
    EvaluationView v = demoViews().get(0);
    EvaluationPack.Columns columns = EvaluationPack.Columns.of(v);
    for (byte[] pack :
        List.of(
            EvaluationPack.encodeFormat1(v.forStorage()),
            EvaluationPack.encode(v.forStorage(), columns),
            EvaluationPack.encode(v.forStorage(), columns, SHAPES))) {
      for (int cut : new int[] {0, 1, pack.length / 2, pack.length - 1}) {
        byte[] shorter = Arrays.copyOf(pack, cut);
        assertThatThrownBy(() -> EvaluationPack.decode(shorter, columns, SHAPES))
            .isInstanceOf(IllegalStateException.class);
      }
      byte[] longer = Arrays.copyOf(pack, pack.length + 1);
      assertThatThrownBy(() -> EvaluationPack.decode(longer, columns, SHAPES))
          .hasMessageContaining("after its last field");
      byte[] otherFormat = pack.clone();
      otherFormat[0] = 9;
      assertThatThrownBy(() -> EvaluationPack.decode(otherFormat, columns, SHAPES))
          .hasMessageContaining("format 9");
    }
  }

  /**
   * A sentence's position is its code in rows already written: the list may grow at its end but its
   * first 14 sentences (format 2 as first shipped) never change.
   */
  @Test
  void theSentenceListOnlyGrowsAtItsEnd() throws Exception {
    List<String> sentences = EvaluationPack.SENTENCES;
    assertThat(sentences).hasSizeGreaterThanOrEqualTo(14).doesNotHaveDuplicates();
    String first = String.join("\n", sentences.subList(0, 14)) + "\n";
    byte[] digest =
        MessageDigest.getInstance("SHA-256").digest(first.getBytes(StandardCharsets.UTF_8));
    assertThat(HexFormat.of().formatHex(digest))
        .isEqualTo("c5f4a4ffd08df820fbd85b60dbca9189af5986441847095f1a196f81bc8f4cfa");
    assertThat(EvaluationPack.WORDS.subList(112, 120))
        .containsExactly("SC", "CACE", "DCACE", "pH", "Na", "NaN", "uS/cm", "ug/kg");
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
