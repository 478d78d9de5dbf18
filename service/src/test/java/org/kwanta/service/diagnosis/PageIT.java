package org.kwanta.service.diagnosis;

import static org.assertj.core.api.Assertions.assertThat;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.logging.Level;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.TestInstance;
import org.kwanta.service.support.DatabaseTest;
import org.kwanta.service.support.Depth;
import org.kwanta.service.support.Http;
import org.openqa.selenium.By;
import org.openqa.selenium.JavascriptExecutor;
import org.openqa.selenium.OutputType;
import org.openqa.selenium.StaleElementReferenceException;
import org.openqa.selenium.TakesScreenshot;
import org.openqa.selenium.WebElement;
import org.openqa.selenium.chrome.ChromeDriver;
import org.openqa.selenium.chrome.ChromeDriverService;
import org.openqa.selenium.chrome.ChromeOptions;
import org.openqa.selenium.logging.LogEntry;
import org.openqa.selenium.logging.LogType;
import org.openqa.selenium.logging.LoggingPreferences;
import org.openqa.selenium.support.ui.WebDriverWait;
import org.springframework.boot.test.web.server.LocalServerPort;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/**
 * The chemist page in a real browser (Debian's chromium and chromium-driver): the board shows an
 * AL2 point as AL2, a condenser leak sent through the ingest as a cooling-water ingress in the
 * process, a name holding markup as text (no script runs, the Content-Security-Policy is sent);
 * acknowledging an excursion from the page adds a history entry; a lab and a grab result entered
 * from the page appear as markers on the trend; a read key sees no forms (the entry forms show for
 * a chemist key); at 390 px the page does not scroll sideways; first paint on loopback is within 1
 * s; no test leaves a console error. Screenshots of the board, a trend and the pH curve at 1440 and
 * 390 px go to target/screenshots. Without the browser the test is skipped visibly, except in CI
 * (CI=true), where it fails. The everyday build walks the board, the leak, an acknowledgement and
 * the phone width; CI walks every test here ({@link Depth#THOROUGH}).
 */
@DatabaseTest
@TestInstance(TestInstance.Lifecycle.PER_CLASS)
class PageIT {

  static final Path CHROMIUM = Path.of("/usr/bin/chromium");
  static final Path DRIVER = Path.of("/usr/bin/chromedriver");

  /** A name that would run script if the page built HTML from data. */
  static final String MARKUP = "<img src=x onerror=\"window.kwantaInjected=1\">";

  static final JsonMapper JSON = JsonMapper.builder().build();

  @LocalServerPort int port;

  private ChromeDriver driver;
  private String chemistKey;
  private String readKey;

  /** The first contentful paint of the last new tab, ms after its navigation started. */
  private double coldPaint;

  @BeforeAll
  void seed() throws Exception {
    boolean present = Files.isExecutable(CHROMIUM) && Files.isExecutable(DRIVER);
    if (!present && "true".equals(System.getenv("CI"))) {
      throw new AssertionError(
          "CI needs Debian's chromium and chromium-driver (.ci/run installs them)");
    }
    assumeTrue(present, "no /usr/bin/chromium and /usr/bin/chromedriver: browser test skipped");
    Http http = Http.admin(port);
    chemistKey = key(http, "Page test chemist (invented)", "chemist");
    readKey = key(http, "Page test reader (invented)", "read");
    seedLevels(http);
    seedLeak(http);
    System.setProperty("webdriver.chrome.driver", DRIVER.toString());
  }

  @AfterAll
  void quit() {
    if (driver != null) {
      driver.quit();
    }
  }

  @AfterEach
  void noConsoleErrors() {
    if (driver == null) {
      return;
    }
    List<LogEntry> severe =
        driver.manage().logs().get(LogType.BROWSER).getAll().stream()
            .filter(e -> e.getLevel().intValue() >= Level.SEVERE.intValue())
            .toList();
    driver.quit();
    driver = null;
    assertThat(severe).as("console errors").isEmpty();
  }

