package org.kwanta.model.water;

/**
 * The water-properties facade: density (IAPWS-IF97), ionization constant (IAPWS R11-07 or R11-24),
 * static dielectric constant (IAPWS R8-97) and the Debye–Hückel parameters derived from them.
 */
public final class Water {

  /** Atmospheric pressure used as the floor when no pressure is given, Pa. */
  public static final double ATMOSPHERIC_PRESSURE_PA = 101_325.0;

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
    throw new UnsupportedOperationException("implemented in the water-properties work");
  }

  /**
   * Liquid water at a temperature with no pressure given: the saturation pressure, not below
   * 0.101325 MPa. The result says which was used.
   */
  public static WaterState atSaturation(double temperatureK, IonizationFormulation ionization) {
    throw new UnsupportedOperationException("implemented in the water-properties work");
  }
}
