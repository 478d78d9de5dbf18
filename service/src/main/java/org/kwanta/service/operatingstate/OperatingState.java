package org.kwanta.service.operatingstate;

/**
 * What a plant block is doing, as a chemist records it. Only {@link #IN_SERVICE} time counts
 * towards excursion hours, monthly hours per level and instrument availability.
 */
public enum OperatingState {
  /** Generating (or producing steam) in normal operation. */
  IN_SERVICE,
  /** From the first firing to the end of the start-up procedure; hold points apply. */
  START_UP,
  /** Off and not laid up (a short stop, or waiting for a layup decision). */
  SHUT_DOWN,
  /** Laid up filled with conditioned water. */
  LAYUP_WET,
  /** Laid up drained and dried (dehumidified air or nitrogen). */
  LAYUP_DRY
}
