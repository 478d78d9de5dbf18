package org.kwanta.service.chemistry;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.net.http.HttpResponse;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.springframework.boot.test.web.server.LocalServerPort;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The chemistry speciation endpoints over HTTP. The engine's chemistry is checked in the model's
 * tests; here each chemistry number that crosses the API is checked once against its outside
 * source, named beside the check, and the rest is the contract (units, errors, CSV).
 */
@DatabaseTest
class SpeciationApiIT {

  private static final JsonMapper JSON = JsonMapper.builder().build();
  private static final String JSON_TYPE = "application/json";
  private static final String SPECIATION = "/api/v1/chemistry/speciation";
  private static final String CURVE = "/api/v1/chemistry/speciation/curve";
  private static final String AMMONIA_1_MG =
      "{\"component\": \"ammonia\", \"amount\": 1.0, \"unit\": \"mg/kg\"}";

  @LocalServerPort int port;
  Http http;

  @BeforeEach
  void client() {
    http = Http.admin(port);
  }

  private HttpResponse<String> post(String path, String body, String... headers) {
    return http.post(path, JSON_TYPE, body, headers);
  }

  private JsonNode ok(String path, String body) {
    HttpResponse<String> r = post(path, body);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    assertThat(r.headers().firstValue("Content-Type")).get().asString().contains(JSON_TYPE);
    return JSON.readTree(r.body());
  }

  private JsonNode problem(HttpResponse<String> r, int status, String type) {
    assertThat(r.statusCode()).as(r.body()).isEqualTo(status);
    assertThat(r.headers().firstValue("Content-Type"))
        .get()
        .asString()
        .contains("application/problem+json");
    JsonNode body = JSON.readTree(r.body());
    assertThat(body.get("type").asString()).isEqualTo(type);
    return body;
  }

  @Test
  void ammoniaOneMilligramPerKilogramGivesPh94At25Cel() {
    // 1 mg/kg NH3 gives pH25 ≈ 9.4: common practice, no source. Neutral pH at 25 °C 6.997-6.998:
    // CRC Handbook tabulation of IAPWS R11-07, pKw 13.995 at 25 °C, halved.
    JsonNode body =
        ok(SPECIATION, "{\"composition\": [" + AMMONIA_1_MG + "], \"temperatureCel\": 25}");
    JsonNode r = body.get("results").get(0);
    assertThat(r.get("phAtTemperature").get("ph").asDouble()).isCloseTo(9.4, within(0.05));
    assertThat(r.get("phAt25Cel").asDouble()).isCloseTo(9.4, within(0.05));
    assertThat(r.get("neutralPh").asDouble()).isBetween(6.997, 6.998);
    assertThat(r.get("pressureSource").asString()).isEqualTo("ATMOSPHERIC_FLOOR");
    assertThat(r.get("pressureMPa").asDouble()).isEqualTo(0.101325);
    // Contract: the total as given and as the molality used (Amounts, NH3 17.031 g/mol).
    JsonNode total = body.get("composition").get(0);
    assertThat(total.get("countedAs").asString()).isEqualTo("NH3");
    assertThat(total.get("unit").asString()).isEqualTo("mg/kg");
    assertThat(total.get("molalityMolPerKg").asDouble())
        .isCloseTo(1.0 / 1000 / 17.031, within(1e-12));
    assertThat(body.get("activityModel").asString()).isEqualTo("davies");
    assertThat(body.get("constantSet").asString()).isEqualTo("default");
    assertThat(body.get("pKwFormulation").asString()).isEqualTo("IAPWS R11-07");
  }

