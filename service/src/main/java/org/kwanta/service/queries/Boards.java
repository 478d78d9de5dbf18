package org.kwanta.service.queries;

import jakarta.annotation.PreDestroy;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import org.kwanta.service.diagnosis.DiagnosisService;
import org.kwanta.service.plants.PlantDeclaration;
import org.kwanta.service.plants.Plants;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.stereotype.Component;
import tools.jackson.databind.json.JsonMapper;

/**
 * The plants' boards (the overview: every point's latest values, levels and diagnosis), kept up to
 * date off the request path.
 *
 * <p>A board is computed whole at one time, its {@code asOf}: the latest readings and evaluation,
 * the levels at that time ({@link LevelWindows}) and the current diagnosis ({@link
 * DiagnosisService#current}), the same code and answer a request computed before; with it its weak
 * tag ({@link OverviewTags}) and its JSON. A request answers the plant's last board while it is at
 * most {@code kwanta.board.max-lag} old, and computes a new one otherwise. Every {@code
 * kwanta.board.refresh} a thread of its own recomputes the boards asked for in the last {@link
 * #UNUSED} whose data changed: the points' generations (migration V31: this instance's writes and
 * any other instance's alike) or the limits fingerprint ({@link States#freshness}), or that are
 * half the lag old (what changes with the clock alone: a value leaving the level window, a point
 * without data for an hour leaving the diagnosis). A board is thus as it was at its {@code asOf},
 * which the answer gives, and under a live feed trails the last write by about one refresh and its
 * computation.
 *
 * <p>{@code kwanta.board.max-lag} of zero computes every board on its request (no thread).
 */
@Component
class Boards {

  private static final Logger log = LoggerFactory.getLogger(Boards.class);

  /** Boards not asked for this long are dropped, not refreshed. */
  static final Duration UNUSED = Duration.ofMinutes(5);

  private final Plants plants;
  private final States states;
  private final DiagnosisService diagnosis;
  private final JsonMapper mapper;
  private final CurrentLevels levels;
  private final Clock clock;
  private final Duration maxLag;
  private final Map<String, Board> boards = new ConcurrentHashMap<>();
  private final Map<String, Instant> lastAsked = new ConcurrentHashMap<>();
  private final java.util.Set<String> failing = ConcurrentHashMap.newKeySet();
  private final ScheduledExecutorService refresher;

  Boards(
      Plants plants,
      States states,
      DiagnosisService diagnosis,
      JsonMapper mapper,
      CurrentLevels levels,
      Clock clock,
      @Value("${kwanta.board.max-lag:PT10S}") Duration maxLag,
      @Value("${kwanta.board.refresh:PT1S}") Duration refresh) {
    this.plants = plants;
    this.states = states;
    this.diagnosis = diagnosis;
    this.mapper = mapper;
    this.levels = levels;
    this.clock = clock;
    this.maxLag = maxLag;
    if (maxLag.isZero() || maxLag.isNegative()) {
      this.refresher = null;
    } else {
      this.refresher =
          Executors.newSingleThreadScheduledExecutor(
              r -> {
                Thread t = new Thread(r, "kwanta-board");
                t.setDaemon(true);
                return t;
              });
      long ms = Math.max(50, refresh.toMillis());
      refresher.scheduleWithFixedDelay(this::refreshAll, ms, ms, TimeUnit.MILLISECONDS);
    }
  }

  /**
   * A plant's board as computed at {@code overview.asOf()}.
   *
   * @param freshness what it was computed on, read before anything else
   * @param tag its weak entity tag
   * @param json its JSON, as the overview endpoint answers it
   * @param timing the stages of its computation ({@code Server-Timing} when computed on a request)
   * @param millis the time its computation took, ms
   */
  record Board(
      PlantDeclaration plant,
      States.Freshness freshness,
      StateController.Overview overview,
      String tag,
      byte[] json,
      String timing,
      double millis) {}

  /**
   * The plant's board: the last one while at most the lag old and of the same declaration, else one
   * computed now.
   */
  Board of(PlantDeclaration plant) {
    if (refresher == null) {
      return compute(plant); // no lag: nothing kept
    }
    Instant now = clock.instant();
    lastAsked.put(plant.id(), now);
    Board b = boards.get(plant.id());
    if (b != null
        && b.plant().equals(plant)
        && !now.isBefore(b.overview().asOf())
        && Duration.between(b.overview().asOf(), now).compareTo(maxLag) <= 0) {
      return b;
    }
    return store(compute(plant));
  }

  /** Computes a plant's board now, as a request did before boards were kept. */
  Board compute(PlantDeclaration plant) {
    Instant now = clock.instant();
    long start = System.nanoTime();
    ServerTiming timing = new ServerTiming();
    // read first: a write during the computation makes the next refresh compute again
    States.Freshness freshness = states.freshness(plant.id(), now);
    timing.lap("freshness");
    Map<String, DiagnosisService.PointDiagnosis> current = diagnosis.current(plant.id());
    timing.lap("diagnosis");
    StateController.Overview overview =
        new StateController.Overview(
            plant.id(),
            plant.name(),
            now,
            states.board(
                freshness,
                plant.samplePoints().stream()
                    .map(
                        p ->
                            new States.Shown(
                                p.id(), p.name(), p.cycleLocation(), p.treatmentRegime()))
                    .toList(),
                now,
                current,
                timing));
    String tag = OverviewTags.of(mapper, overview, levels.window());
    timing.lap("tag");
    byte[] json = mapper.writeValueAsBytes(overview);
    timing.lap("json");
    return new Board(
        plant, freshness, overview, tag, json, timing.header(), (System.nanoTime() - start) / 1e6);
  }

  /** Keeps the later of the stored board and this one. */
  private Board store(Board b) {
    return boards.merge(
        b.plant().id(),
        b,
        (old, neu) -> neu.overview().asOf().isBefore(old.overview().asOf()) ? old : neu);
  }

  /** Recomputes the asked boards whose data changed or that are half the lag old. */
  void refreshAll() {
    Instant now = clock.instant();
    for (Map.Entry<String, Instant> asked : List.copyOf(lastAsked.entrySet())) {
      String plantId = asked.getKey();
      try {
        if (Duration.between(asked.getValue(), now).compareTo(UNUSED) > 0) {
          lastAsked.remove(plantId, asked.getValue());
          boards.remove(plantId);
          continue;
        }
        Board b = boards.get(plantId);
        if (b != null
            && Duration.between(b.overview().asOf(), now).compareTo(maxLag.dividedBy(2)) < 0
            && b.freshness().equals(states.freshness(plantId, now))) {
          continue;
        }
        PlantDeclaration plant = plants.find(plantId).orElse(null);
        if (plant == null) {
          boards.remove(plantId);
          lastAsked.remove(plantId);
          continue;
        }
        store(compute(plant));
        failing.remove(plantId);
      } catch (RuntimeException e) {
        // the board stays as it was; a request past the lag computes its own. Said once per run of
        // failures (a database outage would repeat it every refresh)
        if (failing.add(plantId)) {
          log.warn("Board of plant {} not refreshed: {}", plantId, e.getMessage());
        }
      }
    }
  }

  @PreDestroy
  void stop() {
    if (refresher != null) {
      refresher.shutdownNow();
    }
  }
}