  @Test
  void theBoardShowsAnAl2PointAsAl2AndMarkupInNamesAsText() throws Exception {
    HttpResponse<String> page = Http.admin(port).get("/");
    assertThat(page.headers().firstValue("Content-Security-Policy").orElse(""))
        .contains("script-src 'self'")
        .doesNotContain("unsafe-inline");
    open(1440, chemistKey, "page-levels");
    WebElement row = row("PL-ECO");
    assertThat(row.findElement(By.cssSelector("td[data-label=Level] .lvl")).getText())
        .contains("AL2");
    assertThat(row.findElement(By.cssSelector(".lvl")).getAttribute("aria-label"))
        .startsWith("action level 2");
    assertThat(row.getText()).contains(MARKUP); // the point's name, as text
    assertThat(driver.findElement(By.id("plant")).getText()).contains(MARKUP);
    assertThat(js("return document.querySelectorAll('img').length")).isEqualTo(0L);
    assertThat(js("return window.kwantaInjected === undefined")).isEqualTo(true);
    // most urgent first: the AL2 point leads the board
    assertThat(
            driver
                .findElements(By.cssSelector("#overview tbody tr"))
                .get(0)
                .getAttribute("data-point"))
        .isEqualTo("PL-ECO");
    assertThat(driver.findElement(By.id("who")).getText())
        .contains("Signed in as Page test chemist (invented), chemist");
    // the sign-in prompt does not linger once the key is accepted
    assertThat(driver.findElement(By.id("status")).getText()).doesNotContain("Sign in");
    screenshot("board-1440.png");
  }

  @Test
  void theCondenserLeakShowsItsDiagnosisOnTheBoardAndInTheTrend() throws Exception {
    open(1440, chemistKey, "page-leak");
    WebElement row = row("PG-CPD");
    assertThat(row.getText())
        .contains("Cooling water is getting in: a condenser leak")
        .contains("points at the process")
        .contains("COOLING_WATER_INGRESS");
    screenshot("board-condenser-leak-1440.png");
    openPoint("PG-CPD");
    wait(60).until(d -> d.findElement(By.id("findings")).getText().contains("condenser leak"));
    assertThat(driver.findElement(By.id("findings")).getText()).contains("expected");
    wait(60)
        .until(d -> d.findElement(By.id("history")).getText().contains("COOLING_WATER_INGRESS"));
    wait(60).until(d -> "cation_conductivity_25".equals(body("trend")));
    assertThat(driver.findElements(By.cssSelector("#trend canvas"))).isNotEmpty();
    scrollTo("trend-form");
    screenshot("trend-condenser-leak-1440.png");
  }

  @Test
  @Tag(Depth.THOROUGH)
  void theTrendDrawsTheLimitsInForceAndTheCurveItsWhatIf() throws Exception {
    open(1440, chemistKey, "page-levels");
    openPoint("PL-ECO");
    wait(60).until(d -> "cation_conductivity_25".equals(body("trend")));
    String legend = driver.findElement(By.cssSelector("#trend .u-legend")).getText();
    assertThat(legend).contains("AL2 high limit").contains("AL1 high limit").contains("µS/cm");
    assertThat(driver.findElement(By.id("trend-caption")).getText()).contains("(UTC)");
    scrollTo("trend-form");
    screenshot("trend-1440.png");
    wait(60).until(d -> "current".equals(body("curve")));
    assertThat(driver.findElement(By.id("curve-caption")).getText()).contains("at 25 °C");
    WebElement ammonia = driver.findElement(By.id("whatif-0"));
    ammonia.clear();
    ammonia.sendKeys("2");
    driver.findElement(By.cssSelector("#whatif button[type=submit]")).click();
    wait(60).until(d -> "what-if".equals(body("curve")));
    assertThat(driver.findElement(By.cssSelector("#curve .u-legend")).getText())
        .contains("what-if water");
    scrollTo("curve");
    screenshot("curve-1440.png");
    // a chemist changes limits from now on, with a reason; the table shows the new version
    assertThat(driver.findElement(By.id("limit-form")).isDisplayed()).isTrue();
    js(
        "const p = document.getElementById('limit-parameter'); p.value = 'cation_conductivity';"
            + " p.dispatchEvent(new Event('change'));");
    WebElement al1 = driver.findElement(By.id("limit-thr-0"));
    al1.clear();
    al1.sendKeys("0.3");
    driver.findElement(By.id("limit-reason")).sendKeys("Chemistry manual rev. 7 (page test)");
    driver.findElement(By.cssSelector("#limit-form button[type=submit]")).click();
    wait(60)
        .until(d -> d.findElement(By.id("status")).getText().contains("recorded, in force now"));
    wait(60)
        .until(d -> d.findElement(By.id("limits")).getText().contains("plant's own, version 1"));
    assertThat(driver.findElement(By.id("limits")).getText()).contains("> 0.300 µS/cm");
  }

