package org.kwanta.model.conductivity;

import org.kwanta.model.Reference;
import org.kwanta.model.ValidityRange;
import org.kwanta.model.water.Water;
import org.kwanta.model.water.WaterState;

/**
 * The conductivity facade: electrolytic conductivity of dilute aqueous solutions at 0–100 °C from
 * ion molalities,
 *
 * <pre>
 *   κ (µS/cm) = 10³ · Σᵢ cᵢ · |zᵢ| · λᵢ(T, I),   cᵢ = mᵢ · ρ_w / (1000 kg m⁻³)
 * </pre>
 *
 * with λ°ᵢ(T) from {@link LimitingConductivity}, the Onsager correction of {@link
 * OnsagerCorrection} and water properties (ρ, ε, Kw) from a {@link WaterState}. Molality is the
 * conserved amount; molarity follows the density at each temperature.
 */
public final class Conductivity {

  /** The combined model, as set out in the project's reference notes on conductivity. */
  public static final Reference MODEL =
      new Reference(
          "Kwanta conductivity model",
          "Limiting conductivities (CRC) with PHREEQC dw_T temperature scaling, IAPWS R12-08"
              + " viscosity, Debye-Hückel-Onsager limiting law; pure water after Light et al.,"
              + " Electrochem. Solid-State Lett. 8 (2005) E16",
          Reference.Confidence.RETRIEVED);

  /** Temperature range of the conductivity model, K (0–100 °C). */
  public static final ValidityRange TEMPERATURE_VALIDITY =
      new ValidityRange("temperature", 273.15, 373.15, "K", MODEL);

  /**
   * Density of water at 298.15 K and 0.101325 MPa, kg/m³ (IAPWS-IF97 region 1), the state at which
   * η(25 °C) of the Walden ratio is taken.
   */
  static final double DENSITY_25C_KG_PER_M3 =
      Water.densityKgPerM3(LimitingConductivity.T25_K, Water.ATMOSPHERIC_PRESSURE_PA);

  /** η(25 °C, 0.101325 MPa), Pa·s (IAPWS R12-08). */
  static final double VISCOSITY_25C_PA_S =
      WaterViscosity.at(LimitingConductivity.T25_K, DENSITY_25C_KG_PER_M3);

  private Conductivity() {}

  /**
   * The ion conductivities at the temperature and density of a water state.
   *
   * @throws org.kwanta.model.OutOfValidityRangeException outside 0–100 °C
   */
  public static IonConductivities at(WaterState water) {
    double t = TEMPERATURE_VALIDITY.check(water.temperatureK());
    double eta = WaterViscosity.at(t, water.densityKgPerM3());
    return new IonConductivities(water, eta, VISCOSITY_25C_PA_S / eta);
  }

  /**
   * Conductivity of pure water (H⁺ and OH⁻ from Kw only, Davies activities), µS/cm.
   *
   * @throws org.kwanta.model.OutOfValidityRangeException outside 0–100 °C
   */
  public static double pureWater(WaterState water) {
    return at(water).pureWater();
  }
}
