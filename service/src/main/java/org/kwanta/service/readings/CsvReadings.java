package org.kwanta.service.readings;

import java.io.IOException;
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
import org.kwanta.service.system.BadRequestException;

/**
 * Reads a CSV batch (RFC 4180 with a header row). Columns: {@code sample_point, parameter, time,
 * value, unit} and optionally {@code quality, sample_temperature_cel, compensated}, in any order.
 */
final class CsvReadings {

  static final Set<String> REQUIRED = Set.of("sample_point", "parameter", "time", "value", "unit");
  static final Set<String> OPTIONAL = Set.of("quality", "sample_temperature_cel", "compensated");

  private CsvReadings() {}

  record Parsed(List<ReadingInput> readings, List<RejectedReading> rejected) {}

  static Parsed parse(Reader body, int maxRows) {
    CSVFormat format =
        CSVFormat.RFC4180
            .builder()
            .setHeader()
            .setSkipHeaderRecord(true)
            .setIgnoreEmptyLines(true)
            .setTrim(true)
            .get();
    List<ReadingInput> readings = new ArrayList<>();
    List<RejectedReading> rejected = new ArrayList<>();
    try (CSVParser parser = CSVParser.parse(body, format)) {
      Map<String, Integer> header = parser.getHeaderMap();
      List<String> missing =
          REQUIRED.stream().filter(c -> !header.containsKey(c)).sorted().toList();
      List<String> unknown =
          header.keySet().stream()
              .filter(c -> !REQUIRED.contains(c) && !OPTIONAL.contains(c))
              .sorted()
              .toList();
      if (!missing.isEmpty() || !unknown.isEmpty()) {
        throw BadRequestException.of(
            "CSV header: "
                + (missing.isEmpty() ? "" : "missing columns " + missing + " ")
                + (unknown.isEmpty() ? "" : "unknown columns " + unknown + " ")
                + "(required "
                + REQUIRED.stream().sorted().toList()
                + ", optional "
                + OPTIONAL.stream().sorted().toList()
                + ")");
      }
      int index = 0;
      for (CSVRecord record : parser) {
        if (index >= maxRows) {
          throw new BatchTooLargeException(index + 1, maxRows);
        }
        if (!record.isConsistent()) {
          rejected.add(
              new RejectedReading(
                  index,
                  null,
                  "row has " + record.size() + " fields, header has " + header.size()));
          readings.add(null);
          index++;
          continue;
        }
        Double value = number(record, "value", index, rejected);
        Double temperature = number(record, "sample_temperature_cel", index, rejected);
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
                compensated));
        index++;
      }
    } catch (IOException | UncheckedIOException e) {
      // the body is already in memory, so a read error is a format error (e.g. an unclosed quote)
      Throwable cause = e instanceof UncheckedIOException u ? u.getCause() : e;
      throw BadRequestException.of("malformed CSV: " + cause.getMessage());
    } catch (IllegalStateException | IllegalArgumentException e) {
      if (e instanceof BadRequestException) {
        throw e;
      }
      throw BadRequestException.of("malformed CSV: " + e.getMessage());
    }
    return new Parsed(readings, rejected);
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
    String v = text(record, column);
    if (v == null) {
      return null;
    }
    try {
      return Double.valueOf(v);
    } catch (NumberFormatException e) {
      rejected.add(new RejectedReading(index, column, "not a number: '" + abbreviate(v) + "'"));
      return Double.NaN;
    }
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