  @Test
  void acknowledgingFromThePageAddsAHistoryEntry() throws Exception {
    open(1440, chemistKey, "page-levels");
    wait(60).until(d -> "loaded".equals(body("events")));
    By card = By.cssSelector("#excursions article.open[data-point='PL-ECO']");
    wait(60).until(d -> !d.findElements(card).isEmpty());
    WebElement excursion = driver.findElement(card);
    assertThat(excursion.getText()).contains("left of the allowance");
    String note = "Sampled by hand, polisher bypass closed (page test)";
    excursion.findElement(By.cssSelector("textarea")).sendKeys(note);
    excursion.findElement(By.xpath(".//button[text()='Acknowledge']")).click();
    wait(60)
        .until(
            d -> {
              try {
                return d.findElement(card)
                    .findElement(By.cssSelector("ol.history"))
                    .getText()
                    .contains(note);
              } catch (org.openqa.selenium.NoSuchElementException
                  | StaleElementReferenceException e) {
                return false;
              }
            });
    assertThat(driver.findElement(card).getText()).contains("Page test chemist (invented)");
    scrollTo("events");
    screenshot("events-1440.png");
    JsonNode rows =
        JSON.readTree(
            Http.admin(port)
                .get("/api/v1/excursions?samplePoint=PL-ECO&parameter=cation_conductivity")
                .body());
    List<String> notes = new ArrayList<>();
    rows.forEach(r -> r.get("acknowledgements").forEach(a -> notes.add(a.get("note").asString())));
    assertThat(notes).contains(note);
  }

  @Test
  @Tag(Depth.THOROUGH)
  void aReadKeySeesNoFormsAndSignsOut() throws Exception {
    open(1440, readKey, "page-levels");
    wait(60).until(d -> "loaded".equals(body("events")));
    assertThat(driver.findElements(By.cssSelector("#events form"))).isEmpty();
    openPoint("PL-ECO");
    wait(60).until(d -> d.findElement(By.id("limits")).getText().contains("cation conductivity"));
    assertThat(driver.findElement(By.id("limit-form")).isDisplayed()).isFalse();
    wait(60).until(d -> "none".equals(body("entry")));
    assertThat(driver.findElement(By.id("lab-form")).isDisplayed()).isFalse();
    assertThat(driver.findElement(By.id("block-form")).isDisplayed()).isFalse();
    assertThat(driver.findElement(By.id("entry-readonly")).getText())
        .contains("Entry needs a chemist or admin key");
    driver.findElement(By.id("signout")).click();
    assertThat(js("return sessionStorage.getItem('kwanta.key')")).isNull();
    assertThat(js("return localStorage.length")).isEqualTo(0L);
    assertThat(driver.findElement(By.id("key-form")).isDisplayed()).isTrue();
  }

  @Test
  void atPhoneWidthTheBoardIsCardsWithoutSidewaysScroll() throws Exception {
    open(390, chemistKey, "page-leak");
    assertThat(js("return document.documentElement.scrollWidth"))
        .as(WIDER, js(WIDEST))
        .isEqualTo(390L);
    assertThat(js("return getComputedStyle(document.querySelector('#overview thead')).display"))
        .isEqualTo("none");
    screenshot("board-390.png");
    choosePlant("page-levels", "PL-");
    openPoint("PL-ECO");
    wait(60).until(d -> "cation_conductivity_25".equals(body("trend")));
    wait(60).until(d -> "current".equals(body("curve")));
    assertThat(js("return document.documentElement.scrollWidth"))
        .as(WIDER, js(WIDEST))
        .isEqualTo(390L);
    scrollTo("trend-form");
    screenshot("trend-390.png");
    scrollTo("curve");
    screenshot("curve-390.png");
    // the entry forms of a chemist key fit the phone too
    wait(60).until(d -> "forms".equals(body("entry")));
    assertThat(driver.findElement(By.id("lab-form")).isDisplayed()).isTrue();
    assertThat(js("return document.documentElement.scrollWidth"))
        .as(WIDER, js(WIDEST))
        .isEqualTo(390L);
    scrollTo("lab");
    screenshot("entry-390.png");
  }

