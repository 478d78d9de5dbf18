package org.kwanta.service.ingest;

import static org.assertj.core.api.Assertions.assertThat;

import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.time.ZoneOffset;
import java.time.temporal.ChronoUnit;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;
import java.util.TreeMap;
import java.util.stream.Collectors;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.kwanta.service.ingest.EvaluationRunner.StoredReading;
import org.kwanta.service.ingest.ReadingRollupsIT.Sent;
import org.kwanta.service.support.Http;
import org.kwanta.service.support.TestDatabase;
import org.springframework.beans.factory.annotation.Autowired;
import org.springframework.boot.micrometer.metrics.test.autoconfigure.AutoConfigureMetrics;
import org.springframework.boot.test.context.SpringBootTest;
import org.springframework.boot.test.web.server.LocalServerPort;
import org.springframework.jdbc.core.JdbcTemplate;
import org.springframework.test.context.ContextConfiguration;

/**
 * Packed cold storage through the database (V69, {@link PackedReadings}): readings ingested, packed
 * and read back equal what was stored before packing, bit for bit; corrections and late readings
 * after packing rewrite the blocks, keep their revisions and leave rollups equal to the aggregates
 * of the readings; the same readings in other batch orders, packed at another moment, give the same
 * stored state. Values are invented (feedwater sodium and cation conductivity), not measurements.
 *
 * <p>A database of its own: packing a day packs every series of it, other test classes' too.
 */
@SpringBootTest(webEnvironment = SpringBootTest.WebEnvironment.RANDOM_PORT)
@ContextConfiguration(initializers = TestDatabase.OwnDatabaseInitializer.class)
@AutoConfigureMetrics
class PackedReadingsIT {

  private static final String[] PARAMETERS = {"sodium", "cation_conductivity"};
  private static final String[] UNITS = {"ug/kg", "uS/cm"};
  private static final String[] QUALITIES = {"good", "uncertain", "bad"};

  @LocalServerPort int port;
  @Autowired JdbcTemplate jdbc;
  @Autowired ReadingPacker packer;
  @Autowired ReadingStore store;
  @Autowired StoredSeries series;
  @Autowired ReadingHistory history;
  @Autowired IngestService ingest;
  Http http;

  @BeforeEach
  void client() {
    http = Http.admin(port);
  }

  /** 20:00 UTC of a day some days ago; each test its own day, so none packs another's. */
  private static Instant start(int daysAgo) {
    return Instant.now()
        .truncatedTo(ChronoUnit.DAYS)
        .minus(daysAgo, ChronoUnit.DAYS)
        .plusSeconds(72_000);
  }

  private static LocalDate dayOf(Instant t) {
    return LocalDate.ofInstant(t, ZoneOffset.UTC);
  }

  /** A reading as sent, with the fields the rollups ignore. */
  record Full(Sent sent, Double temperature, boolean compensated) {}

  /**
   * Readings about every 10 s (with microsecond jitter) from 20:00 for 8 h, over two UTC days:
   * sodium with 3 decimals, cation conductivity at full precision, a temperature on most.
   */
  private static List<Full> series(String point, Instant start, Random random, boolean jitter) {
    List<Full> out = new ArrayList<>();
    Instant end = start.plus(Duration.ofHours(8));
    double sodium = 0.4;
    for (Instant t = start; t.isBefore(end); ) {
      sodium = Math.max(0.05, sodium + (random.nextDouble() - 0.5) * 0.01);
      double value = Math.round(sodium * 1000) / 1000.0;
      out.add(
          new Full(
              new Sent(point, "sodium", t, value, random.nextInt(20) == 0 ? 1 : 0), null, true));
      out.add(
          new Full(
              new Sent(
                  point,
                  "cation_conductivity",
                  t,
                  Math.abs(0.08 + 0.01 * random.nextGaussian()),
                  random.nextInt(30) == 0 ? 2 : 0),
              random.nextInt(10) == 0 ? null : Math.round(250 + random.nextGaussian() * 5) / 10.0,
              random.nextInt(5) != 0));
      t = t.plusSeconds(10);
      if (jitter) {
        t = t.plusNanos(1000L * (random.nextInt(2001) - 1000));
      }
    }
    return out;
  }

