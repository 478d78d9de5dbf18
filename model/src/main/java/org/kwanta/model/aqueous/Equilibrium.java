package org.kwanta.model.aqueous;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;

/**
 * A dissociation equilibrium, always written in the direction HA ⇌ A⁻ + H⁺ or BH⁺ ⇌ B + H⁺ (log10
 * Ka negative, pKa = −log10 Ka), whatever direction the source prints. Molal, infinite dilution,
 * a(H₂O) = 1. The reaction text is built from the species' symbols ({@link #reaction()}).
 *
 * <p>Each step links two neighbours of one component's species chain ({@link Component#species()}).
 * The step of a weak base (ammonia or an amine, {@link Component#isWeakBase()}) follows from its
 * two species and is not declared here: it is named as its acid, e.g. {@code AMMONIUM} for NH₄⁺ ⇌
 * NH₃ + H⁺, and found with {@link #ofWeakBase(Component)}. An amine added to {@link Component} and
 * {@link Species} therefore has its equilibrium with no edit to this file. The steps of the acids
 * (sulfate, carbonic and phosphoric acid, the organic acids, boric acid) are declared below,
 * because their names and some reactions (with a water molecule) do not follow from the species.
 *
 * <p>The equilibria are a fixed set built once when the class is loaded, in the order of {@link
 * Component} and, within a component, of its chain; {@link #ordinal()} is the position in that
 * order and indexes the engine's arrays. Equal equilibria are the same object.
 */
public final class Equilibrium {

  /** The declared steps, in declaration order (filled by {@link #declare} during class loading). */
  private static final List<Equilibrium> DECLARED = new ArrayList<>();

  /** HSO4⁻ ⇌ SO4²⁻ + H⁺. */
  public static final Equilibrium BISULFATE =
      declare("BISULFATE", Species.BISULFATE, Species.SULFATE, false);

  /** CO2(aq) + H2O ⇌ HCO3⁻ + H⁺ (K1). */
  public static final Equilibrium CARBONIC_FIRST =
      declare("CARBONIC_FIRST", Species.CARBON_DIOXIDE, Species.BICARBONATE, true);

  /** HCO3⁻ ⇌ CO3²⁻ + H⁺ (K2). */
  public static final Equilibrium CARBONIC_SECOND =
      declare("CARBONIC_SECOND", Species.BICARBONATE, Species.CARBONATE, false);

  /** H3PO4 ⇌ H2PO4⁻ + H⁺ (K1). */
  public static final Equilibrium PHOSPHORIC_FIRST =
      declare("PHOSPHORIC_FIRST", Species.PHOSPHORIC_ACID, Species.DIHYDROGEN_PHOSPHATE, false);

  /** H2PO4⁻ ⇌ HPO4²⁻ + H⁺ (K2). */
  public static final Equilibrium PHOSPHORIC_SECOND =
      declare("PHOSPHORIC_SECOND", Species.DIHYDROGEN_PHOSPHATE, Species.HYDROGEN_PHOSPHATE, false);

  /** HPO4²⁻ ⇌ PO4³⁻ + H⁺ (K3). */
  public static final Equilibrium PHOSPHORIC_THIRD =
      declare("PHOSPHORIC_THIRD", Species.HYDROGEN_PHOSPHATE, Species.PHOSPHATE, false);

  /** CH3COOH ⇌ CH3COO⁻ + H⁺. */
  public static final Equilibrium ACETIC =
      declare("ACETIC", Species.ACETIC_ACID, Species.ACETATE, false);

  /** HCOOH ⇌ HCOO⁻ + H⁺. */
  public static final Equilibrium FORMIC =
      declare("FORMIC", Species.FORMIC_ACID, Species.FORMATE, false);

  /** B(OH)3 + H2O ⇌ B(OH)4⁻ + H⁺. */
  public static final Equilibrium BORIC =
      declare("BORIC", Species.BORIC_ACID, Species.BORATE, true);

