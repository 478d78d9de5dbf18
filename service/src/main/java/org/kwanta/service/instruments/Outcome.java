package org.kwanta.service.instruments;

/** How a check ended. A failed check does not restart the interval: the check is still due. */
public enum Outcome {
  /** Within tolerance, nothing changed. */
  PASSED,
  /** Out of tolerance and adjusted (recalibrated, resin or parts replaced): fit for use again. */
  ADJUSTED,
  /** Failed and not put right: the instrument's data stay in doubt until a later check. */
  FAILED
}
