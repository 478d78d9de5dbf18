package org.kwanta.model.conductivity;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;

/** Reads a numeric test-resource CSV whose header lines start with '#'. */
final class CsvRows {

  private CsvRows() {}

  static List<double[]> read(String resource) {
    InputStream in = CsvRows.class.getResourceAsStream(resource);
    if (in == null) {
      throw new IllegalStateException("missing test resource " + resource);
    }
    List<double[]> rows = new ArrayList<>();
    try (BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
      String line;
      while ((line = r.readLine()) != null) {
        line = line.strip();
        if (line.isEmpty() || line.startsWith("#")) {
          continue;
        }
        String[] parts = line.split(",");
        double[] row = new double[parts.length];
        for (int i = 0; i < parts.length; i++) {
          row[i] = Double.parseDouble(parts[i].strip());
        }
        rows.add(row);
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return rows;
  }
}
