package org.kwanta.service.limits;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.net.URLEncoder;
import java.net.http.HttpResponse;
import java.nio.charset.StandardCharsets;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.UUID;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.dao.DataAccessException;
import org.springframework.jdbc.core.JdbcTemplate;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The chemistry record (issue 13), through the HTTP API: limits as effective-dated versions, the
 * past as reported and as recomputed, acknowledgements as a history by key, the audit log and its
 * immutability. The series is the invented condenser leak of {@link ExcursionsIT} (demo only); the
 * default thresholds it crosses are the recalled IAPWS values (0.2 / 0.35 / 0.65 µS/cm, from memory
 * — verify); the plant limits set here are invented.
 */
@DatabaseTest
class ChemistryRecordIT {

  private static final JsonMapper JSON = JsonMapper.builder().build();

  /** Invented plant limits: AL1 above 0.5 µS/cm only. */
  private static final String PLANT_LIMITS =
      """
      {"parameter":"cation_conductivity","unit":"uS/cm",
       "normal":{"high":0.5,"source":"Brackenmoor chemistry manual (fictional), table 3"},
       "thresholds":[{"level":"AL1","side":"HIGH","value":0.5,"source":"Brackenmoor manual (fictional)"}],
       "deadband":{"value":0.01,"source":"site choice"},
       "persistence":{"value":"PT5M","source":"site choice"}}""";

  @LocalServerPort int port;
  @Autowired JdbcTemplate jdbc;
  Http http;
  String tag;
  String point;
  String other;
  Instant day;

  @BeforeEach
  void plant() {
    http = Http.admin(port);
    day = Instant.now().truncatedTo(ChronoUnit.DAYS).minus(7, ChronoUnit.DAYS);
    tag = UUID.randomUUID().toString().substring(0, 8).toLowerCase(Locale.ROOT);
    point = "R" + tag + "-U2-CPD";
    other = "R" + tag + "-U1-CPD";
    String body =
        ("{\"id\":\"record-%s\",\"name\":\"Record test (fictional)\","
                + "\"blocks\":[{\"id\":\"U1\",\"name\":\"Unit 1\"},{\"id\":\"U2\",\"name\":\"Unit 2\"}],"
                + "\"samplePoints\":[%s,%s]}")
            .formatted(tag, samplePoint(point, "U2"), samplePoint(other, "U1"));
    HttpResponse<String> r = http.post("/api/v1/plants", "application/json", body);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(201);
  }

  private static String samplePoint(String id, String block) {
    return ("{\"id\":\"%s\",\"block\":\"%s\",\"name\":\"Condensate pump discharge\","
            + "\"cycleLocation\":\"CONDENSATE\",\"treatmentRegime\":\"AVT(O)\","
            + "\"operatingTemperatureCel\":40,\"operatingPressureMPa\":1.5}")
        .formatted(id, block);
  }

  /** The leak of last week at both points. */
  private void ingestLeak() {
    List<String> readings = new ArrayList<>();
    for (int m = 0; m <= 1080; m++) {
      String t = day.plusSeconds(60L * m).toString();
      for (String p : List.of(point, other)) {
        readings.add(
            String.format(
                Locale.ROOT,
                "{\"samplePoint\":\"%s\",\"parameter\":\"cation_conductivity\",\"time\":\"%s\","
                    + "\"value\":%s,\"unit\":\"uS/cm\"}",
                p,
                t,
                ExcursionsIT.condenserLeak(m)));
      }
    }
    HttpResponse<String> r =
        http.post(
            "/api/v1/readings",
            "application/json",
            "{\"readings\":[" + String.join(",", readings) + "]}");
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
  }

  private String window() {
    return "&from=" + day + "&to=" + day.plus(1, ChronoUnit.DAYS);
  }

  private HttpResponse<String> excursions(String samplePoint, String basis) {
    HttpResponse<String> r =
        http.get(
            "/api/v1/excursions?samplePoint="
                + samplePoint
                + "&parameter=cation_conductivity"
                + window()
                + (basis == null ? "" : "&basis=" + basis));
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    return r;
  }

