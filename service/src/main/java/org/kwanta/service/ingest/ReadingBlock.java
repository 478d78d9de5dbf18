package org.kwanta.service.ingest;

import java.util.ArrayList;
import java.util.List;
import java.util.zip.CRC32C;

/**
 * The lossless encoding of one series' readings in one block of packed cold storage ({@code
 * reading_pack.block}, migration V69): times, values, qualities, sample temperatures and the
 * compensated flag of a reading row, decoded back bit for bit (times to the microsecond, values by
 * their raw IEEE 754 bits, so -0.0, subnormals, infinities and NaN payloads survive).
 *
 * <p>The ideas are those of Gorilla (T. Pelkonen, S. Franklin, J. Teller, P. Cavallaro, Q. Huang,
 * J. Meza, K. Veeraraghavan: "Gorilla: A Fast, Scalable, In-Memory Time Series Database", Proc.
 * VLDB Endowment 8(12), 2015, 1816–1827, section 4.1): times as delta-of-delta with short prefix
 * codes (4.1.1), values as the XOR with the previous value coded by its leading and trailing zeros
 * (4.1.2). Analyser values usually have a fixed decimal resolution, so a column is also tried as
 * scaled integers: the smallest scale 10<sup>e</sup>, e = 0..9, at which every value {@code v}
 * round-trips exactly ({@code Double.doubleToRawLongBits(rint(v·10^e) / 10^e) == raw bits of v}),
 * stored as first integer then deltas; the shorter of the two encodings is kept.
 *
 * <p>Layout (bits, most significant first, after a format byte): count (32), times (first 64 bits,
 * then delta and delta-of-delta codes), the value column, the temperature presence as runs, the
 * present temperatures as a value column, the qualities as runs of (16-bit value, length), the
 * compensated flags as runs; zero padding to a byte, then a CRC-32C of everything before it (4
 * bytes, big-endian). Signed integers (time deltas of delta, scaled-value deltas) use the prefix
 * codes {@code 0} (zero), {@code 10}+7 bits, {@code 110}+12, {@code 1110}+21, {@code 11110}+32 and
 * {@code 11111}+64 bits (two's complement): 9 bits for an analyser's noise of a few counts, 15 for
 * millisecond jitter, 25 for jitter up to a second. A block whose checksum, format, length or
 * contents do not add up fails with {@link DamagedBlockException}; nothing is guessed.
 */
final class ReadingBlock {

  /** The format byte of blocks written by this class. */
  static final int FORMAT = 1;

  /** Largest decimal exponent tried for the scaled-integer encoding of a value column. */
  static final int MAX_SCALE = 9;

  private static final double[] POW10 = {1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9};

  /** Integers beyond ±2<sup>53</sup> are not all exact as doubles, so scaling stops there. */
  private static final double EXACT_LIMIT = 9007199254740992.0;

  private static final int MODE_XOR = 0;
  private static final int MODE_SCALED = 1;

  private ReadingBlock() {}

  /**
   * One reading row as stored.
   *
   * @param micros time in microseconds since 1970-01-01T00:00Z
   * @param value the value, any double
   * @param quality 0 good, 1 uncertain, 2 bad (any short is kept)
   * @param temperature the sample temperature in °C, or null
   * @param compensated whether the value is temperature compensated
   */
  record Row(long micros, double value, short quality, Double temperature, boolean compensated) {}

  /** A block that does not decode: damaged, truncated or of an unknown format. */
  static final class DamagedBlockException extends IllegalStateException {
    DamagedBlockException(String message) {
      super(message);
    }
  }

  /**
   * Encodes rows in strictly increasing time order.
   *
   * @throws IllegalArgumentException when the rows are empty or not strictly increasing in time
   */
  static byte[] encode(List<Row> rows) {
    int n = rows.size();
    if (n == 0) {
      throw new IllegalArgumentException("a reading block needs at least one row");
    }
    BitWriter w = new BitWriter(16 + n * 2);
    w.bits(n, 32);
    long prev = rows.get(0).micros();
    w.bits(prev, 64);
    long prevDelta = 0;
    for (int i = 1; i < n; i++) {
      long t = rows.get(i).micros();
      if (t <= prev) {
        throw new IllegalArgumentException(
            "reading block rows must be in strictly increasing time order: "
                + t
                + " µs after "
                + prev);
      }
      long delta = t - prev;
      w.signed(i == 1 ? delta : delta - prevDelta);
      prevDelta = delta;
      prev = t;
    }
    double[] values = new double[n];
    boolean[] present = new boolean[n];
    int temperatures = 0;
    for (int i = 0; i < n; i++) {
      values[i] = rows.get(i).value();
      present[i] = rows.get(i).temperature() != null;
      temperatures += present[i] ? 1 : 0;
    }
    doubles(w, values, n);
    flags(w, present);
    double[] temps = new double[temperatures];
    for (int i = 0, j = 0; i < n; i++) {
      if (present[i]) {
        temps[j++] = rows.get(i).temperature();
      }
    }
    if (temperatures > 0) {
      doubles(w, temps, temperatures);
    }
    int i = 0;
    while (i < n) {
      short q = rows.get(i).quality();
      int j = i + 1;
      while (j < n && rows.get(j).quality() == q) {
        j++;
      }
      w.bits(q & 0xFFFF, 16);
      w.varint(j - i);
      i = j;
    }
    boolean[] compensated = new boolean[n];
    for (int k = 0; k < n; k++) {
      compensated[k] = rows.get(k).compensated();
    }
    flags(w, compensated);
    return w.finish();
  }