  private void send(List<Full> readings, int batch) {
    for (int i = 0; i < readings.size(); i += batch) {
      List<String> json = new ArrayList<>();
      for (Full f : readings.subList(i, Math.min(readings.size(), i + batch))) {
        Sent s = f.sent();
        int p = s.parameter().equals("sodium") ? 0 : 1;
        // only conductivities carry a temperature and the compensated flag
        String extra =
            ",\"quality\":\""
                + QUALITIES[s.quality()]
                + "\""
                + (p == 0 ? "" : ",\"compensated\":" + f.compensated())
                + (f.temperature() == null ? "" : ",\"sampleTemperatureCel\":" + f.temperature());
        json.add(
            ReadingsIngestIT.reading(
                s.point(), s.parameter(), s.time().toString(), s.value(), UNITS[p], extra));
      }
      var r = http.post("/api/v1/readings", "application/json", ReadingsIngestIT.batch(json));
      assertThat(r.statusCode()).as(r.body()).isEqualTo(200);
    }
    // the days' statistics, as autovacuum has them a minute after such a write: without them the
    // planner takes the minutes-old partitions for empty, and the reads below took 5-9 s each
    ingest.refreshStatistics(
        readings.stream().map(f -> dayOf(f.sent().time())).collect(Collectors.toSet()));
  }

  /**
   * A point's stored readings, hot rows and decoded blocks, as text with raw bits: parameter, time
   * in µs, value bits, quality, temperature bits (or "-"), compensated; sorted.
   */
  private List<String> storedState(String point) {
    List<String> out = new ArrayList<>();
    jdbc.query(
        "SELECT q.code, r.time, r.value, r.quality, r.sample_temperature_cel, r.compensated"
            + " FROM reading r JOIN reading_parameter q USING (parameter_key)"
            + " WHERE r.point_key = (SELECT point_key FROM reading_point WHERE sample_point_id = ?)",
        rs -> {
          double t = rs.getDouble(5);
          Double temperature = rs.wasNull() ? null : t;
          out.add(
              line(
                  rs.getString(1),
                  new ReadingBlock.Row(
                      PackedReadings.micros(rs.getTimestamp(2).toInstant()),
                      rs.getDouble(3),
                      rs.getShort(4),
                      temperature,
                      rs.getBoolean(6))));
        },
        point);
    jdbc.query(
        "SELECT q.code, p.block, p.count FROM reading_pack p JOIN reading_parameter q"
            + " USING (parameter_key)"
            + " WHERE p.point_key = (SELECT point_key FROM reading_point WHERE sample_point_id = ?)",
        rs -> {
          List<ReadingBlock.Row> rows = ReadingBlock.decode(rs.getBytes(2));
          assertThat(rows).hasSize(rs.getInt(3));
          String code = rs.getString(1);
          rows.forEach(r -> out.add(line(code, r)));
        },
        point);
    Collections.sort(out);
    return out;
  }

  private static String line(String code, ReadingBlock.Row r) {
    return String.format(
        Locale.ROOT,
        "%s %d %016x %d %s %b",
        code,
        r.micros(),
        Double.doubleToRawLongBits(r.value()),
        r.quality(),
        r.temperature() == null
            ? "-"
            : Long.toHexString(Double.doubleToRawLongBits(r.temperature())),
        r.compensated());
  }

  private boolean hasPartition(LocalDate day) {
    return jdbc.queryForObject(
        "SELECT to_regclass(?) IS NOT NULL", Boolean.class, Partitions.name("reading", day));
  }

  private static List<String> bits(List<StoredReading> readings) {
    return readings.stream()
        .map(
            r ->
                r.parameter()
                    + " "
                    + r.time()
                    + " "
                    + Long.toHexString(Double.doubleToRawLongBits(r.value()))
                    + " "
                    + r.quality()
                    + " "
                    + Long.toHexString(Double.doubleToRawLongBits(r.sampleTemperatureCel()))
                    + " "
                    + r.compensated())
        .toList();
  }

