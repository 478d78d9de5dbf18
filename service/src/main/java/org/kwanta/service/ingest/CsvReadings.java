package org.kwanta.service.ingest;

import java.io.IOException;
import java.io.PushbackReader;
import java.io.Reader;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.kwanta.service.system.ProblemException;

/**
 * Reads a CSV batch (RFC 4180 with a header row). Columns: {@code sample_point, parameter, time,
 * value, unit} and optionally {@code quality, sample_temperature_cel, compensated} and, for grab
 * and lab results, {@code source, sample_id, lab_method, censored, density_temperature_cel}, in any
 * order; a value written {@code <2} is censored below 2. A UTF-8 byte-order mark before the header
 * is skipped; blank lines are ignored. Numbers are plain decimals ({@code 9.6}, {@code -1.5e-3}):
 * Java's hexadecimal and type-suffixed forms ({@code 0x1p3}, {@code 9.6d}) are refused. Every
 * rejection carries the file line where its row starts.
 */
final class CsvReadings {

  static final Set<String> REQUIRED = Set.of("sample_point", "parameter", "time", "value", "unit");
  static final Set<String> OPTIONAL =
      Set.of(
          "quality",
          "sample_temperature_cel",
          "compensated",
          "source",
          "sample_id",
          "lab_method",
          "censored",
          "density_temperature_cel");

  private CsvReadings() {}

  /**
   * The rows read.
   *
   * @param lines the file line (from 1; the header is line 1) where each data row starts, by index
   */
  record Parsed(List<ReadingInput> readings, List<RejectedReading> rejected, int[] lines) {}

  static Parsed parse(Reader body, int maxRows) {
    // empty lines are kept as records (and skipped below) so that line numbers can be counted
    CSVFormat format =
        CSVFormat.RFC4180
            .builder()
            .setHeader()
            .setSkipHeaderRecord(true)
            .setIgnoreEmptyLines(false)
            .setTrim(true)
            .get();
    List<ReadingInput> readings = new ArrayList<>();
    List<RejectedReading> rejected = new ArrayList<>();
    int[] lines = new int[16];
    try (CSVParser parser = CSVParser.parse(withoutByteOrderMark(body), format)) {
      Map<String, Integer> header = parser.getHeaderMap();
      List<String> missing =
          REQUIRED.stream().filter(c -> !header.containsKey(c)).sorted().toList();
      List<String> unknown =
          header.keySet().stream()
              .filter(c -> !REQUIRED.contains(c) && !OPTIONAL.contains(c))
              .sorted()
              .toList();
      if (!missing.isEmpty() || !unknown.isEmpty()) {
        throw ProblemException.of(
            "CSV header (line 1): "
                + (missing.isEmpty() ? "" : "missing columns " + missing + " ")
                + (unknown.isEmpty() ? "" : "unknown columns " + unknown + " ")
                + "(required "
                + REQUIRED.stream().sorted().toList()
                + ", optional "
                + OPTIONAL.stream().sorted().toList()
                + ")");
      }
      int index = 0;
      // a record starts on the line after the previous record's end (line ends consumed so far)
      long start = parser.getCurrentLineNumber() + 1;
      for (CSVRecord record : parser) {
        int line = (int) Math.min(Integer.MAX_VALUE, start);
        start = parser.getCurrentLineNumber() + 1;
        if (record.size() == 1 && record.get(0).isEmpty()) {
          continue; // a blank line
        }
        if (index >= maxRows) {
          throw new BatchTooLargeException(index + 1, maxRows);
        }
        if (index == lines.length) {
          lines = java.util.Arrays.copyOf(lines, lines.length * 2);
        }
        lines[index] = line;
        if (!record.isConsistent()) {
          rejected.add(
              new RejectedReading(
                  index,
                  null,
                  "row has " + record.size() + " fields, header has " + header.size(),
                  line));
          readings.add(null);
          index++;
          continue;
        }
        // a lab's "<2" is a result below the detection limit 2 (censored), never the number 2
        String censored = text(record, "censored");
        String valueText = text(record, "value");
        boolean below = valueText != null && valueText.startsWith("<");
        if (below) {
          censored = censored == null ? "below" : censored;
        }
        Double value =
            number(
                record,
                "value",
                below ? valueText.substring(1).trim() : valueText,
                index,
                rejected);
        Double temperature = number(record, "sample_temperature_cel", index, rejected);
        Double densityTemperature = number(record, "density_temperature_cel", index, rejected);
        Boolean compensated = bool(record, "compensated", index, rejected);
        readings.add(
            new ReadingInput(
                text(record, "sample_point"),
                text(record, "parameter"),
                text(record, "time"),
                value,
                text(record, "unit"),
                text(record, "quality"),
                temperature,
                compensated,
                text(record, "source"),
                text(record, "sample_id"),
                text(record, "lab_method"),
                censored,
                densityTemperature));
        index++;
      }
    } catch (IOException | UncheckedIOException e) {
      // the body is already in memory, so a read error is a format error (e.g. an unclosed quote)
      Throwable cause = e instanceof UncheckedIOException u ? u.getCause() : e;
      throw ProblemException.of("malformed CSV: " + cause.getMessage());
    } catch (IllegalStateException | IllegalArgumentException e) {
      if (e instanceof ProblemException) {
        throw e;
      }
      throw ProblemException.of("malformed CSV: " + e.getMessage());
    }
    int[] rowLines = java.util.Arrays.copyOf(lines, readings.size());
    return new Parsed(
        readings, rejected.stream().map(r -> r.atLine(rowLines[r.index()])).toList(), rowLines);
  }

