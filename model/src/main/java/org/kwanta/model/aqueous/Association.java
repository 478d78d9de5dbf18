package org.kwanta.model.aqueous;

import java.util.function.DoubleUnaryOperator;
import org.kwanta.model.Reference;
import org.kwanta.model.ValidityRange;

/**
 * An association reaction the speciation carries beside the dissociation chains: the sodium ion
 * pairs ({@link SodiumIonPairs}) and the polyborates ({@link MesmerPolyborates}). Each is on by
 * default and can be turned off per speciation ({@link SpeciationOptions#withAssociations}), except
 * NaHPO₄⁻, which is carried only when chosen ({@link SpeciationOptions#DEFAULT_ASSOCIATIONS}). The
 * constant is evaluated as its source writes it:
 *
 * <ul>
 *   <li>ion pairs: the association constant K_A of M⁺ + X^z⁻ ⇌ MX, molal, I = 0;
 *   <li>polyborates: the OH⁻-based quotient Q_xy of x B(OH)₃ + y OH⁻ ⇌ B_x(OH)_(3x+y)^(y−).
 * </ul>
 */
public enum Association {
  /** Na⁺ + OH⁻ ⇌ NaOH° (llnl.dat). */
  SODIUM_HYDROXIDE(
      Species.SODIUM_HYDROXIDE_PAIR,
      "Na⁺ + OH⁻ ⇌ NaOH°",
      "naoh-pair-1",
      0,
      t -> SodiumIonPairs.NAOH.log10K(t, Double.NaN),
      SodiumIonPairs.VALIDITY_LLNL),
  /** Na⁺ + Cl⁻ ⇌ NaCl° (llnl.dat). */
  SODIUM_CHLORIDE(
      Species.SODIUM_CHLORIDE_PAIR,
      "Na⁺ + Cl⁻ ⇌ NaCl°",
      "nacl-pair-1",
      0,
      t -> SodiumIonPairs.LLNL_NACL.log10K(t, Double.NaN),
      SodiumIonPairs.VALIDITY_LLNL),
  /** Na⁺ + SO₄²⁻ ⇌ NaSO₄⁻ (Thermoddem). */
  SODIUM_SULFATE(
      Species.SODIUM_SULFATE_PAIR,
      "Na⁺ + SO₄²⁻ ⇌ NaSO₄⁻",
      "naso4-pair-1",
      0,
      t -> SodiumIonPairs.THERMODDEM_NASO4.log10K(t, Double.NaN),
      SodiumIonPairs.VALIDITY_THERMODDEM),
  /**
   * Na⁺ + HPO₄²⁻ ⇌ NaHPO₄⁻ (Thermoddem; low confidence above about 100 °C, so not among {@link
   * SpeciationOptions#DEFAULT_ASSOCIATIONS}: carried only when chosen).
   */
  SODIUM_HYDROGEN_PHOSPHATE(
      Species.SODIUM_HYDROGEN_PHOSPHATE_PAIR,
      "Na⁺ + HPO₄²⁻ ⇌ NaHPO₄⁻",
      "nahpo4-pair-1",
      0,
      t -> SodiumIonPairs.NAHPO4.log10K(t, Double.NaN),
      SodiumIonPairs.VALIDITY_THERMODDEM_PHOSPHATE),
  /** 2 B(OH)₃ + OH⁻ ⇌ B₂(OH)₇⁻ (Mesmer 1972 Q21). */
  DIBORATE(
      Species.DIBORATE,
      "2 B(OH)₃ + OH⁻ ⇌ B₂(OH)₇⁻",
      "polyborate-21",
      2,
      t -> MesmerPolyborates.log10Q(0, t),
      MesmerPolyborates.VALIDITY),
  /** 3 B(OH)₃ + OH⁻ ⇌ B₃O₃(OH)₄⁻ + 3 H₂O (Mesmer 1972 Q31). */
  TRIBORATE(
      Species.TRIBORATE,
      "3 B(OH)₃ + OH⁻ ⇌ B₃O₃(OH)₄⁻ + 3 H₂O",
      "polyborate-31",
      3,
      t -> MesmerPolyborates.log10Q(1, t),
      MesmerPolyborates.VALIDITY),
  /** 4 B(OH)₃ + 2 OH⁻ ⇌ B₄O₅(OH)₄²⁻ + 5 H₂O (Mesmer 1972 Q42). */
  TETRABORATE(
      Species.TETRABORATE,
      "4 B(OH)₃ + 2 OH⁻ ⇌ B₄O₅(OH)₄²⁻ + 5 H₂O",
      "polyborate-42",
      4,
      t -> MesmerPolyborates.log10Q(2, t),
      MesmerPolyborates.VALIDITY);

  private final Species formed;
  private final String reaction;
  private final String id;
  private final int boronAtoms;
  private final DoubleUnaryOperator log10K;
  private final ValidityRange validity;

  Association(
      Species formed,
      String reaction,
      String id,
      int boronAtoms,
      DoubleUnaryOperator log10K,
      ValidityRange validity) {
    this.formed = formed;
    this.reaction = reaction;
    this.id = id;
    this.boronAtoms = boronAtoms;
    this.log10K = log10K;
    this.validity = validity;
  }

  /** The species formed. */
  public Species formed() {
    return formed;
  }

  /** The reaction as its source writes it, in chemical typography. */
  public String reaction() {
    return reaction;
  }

  /** Stable id of our own shown in results, e.g. {@code "nacl-pair-1"}. */
  public String id() {
    return id;
  }

  /** True for a sodium ion pair, false for a polyborate. */
  public boolean isIonPair() {
    return boronAtoms == 0;
  }

  /** Boron atoms in the species formed (0 for an ion pair). */
  public int boronAtoms() {
    return boronAtoms;
  }

  /**
   * log10 of the constant as the source writes it (K_A of an ion pair, Q_xy of a polyborate),
   * molal; evaluated also outside {@link #validity()}.
   *
   * @param temperatureK temperature, K
   */
  public double log10K(double temperatureK) {
    return log10K.applyAsDouble(temperatureK);
  }

  /** The fit's stated temperature range, K. */
  public ValidityRange validity() {
    return validity;
  }

  /** Citation and confidence. */
  public Reference reference() {
    return validity.source();
  }
}
