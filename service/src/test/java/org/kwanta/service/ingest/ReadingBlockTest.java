package org.kwanta.service.ingest;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.kwanta.service.ingest.ReadingBlock.DamagedBlockException;
import org.kwanta.service.ingest.ReadingBlock.Row;

/**
 * Round trips of {@link ReadingBlock}: bit-exact for every kind of series, and loud on damage. The
 * series are made up here (seeded); the sizes asserted are this encoding's, measured, not a
 * published figure.
 */
class ReadingBlockTest {

  /** 2026-12-01T00:00:00Z in microseconds. */
  private static final long DAY = 1_796_083_200_000_000L;

  private static final long TEN_SECONDS = 10_000_000L;

  @Test
  void regularConductivityWithThreeDecimalsTakesUnderTwoBytesPerReading() {
    SplittableRandom random = new SplittableRandom(1);
    List<Row> rows = new ArrayList<>();
    double level = 0.055;
    for (int i = 0; i < 360; i++) {
      level += (random.nextDouble() - 0.5) * 0.002;
      level = Math.max(0.040, Math.min(0.090, level));
      // an analyser that reports 3 decimals in µS/cm, sent as text and parsed: 0.057, 0.058, ...
      double value = Double.parseDouble(String.format("%.3f", level));
      rows.add(new Row(DAY + i * TEN_SECONDS, value, (short) 0, 25.0, true));
    }
    byte[] block = roundTrip(rows);
    assertTrue(block.length < 2 * rows.size(), block.length + " bytes");
  }

  @Test
  void randomDoublesRoundTripAtAboutEightBytesEach() {
    SplittableRandom random = new SplittableRandom(2);
    List<Row> rows = new ArrayList<>();
    for (int i = 0; i < 360; i++) {
      rows.add(new Row(DAY + i * TEN_SECONDS, random.nextDouble() * 10, (short) 0, null, true));
    }
    byte[] block = roundTrip(rows);
    assertTrue(block.length < 9 * rows.size(), block.length + " bytes");
  }

  @ParameterizedTest
  @ValueSource(longs = {3, 4, 5, 6, 7, 8, 9, 10})
  void randomSeriesRoundTripBitExactly(long seed) {
    SplittableRandom random = new SplittableRandom(seed);
    int n = 1 + random.nextInt(800);
    List<Row> rows = new ArrayList<>();
    long t = DAY + random.nextLong(1L << 40) - (1L << 39);
    int kind = random.nextInt(4);
    int decimals = random.nextInt(10);
    for (int i = 0; i < n; i++) {
      double value =
          switch (kind) {
            case 0 -> Double.longBitsToDouble(random.nextLong()); // any bits, NaN payloads too
            case 1 -> Math.round(random.nextGaussian() * 1e6) / Math.pow(10, decimals);
            case 2 -> random.nextDouble(-1e300, 1e300);
            default -> 7.0;
          };
      Double temperature =
          random.nextInt(5) == 0 ? null : Math.round(random.nextDouble(5, 60) * 10) / 10.0;
      short quality = (short) (random.nextInt(10) == 0 ? random.nextInt(3) : 0);
      rows.add(new Row(t, value, quality, temperature, random.nextInt(7) != 0));
      // irregular: jitter, gaps from a microsecond to days
      t +=
          switch (random.nextInt(4)) {
            case 0 -> 1;
            case 1 -> TEN_SECONDS + random.nextLong(-5_000, 5_000);
            case 2 -> random.nextLong(1, 86_400_000_000L * 3);
            default -> TEN_SECONDS;
          };
    }
    roundTrip(rows);
  }

  @Test
  void edgeValuesRoundTripBitExactly() {
    double[] edges = {
      -0.0,
      0.0,
      Double.MIN_VALUE,
      -Double.MIN_VALUE,
      Double.MIN_NORMAL,
      Math.nextDown(Double.MIN_NORMAL),
      Double.MAX_VALUE,
      -Double.MAX_VALUE,
      Double.POSITIVE_INFINITY,
      Double.NEGATIVE_INFINITY,
      Double.NaN,
      Double.longBitsToDouble(0x7ff0000000000001L), // signalling NaN payload
      Double.longBitsToDouble(0xfff8000000000123L),
      1e-300,
      9007199254740993.0,
      0.1,
      1.0 / 3
    };
    List<Row> rows = new ArrayList<>();
    for (int i = 0; i < edges.length; i++) {
      rows.add(new Row(Long.MIN_VALUE / 2 + i, edges[i], Short.MIN_VALUE, edges[i], i % 2 == 0));
    }
    roundTrip(rows);
    // each alone, and negative zero among scalable values (which would lose its sign if scaled)
    for (double e : edges) {
      roundTrip(List.of(new Row(0, e, (short) 1, null, false)));
    }
    roundTrip(
        List.of(
            new Row(0, 0.25, (short) 0, 1.5, true),
            new Row(1, -0.0, (short) 0, -0.0, true),
            new Row(2, 0.5, (short) 0, 0.0, true)));
  }