  private HttpResponse<String> monthlyHours(String samplePoint, String basis) {
    HttpResponse<String> r =
        http.get(
            "/api/v1/excursions/monthly-hours?samplePoint="
                + samplePoint
                + "&parameter=cation_conductivity"
                + window()
                + (basis == null ? "" : "&basis=" + basis));
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    return r;
  }

  private HttpResponse<String> putLimits(Http as, String query) {
    return as.send(
        "PUT",
        "/api/v1/sample-points/" + point + "/limits/cation_conductivity" + query,
        "application/json",
        PLANT_LIMITS);
  }

  /**
   * The version of the shipped defaults this build brings: the test database is fresh, so its first
   * start recorded this version as the first activation, which covers every earlier time (V54).
   */
  private static final int DEFAULTS_VERSION_NOW = 4;

  private static JsonNode withoutVersion(JsonNode excursions) {
    tools.jackson.databind.node.ArrayNode out = JSON.createArrayNode();
    for (JsonNode e : excursions) {
      tools.jackson.databind.node.ObjectNode copy =
          ((tools.jackson.databind.node.ObjectNode) e).deepCopy();
      copy.remove("limitsVersion");
      copy.remove("limitsEffectiveFrom");
      out.add(copy);
    }
    return out;
  }

  private static String enc(String s) {
    return URLEncoder.encode(s, StandardCharsets.UTF_8);
  }

  @Test
  void aLimitChangedTodayLeavesLastWeekAsReportedAndChangesItAsRecomputed() {
    ingestLeak();
    String reported = excursions(point, null).body();
    String hoursReported = monthlyHours(point, null).body();
    String otherReported = excursions(other, "recomputed").body();
    JsonNode before = JSON.readTree(reported);
    assertThat(before).hasSize(1);
    assertThat(before.get(0).get("highestLevel").asString()).isEqualTo("AL3");
    assertThat(before.get(0).get("limitsOrigin").asString()).isEqualTo("DEFAULT");
    assertThat(before.get(0).get("limitsVersion").asInt()).isEqualTo(DEFAULTS_VERSION_NOW);
    assertThat(before.get(0).get("basis").asString()).isEqualTo("as-reported");
    // Before any change, today's limits judge last week as last week's did: both bases agree.
    // Today's
    // defaults are a later version (2, in force since this database's start) with the same values
    // for this point, so only the version and its start differ.
    JsonNode recomputedBefore = JSON.readTree(excursions(point, "recomputed").body());
    assertThat(recomputedBefore.get(0).get("limitsVersion").asInt())
        .isEqualTo(DEFAULTS_VERSION_NOW);
    assertThat(withoutVersion(recomputedBefore))
        .isEqualTo(withoutVersion(JSON.readTree(reported.replace("as-reported", "recomputed"))));

    JsonNode reportBefore = reportHours(null);

    HttpResponse<String> put = putLimits(http, "");
    assertThat(put.statusCode()).as(put.body()).isEqualTo(200);
    assertThat(JSON.readTree(put.body()).get("version").asInt()).isEqualTo(1);

    // The month's report: as reported, the action-level hours are those of before the change; as
    // recomputed, today's limits (AL1 only) judge the leak.
    JsonNode reportAfter = reportHours("as-reported");
    for (String level : List.of("AL1", "AL2", "AL3")) {
      assertThat(reportAfter.get(level).asDouble()).isEqualTo(reportBefore.get(level).asDouble());
    }
    assertThat(reportBefore.get("AL3").asDouble()).isPositive();
    JsonNode reportRecomputed = reportHours("recomputed");
    assertThat(reportRecomputed.get("AL3").asDouble()).isZero();
    assertThat(reportRecomputed.get("AL1").asDouble()).isPositive();

    // As reported: identical, excursion and hours.
    HttpResponse<String> after = excursions(point, null);
    assertThat(after.body()).isEqualTo(reported);
    assertThat(after.headers().firstValue("Kwanta-Basis")).contains("as-reported");
    assertThat(monthlyHours(point, "as-reported").body()).isEqualTo(hoursReported);

    // As recomputed: the new limits where they apply (this point and parameter) ...
    HttpResponse<String> recomputed = excursions(point, "recomputed");
    assertThat(recomputed.headers().firstValue("Kwanta-Basis")).contains("recomputed");
    JsonNode r = JSON.readTree(recomputed.body());
    assertThat(r).hasSize(1);
    assertThat(r.get(0).get("basis").asString()).isEqualTo("recomputed");
    assertThat(r.get(0).get("limitsOrigin").asString()).isEqualTo("OVERRIDE");
    assertThat(r.get(0).get("highestLevel").asString()).isEqualTo("AL1");
    assertThat(r.get(0).get("durationSeconds").asLong())
        .isLessThan(before.get(0).get("durationSeconds").asLong());
    JsonNode hours = JSON.readTree(monthlyHours(point, "recomputed").body());
    assertThat(hours.toString()).doesNotContain("AL3").contains("AL1");
    assertThat(JSON.readTree(hoursReported).toString()).contains("AL3");
    // ... and nowhere else: the other point's recomputed record has not moved.
    assertThat(excursions(other, "recomputed").body()).isEqualTo(otherReported);
  }

