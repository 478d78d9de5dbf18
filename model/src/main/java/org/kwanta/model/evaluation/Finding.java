package org.kwanta.model.evaluation;

import org.kwanta.model.Instrument;

/**
 * One fired check.
 *
 * @param code why
 * @param pointsAt the instrument (or the sample conditioning, or the process) it points at
 * @param explanation one sentence with the numbers behind it
 * @param evidence what was expected, what was read, the residual and its tolerance; null for the
 *     checks that compare no prediction (stale, flat line, out of range, ...)
 */
public record Finding(ReasonCode code, Instrument pointsAt, String explanation, Evidence evidence) {

  /** A finding without a prediction behind it. */
  public Finding(ReasonCode code, Instrument pointsAt, String explanation) {
    this(code, pointsAt, explanation, null);
  }

  /**
   * The numbers behind a finding that compares a channel with what the other channels predict.
   *
   * @param quantity what is compared, e.g. "cation conductivity rise"
   * @param unit its unit (UCUM code)
   * @param expected the value predicted from the other channels (or the baseline)
   * @param read the value read
   * @param tolerance the residual that would still count as agreement (same unit)
   */
  public record Evidence(
      String quantity, String unit, double expected, double read, double tolerance) {

    /** read − expected. */
    public double residual() {
      return read - expected;
    }
  }
}
