package org.kwanta.service.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpResponse;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.jdbc.core.JdbcTemplate;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * Evaluations are stored in the compact form (no JSON text), a few hundred bytes a row, and the API
 * returns the same JSON for them as for a row stored the old way, as JSON text.
 */
@DatabaseTest
class EvaluationPackIT {

  private static final JsonMapper JSON = JsonMapper.builder().build();

  @LocalServerPort int port;
  @Autowired JdbcTemplate jdbc;

  @Test
  void evaluationsAreStoredCompactAndReadBackAsBeforeFromEitherForm() {
    Http http = Http.admin(port);
    String point = TestPlants.feedwaterPoints(http, 1).get(0);
    Instant start = Instant.now().truncatedTo(ChronoUnit.DAYS).minus(1, ChronoUnit.DAYS);
    HttpResponse<String> r =
        http.post(
            "/api/v1/readings",
            "application/json",
            ReadingsIngestIT.batch(ReadingsIngestIT.feedwaterReadings(point, start, 40, 60)));
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);

    String path =
        "/api/v1/sample-points/"
            + point
            + "/evaluations?from="
            + start
            + "&to="
            + start.plusSeconds(3600);
    JsonNode packed = JSON.readTree(http.get(path).body()).get("evaluations");
    assertThat(packed).hasSize(40);
    Map<String, Object> stored =
        jdbc.queryForMap(
            "SELECT count(*) AS n, count(details) AS json_rows, avg(octet_length(detail_pack)) AS"
                + " mean, max(octet_length(detail_pack)) AS largest FROM evaluation WHERE"
                + " point_key = (SELECT point_key FROM reading_point WHERE sample_point_id = ?)",
            point);
    assertThat(((Number) stored.get("n")).intValue()).isEqualTo(40);
    assertThat(((Number) stored.get("json_rows")).intValue()).isZero();
    // against about 3 kB of JSON text before (4 kB for this water), about 380 bytes in format 1
    // (V61), about 180 in format 2 (V70); format 3 (V72) keeps the shape apart
    assertThat(((Number) stored.get("mean")).doubleValue()).isLessThan(150);
    assertThat(((Number) stored.get("largest")).intValue()).isLessThan(400);
    assertThat(
            jdbc.queryForList(
                "SELECT DISTINCT get_byte(detail_pack, 0) FROM evaluation WHERE point_key ="
                    + " (SELECT point_key FROM reading_point WHERE sample_point_id = ?)",
                Integer.class,
                point))
        .containsExactly(3);

    JsonNode first = packed.get(0).get("evaluation");
    assertThat(first.get("phAtTemperature").get("uncertainty").get("rule").asString()).isNotBlank();

    // the same row as a row written in format 2 (V70 to V72): the whole pack, no shape
    EvaluationView firstView = JSON.treeToValue(first, EvaluationView.class);
    jdbc.update(
        "UPDATE evaluation SET detail_pack = ? WHERE point_key ="
            + " (SELECT point_key FROM reading_point WHERE sample_point_id = ?) AND time = ?",
        EvaluationPack.encode(firstView.forStorage(), EvaluationPack.Columns.of(firstView)),
        point,
        java.sql.Timestamp.from(start));
    assertThat(JSON.readTree(http.get(path).body()).get("evaluations")).isEqualTo(packed);

    // the same row as a row written in format 1 (V61 to V70): its pack read without the columns
    jdbc.update(
        "UPDATE evaluation SET detail_pack = ? WHERE point_key ="
            + " (SELECT point_key FROM reading_point WHERE sample_point_id = ?) AND time = ?",
        EvaluationPack.encodeFormat1(JSON.treeToValue(first, EvaluationView.class).forStorage()),
        point,
        java.sql.Timestamp.from(start));
    assertThat(
            jdbc.queryForObject(
                "SELECT get_byte(detail_pack, 0) FROM evaluation WHERE point_key ="
                    + " (SELECT point_key FROM reading_point WHERE sample_point_id = ?)"
                    + " AND time = ?",
                Integer.class,
                point,
                java.sql.Timestamp.from(start)))
        .isEqualTo(1);
    assertThat(JSON.readTree(http.get(path).body()).get("evaluations")).isEqualTo(packed);

    // the same row as a row written before the compact form: its JSON text, no pack
    jdbc.update(
        "UPDATE evaluation SET details = ?, detail_pack = NULL WHERE point_key ="
            + " (SELECT point_key FROM reading_point WHERE sample_point_id = ?) AND time = ?",
        JSON.writeValueAsString(compactJson(first)),
        point,
        java.sql.Timestamp.from(start));
    JsonNode fromJson = JSON.readTree(http.get(path).body()).get("evaluations");
    assertThat(fromJson).isEqualTo(packed);
  }

  /** The stored JSON form of a view as the API returns it (the writer stored it compact). */
  private static Object compactJson(JsonNode apiView) {
    return JSON.treeToValue(apiView, EvaluationView.class).forStorage();
  }
}