  @Test
  void neutralPhAt300CelMatchesCrcTabulation() {
    // CRC Handbook tabulation of IAPWS R11-07, saturation: pKw 11.339 at 300 °C, neutral pH 5.67.
    JsonNode r =
        ok(SPECIATION, "{\"composition\": [" + AMMONIA_1_MG + "], \"temperatureCel\": 300}")
            .get("results")
            .get(0);
    assertThat(r.get("pKw").asDouble()).isBetween(11.3385, 11.3395);
    assertThat(r.get("neutralPh").asDouble()).isBetween(5.669, 5.670);
    assertThat(r.get("pressureSource").asString()).isEqualTo("SATURATION");
    // Contract: pH − neutral is the difference of the two fields; the 25 °C pH of the same water
    // (common practice, no source: ≈ 9.4) comes with the result at temperature.
    assertThat(r.get("phMinusNeutral").asDouble())
        .isCloseTo(
            r.get("phAtTemperature").get("ph").asDouble() - r.get("neutralPh").asDouble(),
            within(1e-12));
    assertThat(r.get("phAt25Cel").asDouble()).isCloseTo(9.4, within(0.05));
    // Contract: the band holds the main result and names its sets (one shape of phAtTemperature,
    // docs/names.md).
    JsonNode band = r.get("phAtTemperature");
    assertThat(band.get("low").asDouble()).isLessThanOrEqualTo(band.get("ph").asDouble());
    assertThat(band.get("high").asDouble()).isGreaterThanOrEqualTo(band.get("ph").asDouble());
    assertThat(band.get("bandFrom").asString()).isEqualTo("CONSTANT_SETS");
    assertThat(band.get("lowConstantSet").asString()).isNotBlank();
    assertThat(band.get("highConstantSet").asString()).isNotBlank();
    assertThat(band.get("members").size()).isGreaterThan(1);
    assertThat(r.get("ionicStrengthMolPerKg").asDouble()).isPositive();
  }

  @Test
  void sodiumHydroxideMatchesAstmD5128Table1InMicromolesPerKilogram() {
    // ASTM D5128 (on-line pH of low-conductivity water) Table 1 (retrieved): 1.0 mg/L NaOH, pH 9.40
    // at
    // 25 °C. 1.0 mg/L / 39.997 g/mol / 0.99705 kg/L (water at 25 °C) = 25.08 µmol/kg of Na.
    JsonNode r =
        ok(
                SPECIATION,
                "{\"composition\": [{\"component\": \"sodium\", \"amount\": 25.08, \"unit\":"
                    + " \"umol/kg\"}], \"temperatureCel\": 25}")
            .get("results")
            .get(0);
    assertThat(r.get("phAtTemperature").get("ph").asDouble()).isCloseTo(9.40, within(0.02));
  }

  @Test
  void everySpeciesAndConstantIsListedWithSourceAndExtrapolationFlag() {
    // The default NH4+ fit (llnl.dat, cited in the response) is stated to 300 °C, so at 330 °C
    // (Brackenmoor HP drum) it is extrapolated and the result says so.
    JsonNode r =
        ok(
                SPECIATION,
                """
                {"composition": [
                  {"component": "ammonia", "amount": 0.8, "unit": "mg/kg"},
                  {"component": "chloride", "amount": 5, "unit": "ug/kg"},
                  {"component": "sulfate", "amount": 4, "unit": "ug/kg"}],
                 "temperatureCel": 330}""")
            .get("results")
            .get(0);
    List<String> species = new ArrayList<>();
    r.get("species")
        .forEach(s -> species.add(s.get("formula").asString() + " " + s.get("chargeNumber")));
    assertThat(species).containsExactly("NH4 1", "NH3 0", "Cl -1", "HSO4 -1", "SO4 -2");
    double ammoniaFractions = 0;
    for (JsonNode s : r.get("species")) {
      assertThat(s.get("molalityMolPerKg").asDouble()).isNotNegative();
      if (s.get("component").asString().equals("ammonia")) {
        ammoniaFractions += s.get("fractionOfComponent").asDouble();
      }
    }
    assertThat(ammoniaFractions).isCloseTo(1.0, within(1e-12));
    JsonNode ammonium = r.get("constants").get(0);
    assertThat(ammonium.get("equilibrium").asString()).isEqualTo("ammonium");
    assertThat(ammonium.get("reaction").asString()).isEqualTo("NH₄⁺ ⇌ NH₃ + H⁺");
    assertThat(ammonium.get("sourceId").asString()).isEqualTo("ammonium-1");
    assertThat(ammonium.get("citation").asString()).contains("llnl.dat");
    assertThat(ammonium.get("confidence").asString()).isEqualTo("RETRIEVED");
    assertThat(ammonium.get("validToCel").asDouble()).isEqualTo(300.0);
    assertThat(ammonium.get("extrapolated").asBoolean()).isTrue();
    assertThat(r.get("constants").size()).isEqualTo(2); // NH4+ and HSO4-; chloride has none
    List<String> notices = new ArrayList<>();
    r.get("notices").forEach(n -> notices.add(n.get("code").asString()));
    assertThat(notices).containsExactly("EXTRAPOLATED_CONSTANT");
  }

