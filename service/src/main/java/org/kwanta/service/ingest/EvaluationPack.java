package org.kwanta.service.ingest;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.kwanta.service.chemistry.PhUncertaintyView;
import org.kwanta.service.chemistry.PhUncertaintyView.ContributionView;
import org.kwanta.service.chemistry.PhUncertaintyView.PartView;
import org.kwanta.service.ingest.EvaluationView.CalculatedPh;
import org.kwanta.service.ingest.EvaluationView.Compensated;
import org.kwanta.service.ingest.EvaluationView.Composition;
import org.kwanta.service.ingest.EvaluationView.FindingView;
import org.kwanta.service.ingest.EvaluationView.PhAtTemperature;

/**
 * The compact binary form of a stored evaluation ({@code evaluation.detail_pack}): the fields of
 * {@link EvaluationView#forStorage()} in declaration order, without names. It replaces about 3 kB
 * of JSON text per evaluation by about 105 bytes (format 3; 180 in format 2) and reads back to an
 * equal view, so the API's JSON is unchanged ({@code EvaluationPackTest} checks the round trip).
 * The first byte of every pack is its format; {@link #decode} reads all three formats.
 *
 * <p>Format 1 (written from V61 until V70):
 *
 * <ul>
 *   <li>a <b>number</b> is one tag byte: 0 null; 1 followed by the 8 bytes of the IEEE double; 2
 *       followed by a zigzag varint k, the value being exactly k / 10⁶ (the uncertainty's
 *       half-widths, stored to 10⁻⁶ pH, and zeros take 2 bytes instead of 9); 3 followed by a
 *       varint d: the same bits as the number written d + 1 numbers before (of the last {@value
 *       #HISTORY}; a conductivity read at 25 °C equals its 25 °C value, the band's central pH and
 *       ends are repeated in its uncertainty);
 *   <li>a <b>string</b> is a varint v: 0 null; odd, the word (v − 1) / 2 of the frozen list {@code
 *       evaluation-pack-words-1.txt} (parameter and finding codes, formulations, constant sets: the
 *       strings nearly every row repeats); even, (v / 2 − 1) bytes of UTF-8 follow;
 *   <li>a <b>list</b> is a varint n + 1 (0 for null) followed by its items; a nested record is a
 *       presence byte followed by its fields; booleans are one byte; an instant is a zigzag varint
 *       of epoch seconds and a varint of nanoseconds.
 * </ul>
 *
 * <p>Format 2 (from V70) keeps lists and instants as format 1 and changes:
 *
 * <ul>
 *   <li>the configuration version and the instrument-in-doubt flag are not written: they are the
 *       row's columns;
 *   <li>a <b>string</b> is a varint v: 0 null; 1 the empty string; 2 to {@value #FORMAT_2_WORDS} +
 *       1 the word v − 2 of the same list (one byte for its first 126 words); above, (v − {@value
 *       #FORMAT_2_WORDS} − 2) bytes of UTF-8 follow;
 *   <li>a <b>number</b> is one tag byte: 0 null; 1 followed by the 8 bytes of the IEEE double; 2
 *       the same bits as the number's <em>context</em>: for the 25 °C conductivities, the
 *       calculated pH, the pH at temperature, its band and the neutral pH, the row's typed column
 *       ({@link Columns}; the reader passes the row's columns in), for an uncertainty part's low
 *       and high the uncertainty's pH − belowPh and pH + abovePh; 3 +0.0; 4 + s (s = 0..6) followed
 *       by a zigzag varint k, the value being exactly k / 10^s; 11 + d (d &lt; {@value #HISTORY})
 *       the same bits as the number read d + 1 numbers before;
 *   <li>a conductivity's two flags share one byte (bit 0 compensated by the analyser, bit 1 below
 *       pure water);
 *   <li>an uncertainty part is one byte of flags (0: absent; bit 0 present, bit 1 its label, low,
 *       high and basis follow, bit 2 its constant sets follow, bit 3 its contributions carry a
 *       detail), then belowPh, abovePh and the fields its flags name: the compact part {@link
 *       PhUncertaintyView#compact()} stores has none of the optional fields;
 *   <li>a finding's <b>explanation</b> is a varint: 0 null; 1 a string follows; 2 + t: the
 *       explanation is the sentence t of the frozen list {@code evaluation-pack-explanations-2.txt}
 *       with its {@code %s} slots filled by what follows: per slot, nibbles (high half first) of
 *       the characters {@value #SLOT_CHARACTERS} ended by 15, or the single nibble 14 when the slot
 *       is a string written after the nibbles (padded to a byte with 0).
 * </ul>
 *
 * <p>Format 3 (from V72; the service writes it through {@link #encode(EvaluationView, Columns,
 * Shapes)}) writes the same fields as format 2 in two streams. The <em>shape</em>: everything that
 * says what the fields are (presence bytes, list lengths, flags, words, sentence numbers, the tag
 * of each number, the code 1026 for a string written out); the <em>values</em>: the 8 bytes of a
 * raw number, a decimal as one varint (zigzag k shifted left by 3, or'ed with s: the value is k /
 * 10^s), the bytes of a string written out (a varint length, then UTF-8), an instant's seconds and
 * nanoseconds, the nibbles of an explanation's slots. The pack is the format byte 3, the varint
 * number of its shape ({@link Shapes}: the table {@code evaluation_shape}), then the values. A
 * point's consecutive evaluations differ in their values and nearly never in their shape (an ingest
 * load run: 8 shapes for 145,920 rows, 179 bytes a pack in format 2, 104 in format 3).
 *
 * <p>The word and sentence lists are append-only: a word's position is its code in every row ever
 * written (a test pins the lists' first entries). Words or sentences that are not listed are
 * written out, so a new finding code, note or explanation needs no change here; adding it to the
 * end of its list only makes rows shorter.
 */
