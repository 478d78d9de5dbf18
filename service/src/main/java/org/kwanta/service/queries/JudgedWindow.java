package org.kwanta.service.queries;

import java.time.Instant;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.kwanta.model.limits.Sample;
import org.kwanta.service.limits.ExcursionFinder;

/**
 * The judged readings of one series (sample point × parameter) over the level window, in compact
 * primitive arrays, oldest first: time (microseconds since the epoch), value, the doubt flags and,
 * for pH only, the calculated pH at 25 °C the drum water fallback classifies. About 17 bytes a
 * reading (25 for pH). Not thread-safe; its owner locks.
 */
final class JudgedWindow {

  private static final byte IN_DOUBT = 1;
  private static final byte PH_ELECTRODE_IN_DOUBT = 2;

  private final boolean keepsCalculatedPh;
  private long[] micros = new long[16];
  private double[] values = new double[16];
  private byte[] flags = new byte[16];
  private double[] calculated;
  private int size;

  /** Changes with every change of the contents, so a result computed on them can be reused. */
  private long version;

  JudgedWindow(boolean keepsCalculatedPh) {
    this.keepsCalculatedPh = keepsCalculatedPh;
    this.calculated = keepsCalculatedPh ? new double[16] : null;
  }

  int size() {
    return size;
  }

  long version() {
    return version;
  }

  /** The time of the first reading (microseconds), or Long.MIN_VALUE when empty. */
  long firstMicros() {
    return size == 0 ? Long.MIN_VALUE : micros[0];
  }

  /** Appends a reading later than every one held. */
  void append(
      long epochMicros,
      double value,
      boolean inDoubt,
      double calculatedPh25,
      boolean phElectrodeInDoubt) {
    if (size > 0 && epochMicros <= micros[size - 1]) {
      throw new IllegalStateException("readings must come in increasing time order");
    }
    if (size == micros.length) {
      int n = size * 2;
      micros = Arrays.copyOf(micros, n);
      values = Arrays.copyOf(values, n);
      flags = Arrays.copyOf(flags, n);
      if (keepsCalculatedPh) {
        calculated = Arrays.copyOf(calculated, n);
      }
    }
    micros[size] = epochMicros;
    values[size] = value;
    flags[size] =
        (byte) ((inDoubt ? IN_DOUBT : 0) | (phElectrodeInDoubt ? PH_ELECTRODE_IN_DOUBT : 0));
    if (keepsCalculatedPh) {
      calculated[size] = calculatedPh25;
    }
    size++;
    version++;
  }

  /** Drops the readings at or after a time (they are read again). */
  void truncateFrom(long epochMicros) {
    int i = indexOf(epochMicros);
    if (i < size) {
      size = i;
      version++;
    }
  }

  /** Drops the readings before a time (they left the window). */
  void dropBefore(long epochMicros) {
    int i = indexOf(epochMicros);
    if (i == 0) {
      return;
    }
    int n = size - i;
    System.arraycopy(micros, i, micros, 0, n);
    System.arraycopy(values, i, values, 0, n);
    System.arraycopy(flags, i, flags, 0, n);
    if (keepsCalculatedPh) {
      System.arraycopy(calculated, i, calculated, 0, n);
    }
    size = n;
    version++;
    if (micros.length > 64 && size < micros.length / 4) {
      int c = Math.max(16, size * 2);
      micros = Arrays.copyOf(micros, c);
      values = Arrays.copyOf(values, c);
      flags = Arrays.copyOf(flags, c);
      if (keepsCalculatedPh) {
        calculated = Arrays.copyOf(calculated, c);
      }
    }
  }

  /** The first index whose time is at or after the given one. */
  private int indexOf(long epochMicros) {
    int i = Arrays.binarySearch(micros, 0, size, epochMicros);
    return i >= 0 ? i : -i - 1;
  }

  /** The samples as the classifier takes them ({@link ExcursionFinder#sample}). */
  List<Sample> samples(boolean phFallback) {
    List<Sample> out = new ArrayList<>(size);
    for (int i = 0; i < size; i++) {
      out.add(
          ExcursionFinder.sample(
              phFallback,
              instant(micros[i]),
              values[i],
              (flags[i] & IN_DOUBT) != 0,
              keepsCalculatedPh ? calculated[i] : Double.NaN,
              (flags[i] & PH_ELECTRODE_IN_DOUBT) != 0));
    }
    return out;
  }

  static Instant instant(long epochMicros) {
    return Instant.ofEpochSecond(
        Math.floorDiv(epochMicros, 1_000_000L), Math.floorMod(epochMicros, 1_000_000L) * 1000L);
  }

  static long micros(Instant t) {
    return Math.addExact(Math.multiplyExact(t.getEpochSecond(), 1_000_000L), t.getNano() / 1000);
  }
}
