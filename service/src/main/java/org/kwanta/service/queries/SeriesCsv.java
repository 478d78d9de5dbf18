package org.kwanta.service.queries;

import java.util.Locale;
import org.kwanta.service.ingest.StoredSeries;

/** CSV (RFC 4180) of a series; the header names the unit of each column. */
final class SeriesCsv {

  private SeriesCsv() {}

  static String write(SeriesController.SeriesResponse r) {
    StringBuilder sb = new StringBuilder();
    String unit = r.unit().replace("[", "").replace("]", "").replace("/", "_per_");
    if (r.points() != null) {
      sb.append("time,").append(r.parameter()).append('_').append(unit).append(",quality\r\n");
      for (StoredSeries.Point p : r.points()) {
        sb.append(p.time())
            .append(',')
            .append(p.value() == null ? "" : p.value().toString())
            .append(',')
            .append(p.quality() == null ? "" : p.quality())
            .append("\r\n");
      }
    } else {
      sb.append("bucket_start,min_")
          .append(unit)
          .append(",mean_")
          .append(unit)
          .append(",max_")
          .append(unit)
          .append(",last_")
          .append(unit)
          .append(",count\r\n");
      for (StoredSeries.Bucket b : r.buckets()) {
        sb.append(
                String.format(
                    Locale.ROOT,
                    "%s,%s,%s,%s,%s,%d",
                    b.start(),
                    b.min(),
                    b.mean(),
                    b.max(),
                    b.last(),
                    b.count()))
            .append("\r\n");
      }
    }
    return sb.toString();
  }
}
