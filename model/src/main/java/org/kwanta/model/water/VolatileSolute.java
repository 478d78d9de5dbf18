package org.kwanta.model.water;

/** Solutes whose vapour–liquid distribution constant between steam and water Kwanta knows. */
public enum VolatileSolute {
  /** Ammonia, NH3 (the neutral molecule distributes; NH4⁺ stays in the liquid). */
  AMMONIA,
  /** Carbon dioxide, CO2 (the neutral molecule distributes; HCO3⁻ and CO3²⁻ stay). */
  CARBON_DIOXIDE
}
