package org.kwanta.service.system;

/** One CSV cell: RFC 4180 quoting; a leading formula character is neutralised for spreadsheets. */
public final class CsvCells {

  private CsvCells() {}

  /** The cell for a text (empty for null). */
  public static String of(String s) {
    if (s == null) {
      return "";
    }
    String v = !s.isEmpty() && "=+-@".indexOf(s.charAt(0)) >= 0 ? "'" + s : s;
    return v.contains(",") || v.contains("\"") || v.contains("\n") || v.contains("\r")
        ? "\"" + v.replace("\"", "\"\"") + "\""
        : v;
  }
}
