package org.kwanta.model.diagnosis;

import java.util.concurrent.ConcurrentHashMap;
import org.kwanta.model.conductivity.AlkalizerMix;
import org.kwanta.model.conductivity.Conductivity;
import org.kwanta.model.conductivity.Equilibria;
import org.kwanta.model.conductivity.Solute;
import org.kwanta.model.conductivity.Solutes;
import org.kwanta.model.conductivity.SolutionModel;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.model.water.Water;

/**
 * What a cooling-water leak does to cation conductivity: the sodium it brings comes with chloride
 * and sulfate in the water's proportions ({@link CoolingWater}); after the cation exchanger those
 * are hydrochloric and sulfuric acid. The rise is computed with the project's solution model at 25
 * °C on top of the acids already there (the baseline cation conductivity read as hydrochloric
 * acid), because near pure water an acid also suppresses the water's own ions and the rise is less
 * than the limiting conductivities alone would say (reference notes §5.4: pure NaCl, 1/5/10 µg/kg
 * Na gives +0.008/+0.059/+0.142 µS/cm from pure water).
 */
final class Ingress {

  static final double NA_G_PER_MOL = 22.98977;

  private static final SolutionModel MODEL_25 =
      new SolutionModel(
          Conductivity.at(
              Water.at(298.15, Water.ATMOSPHERIC_PRESSURE_PA, IonizationFormulation.R11_07)),
          Equilibria.of(
              Water.at(298.15, Water.ATMOSPHERIC_PRESSURE_PA, IonizationFormulation.R11_07)),
          AlkalizerMix.AMMONIA);

  private static final ConcurrentHashMap<Double, Solutes> BACKGROUND = new ConcurrentHashMap<>();

  private Ingress() {}

  /**
   * The cation conductivity rise, µS/cm at 25 °C, that a leak bringing {@code sodiumUgPerKg} of
   * sodium would cause on top of a baseline cation conductivity.
   *
   * @param sodiumUgPerKg the sodium rise, µg/kg (≤ 0 gives 0)
   * @param baselineCation the baseline cation conductivity, µS/cm at 25 °C
   */
  static double cationRise(double sodiumUgPerKg, double baselineCation, CoolingWater water) {
    if (!(sodiumUgPerKg > 0)) {
      return 0;
    }
    Solutes background = background(baselineCation);
    double na = sodiumUgPerKg / NA_G_PER_MOL / 1e6;
    Solutes leak =
        new Solutes(
            0,
            0,
            background.chloride() + na * water.chloridePerSodium(),
            background.sulfate() + na * water.sulfatePerSodium(),
            0,
            0);
    return MODEL_25.solve(leak).kappa() - MODEL_25.solve(background).kappa();
  }

  /** The baseline read as hydrochloric acid (pure water when at or below its conductivity). */
  static Solutes background(double baselineCation) {
    double key = Math.round(baselineCation * 1e4) / 1e4; // 0.0001 µS/cm resolution
    return BACKGROUND.computeIfAbsent(
        key,
        k -> {
          if (!(k > MODEL_25.ions().pureWater())) {
            return Solutes.NONE;
          }
          Solutes s = MODEL_25.fit(Solutes.NONE, Solute.HYDROCHLORIC_ACID, k).solutes();
          return new Solutes(0, 0, s.chloride(), 0, 0, 0);
        });
  }
}
