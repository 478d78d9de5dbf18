package org.kwanta.service.events;

/** Where an excursion event stands. */
public enum EventStatus {
  /** Recorded, not yet looked into. */
  OPEN,
  /** Being investigated. */
  UNDER_INVESTIGATION,
  /** Cause found and dealt with, or accepted. */
  CLOSED
}
