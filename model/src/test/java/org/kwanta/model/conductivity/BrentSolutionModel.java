package org.kwanta.model.conductivity;

import java.util.Arrays;
import java.util.Map;
import java.util.function.DoubleUnaryOperator;
import org.kwanta.model.NoConvergenceException;
import org.kwanta.model.aqueous.Component;
import org.kwanta.model.aqueous.Species;
import org.kwanta.model.numeric.Brent;
import org.kwanta.model.water.WaterState;

/**
 * The solution model as it was before it was optimised (commit 51e8942): nested Brent searches on
 * pH inside a plain fixed-point iteration on the ionic strength. Kept unchanged as the test oracle
 * of {@link SolutionModel}, which must agree with it to numerical noise.
 *
 * <p>Original description: Charge balance and conductivity of a cycle-water solution at one
 * temperature, and its inverse: the amount of one solute that gives a measured conductivity.
 *
 * <p>Species follow from a(H⁺) in closed form (Kw; BH⁺ = B + H⁺ for each alkalizer; carbonic and
 * phosphoric acid steps; Na⁺, Cl⁻, SO₄²⁻ fully dissociated), with Davies activity coefficients at
 * an ionic strength iterated to a fixed point. The charge balance Σ zᵢmᵢ = 0 is solved for pH with
 * Brent's method. For the inverse problem the unknown amount x enters the charge balance linearly,
 * x = −(charge of the rest)/(charge per unit x), so the fit is a single Brent search on pH rather
 * than a search nested around a speciation. (For a neutral salt, which does not enter the charge
 * balance, the search is on x.) Conductivity per {@link IonConductivities}. Immutable and
 * thread-safe.
 */
final class BrentSolutionModel {

  /** Lowest pH searched (acid side), far beyond 100 µS/cm of any acid. */
  private static final double PH_MIN = 1.5;

  /** Distance below pKw of the highest pH searched (base side). */
  private static final double PH_MAX_BELOW_PKW = 1.5;

  private static final double PH_TOLERANCE = 1e-13;
  private static final int BRENT_ITERATIONS = 200;
  private static final int MAX_ACTIVITY_ITERATIONS = 60;

  /** Relative change of ionic strength at which the activity iteration stops. */
  private static final double IONIC_STRENGTH_TOLERANCE = 1e-10;

  /** Half-width of the warm-start pH bracket. */
  private static final double WARM_HALF_WIDTH = 0.01;

  private static final int H = Species.HYDROGEN_ION.ordinal();
  private static final int OH = Species.HYDROXIDE.ordinal();
  private static final int NA = Species.SODIUM_ION.ordinal();
  private static final int CL = Species.CHLORIDE_ION.ordinal();
  private static final int SO4 = Species.SULFATE.ordinal();
  private static final int HCO3 = Species.BICARBONATE.ordinal();
  private static final int CO3 = Species.CARBONATE.ordinal();
  private static final int H2PO4 = Species.DIHYDROGEN_PHOSPHATE.ordinal();
  private static final int HPO4 = Species.HYDROGEN_PHOSPHATE.ordinal();
  private static final int PO4 = Species.PHOSPHATE.ordinal();
  private static final int N_IONS = Species.values().length;
  private static final int[] CHARGES = charges();

  private final IonConductivities ions;
  private final WaterState water;
  private final double kw;
  private final double dhA;
  private final double k1c;
  private final double k2c;
  private final double k1p;
  private final double k2p;
  private final double k3p;
  private final int[] baseCation;
  private final double[] baseFraction;
  private final double[] baseKa;

  /**
   * @param ions ion conductivities at the temperature
   * @param equilibria equilibrium constants at the same water state
   * @param mix the alkalizer or mix that {@link Solutes#alkalizer()} refers to
   * @throws IllegalArgumentException when the mix needs a constant the equilibria lack, or the two
   *     belong to different temperatures
   */
  BrentSolutionModel(IonConductivities ions, Equilibria equilibria, AlkalizerMix mix) {
    this.ions = ions;
    this.water = ions.water();
    if (equilibria.water().temperatureK() != water.temperatureK()) {
      throw new IllegalArgumentException(
          "conductivities at "
              + water.temperatureK()
              + " K but equilibria at "
              + equilibria.water().temperatureK()
              + " K");
    }
    this.kw = Math.pow(10, -water.pKw());
    this.dhA = water.debyeHuckelA();
    this.k1c = Math.pow(10, -equilibria.carbonicPK1());
    this.k2c = Math.pow(10, -equilibria.carbonicPK2());
    this.k1p = Math.pow(10, -equilibria.phosphoricPK1());
    this.k2p = Math.pow(10, -equilibria.phosphoricPK2());
    this.k3p = Math.pow(10, -equilibria.phosphoricPK3());
    int n = mix.molarFractions().size();
    this.baseCation = new int[n];
    this.baseFraction = new double[n];
    this.baseKa = new double[n];
    int i = 0;
    for (Map.Entry<Component, Double> e : mix.molarFractions().entrySet()) {
      Double pk = equilibria.basePKa().get(e.getKey());
      if (pk == null) {
        throw new IllegalArgumentException("no pKa given for " + e.getKey());
      }
      baseCation[i] = e.getKey().species().get(0).ordinal();
      baseFraction[i] = e.getValue();
      baseKa[i] = Math.pow(10, -pk);
      i++;
    }
  }

