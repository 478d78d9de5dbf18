package org.kwanta.service.reports;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.UUID;
import java.util.logging.Level;
import org.junit.jupiter.api.Test;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Http;
import org.kwanta.service.support.TestKeys;
import org.openqa.selenium.By;
import org.openqa.selenium.JavascriptExecutor;
import org.openqa.selenium.OutputType;
import org.openqa.selenium.TakesScreenshot;
import org.openqa.selenium.chrome.ChromeDriver;
import org.openqa.selenium.chrome.ChromeDriverService;
import org.openqa.selenium.chrome.ChromeOptions;
import org.openqa.selenium.logging.LogEntry;
import org.openqa.selenium.logging.LogType;
import org.openqa.selenium.logging.LoggingPreferences;
import org.openqa.selenium.support.ui.WebDriverWait;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.test.context.TestPropertySource;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The monthly report of a scripted month (April 2026, 30 days = 720 h) of an invented plant,
 * against figures computed by hand. The readings are invented; the levels they cross are the
 * shipped example limits for condensate cation conductivity (AL1 &gt; 0.2, AL2 &gt; 0.35 µS/cm,
 * recalled from IAPWS TGD3-10, from memory — verify). The past horizon of the ingest is widened so
 * that the fixed month stays acceptable in later years.
 *
 * <p>The script, block U1:
 *
 * <pre>
 *   states:   04-01 00:00 IN_SERVICE, 04-10 00:00 SHUT_DOWN, 04-12 00:00 START_UP,
 *             04-12 12:00 IN_SERVICE (to the end of the month)
 *   readings: condensate cation conductivity every 15 min, 0.08 µS/cm, except
 *             04-05 00:00–06:00 quality "bad" (24 readings, value 0.08)
 *             04-10 00:00–04-12 00:00 none (shut down)
 *             04-12 00:00–12:00 0.50 (AL2, during start-up)
 *             04-15 00:00–04:00 none (16 slots without data)
 *             04-20 06:00–10:00 0.30 (AL1)
 *             04-25 00:00–02:00 0.50 (AL2)
 * </pre>
 *
 * <p>By hand:
 *
 * <pre>
 *   in service   = (04-10 − 04-01) + (05-01 − 04-12 12:00) = 216 h + 444 h = 660 h
 *   shut down    = 48 h; start-up = 12 h; 660 + 48 + 12 = 720 h
 *   hours in service per level: AL1 4 h, AL2 2 h (the 12 h of AL2 in start-up do not count),
 *                 NORMAL 660 − 6 = 654 h
 *   slots (15 min) in service = 660 × 4 = 2640
 *   slots with data  = 2640 − 16 (the gap)               = 2624 → completeness 2624/2640 = 0.993939…
 *   slots good       = 2624 − 24 (bad quality)           = 2600 → availability 2600/2640 = 0.984848…
 *   penalty P = (0.25 × 4 + 0.5 × 2) / 660 = 2/660 = 0.0030303…
 *   S = 1 − P = 658/660 = 0.9969697…;  A = 2600/2640 = 650/660 = 0.9848485…
 *   index = 100 × (0.8 × 658 + 0.2 × 650) / 660 = 100 × 656.4 / 660 = 99.454545…
 * </pre>
 *
 * Calibration: a cell constant check (PASSED) and a resin change (ADJUSTED) on 04-03, intervals
 * P180D and P30D (the shipped example defaults): at the end of the month both IN_DATE, next due
 * 2026-09-30T09:00Z and 2026-05-03T09:30Z. One excursion event (the in-service AL2 excursion),
 * closed, cause CONDENSER_INGRESS.
 */
@DatabaseTest
@TestPropertySource(properties = "kwanta.ingest.past-horizon=P3650D")
class MonthlyReportIT {

  private static final Logger log = LoggerFactory.getLogger(MonthlyReportIT.class);
  private static final JsonMapper JSON = JsonMapper.builder().build();
  private static final double EXACT = 1e-9;

  @LocalServerPort int port;

  private static Instant t(String s) {
    return Instant.parse("2026-" + s + ":00Z");
  }

