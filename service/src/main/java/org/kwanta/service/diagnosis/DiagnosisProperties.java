package org.kwanta.service.diagnosis;

import java.time.Duration;
import org.kwanta.model.diagnosis.Diagnoser;
import org.springframework.boot.context.properties.ConfigurationProperties;

/**
 * Settings of the diagnosis over time ({@code kwanta.diagnosis.*}); defaults as {@link
 * Diagnoser.Settings#defaults()}. Engineering choices (common practice, no source): see
 * docs/diagnosis.md.
 *
 * @param baselinePeriod how much history a channel's baseline is the median of (PT24H)
 * @param baselineGap the most recent time left out of the baseline (PT60M)
 * @param driftWindow how far back the drift test sums (PT8H)
 * @param processPersistence minutes a process finding must hold (3)
 * @param instrumentPersistence minutes an instrument finding must hold (10)
 */
@ConfigurationProperties("kwanta.diagnosis")
public record DiagnosisProperties(
    Duration baselinePeriod,
    Duration baselineGap,
    Duration driftWindow,
    Integer processPersistence,
    Integer instrumentPersistence) {

  /** The engine's settings (throws on values out of range, so a bad setting stops the start). */
  public Diagnoser.Settings settings() {
    Diagnoser.Settings d = Diagnoser.Settings.defaults();
    return new Diagnoser.Settings(
        baselinePeriod == null ? d.baselinePeriod() : baselinePeriod,
        baselineGap == null ? d.baselineGap() : baselineGap,
        driftWindow == null ? d.cusumWindow() : driftWindow,
        processPersistence == null ? d.processPersistence() : processPersistence,
        instrumentPersistence == null ? d.instrumentPersistence() : instrumentPersistence);
  }
}