  @Test
  void unitsAreInterchangeable() {
    // Contract: 1 mg/kg NH3 and the same amount in mmol/kg give the same pH.
    String mmol =
        "{\"component\": \"ammonia\", \"amount\": " + (1.0 / 17.031) + ", \"unit\": \"mmol/kg\"}";
    double a =
        ok(SPECIATION, "{\"composition\": [" + AMMONIA_1_MG + "], \"temperatureCel\": 200}")
            .get("results")
            .get(0)
            .get("phAtTemperature")
            .get("ph")
            .asDouble();
    double b =
        ok(SPECIATION, "{\"composition\": [" + mmol + "], \"temperatureCel\": 200}")
            .get("results")
            .get(0)
            .get("phAtTemperature")
            .get("ph")
            .asDouble();
    assertThat(b).isCloseTo(a, within(1e-9));
  }

  @Test
  void severalTemperaturesGivePressureOptionsAndNotices() {
    JsonNode body =
        ok(
            SPECIATION,
            "{\"composition\": ["
                + AMMONIA_1_MG
                + "], \"temperaturesCel\": [25, 155, 230, 300], \"pressureMPa\": 15,"
                + " \"activityModel\": \"bdot\", \"sampleOrigin\": \"condensed_steam\","
                + " \"constantSet\": \"ammonium-2\", \"ionization\": \"R11-24\"}");
    assertThat(body.get("activityModel").asString()).isEqualTo("bdot");
    assertThat(body.get("sampleOrigin").asString()).isEqualTo("condensed_steam");
    assertThat(body.get("constantSet").asString()).isEqualTo("ammonium-2");
    assertThat(body.get("pKwFormulation").asString()).isEqualTo("IAPWS R11-24");
    JsonNode results = body.get("results");
    assertThat(results.size()).isEqualTo(4);
    assertThat(results.get(2).get("temperatureCel").asDouble()).isCloseTo(230, within(1e-9));
    assertThat(results.get(3).get("pressureMPa").asDouble()).isEqualTo(15.0);
    assertThat(results.get(3).get("pressureSource").asString()).isEqualTo("GIVEN");
    assertThat(results.get(3).get("notices").get(0).get("code").asString())
        .isEqualTo("CONDENSED_LIQUID_AT_STATED_TEMPERATURE");
  }

  @Test
  void unknownComponentIs400ListingKnownComponents() {
    JsonNode p =
        problem(
            post(
                SPECIATION,
                "{\"composition\": [{\"component\": \"unobtainium\", \"amount\": 1, \"unit\":"
                    + " \"mg/kg\"}], \"temperatureCel\": 300}"),
            400,
            "urn:kwanta:problem:bad-request");
    assertThat(p.get("detail").asString()).contains("unobtainium");
    List<String> known = new ArrayList<>();
    p.get("knownComponents").forEach(n -> known.add(n.asString()));
    assertThat(known).contains("ammonia", "chloride", "carbon_dioxide", "phosphate");
  }

  @Test
  void badUnitIs400ListingUcumCodes() {
    JsonNode p =
        problem(
            post(
                SPECIATION,
                "{\"composition\": [{\"component\": \"ammonia\", \"amount\": 1, \"unit\":"
                    + " \"ppm\"}], \"temperatureCel\": 300}"),
            400,
            "urn:kwanta:problem:bad-request");
    List<String> known = new ArrayList<>();
    p.get("knownUnits").forEach(n -> known.add(n.asString()));
    assertThat(known).containsExactly("mg/kg", "ug/kg", "mol/kg", "mmol/kg", "umol/kg");
  }