  @Test
  void reportOfAScriptedMonthMatchesTheHandComputation() {
    Http http = Http.admin(port);
    String tag = UUID.randomUUID().toString().substring(0, 8).toLowerCase(Locale.ROOT);
    String plant = "report-" + tag;
    String cpd = "M" + tag + "-CPD";
    String body =
        ("{\"id\":\"%s\",\"name\":\"Report test (fictional)\","
                + "\"blocks\":[{\"id\":\"U1\",\"name\":\"Unit 1\"}],\"samplePoints\":["
                + "{\"id\":\"%s\",\"block\":\"U1\",\"name\":\"Condensate pump discharge\","
                + "\"cycleLocation\":\"CONDENSATE\",\"treatmentRegime\":\"AVT(O)\","
                + "\"operatingTemperatureCel\":40,\"operatingPressureMPa\":1.5,"
                + "\"parameters\":[\"cation_conductivity\"]}]}")
            .formatted(plant, cpd);
    assertThat(http.post("/api/v1/plants", "application/json", body).statusCode()).isEqualTo(201);

    for (String[] s :
        List.of(
            new String[] {"IN_SERVICE", "04-01T00:00"},
            new String[] {"SHUT_DOWN", "04-10T00:00"},
            new String[] {"START_UP", "04-12T00:00"},
            new String[] {"IN_SERVICE", "04-12T12:00"})) {
      HttpResponse<String> r =
          http.post(
              "/api/v1/plants/" + plant + "/blocks/U1/operating-states",
              "application/json",
              "{\"state\":\"%s\",\"since\":\"%s\"}".formatted(s[0], t(s[1])));
      assertThat(r.statusCode()).as(r.body()).isEqualTo(201);
    }

    List<String> readings = new ArrayList<>();
    for (Instant at = t("04-01T00:00"); at.isBefore(t("05-01T00:00")); at = at.plusSeconds(900)) {
      boolean shutDown = !at.isBefore(t("04-10T00:00")) && at.isBefore(t("04-12T00:00"));
      boolean gap = !at.isBefore(t("04-15T00:00")) && at.isBefore(t("04-15T04:00"));
      if (shutDown || gap) {
        continue;
      }
      double value = 0.08;
      if (!at.isBefore(t("04-12T00:00")) && at.isBefore(t("04-12T12:00"))) {
        value = 0.50;
      } else if (!at.isBefore(t("04-20T06:00")) && at.isBefore(t("04-20T10:00"))) {
        value = 0.30;
      } else if (!at.isBefore(t("04-25T00:00")) && at.isBefore(t("04-25T02:00"))) {
        value = 0.50;
      }
      boolean bad = !at.isBefore(t("04-05T00:00")) && at.isBefore(t("04-05T06:00"));
      readings.add(
          String.format(
              Locale.ROOT,
              "{\"samplePoint\":\"%s\",\"parameter\":\"cation_conductivity\",\"time\":\"%s\","
                  + "\"value\":%s,\"unit\":\"uS/cm\"%s}",
              cpd,
              at,
              value,
              bad ? ",\"quality\":\"bad\"" : ""));
    }
    HttpResponse<String> ingest =
        http.post(
            "/api/v1/readings",
            "application/json",
            "{\"readings\":[" + String.join(",", readings) + "]}");
    assertThat(ingest.statusCode()).as(ingest.body()).isEqualTo(200);

    check(
        http,
        cpd,
        "CELL_CONSTANT_CHECK",
        "04-03T09:00",
        "PASSED",
        "[{\"name\":\"cell constant\",\"value\":0.0101,\"unit\":\"cm-1\",\"reference\":0.0100}]");
    check(http, cpd, "CATION_RESIN_CHANGE", "04-03T09:30", "ADJUSTED", "[]");

    HttpResponse<String> event =
        http.post(
            "/api/v1/excursion-events",
            "application/json",
            ("{\"title\":\"Condensate cation conductivity rise\",\"causeCategory\":\"CONDENSER_INGRESS\","
                    + "\"note\":\"tube leak found and plugged (fictional)\",\"excursions\":[{"
                    + "\"samplePoint\":\"%s\",\"parameter\":\"cation_conductivity\",\"start\":\"%s\"}]}")
                .formatted(cpd, t("04-25T00:00")));
    assertThat(event.statusCode()).as(event.body()).isEqualTo(201);
    long eventId = JSON.readTree(event.body()).get("id").asLong();
    HttpResponse<String> closed =
        http.post(
            "/api/v1/excursion-events/" + eventId + "/entries",
            "application/json",
            "{\"status\":\"CLOSED\",\"note\":\"closed after the repair\"}");
    assertThat(closed.statusCode()).as(closed.body()).isEqualTo(201);

    HttpResponse<String> r = http.get("/api/v1/plants/" + plant + "/reports/monthly?month=2026-04");
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    log.info("Scripted month report: {}", r.body());
    JsonNode report = JSON.readTree(r.body());

    JsonNode block = report.get("blocks").get(0);
    assertThat(block.get("hoursInService").asDouble()).isCloseTo(660, within(EXACT));
    assertThat(block.get("hoursUnrecorded").asDouble()).isZero();
    assertThat(block.get("hoursByState").get("SHUT_DOWN").asDouble()).isCloseTo(48, within(EXACT));
    assertThat(block.get("hoursByState").get("START_UP").asDouble()).isCloseTo(12, within(EXACT));

    assertThat(report.get("channels")).hasSize(1);
    JsonNode channel = report.get("channels").get(0);
    assertThat(channel.get("parameter").asString()).isEqualTo("cation_conductivity");
    assertThat(channel.get("hoursInService").asDouble()).isCloseTo(660, within(EXACT));
    assertThat(channel.get("hoursByLevel").get("NORMAL").asDouble()).isCloseTo(654, within(EXACT));
    assertThat(channel.get("hoursByLevel").get("AL1").asDouble()).isCloseTo(4, within(EXACT));
    assertThat(channel.get("hoursByLevel").get("AL2").asDouble()).isCloseTo(2, within(EXACT));
    assertThat(channel.get("hoursByLevel").get("AL3").asDouble()).isZero();
    assertThat(channel.get("penalty").asDouble()).isCloseTo(2.0 / 660, within(EXACT));

    JsonNode instrument = report.get("instruments").get(0);
    assertThat(instrument.get("slotsInService").asLong()).isEqualTo(2640);
    assertThat(instrument.get("slotsWithData").asLong()).isEqualTo(2624);
    assertThat(instrument.get("slotsGood").asLong()).isEqualTo(2600);
    assertThat(instrument.get("availability").asDouble()).isCloseTo(2600.0 / 2640, within(EXACT));
    assertThat(instrument.get("completeness").asDouble()).isCloseTo(2624.0 / 2640, within(EXACT));

    JsonNode index = report.get("index");
    assertThat(index.get("chemistryScore").asDouble()).isCloseTo(658.0 / 660, within(EXACT));
    assertThat(index.get("availabilityScore").asDouble()).isCloseTo(650.0 / 660, within(EXACT));
    assertThat(index.get("value").asDouble()).isCloseTo(100 * 656.4 / 660, within(EXACT));
    assertThat(index.get("value").asDouble()).isCloseTo(99.454545, within(1e-6));

    assertThat(report.get("events")).hasSize(1);
    assertThat(report.get("events").get(0).get("status").asString()).isEqualTo("CLOSED");
    assertThat(report.get("events").get(0).get("causeCategory").asString())
        .isEqualTo("CONDENSER_INGRESS");

    List<String> calibration = new ArrayList<>();
    report
        .get("calibration")
        .forEach(
            c ->
                calibration.add(
                    c.get("kind").asString()
                        + " "
                        + c.get("status").asString()
                        + " "
                        + c.get("nextDue").asString()
                        + " "
                        + c.get("checksInPeriod").asInt()));
    assertThat(calibration)
        .containsExactlyInAnyOrder(
            "CELL_CONSTANT_CHECK IN_DATE 2026-09-30T09:00:00Z 1",
            "CATION_RESIN_CHANGE IN_DATE 2026-05-03T09:30:00Z 1");

    assertThat(report.get("grabVsOnline").get("available").asBoolean()).isTrue();
    assertThat(report.get("grabVsOnline").get("note").asString())
        .startsWith("no grab or lab result in the period");

    HttpResponse<String> csv =
        http.get("/api/v1/plants/" + plant + "/reports/monthly?month=2026-04&format=csv");
    assertThat(csv.statusCode()).isEqualTo(200);
    assertThat(csv.body())
        .startsWith("section,sample_point,parameter,item,value,unit\r\n")
        .contains("hours_in_service," + cpd + ",cation_conductivity,AL2,2.000000,h")
        .contains("availability," + cpd + ",cation_conductivity,availability,0.984848,1")
        .contains("index,,,chemistry_performance_index,99.454545,1")
        .contains("grab_vs_online,,,available,true,");

    HttpResponse<String> hours =
        http.get(
            "/api/v1/excursions/monthly-hours?samplePoint="
                + cpd
                + "&parameter=cation_conductivity&from="
                + t("04-01T00:00")
                + "&to="
                + t("05-01T00:00"));
    assertThat(hours.body()).contains("\"level\":\"AL2\",\"hours\":2.0");

    HttpResponse<String> annual = http.get("/api/v1/plants/" + plant + "/reports/annual?year=2026");
    assertThat(annual.statusCode()).as(annual.body()).isEqualTo(200);
    assertThat(http.get("/api/v1/plants/" + plant + "/reports/monthly?month=April").statusCode())
        .isEqualTo(400);
    assertThat(http.get("/api/v1/plants/no-such-plant/reports/monthly?month=2026-04").statusCode())
        .isEqualTo(404);

    printablePage(plant);
  }

