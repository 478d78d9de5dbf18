package org.kwanta.model.water;

/**
 * Where a (T, p) state lies, by IAPWS-IF97 region. Region 2 above the critical temperature (p below
 * the B23 line) is reported as {@link #VAPOUR_REGION_2}: steam-like, of low density.
 */
public enum Phase {
  /** IF97 region 1: compressed or saturated liquid, T ≤ 623.15 K. */
  LIQUID_REGION_1,
  /** IF97 region 2: vapour (superheated steam). */
  VAPOUR_REGION_2,
  /** IF97 region 3 below the critical temperature at p ≥ p_s(T): liquid above 623.15 K. */
  LIQUID_REGION_3,
  /** IF97 region 3 below the critical temperature at p &lt; p_s(T): dense vapour. */
  VAPOUR_REGION_3,
  /** IF97 region 3 at or above the critical temperature: supercritical fluid. */
  SUPERCRITICAL_REGION_3;

  /** True for the two liquid phases (regions 1 and 3). */
  public boolean isLiquid() {
    return this == LIQUID_REGION_1 || this == LIQUID_REGION_3;
  }

  /** True for the two vapour phases (regions 2 and 3). */
  public boolean isVapour() {
    return this == VAPOUR_REGION_2 || this == VAPOUR_REGION_3;
  }
}