  @Test
  void packedReadingsReadBackBitForBit() {
    String point = TestPlants.feedwaterPoints(http, 1).get(0);
    Instant start = start(10);
    List<Full> readings = series(point, start, new Random(69), true);
    // in time order (batches out of order: theSameReadingsInAnotherOrderAndPackedEarlier...)
    send(readings, 1000);
    LocalDate day = dayOf(start);

    List<String> before = storedState(point);
    Instant from = start.minusSeconds(3600);
    Instant to = start.plus(Duration.ofHours(9));
    List<StoredReading> betweenBefore = store.between(point, from, to);
    List<StoredReading> loadedBefore = store.loadSince(Map.of(point, from)).get(point);
    assertThat(betweenBefore).hasSize(readings.size());

    Map<String, Object> readsBefore = reads(point, start);

    long packed = packer.packDay(day);
    assertThat(packed)
        .isEqualTo(readings.stream().filter(f -> dayOf(f.sent().time()).equals(day)).count())
        .isPositive();
    assertThat(hasPartition(day)).isFalse();
    assertThat(hasPartition(day.plusDays(1))).isTrue();
    assertThat(
            jdbc.queryForObject(
                "SELECT readings FROM reading_pack_day WHERE day = ?", Long.class, day))
        .isEqualTo(packed);

    assertThat(storedState(point)).isEqualTo(before);
    assertThat(bits(store.between(point, from, to))).isEqualTo(bits(betweenBefore));
    List<StoredReading> loaded = store.loadSince(Map.of(point, from)).get(point);
    List<StoredReading> sortedBefore = new ArrayList<>(loadedBefore);
    sortedBefore.sort(ReadingStore.TIME_ORDER);
    assertThat(bits(loaded)).isEqualTo(bits(sortedBefore));
    // a range that starts inside a block and ends before the next day
    Instant mid = start.plusSeconds(1234);
    Instant midEnd = start.plus(Duration.ofMinutes(200));
    assertThat(bits(store.between(point, mid, midEnd)))
        .isEqualTo(
            bits(
                betweenBefore.stream()
                    .filter(r -> r.time().isAfter(mid) && !r.time().isAfter(midEnd))
                    .toList()));

    assertReadsEqual(reads(point, start), readsBefore);
    // the next day packed too: every reading in blocks
    assertThat(packer.packDay(day.plusDays(1))).isPositive();
    assertThat(storedState(point)).isEqualTo(before);
    assertReadsEqual(reads(point, start), readsBefore);

    // sending the same readings again changes nothing and keeps no revision
    send(readings, 1000);
    assertThat(storedState(point)).isEqualTo(before);
    assertThat(hasPartition(day)).as("a packed day gets no partition again").isFalse();
    assertThat(
            jdbc.queryForObject(
                "SELECT count(*) FROM reading_revision WHERE point_key = (SELECT point_key FROM"
                    + " reading_point WHERE sample_point_id = ?)",
                Long.class,
                point))
        .isZero();
  }

