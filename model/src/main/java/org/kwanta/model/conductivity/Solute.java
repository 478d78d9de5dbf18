package org.kwanta.model.conductivity;

/** The one solute whose amount a conductivity fit determines. */
public enum Solute {
  /** The configured alkalizer or alkalizer mix (weak base). */
  ALKALIZER,
  /** Sodium hydroxide (sets {@link Solutes#sodium()}). */
  SODIUM_HYDROXIDE,
  /** Strong acid counted as hydrochloric acid (sets {@link Solutes#chloride()}). */
  HYDROCHLORIC_ACID,
  /** Sulfuric acid, fully dissociated (sets {@link Solutes#sulfate()}). */
  SULFURIC_ACID,
  /** Carbon dioxide (sets {@link Solutes#carbonate()}). */
  CARBON_DIOXIDE,
  /** Phosphoric acid (sets {@link Solutes#phosphate()}). */
  PHOSPHORIC_ACID,
  /** Neutral salt, sodium chloride (sets sodium and chloride equally). */
  SODIUM_CHLORIDE
}