final class EvaluationPack {

  static final String WORDS_RESOURCE = "/evaluation-pack-words-1.txt";

  static final List<String> WORDS = loadWords(WORDS_RESOURCE);

  static final String SENTENCES_RESOURCE = "/evaluation-pack-explanations-2.txt";

  /** The explanation sentences of format 2, {@code %s} where a value goes. */
  static final List<String> SENTENCES = loadWords(SENTENCES_RESOURCE);

  /** The characters a slot of an explanation is written with in nibbles 0 to 13. */
  static final String SLOT_CHARACTERS = "0123456789.-+e";

  /** How many words of the list a format-2 string can name (see the class comment). */
  static final int FORMAT_2_WORDS = 1024;

  /** How many of the last numbers a number may refer back to. */
  static final int HISTORY = 32;

  private static final Map<String, Integer> CODES = codes(WORDS, WORDS_RESOURCE);

  private static final List<String[]> SENTENCE_PIECES = pieces(SENTENCES);

  private static final double[] POWERS_OF_TEN = {1, 10, 100, 1e3, 1e4, 1e5, 1e6};

  private EvaluationPack() {}

  /**
   * The row's columns that a format-2 pack refers to, NaN where a number's column is NULL: what
   * {@link EvaluationStore} writes and {@link Evaluations} reads back beside the pack. A format-2
   * pack holds neither the configuration version nor the instrument-in-doubt flag: they are the
   * row's {@code config_version} and {@code instrument_in_doubt} (null in {@link #NONE}).
   */
  record Columns(
      double sc25,
      double cc25,
      double dcc25,
      double ph25,
      double phAtTemperature,
      double low,
      double high,
      double neutral,
      Integer configVersion,
      Boolean instrumentInDoubt) {

    /** No columns (a reader without them can still decode format 1). */
    static final Columns NONE =
        new Columns(
            Double.NaN,
            Double.NaN,
            Double.NaN,
            Double.NaN,
            Double.NaN,
            Double.NaN,
            Double.NaN,
            Double.NaN,
            null,
            null);

    /** The columns a view is stored with. */
    static Columns of(EvaluationView v) {
      EvaluationView.PhAtTemperature t = v.phAtTemperature();
      return new Columns(
          nanIfNull(v.at25("specific_conductivity")),
          nanIfNull(v.at25("cation_conductivity")),
          nanIfNull(v.at25("degassed_cation_conductivity")),
          v.calculatedPh() == null ? Double.NaN : finiteOrNaN(v.calculatedPh().rigorous()),
          t == null ? Double.NaN : finiteOrNaN(t.ph()),
          t == null ? Double.NaN : finiteOrNaN(t.low()),
          t == null ? Double.NaN : finiteOrNaN(t.high()),
          t == null ? Double.NaN : finiteOrNaN(t.neutralPh()),
          v.configVersion(),
          v.instrumentInDoubt());
    }

    /** The ten columns of a result set from {@code first} on, in the order of the record. */
    static Columns read(java.sql.ResultSet rs, int first) throws java.sql.SQLException {
      double[] c = new double[8];
      for (int k = 0; k < 8; k++) {
        c[k] = rs.getDouble(first + k);
        if (rs.wasNull()) {
          c[k] = Double.NaN;
        }
      }
      return new Columns(
          c[0],
          c[1],
          c[2],
          c[3],
          c[4],
          c[5],
          c[6],
          c[7],
          rs.getInt(first + 8),
          rs.getBoolean(first + 9));
    }

    /** The SQL select list of the columns, in the order of the record. */
    static final String SELECT =
        "specific_conductivity_25, cation_conductivity_25, degassed_cation_conductivity_25,"
            + " calculated_ph_25, ph_at_temperature, ph_at_temperature_low, ph_at_temperature_high,"
            + " neutral_ph_at_temperature, config_version, instrument_in_doubt";

    private static double nanIfNull(Double v) {
      return v == null ? Double.NaN : v;
    }

    private static double finiteOrNaN(double v) {
      return Double.isFinite(v) ? v : Double.NaN;
    }

    /** The conductivity column of a parameter, NaN for one without. */
    double at25(String parameter) {
      if (parameter == null) {
        return Double.NaN;
      }
      return switch (parameter) {
        case "specific_conductivity" -> sc25;
        case "cation_conductivity" -> cc25;
        case "degassed_cation_conductivity" -> dcc25;
        default -> Double.NaN;
      };
    }
  }

  /** Encodes a view (in the form {@link EvaluationView#forStorage()} gives) in format 2. */
  static byte[] encode(EvaluationView v) {
    return encode(v, Columns.of(v));
  }

  /** Encodes a view in format 2, numbers equal to {@code c}'s columns by reference to them. */
  static byte[] encode(EvaluationView v, Columns c) {
    Out o = new Out(2);
    o.b(2);
    write(o, v, c);
    return o.bytes();
  }

  /**
   * Encodes a view in format 3: its shape numbered by {@code shapes}, its values in the pack; in
   * format 2 when {@code shapes} takes no more shapes.
   */
  static byte[] encode(EvaluationView v, Columns c, Shapes shapes) {
    Out o = new Out(3);
    write(o, v, c);
    int number = shapes.number(o.shapeBytes());
    if (number < 0) {
      return encode(v, c);
    }
    byte[] payload = o.payloadBytes();
    Buf pack = new Buf(payload.length + 4);
    pack.b(3);
    pack.varint(number);
    for (byte x : payload) {
      pack.b(x);
    }
    return pack.bytes();
  }

