package org.kwanta.model.limits;

/** Which way a threshold is crossed. */
public enum Side {
  /** Exceeded when the value is strictly above the threshold. */
  HIGH,
  /** Exceeded when the value is strictly below the threshold. */
  LOW
}