  private static Equilibrium declare(String name, Species acid, Species base, boolean withWater) {
    Equilibrium e = new Equilibrium(name, acid, base, withWater);
    DECLARED.add(e);
    return e;
  }

  /** Every equilibrium, by ordinal. */
  private static final Equilibrium[] VALUES;

  /** The steps of each component, in chain order. */
  private static final Map<Component, List<Equilibrium>> STEPS = new EnumMap<>(Component.class);

  static {
    List<Equilibrium> all = new ArrayList<>();
    for (Component c : Component.values()) {
      List<Species> chain = c.species();
      List<Equilibrium> steps = new ArrayList<>();
      if (c.isWeakBase()) {
        Species acid = chain.get(0);
        steps.add(new Equilibrium(acid.name(), acid, chain.get(1), false));
      } else {
        for (Equilibrium e : DECLARED) {
          if (e.component() == c) {
            steps.add(e);
          }
        }
      }
      // step i turns species i into species i + 1 and releases one H⁺
      if (steps.size() != Math.max(0, chain.size() - 1)) {
        throw new IllegalStateException(
            c + ": " + chain.size() + " species need " + (chain.size() - 1) + " steps");
      }
      for (int i = 0; i < steps.size(); i++) {
        Equilibrium e = steps.get(i);
        if (e.acid != chain.get(i)
            || e.base != chain.get(i + 1)
            || e.base.chargeNumber() != e.acid.chargeNumber() - 1) {
          throw new IllegalStateException(c + ": step " + e + " does not follow its species chain");
        }
        e.ordinal = all.size();
        all.add(e);
      }
      STEPS.put(c, List.copyOf(steps));
    }
    if (!all.containsAll(DECLARED)) {
      throw new IllegalStateException("a declared step belongs to a weak base: " + DECLARED);
    }
    VALUES = all.toArray(new Equilibrium[0]);
  }

  /** NH4⁺ ⇌ NH3 + H⁺ (the weak-base step of ammonia, named for the catalogue's several fits). */
  public static final Equilibrium AMMONIUM = ofWeakBase(Component.AMMONIA);

  private final String name;
  private final Species acid;
  private final Species base;
  private final String reaction;

  /** Position in {@link #values()}; set once while the class is loaded. */
  private int ordinal = -1;

  private Equilibrium(String name, Species acid, Species base, boolean withWater) {
    this.name = name;
    this.acid = acid;
    this.base = base;
    this.reaction = acid.symbol() + (withWater ? " + H₂O" : "") + " ⇌ " + base.symbol() + " + H⁺";
  }

  /** Every equilibrium, in {@link #ordinal()} order (a new array on each call). */
  public static Equilibrium[] values() {
    return VALUES.clone();
  }

  /**
   * The step BH⁺ ⇌ B + H⁺ of a weak base.
   *
   * @throws IllegalArgumentException when the component is not a weak base
   */
  public static Equilibrium ofWeakBase(Component base) {
    if (!base.isWeakBase()) {
      throw new IllegalArgumentException(base + " is not a weak base");
    }
    return STEPS.get(base).get(0);
  }

  /** The steps of a component, in chain order (empty for fully dissociated ions). */
  static List<Equilibrium> of(Component c) {
    return STEPS.get(c);
  }

  /** The name, in upper case: the declared name, or for a weak base its acid's name. */
  public String name() {
    return name;
  }

  /** Position in {@link #values()}: component order, then chain order. */
  public int ordinal() {
    return ordinal;
  }

  /**
   * The reaction in the dissociation direction used throughout the engine, in chemical typography,
   * e.g. {@code "HSO₄⁻ ⇌ SO₄²⁻ + H⁺"}.
   */
  public String reaction() {
    return reaction;
  }

  /** The proton donor (left side). */
  public Species acid() {
    return acid;
  }

  /** The conjugate base (right side, with H⁺). */
  public Species base() {
    return base;
  }

  /** The component both species belong to. */
  public Component component() {
    return acid.component();
  }

  @Override
  public String toString() {
    return name;
  }
}