  /**
   * The shapes of format-3 packs, each numbered once and kept for good (the table {@code
   * evaluation_shape}; a map in tests).
   */
  interface Shapes {
    /**
     * The number of a shape, registered durably (committed before it is returned) when new; -1 when
     * no more shapes are taken.
     */
    int number(byte[] shape);

    /** The shape numbered {@code number}; fails when there is none. */
    byte[] shape(int number);
  }

  /** Writes the fields of format 2 or 3 (after the format byte). */
  private static void write(Out o, EvaluationView v, Columns c) {
    if (!Integer.valueOf(v.configVersion()).equals(c.configVersion())
        || !Boolean.valueOf(v.instrumentInDoubt()).equals(c.instrumentInDoubt())) {
      throw new IllegalArgumentException(
          "a format-2 pack takes the configuration version and the doubt from its row's columns");
    }
    o.list(
        v.compensated(),
        (out, k) -> {
          out.str(k.parameter());
          out.num(k.asReadUSPerCm());
          out.num(k.at25USPerCm(), c.at25(k.parameter()));
          out.num(k.sampleTemperatureCel());
          out.b((k.compensatedByAnalyser() ? 1 : 0) | (k.belowPureWater() ? 2 : 0));
        });
    composition(o, v.composition());
    if (o.present(v.calculatedPh())) {
      CalculatedPh p = v.calculatedPh();
      o.num(p.rigorous(), c.ph25());
      o.num(p.rigorousUncertainty());
      o.num(p.tradeFormula());
      o.num(p.tradeFormulaConstant());
      o.bool(p.tradeFormulaInWindow());
      o.str(p.tradeFormulaNote());
    }
    if (o.present(v.phAtTemperature())) {
      PhAtTemperature t = v.phAtTemperature();
      o.num(t.temperatureCel());
      o.num(t.pressureMPa());
      o.num(t.ph(), c.phAtTemperature());
      o.num(t.low(), c.low());
      o.num(t.high(), c.high());
      o.str(t.bandFrom());
      o.num(t.neutralPh(), c.neutral());
      o.str(t.formulation());
      o.str(t.basis());
      o.list(t.notes(), Out::str);
      o.str(t.operatingConditionSource());
      o.num(t.measuredDrumPressureMPa());
      measuredAt(o, t.measuredAt());
      PhUncertaintyView u = t.uncertainty();
      if (o.present(u)) {
        o.num(u.ph(), c.phAtTemperature());
        o.num(u.low(), c.low());
        o.num(u.high(), c.high());
        o.str(u.rule());
        part2(o, u.instrumentTolerances(), u.ph());
        part2(o, u.constantSetSpread(), u.ph());
        part2(o, u.estimatedConstants(), u.ph());
        part2(o, u.operatingConditions(), u.ph());
      }
    }
    o.list(
        v.findings(),
        (out, f) -> {
          out.str(f.code());
          out.str(f.pointsAt());
          out.explanation(f.explanation());
        });
    o.list(v.notes(), Out::str);
  }

  /** Encodes a view in format 1, as written from V61 until V70 (for tests of old rows). */
  static byte[] encodeFormat1(EvaluationView v) {
    Out o = new Out(1);
    o.b(1);
    o.varint(v.configVersion());
    o.list(v.compensated(), EvaluationPack::compensated);
    composition(o, v.composition());
    if (o.present(v.calculatedPh())) {
      CalculatedPh c = v.calculatedPh();
      o.num(c.rigorous());
      o.num(c.rigorousUncertainty());
      o.num(c.tradeFormula());
      o.num(c.tradeFormulaConstant());
      o.bool(c.tradeFormulaInWindow());
      o.str(c.tradeFormulaNote());
    }
    if (o.present(v.phAtTemperature())) {
      phAtTemperature(o, v.phAtTemperature());
    }
    o.list(
        v.findings(),
        (out, f) -> {
          out.str(f.code());
          out.str(f.pointsAt());
          out.str(f.explanation());
        });
    o.bool(v.instrumentInDoubt());
    o.list(v.notes(), Out::str);
    return o.bytes();
  }

  private static void composition(Out o, Composition c) {
    if (o.present(c)) {
      o.num(c.alkalizerMgPerKg());
      o.num(c.chlorideEquivalentUgPerKg());
      o.num(c.carbonDioxideUgPerKg());
      o.num(c.sodiumUgPerKg());
      o.num(c.phosphateMgPerKg());
      o.num(c.sodiumToPhosphateMolarRatio());
    }
  }

  private static void measuredAt(Out o, Instant at) {
    if (o.present(at)) {
      o.instant(at);
    }
  }

  /** Decodes a pack of format 1 (which needs no columns); a format-2 pack fails. */
  static EvaluationView decode(byte[] bytes) {
    return decode(bytes, Columns.NONE);
  }

  /** Decodes what {@link #encode} or {@link #encodeFormat1} wrote; {@code c}: the row's columns. */
  static EvaluationView decode(byte[] bytes, Columns c) {
    return decode(bytes, c, null);
  }

