package org.kwanta.service.support;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpResponse;
import java.sql.Timestamp;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Random;
import java.util.TreeSet;
import java.util.UUID;
import java.util.function.Consumer;
import org.springframework.jdbc.core.JdbcTemplate;

/**
 * A random feed through the ingest, for tests of what is kept up to date incrementally: readings a
 * minute apart at a drum water and a feedwater point of a new plant, 22 hours from 24 hours ago (26
 * in CI, where the steps take 4 hours), then steps of 6 minutes up to now with gaps filled in later
 * batches (out of order), corrections of earlier readings (which re-evaluate the hour after them
 * and so change later readings' doubt), bad-quality readings, readings ahead of the step's time,
 * and once a reading changed by SQL by hand (a generation step the ingest did not log). The series
 * are invented.
 */
public final class RandomFeed {

  /**
   * Steps of 6 minutes after the first 22 hours: 20 in the everyday build, 40 in CI's (each step
   * has late batches, corrections far back and a reading ahead; step 17 changes a reading by hand).
   */
  public static final int STEPS = Depth.of(20, 40);

  private final Http http;
  private final JdbcTemplate jdbc;
  private final Random random = new Random(20261203);

  /** The plant made, its points (drum water, feedwater) and the first reading's time. */
  public final String plant;

  public final String drum;
  public final String feed;
  public final Instant t0;

  public RandomFeed(Http http, JdbcTemplate jdbc, String prefix) {
    this.http = http;
    this.jdbc = jdbc;
    String tag = UUID.randomUUID().toString().substring(0, 8).toLowerCase(Locale.ROOT);
    plant = prefix + "-" + tag;
    drum = "F" + tag + "-DRUM";
    feed = "F" + tag + "-FEED";
    // the last step ends now
    t0 =
        Instant.now()
            .truncatedTo(ChronoUnit.MINUTES)
            .minus(22 * 60 + 6 * STEPS, ChronoUnit.MINUTES);
  }

  public List<String> points() {
    return List.of(drum, feed);
  }

  /**
   * One reading of an ingest batch, as JSON ({@code extra}: further fields with a leading comma).
   */
  public static String reading(
      String point, String parameter, Instant time, double value, String unit, String extra) {
    return String.format(
        Locale.ROOT,
        "{\"samplePoint\":\"%s\",\"parameter\":\"%s\",\"time\":\"%s\",\"value\":%s,\"unit\":\"%s\"%s}",
        point,
        parameter,
        time,
        value,
        unit,
        extra);
  }

  /**
   * One minute's readings of a point. SC 8.55, CACE 0.113, DCACE 0.0725 µS/cm and pH 9.49 are the
   * engine's solution model for 1.5 mg/kg ammonia (model test fixture Demo.readings); the variants
   * raise the cation conductivity past the example action levels for stretches of time, drop the pH
   * at random (the electrode then disagrees with the conductivities and is in doubt) or mark a
   * reading bad.
   */
  private List<String> minute(String point, Instant t) {
    // stretches of 45 minutes in three with the cation conductivity high, so levels are reached
    long m = t.getEpochSecond() / 60;
    double cace = (m / 45) % 3 == 1 ? 0.4 + 0.5 * random.nextDouble() : 0.113;
    double ph = random.nextInt(5) == 0 ? 7.6 : 9.49;
    String quality = random.nextInt(12) == 0 ? ",\"quality\":\"bad\"" : "";
    return List.of(
        reading(point, "specific_conductivity", t, 8.55, "uS/cm", ",\"compensated\":true"),
        reading(point, "cation_conductivity", t, cace, "uS/cm", ",\"compensated\":true" + quality),
        reading(point, "degassed_cation_conductivity", t, 0.0725, "uS/cm", ",\"compensated\":true"),
        reading(point, "ph", t, ph, "[pH]", ""));
  }

