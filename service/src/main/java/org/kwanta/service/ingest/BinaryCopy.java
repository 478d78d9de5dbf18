package org.kwanta.service.ingest;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.DataOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.sql.Connection;
import java.sql.SQLException;
import java.time.Instant;
import java.util.List;
import org.postgresql.PGConnection;

/**
 * Rows for PostgreSQL's {@code COPY ... FROM STDIN (FORMAT binary)}: the server reads values as
 * they are, without parsing text (see the PostgreSQL manual, COPY, "Binary Format"). Written for
 * the column types the ingest uses: text, timestamptz, float8, int4, int2, bool and text[].
 */
public final class BinaryCopy {

  private static final byte[] SIGNATURE = {
    'P', 'G', 'C', 'O', 'P', 'Y', '\n', (byte) 0xff, '\r', '\n', 0
  };

  /** Microseconds from 1970-01-01 to PostgreSQL's epoch 2000-01-01 (UTC). */
  private static final long POSTGRES_EPOCH_MICROS = 946_684_800_000_000L;

  private static final int TEXT_OID = 25;

  /** A byte buffer whose content can be read without copying it. */
  private static final class Buffer extends ByteArrayOutputStream {
    Buffer(int size) {
      super(size);
    }

    ByteArrayInputStream reader() {
      return new ByteArrayInputStream(buf, 0, count);
    }
  }

  private final Buffer bytes;
  private final DataOutputStream out;
  private int rows;

  private final boolean fragment;

  public BinaryCopy(int expectedRows, int bytesPerRow) {
    this(expectedRows, bytesPerRow, false);
  }

  private BinaryCopy(int expectedRows, int bytesPerRow, boolean fragment) {
    this.fragment = fragment;
    bytes = new Buffer(19 + expectedRows * bytesPerRow);
    out = new DataOutputStream(bytes);
    if (!fragment) {
      try {
        out.write(SIGNATURE);
        out.writeInt(0); // flags
        out.writeInt(0); // header extension length
      } catch (IOException e) {
        throw new UncheckedIOException(e);
      }
    }
  }

  /** Rows without the header, to be {@linkplain #append appended} to a whole COPY later. */
  public static BinaryCopy fragment(int expectedRows, int bytesPerRow) {
    return new BinaryCopy(expectedRows, bytesPerRow, true);
  }

  /** Appends the rows of a fragment. */
  public BinaryCopy append(BinaryCopy rowsOnly) {
    if (!rowsOnly.fragment) {
      throw new IllegalArgumentException("only a fragment can be appended");
    }
    try {
      rowsOnly.out.flush();
      rowsOnly.bytes.writeTo(out);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    rows += rowsOnly.rows;
    return this;
  }

  /** Starts a row of the given number of columns. */
  public BinaryCopy row(int columns) {
    rows++;
    try {
      out.writeShort(columns);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return this;
  }

  public BinaryCopy text(String s) {
    try {
      if (s == null) {
        out.writeInt(-1);
      } else {
        byte[] b = s.getBytes(StandardCharsets.UTF_8);
        out.writeInt(b.length);
        out.write(b);
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return this;
  }

  /** A text value given as UTF-8 bytes. */
  public BinaryCopy text(byte[] utf8) {
    try {
      out.writeInt(utf8.length);
      out.write(utf8);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return this;
  }

  /** A bytea value (null for SQL NULL). */
  public BinaryCopy bytea(byte[] bytes) {
    try {
      if (bytes == null) {
        out.writeInt(-1);
      } else {
        out.writeInt(bytes.length);
        out.write(bytes);
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return this;
  }

  /** A timestamptz, to the microsecond (finer parts are cut off). */
  public BinaryCopy timestamp(Instant t) {
    try {
      out.writeInt(8);
      long micros =
          Math.addExact(Math.multiplyExact(t.getEpochSecond(), 1_000_000L), t.getNano() / 1000);
      out.writeLong(micros - POSTGRES_EPOCH_MICROS);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return this;
  }

  /** A float8; NaN is written as SQL NULL. */
  public BinaryCopy float8(double v) {
    try {
      if (Double.isNaN(v)) {
        out.writeInt(-1);
      } else {
        out.writeInt(8);
        out.writeDouble(v);
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return this;
  }

  /** A float8 that may be SQL NULL. */
  public BinaryCopy float8(Double v) {
    return float8(v == null ? Double.NaN : v.doubleValue());
  }

  public BinaryCopy int4(int v) {
    try {
      out.writeInt(4);
      out.writeInt(v);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return this;
  }

  public BinaryCopy int2(short v) {
    try {
      out.writeInt(2);
      out.writeShort(v);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return this;
  }

  public BinaryCopy bool(boolean v) {
    try {
      out.writeInt(1);
      out.writeByte(v ? 1 : 0);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return this;
  }

  /** A one-dimensional text[] without NULL elements (empty: a zero-dimensional array). */
  public BinaryCopy textArray(List<String> values) {
    try {
      byte[][] encoded = new byte[values.size()][];
      int length = 12 + (values.isEmpty() ? 0 : 8);
      for (int i = 0; i < encoded.length; i++) {
        encoded[i] = values.get(i).getBytes(StandardCharsets.UTF_8);
        length += 4 + encoded[i].length;
      }
      out.writeInt(length);
      out.writeInt(values.isEmpty() ? 0 : 1); // dimensions
      out.writeInt(0); // no NULL elements
      out.writeInt(TEXT_OID);
      if (!values.isEmpty()) {
        out.writeInt(values.size());
        out.writeInt(1); // lower bound
        for (byte[] b : encoded) {
          out.writeInt(b.length);
          out.write(b);
        }
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return this;
  }

  /** Bytes written so far. */
  public int size() {
    return bytes.size();
  }

  public int rows() {
    return rows;
  }

  /**
   * Sends the rows with {@code COPY <target> FROM STDIN (FORMAT binary)} on the given connection
   * (in its transaction) and returns the number of rows the server took.
   */
  public long send(Connection connection, String target) throws SQLException {
    if (fragment) {
      throw new IllegalStateException("a fragment cannot be sent alone");
    }
    try {
      out.writeShort(-1); // trailer
      out.flush();
      return connection
          .unwrap(PGConnection.class)
          .getCopyAPI()
          .copyIn("COPY " + target + " FROM STDIN (FORMAT binary)", bytes.reader());
    } catch (IOException e) {
      throw new SQLException("COPY to " + target + " failed", e);
    }
  }
}