  @Test
  void unknownFieldsAndMalformedRequestsAre400() {
    JsonNode p =
        problem(
            post(SPECIATION, "{\"composition\": [" + AMMONIA_1_MG + "], \"temperatureC\": 300}"),
            400,
            "urn:kwanta:problem:bad-request");
    assertThat(p.get("field").asString()).isEqualTo("temperatureC");
    JsonNode nested =
        problem(
            post(
                SPECIATION,
                "{\"composition\": [{\"component\": \"ammonia\", \"amount\": 1, \"unit\":"
                    + " \"mg/kg\", \"as\": \"N\"}], \"temperatureCel\": 300}"),
            400,
            "urn:kwanta:problem:bad-request");
    assertThat(nested.get("field").asString()).isEqualTo("composition[0].as");
    String bad = "urn:kwanta:problem:bad-request";
    problem(post(SPECIATION, "{not json"), 400, bad);
    problem(post(SPECIATION, ""), 400, bad);
    problem(post(SPECIATION, "{\"composition\": [" + AMMONIA_1_MG + "]}"), 400, bad);
    problem(
        post(
            SPECIATION,
            "{\"composition\": ["
                + AMMONIA_1_MG
                + "], \"temperatureCel\": 300, \"temperaturesCel\": [300]}"),
        400,
        bad);
    problem(post(SPECIATION, "{\"temperatureCel\": 300}"), 400, bad);
    problem(
        post(
            SPECIATION,
            "{\"composition\": ["
                + AMMONIA_1_MG
                + ","
                + AMMONIA_1_MG
                + "], \"temperatureCel\": 300}"),
        400,
        bad);
    problem(
        post(SPECIATION, "{\"composition\": [" + AMMONIA_1_MG + "], \"temperatureCel\": \"hot\"}"),
        400,
        bad);
    JsonNode set =
        problem(
            post(
                SPECIATION,
                "{\"composition\": ["
                    + AMMONIA_1_MG
                    + "], \"temperatureCel\": 300,"
                    + " \"constantSet\": \"nope\"}"),
            400,
            bad);
    assertThat(set.get("knownConstantSets").toString()).contains("default");
    problem(
        post(
            SPECIATION,
            "{\"composition\": ["
                + AMMONIA_1_MG
                + "], \"temperatureCel\": 300,"
                + " \"activityModel\": \"pitzer\"}"),
        400,
        bad);
    problem(
        http.post(SPECIATION, "text/plain", "ammonia 1 mg/kg"),
        415,
        "urn:kwanta:problem:unsupported-media-type");
    problem(http.get(SPECIATION), 405, "urn:kwanta:problem:method-not-allowed");
    problem(post("/api/v1/chemistry/nothing-here", "{}"), 404, "urn:kwanta:problem:not-found");
  }

  @Test
  void temperatureAbove350CelIs422NamingTheLimit() {
    JsonNode p =
        problem(
            post(SPECIATION, "{\"composition\": [" + AMMONIA_1_MG + "], \"temperatureCel\": 360}"),
            422,
            "urn:kwanta:problem:out-of-validity-range");
    assertThat(p.get("limit").get("quantity").asString()).isEqualTo("temperature");
    assertThat(p.get("limit").get("max").asDouble()).isEqualTo(623.15);
    assertThat(p.get("limit").get("unit").asString()).isEqualTo("K");
  }

  @Test
  void amountAbove01MolPerKgIs422NamingTheLimit() {
    JsonNode p =
        problem(
            post(
                SPECIATION,
                "{\"composition\": [{\"component\": \"sodium\", \"amount\": 0.2, \"unit\":"
                    + " \"mol/kg\"}], \"temperatureCel\": 25}"),
            422,
            "urn:kwanta:problem:out-of-validity-range");
    assertThat(p.get("limit").get("quantity").asString()).isEqualTo("total molality of sodium");
    assertThat(p.get("limit").get("max").asDouble()).isEqualTo(0.1);
    assertThat(p.get("limit").get("unit").asString()).isEqualTo("mol/kg");
    problem(
        post(
            SPECIATION,
            "{\"composition\": [{\"component\": \"sodium\", \"amount\": -1, \"unit\":"
                + " \"mg/kg\"}], \"temperatureCel\": 25}"),
        422,
        "urn:kwanta:problem:out-of-validity-range");
  }

