package org.kwanta.service.queries;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.Parameter;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.time.Duration;
import java.time.Instant;
import java.time.OffsetDateTime;
import java.time.format.DateTimeParseException;
import java.util.List;
import java.util.Locale;
import org.kwanta.service.ingest.LabResults;
import org.kwanta.service.ingest.StoredSeries;
import org.kwanta.service.samplepoints.SamplePointConfigs;
import org.kwanta.service.system.ProblemException;
import org.kwanta.service.system.ResponseFormats;
import org.springframework.http.MediaType;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.RequestHeader;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
import org.springframework.web.bind.annotation.RestController;

@RestController
@RequestMapping("/api/v1/sample-points/{samplePoint}")
@Tag(
    name = "Queries",
    description = "Series, latest state and overview, for chemists and dashboards")
class SeriesController {

  static final int DEFAULT_LIMIT = 10_000;
  static final int MAX_LIMIT = 100_000;
  static final int MAX_BUCKETS = 10_000;
  static final Duration MAX_RANGE = Duration.ofDays(400);

  private final StoredSeries series;
  private final SamplePointConfigs configs;

  private final LabResults labResults;

  SeriesController(StoredSeries series, SamplePointConfigs configs, LabResults labResults) {
    this.labResults = labResults;
    this.series = series;
    this.configs = configs;
  }

  /** A series, raw or bucketed. Units in {@code unit} (UCUM). */
  record SeriesResponse(
      String samplePoint,
      String parameter,
      String unit,
      Instant from,
      Instant to,
      Long bucketSeconds,
      List<StoredSeries.Point> points,
      List<StoredSeries.Bucket> buckets,
      Instant next,
      List<LabPoint> labResults) {}

  /**
   * A grab or lab result beside an online series (never part of {@code points} or {@code buckets});
   * {@code censored} "below": below the detection limit {@code value}.
   */
  record LabPoint(Instant time, String source, double value, String censored, String sampleId) {}

  @GetMapping(
      value = "/series",
      produces = {MediaType.APPLICATION_JSON_VALUE, "text/csv"})
  @Operation(
      summary = "A series of a measured or derived parameter",
      description =
          "Raw points (paged: at most `limit` rows; `next` is the `after` value for the next page) or,"
              + " with `bucket` (ISO 8601 duration such as PT1M) or `maxPoints`, buckets with min, mean,"
              + " max, last and count. Derived parameters: specific_conductivity_25,"
              + " cation_conductivity_25, degassed_cation_conductivity_25, calculated_ph_25,"
              + " ph_at_temperature (and _low, _high), neutral_ph_at_temperature. CSV with Accept: text/csv"
              + " or format=csv. JSON of a measured parameter: also `labResults`, the grab and lab"
              + " results in the range (apart from the online points; censored ones marked).")
  ResponseEntity<?> series(
      @Parameter(example = "U1-ECO-IN") @PathVariable("samplePoint") String samplePointId,
      @Parameter(example = "cation_conductivity") @RequestParam String parameter,
      @Parameter(example = "2026-11-30T00:00:00Z") @RequestParam String from,
      @Parameter(example = "2026-12-01T00:00:00Z") @RequestParam String to,
      @Parameter(description = "ISO 8601 duration, e.g. PT5M") @RequestParam(required = false)
          String bucket,
      @Parameter(description = "choose a bucket so that at most this many buckets come back")
          @RequestParam(required = false)
          Integer maxPoints,
      @RequestParam(required = false) Integer limit,
      @Parameter(description = "raw mode: only points after this time (paging cursor)")
          @RequestParam(required = false)
          String after,
      @RequestParam(required = false) String format,
      @RequestHeader(value = "Accept", required = false) String accept) {
    if (configs.existing(List.of(samplePointId)).isEmpty()) {
      throw ProblemException.notFound("sample point", samplePointId);
    }
    SeriesParameter p =
        SeriesParameter.byCode(parameter)
            .orElseThrow(
                () ->
                    ProblemException.of(
                        "unknown parameter '"
                            + parameter
                            + "'; known: "
                            + SeriesParameter.codes()));
    Instant start = instant("from", from);
    Instant end = instant("to", to);
    if (!end.isAfter(start)) {
      throw ProblemException.of("'to' must be after 'from'");
    }
    if (Duration.between(start, end).compareTo(MAX_RANGE) > 0) {
      throw ProblemException.of("range longer than " + MAX_RANGE.toDays() + " days");
    }
    boolean csv = ResponseFormats.csvRequested(format, accept);
    Duration size = bucketSize(bucket, maxPoints, start, end);
    SeriesResponse response;
    if (size == null) {
      int n = limit == null ? DEFAULT_LIMIT : limit;
      if (n < 1 || n > MAX_LIMIT) {
        throw ProblemException.of("limit must be in [1, " + MAX_LIMIT + "]");
      }
      List<StoredSeries.Point> points =
          series.raw(
              samplePointId,
              p.source(),
              start,
              end,
              after == null ? null : instant("after", after),
              n);
      Instant next = points.size() == n ? points.get(n - 1).time() : null;
      response =
          new SeriesResponse(
              samplePointId,
              p.code(),
              p.unit(),
              start,
              end,
              null,
              points,
              null,
              next,
              labPoints(samplePointId, p, start, end));
    } else {
      List<StoredSeries.Bucket> buckets =
          series.bucketed(samplePointId, p.source(), start, end, size);
      response =
          new SeriesResponse(
              samplePointId,
              p.code(),
              p.unit(),
              start,
              end,
              size.toSeconds(),
              null,
              buckets,
              null,
              labPoints(samplePointId, p, start, end));
    }
    if (csv) {
      return ResponseEntity.ok()
          .contentType(ResponseFormats.TEXT_CSV)
          .header(
              "Content-Disposition",
              "attachment; filename=\"" + samplePointId + "_" + p.code() + ".csv\"")
          .body(SeriesCsv.write(response));
    }
    return ResponseEntity.ok().contentType(MediaType.APPLICATION_JSON).body(response);
  }