  /**
   * Decodes a pack of any format; {@code c}: the row's columns, {@code shapes}: where format 3
   * finds its shapes.
   */
  static EvaluationView decode(byte[] bytes, Columns c, Shapes shapes) {
    In in = new In(bytes);
    int format = in.b();
    in.format = format;
    if (format == 3) {
      if (shapes == null) {
        throw new IllegalStateException("evaluation pack of format 3 read without its shapes");
      }
      long number = in.varint();
      if (number > Integer.MAX_VALUE) {
        throw new IllegalStateException("evaluation pack names shape " + number);
      }
      in.split(shapes.shape((int) number));
    }
    EvaluationView v =
        switch (format) {
          case 1 -> decode1(in);
          case 2, 3 -> decode2(in, c);
          default ->
              throw new IllegalStateException("evaluation pack format " + format + " is not known");
        };
    if (!in.atEnd()) {
      throw new IllegalStateException("evaluation pack has bytes after its last field");
    }
    return v;
  }

  private static EvaluationView decode2(In in, Columns c) {
    if (c.configVersion() == null || c.instrumentInDoubt() == null) {
      throw new IllegalStateException(
          "evaluation pack of format " + in.format + " read without its row's columns");
    }
    int configVersion = c.configVersion();
    List<Compensated> compensated =
        in.list(
            i -> {
              String parameter = i.str();
              double asRead = i.dbl();
              double at25 = i.dbl(c.at25(parameter));
              Double temperature = i.num();
              int flags = i.b();
              if (flags > 3) {
                throw new IllegalStateException("evaluation pack has flags " + flags);
              }
              return new Compensated(
                  parameter, asRead, temperature, at25, (flags & 1) != 0, (flags & 2) != 0);
            });
    Composition composition = composition(in);
    CalculatedPh calculated =
        in.present()
            ? new CalculatedPh(in.dbl(c.ph25()), in.dbl(), in.num(), in.num(), in.bool(), in.str())
            : null;
    PhAtTemperature t = null;
    if (in.present()) {
      double temperature = in.dbl();
      double pressure = in.dbl();
      double ph = in.dbl(c.phAtTemperature());
      double low = in.dbl(c.low());
      double high = in.dbl(c.high());
      String bandFrom = in.str();
      double neutral = in.dbl(c.neutral());
      String formulation = in.str();
      String basis = in.str();
      List<String> notes = in.list(In::str);
      String source = in.str();
      Double drumPressure = in.num();
      Instant measuredAt = in.present() ? in.instant() : null;
      PhUncertaintyView u = null;
      if (in.present()) {
        double uPh = in.dbl(c.phAtTemperature());
        double uLow = in.dbl(c.low());
        double uHigh = in.dbl(c.high());
        String rule = in.str();
        u =
            new PhUncertaintyView(
                uPh,
                uLow,
                uHigh,
                rule,
                part2(in, uPh),
                part2(in, uPh),
                part2(in, uPh),
                part2(in, uPh));
      }
      t =
          new PhAtTemperature(
              temperature,
              pressure,
              ph,
              low,
              high,
              bandFrom,
              neutral,
              formulation,
              basis,
              notes,
              source,
              drumPressure,
              measuredAt,
              u);
    }
    List<FindingView> findings = in.list(i -> new FindingView(i.str(), i.str(), i.explanation()));
    boolean inDoubt = c.instrumentInDoubt();
    List<String> notes = in.list(In::str);
    return new EvaluationView(
        configVersion, compensated, composition, calculated, t, findings, inDoubt, notes);
  }

  private static void part2(Out o, PartView p, double ph) {
    if (p == null) {
      o.b(0);
      return;
    }
    boolean general = p.label() != null || p.low() != null || p.high() != null || p.basis() != null;
    boolean sets = p.lowConstantSet() != null || p.highConstantSet() != null;
    boolean details =
        p.contributions() != null && p.contributions().stream().anyMatch(k -> k.detail() != null);
    o.b(1 | (general ? 2 : 0) | (sets ? 4 : 0) | (details ? 8 : 0));
    o.num(p.belowPh());
    o.num(p.abovePh());
    if (general) {
      o.str(p.label());
      o.num(p.low(), ph - p.belowPh());
      o.num(p.high(), ph + p.abovePh());
      o.str(p.basis());
    }
    if (sets) {
      o.str(p.lowConstantSet());
      o.str(p.highConstantSet());
    }
    o.list(
        p.contributions(),
        (out, k) -> {
          out.str(k.source());
          out.num(k.halfWidthPh());
          if (details) {
            out.str(k.detail());
          }
        });
  }

  private static PartView part2(In in, double ph) {
    int flags = in.b();
    if (flags == 0) {
      return null;
    }
    if ((flags & 1) == 0 || flags > 15) {
      throw new IllegalStateException("evaluation pack has part flags " + flags);
    }
    double below = in.dbl();
    double above = in.dbl();
    String label = null;
    Double low = null;
    Double high = null;
    String basis = null;
    if ((flags & 2) != 0) {
      label = in.str();
      low = in.num(ph - below);
      high = in.num(ph + above);
      basis = in.str();
    }
    String lowSet = null;
    String highSet = null;
    if ((flags & 4) != 0) {
      lowSet = in.str();
      highSet = in.str();
    }
    boolean details = (flags & 8) != 0;
    List<ContributionView> contributions =
        in.list(i -> new ContributionView(i.str(), i.dbl(), details ? i.str() : null));
    return new PartView(label, low, high, below, above, lowSet, highSet, basis, contributions);
  }

