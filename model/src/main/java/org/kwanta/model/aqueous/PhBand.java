package org.kwanta.model.aqueous;

import java.util.List;

/**
 * pH at temperature evaluated with every distinct alternative constant set, so the spread between
 * published data is visible.
 *
 * @param minPh lowest pH, molal activity scale
 * @param minSet the constant set that gave it
 * @param maxPh highest pH
 * @param maxSet the constant set that gave it
 * @param members every evaluated set (sets that select the same fits for the components present as
 *     an earlier set are not repeated)
 */
public record PhBand(
    double minPh, String minSet, double maxPh, String maxSet, List<Member> members) {

  public PhBand {
    members = List.copyOf(members);
  }

  /** Width of the band, pH units. */
  public double width() {
    return maxPh - minPh;
  }

  /**
   * One evaluated set.
   *
   * @param constantSet the set's name
   * @param ph pH at temperature with that set
   * @param extrapolated true when the set used a constant outside its fit's stated range
   */
  public record Member(String constantSet, double ph, boolean extrapolated) {}
}
