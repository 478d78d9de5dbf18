package org.kwanta.service.ingest;

import java.nio.ByteBuffer;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/** Shapes of format-3 packs in memory, numbered from 1 in the order they come (for tests). */
final class MapShapes implements EvaluationPack.Shapes {

  private final Map<ByteBuffer, Integer> numbers = new HashMap<>();
  private final List<byte[]> shapes = new ArrayList<>();
  private final int limit;

  MapShapes() {
    this(Integer.MAX_VALUE);
  }

  /** Takes at most {@code limit} shapes. */
  MapShapes(int limit) {
    this.limit = limit;
  }

  @Override
  public synchronized int number(byte[] shape) {
    Integer n = numbers.get(ByteBuffer.wrap(shape));
    if (n != null) {
      return n;
    }
    if (shapes.size() >= limit) {
      return -1;
    }
    shapes.add(shape.clone());
    numbers.put(ByteBuffer.wrap(shape.clone()), shapes.size());
    return shapes.size();
  }

  @Override
  public synchronized byte[] shape(int number) {
    if (number < 1 || number > shapes.size()) {
      throw new IllegalStateException("no evaluation shape " + number);
    }
    return shapes.get(number - 1).clone();
  }

  synchronized int size() {
    return shapes.size();
  }
}
