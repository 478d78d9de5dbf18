package org.kwanta.model.aqueous;

/** Something a reader of a {@link SpeciationResult} must see beside the numbers. */
public enum Notice {
  /**
   * At least one equilibrium constant was evaluated outside its fit's stated temperature range (see
   * {@link ConstantUsed#extrapolated()}).
   */
  EXTRAPOLATED_CONSTANT,
  /**
   * At least one association constant carried (ion pair or polyborate, {@link
   * AssociationUsed#extrapolated()}) was evaluated outside its fit's stated temperature range; the
   * polyborate quotients are fitted at 50-200 °C only.
   */
  EXTRAPOLATED_ASSOCIATION_CONSTANT,
  /** The ionic strength exceeds the range to which the activity model is customarily adequate. */
  IONIC_STRENGTH_ABOVE_ACTIVITY_MODEL_RANGE,
  /** The sample is condensed steam, speciated as a liquid at the stated temperature. */
  CONDENSED_LIQUID_AT_STATED_TEMPERATURE
}