  /**
   * Decodes a block written by {@link #encode}.
   *
   * @throws DamagedBlockException when the block is damaged or of an unknown format
   */
  static List<Row> decode(byte[] block) {
    if (block == null || block.length < 6) {
      throw new DamagedBlockException(
          "reading block too short: " + (block == null ? "null" : block.length + " bytes"));
    }
    CRC32C crc = new CRC32C();
    crc.update(block, 0, block.length - 4);
    int stored =
        ((block[block.length - 4] & 0xFF) << 24)
            | ((block[block.length - 3] & 0xFF) << 16)
            | ((block[block.length - 2] & 0xFF) << 8)
            | (block[block.length - 1] & 0xFF);
    if ((int) crc.getValue() != stored) {
      throw new DamagedBlockException(
          "reading block damaged: CRC-32C "
              + Integer.toHexString((int) crc.getValue())
              + " != stored "
              + Integer.toHexString(stored)
              + " ("
              + block.length
              + " bytes)");
    }
    if (block[0] != FORMAT) {
      throw new DamagedBlockException("reading block of unknown format " + block[0]);
    }
    BitReader r = new BitReader(block, 1, block.length - 4);
    long count = r.bits(32);
    if (count <= 0 || count > (long) (block.length - 5) * 8) {
      throw new DamagedBlockException("reading block count " + count + " does not fit its length");
    }
    int n = (int) count;
    long[] micros = new long[n];
    micros[0] = r.bits(64);
    long delta = 0;
    for (int i = 1; i < n; i++) {
      long code = r.signed();
      delta = i == 1 ? code : delta + code;
      micros[i] = micros[i - 1] + delta;
      if (micros[i] <= micros[i - 1]) {
        throw new DamagedBlockException("reading block times not increasing at row " + i);
      }
    }
    double[] values = readDoubles(r, n);
    boolean[] present = readFlags(r, n);
    int temperatures = 0;
    for (boolean p : present) {
      temperatures += p ? 1 : 0;
    }
    double[] temps = temperatures > 0 ? readDoubles(r, temperatures) : new double[0];
    short[] qualities = new short[n];
    for (int i = 0; i < n; ) {
      short q = (short) r.bits(16);
      long run = r.varint();
      if (run <= 0 || run > n - i) {
        throw new DamagedBlockException("reading block quality run " + run + " at row " + i);
      }
      for (long k = 0; k < run; k++) {
        qualities[i++] = q;
      }
    }
    boolean[] compensated = readFlags(r, n);
    r.expectEnd();
    List<Row> rows = new ArrayList<>(n);
    for (int i = 0, j = 0; i < n; i++) {
      rows.add(
          new Row(
              micros[i], values[i], qualities[i], present[i] ? temps[j++] : null, compensated[i]));
    }
    return rows;
  }

  /**
   * The rows of {@code base} with {@code changes} applied: a change at a time already present
   * replaces that row, others are added; the result in time order.
   */
  static List<Row> merge(List<Row> base, List<Row> changes) {
    java.util.TreeMap<Long, Row> byTime = new java.util.TreeMap<>();
    for (Row r : base) {
      byTime.put(r.micros(), r);
    }
    for (Row r : changes) {
      byTime.put(r.micros(), r);
    }
    return new ArrayList<>(byTime.values());
  }

  // ---- value columns

  private static void doubles(BitWriter w, double[] values, int n) {
    BitWriter xor = new BitWriter(n * 9 + 8);
    xorColumn(xor, values, n);
    int scale = scaleOf(values, n);
    if (scale >= 0) {
      BitWriter scaled = new BitWriter(n * 3 + 16);
      scaledColumn(scaled, values, n, scale);
      if (scaled.length() < xor.length()) {
        w.bits(MODE_SCALED, 2);
        w.append(scaled);
        return;
      }
    }
    w.bits(MODE_XOR, 2);
    w.append(xor);
  }