  @Test
  @Tag(Depth.THOROUGH)
  void aLabEntryThroughThePageAppearsAsAMarkerOnTheTrend() throws Exception {
    open(1440, chemistKey, "page-levels");
    wait(60).until(d -> "forms".equals(body("entry")));
    assertThat(driver.findElement(By.id("lab-form")).isDisplayed()).isTrue();
    assertThat(driver.findElement(By.id("block-form")).isDisplayed()).isTrue();
    assertThat(driver.findElement(By.id("entry-readonly")).isDisplayed()).isFalse();
    enterLab("lab", 30, "0.42", false, "S-PAGE-1");
    enterLab("grab", 10, "0.05", true, "S-PAGE-2");
    // a block's operating state, recorded from the page (in service: the other tests' levels stay)
    js(
        "const s = document.getElementById('block-state'); s.value = 'IN_SERVICE';"
            + " s.dispatchEvent(new Event('change'));");
    driver.findElement(By.id("block-note")).sendKeys("On load after the page test's seed");
    driver.findElement(By.cssSelector("#block-form button[type=submit]")).click();
    wait(60)
        .until(
            d ->
                d.findElement(By.id("block-states"))
                    .getText()
                    .contains("Page test chemist (invented)"));
    assertThat(driver.findElement(By.id("block-now")).getText()).isEqualTo("in service");
    scrollTo("lab");
    screenshot("entry-1440.png");
    // the trend of the point draws both as markers inside the plot and lists them
    openPoint("PL-ECO");
    wait(60).until(d -> "cation_conductivity_25".equals(body("trend")));
    wait(60).until(d -> "2".equals(body("labmarksDrawn")));
    String listed = driver.findElement(By.id("trend-lab")).getText();
    assertThat(listed)
        .contains("0.420 µS/cm (lab result, sample S-PAGE-1)")
        .contains("< 0.050 µS/cm (grab sample, below the detection limit, sample S-PAGE-2)")
        .contains("● lab result")
        .contains("◆ grab sample")
        .contains("▽ below the detection limit");
    // the last hour, where both are: still drawn after the window is fetched again
    js(
        "document.body.dataset.labmarksDrawn = '';"
            + " const r = document.getElementById('trend-range'); r.value = '3600';"
            + " r.dispatchEvent(new Event('change'));");
    wait(60).until(d -> "2".equals(body("labmarksDrawn")));
    scrollTo("trend-form");
    screenshot("trend-lab-1440.png");
    // and the API holds them as entered, by the page's key
    JsonNode stored =
        JSON.readTree(
            Http.admin(port)
                .get("/api/v1/sample-points/PL-ECO/lab-results?parameter=cation_conductivity")
                .body());
    List<String> seen = new ArrayList<>();
    stored.forEach(
        r ->
            seen.add(
                r.get("source").asString()
                    + " "
                    + r.get("display").asString()
                    + " "
                    + r.get("enteredBy").asString()));
    assertThat(seen)
        .contains(
            "lab 0.42 uS/cm Page test chemist (invented)",
            "grab < 0.05 uS/cm Page test chemist (invented)");
  }

