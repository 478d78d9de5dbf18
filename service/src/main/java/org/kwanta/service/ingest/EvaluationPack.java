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
 * of JSON text per evaluation by about 250 bytes and reads back to an equal view, so the API's JSON
 * is unchanged ({@code EvaluationPackTest} checks the round trip).
 *
 * <p>Format 1, a leading format byte then:
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
 * The word list is append-only: a word's position is its code in every row ever written (a test
 * pins the list's first entries). Words that are not in it are written out, so a new finding code
 * or note needs no change here; adding it to the end of the list only makes rows shorter.
 */
final class EvaluationPack {

  static final byte FORMAT = 1;

  static final String WORDS_RESOURCE = "/evaluation-pack-words-1.txt";

  static final List<String> WORDS = loadWords();

  /** How many of the last numbers a number may refer back to. */
  static final int HISTORY = 32;

  private static final Map<String, Integer> CODES = codes(WORDS);

  private EvaluationPack() {}

  /** Encodes a view (in the form {@link EvaluationView#forStorage()} gives). */
  static byte[] encode(EvaluationView v) {
    Out o = new Out();
    o.b(FORMAT);
    o.varint(v.configVersion());
    o.list(v.compensated(), EvaluationPack::compensated);
    if (o.present(v.composition())) {
      Composition c = v.composition();
      o.num(c.alkalizerMgPerKg());
      o.num(c.chlorideEquivalentUgPerKg());
      o.num(c.carbonDioxideUgPerKg());
      o.num(c.sodiumUgPerKg());
      o.num(c.phosphateMgPerKg());
      o.num(c.sodiumToPhosphateMolarRatio());
    }
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

  /** Decodes what {@link #encode} wrote. */
  static EvaluationView decode(byte[] bytes) {
    In in = new In(bytes);
    int format = in.b();
    if (format != FORMAT) {
      throw new IllegalStateException("evaluation pack format " + format + " is not known");
    }
    int configVersion = (int) in.varint();
    List<Compensated> compensated =
        in.list(
            i -> {
              String parameter = i.str();
              double asRead = i.dbl();
              double at25 = i.dbl();
              return new Compensated(parameter, asRead, i.num(), at25, i.bool(), i.bool());
            });
    Composition composition =
        in.present()
            ? new Composition(in.num(), in.num(), in.num(), in.num(), in.num(), in.num())
            : null;
    CalculatedPh calculated =
        in.present()
            ? new CalculatedPh(in.dbl(), in.dbl(), in.num(), in.num(), in.bool(), in.str())
            : null;
    PhAtTemperature t = in.present() ? phAtTemperature(in) : null;
    List<FindingView> findings = in.list(i -> new FindingView(i.str(), i.str(), i.str()));
    boolean inDoubt = in.bool();
    List<String> notes = in.list(In::str);
    if (!in.atEnd()) {
      throw new IllegalStateException("evaluation pack has bytes after its last field");
    }
    return new EvaluationView(
        configVersion, compensated, composition, calculated, t, findings, inDoubt, notes);
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

  private static List<String> loadWords() {
    try (InputStream s = EvaluationPack.class.getResourceAsStream(WORDS_RESOURCE)) {
      if (s == null) {
        throw new IllegalStateException(WORDS_RESOURCE + " is missing from the class path");
      }
      return new BufferedReader(new InputStreamReader(s, StandardCharsets.UTF_8)).lines().toList();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  private static Map<String, Integer> codes(List<String> words) {
    Map<String, Integer> m = new HashMap<>();
    for (int i = 0; i < words.size(); i++) {
      if (m.putIfAbsent(words.get(i), i) != null) {
        throw new IllegalStateException(
            "word listed twice in " + WORDS_RESOURCE + ": " + words.get(i));
      }
    }
    return Map.copyOf(m);
  }

  private interface Writer<T> {
    void write(Out o, T value);
  }

  private interface Reader<T> {
    T read(In in);
  }

  /** A growing byte buffer with the format's primitives. */
  private static final class Out {
    private byte[] buf = new byte[384];
    private int n;

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

    void zigzag(long v) {
      varint((v << 1) ^ (v >> 63));
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
      for (int d = 0; d < Math.min(written, HISTORY); d++) {
        if (history[(written - 1 - d) % HISTORY] == bits) {
          b(3);
          varint(d);
          remember(bits);
          return;
        }
      }
      b(1);
      for (int shift = 56; shift >= 0; shift -= 8) {
        b((int) (bits >>> shift));
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
      Integer code = CODES.get(s);
      if (code != null) {
        varint(2L * code + 1);
        return;
      }
      byte[] utf8 = s.getBytes(StandardCharsets.UTF_8);
      varint(2L * (utf8.length + 1));
      for (byte x : utf8) {
        b(x);
      }
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

    byte[] bytes() {
      return Arrays.copyOf(buf, n);
    }
  }

  /** Reads what {@link Out} wrote; a short or malformed pack fails loudly. */
  private static final class In {
    private final byte[] buf;
    private int i;

    In(byte[] buf) {
      this.buf = buf;
    }

    int b() {
      if (i >= buf.length) {
        throw new IllegalStateException("evaluation pack ends early at byte " + i);
      }
      return buf[i++] & 0xFF;
    }

    boolean atEnd() {
      return i == buf.length;
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
          throw new IllegalStateException("evaluation pack has a varint longer than 64 bits");
        }
      }
    }

    long zigzag() {
      long v = varint();
      return (v >>> 1) ^ -(v & 1);
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
      int tag = b();
      long bits =
          switch (tag) {
            case 0 -> 0;
            case 1 -> {
              long raw = 0;
              for (int k = 0; k < 8; k++) {
                raw = (raw << 8) | b();
              }
              yield raw;
            }
            case 2 -> Double.doubleToRawLongBits(zigzag() / 1e6);
            case 3 -> {
              long d = varint();
              if (d >= Math.min(read, HISTORY)) {
                throw new IllegalStateException("evaluation pack refers to number " + d + " back");
              }
              yield history[(int) ((read - 1 - d) % HISTORY)];
            }
            default -> throw new IllegalStateException("evaluation pack has number tag " + tag);
          };
      if (tag == 0) {
        return null;
      }
      history[read % HISTORY] = bits;
      read++;
      return Double.longBitsToDouble(bits);
    }

    double dbl() {
      Double v = num();
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
      if ((v & 1) == 1) {
        long code = (v - 1) / 2;
        if (code >= WORDS.size()) {
          throw new IllegalStateException("evaluation pack names word " + code + ", not listed");
        }
        return WORDS.get((int) code);
      }
      int len = (int) (v / 2 - 1);
      if (len < 0 || i + len > buf.length) {
        throw new IllegalStateException("evaluation pack ends inside a string");
      }
      String s = new String(buf, i, len, StandardCharsets.UTF_8);
      i += len;
      return s;
    }

    <T> List<T> list(Reader<T> r) {
      long n = varint();
      if (n == 0) {
        return null;
      }
      if (n - 1 > buf.length - i) {
        throw new IllegalStateException("evaluation pack lists more items than it has bytes");
      }
      List<T> out = new ArrayList<>((int) (n - 1));
      for (long k = 1; k < n; k++) {
        out.add(r.read(this));
      }
      return java.util.Collections.unmodifiableList(out);
    }
  }
}
