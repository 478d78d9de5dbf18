package org.kwanta.model.diagnosis;

import org.kwanta.model.conductivity.AlkalizerMix;
import org.kwanta.model.conductivity.ForwardConductivity;
import org.kwanta.model.conductivity.Solutes;

/**
 * What a cooling-water leak does to each conductivity channel of a water: the sodium it brings
 * comes with chloride and sulfate in the declared water's proportions ({@link CoolingWater}, as
 * {@link Ingress} uses them for the diagnosis); the other cations of the cooling water (Mg²⁺, Ca²⁺,
 * K⁺), which balance the anions beyond the sodium, are counted as sodium equivalents, so the
 * specific conductivity rise is slightly low (λ° per equivalent: Na⁺ 50.1, ½Mg²⁺ 53.0, ½Ca²⁺ 59.5,
 * K⁺ 73.5 S·cm²/mol, CRC). Bicarbonate is left out as in {@link CoolingWater}. The cation channels
 * see the anions as their acids, so their rise does not depend on the cations.
 */
public final class LeakChannels {

  static final double NA_G_PER_MOL = Ingress.NA_G_PER_MOL;

  private LeakChannels() {}

  /**
   * The channels before and after the leak.
   *
   * @param before the water's channels
   * @param after with the leak
   * @param leak the amounts the leak adds, mol/kg (sodium: sodium equivalents of all cations)
   */
  public record Rise(
      ForwardConductivity.Channels before, ForwardConductivity.Channels after, Solutes leak) {

    /** Specific conductivity rise, µS/cm at the temperature. */
    public double specific() {
      return after.specific().kappa() - before.specific().kappa();
    }

    /** Cation conductivity rise, µS/cm. */
    public double cation() {
      return after.cation().kappa() - before.cation().kappa();
    }

    /** Degassed cation conductivity rise, µS/cm. */
    public double degassedCation() {
      return after.degassedCation().kappa() - before.degassedCation().kappa();
    }
  }

  /**
   * The rise of each channel when cooling water of a kind enters a water, bringing a given sodium.
   *
   * @param water the water before the leak, mol/kg
   * @param mix its alkalizer mix
   * @param temperatureK the channels' temperature, K (0–100 °C)
   * @param kind the cooling water
   * @param sodiumUgPerKg the sodium the leak brings, µg/kg (≥ 0)
   * @throws IllegalArgumentException for a negative or non-finite sodium
   */
  public static Rise of(
      Solutes water,
      AlkalizerMix mix,
      double temperatureK,
      CoolingWater kind,
      double sodiumUgPerKg) {
    if (!(sodiumUgPerKg >= 0) || Double.isInfinite(sodiumUgPerKg)) {
      throw new IllegalArgumentException(
          "sodium of the leak must be a finite amount ≥ 0 µg/kg, not " + sodiumUgPerKg);
    }
    double na = sodiumUgPerKg / NA_G_PER_MOL / 1e6;
    double cl = na * kind.chloridePerSodium();
    double so4 = na * kind.sulfatePerSodium();
    Solutes leak = new Solutes(0, cl + 2 * so4, cl, so4, 0, 0);
    Solutes after =
        new Solutes(
            water.alkalizer(),
            water.sodium() + leak.sodium(),
            water.chloride() + cl,
            water.sulfate() + so4,
            water.carbonate(),
            water.phosphate());
    return new Rise(
        ForwardConductivity.of(water, mix, temperatureK),
        ForwardConductivity.of(after, mix, temperatureK),
        leak);
  }
}
