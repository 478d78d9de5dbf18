package org.kwanta.service.operatingstate;

import com.fasterxml.jackson.annotation.JsonProperty;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.kwanta.model.Parameter;
import org.kwanta.model.limits.CycleLocation;
import org.kwanta.service.ingest.ReadingHistory;
import org.springframework.core.io.ResourceLoader;
import org.springframework.jdbc.core.simple.JdbcClient;
import org.springframework.stereotype.Service;
import tools.jackson.databind.DeserializationFeature;
import tools.jackson.dataformat.yaml.YAMLMapper;

/**
 * Start-up hold points: values a sample must reach before the block takes the next start-up step,
 * each with its source, read from a file ({@link StartupProperties}). {@link #check} reports each
 * one as met, not met, or without data, from the latest good reading of the block's sample points
 * at the hold point's cycle locations within {@link #RECENT} before the time asked.
 */
@Service
public class HoldPoints {

  /** How old the latest reading may be to judge a hold point (engineering choice, no source). */
  static final Duration RECENT = Duration.ofMinutes(30);

  /** Which way the value must lie. */
  public enum Comparison {
    /** The value must not exceed the hold value. */
    AT_MOST,
    /** The value must not fall below the hold value. */
    AT_LEAST
  }

  /** The outcome of one hold point at one sample point. */
  public enum Status {
    MET,
    NOT_MET,
    NO_DATA
  }

  /** One hold point as written in the file. */
  public record HoldPoint(
      String id,
      String step,
      String description,
      List<CycleLocation> cycleLocations,
      String parameter,
      String unit,
      Comparison comparison,
      double value,
      String source,
      boolean fromMemory) {

    public HoldPoint {
      Objects.requireNonNull(id, "id");
      Objects.requireNonNull(step, "step");
      Objects.requireNonNull(comparison, "comparison");
      Objects.requireNonNull(source, "source: every hold point names where its value comes from");
      Parameter p = Parameter.ofCode(parameter);
      if (!p.unit().equals(unit)) {
        throw new IllegalArgumentException(
            "Hold point " + id + ": unit " + unit + " is not " + p.code() + "'s " + p.unit());
      }
      cycleLocations = List.copyOf(cycleLocations);
    }

    boolean met(double measured) {
      return comparison == Comparison.AT_MOST ? measured <= value : measured >= value;
    }
  }

  /** One hold point judged at one sample point. */
  public record Result(
      HoldPoint holdPoint,
      String samplePoint,
      Double measured,
      Instant measuredAt,
      Status status) {}

  private record File(@JsonProperty("holdPoints") List<HoldPoint> holdPoints) {}

  private final List<HoldPoint> holdPoints;
  private final JdbcClient jdbc;
  private final ReadingHistory readings;

  HoldPoints(
      StartupProperties properties,
      ResourceLoader resources,
      JdbcClient jdbc,
      ReadingHistory readings) {
    this.jdbc = jdbc;
    this.readings = readings;
    YAMLMapper yaml =
        YAMLMapper.builder().enable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES).build();
    try (InputStream in = resources.getResource(properties.location()).getInputStream()) {
      this.holdPoints = List.copyOf(yaml.readValue(in, File.class).holdPoints());
    } catch (IOException e) {
      throw new UncheckedIOException("Cannot read hold points " + properties.location(), e);
    }
  }

  /** The hold points in force. */
  public List<HoldPoint> all() {
    return holdPoints;
  }

  /** Every hold point at every sample point of the block it applies to, judged at {@code at}. */
  public List<Result> check(String plant, String block, Instant at) {
    List<Result> out = new ArrayList<>();
    for (HoldPoint h : holdPoints) {
      List<String> points =
          jdbc.sql(
                  """
                  SELECT id FROM sample_point
                  WHERE plant_id = ? AND block_id = ?
                    AND cycle_location = ANY(string_to_array(?, ','))
                  ORDER BY id""")
              .params(
                  plant,
                  block,
                  String.join(",", h.cycleLocations().stream().map(Enum::name).toList()))
              .query(String.class)
              .list();
      for (String point : points) {
        out.add(latest(h, point, at));
      }
    }
    return out;
  }

  /** The latest reading that is not of bad quality within RECENT before {@code at}, judged. */
  private Result latest(HoldPoint h, String point, Instant at) {
    return readings
        .latestNotBad(point, h.parameter(), at.minus(RECENT), at)
        .map(
            r ->
                new Result(
                    h, point, r.value(), r.time(), h.met(r.value()) ? Status.MET : Status.NOT_MET))
        .orElse(new Result(h, point, null, null, Status.NO_DATA));
  }
}
