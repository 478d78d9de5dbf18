package org.kwanta.service.reports;

import java.util.Locale;
import org.kwanta.service.system.CsvCells;

/**
 * A report as one CSV table in long form: {@code section,sample_point,parameter,item,value,unit},
 * one row per figure, so a spreadsheet can filter by section ({@link CsvCells} quoting).
 */
final class ReportCsv {

  private ReportCsv() {}

  static String of(Report r) {
    StringBuilder sb = new StringBuilder("section,sample_point,parameter,item,value,unit\r\n");
    row(sb, "period", "", "", "plant", r.plant(), "");
    row(sb, "period", "", "", "label", r.label(), "");
    row(sb, "period", "", "", "from", r.from().toString(), "");
    row(sb, "period", "", "", "to", r.to().toString(), "");
    row(sb, "period", "", "", "as_of", r.asOf().toString(), "");
    row(sb, "period", "", "", "counting", r.counting(), "");
    for (Report.BlockTime u : r.blocks()) {
      row(sb, "block_hours", u.block(), "", "IN_SERVICE_COUNTED", num(u.hoursInService()), "h");
      row(sb, "block_hours", u.block(), "", "UNRECORDED", num(u.hoursUnrecorded()), "h");
      u.hoursByState().forEach((s, h) -> row(sb, "block_hours", u.block(), "", s, num(h), "h"));
    }
    for (Report.Channel c : r.channels()) {
      c.hoursByLevel()
          .forEach(
              (l, h) ->
                  row(sb, "hours_in_service", c.samplePoint(), c.parameter(), l, num(h), "h"));
      row(sb, "penalty", c.samplePoint(), c.parameter(), "penalty", num(c.penalty()), "1");
    }
    for (Report.Event e : r.events()) {
      row(
          sb,
          "event",
          "",
          "",
          "event " + e.id() + ": " + e.title(),
          e.status() + " / " + e.causeCategory(),
          "");
    }
    for (Report.Instrument i : r.instruments()) {
      row(
          sb,
          "availability",
          i.samplePoint(),
          i.parameter(),
          "availability",
          opt(i.availability()),
          "1");
      row(
          sb,
          "completeness",
          i.samplePoint(),
          i.parameter(),
          "completeness",
          opt(i.completeness()),
          "1");
    }
    for (Report.CheckStatus c : r.calibration()) {
      row(
          sb,
          "calibration",
          c.samplePoint(),
          c.parameter(),
          c.kind(),
          c.status() + (c.nextDue() == null ? "" : " due " + c.nextDue()),
          "");
    }
    row(
        sb,
        "grab_vs_online",
        "",
        "",
        "available",
        String.valueOf(r.grabVsOnline().available()),
        "");
    row(sb, "grab_vs_online", "", "", "note", r.grabVsOnline().note(), "");
    for (Report.GrabRow g : r.grabVsOnline().comparisons()) {
      String at = g.grabTime().toString();
      row(sb, "grab_vs_online", g.samplePoint(), g.parameter(), "grab " + at, g.grab(), g.unit());
      row(
          sb,
          "grab_vs_online",
          g.samplePoint(),
          g.parameter(),
          "online " + at,
          num(g.onlineValue()),
          g.unit());
      row(
          sb,
          "grab_vs_online",
          g.samplePoint(),
          g.parameter(),
          "deviation " + at + " (tolerance " + num(g.tolerance()) + ", " + g.verdict() + ")",
          num(g.deviation()),
          g.unit());
    }
    row(sb, "index", "", "", "chemistry_performance_index", num(r.index().value()), "1");
    row(sb, "index", "", "", "chemistry_score", num(r.index().chemistryScore()), "1");
    row(sb, "index", "", "", "availability_score", num(r.index().availabilityScore()), "1");
    return sb.toString();
  }

  private static String num(double v) {
    return String.format(Locale.ROOT, "%.6f", v);
  }

  private static String opt(Double v) {
    return v == null ? "" : num(v);
  }

  private static void row(StringBuilder sb, String... cells) {
    for (int i = 0; i < cells.length; i++) {
      if (i > 0) {
        sb.append(',');
      }
      sb.append(CsvCells.of(cells[i]));
    }
    sb.append("\r\n");
  }
}