  private static int[] charges() {
    Species[] all = Species.values();
    int[] z = new int[all.length];
    for (int i = 0; i < all.length; i++) {
      z[i] = all[i].chargeNumber();
    }
    return z;
  }

  /** The ion conductivities this model uses. */
  public IonConductivities ions() {
    return ions;
  }

  /** Temperature, K. */
  public double temperatureK() {
    return water.temperatureK();
  }

  /** Speciates given totals: pH from the charge balance, then κ. */
  public Solution solve(Solutes s) {
    State st = new State();
    double ionic = 0;
    double pH = Double.NaN;
    for (int it = 0; it < MAX_ACTIVITY_ITERATIONS; it++) {
      st.activity(ionic);
      pH = warmBrent(p -> st.charge(p, s), pH, PH_MIN, water.pKw() - 1);
      st.charge(pH, s);
      st.fill(s);
      double next = st.ionicStrength();
      if (Math.abs(next - ionic) <= IONIC_STRENGTH_TOLERANCE * next) {
        return new Solution(s, pH, next, ions.kappa(st.m), water.temperatureK());
      }
      ionic = next;
    }
    throw new NoConvergenceException("activity iteration", MAX_ACTIVITY_ITERATIONS, ionic);
  }

  /**
   * The amount of one solute, the others held, at which the solution has the given conductivity.
   * When the target lies at or below the conductivity of the other solutes alone, returns that
   * solution with the amount zero (its {@link Solution#kappa()} then exceeds the target: the caller
   * decides what that means).
   *
   * @param known the other amounts (the unknown's own amount is ignored)
   * @param unknown the solute to fit
   * @param kappaTarget conductivity at this model's temperature, µS/cm
   */
  public Solution fit(Solutes known, Solute unknown, double kappaTarget) {
    Solutes base = known.with(unknown, 0);
    if (unknown == Solute.SODIUM_CHLORIDE) {
      return fitNeutralSalt(base, kappaTarget);
    }
    State st = new State();
    double ionic = 0;
    double pHbg = Double.NaN;
    double pH = Double.NaN;
    for (int it = 0; it < MAX_ACTIVITY_ITERATIONS; it++) {
      st.activity(ionic);
      pHbg = warmBrent(p -> st.charge(p, base), pHbg, PH_MIN, water.pKw() - 1);
      double kappaBg = st.kappaWith(pHbg, base, unknown, 0);
      if (kappaTarget <= kappaBg) {
        return solve(base);
      }
      boolean raisesPh = st.chargePerUnit(pHbg, unknown) > 0;
      double end = raisesPh ? water.pKw() - PH_MAX_BELOW_PKW : PH_MIN;
      pH =
          warmBrent(
              p -> st.kappaWith(p, base, unknown, st.amountAt(p, base, unknown)) - kappaTarget,
              pH,
              Math.min(pHbg, end),
              Math.max(pHbg, end));
      double x = Math.max(0, st.amountAt(pH, base, unknown));
      Solutes s = base.with(unknown, x);
      st.charge(pH, s);
      st.fill(s);
      double next = st.ionicStrength();
      if (Math.abs(next - ionic) <= IONIC_STRENGTH_TOLERANCE * next) {
        return new Solution(s, pH, next, ions.kappa(st.m), water.temperatureK());
      }
      ionic = next;
    }
    throw new NoConvergenceException("activity iteration in fit", MAX_ACTIVITY_ITERATIONS, ionic);
  }

  /**
   * Brent on [lo, hi], first trying a narrow bracket around the previous iterate's root (the
   * activity coefficients move the root only slightly between iterations).
   */
  private static double warmBrent(DoubleUnaryOperator f, double guess, double lo, double hi) {
    if (!Double.isNaN(guess)) {
      double a = Math.max(lo, guess - WARM_HALF_WIDTH);
      double b = Math.min(hi, guess + WARM_HALF_WIDTH);
      double fa = f.applyAsDouble(a);
      double fb = f.applyAsDouble(b);
      if (fa * fb <= 0) {
        return Brent.solve(f, a, b, PH_TOLERANCE, BRENT_ITERATIONS);
      }
    }
    return Brent.solve(f, lo, hi, PH_TOLERANCE, BRENT_ITERATIONS);
  }