  /** The month's report (the month of the leak): the hours by level of the point's channel. */
  private JsonNode reportHours(String basis) {
    String month = day.toString().substring(0, 7);
    HttpResponse<String> r =
        http.get(
            "/api/v1/plants/record-"
                + tag
                + "/reports/monthly?month="
                + month
                + (basis == null ? "" : "&basis=" + basis));
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    JsonNode report = JSON.readTree(r.body());
    assertThat(report.get("basis").asString()).isEqualTo(basis == null ? "as-reported" : basis);
    for (JsonNode c : report.get("channels")) {
      if (c.get("samplePoint").asString().equals(point)
          && c.get("parameter").asString().equals("cation_conductivity")) {
        return c.get("hoursByLevel");
      }
    }
    throw new AssertionError("no channel of " + point + " in " + r.body());
  }

  @Test
  void aBackDatedChangeNeedsAReasonAndThenIsTheRecordFromThatTimeOn() {
    ingestLeak();
    String from = day.toString();
    HttpResponse<String> noReason = putLimits(http, "?effectiveFrom=" + enc(from));
    assertThat(noReason.statusCode()).as(noReason.body()).isEqualTo(400);
    assertThat(noReason.body()).contains("reason");

    HttpResponse<String> put =
        putLimits(
            http,
            "?effectiveFrom="
                + enc(from)
                + "&reason="
                + enc("Manual rev. 4 (fictional) was in force from that day"));
    assertThat(put.statusCode()).as(put.body()).isEqualTo(200);
    JsonNode e = JSON.readTree(excursions(point, null).body());
    assertThat(e.get(0).get("limitsOrigin").asString()).isEqualTo("OVERRIDE");
    assertThat(e.get(0).get("highestLevel").asString()).isEqualTo("AL1");

    JsonNode history =
        JSON.readTree(
            http.get("/api/v1/sample-points/" + point + "/limits/cation_conductivity/history")
                .body());
    assertThat(history.get("versions")).hasSize(1);
    assertThat(history.get("versions").get(0).get("reason").asString()).contains("rev. 4");
    assertThat(history.get("periods")).hasSize(2);
    assertThat(history.get("periods").get(0).get("limits").get("origin").asString())
        .isEqualTo("DEFAULT");
    assertThat(Instant.parse(history.get("periods").get(1).get("from").asString())).isEqualTo(day);

    // Withdrawn today: the past keeps the plant's limits, from now on the default applies.
    HttpResponse<String> delete =
        http.send(
            "DELETE",
            "/api/v1/sample-points/" + point + "/limits/cation_conductivity",
            "application/json",
            "");
    assertThat(delete.statusCode()).as(delete.body()).isEqualTo(200);
    assertThat(JSON.readTree(excursions(point, null).body()).get(0).get("highestLevel").asString())
        .isEqualTo("AL1");
    assertThat(
            JSON.readTree(excursions(point, "recomputed").body())
                .get(0)
                .get("highestLevel")
                .asString())
        .isEqualTo("AL3");
  }

