package org.kwanta.model.limits;

/** Which way a profile's thresholds point: all high, all low, or some of each. */
public enum Direction {
  HIGH,
  LOW,
  BOTH
}