  @Test
  void correctionsAfterPackingRewriteBlocksKeepRevisionsAndRollups() {
    String point = TestPlants.feedwaterPoints(http, 1).get(0);
    Instant start = start(12);
    LocalDate day = dayOf(start);
    Random random = new Random(70);
    List<Full> readings = series(point, start, random, false);
    send(readings, 1000);
    packer.packDay(day);
    assertThat(hasPartition(day)).isFalse();

    Map<String, Full> state = new HashMap<>();
    readings.forEach(f -> state.put(key(f.sent()), f));
    // corrections of random readings (either day), late readings between the packed ones, and
    // one hour of the packed day turned bad entirely
    List<Full> changes = new ArrayList<>();
    Map<String, Double> replaced = new TreeMap<>();
    for (int i = 0; i < readings.size() / 10; i++) {
      Full f = readings.get(random.nextInt(readings.size()));
      Sent s = f.sent();
      if (replaced.containsKey(key(s))) {
        continue;
      }
      replaced.put(key(s), s.value());
      changes.add(
          new Full(
              new Sent(s.point(), s.parameter(), s.time(), s.value() * 1.5, random.nextInt(3)),
              f.temperature(),
              f.compensated()));
    }
    for (int i = 0; i < 50; i++) {
      Instant t = start.plusSeconds(5 + 10L * random.nextInt(4 * 360));
      Sent s = new Sent(point, "sodium", t, 0.321, 0);
      if (!replaced.containsKey(key(s))) {
        changes.add(new Full(s, null, true));
      }
    }
    Instant badHour = start.plus(Duration.ofHours(2));
    for (Full f : readings) {
      Sent s = f.sent();
      if (s.parameter().equals("sodium")
          && s.time().truncatedTo(ChronoUnit.HOURS).equals(badHour)
          && !replaced.containsKey(key(s))) {
        replaced.put(key(s), s.value());
        changes.add(
            new Full(
                new Sent(s.point(), s.parameter(), s.time(), s.value(), 2),
                f.temperature(),
                f.compensated()));
      }
    }
    Collections.shuffle(changes, random);
    send(changes, 300);
    changes.forEach(f -> state.put(key(f.sent()), f));

    assertThat(hasPartition(day)).as("a packed day gets no partition again").isFalse();
    // the stored readings are the final state
    List<String> expected = new ArrayList<>();
    for (Full f : state.values()) {
      Sent s = f.sent();
      expected.add(
          line(
              s.parameter(),
              new ReadingBlock.Row(
                  PackedReadings.micros(s.time()),
                  s.value(),
                  (short) s.quality(),
                  f.temperature(),
                  f.compensated())));
    }
    Collections.sort(expected);
    assertThat(storedState(point)).isEqualTo(expected);
    // every replaced reading kept, packed or hot, with its old and new value
    Map<String, Double> revised = new TreeMap<>();
    jdbc.query(
        "SELECT q.code, r.time, r.old_value FROM reading_revision r"
            + " JOIN reading_parameter q USING (parameter_key)"
            + " WHERE r.point_key = (SELECT point_key FROM reading_point WHERE sample_point_id = ?)",
        rs -> {
          revised.put(
              point + '/' + rs.getString(1) + '/' + rs.getTimestamp(2).toInstant(),
              rs.getDouble(3));
        },
        point);
    assertThat(revised).isEqualTo(replaced);
    assertThat(revised.keySet())
        .anyMatch(k -> Instant.parse(k.substring(k.lastIndexOf('/') + 1)).isBefore(badHour));
    // rollups equal the aggregates of the final readings
    Map<String, Sent> sent = new HashMap<>();
    state.forEach((k, f) -> sent.put(k, f.sent()));
    List<String> points = List.of(point);
    ReadingRollupsIT.assertSame(
        ReadingRollupsIT.stored(jdbc, "reading_rollup_hour", points),
        ReadingRollupsIT.expected(sent, ChronoUnit.HOURS));
    ReadingRollupsIT.assertSame(
        ReadingRollupsIT.stored(jdbc, "reading_rollup_day", points),
        ReadingRollupsIT.expected(sent, ChronoUnit.DAYS));
  }

