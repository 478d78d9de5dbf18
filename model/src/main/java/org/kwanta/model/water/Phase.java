package org.kwanta.model.water;

/** Where a (T, p) state lies, by IAPWS-IF97 region. */
public enum Phase {
  /** IF97 region 1: compressed or saturated liquid. */
  LIQUID_REGION_1,
  /** IF97 region 2: vapour. */
  VAPOUR_REGION_2
}