  @Test
  void timesAtTheEndsOfTheRangeRoundTrip() {
    roundTrip(
        List.of(
            new Row(Long.MIN_VALUE, 1, (short) 0, null, true),
            new Row(0, 2, (short) 0, null, true),
            new Row(Long.MAX_VALUE, 3, (short) 0, null, true)));
  }

  @Test
  void scalesAreChosenByExactRoundTrip() {
    assertEquals(3, ReadingBlock.scaleOf(new double[] {0.034, 0.035, 0.1}, 3));
    assertEquals(0, ReadingBlock.scaleOf(new double[] {12, -7, 0}, 3));
    assertEquals(-1, ReadingBlock.scaleOf(new double[] {1.0 / 3}, 1));
    assertEquals(-1, ReadingBlock.scaleOf(new double[] {-0.0}, 1));
    assertEquals(-1, ReadingBlock.scaleOf(new double[] {1e17 + 0.5, 1}, 2));
  }

  @Test
  void everyDamagedByteFailsLoudly() {
    List<Row> rows = new ArrayList<>();
    for (int i = 0; i < 50; i++) {
      rows.add(new Row(DAY + i * TEN_SECONDS, i * 0.001, (short) (i / 20), 25.0 + i, true));
    }
    byte[] block = ReadingBlock.encode(rows);
    for (int i = 0; i < block.length; i++) {
      for (int bit = 0; bit < 8; bit++) {
        byte[] damaged = block.clone();
        damaged[i] ^= (byte) (1 << bit);
        assertThrows(DamagedBlockException.class, () -> ReadingBlock.decode(damaged));
      }
    }
    for (int len = 0; len < block.length; len++) {
      byte[] truncated = java.util.Arrays.copyOf(block, len);
      assertThrows(DamagedBlockException.class, () -> ReadingBlock.decode(truncated));
    }
    assertThrows(DamagedBlockException.class, () -> ReadingBlock.decode(null));
  }

  @Test
  void refusesRowsOutOfOrderAndEmptyBlocks() {
    assertThrows(IllegalArgumentException.class, () -> ReadingBlock.encode(List.of()));
    assertThrows(
        IllegalArgumentException.class,
        () ->
            ReadingBlock.encode(
                List.of(
                    new Row(2, 1, (short) 0, null, true), new Row(2, 1, (short) 0, null, true))));
  }

  @Test
  void mergeReplacesRowsAtTheSameTimeAndKeepsOrder() {
    List<Row> base =
        List.of(new Row(10, 1, (short) 0, null, true), new Row(30, 3, (short) 0, null, true));
    List<Row> merged =
        ReadingBlock.merge(
            base,
            List.of(new Row(20, 2, (short) 0, null, true), new Row(30, 4, (short) 1, 5.0, false)));
    assertEquals(
        List.of(
            new Row(10, 1, (short) 0, null, true),
            new Row(20, 2, (short) 0, null, true),
            new Row(30, 4, (short) 1, 5.0, false)),
        merged);
  }

  /** Encodes, decodes and compares raw bits; returns the block. */
  private static byte[] roundTrip(List<Row> rows) {
    byte[] block = ReadingBlock.encode(rows);
    List<Row> back = ReadingBlock.decode(block);
    assertEquals(rows.size(), back.size());
    long[] expected = new long[rows.size() * 5];
    long[] actual = new long[rows.size() * 5];
    for (int i = 0; i < rows.size(); i++) {
      fill(expected, i, rows.get(i));
      fill(actual, i, back.get(i));
    }
    assertArrayEquals(expected, actual);
    return block;
  }

  private static void fill(long[] out, int i, Row r) {
    out[5 * i] = r.micros();
    out[5 * i + 1] = Double.doubleToRawLongBits(r.value());
    out[5 * i + 2] = r.quality();
    out[5 * i + 3] =
        r.temperature() == null ? 0x5555_5555_5555L : Double.doubleToRawLongBits(r.temperature());
    out[5 * i + 4] = r.compensated() ? 1 : 0;
  }
}