  @Test
  void twoAcknowledgementsAreBothKeptInOrderWithTheKeysIdentity() {
    ingestLeak();
    String start = JSON.readTree(excursions(point, null).body()).get(0).get("start").asString();
    JsonNode second = createKey("Night shift chemist (fictional)", "admin");
    String ack =
        ("{\"samplePoint\":\"%s\",\"parameter\":\"cation_conductivity\",\"start\":\"%s\","
            + "\"note\":\"%s\"}");
    HttpResponse<String> first =
        http.post(
            "/api/v1/excursions/acknowledgements",
            "application/json",
            ack.formatted(point, start, "Tube leak in condenser half B."));
    assertThat(first.statusCode()).as(first.body()).isEqualTo(201);
    HttpResponse<String> again =
        http.withKey(second.get("key").asString())
            .post(
                "/api/v1/excursions/acknowledgements",
                "application/json",
                ack.formatted(point, start, "Half B plugged; back to normal 13:00."));
    assertThat(again.statusCode()).as(again.body()).isEqualTo(201);

    JsonNode e = JSON.readTree(excursions(point, null).body()).get(0);
    JsonNode acks = e.get("acknowledgements");
    assertThat(acks).hasSize(2);
    assertThat(acks.get(0).get("keyId").asString()).isEqualTo("testadmin");
    assertThat(acks.get(0).get("note").asString()).contains("half B");
    assertThat(acks.get(1).get("keyId").asString()).isEqualTo(second.get("id").asString());
    assertThat(acks.get(1).get("keyName").asString()).isEqualTo("Night shift chemist (fictional)");
    assertThat(Instant.parse(acks.get(1).get("at").asString()))
        .isAfterOrEqualTo(Instant.parse(acks.get(0).get("at").asString()));
    assertThat(e.get("acknowledgedBy").asString()).isEqualTo("Night shift chemist (fictional)");
    assertThat(e.get("acknowledgedByKeyId").asString()).isEqualTo(second.get("id").asString());
  }

  private JsonNode createKey(String name, String role) {
    HttpResponse<String> r =
        http.post(
            "/api/v1/keys",
            "application/json",
            "{\"name\":\"" + name + "\",\"role\":\"" + role + "\"}");
    assertThat(r.statusCode()).as(r.body()).isEqualTo(201);
    return JSON.readTree(r.body());
  }