  /**
   * The time fields read 24-hour at an en-US browser (where datetime-local showed AM/PM), say their
   * zone, start at now, and refuse a time they cannot read with a message under the field, sending
   * nothing.
   */
  @Test
  @Tag(Depth.THOROUGH)
  void timeFieldsRead24HourWithTheirZoneAndRefuseABadTime() throws Exception {
    open(1440, chemistKey, "page-levels");
    System.out.println(
        "PageIT browser locale: "
            + js("return new Intl.DateTimeFormat().resolvedOptions().locale")
            + ", hour12 by default: "
            + js(
                "return new Intl.DateTimeFormat(undefined, { hour: 'numeric' }).resolvedOptions()"
                    + ".hour12"));
    wait(60).until(d -> "forms".equals(body("entry")));
    openPoint("PL-ECO");
    wait(60).until(d -> d.findElement(By.id("limit-form")).isDisplayed());
    for (String id : List.of("lab-time", "block-since", "limit-from")) {
      WebElement f = driver.findElement(By.id(id));
      assertThat(f.getAttribute("type")).as(id).isEqualTo("text");
      assertThat(f.getAttribute("value")).as(id).matches("\\d{4}-\\d{2}-\\d{2} \\d{2}:\\d{2}");
      assertThat(driver.findElement(By.id(id + "-zone")).getText())
          .as(id)
          .startsWith("(24-hour clock, UTC");
      // the label names the field for a screen reader, the zone describes it
      assertThat(driver.findElement(By.cssSelector("label[for='" + id + "']")).getText())
          .isNotBlank();
    }
    String forms =
        (String)
            js(
                "return [...document.querySelectorAll('form')].map(f => f.innerText + ' '"
                    + " + [...f.querySelectorAll('input')].map(i => i.value + ' ' + i.placeholder).join(' '))"
                    + ".join(' ')");
    assertThat(forms).doesNotContainPattern("\\b[AaPp]\\.?[Mm]\\b");
    // a time in the en-US form is refused under the field, and nothing is stored
    long before = labResults("PL-ECO", "sodium");
    long states = blockStates("page-levels", "U");
    js(
        "const set = (id, v) => { const f = document.getElementById(id); f.value = v;"
            + " f.dispatchEvent(new Event('change')); };"
            + " set('lab-point', 'PL-ECO'); set('lab-parameter', 'sodium');");
    WebElement time = driver.findElement(By.id("lab-time"));
    time.clear();
    time.sendKeys("12/03/2026 2:05 PM");
    driver.findElement(By.id("lab-value")).sendKeys("3");
    driver.findElement(By.cssSelector("#lab-form button[type=submit]")).click();
    wait(10).until(d -> d.findElement(By.id("lab-time-error")).isDisplayed());
    assertThat(driver.findElement(By.id("lab-time-error")).getText())
        .contains("is not a time as YYYY-MM-DD HH:MM (24-hour clock");
    assertThat(time.getAttribute("aria-invalid")).isEqualTo("true");
    assertThat(driver.findElement(By.id("status")).getText()).contains("Not stored");
    // a date that does not exist, in the block's form: refused too
    WebElement since = driver.findElement(By.id("block-since"));
    since.clear();
    since.sendKeys("2026-02-30 10:00");
    driver.findElement(By.cssSelector("#block-form button[type=submit]")).click();
    wait(10).until(d -> d.findElement(By.id("block-since-error")).isDisplayed());
    assertThat(driver.findElement(By.id("block-since-error")).getText())
        .contains("2026-02-30 is not a date");
    scrollTo("lab");
    screenshot("entry-bad-time-1440.png");
    Thread.sleep(1000);
    assertThat(labResults("PL-ECO", "sodium")).as("lab results stored").isEqualTo(before);
    assertThat(blockStates("page-levels", "U")).as("block states recorded").isEqualTo(states);
    // corrected, the message goes and the result is stored
    typeTime("lab-time", 5);
    assertThat(driver.findElement(By.id("lab-time-error")).isDisplayed()).isFalse();
    driver.findElement(By.cssSelector("#lab-form button[type=submit]")).click();
    wait(60).until(d -> d.findElement(By.id("status")).getText().contains("Stored: lab result"));
    assertThat(labResults("PL-ECO", "sodium")).isEqualTo(before + 1);
  }

  /** The board asked again with its ETag: 304 without a body while nothing changed. */
  @Test
  @Tag(Depth.THOROUGH)
  void theBoardAskedAgainWithItsEtagIsNotModified() throws Exception {
    Http http = Http.admin(port);
    HttpResponse<String> first = http.get("/api/v1/plants/page-levels/overview");
    String tag = first.headers().firstValue("ETag").orElseThrow();
    assertThat(tag).startsWith("W/\"");
    HttpResponse<String> again =
        http.get("/api/v1/plants/page-levels/overview", "If-None-Match", tag);
    assertThat(again.statusCode()).isEqualTo(304);
    assertThat(again.body()).isEmpty();
    // the excursions and the events the page polls beside it: the same
    for (String path :
        List.of(
            "/api/v1/excursions?plant=page-levels&from=" + Instant.now().minus(Duration.ofDays(7)),
            "/api/v1/excursion-events")) {
      HttpResponse<String> listed = http.get(path);
      String listTag = listed.headers().firstValue("ETag").orElseThrow();
      assertThat(listTag).as(path).startsWith("W/\"");
      assertThat(http.get(path, "If-None-Match", listTag).statusCode()).as(path).isEqualTo(304);
    }
    // and the page, whose next refresh sends the tags, keeps its board with the ages counted on,
    // and its excursions and events
    open(1440, readKey, "page-levels");
    js(
        "document.body.dataset.boardAnswer = ''; document.body.dataset.eventsAnswer = '';"
            + " document.getElementById('tz').dispatchEvent(new Event('change'))");
    wait(60).until(d -> "not-modified".equals(body("boardAnswer")));
    wait(60).until(d -> "not-modified".equals(body("eventsAnswer")));
    assertThat(row("PL-ECO").findElement(By.cssSelector(".lvl")).getText()).contains("AL2");
  }

