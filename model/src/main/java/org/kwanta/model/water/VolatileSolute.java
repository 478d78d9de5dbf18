package org.kwanta.model.water;

/**
 * Solutes whose vapour–liquid distribution constant between steam and water Kwanta knows. Only the
 * neutral molecule distributes; its ion (NH4⁺, HCO3⁻, a protonated amine) stays in the liquid. The
 * amines' constants are estimates ({@link AmineDistribution}). Each constant bears the name of its
 * {@code aqueous.Component}: the early condensate finds a component's constant by that name, and
 * refuses a weak base that has none.
 */
public enum VolatileSolute {
  /** Ammonia, NH3. */
  AMMONIA,
  /** Carbon dioxide, CO2 (HCO3⁻ and CO3²⁻ stay). */
  CARBON_DIOXIDE,
  /** Morpholine, C4H9NO (estimate). */
  MORPHOLINE,
  /** Ethanolamine, C2H7NO (estimate). */
  ETHANOLAMINE,
  /** Cyclohexylamine, C6H13N (estimate). */
  CYCLOHEXYLAMINE,
  /** Dimethylamine, C2H7N (estimate). */
  DIMETHYLAMINE,
  /** 3-Methoxypropylamine, C4H11NO (estimate). */
  METHOXYPROPYLAMINE,
  /** 2-Diethylaminoethanol, C6H15NO (estimate). */
  DIETHYLAMINOETHANOL
}