  private void post(List<String> rows) {
    for (int i = 0; i < rows.size(); i += 4000) {
      List<String> part = rows.subList(i, Math.min(rows.size(), i + 4000));
      HttpResponse<String> r =
          http.post(
              "/api/v1/readings",
              "application/json",
              "{\"readings\":[" + String.join(",", part) + "]}");
      assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    }
  }

  /**
   * Declares the plant, posts the first 22 hours and {@link #STEPS} steps up to now, and after each
   * calls {@code after} with the step's time (readings ahead of it exist).
   */
  public void run(Consumer<Instant> after) {
    String body =
        ("{\"id\":\"%s\",\"name\":\"Random feed test (fictional)\","
                + "\"blocks\":[{\"id\":\"U1\",\"name\":\"Unit 1\"}],\"samplePoints\":["
                + "{\"id\":\"%s\",\"block\":\"U1\",\"name\":\"drum\",\"cycleLocation\":\"DRUM_WATER\","
                + "\"treatmentRegime\":\"AVT(O)\",\"operatingTemperatureCel\":150},"
                + "{\"id\":\"%s\",\"block\":\"U1\",\"name\":\"feed\",\"cycleLocation\":\"FEEDWATER\","
                + "\"treatmentRegime\":\"AVT(O)\",\"operatingTemperatureCel\":150}]}")
            .formatted(plant, drum, feed);
    HttpResponse<String> created = http.post("/api/v1/plants", "application/json", body);
    assertThat(created.statusCode()).as(created.body()).isEqualTo(201);
    List<String> ids = points();

    // the first 22 hours, then STEPS steps of 6 minutes up to now: the one-day
    // window
    // starts before the first reading and slides past it
    List<String> first = new ArrayList<>();
    for (int m = 0; m < 22 * 60; m++) {
      for (String p : ids) {
        first.addAll(minute(p, t0.plusSeconds(60L * m)));
      }
    }
    post(first);
    after.accept(t0.plusSeconds(22 * 3600));

    TreeSet<Integer> gaps = new TreeSet<>();
    for (int step = 0; step < STEPS; step++) {
      int from = 22 * 60 + step * 6;
      List<String> rows = new ArrayList<>();
      for (int m = from; m < from + 6; m++) {
        if (random.nextInt(4) == 0) {
          gaps.add(m); // left out now, sent in a later batch
          continue;
        }
        for (String p : ids) {
          rows.addAll(minute(p, t0.plusSeconds(60L * m)));
        }
      }
      // late readings: some gaps filled, oldest or newest first
      while (!gaps.isEmpty() && random.nextInt(3) > 0) {
        int m = random.nextBoolean() ? gaps.pollFirst() : gaps.pollLast();
        for (String p : ids) {
          rows.addAll(minute(p, t0.plusSeconds(60L * m)));
        }
      }
      // corrections of earlier minutes, recent or far back (the evaluations after them are
      // recomputed, which may change the doubt of later readings)
      for (int c = 0; c < 3; c++) {
        int m = random.nextBoolean() ? from - 1 - random.nextInt(90) : random.nextInt(from);
        rows.addAll(minute(random.nextBoolean() ? drum : feed, t0.plusSeconds(60L * m)));
      }
      // a reading ahead of the time asked for (it comes into the window later)
      Instant at = t0.plusSeconds(60L * (from + 6));
      if (step % 5 == 0) {
        rows.addAll(minute(feed, at.plusSeconds(150)));
      }
      post(rows);
      if (step == 17) {
        // a reading changed by hand: its generation step is not in the ingest's log
        int changed =
            jdbc.update(
                "UPDATE reading SET value = 0.7"
                    + " WHERE point_key = (SELECT point_key FROM reading_point WHERE sample_point_id = ?)"
                    + " AND parameter_key = (SELECT parameter_key FROM reading_parameter"
                    + " WHERE code = 'cation_conductivity') AND time = ?",
                feed,
                Timestamp.from(t0.plusSeconds(60L * (from - 10))));
        assertThat(changed).isLessThanOrEqualTo(1);
      }
      after.accept(at);
    }
  }
}
