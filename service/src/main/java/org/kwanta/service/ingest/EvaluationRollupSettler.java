package org.kwanta.service.ingest;

import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.springframework.scheduling.annotation.Scheduled;
import org.springframework.stereotype.Component;

/**
 * Settles the derived series' marked rollup hours off the ingest path, every five seconds, until
 * none is left ({@link EvaluationRollups#settle}). Several instances share the work (each skips the
 * marks another is settling). Readers never wait for it: a marked hour is read from the
 * evaluations.
 */
@Component
class EvaluationRollupSettler {

  private static final Logger log = LoggerFactory.getLogger(EvaluationRollupSettler.class);

  private final EvaluationRollups rollups;

  EvaluationRollupSettler(EvaluationRollups rollups) {
    this.rollups = rollups;
  }

  @Scheduled(fixedDelay = 5_000, initialDelay = 5_000)
  void settle() {
    try {
      while (rollups.settle() == EvaluationRollups.SETTLE_BATCH) {
        // more marked hours than one round takes
      }
    } catch (RuntimeException e) {
      // the marks stay; readers use the evaluations for those hours meanwhile
      log.warn("Derived-series rollups not settled this round: {}", e.getMessage());
    }
  }
}
