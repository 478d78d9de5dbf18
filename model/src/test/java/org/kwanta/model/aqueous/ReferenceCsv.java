package org.kwanta.model.aqueous;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;

/** Reads a test-resource CSV: '#' lines are comments, the first other line is the header. */
final class ReferenceCsv {

  private ReferenceCsv() {}

  static List<String[]> rows(String resource) {
    var in = ReferenceCsv.class.getResourceAsStream(resource);
    if (in == null) {
      throw new IllegalStateException("missing test resource " + resource);
    }
    List<String[]> rows = new ArrayList<>();
    try (BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
      boolean header = true;
      for (String line = r.readLine(); line != null; line = r.readLine()) {
        if (line.isBlank() || line.startsWith("#")) {
          continue;
        }
        if (header) {
          header = false;
          continue;
        }
        rows.add(split(line));
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return rows;
  }

  private static String[] split(String line) {
    List<String> cells = new ArrayList<>();
    StringBuilder cell = new StringBuilder();
    boolean quoted = false;
    for (char ch : line.toCharArray()) {
      if (ch == '"') {
        quoted = !quoted;
      } else if (ch == ',' && !quoted) {
        cells.add(cell.toString());
        cell.setLength(0);
      } else {
        cell.append(ch);
      }
    }
    cells.add(cell.toString());
    return cells.toArray(String[]::new);
  }
}
