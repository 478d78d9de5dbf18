package org.kwanta.service.ingest;

import java.nio.ByteBuffer;
import java.sql.Connection;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.util.List;
import java.util.concurrent.ConcurrentHashMap;
import javax.sql.DataSource;
import org.kwanta.service.system.ReadSource;
import org.springframework.dao.DataAccessResourceFailureException;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.stereotype.Component;

/**
 * The shapes of format-3 evaluation packs ({@link EvaluationPack}), in the table {@code
 * evaluation_shape} and in memory. A new shape is registered on a connection of its own and
 * committed before its number is returned, so no row can refer to a shape that a rolled-back
 * transaction took with it, and a reader (on the primary or a replica) that sees the row sees its
 * shape. Instances sharing a database share the numbers (the table's unique shape decides).
 *
 * <p>At most {@value #LIMIT} shapes are taken by an instance; beyond, packs are written in format 2
 * (whole, about 75 bytes more): a guard against a source of ever new shapes, which the evaluation
 * does not have (an ingest load run: 8 shapes for 145,920 rows; the demo's 26 hours: see {@code
 * EvaluationPackTest}).
 */
@Component
public class EvaluationShapes implements EvaluationPack.Shapes {

  /** How many shapes an instance takes before it writes packs whole. */
  static final int LIMIT = 100_000;

  private final DataSource primary;
  private final JdbcTemplate reads;
  private final ConcurrentHashMap<ByteBuffer, Integer> numbers = new ConcurrentHashMap<>();
  private final ConcurrentHashMap<Integer, byte[]> shapes = new ConcurrentHashMap<>();

  EvaluationShapes(DataSource primary, ReadSource reads) {
    this.primary = primary;
    this.reads = reads.jdbc();
  }

  @Override
  public int number(byte[] shape) {
    Integer n = numbers.get(ByteBuffer.wrap(shape));
    if (n != null) {
      return n;
    }
    synchronized (this) {
      n = numbers.get(ByteBuffer.wrap(shape));
      if (n != null) {
        return n;
      }
      if (numbers.size() >= LIMIT) {
        return -1;
      }
      int registered = register(shape);
      remember(registered, shape.clone());
      return registered;
    }
  }

  @Override
  public byte[] shape(int number) {
    byte[] s = shapes.get(number);
    if (s != null) {
      return s;
    }
    List<byte[]> found =
        reads.query(
            "SELECT shape FROM evaluation_shape WHERE shape_id = ?",
            (rs, i) -> rs.getBytes(1),
            number);
    if (found.isEmpty()) {
      throw new IllegalStateException("evaluation shape " + number + " is not stored");
    }
    remember(number, found.get(0));
    return found.get(0);
  }

  private void remember(int number, byte[] shape) {
    shapes.putIfAbsent(number, shape);
    if (numbers.size() < LIMIT) {
      numbers.putIfAbsent(ByteBuffer.wrap(shape), number);
    }
  }

  /** Inserts the shape (or finds the number another instance gave it), committed at once. */
  private int register(byte[] shape) {
    try (Connection c = primary.getConnection()) {
      boolean autoCommit = c.getAutoCommit();
      c.setAutoCommit(true);
      try {
        Integer n =
            first(
                c,
                "INSERT INTO evaluation_shape (shape) VALUES (?) ON CONFLICT (shape) DO NOTHING"
                    + " RETURNING shape_id",
                shape);
        if (n == null) {
          n = first(c, "SELECT shape_id FROM evaluation_shape WHERE shape = ?", shape);
        }
        if (n == null) {
          throw new IllegalStateException("evaluation shape neither inserted nor found");
        }
        return n;
      } finally {
        c.setAutoCommit(autoCommit);
      }
    } catch (SQLException e) {
      throw new DataAccessResourceFailureException("registering an evaluation shape", e);
    }
  }

  private static Integer first(Connection c, String sql, byte[] shape) throws SQLException {
    try (PreparedStatement ps = c.prepareStatement(sql)) {
      ps.setBytes(1, shape);
      try (ResultSet rs = ps.executeQuery()) {
        return rs.next() ? rs.getInt(1) : null;
      }
    }
  }
}