  /** The grab and lab results of a measured parameter in [from, to); null for derived ones. */
  private List<LabPoint> labPoints(String point, SeriesParameter p, Instant from, Instant to) {
    if (!p.measured()) {
      return null;
    }
    return labResults.between(point, org.kwanta.model.Parameter.ofCode(p.code()), from, to).stream()
        .map(r -> new LabPoint(r.time(), r.source(), r.value(), r.censored(), r.sampleId()))
        .toList();
  }

  private static Duration bucketSize(String bucket, Integer maxPoints, Instant start, Instant end) {
    if (bucket != null) {
      Duration d;
      try {
        d = Duration.parse(bucket.toUpperCase(Locale.ROOT));
      } catch (DateTimeParseException e) {
        throw ProblemException.of("bucket must be an ISO 8601 duration such as PT1M");
      }
      if (d.toSeconds() < 1) {
        throw ProblemException.of("bucket must be at least one second");
      }
      if (Duration.between(start, end).dividedBy(d) > MAX_BUCKETS) {
        throw ProblemException.of("more than " + MAX_BUCKETS + " buckets; use a larger bucket");
      }
      return d;
    }
    if (maxPoints != null) {
      if (maxPoints < 1 || maxPoints > MAX_BUCKETS) {
        throw ProblemException.of("maxPoints must be in [1, " + MAX_BUCKETS + "]");
      }
      long seconds = Duration.between(start, end).toSeconds();
      long perBucket = Math.max(1, (seconds + maxPoints - 1) / maxPoints);
      return Duration.ofSeconds(niceSeconds(perBucket));
    }
    return null;
  }

  /** The smallest "round" bucket (1 s, 5 s, 10 s, 30 s, 1 min, ...) not below {@code seconds}. */
  static long niceSeconds(long seconds) {
    long[] nice = {
      1, 2, 5, 10, 15, 30, 60, 120, 300, 600, 900, 1800, 3600, 7200, 10800, 21600, 43200, 86400
    };
    for (long n : nice) {
      if (n >= seconds) {
        return n;
      }
    }
    return ((seconds + 86399) / 86400) * 86400;
  }

  static Instant instant(String name, String value) {
    try {
      return OffsetDateTime.parse(value).toInstant();
    } catch (DateTimeParseException e) {
      throw ProblemException.of(
          "'" + name + "' must be ISO 8601 with an offset, e.g. 2026-11-30T00:00:00Z");
    }
  }
}