  @Test
  void theSameReadingsInAnotherOrderAndPackedEarlierGiveTheSameState() {
    List<String> points = TestPlants.feedwaterPoints(http, 2);
    Instant start = start(14);
    LocalDate day = dayOf(start);
    List<Full> a = series(points.get(0), start, new Random(71), false);
    List<Full> b = new ArrayList<>();
    for (Full f : a) {
      Sent s = f.sent();
      b.add(
          new Full(
              new Sent(points.get(1), s.parameter(), s.time(), s.value(), s.quality()),
              f.temperature(),
              f.compensated()));
    }
    // A: in time order, packed afterwards
    send(a, 500);
    // B: a wrong value first for some, then half of them shuffled; the day packed (A's too);
    // then the other half and the right values, shuffled, into the blocks
    Random random = new Random(72);
    List<Full> wrong = new ArrayList<>();
    for (int i = 0; i < 200; i++) {
      Full f = b.get(random.nextInt(b.size()));
      Sent s = f.sent();
      wrong.add(
          new Full(new Sent(s.point(), s.parameter(), s.time(), s.value() + 1, 0), null, false));
    }
    send(wrong, 200);
    List<Full> shuffled = new ArrayList<>(b);
    Collections.shuffle(shuffled, random);
    send(shuffled.subList(0, shuffled.size() / 2), 333);
    packer.packDay(day);
    send(shuffled.subList(shuffled.size() / 2, shuffled.size()), 333);

    List<String> stateA =
        storedState(points.get(0)).stream().map(l -> l.replace(points.get(0), "P")).toList();
    List<String> stateB =
        storedState(points.get(1)).stream().map(l -> l.replace(points.get(1), "P")).toList();
    assertThat(stateB).isEqualTo(stateA).hasSize(a.size());
    for (String table : List.of("reading_rollup_hour", "reading_rollup_day")) {
      Map<String, ReadingRollupsIT.Expected> ra = new TreeMap<>();
      ReadingRollupsIT.stored(jdbc, table, List.of(points.get(0)))
          .forEach((k, v) -> ra.put(k.replace(points.get(0), "P"), v));
      Map<String, ReadingRollupsIT.Expected> rb = new TreeMap<>();
      ReadingRollupsIT.stored(jdbc, table, List.of(points.get(1)))
          .forEach((k, v) -> rb.put(k.replace(points.get(1), "P"), v));
      ReadingRollupsIT.assertSame(rb, ra);
    }
    // the evaluations of both points are the same too
    List<String> evalA = evaluations(points.get(0));
    assertThat(evaluations(points.get(1))).isEqualTo(evalA).isNotEmpty();
  }

  private List<String> evaluations(String point) {
    return jdbc.queryForList(
        "SELECT time::text || ' ' || coalesce(cation_conductivity_25::text, '-') || ' '"
            + " || coalesce(points_at::text, '-') || ' '"
            + " || coalesce(encode(detail_pack, 'hex'), '-') FROM evaluation"
            + " WHERE point_key = (SELECT point_key FROM reading_point WHERE sample_point_id = ?)"
            + " ORDER BY time",
        String.class,
        point);
  }

  /** What the read APIs answer for the point's series around its readings. */
  private Map<String, Object> reads(String point, Instant start) {
    Map<String, Object> out = new TreeMap<>();
    Instant from = start.minusSeconds(3600);
    Instant to = start.plus(Duration.ofHours(9));
    for (String code : PARAMETERS) {
      StoredSeries.Source source = StoredSeries.Source.readings(code);
      out.put(code + " raw", series.raw(point, source, from, to, null, 1_000_000));
      out.put(
          code + " raw after",
          series.raw(point, source, from, to, start.plusSeconds(7777).plusNanos(3000), 500));
      out.put(
          code + " bucketedRaw",
          series.bucketedRaw(point, source, from, to, Duration.ofMinutes(15)));
      // rollups for whole hours, raw for the hour around each boundary off the hour
      out.put(
          code + " bucketed",
          series.bucketed(
              point, source, from.plusSeconds(1800), to.minusSeconds(77), Duration.ofHours(2)));
      out.put(
          code + " judged", history.judged(point, code, code.toUpperCase(Locale.ROOT), from, to));
      out.put(
          code + " latestNotBad",
          history.latestNotBad(point, code, start.plusSeconds(3000), start.plusSeconds(3600)));
    }
    List<ReadingHistory.PointReading> minutes =
        new ArrayList<>(history.lastPerMinute(List.of(point), List.of(PARAMETERS), from, to));
    minutes.sort(
        java.util.Comparator.comparing(ReadingHistory.PointReading::time)
            .thenComparing(ReadingHistory.PointReading::parameter));
    out.put("lastPerMinute", minutes);
    List<String> judgedSince = new ArrayList<>();
    history.judgedSince(
        Map.of(point, from),
        List.of(PARAMETERS),
        to,
        (p, code, micros, value, inDoubt, calculated, phInDoubt) ->
            judgedSince.add(
                code
                    + " "
                    + micros
                    + " "
                    + Double.doubleToRawLongBits(value)
                    + " "
                    + inDoubt
                    + " "
                    + calculated
                    + " "
                    + phInDoubt));
    out.put("judgedSince", judgedSince);
    Map<String, String> slots =
        slotCounts(
            point,
            from,
            to,
            "900 seconds",
            "{[\"" + from.plusSeconds(1800) + "\",\"" + to.minusSeconds(7200) + "\")}");
    assertThat(slots).hasSize(2);
    out.put("slotCounts", slots);
    // slots of 21 min from 19:00: one spans midnight, between a packed and a hot day
    out.put(
        "slotCounts of 21 min",
        slotCounts(point, from, to, "1260 seconds", "{[\"" + from + "\",\"" + to + "\")}"));
    out.put("latestPerParameter", bits(history.latestPerParameter(point, from)));
    out.put(
        "latestPerParameter of points",
        bits(history.latestPerParameter(List.of(point), from).get(point)));
    return out;
  }

