package org.kwanta.model.conductivity;

/**
 * Total amounts of the solutes the conductivity model handles, mol/kg of water (molality, which
 * does not change when the sample is heated or cooled).
 *
 * @param alkalizer total of the configured alkalizer or alkalizer mix (B + BH⁺), mol/kg
 * @param sodium sodium (as a strong cation), mol/kg
 * @param chloride chloride, or strong-acid anions counted as chloride equivalents, mol/kg
 * @param sulfate sulfate, mol/kg (fully dissociated; HSO₄⁻ is negligible above pH 4)
 * @param carbonate total inorganic carbon CO₂ + HCO₃⁻ + CO₃²⁻, mol/kg
 * @param phosphate total phosphate, mol/kg
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
}