  /** The body without a leading UTF-8 byte-order mark (U+FEFF), which spreadsheets write. */
  private static Reader withoutByteOrderMark(Reader body) {
    PushbackReader in = new PushbackReader(body, 1);
    try {
      int first = in.read();
      if (first != -1 && first != '\uFEFF') {
        in.unread(first);
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return in;
  }

  private static String text(CSVRecord record, String column) {
    if (!record.isMapped(column)) {
      return null;
    }
    String v = record.get(column);
    return v == null || v.isEmpty() ? null : v;
  }

  private static Double number(
      CSVRecord record, String column, int index, List<RejectedReading> rejected) {
    return number(record, column, text(record, column), index, rejected);
  }

  private static Double number(
      CSVRecord record, String column, String v, int index, List<RejectedReading> rejected) {
    if (v == null || v.isEmpty()) {
      return null;
    }
    if (!isDecimal(v)) {
      rejected.add(
          new RejectedReading(
              index,
              column,
              "not a number (a plain decimal: digits, optional sign, point, exponent): '"
                  + abbreviate(v)
                  + "'"));
      return Double.NaN;
    }
    return Double.valueOf(v);
  }

  /**
   * Whether the text is a plain decimal: {@code [+-]digits[.digits][(e|E)[+-]digits]}, with digits
   * on at least one side of the point. Refuses what {@link Double#valueOf} would also take: hex
   * ({@code 0x1p3}), type suffixes ({@code 9.6d}, {@code 2f}), {@code NaN}, {@code Infinity}.
   */
  static boolean isDecimal(String v) {
    int i = 0;
    int n = v.length();
    if (i < n && (v.charAt(i) == '+' || v.charAt(i) == '-')) {
      i++;
    }
    int digits = 0;
    while (i < n && v.charAt(i) >= '0' && v.charAt(i) <= '9') {
      i++;
      digits++;
    }
    if (i < n && v.charAt(i) == '.') {
      i++;
      while (i < n && v.charAt(i) >= '0' && v.charAt(i) <= '9') {
        i++;
        digits++;
      }
    }
    if (digits == 0) {
      return false;
    }
    if (i < n && (v.charAt(i) == 'e' || v.charAt(i) == 'E')) {
      i++;
      if (i < n && (v.charAt(i) == '+' || v.charAt(i) == '-')) {
        i++;
      }
      int exponent = 0;
      while (i < n && v.charAt(i) >= '0' && v.charAt(i) <= '9') {
        i++;
        exponent++;
      }
      if (exponent == 0) {
        return false;
      }
    }
    return i == n;
  }

  private static Boolean bool(
      CSVRecord record, String column, int index, List<RejectedReading> rejected) {
    String v = text(record, column);
    if (v == null) {
      return null;
    }
    return switch (v.toLowerCase(Locale.ROOT)) {
      case "true" -> Boolean.TRUE;
      case "false" -> Boolean.FALSE;
      default -> {
        rejected.add(new RejectedReading(index, column, "must be true or false"));
        yield null;
      }
    };
  }

  private static String abbreviate(String s) {
    return s.length() <= 40 ? s : s.substring(0, 37) + "...";
  }
}