  /**
   * The printable page in Debian's headless Chromium (as PageIT): the index shows, the trend is
   * drawn, and the browser reports no error (a Content-Security-Policy violation would be one).
   * Screenshots: target/screenshots/report-2026-04.png (1100 px) and report-2026-04-390.png.
   * Without the browser this part is left out (logged), except in CI, where it fails.
   */
  private void printablePage(String plant) {
    Path chromium = Path.of("/usr/bin/chromium");
    Path driverPath = Path.of("/usr/bin/chromedriver");
    boolean present = Files.isExecutable(chromium) && Files.isExecutable(driverPath);
    if (!present) {
      assertThat(System.getenv("CI"))
          .as("CI needs chromium and chromium-driver")
          .isNotEqualTo("true");
      log.warn("no /usr/bin/chromium and /usr/bin/chromedriver: printable page not checked");
      return;
    }
    System.setProperty("webdriver.chrome.driver", driverPath.toString());
    ChromeOptions options = new ChromeOptions();
    options.setBinary(chromium.toFile());
    options.addArguments(
        "--headless=new", "--no-sandbox", "--disable-gpu", "--window-size=1100,2600");
    LoggingPreferences logs = new LoggingPreferences();
    logs.enable(LogType.BROWSER, Level.ALL);
    options.setCapability("goog:loggingPrefs", logs);
    ChromeDriver driver =
        new ChromeDriver(
            new ChromeDriverService.Builder().usingDriverExecutable(driverPath.toFile()).build(),
            options);
    try {
      String base = "http://localhost:" + port + "/report.html";
      driver.get(base);
      ((JavascriptExecutor) driver)
          .executeScript("sessionStorage.setItem('kwanta.key', arguments[0]);", TestKeys.ADMIN);
      driver.manage().logs().get(LogType.BROWSER);
      driver.get(base + "?plant=" + plant + "&month=2026-04");
      WebDriverWait wait = new WebDriverWait(driver, Duration.ofSeconds(30));
      wait.until(d -> d.findElement(By.id("index")).getText().startsWith("99.45"));
      wait.until(d -> !d.findElements(By.cssSelector("#trends polyline")).isEmpty());
      assertThat(driver.findElement(By.id("grab")).getText())
          .startsWith("No grab or lab result in the period");
      assertThat(driver.findElements(By.cssSelector("#bars rect"))).hasSize(3);
      assertThat(driver.findElement(By.id("channels")).getText())
          .contains("654.00")
          .contains("4.00")
          .contains("2.00");
      Path dir = Path.of("target", "screenshots");
      Files.createDirectories(dir);
      Files.write(
          dir.resolve("report-2026-04.png"),
          ((TakesScreenshot) driver).getScreenshotAs(OutputType.BYTES));
      driver.manage().window().setSize(new org.openqa.selenium.Dimension(390, 2600));
      Files.write(
          dir.resolve("report-2026-04-390.png"),
          ((TakesScreenshot) driver).getScreenshotAs(OutputType.BYTES));
      List<String> errors =
          driver.manage().logs().get(LogType.BROWSER).getAll().stream()
              .filter(e -> e.getLevel().intValue() >= Level.SEVERE.intValue())
              .map(LogEntry::getMessage)
              .toList();
      assertThat(errors).as("browser errors (a CSP violation is one)").isEmpty();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    } finally {
      driver.quit();
    }
  }

  private static void check(
      Http http, String point, String kind, String at, String outcome, String results) {
    HttpResponse<String> r =
        http.post(
            "/api/v1/sample-points/" + point + "/instrument-checks",
            "application/json",
            ("{\"parameter\":\"cation_conductivity\",\"kind\":\"%s\",\"performedAt\":\"%s\","
                    + "\"outcome\":\"%s\",\"results\":%s}")
                .formatted(kind, t(at), outcome, results));
    assertThat(r.statusCode()).as(r.body()).isEqualTo(201);
  }
}
