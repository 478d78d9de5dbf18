package org.kwanta.service.instruments;

import java.time.Duration;
import org.springframework.boot.context.properties.ConfigurationProperties;

/**
 * Instrument care settings ({@code kwanta.instruments.*}): how often each check is due, and the
 * time slot of the availability count. The default intervals are examples of common practice (no
 * source); the plant's maintenance procedure governs.
 *
 * @param cellConstantCheck conductivity cell constant check (P180D)
 * @param bufferCalibration pH buffer calibration (P30D)
 * @param sodiumCalibration sodium analyser calibration (P30D)
 * @param cationResinChange cation column resin change (P30D)
 * @param dissolvedOxygenZeroSpan dissolved-oxygen zero and span (P90D)
 * @param availabilitySlot the slot of the availability and completeness counts (PT15M): a slot of
 *     in-service time counts as available when it holds at least one good reading not in doubt
 */
@ConfigurationProperties("kwanta.instruments")
public record InstrumentCareProperties(
    Duration cellConstantCheck,
    Duration bufferCalibration,
    Duration sodiumCalibration,
    Duration cationResinChange,
    Duration dissolvedOxygenZeroSpan,
    Duration availabilitySlot) {

  /** The interval of a kind of check. */
  public Duration interval(CheckKind kind) {
    Duration d =
        switch (kind) {
          case CELL_CONSTANT_CHECK -> cellConstantCheck;
          case BUFFER_CALIBRATION -> bufferCalibration;
          case SODIUM_CALIBRATION -> sodiumCalibration;
          case CATION_RESIN_CHANGE -> cationResinChange;
          case DISSOLVED_OXYGEN_ZERO_SPAN -> dissolvedOxygenZeroSpan;
          case GRAB_COMPARISON ->
              throw new IllegalArgumentException("a grab comparison has no interval");
        };
    if (d != null) {
      return d;
    }
    return switch (kind) {
      case CELL_CONSTANT_CHECK -> Duration.ofDays(180);
      case DISSOLVED_OXYGEN_ZERO_SPAN -> Duration.ofDays(90);
      default -> Duration.ofDays(30);
    };
  }

  /** The availability slot. */
  public Duration slot() {
    Duration s = availabilitySlot == null ? Duration.ofMinutes(15) : availabilitySlot;
    if (s.compareTo(Duration.ofMinutes(1)) < 0 || s.compareTo(Duration.ofDays(1)) > 0) {
      throw new IllegalArgumentException(
          "kwanta.instruments.availability-slot must lie between PT1M and P1D; was " + s);
    }
    return s;
  }
}