  /** The smallest decimal exponent at which every value round-trips bit-exactly, or -1. */
  static int scaleOf(double[] values, int n) {
    for (int e = 0; e <= MAX_SCALE; e++) {
      if (roundTrips(values, n, POW10[e])) {
        return e;
      }
    }
    return -1;
  }

  private static boolean roundTrips(double[] values, int n, double p) {
    for (int i = 0; i < n; i++) {
      double s = Math.rint(values[i] * p);
      if (!(Math.abs(s) <= EXACT_LIMIT)) {
        return false; // also NaN and infinities
      }
      if (Double.doubleToRawLongBits(((double) (long) s) / p)
          != Double.doubleToRawLongBits(values[i])) {
        return false;
      }
    }
    return true;
  }

  private static void scaledColumn(BitWriter w, double[] values, int n, int scale) {
    double p = POW10[scale];
    w.bits(scale, 4);
    long prev = (long) Math.rint(values[0] * p);
    w.bits(prev, 64);
    for (int i = 1; i < n; i++) {
      long v = (long) Math.rint(values[i] * p);
      w.signed(v - prev);
      prev = v;
    }
  }

  /** Gorilla's value encoding (Pelkonen et al. 2015, 4.1.2), with 6-bit leading-zero counts. */
  private static void xorColumn(BitWriter w, double[] values, int n) {
    long prev = Double.doubleToRawLongBits(values[0]);
    w.bits(prev, 64);
    int leading = -1;
    int trailing = 0;
    for (int i = 1; i < n; i++) {
      long bits = Double.doubleToRawLongBits(values[i]);
      long x = bits ^ prev;
      prev = bits;
      if (x == 0) {
        w.bits(0, 1);
        continue;
      }
      w.bits(1, 1);
      int lz = Long.numberOfLeadingZeros(x);
      int tz = Long.numberOfTrailingZeros(x);
      if (leading >= 0 && lz >= leading && tz >= trailing) {
        w.bits(0, 1); // inside the previous window
        w.bits(x >>> trailing, 64 - leading - trailing);
      } else {
        leading = lz;
        trailing = tz;
        int length = 64 - lz - tz;
        w.bits(1, 1);
        w.bits(lz, 6);
        w.bits(length - 1, 6);
        w.bits(x >>> tz, length);
      }
    }
  }

  private static double[] readDoubles(BitReader r, int n) {
    int mode = (int) r.bits(2);
    double[] out = new double[n];
    if (mode == MODE_SCALED) {
      int scale = (int) r.bits(4);
      if (scale > MAX_SCALE) {
        throw new DamagedBlockException("reading block scale 10^" + scale + " out of range");
      }
      double p = POW10[scale];
      long v = r.bits(64);
      out[0] = ((double) v) / p;
      for (int i = 1; i < n; i++) {
        v += r.signed();
        out[i] = ((double) v) / p;
      }
    } else if (mode == MODE_XOR) {
      long prev = r.bits(64);
      out[0] = Double.longBitsToDouble(prev);
      int leading = -1;
      int trailing = 0;
      for (int i = 1; i < n; i++) {
        if (r.bits(1) != 0) {
          if (r.bits(1) != 0) {
            leading = (int) r.bits(6);
            int length = (int) r.bits(6) + 1;
            trailing = 64 - leading - length;
            if (trailing < 0) {
              throw new DamagedBlockException("reading block XOR window out of range");
            }
          } else if (leading < 0) {
            throw new DamagedBlockException("reading block XOR window used before it was set");
          }
          prev ^= r.bits(64 - leading - trailing) << trailing;
        }
        out[i] = Double.longBitsToDouble(prev);
      }
    } else {
      throw new DamagedBlockException("reading block value mode " + mode);
    }
    return out;
  }

  // ---- flags as runs: the first flag, then run lengths alternating

  private static void flags(BitWriter w, boolean[] flags) {
    w.bits(flags[0] ? 1 : 0, 1);
    int i = 0;
    while (i < flags.length) {
      int j = i + 1;
      while (j < flags.length && flags[j] == flags[i]) {
        j++;
      }
      w.varint(j - i);
      i = j;
    }
  }

  private static boolean[] readFlags(BitReader r, int n) {
    boolean[] out = new boolean[n];
    boolean f = r.bits(1) != 0;
    for (int i = 0; i < n; ) {
      long run = r.varint();
      if (run <= 0 || run > n - i) {
        throw new DamagedBlockException("reading block flag run " + run + " at row " + i);
      }
      for (long k = 0; k < run; k++) {
        out[i++] = f;
      }
      f = !f;
    }
    return out;
  }

  // ---- bits

  /** Appends bits most significant first. */
  private static final class BitWriter {
    private long[] words;
    private int length; // in bits

    BitWriter(int expectedBytes) {
      words = new long[Math.max(2, expectedBytes / 8 + 1)];
    }

    int length() {
      return length;
    }