  /**
   * Each total within 0.1 mol/kg, yet the solution's ionic strength is ≈ 0.29 mol/kg (½ Σ m z²,
   * arithmetic on invented totals): a 422 naming the activity model's limit on the total ionic
   * strength (Kwanta's limit; Davies customarily adequate to about 0.1 mol/kg, common practice).
   */
  @Test
  void totalIonicStrengthAboveTheLimitIs422() {
    JsonNode p =
        problem(
            post(
                SPECIATION,
                "{\"composition\": ["
                    + "{\"component\": \"sodium\", \"amount\": 0.09, \"unit\": \"mol/kg\"},"
                    + "{\"component\": \"chloride\", \"amount\": 0.01, \"unit\": \"mol/kg\"},"
                    + "{\"component\": \"sulfate\", \"amount\": 0.04, \"unit\": \"mol/kg\"},"
                    + "{\"component\": \"lithium\", \"amount\": 0.08, \"unit\": \"mol/kg\"},"
                    + "{\"component\": \"potassium\", \"amount\": 0.01, \"unit\": \"mol/kg\"}"
                    + "], \"temperatureCel\": 25}"),
            422,
            "urn:kwanta:problem:out-of-validity-range");
    assertThat(p.get("limit").get("quantity").asString()).isEqualTo("ionic strength");
    assertThat(p.get("limit").get("max").asDouble()).isEqualTo(0.1);
    assertThat(p.get("limit").get("unit").asString()).isEqualTo("mol/kg");
    assertThat(p.toString()).doesNotContain("NaN");
  }

  /**
   * Sodium chloride water at 300 °C: the ion pairs are listed with source, range and confidence
   * (llnl.dat NaOH° and NaCl°), NaCl° appears among the species, and {@code ionAssociation: false}
   * leaves them out. Boron at 25 °C: the polyborates are flagged as extrapolated beyond Mesmer
   * 1972's 50-200 °C fit.
   */
  @Test
  void ionPairsAndPolyboratesAreListedWithTheirSources() {
    String salt =
        "{\"component\": \"sodium\", \"amount\": 1, \"unit\": \"mmol/kg\"},"
            + "{\"component\": \"chloride\", \"amount\": 1, \"unit\": \"mmol/kg\"}";
    JsonNode r =
        ok(SPECIATION, "{\"composition\": [" + salt + "], \"temperatureCel\": 300}")
            .get("results")
            .get(0);
    JsonNode a = r.get("associations");
    assertThat(a.size()).isEqualTo(2);
    assertThat(a.get(1).get("association").asString()).isEqualTo("sodium_chloride");
    assertThat(a.get(1).get("citation").asString()).contains("llnl.dat");
    assertThat(a.get(1).get("validToCel").asDouble()).isEqualTo(300);
    assertThat(a.get(1).get("extrapolated").asBoolean()).isFalse();
    assertThat(r.get("species").toString()).contains("sodium_chloride_pair");
    JsonNode off =
        ok(
                SPECIATION,
                "{\"composition\": ["
                    + salt
                    + "], \"temperatureCel\": 300, \"ionAssociation\": false}")
            .get("results")
            .get(0);
    assertThat(off.get("associations").size()).isZero();
    assertThat(off.get("species").toString()).doesNotContain("_pair");
    JsonNode boron =
        ok(
                SPECIATION,
                "{\"composition\": [{\"component\": \"boron\", \"amount\": 1000, \"unit\":"
                    + " \"mg/kg\"}], \"temperatureCel\": 25}")
            .get("results")
            .get(0);
    assertThat(boron.get("notices").toString()).contains("EXTRAPOLATED_ASSOCIATION_CONSTANT");
    assertThat(boron.toString()).doesNotContain("NaN");
  }

  @Test
  void steamPressureAndBdotOutsideItsRangeAre422() {
    // 5 MPa is below the saturation pressure at 300 °C (8.59 MPa, IAPWS-IF97): steam.
    JsonNode p =
        problem(
            post(
                SPECIATION,
                "{\"composition\": ["
                    + AMMONIA_1_MG
                    + "], \"temperatureCel\": 300,"
                    + " \"pressureMPa\": 5}"),
            422,
            "urn:kwanta:problem:out-of-validity-range");
    assertThat(p.get("limit").get("unit").asString()).isEqualTo("MPa");
    assertThat(p.get("limit").get("min").asDouble()).isCloseTo(8.5877, within(0.001));
    JsonNode b =
        problem(
            post(
                SPECIATION,
                "{\"composition\": ["
                    + AMMONIA_1_MG
                    + "], \"temperatureCel\": 330,"
                    + " \"activityModel\": \"bdot\"}"),
            422,
            "urn:kwanta:problem:out-of-validity-range");
    assertThat(b.get("limit").get("max").asDouble()).isEqualTo(573.15);
  }