  /** The monthly report opens from the page's link in the same tab (the key stays in the tab). */
  @Test
  @Tag(Depth.THOROUGH)
  void theMonthlyReportOpensFromThePage() throws Exception {
    open(1440, readKey, "page-leak");
    driver.findElement(By.id("report-link")).click();
    wait(60).until(d -> body("loaded") != null && !"board".equals(body("loaded")));
    assertThat(body("loaded")).isEqualTo("report");
    screenshot("report-1440.png");
    driver.executeCdpCommand(
        "Emulation.setDeviceMetricsOverride",
        Map.of("width", 390, "height", 844, "deviceScaleFactor", 1, "mobile", true));
    driver.navigate().refresh();
    wait(60).until(d -> "report".equals(body("loaded")));
    System.out.println(
        "PageIT report at 390 px: scrollWidth "
            + js("return document.documentElement.scrollWidth"));
    screenshot("report-390.png");
  }

  private long blockStates(String plant, String block) throws Exception {
    HttpResponse<String> r =
        Http.admin(port).get("/api/v1/plants/" + plant + "/blocks/" + block + "/operating-states");
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    return JSON.readTree(r.body()).get("entries").size();
  }

  private long labResults(String point, String parameter) throws Exception {
    HttpResponse<String> r =
        Http.admin(port)
            .get("/api/v1/sample-points/" + point + "/lab-results?parameter=" + parameter);
    assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    return JSON.readTree(r.body()).size();
  }

  /**
   * First paint on loopback: the first contentful paint of the page (sign-in form) as a new tab
   * loads it, and of three reloads with the key in the tab's session, with the time until the board
   * shows its points. Goal (issue 15): first paint within 1 s. The figures go to
   * target/screenshots/first-paint.txt.
   */
  @Test
  @Tag(Depth.THOROUGH)
  void firstPaintOnLoopbackIsWithinOneSecond() throws Exception {
    open(1440, chemistKey, "page-levels");
    List<Double> paints = new ArrayList<>();
    List<Double> boards = new ArrayList<>();
    for (int i = 0; i < 3; i++) {
      driver.navigate().refresh();
      wait(60).until(d -> "board".equals(body("loaded")));
      paints.add(number(js(PAINT)));
      boards.add(number(js("return performance.getEntriesByName('board-shown')[0].startTime")));
    }
    List<Double> sorted = paints.stream().sorted().toList();
    String figures =
        String.format(
            java.util.Locale.ROOT,
            "first contentful paint, new tab: %.0f ms; reloads with the key: %s ms (median %.0f);"
                + " board shown: %s ms%n",
            coldPaint,
            paints.stream().map(v -> String.format(java.util.Locale.ROOT, "%.0f", v)).toList(),
            sorted.get(1),
            boards.stream().map(v -> String.format(java.util.Locale.ROOT, "%.0f", v)).toList());
    System.out.print("PageIT " + figures);
    Path dir = Path.of("target", "screenshots");
    Files.createDirectories(dir);
    Files.writeString(dir.resolve("first-paint.txt"), figures);
    assertThat(coldPaint).as("first paint of a new tab, ms").isLessThanOrEqualTo(1000.0);
    assertThat(sorted.get(1)).as("median first paint of a reload, ms").isLessThanOrEqualTo(1000.0);
  }

  /** The elements reaching beyond a 390 px viewport, for the message of a failed width check. */
  static final String WIDEST =
      "return [...document.querySelectorAll('body *')].filter(e => e.getBoundingClientRect().right > 391)"
          + ".map(e => e.tagName + (e.id ? '#' + e.id : '') + (e.className ? '.' + e.className : '')"
          + " + ' ' + Math.round(e.getBoundingClientRect().right)).slice(-8).join(', ')";

  static final String WIDER = "elements beyond 390 px: %s";

  static final String PAINT =
      "const p = performance.getEntriesByName('first-contentful-paint')[0];"
          + " return p ? p.startTime : null";

  private static double number(Object v) {
    assertThat(v).as("a performance figure").isInstanceOf(Number.class);
    return ((Number) v).doubleValue();
  }

  /** Enters a grab or lab result of cation conductivity at PL-ECO, minutesAgo, from the page. */
  private void enterLab(
      String source, int minutesAgo, String value, boolean below, String sampleId) {
    js(
        "const set = (id, v) => { const f = document.getElementById(id); f.value = v;"
            + " f.dispatchEvent(new Event('input')); f.dispatchEvent(new Event('change')); };"
            + " set('lab-point', 'PL-ECO'); set('lab-parameter', 'cation_conductivity');"
            + " set('lab-source', arguments[0]);"
            + " document.getElementById('lab-below').checked = arguments[1];",
        source,
        below);
    typeTime("lab-time", minutesAgo);
    driver.findElement(By.id("lab-value")).sendKeys(value);
    driver.findElement(By.id("lab-sample")).sendKeys(sampleId);
    driver.findElement(By.cssSelector("#lab-form button[type=submit]")).click();
    String word = "grab".equals(source) ? "Stored: grab sample" : "Stored: lab result";
    wait(60).until(d -> d.findElement(By.id("status")).getText().contains(word));
  }