  @Test
  void everyChangeOfAScriptedAdministrationHasOneAuditRow() {
    ingestLeak();
    Instant t0 = Instant.now().minusSeconds(1);
    JsonNode key = createKey("Record script " + tag + " (fictional)", "admin");
    String keyId = key.get("id").asString();
    Http script = http.withKey(key.get("key").asString());
    assertThat(putLimits(script, "").statusCode()).isEqualTo(200);
    assertThat(
            script
                .send(
                    "DELETE",
                    "/api/v1/sample-points/" + point + "/limits/cation_conductivity",
                    "application/json",
                    "")
                .statusCode())
        .isEqualTo(200);
    String changed = samplePoint(point, "U2").replace("AVT(O)", "AVT(R)");
    HttpResponse<String> sp =
        script.send("PUT", "/api/v1/sample-points/" + point, "application/json", changed);
    assertThat(sp.statusCode()).as(sp.body()).isEqualTo(200);
    String start = JSON.readTree(excursions(point, null).body()).get(0).get("start").asString();
    HttpResponse<String> ack =
        script.post(
            "/api/v1/excursions/acknowledgements",
            "application/json",
            ("{\"samplePoint\":\"%s\",\"parameter\":\"cation_conductivity\",\"start\":\"%s\","
                    + "\"note\":\"Seen.\"}")
                .formatted(point, start));
    assertThat(ack.statusCode()).as(ack.body()).isEqualTo(201);
    JsonNode reader = createKeyAs(script, "Record reader " + tag + " (fictional)", "read");
    assertThat(
            script
                .send("DELETE", "/api/v1/keys/" + reader.get("id").asString(), "", "")
                .statusCode())
        .isEqualTo(200);

    HttpResponse<String> r = http.get("/api/v1/audit?from=" + enc(t0.toString()));
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    List<String> actions = new ArrayList<>();
    for (JsonNode e : JSON.readTree(r.body())) {
      if (e.get("keyId").asString().equals(keyId)) {
        actions.add(e.get("action").asString() + " " + e.get("entityId").asString());
      }
    }
    String limits = point + "/cation_conductivity";
    assertThat(actions)
        .containsExactly(
            "limits.set " + limits,
            "limits.withdraw " + limits,
            "sample-point.update " + point,
            "acknowledgement.create " + limits + "/" + start,
            "api-key.create " + reader.get("id").asString(),
            "api-key.revoke " + reader.get("id").asString());

    // The script key's own creation, by the test admin key, with before and after.
    JsonNode created =
        JSON.readTree(http.get("/api/v1/audit?entity=api-key&entityId=" + keyId).body());
    assertThat(created).hasSize(1);
    assertThat(created.get(0).get("keyId").asString()).isEqualTo("testadmin");
    assertThat(created.get(0).get("before").isNull()).isTrue();
    assertThat(created.get(0).get("after").get("role").asString()).isEqualTo("admin");
    assertThat(created.get(0).toString()).doesNotContain(key.get("key").asString());

    JsonNode update =
        JSON.readTree(http.get("/api/v1/audit?entity=sample-point&entityId=" + point).body());
    JsonNode last = update.get(update.size() - 1);
    assertThat(last.get("before").get("treatmentRegime").asString()).isEqualTo("AVT(O)");
    assertThat(last.get("after").get("treatmentRegime").asString()).isEqualTo("AVT(R)");

    HttpResponse<String> csv =
        http.get("/api/v1/audit?format=csv&entity=limits&entityId=" + enc(limits));
    assertThat(csv.headers().firstValue("Content-Type").orElseThrow()).startsWith("text/csv");
    String[] lines = csv.body().split("\r\n");
    assertThat(lines[0])
        .isEqualTo("id,at,key_id,key_name,action,entity_type,entity_id,before,after");
    assertThat(lines).hasSize(3);

    // A read key does not see the audit log.
    assertThat(
            http.withKey(createKey("Record dashboard " + tag, "read").get("key").asString())
                .get("/api/v1/audit")
                .statusCode())
        .isEqualTo(403);
  }

  @Test
  void aChemistAcknowledgesAndSetsLimitsWithAReasonButManagesNoKeys() {
    ingestLeak();
    Http chemist =
        http.withKey(
            createKey("Day chemist " + tag + " (fictional)", "chemist").get("key").asString());
    HttpResponse<String> noReason = putLimits(chemist, "");
    assertThat(noReason.statusCode()).as(noReason.body()).isEqualTo(400);
    assertThat(noReason.body()).contains("reason");
    HttpResponse<String> past =
        putLimits(chemist, "?effectiveFrom=" + enc(day.toString()) + "&reason=" + enc("rev. 4"));
    assertThat(past.statusCode()).as(past.body()).isEqualTo(403);
    HttpResponse<String> now = putLimits(chemist, "?reason=" + enc("Manual rev. 5 (fictional)"));
    assertThat(now.statusCode()).as(now.body()).isEqualTo(200);

    String start = JSON.readTree(excursions(point, null).body()).get(0).get("start").asString();
    HttpResponse<String> ack =
        chemist.post(
            "/api/v1/excursions/acknowledgements",
            "application/json",
            ("{\"samplePoint\":\"%s\",\"parameter\":\"cation_conductivity\",\"start\":\"%s\","
                    + "\"note\":\"Seen by the day chemist.\"}")
                .formatted(point, start));
    assertThat(ack.statusCode()).as(ack.body()).isEqualTo(201);
    assertThat(chemist.get("/api/v1/audit?entity=limits").statusCode()).isEqualTo(200);
    assertThat(
            chemist
                .post("/api/v1/keys", "application/json", "{\"name\":\"x\",\"role\":\"admin\"}")
                .statusCode())
        .isEqualTo(403);
    assertThat(chemist.get("/api/v1/keys").statusCode()).isEqualTo(403);
  }