  /** {@link ReadingHistory#slotCounts} as "point|parameter" to "with data/good". */
  private Map<String, String> slotCounts(
      String point, Instant from, Instant to, String interval, String inService) {
    Map<String, String> out = new TreeMap<>();
    history
        .slotCounts(point, String.join(",", PARAMETERS), from, to, interval, inService)
        .forEach((k, v) -> out.put(k, v[0] + "/" + v[1]));
    return out;
  }

  /** Equal, the bucket means up to the rounding of their sums. */
  private static void assertReadsEqual(Map<String, Object> actual, Map<String, Object> expected) {
    assertThat(actual.keySet()).isEqualTo(expected.keySet());
    expected.forEach(
        (k, e) -> {
          Object a = actual.get(k);
          if (k.contains("bucketed")) {
            @SuppressWarnings("unchecked")
            List<StoredSeries.Bucket> ab = (List<StoredSeries.Bucket>) a;
            @SuppressWarnings("unchecked")
            List<StoredSeries.Bucket> eb = (List<StoredSeries.Bucket>) e;
            assertThat(ab).as(k).hasSameSizeAs(eb).isNotEmpty();
            for (int i = 0; i < eb.size(); i++) {
              StoredSeries.Bucket x = ab.get(i);
              StoredSeries.Bucket y = eb.get(i);
              assertThat(List.of(x.start(), x.min(), x.max(), x.last(), x.count()))
                  .as(k)
                  .isEqualTo(List.of(y.start(), y.min(), y.max(), y.last(), y.count()));
              assertThat(x.mean())
                  .as(k)
                  .isCloseTo(y.mean(), org.assertj.core.api.Assertions.within(1e-14));
            }
          } else {
            assertThat(a).as(k).isEqualTo(e);
          }
        });
    assertThat((List<?>) expected.get("sodium raw")).isNotEmpty();
    assertThat((List<?>) expected.get("judgedSince")).isNotEmpty();
  }

  private static String key(Sent s) {
    return s.point() + '/' + s.parameter() + '/' + s.time();
  }

  @Test
  void retentionDeletesPackedBlocks() {
    String point = TestPlants.feedwaterPoints(http, 1).get(0);
    Instant start = start(30);
    send(series(point, start, new Random(73), false).subList(0, 100), 100);
    // the schedule's path: every day that ends at or before the horizon, and only those
    Instant horizon = start.truncatedTo(ChronoUnit.DAYS).plus(Duration.ofDays(1));
    assertThat(packer.packBefore(horizon.minusSeconds(1))).doesNotContain(dayOf(start));
    assertThat(hasPartition(dayOf(start))).isTrue();
    assertThat(packer.packBefore(horizon))
        .contains(dayOf(start))
        .allMatch(d -> d.isBefore(dayOf(horizon)));
    assertThat(hasPartition(dayOf(start))).isFalse();
    assertThat(storedState(point)).hasSize(100);
    assertThat(
            jdbc.queryForObject(
                "SELECT count(*) FROM reading_pack_day WHERE day = ?", Long.class, dayOf(start)))
        .isOne();
    packedReadings.deleteBefore(dayOf(start).plusDays(1));
    assertThat(storedState(point)).isEmpty();
    assertThat(
            jdbc.queryForObject(
                "SELECT count(*) FROM reading_pack_day WHERE day = ?", Long.class, dayOf(start)))
        .isZero();
  }

  @Autowired javax.sql.DataSource dataSource;

