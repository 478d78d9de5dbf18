package org.kwanta.model.water;

/** How the pressure of a {@link WaterState} was chosen. */
public enum PressureSource {
  /** Given by the caller. */
  GIVEN,
  /** Not given: the saturation pressure at the temperature, IF97 region 4. */
  SATURATION,
  /** Not given: the saturation pressure lies below 0.101325 MPa, so 0.101325 MPa was used. */
  ATMOSPHERIC_FLOOR
}