  private Solution fitNeutralSalt(Solutes base, double kappaTarget) {
    Solution bg = solve(base);
    if (kappaTarget <= bg.kappa()) {
      return bg;
    }
    double perMol =
        water.densityKgPerM3()
            * (ions.limiting(Species.SODIUM_ION) + ions.limiting(Species.CHLORIDE_ION));
    double hi = 2 * (kappaTarget - bg.kappa()) / perMol + 1e-12;
    while (solve(base.with(Solute.SODIUM_CHLORIDE, hi)).kappa() < kappaTarget) {
      hi *= 2;
    }
    double x =
        Brent.solve(
            v -> solve(base.with(Solute.SODIUM_CHLORIDE, v)).kappa() - kappaTarget,
            0,
            hi,
            hi * 1e-14,
            BRENT_ITERATIONS);
    return solve(base.with(Solute.SODIUM_CHLORIDE, x));
  }

  /** Working state: activity coefficients and species molalities at one trial pH. */
  private final class State {
    final double[] m = new double[N_IONS];
    double g1 = 1;
    double g2 = 1;
    double g3 = 1;
    // species per unit total at the last pH evaluated
    double mH;
    double mOH;
    final double[] alpha = new double[baseKa.length];
    double fHco3;
    double fCo3;
    double fH2po4;
    double fHpo4;
    double fPo4;
    double lastPh = Double.NaN;

    void activity(double ionicStrength) {
      g1 = Davies.gamma(dhA, 1, ionicStrength);
      g2 = Davies.gamma(dhA, 2, ionicStrength);
      g3 = Davies.gamma(dhA, 3, ionicStrength);
      lastPh = Double.NaN;
    }

    void at(double pH) {
      if (pH == lastPh) {
        return;
      }
      double aH = Math.pow(10, -pH);
      mH = aH / g1;
      mOH = kw / (aH * g1);
      for (int i = 0; i < baseKa.length; i++) {
        alpha[i] = aH / (aH + baseKa[i] * g1);
      }
      double r1 = k1c / (aH * g1);
      double r2 = k1c * k2c / (aH * aH * g2);
      double d = 1 + r1 + r2;
      fHco3 = r1 / d;
      fCo3 = r2 / d;
      double p1 = k1p / (aH * g1);
      double p2 = k1p * k2p / (aH * aH * g2);
      double p3 = k1p * k2p * k3p / (aH * aH * aH * g3);
      double dp = 1 + p1 + p2 + p3;
      fH2po4 = p1 / dp;
      fHpo4 = p2 / dp;
      fPo4 = p3 / dp;
      lastPh = pH;
    }

    double alkalizerCharge() {
      double q = 0;
      for (int i = 0; i < alpha.length; i++) {
        q += baseFraction[i] * alpha[i];
      }
      return q;
    }

    /** Net charge, mol/kg, of the totals at a trial pH (decreasing in pH). */
    double charge(double pH, Solutes s) {
      at(pH);
      return mH
          - mOH
          + s.alkalizer() * alkalizerCharge()
          + s.sodium()
          - s.chloride()
          - 2 * s.sulfate()
          - s.carbonate() * (fHco3 + 2 * fCo3)
          - s.phosphate() * (fH2po4 + 2 * fHpo4 + 3 * fPo4);
    }

    double chargePerUnit(double pH, Solute u) {
      at(pH);
      return switch (u) {
        case ALKALIZER -> alkalizerCharge();
        case SODIUM_HYDROXIDE -> 1;
        case HYDROCHLORIC_ACID -> -1;
        case SULFURIC_ACID -> -2;
        case CARBON_DIOXIDE -> -(fHco3 + 2 * fCo3);
        case PHOSPHORIC_ACID -> -(fH2po4 + 2 * fHpo4 + 3 * fPo4);
        case SODIUM_CHLORIDE -> 0;
      };
    }

    /** Amount of the unknown that balances the charge at a trial pH. */
    double amountAt(double pH, Solutes base, Solute u) {
      double rest = charge(pH, base);
      return -rest / chargePerUnit(pH, u);
    }

    double kappaWith(double pH, Solutes base, Solute u, double x) {
      Solutes s = x == 0 ? base : base.with(u, x);
      at(pH);
      fill(s);
      return ions.kappa(m);
    }

    void fill(Solutes s) {
      Arrays.fill(m, 0);
      m[H] = mH;
      m[OH] = mOH;
      for (int i = 0; i < alpha.length; i++) {
        m[baseCation[i]] += s.alkalizer() * baseFraction[i] * alpha[i];
      }
      m[NA] += s.sodium();
      m[CL] += s.chloride();
      m[SO4] += s.sulfate();
      m[HCO3] += s.carbonate() * fHco3;
      m[CO3] += s.carbonate() * fCo3;
      m[H2PO4] += s.phosphate() * fH2po4;
      m[HPO4] += s.phosphate() * fHpo4;
      m[PO4] += s.phosphate() * fPo4;
    }

    double ionicStrength() {
      double sum = 0;
      for (int i = 0; i < N_IONS; i++) {
        int z = CHARGES[i];
        sum += m[i] * z * z;
      }
      return 0.5 * sum;
    }
  }
}