    /** The low {@code count} bits of {@code value}, 0 ≤ count ≤ 64. */
    void bits(long value, int count) {
      if (count == 0) {
        return;
      }
      if (count < 64) {
        value &= (1L << count) - 1;
      }
      if ((length + count + 63) / 64 >= words.length) {
        words = java.util.Arrays.copyOf(words, words.length * 2 + 2);
      }
      int word = length >>> 6;
      int used = length & 63;
      int free = 64 - used;
      if (count <= free) {
        words[word] |= value << (free - count);
      } else {
        words[word] |= value >>> (count - free);
        words[word + 1] |= value << (64 - (count - free));
      }
      length += count;
    }

    /** A signed integer as a prefix code (see the class comment). */
    void signed(long v) {
      if (v == 0) {
        bits(0, 1);
      } else if (v >= -(1L << 6) && v < (1L << 6)) {
        bits(0b10, 2);
        bits(v, 7);
      } else if (v >= -(1L << 11) && v < (1L << 11)) {
        bits(0b110, 3);
        bits(v, 12);
      } else if (v >= -(1L << 20) && v < (1L << 20)) {
        bits(0b1110, 4);
        bits(v, 21);
      } else if (v >= Integer.MIN_VALUE && v <= Integer.MAX_VALUE) {
        bits(0b11110, 5);
        bits(v, 32);
      } else {
        bits(0b11111, 5);
        bits(v, 64);
      }
    }

    /** A positive integer in groups of 7 bits, each after a continuation bit. */
    void varint(long v) {
      while ((v & ~0x7FL) != 0) {
        bits(0x80 | (v & 0x7F), 8);
        v >>>= 7;
      }
      bits(v, 8);
    }

    void append(BitWriter other) {
      int full = other.length >>> 6;
      for (int i = 0; i < full; i++) {
        bits(other.words[i], 64);
      }
      int rest = other.length & 63;
      if (rest > 0) {
        bits(other.words[full] >>> (64 - rest), rest);
      }
    }

    /** The format byte, the bits padded to a byte, and the CRC-32C. */
    byte[] finish() {
      int bytes = (length + 7) / 8;
      byte[] out = new byte[1 + bytes + 4];
      out[0] = FORMAT;
      for (int i = 0; i < bytes; i++) {
        out[1 + i] = (byte) (words[i >>> 3] >>> (56 - 8 * (i & 7)));
      }
      CRC32C crc = new CRC32C();
      crc.update(out, 0, 1 + bytes);
      int c = (int) crc.getValue();
      out[1 + bytes] = (byte) (c >>> 24);
      out[2 + bytes] = (byte) (c >>> 16);
      out[3 + bytes] = (byte) (c >>> 8);
      out[4 + bytes] = (byte) c;
      return out;
    }
  }

  /** Reads bits most significant first from {@code data[from, to)}. */
  private static final class BitReader {
    private final byte[] data;
    private final int from;
    private final long end; // in bits, relative to from
    private long position;

    BitReader(byte[] data, int from, int to) {
      this.data = data;
      this.from = from;
      this.end = (long) (to - from) * 8;
    }

    long bits(int count) {
      if (position + count > end) {
        throw new DamagedBlockException(
            "reading block truncated: " + count + " bits wanted at bit " + position + " of " + end);
      }
      long v = 0;
      for (int k = 0; k < count; ) {
        int b = data[from + (int) (position >>> 3)] & 0xFF;
        int offset = (int) (position & 7);
        int take = Math.min(8 - offset, count - k);
        int chunk = (b >>> (8 - offset - take)) & ((1 << take) - 1);
        v = (v << take) | chunk;
        k += take;
        position += take;
      }
      return v;
    }

    long signed() {
      if (bits(1) == 0) {
        return 0;
      }
      if (bits(1) == 0) {
        return extend(bits(7), 7);
      }
      if (bits(1) == 0) {
        return extend(bits(12), 12);
      }
      if (bits(1) == 0) {
        return extend(bits(21), 21);
      }
      if (bits(1) == 0) {
        return (int) bits(32);
      }
      return bits(64);
    }

    /** The low {@code n} bits as a two's complement number. */
    private static long extend(long v, int n) {
      return (v << (64 - n)) >> (64 - n);
    }

    long varint() {
      long v = 0;
      for (int shift = 0; shift < 64; shift += 7) {
        long b = bits(8);
        v |= (b & 0x7F) << shift;
        if ((b & 0x80) == 0) {
          return v;
        }
      }
      throw new DamagedBlockException("reading block varint too long");
    }

    /** Only zero padding may follow the last field. */
    void expectEnd() {
      if (end - position >= 8 || (position < end && bits((int) (end - position)) != 0)) {
        throw new DamagedBlockException(
            "reading block has " + (end - position) + " bits after its last field");
      }
    }
  }
}
