package org.kwanta.model.water;

import java.util.Objects;
import org.kwanta.model.Reference;
import org.kwanta.model.ValidityRange;

/**
 * The water-properties facade: density (IAPWS-IF97), ionization constant (IAPWS R11-07 or R11-24),
 * static dielectric constant (IAPWS R8-97) and the Debye–Hückel parameters derived from them.
 *
 * <p>Phase: for T ≤ 623.15 K the state is liquid (IF97 region 1) when p ≥ p_s(T) and vapour (IF97
 * region 2) when p &lt; p_s(T); exactly on the saturation line it is the saturated liquid. Above
 * 623.15 K the liquid lies in IF97 region 3, which is not implemented: such temperatures throw.
 * Validity: {@link #TEMPERATURE_VALIDITY} and {@link #PRESSURE_VALIDITY}. Inputs outside, or NaN,
 * throw {@link org.kwanta.model.OutOfValidityRangeException} naming the quantity, value, limits,
 * unit and source; nothing is clamped.
 */
public final class Water {

  /** Atmospheric pressure used as the floor when no pressure is given, Pa. */
  public static final double ATMOSPHERIC_PRESSURE_PA = 101_325.0;

  /** IAPWS-IF97, the density formulation. */
  public static final Reference IF97 = Region1.REFERENCE;

  /** Temperature range of the facade: IF97 regions 1 and 2 below region 3, K. */
  public static final ValidityRange TEMPERATURE_VALIDITY = Region1.VALIDITY;

  /** Pressure range of the facade: above 0 up to the 100 MPa limit of IF97 regions 1 and 2, Pa. */
  public static final ValidityRange PRESSURE_VALIDITY =
      new ValidityRange("pressure", Double.MIN_VALUE, 100e6, "Pa", IF97);

  private Water() {}

  /**
   * Water at a given temperature and pressure.
   *
   * @param temperatureK temperature, K
   * @param pressurePa pressure, Pa
   * @param ionization which release gives pKw
   * @throws org.kwanta.model.OutOfValidityRangeException outside the formulations' ranges
   */
  public static WaterState at(
      double temperatureK, double pressurePa, IonizationFormulation ionization) {
    Objects.requireNonNull(ionization, "ionization formulation");
    TEMPERATURE_VALIDITY.check(temperatureK);
    PRESSURE_VALIDITY.check(pressurePa);
    return state(
        temperatureK,
        pressurePa,
        PressureSource.GIVEN,
        Region4.saturationPressurePaUnchecked(temperatureK),
        ionization);
  }

  /**
   * Liquid water at a temperature with no pressure given: the saturation pressure, not below
   * 0.101325 MPa. The result says which was used.
   */
  public static WaterState atSaturation(double temperatureK, IonizationFormulation ionization) {
    Objects.requireNonNull(ionization, "ionization formulation");
    TEMPERATURE_VALIDITY.check(temperatureK);
    double ps = Region4.saturationPressurePaUnchecked(temperatureK);
    return ps >= ATMOSPHERIC_PRESSURE_PA
        ? state(temperatureK, ps, PressureSource.SATURATION, ps, ionization)
        : state(
            temperatureK,
            ATMOSPHERIC_PRESSURE_PA,
            PressureSource.ATMOSPHERIC_FLOOR,
            ps,
            ionization);
  }

  /**
   * pKw at a temperature and pressure, the density included: the fast path for callers that need
   * only pKw (same checks and numbers as {@link #at}).
   *
   * @param temperatureK temperature, K
   * @param pressurePa pressure, Pa
   * @param ionization which release gives pKw
   * @return −log10 Kw, Kw molal
   * @throws org.kwanta.model.OutOfValidityRangeException outside the formulations' ranges
   */
  public static double pKw(
      double temperatureK, double pressurePa, IonizationFormulation ionization) {
    Objects.requireNonNull(ionization, "ionization formulation");
    return IonizationConstant.of(ionization)
        .pKwUnchecked(temperatureK, densityKgPerM3(temperatureK, pressurePa));
  }

  /**
   * Density of water (IF97 region 1 for liquid, region 2 for vapour).
   *
   * @param temperatureK temperature, K
   * @param pressurePa pressure, Pa
   * @return density, kg/m³
   * @throws org.kwanta.model.OutOfValidityRangeException outside {@link #TEMPERATURE_VALIDITY} or
   *     {@link #PRESSURE_VALIDITY}
   */
  public static double densityKgPerM3(double temperatureK, double pressurePa) {
    TEMPERATURE_VALIDITY.check(temperatureK);
    PRESSURE_VALIDITY.check(pressurePa);
    return pressurePa >= Region4.saturationPressurePaUnchecked(temperatureK)
        ? Region1.densityUnchecked(temperatureK, pressurePa)
        : Region2.densityUnchecked(temperatureK, pressurePa);
  }

  /**
   * Saturation pressure of water, IF97 region 4.
   *
   * @param temperatureK temperature, K (273.15 K to 647.096 K)
   * @return p_s, Pa
   */
  public static double saturationPressurePa(double temperatureK) {
    return Region4.saturationPressurePa(temperatureK);
  }

  /**
   * Saturation temperature of water, IF97 region 4.
   *
   * @param pressurePa pressure, Pa (611.213 Pa to 22.064 MPa)
   * @return T_s, K
   */
  public static double saturationTemperatureK(double pressurePa) {
    return Region4.saturationTemperatureK(pressurePa);
  }

  private static WaterState state(
      double t, double p, PressureSource source, double ps, IonizationFormulation ionization) {
    boolean liquid = p >= ps;
    double rho = liquid ? Region1.densityUnchecked(t, p) : Region2.densityUnchecked(t, p);
    double pKw = IonizationConstant.of(ionization).pKw(t, rho);
    double epsilon = DielectricConstant.relativePermittivity(t, rho);
    return new WaterState(
        t,
        p,
        source,
        liquid ? Phase.LIQUID_REGION_1 : Phase.VAPOUR_REGION_2,
        ps,
        rho,
        ionization,
        pKw,
        epsilon,
        DebyeHuckel.a(t, rho, epsilon),
        DebyeHuckel.b(t, rho, epsilon));
  }
}
