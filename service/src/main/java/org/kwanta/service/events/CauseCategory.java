package org.kwanta.service.events;

/**
 * What caused an excursion event: Kwanta's own categories, broad enough for any steam-cycle plant.
 * They name where the contaminant or the upset came from, not a guideline's wording.
 */
public enum CauseCategory {
  /** Cooling water into the condensate (condenser tube leak, tube-sheet leak). */
  CONDENSER_INGRESS,
  /** Air into the cycle under vacuum (seals, valves, flanges). */
  AIR_INGRESS,
  /** Make-up water out of its own specification. */
  MAKE_UP_WATER,
  /** Condensate polishing: resin exhaustion, regeneration chemicals, resin fines. */
  CONDENSATE_POLISHING,
  /** Chemical conditioning: dosing too much, too little, or the wrong chemical. */
  CHEMICAL_DOSING,
  /** Start-up, shut-down or a load transient. */
  OPERATING_TRANSIENT,
  /** Not the water: analyser, sample line, cooler or cation column. */
  INSTRUMENT_OR_SAMPLING,
  /** Another source, named in the notes. */
  OTHER,
  /** Not yet known. */
  UNDETERMINED
}