  private static EvaluationView decode1(In in) {
    int configVersion = (int) in.varint();
    List<Compensated> compensated =
        in.list(
            i -> {
              String parameter = i.str();
              double asRead = i.dbl();
              double at25 = i.dbl();
              return new Compensated(parameter, asRead, i.num(), at25, i.bool(), i.bool());
            });
    Composition composition = composition(in);
    CalculatedPh calculated =
        in.present()
            ? new CalculatedPh(in.dbl(), in.dbl(), in.num(), in.num(), in.bool(), in.str())
            : null;
    PhAtTemperature t = in.present() ? phAtTemperature(in) : null;
    List<FindingView> findings = in.list(i -> new FindingView(i.str(), i.str(), i.str()));
    boolean inDoubt = in.bool();
    List<String> notes = in.list(In::str);
    return new EvaluationView(
        configVersion, compensated, composition, calculated, t, findings, inDoubt, notes);
  }

  private static Composition composition(In in) {
    return in.present()
        ? new Composition(in.num(), in.num(), in.num(), in.num(), in.num(), in.num())
        : null;
  }

  private static void compensated(Out o, Compensated c) {
    o.str(c.parameter());
    o.num(c.asReadUSPerCm());
    o.num(c.at25USPerCm());
    o.num(c.sampleTemperatureCel());
    o.bool(c.compensatedByAnalyser());
    o.bool(c.belowPureWater());
  }

  private static void phAtTemperature(Out o, PhAtTemperature t) {
    o.num(t.temperatureCel());
    o.num(t.pressureMPa());
    o.num(t.ph());
    o.num(t.low());
    o.num(t.high());
    o.str(t.bandFrom());
    o.num(t.neutralPh());
    o.str(t.formulation());
    o.str(t.basis());
    o.list(t.notes(), Out::str);
    o.str(t.operatingConditionSource());
    o.num(t.measuredDrumPressureMPa());
    if (o.present(t.measuredAt())) {
      o.zigzag(t.measuredAt().getEpochSecond());
      o.varint(t.measuredAt().getNano());
    }
    PhUncertaintyView u = t.uncertainty();
    if (o.present(u)) {
      o.num(u.ph());
      o.num(u.low());
      o.num(u.high());
      o.str(u.rule());
      part(o, u.instrumentTolerances());
      part(o, u.constantSetSpread());
      part(o, u.estimatedConstants());
      part(o, u.operatingConditions());
    }
  }

  private static PhAtTemperature phAtTemperature(In in) {
    double temperature = in.dbl();
    double pressure = in.dbl();
    double ph = in.dbl();
    double low = in.dbl();
    double high = in.dbl();
    String bandFrom = in.str();
    double neutral = in.dbl();
    String formulation = in.str();
    String basis = in.str();
    List<String> notes = in.list(In::str);
    String source = in.str();
    Double drumPressure = in.num();
    Instant measuredAt = in.present() ? Instant.ofEpochSecond(in.zigzag(), in.varint()) : null;
    PhUncertaintyView u =
        in.present()
            ? new PhUncertaintyView(
                in.dbl(), in.dbl(), in.dbl(), in.str(), part(in), part(in), part(in), part(in))
            : null;
    return new PhAtTemperature(
        temperature,
        pressure,
        ph,
        low,
        high,
        bandFrom,
        neutral,
        formulation,
        basis,
        notes,
        source,
        drumPressure,
        measuredAt,
        u);
  }

  private static void part(Out o, PartView p) {
    if (o.present(p)) {
      o.str(p.label());
      o.num(p.low());
      o.num(p.high());
      o.num(p.belowPh());
      o.num(p.abovePh());
      o.str(p.lowConstantSet());
      o.str(p.highConstantSet());
      o.str(p.basis());
      o.list(
          p.contributions(),
          (out, c) -> {
            out.str(c.source());
            out.num(c.halfWidthPh());
            out.str(c.detail());
          });
    }
  }

  private static PartView part(In in) {
    if (!in.present()) {
      return null;
    }
    return new PartView(
        in.str(),
        in.num(),
        in.num(),
        in.dbl(),
        in.dbl(),
        in.str(),
        in.str(),
        in.str(),
        in.list(i -> new ContributionView(i.str(), i.dbl(), i.str())));
  }