  @Test
  void anExcursionEventGroupsExcursionsAndKeepsEveryEntry() {
    ingestLeak();
    String a = JSON.readTree(excursions(point, null).body()).get(0).get("start").asString();
    String b = JSON.readTree(excursions(other, null).body()).get(0).get("start").asString();
    Http chemist =
        http.withKey(
            createKey("Event chemist " + tag + " (fictional)", "chemist").get("key").asString());
    String create =
        ("{\"title\":\"Both units: cation conductivity up (fictional)\","
                + "\"note\":\"Both condensate pumps at once.\",\"excursions\":["
                + "{\"samplePoint\":\"%s\",\"parameter\":\"cation_conductivity\",\"start\":\"%s\"}]}")
            .formatted(point, a);
    HttpResponse<String> created =
        chemist.post("/api/v1/excursion-events", "application/json", create);
    assertThat(created.statusCode()).as(created.body()).isEqualTo(201);
    JsonNode event = JSON.readTree(created.body());
    long id = event.get("id").asLong();
    assertThat(event.get("status").asString()).isEqualTo("OPEN");
    assertThat(event.get("causeCategory").asString()).isEqualTo("UNDETERMINED");

    HttpResponse<String> added =
        chemist.post(
            "/api/v1/excursion-events/" + id + "/excursions",
            "application/json",
            "{\"samplePoint\":\"%s\",\"parameter\":\"cation_conductivity\",\"start\":\"%s\"}"
                .formatted(other, b));
    assertThat(added.statusCode()).as(added.body()).isEqualTo(201);
    HttpResponse<String> investigating =
        chemist.post(
            "/api/v1/excursion-events/" + id + "/entries",
            "application/json",
            "{\"status\":\"UNDER_INVESTIGATION\",\"causeCategory\":\"CONDENSER_INGRESS\","
                + "\"note\":\"Sodium followed: cooling water.\"}");
    assertThat(investigating.statusCode()).as(investigating.body()).isEqualTo(201);
    HttpResponse<String> closed =
        http.post(
            "/api/v1/excursion-events/" + id + "/entries",
            "application/json",
            "{\"status\":\"CLOSED\",\"note\":\"Half B plugged.\"}");
    assertThat(closed.statusCode()).as(closed.body()).isEqualTo(201);

    JsonNode e = JSON.readTree(http.get("/api/v1/excursion-events/" + id).body());
    assertThat(e.get("status").asString()).isEqualTo("CLOSED");
    assertThat(e.get("causeCategory").asString()).isEqualTo("CONDENSER_INGRESS");
    assertThat(e.get("excursions")).hasSize(2);
    JsonNode entries = e.get("entries");
    assertThat(entries).hasSize(3);
    assertThat(entries.get(0).get("status").asString()).isEqualTo("OPEN");
    assertThat(entries.get(1).get("keyName").asString()).startsWith("Event chemist");
    assertThat(entries.get(2).get("keyId").asString()).isEqualTo("testadmin");

    HttpResponse<String> missing =
        chemist.post(
            "/api/v1/excursion-events/" + id + "/excursions",
            "application/json",
            "{\"samplePoint\":\"%s\",\"parameter\":\"cation_conductivity\",\"start\":\"%s\"}"
                .formatted(point, day));
    assertThat(missing.statusCode()).isEqualTo(404);
    JsonNode audit =
        JSON.readTree(http.get("/api/v1/audit?entity=excursion-event&entityId=" + id).body());
    assertThat(audit).hasSize(4);
    assertThatThrownBy(() -> jdbc.execute("UPDATE excursion_event_entry SET note = 'x'"))
        .isInstanceOf(DataAccessException.class)
        .rootCause()
        .hasMessageContaining("append-only");
  }

