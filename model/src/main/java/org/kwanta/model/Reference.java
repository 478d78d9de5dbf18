package org.kwanta.model;

/**
 * A published source behind an equation or a constant.
 *
 * @param id short stable identifier used in API output (for example {@code "IAPWS R11-07"})
 * @param citation full citation: body or authors, title, year, where published
 * @param confidence how far the numbers were checked: a retrieved source reproduced by a check
 *     table, or recalled from memory and still to be verified
 */
public record Reference(String id, String citation, Confidence confidence) {

  /** How well the coefficients behind a reference are established. */
  public enum Confidence {
    /** Implementation reproduces the publication's own check table. */
    VERIFIED_BY_CHECK_TABLE,
    /** Taken from a retrieved public source, without a published check table. */
    RETRIEVED,
    /** Recalled from memory: provisional until checked against the primary publication. */
    FROM_MEMORY,
    /** Estimated by analogy or extrapolation: no measurement behind it. */
    ESTIMATED
  }
}
