package org.kwanta.model.evaluation;

/** Water treatment at a sample point: it selects the solute model of each conductivity channel. */
public enum Regime {
  /** All-volatile treatment, reducing: alkalizer + strong-acid and CO₂ contamination. */
  AVT_R,
  /** All-volatile treatment, oxidizing. */
  AVT_O,
  /** Oxygenated treatment. */
  OT,
  /** Phosphate treatment (boiler water): sodium phosphate. */
  PHOSPHATE,
  /** Caustic treatment (boiler water): sodium hydroxide. */
  CAUSTIC,
  /** Make-up (demineralised) water: neutral salt. */
  MAKE_UP;

  /** True for the volatile treatments AVT(R), AVT(O) and OT. */
  public boolean isVolatile() {
    return this == AVT_R || this == AVT_O || this == OT;
  }
}
