package org.kwanta.service.system;

import static org.assertj.core.api.Assertions.assertThat;

import java.net.http.HttpResponse;
import java.sql.Connection;
import java.sql.DriverManager;
import java.sql.PreparedStatement;
import java.sql.ResultSet;
import java.sql.SQLException;
import java.time.Duration;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.atomic.AtomicReference;
import org.flywaydb.core.Flyway;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.MethodOrderer;
import org.junit.jupiter.api.Order;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestInstance;
import org.junit.jupiter.api.TestMethodOrder;
import org.kwanta.service.support.Http;
import org.kwanta.service.support.TestDatabase;
import org.kwanta.service.support.TestKeys;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.micrometer.metrics.test.autoconfigure.AutoConfigureMetrics;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.context.TestConfiguration;
import org.springframework.boot.test.util.TestPropertyValues;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.context.ApplicationContextInitializer;
import org.springframework.context.ConfigurableApplicationContext;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Primary;
import org.springframework.test.context.ContextConfiguration;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The read replica ({@code kwanta.replica.*}). No streaming replica is available in a test, so the
 * "replica" is a second, migrated but empty database on the test server: a read that came from it
 * finds no readings, one from the primary finds them. Both URLs name two hosts, the first refusing
 * (127.0.0.1:1), with {@code targetServerType=primary}: pgjdbc gets them unchanged and moves on to
 * the second host, as it does after a failover (deploy/replica/check-failover.sh proves that on a
 * real primary and standby).
 */
@org.junit.jupiter.api.Tag(org.kwanta.service.support.Depth.THOROUGH)
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@ContextConfiguration(initializers = ReplicaReadsIT.Databases.class)
@AutoConfigureMetrics
@TestInstance(TestInstance.Lifecycle.PER_CLASS)
@TestMethodOrder(MethodOrderer.OrderAnnotation.class)
class ReplicaReadsIT {

  private static final JsonMapper JSON = JsonMapper.builder().build();
  private static final AtomicReference<Duration> INJECTED_LAG = new AtomicReference<>();
  private static volatile String replicaUrl;

  /** Primary and replica URLs, each behind a refusing first host. */
  static final class Databases
      implements ApplicationContextInitializer<ConfigurableApplicationContext> {
    @Override
    public void initialize(ConfigurableApplicationContext context) {
      TestDatabase db = TestDatabase.get();
      try {
        replicaUrl = db.createScratchDatabase("kwanta_replica");
      } catch (SQLException e) {
        throw new IllegalStateException(e);
      }
      Flyway.configure()
          .dataSource(replicaUrl, db.user(), db.password())
          .locations("classpath:db/migration")
          .load()
          .migrate();
      TestPropertyValues.of(
              "spring.datasource.url=" + twoHosts(db.url()),
              "spring.datasource.username=" + db.user(),
              "spring.datasource.password=" + db.password(),
              "kwanta.replica.url=" + twoHosts(replicaUrl),
              "kwanta.replica.max-lag=PT5S",
              "kwanta.replica.lag-refresh=PT0S",
              TestKeys.ADMIN_KEY_PROPERTY + "=" + TestKeys.ADMIN)
          .applyTo(context.getEnvironment());
    }
  }

  /** The URL with a refusing host first and {@code targetServerType=primary}. */
  static String twoHosts(String url) {
    String prefix = "jdbc:postgresql://";
    String rest = url.substring(prefix.length());
    return prefix
        + "127.0.0.1:1,"
        + rest
        + (rest.contains("?") ? "&" : "?")
        + "targetServerType=primary";
  }

  /** The default lag measure, or an injected lag. */
  @TestConfiguration
  static class InjectedLag {
    @Bean
    @Primary
    ReplicaLag injectedLag() {
      return replica -> {
        Duration injected = INJECTED_LAG.get();
        return injected != null ? injected : ReplicaLag.REPLAY.measure(replica);
      };
    }
  }

  @LocalServerPort int port;
  @Autowired ReadSource reads;
  Http http;
  String point;
  String series;