  private static JsonNode createKeyAs(Http as, String name, String role) {
    HttpResponse<String> r =
        as.post(
            "/api/v1/keys",
            "application/json",
            "{\"name\":\"" + name + "\",\"role\":\"" + role + "\"}");
    assertThat(r.statusCode()).as(r.body()).isEqualTo(201);
    return JSON.readTree(r.body());
  }

  @Test
  void theApplicationsDatabaseRoleCannotAlterTheRecord() {
    ingestLeak();
    assertThat(putLimits(http, "").statusCode()).isEqualTo(200);
    assertThat(jdbc.queryForObject("SELECT count(*) FROM audit_event", Long.class)).isPositive();
    for (String sql :
        List.of(
            "UPDATE audit_event SET key_id = 'someone-else'",
            "DELETE FROM audit_event",
            "TRUNCATE audit_event",
            "UPDATE limit_version SET limits = NULL",
            "DELETE FROM limit_version",
            "DELETE FROM limit_defaults_activation")) {
      assertThatThrownBy(() -> jdbc.execute(sql))
          .as(sql)
          .isInstanceOf(DataAccessException.class)
          .rootCause()
          .hasMessageContaining("append-only");
    }
    // The acknowledgement table is empty in a fresh database; a row makes its UPDATE fire.
    String start = JSON.readTree(excursions(point, null).body()).get(0).get("start").asString();
    http.post(
        "/api/v1/excursions/acknowledgements",
        "application/json",
        ("{\"samplePoint\":\"%s\",\"parameter\":\"cation_conductivity\",\"start\":\"%s\","
                + "\"note\":\"Seen.\"}")
            .formatted(point, start));
    assertThatThrownBy(
            () -> jdbc.execute("UPDATE excursion_acknowledgement SET note = 'rewritten'"))
        .isInstanceOf(DataAccessException.class)
        .rootCause()
        .hasMessageContaining("append-only");
    assertThatThrownBy(() -> jdbc.execute("DELETE FROM excursion_acknowledgement"))
        .isInstanceOf(DataAccessException.class)
        .rootCause()
        .hasMessageContaining("append-only");
  }

  /**
   * A plant of a type with a feedwater and a condensate point (AVT(O)); the ids end in -FW, -CPD.
   */
  private String plantOfType(String plantType) {
    String id = "type-" + UUID.randomUUID().toString().substring(0, 8);
    String fw =
        ("{\"id\":\"%s-FW\",\"block\":\"U1\",\"name\":\"Economizer inlet\","
                + "\"cycleLocation\":\"FEEDWATER\",\"treatmentRegime\":\"AVT(O)\","
                + "\"operatingTemperatureCel\":155,\"operatingPressureMPa\":15.0}")
            .formatted(id);
    String cpd =
        ("{\"id\":\"%s-CPD\",\"block\":\"U1\",\"name\":\"Condensate pump discharge\","
                + "\"cycleLocation\":\"CONDENSATE\",\"treatmentRegime\":\"AVT(O)\","
                + "\"operatingTemperatureCel\":40,\"operatingPressureMPa\":1.5}")
            .formatted(id);
    String body =
        ("{\"id\":\"%s\",\"name\":\"Plant type test (fictional)\",%s"
                + "\"blocks\":[{\"id\":\"U1\",\"name\":\"Unit 1\"}],\"samplePoints\":[%s,%s]}")
            .formatted(
                id, plantType == null ? "" : "\"plantType\":\"" + plantType + "\",", fw, cpd);
    HttpResponse<String> r = http.post("/api/v1/plants", "application/json", body);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(201);
    return id;
  }

  private JsonNode limitsNow(String samplePoint, String parameter) {
    HttpResponse<String> r = http.get("/api/v1/sample-points/" + samplePoint + "/limits");
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    for (JsonNode p : JSON.readTree(r.body())) {
      if (p.get("limits").get("parameter").asString().equals(parameter)) {
        return p;
      }
    }
    throw new AssertionError("no limits for " + parameter + " at " + samplePoint);
  }

