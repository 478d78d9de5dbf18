package org.kwanta.service.instruments;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpResponse;
import java.sql.Timestamp;
import java.time.Instant;
import java.time.ZoneOffset;
import java.time.format.DateTimeFormatter;
import java.time.temporal.ChronoUnit;
import java.util.List;
import java.util.Locale;
import java.util.UUID;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.jdbc.core.JdbcTemplate;

/**
 * The availability count reads only the daily partitions of the period asked for, on both {@code
 * reading} and {@code evaluation} (as {@code ExcursionQueryPlanIT} checks for the excursions).
 */
@DatabaseTest
class AvailabilityQueryPlanIT {

  private static final DateTimeFormatter DAY =
      DateTimeFormatter.ofPattern("yyyyMMdd").withZone(ZoneOffset.UTC);

  @LocalServerPort int port;
  @Autowired JdbcTemplate jdbc;

  @Test
  void thePlanReadsOnlyThePeriodsPartitions() {
    Http http = Http.admin(port);
    String tag = UUID.randomUUID().toString().substring(0, 8).toLowerCase(Locale.ROOT);
    String point = "A" + tag + "-CPD";
    String body =
        ("{\"id\":\"plan-%s\",\"name\":\"Plan test (fictional)\","
                + "\"blocks\":[{\"id\":\"U1\",\"name\":\"Unit 1\"}],\"samplePoints\":[{\"id\":\"%s\","
                + "\"block\":\"U1\",\"name\":\"Condensate\",\"cycleLocation\":\"CONDENSATE\","
                + "\"treatmentRegime\":\"AVT(O)\",\"operatingTemperatureCel\":40,"
                + "\"operatingPressureMPa\":1.5}]}")
            .formatted(tag, point);
    assertThat(http.post("/api/v1/plants", "application/json", body).statusCode()).isEqualTo(201);
    Instant today = Instant.now().truncatedTo(ChronoUnit.DAYS);
    Instant day = today.minus(5, ChronoUnit.DAYS);
    String readings =
        List.of(day, day.plus(1, ChronoUnit.DAYS), today).stream()
            .map(
                t ->
                    ("{\"samplePoint\":\"%s\",\"parameter\":\"cation_conductivity\",\"time\":\"%s\","
                            + "\"value\":0.08,\"unit\":\"uS/cm\"}")
                        .formatted(point, t.plusSeconds(600)))
            .collect(Collectors.joining(",", "{\"readings\":[", "]}"));
    HttpResponse<String> r = http.post("/api/v1/readings", "application/json", readings);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);

    Instant from = day;
    Instant to = day.plus(1, ChronoUnit.DAYS);
    Timestamp f = Timestamp.from(from);
    Timestamp t = Timestamp.from(to);
    String plan =
        jdbc
            .queryForList(
                "EXPLAIN " + org.kwanta.service.ingest.ReadingHistory.SLOT_COUNTS,
                String.class,
                "900 seconds",
                f,
                "900 seconds",
                f,
                f,
                t,
                point,
                "cation_conductivity",
                f,
                t,
                "900 seconds",
                f,
                Availability.multirange(List.of(new org.kwanta.model.limits.TimeWindow(from, to))))
            .stream()
            .collect(Collectors.joining("\n"));
    assertThat(plan)
        .contains("reading_p" + DAY.format(day))
        .contains("evaluation_p" + DAY.format(day))
        .doesNotContain("reading_p" + DAY.format(day.plus(1, ChronoUnit.DAYS)))
        .doesNotContain("evaluation_p" + DAY.format(today))
        .doesNotContain("reading_p" + DAY.format(today));
  }
}
