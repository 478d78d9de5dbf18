package org.kwanta.model.limits;

/** Chemical treatment of a water/steam circuit (trade terms). */
public enum TreatmentRegime {
  /** All-volatile treatment, reducing (with a reducing agent; mixed-metallurgy systems). */
  AVT_R,
  /** All-volatile treatment, oxidizing (no reducing agent; all-ferrous systems). */
  AVT_O,
  /** Oxygenated treatment. */
  OT,
  /** Phosphate treatment (drum water). */
  PT,
  /** Caustic (sodium hydroxide) treatment (drum water). */
  CT,
  /** Make-up water after the demineralisation plant (no conditioning). */
  MAKE_UP
}