  private static List<String> loadWords(String resource) {
    try (InputStream s = EvaluationPack.class.getResourceAsStream(resource)) {
      if (s == null) {
        throw new IllegalStateException(resource + " is missing from the class path");
      }
      return new BufferedReader(new InputStreamReader(s, StandardCharsets.UTF_8)).lines().toList();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  private static Map<String, Integer> codes(List<String> words, String resource) {
    Map<String, Integer> m = new HashMap<>();
    for (int i = 0; i < words.size(); i++) {
      if (m.putIfAbsent(words.get(i), i) != null) {
        throw new IllegalStateException("word listed twice in " + resource + ": " + words.get(i));
      }
    }
    return Map.copyOf(m);
  }

  /** Each sentence cut at its slots: n slots give n + 1 pieces, none empty but the ends. */
  private static List<String[]> pieces(List<String> sentences) {
    codes(sentences, SENTENCES_RESOURCE);
    List<String[]> out = new ArrayList<>();
    for (String s : sentences) {
      String[] p = s.split("%s", -1);
      for (int k = 1; k < p.length - 1; k++) {
        if (p[k].isEmpty()) {
          throw new IllegalStateException("two slots touch in " + SENTENCES_RESOURCE + ": " + s);
        }
      }
      if (p.length < 2) {
        throw new IllegalStateException("a sentence without slots in " + SENTENCES_RESOURCE);
      }
      out.add(p);
    }
    return List.copyOf(out);
  }

  /**
   * The slots of {@code s} in the sentence cut into {@code p}, or null when it does not match. Each
   * inner piece is taken at its first place after the slot's start, so the slots, put back between
   * the pieces, give {@code s} again.
   */
  private static String[] slots(String s, String[] p) {
    if (!s.startsWith(p[0])) {
      return null;
    }
    int n = p.length - 1;
    String[] out = new String[n];
    int at = p[0].length();
    for (int k = 0; k < n; k++) {
      String next = p[k + 1];
      int end;
      if (k == n - 1) {
        end = s.length() - next.length();
        if (end < at || !s.endsWith(next)) {
          return null;
        }
      } else {
        end = s.indexOf(next, at);
        if (end < 0) {
          return null;
        }
      }
      out[k] = s.substring(at, end);
      at = end + next.length();
    }
    return out;
  }

  private interface Writer<T> {
    void write(Out o, T value);
  }

  private interface Reader<T> {
    T read(In in);
  }

  /** A growing byte buffer with the format's primitives. */
  private static final class Out {
    private final int format;

    /** The structure (format 3: the shape), and the values (the same buffer before format 3). */
    private final Buf shape;

    private final Buf payload;

    Out(int format) {
      this.format = format;
      this.shape = new Buf(format == 3 ? 96 : 256);
      this.payload = format == 3 ? new Buf(160) : shape;
    }

    void b(int v) {
      shape.b(v);
    }

    void varint(long v) {
      shape.varint(v);
    }

    void zigzag(long v) {
      shape.varint((v << 1) ^ (v >> 63));
    }

    boolean present(Object o) {
      b(o == null ? 0 : 1);
      return o != null;
    }

    void bool(boolean v) {
      b(v ? 1 : 0);
    }

    private final long[] history = new long[HISTORY];
    private int written;

    void num(Double v) {
      if (format == 1) {
        num1(v);
      } else {
        num(v, Double.NaN);
      }
    }

    /**
     * A number of format 2; {@code context}: the value the reader will know at this place (a
     * column, a derived bound), NaN for none.
     */
    void num(Double v, double context) {
      if (v == null) {
        b(0);
        return;
      }
      double x = v;
      long bits = Double.doubleToRawLongBits(x);
      if (!Double.isNaN(context) && Double.doubleToRawLongBits(context) == bits) {
        b(2);
      } else if (bits == 0) {
        b(3);
      } else {
        int d = back(bits);
        if (d >= 0) {
          b(11 + d);
        } else if (!decimal(x, bits)) {
          raw(bits);
        }
      }
      remember(bits);
    }

    /** Writes x as k / 10^s with the least s that gives its bits back; false when none does. */
    private boolean decimal(double x, long bits) {
      // k / 10^s (s ≤ 6) times 10⁶ lies within a few ulps of the integer k·10^(6 − s): a number
      // farther from one (most results of a calculation) is none of them
      double micro = x * 1e6;
      if (!(Math.abs(micro) < 0x1p53)
          || Math.abs(micro - Math.rint(micro)) > Math.abs(micro) * 0x1p-40) {
        return false;
      }
      for (int s = 0; s < POWERS_OF_TEN.length; s++) {
        double scaled = x * POWERS_OF_TEN[s];
        if (Math.abs(scaled) < 0x1p53 && Math.rint(scaled) == scaled) {
          long k = (long) scaled;
          if (Double.doubleToRawLongBits(k / POWERS_OF_TEN[s]) == bits) {
            if (format == 3) {
              b(4);
              payload.varint(((k << 1) ^ (k >> 63)) << 3 | s);
            } else {
              b(4 + s);
              zigzag(k);
            }
            return true;
          }
        }
      }
      return false;
    }

    private int back(long bits) {
      for (int d = 0; d < Math.min(written, HISTORY); d++) {
        if (history[(written - 1 - d) % HISTORY] == bits) {
          return d;
        }
      }
      return -1;
    }

    private void raw(long bits) {
      b(1);
      for (int shift = 56; shift >= 0; shift -= 8) {
        payload.b((int) (bits >>> shift));
      }
    }

    private void num1(Double v) {
      if (v == null) {
        b(0);
        return;
      }
      double x = v;
      long bits = Double.doubleToRawLongBits(x);
      double scaled = x * 1e6;
      if (Math.abs(scaled) < 0x1p53 && Math.rint(scaled) == scaled) {
        long k = (long) scaled;
        if (Double.doubleToRawLongBits(k / 1e6) == bits) {
          b(2);
          zigzag(k);
          remember(bits);
          return;
        }
      }
      int d = back(bits);
      if (d >= 0) {
        b(3);
        varint(d);
      } else {
        raw(bits);
      }
      remember(bits);
    }

    private void remember(long bits) {
      history[written % HISTORY] = bits;
      written++;
    }

    void str(String s) {
      if (s == null) {
        varint(0);
        return;
      }
      if (format >= 2 && s.isEmpty()) {
        varint(1);
        return;
      }
      Integer code = CODES.get(s);
      if (code != null && (format == 1 || code < FORMAT_2_WORDS)) {
        varint(format == 1 ? 2L * code + 1 : code + 2L);
        return;
      }
      byte[] utf8 = s.getBytes(StandardCharsets.UTF_8);
      if (format == 3) {
        varint(FORMAT_2_WORDS + 2L);
        payload.varint(utf8.length);
        for (byte x : utf8) {
          payload.b(x);
        }
        return;
      }
      varint(format == 1 ? 2L * (utf8.length + 1) : FORMAT_2_WORDS + 2L + utf8.length);
      for (byte x : utf8) {
        b(x);
      }
    }

    /** An explanation of format 2: a listed sentence with its slots, else the string. */
    void explanation(String s) {
      if (s == null) {
        varint(0);
        return;
      }
      for (int t = 0; t < SENTENCE_PIECES.size(); t++) {
        String[] slots = slots(s, SENTENCE_PIECES.get(t));
        if (slots != null) {
          varint(2L + t);
          int half = -1;
          List<String> strings = new ArrayList<>();
          for (String slot : slots) {
            if (slot.isEmpty() || inNibbles(slot)) {
              for (int k = 0; k < slot.length(); k++) {
                half = nibble(half, SLOT_CHARACTERS.indexOf(slot.charAt(k)));
              }
              half = nibble(half, 15);
            } else {
              half = nibble(half, 14);
              strings.add(slot);
            }
          }
          if (half >= 0) {
            payload.b(half << 4);
          }
          strings.forEach(this::str);
          return;
        }
      }
      varint(1);
      str(s);
    }

    /** Adds a nibble: returns the pending high half, or -1 when the byte was written. */
    private int nibble(int half, int v) {
      if (half < 0) {
        return v;
      }
      payload.b((half << 4) | v);
      return -1;
    }

    private static boolean inNibbles(String slot) {
      for (int k = 0; k < slot.length(); k++) {
        if (SLOT_CHARACTERS.indexOf(slot.charAt(k)) < 0) {
          return false;
        }
      }
      return true;
    }

    <T> void list(List<T> items, Writer<T> w) {
      if (items == null) {
        varint(0);
        return;
      }
      varint(items.size() + 1L);
      for (T item : items) {
        w.write(this, item);
      }
    }

    /**
     * An instant's epoch seconds and nanoseconds (values: format 3 keeps them with the numbers).
     */
    void instant(Instant at) {
      payload.varint((at.getEpochSecond() << 1) ^ (at.getEpochSecond() >> 63));
      payload.varint(at.getNano());
    }

    byte[] bytes() {
      return shape.bytes();
    }

    /** Format 3: the shape, without the format byte. */
    byte[] shapeBytes() {
      return shape.bytes();
    }

    byte[] payloadBytes() {
      return payload.bytes();
    }
  }

  /** A growing byte buffer. */
  private static final class Buf {
    private byte[] buf;
    private int n;

    Buf(int capacity) {
      buf = new byte[capacity];
    }

    void b(int v) {
      if (n == buf.length) {
        buf = Arrays.copyOf(buf, buf.length * 2);
      }
      buf[n++] = (byte) v;
    }

    void varint(long v) {
      while ((v & ~0x7FL) != 0) {
        b((int) ((v & 0x7F) | 0x80));
        v >>>= 7;
      }
      b((int) v);
    }

    int size() {
      return n;
    }

    byte[] bytes() {
      return Arrays.copyOf(buf, n);
    }
  }

  /** Reads what {@link Out} wrote; a short or malformed pack fails loudly. */
  private static final class In {
    /** The structure (format 3: the shape) and the values (the same cursor before format 3). */
    private Cursor shape;

    private Cursor payload;

    int format;

    In(byte[] buf) {
      this.shape = new Cursor(buf, "evaluation pack");
      this.payload = shape;
    }

    /** Format 3: the structure from {@code shapeBytes}, the values from here on. */
    void split(byte[] shapeBytes) {
      payload = shape;
      shape = new Cursor(shapeBytes, "evaluation pack shape");
    }

    int b() {
      return shape.b();
    }

    boolean atEnd() {
      return shape.atEnd() && payload.atEnd();
    }

    long varint() {
      return shape.varint();
    }

    long zigzag() {
      long v = varint();
      return (v >>> 1) ^ -(v & 1);
    }

    long payloadVarint() {
      return payload.varint();
    }

    int payloadByte() {
      return payload.b();
    }

    Instant instant() {
      long v = payload.varint();
      return Instant.ofEpochSecond((v >>> 1) ^ -(v & 1), payload.varint());
    }

    boolean present() {
      return bool();
    }

    boolean bool() {
      int x = b();
      if (x > 1) {
        throw new IllegalStateException("evaluation pack has " + x + " where a flag belongs");
      }
      return x == 1;
    }

    private final long[] history = new long[HISTORY];
    private int read;

    Double num() {
      return num(Double.NaN);
    }

    /** A number; {@code context} as {@link Out#num(Double, double)} had it. */
    Double num(double context) {
      int tag = b();
      if (tag == 0) {
        return null;
      }
      long bits = format == 1 ? bits1(tag) : bits2(tag, context);
      history[read % HISTORY] = bits;
      read++;
      return Double.longBitsToDouble(bits);
    }

    private long bits1(int tag) {
      return switch (tag) {
        case 1 -> raw();
        case 2 -> Double.doubleToRawLongBits(zigzag() / 1e6);
        case 3 -> back(varint());
        default -> throw new IllegalStateException("evaluation pack has number tag " + tag);
      };
    }

    private long bits2(int tag, double context) {
      if (tag == 1) {
        return raw();
      }
      if (tag == 2) {
        if (Double.isNaN(context)) {
          throw new IllegalStateException("evaluation pack refers to a column that is NULL");
        }
        return Double.doubleToRawLongBits(context);
      }
      if (tag == 3) {
        return 0;
      }
      if (format == 3 && tag == 4) {
        long v = payload.varint();
        int s = (int) (v & 7);
        if (s >= POWERS_OF_TEN.length) {
          throw new IllegalStateException("evaluation pack has a decimal with exponent " + s);
        }
        v >>>= 3;
        return Double.doubleToRawLongBits(((v >>> 1) ^ -(v & 1)) / POWERS_OF_TEN[s]);
      }
      if (format != 3 && tag < 4 + POWERS_OF_TEN.length) {
        return Double.doubleToRawLongBits(zigzag() / POWERS_OF_TEN[tag - 4]);
      }
      if (tag >= 11 && tag < 11 + HISTORY) {
        return back(tag - 11);
      }
      throw new IllegalStateException("evaluation pack has number tag " + tag);
    }

    private long raw() {
      long raw = 0;
      for (int k = 0; k < 8; k++) {
        raw = (raw << 8) | payload.b();
      }
      return raw;
    }

    private long back(long d) {
      if (d >= Math.min(read, HISTORY)) {
        throw new IllegalStateException("evaluation pack refers to number " + d + " back");
      }
      return history[(int) ((read - 1 - d) % HISTORY)];
    }

    double dbl() {
      return dbl(Double.NaN);
    }

    double dbl(double context) {
      Double v = num(context);
      if (v == null) {
        throw new IllegalStateException("evaluation pack has null where a number is required");
      }
      return v;
    }

    String str() {
      long v = varint();
      if (v == 0) {
        return null;
      }
      if (format >= 2 && v == 1) {
        return "";
      }
      boolean word = format == 1 ? (v & 1) == 1 : v <= FORMAT_2_WORDS + 1;
      if (word) {
        long code = format == 1 ? (v - 1) / 2 : v - 2;
        if (code >= WORDS.size()) {
          throw new IllegalStateException("evaluation pack names word " + code + ", not listed");
        }
        return WORDS.get((int) code);
      }
      if (format == 3) {
        if (v != FORMAT_2_WORDS + 2) {
          throw new IllegalStateException("evaluation pack shape has string code " + v);
        }
        return payload.utf8(payload.varint());
      }
      return shape.utf8(format == 1 ? v / 2 - 1 : v - FORMAT_2_WORDS - 2);
    }

    String explanation() {
      long v = varint();
      if (v == 0) {
        return null;
      }
      if (v == 1) {
        return str();
      }
      if (v - 2 >= SENTENCE_PIECES.size()) {
        throw new IllegalStateException(
            "evaluation pack names sentence " + (v - 2) + ", not listed");
      }
      String[] p = SENTENCE_PIECES.get((int) (v - 2));
      int slots = p.length - 1;
      StringBuilder[] text = new StringBuilder[slots];
      boolean[] string = new boolean[slots];
      int pending = -1;
      for (int k = 0; k < slots; k++) {
        text[k] = new StringBuilder();
        while (true) {
          int x;
          if (pending >= 0) {
            x = pending;
            pending = -1;
          } else {
            int y = payload.b();
            x = y >>> 4;
            pending = y & 15;
          }
          if (x == 15) {
            break;
          }
          if (x == 14) {
            if (text[k].length() > 0) {
              throw new IllegalStateException("evaluation pack has a string inside a slot");
            }
            string[k] = true;
            break;
          }
          if (x >= SLOT_CHARACTERS.length()) {
            throw new IllegalStateException("evaluation pack has slot nibble " + x);
          }
          text[k].append(SLOT_CHARACTERS.charAt(x));
        }
      }
      if (pending > 0) {
        throw new IllegalStateException("evaluation pack pads a sentence with " + pending);
      }
      StringBuilder out = new StringBuilder(p[0]);
      for (int k = 0; k < slots; k++) {
        if (string[k]) {
          String s = str();
          if (s == null) {
            throw new IllegalStateException("evaluation pack has a null slot");
          }
          out.append(s);
        } else {
          out.append(text[k]);
        }
        out.append(p[k + 1]);
      }
      return out.toString();
    }

    <T> List<T> list(Reader<T> r) {
      long n = varint();
      if (n == 0) {
        return null;
      }
      if (n - 1 > shape.left()) {
        throw new IllegalStateException("evaluation pack lists more items than it has bytes");
      }
      List<T> out = new ArrayList<>((int) (n - 1));
      for (long k = 1; k < n; k++) {
        out.add(r.read(this));
      }
      return java.util.Collections.unmodifiableList(out);
    }
  }

  /** Reads bytes in order; a short or malformed input fails loudly, naming {@code what}. */
  private static final class Cursor {
    private final byte[] buf;
    private final String what;
    private int i;

    Cursor(byte[] buf, String what) {
      this.buf = buf;
      this.what = what;
    }

    int b() {
      if (i >= buf.length) {
        throw new IllegalStateException(what + " ends early at byte " + i);
      }
      return buf[i++] & 0xFF;
    }

    boolean atEnd() {
      return i == buf.length;
    }

    int left() {
      return buf.length - i;
    }

    long varint() {
      long v = 0;
      for (int shift = 0; ; shift += 7) {
        int x = b();
        v |= (long) (x & 0x7F) << shift;
        if ((x & 0x80) == 0) {
          return v;
        }
        if (shift > 56) {
          throw new IllegalStateException(what + " has a varint longer than 64 bits");
        }
      }
    }

    String utf8(long len) {
      if (len < 0 || len > buf.length - i) {
        throw new IllegalStateException(what + " ends inside a string");
      }
      String s = new String(buf, i, (int) len, StandardCharsets.UTF_8);
      i += (int) len;
      return s;
    }
  }
}
