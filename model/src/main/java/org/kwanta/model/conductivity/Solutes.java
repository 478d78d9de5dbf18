package org.kwanta.model.conductivity;

import java.util.EnumMap;
import java.util.Map;
import org.kwanta.model.aqueous.Component;
import org.kwanta.model.aqueous.Composition;

/**
 * Total amounts of the solutes the conductivity fits determine, mol/kg of water (molality, which
 * does not change when the sample is heated or cooled): the {@link Component}s a conductivity
 * channel can tell apart, grouped by the role they play in the fits ({@link #composition} gives the
 * same water as components). A flat record rather than a map because the fits build millions of
 * them.
 *
 * @param alkalizer total of the configured alkalizer or alkalizer mix (B + BH⁺), mol/kg
 * @param sodium {@link Component#SODIUM} (as a strong cation), mol/kg
 * @param chloride {@link Component#CHLORIDE}, or strong-acid anions counted as chloride
 *     equivalents, mol/kg
 * @param sulfate {@link Component#SULFATE}, mol/kg (fully dissociated; HSO₄⁻ is negligible above pH
 *     4)
 * @param carbonate {@link Component#CARBON_DIOXIDE}, total inorganic carbon CO₂ + HCO₃⁻ + CO₃²⁻,
 *     mol/kg
 * @param phosphate {@link Component#PHOSPHATE}, total phosphate, mol/kg
 */
public record Solutes(
    double alkalizer,
    double sodium,
    double chloride,
    double sulfate,
    double carbonate,
    double phosphate) {

  /** Pure water. */
  public static final Solutes NONE = new Solutes(0, 0, 0, 0, 0, 0);

  /** A copy with one amount replaced. */
  public Solutes with(Solute solute, double molality) {
    return switch (solute) {
      case ALKALIZER -> new Solutes(molality, sodium, chloride, sulfate, carbonate, phosphate);
      case SODIUM_HYDROXIDE ->
          new Solutes(alkalizer, molality, chloride, sulfate, carbonate, phosphate);
      case HYDROCHLORIC_ACID ->
          new Solutes(alkalizer, sodium, molality, sulfate, carbonate, phosphate);
      case SULFURIC_ACID ->
          new Solutes(alkalizer, sodium, chloride, molality, carbonate, phosphate);
      case CARBON_DIOXIDE -> new Solutes(alkalizer, sodium, chloride, sulfate, molality, phosphate);
      case PHOSPHORIC_ACID ->
          new Solutes(alkalizer, sodium, chloride, sulfate, carbonate, molality);
      case SODIUM_CHLORIDE ->
          new Solutes(alkalizer, molality, molality, sulfate, carbonate, phosphate);
    };
  }

  /** The amount of one solute, mol/kg (for sodium chloride: the sodium). */
  public double amount(Solute solute) {
    return switch (solute) {
      case ALKALIZER -> alkalizer;
      case SODIUM_HYDROXIDE, SODIUM_CHLORIDE -> sodium;
      case HYDROCHLORIC_ACID -> chloride;
      case SULFURIC_ACID -> sulfate;
      case CARBON_DIOXIDE -> carbonate;
      case PHOSPHORIC_ACID -> phosphate;
    };
  }

  /**
   * The same water as component totals (zero totals left out), the alkalizer split over the mix.
   *
   * @param mix the alkalizer or mix {@link #alkalizer()} refers to
   */
  public Composition composition(AlkalizerMix mix) {
    Map<Component, Double> totals = new EnumMap<>(Component.class);
    for (Map.Entry<Component, Double> e : mix.molarFractions().entrySet()) {
      totals.put(e.getKey(), alkalizer * e.getValue());
    }
    putNonZero(totals, Component.SODIUM, sodium);
    putNonZero(totals, Component.CHLORIDE, chloride);
    putNonZero(totals, Component.SULFATE, sulfate);
    putNonZero(totals, Component.CARBON_DIOXIDE, carbonate);
    putNonZero(totals, Component.PHOSPHATE, phosphate);
    return new Composition(totals);
  }

  private static void putNonZero(Map<Component, Double> totals, Component c, double total) {
    if (total != 0) {
      totals.put(c, total);
    }
  }
}