  @Test
  void aPlantDeclaredHrsgGetsTheHrsgFeedwaterPhRangeAndAConventionalPlantDoesNot() {
    String hrsg = plantOfType("HRSG");
    String conventional = plantOfType(null);
    JsonNode h = limitsNow(hrsg + "-FW", "ph");
    assertThat(h.get("origin").asString()).isEqualTo("DEFAULT");
    assertThat(h.get("version").asInt()).isEqualTo(DEFAULTS_VERSION_NOW);
    assertThat(h.get("limits").get("normal").get("low").asDouble()).isEqualTo(9.6);
    assertThat(h.get("limits").get("normal").get("high").asDouble()).isEqualTo(10.0);
    assertThat(h.get("limits").get("normal").get("source").asString())
        .contains("HRSG")
        .contains("from memory — verify");
    JsonNode c = limitsNow(conventional + "-FW", "ph");
    assertThat(c.get("limits").get("normal").get("low").asDouble()).isEqualTo(9.2);
    assertThat(c.get("limits").get("normal").get("high").asDouble()).isEqualTo(9.6);
    assertThat(jdbc.queryForObject("SELECT plant_type FROM plant WHERE id = ?", String.class, hrsg))
        .isEqualTo("HRSG");
    assertThat(
            jdbc.queryForObject(
                "SELECT plant_type FROM plant WHERE id = ?", String.class, conventional))
        .isEqualTo("CONVENTIONAL_DRUM");

    // The history of a fresh database: this build's defaults from the beginning (an upgraded
    // database keeps the older version before the upgrade: DefaultsVersion3IT).
    JsonNode periods =
        JSON.readTree(http.get("/api/v1/sample-points/" + hrsg + "-FW/limits/ph/history").body())
            .get("periods");
    assertThat(periods).hasSize(1);
    assertThat(periods.get(0).get("limits").get("version").asInt()).isEqualTo(DEFAULTS_VERSION_NOW);
    assertThat(periods.get(0).get("limits").get("limits").get("normal").get("high").asDouble())
        .isEqualTo(10.0);
  }

  @Test
  void aBackfillIntoAFreshDatabaseIsJudgedByTheDefaultsOfItsFirstStart() {
    String hrsg = plantOfType("HRSG");
    String cpd = hrsg + "-CPD";
    // Last week, before this (fresh) test database's first start, an hour of condensate sodium at
    // 3 µg/kg: version 1 has no action levels for it, versions 2 to 4 put it at AL1 (> 2, from
    // memory — verify; the plant declares no sea or brackish cooling water, for which version 4 is
    // tighter). The first activation covers the backfill: reported as the board judges it.
    List<String> readings = new ArrayList<>();
    for (int m = 0; m <= 60; m++) {
      readings.add(
          "{\"samplePoint\":\"%s\",\"parameter\":\"sodium\",\"time\":\"%s\",\"value\":3,\"unit\":\"ug/kg\"}"
              .formatted(cpd, day.plusSeconds(3600L + 60L * m)));
    }
    HttpResponse<String> in =
        http.post(
            "/api/v1/readings",
            "application/json",
            "{\"readings\":[" + String.join(",", readings) + "]}");
    assertThat(in.statusCode()).as(in.body()).isEqualTo(200);
    String query = "/api/v1/excursions?samplePoint=" + cpd + "&parameter=sodium" + window();
    for (String basis : List.of("", "&basis=recomputed")) {
      HttpResponse<String> r = http.get(query + basis);
      assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
      JsonNode e = JSON.readTree(r.body());
      assertThat(e).as(basis).hasSize(1);
      assertThat(e.get(0).get("highestLevel").asString()).isEqualTo("AL1");
      assertThat(e.get(0).get("limitsVersion").asInt()).isEqualTo(DEFAULTS_VERSION_NOW);
    }
  }
}