  @Test
  void curveAsCsvHasUnitsInTheHeaderAndCrcNeutralPhAt300Cel() {
    String body =
        "{\"composition\": ["
            + AMMONIA_1_MG
            + "], \"fromCel\": 25, \"toCel\": 330, \"stepCel\": 5}";
    HttpResponse<String> r = post(CURVE, body, "Accept", "text/csv");
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    assertThat(r.headers().firstValue("Content-Type")).get().asString().startsWith("text/csv");
    String[] lines = r.body().split("\r\n");
    assertThat(lines[0]).isEqualTo(SpeciationCsv.HEADER);
    assertThat(lines).hasSize(1 + 62); // 25, 30, ..., 330 °C
    String[] at300 = null;
    for (String line : lines) {
      if (line.startsWith("300.0000,")) {
        at300 = line.split(",");
      }
    }
    assertThat(at300).isNotNull();
    // CRC Handbook tabulation of IAPWS R11-07, saturation: neutral pH 5.67 at 300 °C.
    assertThat(Double.parseDouble(at300[4])).isBetween(5.669, 5.670);
    double ph = Double.parseDouble(at300[3]);
    assertThat(Double.parseDouble(at300[8])).isLessThanOrEqualTo(ph);
    assertThat(Double.parseDouble(at300[9])).isGreaterThanOrEqualTo(ph);
    // 1 mg/kg NH3 gives pH25 ≈ 9.4: common practice, no source.
    assertThat(Double.parseDouble(at300[13])).isCloseTo(9.4, within(0.05));

    HttpResponse<String> viaParam = post(CURVE + "?format=csv", body);
    assertThat(viaParam.statusCode()).isEqualTo(200);
    assertThat(viaParam.body()).isEqualTo(r.body());
  }

  @Test
  void curveAsJsonAndItsBounds() {
    JsonNode c =
        ok(
            CURVE,
            "{\"composition\": ["
                + AMMONIA_1_MG
                + "], \"fromCel\": 150, \"toCel\": 330, \"stepCel\": 30, \"pressureMPa\": 15}");
    assertThat(c.get("rows").size()).isEqualTo(7);
    assertThat(c.get("rows").get(6).get("temperatureCel").asDouble()).isCloseTo(330, within(1e-9));
    assertThat(c.get("rows").get(6).get("extrapolatedConstant").asBoolean()).isTrue();
    assertThat(c.get("phAt25Cel").asDouble()).isCloseTo(9.4, within(0.05)); // common practice

    String bad = "urn:kwanta:problem:bad-request";
    problem(
        post(
            CURVE,
            "{\"composition\": ["
                + AMMONIA_1_MG
                + "], \"fromCel\": 0, \"toCel\": 350,"
                + " \"stepCel\": 0.1}"),
        400,
        bad);
    problem(
        post(
            CURVE,
            "{\"composition\": ["
                + AMMONIA_1_MG
                + "], \"fromCel\": 100, \"toCel\": 50,"
                + " \"stepCel\": 5}"),
        400,
        bad);
    problem(
        post(
            CURVE + "?format=xml",
            "{\"composition\": ["
                + AMMONIA_1_MG
                + "], \"fromCel\": 25, \"toCel\": 50,"
                + " \"stepCel\": 5}"),
        400,
        bad);
    problem(
        post(
            CURVE,
            "{\"composition\": ["
                + AMMONIA_1_MG
                + "], \"fromCel\": 25, \"toCel\": 400,"
                + " \"stepCel\": 5}"),
        422,
        "urn:kwanta:problem:out-of-validity-range");
    // An error for a CSV request is still problem+json.
    problem(
        post(
            CURVE,
            "{\"composition\": ["
                + AMMONIA_1_MG
                + "], \"fromCel\": 25, \"toCel\": 400,"
                + " \"stepCel\": 5}",
            "Accept",
            "text/csv"),
        422,
        "urn:kwanta:problem:out-of-validity-range");
  }

  @Test
  void openApiDocumentsBothOperationsWithTheAdvisoryCaution() {
    HttpResponse<String> r = http.get("/v3/api-docs");
    assertThat(r.statusCode()).isEqualTo(200);
    JsonNode paths = JSON.readTree(r.body()).get("paths");
    JsonNode op = paths.get(SPECIATION).get("post");
    assertThat(op.get("description").asString()).contains("Advisory");
    assertThat(op.get("requestBody").get("content").get(JSON_TYPE).get("examples").toString())
        .contains("Brackenmoor");
    assertThat(
            paths.get(CURVE).get("post").get("responses").get("200").get("content").has("text/csv"))
        .isTrue();
  }
}
