package org.kwanta.model.water;

import java.util.Objects;
import org.kwanta.model.Reference;
import org.kwanta.model.ValidityRange;

/**
 * The water-properties facade: density (IAPWS-IF97), ionization constant (IAPWS R11-07 or R11-24),
 * static dielectric constant (IAPWS R8-97) and the Debye–Hückel parameters derived from them.
 *
 * <p>Phase (IF97 regions, release section 4): for T ≤ 623.15 K the state is liquid (region 1) when
 * p ≥ p_s(T) and vapour (region 2) when p &lt; p_s(T); exactly on the saturation line it is the
 * saturated liquid. From 623.15 K to 863.15 K, states at p ≥ p_B23(T) lie in region 3 (liquid below
 * the critical temperature at p ≥ p_s(T), dense vapour below it at p &lt; p_s(T), supercritical
 * fluid above it), the others in region 2; above 863.15 K everything is region 2.
 *
 * <p>Permittivity and Debye–Hückel parameters: ε is given up to 873 K (IAPWS R8-97's limit) and NaN
 * above. Debye–Hückel A and B are NaN in states that are not liquid-like (density below {@link
 * #LIQUID_LIKE_DENSITY}, the critical density): this is Kwanta's limit, not a release's; in steam
 * the ions that a liquid activity model describes are not there to describe.
 *
 * <p>Validity: {@link #TEMPERATURE_VALIDITY} and {@link #PRESSURE_VALIDITY}. Inputs outside, or
 * NaN, throw {@link org.kwanta.model.OutOfValidityRangeException} naming the quantity, value,
 * limits, unit and source; nothing is clamped.
 */
public final class Water {

  /** Atmospheric pressure used as the floor when no pressure is given, Pa. */
  public static final double ATMOSPHERIC_PRESSURE_PA = 101_325.0;

  /** IAPWS-IF97, the density formulation. */
  public static final Reference IF97 = Region1.REFERENCE;

  /**
   * Temperature range of the facade, K: IF97 regions 1 to 3 (273.15 K to 1073.15 K), which is also
   * the range of IAPWS R11-07. IF97 region 5 (1073.15 K to 2273.15 K at p ≤ 50 MPa) is not
   * implemented, so the upper limit is Kwanta's as well as R11-07's.
   */
  public static final ValidityRange TEMPERATURE_VALIDITY =
      new ValidityRange(
          "temperature",
          273.15,
          1073.15,
          "K",
          new Reference(
              "IAPWS R7-97(2012) regions 1-3 (region 5 not implemented in Kwanta)",
              IF97.citation()
                  + "; regions 1-4 as implemented here, region 5 (above 1073.15 K) is not",
              Reference.Confidence.VERIFIED_BY_CHECK_TABLE));

  /**
   * Densities at which a state counts as liquid-like, kg/m³: at least the critical density 322
   * kg/m³ (IF97). Kwanta's convention for where a liquid pH scale and Debye–Hückel parameters are
   * reported; no release states it.
   */
  public static final ValidityRange LIQUID_LIKE_DENSITY =
      new ValidityRange(
          "density",
          Region3.RHO_C,
          Double.POSITIVE_INFINITY,
          "kg/m3",
          new Reference(
              "Kwanta liquid-like states (density at least the critical density)",
              "Kwanta's convention: a liquid pH scale and Debye–Hückel parameters are reported"
                  + " for states at least as dense as the critical density of IAPWS-IF97, 322"
                  + " kg/m3",
              Reference.Confidence.ESTIMATED));

  /**
   * Temperature range of saturation (IF97 region 4): 273.15 K to the critical temperature, K. Above
   * the critical point there is no saturation line.
   */
  public static final ValidityRange SATURATION_VALIDITY = Region4.VALIDITY;

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
    SATURATION_VALIDITY.check(temperatureK);
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
   * Density of water (IF97 region 1, 2 or 3 by {@link #phase}).
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
    return density(temperatureK, pressurePa, phaseUnchecked(temperatureK, pressurePa));
  }

  /**
   * The IF97 region and phase of a state.
   *
   * @param temperatureK temperature, K
   * @param pressurePa pressure, Pa
   * @throws org.kwanta.model.OutOfValidityRangeException outside {@link #TEMPERATURE_VALIDITY} or
   *     {@link #PRESSURE_VALIDITY}
   */
  public static Phase phase(double temperatureK, double pressurePa) {
    TEMPERATURE_VALIDITY.check(temperatureK);
    PRESSURE_VALIDITY.check(pressurePa);
    return phaseUnchecked(temperatureK, pressurePa);
  }

  static Phase phaseUnchecked(double t, double p) {
    if (t <= Region1.VALIDITY.max()) {
      return p >= Region4.saturationPressurePaUnchecked(t)
          ? Phase.LIQUID_REGION_1
          : Phase.VAPOUR_REGION_2;
    }
    if (t > Region3.VALIDITY.max() || p < Boundary23.pressurePaUnchecked(t)) {
      return Phase.VAPOUR_REGION_2;
    }
    if (t >= Region3.T_C) {
      return Phase.SUPERCRITICAL_REGION_3;
    }
    return p >= Region4.saturationPressurePaUnchecked(t)
        ? Phase.LIQUID_REGION_3
        : Phase.VAPOUR_REGION_3;
  }

  private static double density(double t, double p, Phase phase) {
    return switch (phase) {
      case LIQUID_REGION_1 -> Region1.densityUnchecked(t, p);
      case VAPOUR_REGION_2 -> Region2.densityUnchecked(t, p);
      case LIQUID_REGION_3, VAPOUR_REGION_3, SUPERCRITICAL_REGION_3 ->
          Region3.densityUnchecked(t, p);
    };
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
    Phase phase = phaseUnchecked(t, p);
    double rho = density(t, p, phase);
    double pKw = IonizationConstant.of(ionization).pKw(t, rho);
    double epsilon =
        DielectricConstant.VALIDITY.contains(t)
            ? DielectricConstant.relativePermittivity(t, rho)
            : Double.NaN;
    boolean debyeHuckel = LIQUID_LIKE_DENSITY.contains(rho) && !Double.isNaN(epsilon);
    return new WaterState(
        t,
        p,
        source,
        phase,
        t <= Region4.VALIDITY.max() ? ps : Double.NaN,
        rho,
        ionization,
        pKw,
        epsilon,
        debyeHuckel ? DebyeHuckel.a(t, rho, epsilon) : Double.NaN,
        debyeHuckel ? DebyeHuckel.b(t, rho, epsilon) : Double.NaN);
  }
}
