package org.kwanta.service.queries;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpResponse;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.UUID;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.kwanta.service.support.RandomFeed;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.web.server.LocalServerPort;

/**
 * The board's levels (the plant overview, kept up to date incrementally per point) equal what the
 * slow path {@link CurrentLevels#of} gives at the time the board says they are from, through an
 * ingested story: a drum water point whose pH electrode fails (in doubt, classified on the
 * calculated pH), a feedwater point whose cation conductivity rises, a limit change of the plant's
 * own, and new readings. The series are invented; the limits are the shipped examples (IAPWS
 * guidance as recalled, from memory) and a fictional plant override.
 */
@DatabaseTest
class BoardLevelsIT {

  @LocalServerPort int port;
  @Autowired StateController controller;
  @Autowired CurrentLevels levels;

  private Http http;
  private String plant;
  private String drum;
  private String feed;

  /**
   * Minutes [from, to) of one reading set a minute at both points. SC 8.55, CACE 0.113, DCACE
   * 0.0725 µS/cm are the engine's own solution model for 1.5 mg/kg ammonia (pH 9.49 at 25 °C, model
   * test fixture Demo.readings); the drum point's electrode reads {@code drumPh}, the feedwater
   * point's cation conductivity is {@code feedCace}.
   */
  private void ingest(Instant t0, int from, int to, double drumPh, double feedCace) {
    List<String> rows = new ArrayList<>();
    for (int m = from; m < to; m++) {
      Instant t = t0.plusSeconds(60L * m);
      for (String p : List.of(drum, feed)) {
        double cace = p.equals(feed) ? feedCace : 0.113;
        rows.add(
            RandomFeed.reading(
                p, "specific_conductivity", t, 8.55, "uS/cm", ",\"compensated\":true"));
        rows.add(
            RandomFeed.reading(
                p, "cation_conductivity", t, cace, "uS/cm", ",\"compensated\":true"));
        rows.add(
            RandomFeed.reading(
                p, "degassed_cation_conductivity", t, 0.0725, "uS/cm", ",\"compensated\":true"));
        rows.add(RandomFeed.reading(p, "ph", t, p.equals(drum) ? drumPh : 9.49, "[pH]", ""));
      }
    }
    HttpResponse<String> r =
        http.post(
            "/api/v1/readings",
            "application/json",
            "{\"readings\":[" + String.join(",", rows) + "]}");
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
  }

  /** The board's states by point, each checked against the slow path at its levelsAsOf. */
  private Map<String, States.State> boardEqualsSlowPath() {
    Map<String, States.State> out = new HashMap<>();
    for (States.State s : controller.board(plant).overview().samplePoints()) {
      assertThat(s.levels())
          .as("levels of %s at %s", s.samplePoint(), s.levelsAsOf())
          .isEqualTo(levels.of(s.samplePoint(), s.levelsAsOf()));
      out.put(s.samplePoint(), s);
    }
    return out;
  }

  private static CurrentLevels.LevelState level(States.State s, String parameter) {
    return s.levels().stream()
        .filter(l -> l.parameter().equals(parameter))
        .findFirst()
        .orElseThrow(() -> new AssertionError("no " + parameter + " level in " + s));
  }

  @Test
  void boardLevelsEqualTheSlowPathThroughAStory() {
    http = Http.admin(port);
    String tag = UUID.randomUUID().toString().substring(0, 8).toLowerCase(Locale.ROOT);
    plant = "board-" + tag;
    drum = "B" + tag + "-DRUM";
    feed = "B" + tag + "-FEED";
    String body =
        ("{\"id\":\"%s\",\"name\":\"Board levels test (fictional)\","
                + "\"blocks\":[{\"id\":\"U1\",\"name\":\"Unit 1\"}],\"samplePoints\":["
                + "{\"id\":\"%s\",\"block\":\"U1\",\"name\":\"drum\",\"cycleLocation\":\"DRUM_WATER\","
                + "\"treatmentRegime\":\"AVT(O)\",\"operatingTemperatureCel\":150},"
                + "{\"id\":\"%s\",\"block\":\"U1\",\"name\":\"feed\",\"cycleLocation\":\"FEEDWATER\","
                + "\"treatmentRegime\":\"AVT(O)\",\"operatingTemperatureCel\":150}]}")
            .formatted(plant, drum, feed);
    HttpResponse<String> created = http.post("/api/v1/plants", "application/json", body);
    assertThat(created.statusCode()).as(created.body()).isEqualTo(201);
    Instant t0 = Instant.now().truncatedTo(ChronoUnit.MINUTES).minus(100, ChronoUnit.MINUTES);

    // 60 minutes: the drum electrode fails at 7.6 (in doubt, the calculated pH stands in), the
    // feedwater cation conductivity is 0.35 µS/cm, above the example AL1 and AL2 (from memory)
    ingest(t0, 0, 60, 7.6, 0.35);
    Map<String, States.State> first = boardEqualsSlowPath();
    CurrentLevels.LevelState drumPh = level(first.get(drum), "ph");
    assertThat(drumPh.instrumentInDoubt()).isTrue();
    assertThat(drumPh.calculatedValue()).isTrue();
    CurrentLevels.LevelState feedCace = level(first.get(feed), "cation_conductivity");
    assertThat(feedCace.actionLevel()).as(feedCace.toString()).isGreaterThanOrEqualTo(1);
    assertThat(feedCace.limitsOrigin()).isEqualTo("DEFAULT");

    // nothing changed: the board reuses what it read, its levels are those of now, still equal
    Map<String, States.State> again = boardEqualsSlowPath();
    assertThat(again.get(feed).levelsAsOf()).isEqualTo(again.get(feed).asOf());
    assertThat(again.get(feed).levels()).isEqualTo(first.get(feed).levels());

    // the plant's own limit: the feedwater level is judged by it at once
    String override =
        """
        {"parameter":"cation_conductivity","unit":"uS/cm",
         "normal":{"high":0.5,"source":"Board test manual (fictional)"},
         "thresholds":[{"level":"AL1","side":"HIGH","value":0.5,"source":"Board test manual (fictional)"}],
         "deadband":{"value":0.01,"source":"site choice"},
         "persistence":{"value":"PT5M","source":"site choice"}}""";
    HttpResponse<String> put =
        http.send(
            "PUT",
            "/api/v1/sample-points/" + feed + "/limits/cation_conductivity",
            "application/json",
            override);
    assertThat(put.statusCode()).as(put.body()).isEqualTo(200);
    Map<String, States.State> limited = boardEqualsSlowPath();
    CurrentLevels.LevelState judged = level(limited.get(feed), "cation_conductivity");
    assertThat(judged.limitsOrigin()).isEqualTo("OVERRIDE");
    assertThat(judged.level()).isEqualTo("NORMAL");
    assertThat(limited.get(feed).levelsAsOf()).isAfter(first.get(feed).levelsAsOf());

    // new readings of both points: the electrode recovers, the cation conductivity passes 0.5
    ingest(t0, 60, 95, 9.49, 0.8);
    Map<String, States.State> later = boardEqualsSlowPath();
    assertThat(later.get(feed).levelsAsOf()).isAfter(limited.get(feed).levelsAsOf());
    assertThat(level(later.get(feed), "cation_conductivity").level()).isEqualTo("AL1");
    assertThat(level(later.get(drum), "ph").instrumentInDoubt()).isFalse();
    assertThat(later.get(drum).levelsAsOf()).isAfter(limited.get(drum).levelsAsOf());
  }
}