  @BeforeAll
  void data() {
    http = Http.admin(port);
    String tag = Long.toString(System.nanoTime(), 36).toUpperCase(Locale.ROOT);
    point = "R" + tag;
    String plant =
        "{\"id\":\"r-"
            + tag.toLowerCase(Locale.ROOT)
            + "\",\"name\":\"Replica test plant (invented)\",\"blocks\":[{\"id\":\"U1\",\"name\":\"u\"}],"
            + "\"samplePoints\":[{\"id\":\""
            + point
            + "\",\"block\":\"U1\",\"name\":\"p\",\"cycleLocation\":\"FEEDWATER\","
            + "\"treatmentRegime\":\"AVT(O)\",\"operatingTemperatureCel\":150}]}";
    assertThat(http.post("/api/v1/plants", "application/json", plant).statusCode()).isEqualTo(201);
    Instant start = Instant.now().truncatedTo(ChronoUnit.MINUTES).minus(30, ChronoUnit.MINUTES);
    List<String> readings = new ArrayList<>();
    for (int i = 0; i < 20; i++) {
      readings.add(
          String.format(
              Locale.ROOT,
              "{\"samplePoint\":\"%s\",\"parameter\":\"cation_conductivity\",\"time\":\"%s\","
                  + "\"value\":%s,\"unit\":\"uS/cm\"}",
              point,
              start.plusSeconds(60L * i),
              0.05 + i * 0.001));
    }
    HttpResponse<String> r =
        http.post(
            "/api/v1/readings",
            "application/json",
            "{\"readings\":[" + String.join(",", readings) + "]}");
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    assertThat(r.headers().firstValue(ReadReplicaConfiguration.SOURCE_HEADER))
        .as("writes are not routed")
        .isEmpty();
    series =
        "/api/v1/sample-points/"
            + point
            + "/series?parameter=cation_conductivity&from="
            + start.minusSeconds(60)
            + "&to="
            + start.plus(1, ChronoUnit.HOURS);
  }

  @AfterAll
  void dropReplica() throws SQLException {
    INJECTED_LAG.set(null);
    TestDatabase.get().dropDatabase(replicaUrl);
  }

  @Test
  @Order(1)
  void pgjdbcGetsTheMultiHostUrlUnchanged() throws SQLException {
    assertThat(reads.replicaUrl()).contains(twoHosts(replicaUrl));
    assertThat(reads.replicaUrl().orElseThrow()).contains("targetServerType=primary");
    // the ingest above went through the primary's two-host URL; the readings are there
    TestDatabase db = TestDatabase.get();
    try (Connection c = DriverManager.getConnection(db.url(), db.user(), db.password());
        PreparedStatement s =
            c.prepareStatement("SELECT count(*) FROM reading_named WHERE sample_point_id = ?")) {
      s.setString(1, point);
      try (ResultSet rs = s.executeQuery()) {
        rs.next();
        assertThat(rs.getLong(1)).isEqualTo(20);
      }
    }
  }

  @Test
  @Order(2)
  void readsComeFromTheReplicaWithItsLag() {
    HttpResponse<String> r = http.get(series);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    assertThat(r.headers().firstValue(ReadReplicaConfiguration.SOURCE_HEADER)).contains("replica");
    assertThat(r.headers().firstValue(ReadReplicaConfiguration.LAG_HEADER)).contains("0.000");
    assertThat(r.headers().firstValue(ReadReplicaConfiguration.FALLBACK_HEADER)).isEmpty();
    // the (empty) replica answered, not the primary that holds the readings
    assertThat(points(r)).isZero();
  }

  @Test
  @Order(3)
  void lagOverTheMaximumFallsBackToThePrimary() {
    INJECTED_LAG.set(Duration.ofMillis(7250));
    try {
      HttpResponse<String> r = http.get(series);
      assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
      assertThat(r.headers().firstValue(ReadReplicaConfiguration.SOURCE_HEADER))
          .contains("primary");
      assertThat(r.headers().firstValue(ReadReplicaConfiguration.LAG_HEADER)).contains("7.250");
      assertThat(r.headers().firstValue(ReadReplicaConfiguration.FALLBACK_HEADER)).contains("lag");
      assertThat(points(r)).isEqualTo(20);

      INJECTED_LAG.set(Duration.ofMillis(4900));
      HttpResponse<String> within = http.get(series);
      assertThat(within.headers().firstValue(ReadReplicaConfiguration.SOURCE_HEADER))
          .contains("replica");
      assertThat(points(within)).isZero();
    } finally {
      INJECTED_LAG.set(null);
    }
  }

  @Test
  @Order(4)
  void anUnreachableReplicaFallsBackToThePrimary() throws SQLException {
    TestDatabase.get().dropDatabase(replicaUrl);
    HttpResponse<String> r = http.get(series);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    assertThat(r.headers().firstValue(ReadReplicaConfiguration.SOURCE_HEADER)).contains("primary");
    assertThat(r.headers().firstValue(ReadReplicaConfiguration.FALLBACK_HEADER))
        .contains("unreachable");
    assertThat(r.headers().firstValue(ReadReplicaConfiguration.LAG_HEADER)).isEmpty();
    assertThat(points(r)).isEqualTo(20);
    // the page's board and state read the primary too
    HttpResponse<String> state = http.get("/api/v1/sample-points/" + point + "/state");
    assertThat(state.statusCode()).as(state.body()).isEqualTo(200);
    assertThat(state.headers().firstValue(ReadReplicaConfiguration.SOURCE_HEADER))
        .contains("primary");
  }

  private static int points(HttpResponse<String> r) {
    JsonNode body = JSON.readTree(r.body());
    return body.get("points").size();
  }
}
