package org.kwanta.model.aqueous;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;

/**
 * The equilibrium constants one speciation uses: log10 Ka of every equilibrium of the components
 * present, the {@link ConstantUsed} list and whether any fit was extrapolated, for one constant set
 * at one temperature and pKw.
 *
 * <p>They are a pure function of (constant set, T, pKw, components present), so they are kept in a
 * bounded cache keyed exactly on those: the set by identity (sets are immutable records), T and pKw
 * by their bits, the components by a bit mask. Concurrent callers may both compute a missing entry;
 * they compute the same values, so sharing cannot change a result. Beyond {@link #CACHE_LIMIT}
 * entries the constants are computed per call.
 */
final class ConstantsAtState {

  /** Most entries kept (a few hundred bytes each). */
  static final int CACHE_LIMIT = 4096;

  private static final double LN10 = Math.log(10);

  private static final Map<Key, ConstantsAtState> CACHE = new ConcurrentHashMap<>();

  final List<ConstantUsed> used;
  final boolean extrapolated;

  /**
   * The association constants that apply to the components present (whether or not a speciation
   * carries them), in {@link Association} order.
   */
  final List<AssociationUsed> associations;

  /** Ka = 10^log10 Ka by {@link Equilibrium#ordinal()}. */
  private final double[] ka;

  /** log10 Ka by {@link Equilibrium#ordinal()} (0 for absent components); do not modify. */
  final double[] log10Ka;

  /** K = 10^log10 K by {@link Association#ordinal()} (0 for associations that do not apply). */
  private final double[] associationK;

  private ConstantsAtState(
      double[] log10Ka,
      List<ConstantUsed> used,
      boolean extrapolated,
      List<AssociationUsed> associations) {
    this.log10Ka = log10Ka;
    this.ka = new double[log10Ka.length];
    for (int i = 0; i < ka.length; i++) {
      ka[i] = Math.exp(LN10 * log10Ka[i]);
    }
    this.used = used;
    this.extrapolated = extrapolated;
    this.associations = associations;
    this.associationK = new double[Association.values().length];
    for (AssociationUsed a : associations) {
      associationK[a.association().ordinal()] = Math.exp(LN10 * a.log10K());
    }
  }

  /** K by association ordinal (0 where it does not apply); do not modify. */
  double[] associationK() {
    return associationK;
  }

  /** True when the association's partners are among the components. */
  static boolean applies(Association a, Set<Component> components) {
    return switch (a) {
      case SODIUM_HYDROXIDE -> components.contains(Component.SODIUM);
      case SODIUM_CHLORIDE ->
          components.contains(Component.SODIUM) && components.contains(Component.CHLORIDE);
      case SODIUM_SULFATE ->
          components.contains(Component.SODIUM) && components.contains(Component.SULFATE);
      case SODIUM_HYDROGEN_PHOSPHATE ->
          components.contains(Component.SODIUM) && components.contains(Component.PHOSPHATE);
      case DIBORATE, TRIBORATE, TETRABORATE -> components.contains(Component.BORON);
    };
  }

  /** Ka by equilibrium ordinal (1 for equilibria of absent components); do not modify. */
  double[] kaByEquilibrium() {
    return ka;
  }

  static ConstantsAtState of(
      ConstantSet set, double temperatureK, double pKw, Set<Component> components) {
    Key key = Key.of(set, temperatureK, pKw, components);
    ConstantsAtState cached = CACHE.get(key);
    if (cached != null) {
      return cached;
    }
    ConstantsAtState computed = compute(set, temperatureK, pKw, components);
    if (CACHE.size() < CACHE_LIMIT) {
      CACHE.putIfAbsent(key, computed);
    }
    return computed;
  }

  private static ConstantsAtState compute(
      ConstantSet set, double t, double pKw, Set<Component> components) {
    double[] log10Ka = new double[Equilibrium.values().length];
    List<ConstantUsed> used = new ArrayList<>();
    boolean extrapolated = false;
    // Components iterate in enum order and their equilibria in chain order, which is the order
    // of Equilibrium: the list comes out sorted.
    for (Component c : components) {
      for (Equilibrium e : c.equilibria()) {
        Fit fit = set.fitAt(e, t);
        double logK = fit.log10K(t, pKw);
        boolean outside = fit.isExtrapolatedAt(t);
        extrapolated |= outside;
        log10Ka[e.ordinal()] = logK;
        used.add(new ConstantUsed(e, logK, fit.id(), fit.reference(), fit.validity(), outside));
      }
    }
    List<AssociationUsed> associations = new ArrayList<>();
    for (Association a : Association.values()) {
      if (applies(a, components)) {
        associations.add(new AssociationUsed(a, a.log10K(t), !a.validity().contains(t)));
      }
    }
    return new ConstantsAtState(
        log10Ka, List.copyOf(used), extrapolated, List.copyOf(associations));
  }

  /**
   * Exact cache key: the set by identity, T and pKw by their bits, the components by a bit mask
   * (also the key of {@link PhUncertainties}' per-state tables).
   */
  record Key(ConstantSet set, long temperatureBits, long pKwBits, int components) {

    static Key of(ConstantSet set, double temperatureK, double pKw, Set<Component> components) {
      int mask = 0;
      for (Component c : components) {
        mask |= 1 << c.ordinal();
      }
      return new Key(
          set, Double.doubleToLongBits(temperatureK), Double.doubleToLongBits(pKw), mask);
    }

    @Override
    public boolean equals(Object o) {
      return o instanceof Key k
          && k.set == set
          && k.temperatureBits == temperatureBits
          && k.pKwBits == pKwBits
          && k.components == components;
    }

    @Override
    public int hashCode() {
      int h = System.identityHashCode(set);
      h = 31 * h + Long.hashCode(temperatureBits);
      h = 31 * h + Long.hashCode(pKwBits);
      return 31 * h + components;
    }
  }
}