  /**
   * A transaction elsewhere that holds the parent {@code reading} (a long query, or an ingest that
   * wrote another day) makes the packer's {@code DROP} wait: it waits at most half a second per
   * attempt, so that whatever queues behind it waits no longer, and tries again; the day is packed
   * once the transaction ends. A transaction that outlasts every attempt leaves the day as it was
   * (nothing packed, nothing lost) for the next run.
   */
  @Test
  void aDropThatMustWaitGivesWayAndTheDayIsPackedLater() throws Exception {
    String point = TestPlants.feedwaterPoints(http, 1).get(0);
    Instant start = start(20);
    LocalDate day = dayOf(start);
    send(series(point, start, new Random(91), false).subList(0, 200), 200);
    List<String> before = storedState(point);
    assertThat(before).hasSize(200);
    try (java.sql.Connection c = dataSource.getConnection()) {
      c.setAutoCommit(false);
      try (java.sql.Statement st = c.createStatement()) {
        st.execute("LOCK TABLE ONLY reading IN ACCESS SHARE MODE");
        // one attempt: the DROP times out, the packing is given up for this run
        assertThat(packedReadings.pack(day, 1)).isEqualTo(-2);
        assertThat(hasPartition(day)).isTrue();
        assertThat(storedState(point)).isEqualTo(before);
        assertThat(
                jdbc.queryForObject(
                    "SELECT count(*) FROM reading_pack_day WHERE day = ?", Long.class, day))
            .isZero();
        // the default attempts: the holder lets go during them
        java.util.concurrent.CompletableFuture<Long> packing =
            java.util.concurrent.CompletableFuture.supplyAsync(() -> packer.packDay(day));
        Thread.sleep(1200);
        assertThat(packing).isNotDone();
        c.commit();
        assertThat(packing.get(30, java.util.concurrent.TimeUnit.SECONDS)).isEqualTo(200);
      }
    }
    assertThat(hasPartition(day)).isFalse();
    assertThat(storedState(point)).isEqualTo(before);
  }

  /**
   * An ingest-like transaction that holds the parent {@code reading} (it wrote another day) and
   * then waits to write into the day being packed: the packer gives the day up instead of waiting
   * on it, so the transaction is not aborted as a deadlock and writes; the day is packed on the
   * next run.
   */
  @Test
  void aWriterWaitingOnThePackedDayGoesFirst() throws Exception {
    String point = TestPlants.feedwaterPoints(http, 1).get(0);
    Instant start = start(22);
    LocalDate day = dayOf(start);
    send(series(point, start, new Random(93), false).subList(0, 100), 100);
    String partition = Partitions.name("reading", day);
    java.util.concurrent.CompletableFuture<Long> packing;
    try (java.sql.Connection c = dataSource.getConnection()) {
      c.setAutoCommit(false);
      try (java.sql.Statement st = c.createStatement()) {
        st.execute("LOCK TABLE ONLY reading IN ROW EXCLUSIVE MODE");
        // the packer holds the day against writes, then waits for the DROP's lock, held by us
        packing = java.util.concurrent.CompletableFuture.supplyAsync(() -> packer.packDay(day));
        long until = System.nanoTime() + 20_000_000_000L;
        while (!jdbc.queryForObject(
            "SELECT EXISTS (SELECT 1 FROM pg_locks WHERE relation = ?::regclass"
                + " AND mode = 'ShareLock' AND granted)",
            Boolean.class,
            partition)) {
          assertThat(System.nanoTime()).as("the packer locked the day").isLessThan(until);
          Thread.sleep(5);
        }
        // now we wait to write into the day, as a late reading would, for longer than
        // deadlock_timeout: a deadlock would be found and one of the two aborted
        st.execute("LOCK TABLE " + partition + " IN ROW EXCLUSIVE MODE");
        Thread.sleep(1500);
      }
      c.commit();
    }
    assertThat(packing.get(30, java.util.concurrent.TimeUnit.SECONDS)).isEqualTo(-2);
    assertThat(hasPartition(day)).isTrue();
    assertThat(packer.packDay(day)).isEqualTo(100);
    assertThat(hasPartition(day)).isFalse();
    assertThat(storedState(point)).hasSize(100);
  }

  @Autowired PackedReadings packedReadings;
}