  /** Types a time minutesAgo into a time field, as YYYY-MM-DD HH:MM in the browser's zone. */
  private void typeTime(String id, int minutesAgo) {
    String text =
        (String)
            js(
                "const d = new Date(Date.now() - arguments[0] * 60000);"
                    + " const p = (n) => String(n).padStart(2, '0');"
                    + " return d.getFullYear() + '-' + p(d.getMonth() + 1) + '-' + p(d.getDate())"
                    + " + ' ' + p(d.getHours()) + ':' + p(d.getMinutes());",
                minutesAgo);
    WebElement field = driver.findElement(By.id(id));
    field.clear();
    field.sendKeys(text);
  }

  // ---- the browser

  private void open(int width, String key, String plant) {
    ChromeOptions options = new ChromeOptions();
    options.setBinary(CHROMIUM.toFile());
    options.addArguments(
        "--headless=new",
        "--no-sandbox",
        "--disable-gpu",
        "--window-size=1440,1000",
        "--lang=en-US"); // a 12-hour locale: the time fields must still read 24-hour
    options.setExperimentalOption("prefs", Map.of("intl.accept_languages", "en-US"));
    LoggingPreferences logs = new LoggingPreferences();
    logs.enable(LogType.BROWSER, Level.ALL);
    options.setCapability("goog:loggingPrefs", logs);
    driver =
        new ChromeDriver(
            new ChromeDriverService.Builder().usingDriverExecutable(DRIVER.toFile()).build(),
            options);
    if (width < 500) { // a window cannot be that narrow: emulate the phone's viewport
      driver.executeCdpCommand(
          "Emulation.setDeviceMetricsOverride",
          Map.of("width", width, "height", 844, "deviceScaleFactor", 1, "mobile", true));
    }
    String base = "http://localhost:" + port + "/";
    driver.get(base);
    wait(60).until(d -> d.findElement(By.id("key-form")).isDisplayed());
    wait(10).until(d -> js(PAINT) != null);
    coldPaint = number(js(PAINT));
    driver.findElement(By.id("key")).sendKeys(key);
    driver.findElement(By.cssSelector("#key-form button")).click();
    wait(60)
        .until(
            d ->
                d.findElements(By.cssSelector("#plant option[value='" + plant + "']")).size() == 1);
    choosePlant(plant, plant.equals("page-leak") ? "PG-" : "PL-");
  }

  /** Chooses a plant and waits for its points on the board. */
  private void choosePlant(String plant, String prefix) {
    js(
        "const s = document.getElementById('plant'); s.value = arguments[0];"
            + " s.dispatchEvent(new Event('change'));",
        plant);
    wait(60)
        .until(
            d ->
                Boolean.TRUE.equals(
                    js(
                        "return [...document.querySelectorAll('#overview tbody tr[data-point]')]"
                            + ".some(r => r.dataset.point.startsWith(arguments[0]))",
                        prefix)));
  }

  private WebElement row(String point) {
    return driver.findElement(By.cssSelector("#overview tbody tr[data-point='" + point + "']"));
  }

  /** Opens a point's detail; the board is rebuilt every 15 s, so click the button as it is now. */
  private void openPoint(String point) {
    wait(60)
        .until(
            d -> {
              try {
                row(point).findElement(By.cssSelector("button.point")).click();
                return true;
              } catch (StaleElementReferenceException stale) {
                return false;
              }
            });
    wait(60).until(d -> point.equals(body("detail")));
  }

  private String body(String data) {
    Object v = js("return document.body.dataset[arguments[0]] || null", data);
    return v == null ? null : v.toString();
  }

  private Object js(String script, Object... args) {
    return ((JavascriptExecutor) driver).executeScript(script, args);
  }

  private void scrollTo(String id) throws InterruptedException {
    js("document.getElementById(arguments[0]).scrollIntoView()", id);
    Thread.sleep(300);
  }

  private WebDriverWait wait(int seconds) {
    return new WebDriverWait(driver, Duration.ofSeconds(seconds));
  }

