package org.kwanta.model.aqueous;

import java.util.List;

/**
 * The uncertainty of a pH at temperature, itemised into its parts, and their combination.
 *
 * <p>The parts ({@link Kind}): (a) instrument tolerances propagated through the inferred
 * composition; (b) the spread over the published constant sets ({@link ConstantSets}); (c) the
 * stated log10 K uncertainty of estimated or extrapolated constants ({@link ConstantUncertainty});
 * (d) the tolerance of the operating temperature and pressure. Each part gives how far the pH may
 * lie below and above the central value; a part that does not apply has zero width and says why.
 *
 * <p>Combination ({@link #RULE}): the parts are treated as independent and combined by the
 * root-sum-square of their half-widths, below and above the central pH separately: low = pH − √(Σ
 * below²), high = pH + √(Σ above²).
 *
 * @param ph the central pH (default constant set, central composition and state)
 * @param parts the four parts, in {@link Kind} order
 * @param low lower end of the combined band
 * @param high upper end of the combined band
 */
public record PhUncertainty(double ph, List<Part> parts, double low, double high) {

  /** How the parts are combined into {@link #low()} and {@link #high()}. */
  public static final String RULE =
      "root-sum-square of the parts' half-widths, below and above the central pH separately"
          + " (the parts taken as independent)";

  public PhUncertainty {
    parts = List.copyOf(parts);
  }

  /** Combines the parts by {@link #RULE}. */
  public static PhUncertainty combine(double ph, List<Part> parts) {
    double below = 0;
    double above = 0;
    for (Part p : parts) {
      below += p.below() * p.below();
      above += p.above() * p.above();
    }
    return new PhUncertainty(ph, parts, ph - Math.sqrt(below), ph + Math.sqrt(above));
  }

  /** The part of a kind. */
  public Part part(Kind kind) {
    for (Part p : parts) {
      if (p.kind() == kind) {
        return p;
      }
    }
    throw new IllegalArgumentException("no part " + kind);
  }

  /** The parts, each named for the API and labelled for the reader with its letter. */
  public enum Kind {
    /** (a) Instrument tolerances propagated through the inferred composition. */
    INSTRUMENT_TOLERANCES("instrumentTolerances", "(a) instrument tolerances"),
    /** (b) Spread of the pH over the published constant sets. */
    CONSTANT_SET_SPREAD("constantSetSpread", "(b) spread over the published constant sets"),
    /** (c) Stated log10 K uncertainty of estimated or extrapolated constants. */
    ESTIMATED_CONSTANTS(
        "estimatedConstants", "(c) estimated or extrapolated equilibrium constants"),
    /** (d) Tolerance of the operating temperature and pressure. */
    OPERATING_CONDITIONS("operatingConditions", "(d) operating temperature and pressure tolerance");

    private final String apiName;
    private final String label;

    Kind(String apiName, String label) {
      this.apiName = apiName;
      this.label = label;
    }

    /** The key of the part in API output, e.g. {@code constantSetSpread}. */
    public String apiName() {
      return apiName;
    }

    /** The label shown to the reader, with the part's letter. */
    public String label() {
      return label;
    }
  }

  /**
   * One part.
   *
   * @param kind which part
   * @param below how far the pH may lie below the central value, pH units (≥ 0)
   * @param above how far above, pH units (≥ 0)
   * @param lowConstantSet for (b): the set giving the lowest pH (the central set when none is
   *     lower); empty otherwise
   * @param highConstantSet for (b): the set giving the highest pH; empty otherwise
   * @param basis how the part was computed, or why it does not apply
   * @param contributions what makes up the part (one line per tolerance or constant)
   */
  public record Part(
      Kind kind,
      double below,
      double above,
      String lowConstantSet,
      String highConstantSet,
      String basis,
      List<Contribution> contributions) {

    public Part {
      contributions = List.copyOf(contributions);
    }

    /** A part of equal half-width on both sides. */
    public static Part symmetric(
        Kind kind, double halfWidth, String basis, List<Contribution> contributions) {
      return new Part(kind, halfWidth, halfWidth, "", "", basis, contributions);
    }

    /** A part that does not apply here, with the reason. */
    public static Part notApplicable(Kind kind, String why) {
      return new Part(kind, 0, 0, "", "", why, List.of());
    }

    /** The larger of {@link #below()} and {@link #above()}, pH units. */
    public double halfWidth() {
      return Math.max(below, above);
    }
  }

  /**
   * One contribution to a part.
   *
   * @param source what contributes, e.g. {@code cyclohexylammonium} or {@code temperature}
   * @param halfWidthPh its effect on the pH, ± pH units
   * @param detail the numbers behind it (tolerance or log10 K uncertainty, sensitivity, reason)
   */
  public record Contribution(String source, double halfWidthPh, String detail) {}
}