  private void screenshot(String name) throws Exception {
    Path dir = Path.of("target", "screenshots");
    Files.createDirectories(dir);
    Files.write(dir.resolve(name), ((TakesScreenshot) driver).getScreenshotAs(OutputType.BYTES));
  }

  // ---- the data

  private static String key(Http http, String name, String role) throws Exception {
    HttpResponse<String> r =
        http.post(
            "/api/v1/keys",
            "application/json",
            "{\"name\":\"" + name + "\",\"role\":\"" + role + "\"}");
    assertThat(r.statusCode()).as(r.body()).isEqualTo(201);
    return JSON.readTree(r.body()).get("key").asString();
  }

  /**
   * A feedwater point whose cation conductivity has stood at 0.5 µS/cm for an hour: above the
   * example AL2 threshold of AVT(O) feedwater (0.35 µS/cm), below AL3 (0.65). The plant and the
   * point carry markup in their names.
   */
  private static void seedLevels(Http http) throws Exception {
    String name = JSON.writeValueAsString(MARKUP);
    String declaration =
        "{\"id\":\"page-levels\",\"name\":"
            + name
            + ",\"coolingWater\":\"BRACKISH\",\"blocks\":[{\"id\":\"U\",\"name\":\"Unit\"}],"
            + "\"samplePoints\":[{\"id\":\"PL-ECO\",\"block\":\"U\",\"name\":"
            + name
            + ",\"cycleLocation\":\"FEEDWATER\",\"treatmentRegime\":\"AVT(O)\","
            + "\"operatingTemperatureCel\":155,\"operatingPressureMPa\":15}]}";
    HttpResponse<String> declared =
        http.send("PUT", "/api/v1/plants/page-levels", "application/json", declaration);
    assertThat(declared.statusCode()).as(declared.body()).isIn(200, 201);
    Instant end = Instant.now().truncatedTo(ChronoUnit.MINUTES);
    StringBuilder b = new StringBuilder("{\"readings\":[");
    for (int m = 60; m >= 0; m--) {
      String t = end.minus(Duration.ofMinutes(m)).toString();
      b.append(m == 60 ? "" : ",")
          .append(reading("specific_conductivity", t, 8.9, "uS/cm"))
          .append(',')
          .append(reading("cation_conductivity", t, 0.5, "uS/cm"))
          .append(',')
          .append(reading("ph", t, 9.66, "[pH]"));
    }
    HttpResponse<String> posted =
        http.post("/api/v1/readings", "application/json", b.append("]}").toString());
    assertThat(posted.statusCode()).as(posted.body()).isEqualTo(200);
  }

  private static String reading(String parameter, String time, double value, String unit) {
    return "{\"samplePoint\":\"PL-ECO\",\"parameter\":\""
        + parameter
        + "\",\"time\":\""
        + time
        + "\",\"value\":"
        + value
        + ",\"unit\":\""
        + unit
        + "\""
        + (parameter.endsWith("conductivity") ? ",\"compensated\":true" : "")
        + "}";
  }

  /** The condenser-leak story of the story bench, at a condensate pump and the economizer. */
  private static void seedLeak(Http http) throws Exception {
    StoryBenchIT.Story leak = StoryBenchIT.leak();
    StoryBenchIT.Story s =
        new StoryBenchIT.Story(
            "page-leak",
            leak.name(),
            List.of(
                new StoryBenchIT.PointSpec(
                    "PG-CPD",
                    null,
                    true,
                    false,
                    false,
                    true,
                    leak.points().get(0).composition(),
                    "none",
                    0),
                new StoryBenchIT.PointSpec(
                    "PG-ECO",
                    "PG-CPD",
                    true,
                    true,
                    true,
                    false,
                    leak.points().get(0).composition(),
                    "none",
                    0)),
            "PG-CPD",
            leak.code(),
            leak.pointsAt(),
            90,
            leak.within());
    HttpResponse<String> declared =
        http.send(
            "PUT", "/api/v1/plants/page-leak", "application/json", StoryBenchIT.declaration(s));
    assertThat(declared.statusCode()).as(declared.body()).isIn(200, 201);
    Instant end = Instant.now().truncatedTo(ChronoUnit.MINUTES).minus(Duration.ofMinutes(1));
    Instant start = end.minus(Duration.ofMinutes(StoryBenchIT.BASELINE_MINUTES + 89));
    for (String batch : StoryBenchIT.batches(s, start, 11)) {
      assertThat(http.post("/api/v1/readings", "application/json", batch).statusCode())
          .isEqualTo(200);
    }
  }
}
