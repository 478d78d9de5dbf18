package org.kwanta.model.conductivity;

import java.util.Map;
import java.util.function.DoubleUnaryOperator;
import org.kwanta.model.NoConvergenceException;
import org.kwanta.model.aqueous.Component;
import org.kwanta.model.aqueous.Species;
import org.kwanta.model.numeric.Brent;
import org.kwanta.model.water.WaterState;

/**
 * Charge balance and conductivity of a cycle-water solution at one temperature, and its inverse:
 * the amount of one solute that gives a measured conductivity.
 *
 * <p>Species follow from a(H⁺) in closed form (Kw; BH⁺ ⇌ B + H⁺ for each alkalizer; carbonic and
 * phosphoric acid steps; Na⁺, Cl⁻, SO₄²⁻ fully dissociated), with Davies activity coefficients at
 * an ionic strength iterated to a fixed point. For the inverse problem the unknown amount x enters
 * the charge balance linearly, x = −(charge of the rest)/(charge per unit x), so the fit is a
 * single search on pH rather than a search nested around a speciation. (For a neutral salt, which
 * does not enter the charge balance, the search is on x.) Conductivity per {@link
 * IonConductivities}. Immutable and thread-safe.
 *
 * <p>Numerics. At fixed activity coefficients every species fraction is a rational function of
 * a(H⁺) whose derivative is closed-form too (d ln αᵢ/d ln a(H⁺) from the mean charge of each acid
 * chain), so both searches on pH use a safeguarded Newton method (Newton steps kept inside a
 * bracket with a known sign change, bisection when a step leaves it or does not halve the
 * residual), started from the previous iterate or from the strong-electrolyte estimate. When only
 * fully dissociated solutes are present the charge balance is a quadratic in m(H⁺) and is solved in
 * closed form. The conductivity search runs on 2(κ − target)/(κ + target), which has the root and
 * sign of κ − target but follows ln κ, nearly linear in pH. The fixed point of the ionic strength I
 * ↦ I(species at pH(γ(I))) is accelerated by secant steps on I(…) − I; while the target lies far
 * above the background (the other solutes alone), the background of an earlier iterate is kept
 * rather than solved again. The stopping rules are those of the original nested Brent searches (pH
 * to 1e-13, I to 1e-10 relative), so results agree with them to numerical noise; where a Newton
 * search does not converge, the original Brent search is run instead. The species at a root reached
 * by a last Newton step (below 1e-9 pH) are stepped there from the last trial pH to first order
 * rather than computed again ({@code State.stepTo}): the same sums to rounding, one exponential
 * less.
 */
public final class SolutionModel {

  /** Lowest pH searched (acid side), far beyond 100 µS/cm of any acid. */
  private static final double PH_MIN = 1.5;

  /** Distance below pKw of the highest pH searched (base side). */
  private static final double PH_MAX_BELOW_PKW = 1.5;

  private static final double PH_TOLERANCE = 1e-13;
  private static final int BRENT_ITERATIONS = 200;
  private static final int MAX_ACTIVITY_ITERATIONS = 60;

  /** Relative change of ionic strength at which the activity iteration stops. */
  private static final double IONIC_STRENGTH_TOLERANCE = 1e-10;

  /** Half-width of the warm-start pH bracket of the Brent fallback. */
  private static final double WARM_HALF_WIDTH = 0.01;

  /**
   * A Newton step on pH this small ends the search: the error left is of the order of its square
   * times |f″/f′| (a few per pH unit), far below {@link #PH_TOLERANCE}.
   */
  private static final double NEWTON_LAST_STEP = 1e-9;

  /**
   * A last Newton step this small is not taken: the point it starts from is within a tenth of
   * {@link #PH_TOLERANCE} of the root, and the species there are already computed.
   */
  private static final double NEGLIGIBLE_STEP = 1e-14;

  private static final int NEWTON_ITERATIONS = 100;

  /** A Newton result this close to a bracket end is not trusted (Brent decides instead). */
  private static final double BRACKET_END_MARGIN = 1e-6;

  private static final double LN10 = Math.log(10);

  // solute groups: the amounts of Solutes in the order of its components
  private static final int ALK = 0;
  private static final int SOD = 1;
  private static final int CHL = 2;
  private static final int SUL = 3;
  private static final int CAR = 4;
  private static final int PHO = 5;
  private static final int GROUPS = 6;

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

  /** ρ, kg/m³, and ½ρ/1000 (molal Σmz² to molar ionic strength). */
  private final double rho;

  private final double halfRhoPerLiter;

  /** Per ion: |z|·λ°, and z²·(B1·λ° + B2/2), of κ = ρ Σ m (|z|λ° − z²(B1λ° + B2/2)√I). */
  private final double[] wa = new double[N_IONS];

  private final double[] wb = new double[N_IONS];

  /** Per base of the mix: wa and wb of its cation. */
  private final double[] baseA;

  private final double[] baseB;

  /** Per group: |z|λ° of the ion pair the solute forms with H⁺ or OH⁻ (for first estimates). */
  private final double[] pairA = new double[GROUPS];

  /**
   * @param ions ion conductivities at the temperature
   * @param equilibria equilibrium constants at the same water state
   * @param mix the alkalizer or mix that {@link Solutes#alkalizer()} refers to
   * @throws IllegalArgumentException when the mix needs a constant the equilibria lack, or the two
   *     belong to different temperatures
   */
  public SolutionModel(IonConductivities ions, Equilibria equilibria, AlkalizerMix mix) {
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
    this.rho = water.densityKgPerM3();
    this.halfRhoPerLiter = 0.5 * rho / 1000;
    Species[] all = Species.values();
    for (int k = 0; k < N_IONS; k++) {
      int z = Math.abs(all[k].chargeNumber());
      double l0 = ions.limiting(all[k]);
      wa[k] = z * l0;
      wb[k] = z * z * (ions.onsagerB1() * l0 + ions.onsagerB2() / 2);
    }
    this.baseA = new double[n];
    this.baseB = new double[n];
    double cationA = 0;
    for (int k = 0; k < n; k++) {
      baseA[k] = wa[baseCation[k]];
      baseB[k] = wb[baseCation[k]];
      cationA += baseFraction[k] * baseA[k];
    }
    pairA[ALK] = wa[OH] + cationA;
    pairA[SOD] = wa[OH] + wa[NA];
    pairA[CHL] = wa[H] + wa[CL];
    pairA[SUL] = wa[H] + wa[SO4] / 2;
    pairA[CAR] = wa[H] + wa[HCO3];
    pairA[PHO] = wa[H] + wa[H2PO4];
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
    return solve(s, null);
  }

  /**
   * {@link #solve(Solutes)} started from a nearby solution (of a similar composition, at any
   * temperature): only its pH and ionic strength are used, as starting values, so the result is the
   * same within the solver's tolerance, only found faster.
   *
   * @param s the totals
   * @param near a solution to start from, or null
   */
  public Solution solve(Solutes s, Solution near) {
    State st = new State(s, -1);
    double ionic = near == null ? 0 : near.ionicStrength();
    double pH = near == null ? Double.NaN : near.pH();
    Secant secant = new Secant();
    for (int it = 0; it < MAX_ACTIVITY_ITERATIONS; it++) {
      st.activity(ionic);
      pH = st.chargeRoot(pH);
      st.at(pH);
      double next = st.ionicStrength(0);
      if (Math.abs(next - ionic) <= IONIC_STRENGTH_TOLERANCE * next) {
        return new Solution(s, pH, next, st.kappa(pH, 0), water.temperatureK());
      }
      ionic = secant.next(ionic, next);
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
    return fit(known, unknown, kappaTarget, null);
  }

  /**
   * {@link #fit(Solutes, Solute, double)} started from a nearby solution (for example the fit of a
   * slightly different target): only its pH and ionic strength are used, as starting values, so the
   * result is the same within the solver's tolerance, only found faster.
   *
   * @param near a solution to start from, or null
   */
  public Solution fit(Solutes known, Solute unknown, double kappaTarget, Solution near) {
    return fit(known, unknown, kappaTarget, near, false);
  }

  /**
   * The fit proper. Whether the target lies at or below the background conductivity is tested at
   * every iterate of the ionic strength, as the original nested Brent search did; near the
   * background the outcome depends on the iterates themselves. So the test is made only at the
   * original's iterates (the first two of an unstarted fit, which match it), and when the target is
   * within {@link #activityMargin} of the background the fit iterates plainly from I = 0 like the
   * original (a started or accelerated fit restarts so); secant steps and starting values are used
   * only away from the background.
   *
   * @param plain iterate plainly from zero
   */
  private Solution fit(
      Solutes known, Solute unknown, double kappaTarget, Solution near, boolean plain) {
    Solutes base = known.with(unknown, 0);
    if (unknown == Solute.SODIUM_CHLORIDE) {
      return fitNeutralSalt(base, kappaTarget);
    }
    int u = group(unknown);
    State st = new State(base, u);
    // adding the alkalizer or sodium hydroxide raises the pH, an acid lowers it
    boolean raisesPh = u == ALK || u == SOD;
    double end = raisesPh ? water.pKw() - PH_MAX_BELOW_PKW : PH_MIN;
    double ionic = near == null ? 0 : near.ionicStrength();
    double pHbg = Double.NaN;
    double kappaBg = Double.NaN;
    double kappaBgIonic = 0;
    double pH = near == null ? Double.NaN : near.pH();
    Secant secant = new Secant();
    for (int it = 0; it < MAX_ACTIVITY_ITERATIONS; it++) {
      st.activity(ionic);
      boolean originals = plain || (near == null && it <= 1);
      if (originals || !farAbove(kappaTarget, kappaBg, Math.max(ionic, kappaBgIonic))) {
        pHbg = st.chargeRoot(pHbg);
        kappaBg = st.kappa(pHbg, 0);
        kappaBgIonic = ionic;
        boolean marginal = withinMargin(kappaTarget, kappaBg, ionic);
        if (originals) {
          // the iterates so far are the original's: decide as it did
          if (kappaTarget <= kappaBg) {
            return solve(base);
          }
          plain |= marginal;
        } else if (marginal) {
          return fit(known, unknown, kappaTarget, null, true);
        }
      }
      pH = st.kappaRoot(kappaTarget, pH, pHbg, end, raisesPh);
      double x = Math.max(0, st.amountAt(pH));
      double next = st.ionicStrength(x);
      if (Math.abs(next - ionic) <= IONIC_STRENGTH_TOLERANCE * next) {
        return new Solution(base.with(unknown, x), pH, next, st.kappa(pH, x), water.temperatureK());
      }
      double accelerated = secant.next(ionic, next);
      ionic = plain ? next : accelerated;
    }
    throw new NoConvergenceException("activity iteration in fit", MAX_ACTIVITY_ITERATIONS, ionic);
  }

  /**
   * Whether a target lies so far above a background conductivity, computed at an earlier iterate,
   * that the background at the current iterate can be neither at or above the target nor within
   * {@link #activityMargin} of it: the background moves by less than one margin of the larger of
   * the two ionic strengths, so four margins leave room for both. The earlier background's pH then
   * still bounds the search for the unknown's amount (the amount there is zero up to that move),
   * and the background need not be solved again.
   *
   * @param kappaBackground the background conductivity at the earlier iterate (NaN: none yet)
   * @param ionicStrength the larger of the two iterates' ionic strengths, mol/kg
   */
  private boolean farAbove(double kappaTarget, double kappaBackground, double ionicStrength) {
    // the margin is at most 2 (γ ≥ 0), so beyond 9 times the background the answer is yes
    // whatever the ionic strength: decided without the margin's exponential
    if (kappaBackground > 0 && kappaTarget > 9 * kappaBackground) {
      return true;
    }
    return kappaTarget > kappaBackground * (1 + 4 * activityMargin(ionicStrength));
  }

  /**
   * Whether a target lies at or below a background conductivity raised by one {@link
   * #activityMargin}: a fit that close to the background iterates plainly.
   */
  private boolean withinMargin(double kappaTarget, double kappaBackground, double ionicStrength) {
    // the margin is at most 2, so beyond 3 times the background the answer is no (as above)
    if (kappaBackground > 0 && kappaTarget > 3 * kappaBackground) {
      return false;
    }
    return kappaTarget <= kappaBackground * (1 + activityMargin(ionicStrength));
  }

  /**
   * An upper bound on the relative change of the background conductivity when the activity
   * coefficients move between γ(0) = 1 and γ(2I): twice 1 − γ of a trivalent ion at 2I (divalent
   * and monovalent ions, and the weak-electrolyte fractions they shift, move less).
   */
  private double activityMargin(double ionicStrength) {
    return 2 * (1 - Davies.gamma(dhA, 3, 2 * ionicStrength));
  }

  private static int group(Solute u) {
    return switch (u) {
      case ALKALIZER -> ALK;
      case SODIUM_HYDROXIDE -> SOD;
      case HYDROCHLORIC_ACID -> CHL;
      case SULFURIC_ACID -> SUL;
      case CARBON_DIOXIDE -> CAR;
      case PHOSPHORIC_ACID -> PHO;
      case SODIUM_CHLORIDE -> throw new IllegalArgumentException("a neutral salt has no group");
    };
  }

  /**
   * Brent on [lo, hi], first trying a narrow bracket around a guess (the original search, kept as
   * the fallback of the Newton searches).
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
    while (solve(base.with(Solute.SODIUM_CHLORIDE, hi), bg).kappa() < kappaTarget) {
      hi *= 2;
    }
    double x =
        Brent.solve(
            v -> solve(base.with(Solute.SODIUM_CHLORIDE, v), bg).kappa() - kappaTarget,
            0,
            hi,
            hi * 1e-14,
            BRENT_ITERATIONS);
    return solve(base.with(Solute.SODIUM_CHLORIDE, x), bg);
  }

  private static double trusted(double x, double lo, double hi) {
    return x - lo > BRACKET_END_MARGIN && hi - x > BRACKET_END_MARGIN ? x : Double.NaN;
  }

  /**
   * Secant acceleration of the fixed point I = G(I): from the last two pairs (I, G(I)) the root of
   * G(I) − I, kept when it lies within one plain step of G(I); otherwise the plain step G(I).
   */
  private static final class Secant {
    private double previousI = Double.NaN;
    private double previousG = Double.NaN;

    double next(double ionic, double g) {
      double proposal = g;
      if (!Double.isNaN(previousI)) {
        double r0 = previousG - previousI;
        double r1 = g - ionic;
        double denominator = r1 - r0;
        if (denominator != 0) {
          double candidate = ionic - r1 * (ionic - previousI) / denominator;
          if (candidate > 0 && Math.abs(candidate - g) <= Math.abs(g - ionic)) {
            proposal = candidate;
          }
        }
      }
      previousI = ionic;
      previousG = g;
      return proposal;
    }
  }

  /**
   * Working state of one solve or fit, for fixed amounts n (a fit's background) and an unknown
   * group u: activity coefficients, and at one trial pH the charge and conductivity sums of water
   * and n, and of a unit amount of u, with their derivatives in ln a(H⁺). The fully dissociated
   * solutes of n add the same to these sums at every pH, so that part is summed once.
   */
  private final class State {
    // the weak-electrolyte amounts of n, and whether a group enters (in n or as the unknown)
    private final double nAlk;
    private final double nCar;
    private final double nPho;
    private final int u;
    private final boolean alkalizer;
    private final boolean carbonic;
    private final boolean phosphoric;

    /** Whether n holds fully dissociated solutes only (its charge balance is a quadratic). */
    private final boolean strongOnly;

    // the fully dissociated solutes of n: charge, Σ m·wa, Σ m·wb, Σ m·z² (independent of pH)
    private final double strongQ;
    private final double strongA;
    private final double strongB;
    private final double strongC;

    double g1 = 1;
    double inverseG1 = 1;
    double lastPh = Double.NaN;

    /**
     * Whether the pH derivatives (suffix L) belong to {@link #lastPh}; false after {@link #stepTo},
     * which moves only the sums themselves.
     */
    boolean slopesCurrent;

    // at the current activity coefficients: Kw/γ₁, and the cumulative acid constants over the
    // activity coefficients of their anions (carbonic K1/γ₁, K1K2/γ₂; phosphoric up to K1K2K3/γ₃)
    double kwPerG1 = kw;
    double c1 = k1c;
    double c2 = k1c * k2c;
    double p1 = k1p;
    double p2 = k1p * k2p;
    double p3 = k1p * k2p * k3p;

    // species at the last pH
    double mH;
    double mOH;

    // water and n at the last pH: charge, Σ m·wa, Σ m·wb, Σ m·z², each with d/d ln a(H⁺)
    // (suffix L)
    double q;
    double qL;
    double a;
    double aL;
    double b;
    double bL;
    double c;
    double cL;

    // the same for a unit amount of the unknown group
    double zu;
    double zuL;
    double au;
    double auL;
    double bu;
    double buL;
    double cu;
    double cuL;

    // result of the last evaluation of a search function: value and d/dpH
    double f;
    double df;

    /**
     * @param n the fixed amounts
     * @param u the unknown group, or −1 for a plain solve
     */
    State(Solutes n, int u) {
      this.u = u;
      nAlk = n.alkalizer();
      nCar = n.carbonate();
      nPho = n.phosphate();
      alkalizer = nAlk != 0 || u == ALK;
      carbonic = nCar != 0 || u == CAR;
      phosphoric = nPho != 0 || u == PHO;
      strongOnly = nAlk == 0 && nCar == 0 && nPho == 0;
      double na = n.sodium();
      double cl = n.chloride();
      double so4 = n.sulfate();
      strongQ = na - cl - 2 * so4;
      strongA = na * wa[NA] + cl * wa[CL] + so4 * wa[SO4];
      strongB = na * wb[NA] + cl * wb[CL] + so4 * wb[SO4];
      strongC = na + cl + 4 * so4;
      // a fully dissociated unknown: its unit sums do not depend on pH
      switch (u) {
        case SOD -> unit(1, wa[NA], wb[NA], 1);
        case CHL -> unit(-1, wa[CL], wb[CL], 1);
        case SUL -> unit(-2, wa[SO4], wb[SO4], 4);
        default -> {}
      }
    }

    private void unit(double z, double ua, double ub, double uc) {
      zu = z;
      au = ua;
      bu = ub;
      cu = uc;
    }

    void activity(double ionicStrength) {
      // Davies: log10 γ is z² times that of a monovalent ion, so γ₂ = γ₁⁴ and γ₃ = γ₁⁹
      g1 = Davies.gamma(dhA, 1, ionicStrength);
      double g1Squared = g1 * g1;
      double g2 = g1Squared * g1Squared;
      double g3 = g2 * g2 * g1;
      inverseG1 = 1 / g1;
      kwPerG1 = kw * inverseG1;
      c1 = k1c * inverseG1;
      c2 = k1c * k2c / g2;
      p1 = k1p * inverseG1;
      p2 = k1p * k2p / g2;
      p3 = k1p * k2p * k3p / g3;
      lastPh = Double.NaN;
    }

    /** Sets the sums at a trial pH (kept when the pH is the last one). */
    void at(double pH) {
      if (pH == lastPh) {
        return;
      }
      compute(pH);
    }

    /** {@link #at}, with the pH derivatives of the sums current too (for a Newton step). */
    private void atWithSlopes(double pH) {
      if (pH == lastPh && slopesCurrent) {
        return;
      }
      compute(pH);
    }

    /**
     * Moves the sums from {@link #lastPh} to a pH a converged Newton step away (at most {@link
     * #NEWTON_LAST_STEP}), to first order in ln a(H⁺): S + S_L·Δln a(H⁺). The second-order term is
     * below ½·|S_LL|·(ln 10·1e-9)² ≈ 3e-18·S, under half an ulp of S, so the sums agree with those
     * computed afresh to rounding, and the root's species cost no further exponential. The pH
     * derivatives are left as they were (first-order stale): a Newton step from here recomputes.
     */
    void stepTo(double pH) {
      double dL = -LN10 * (pH - lastPh);
      mH += mH * dL;
      mOH -= mOH * dL;
      q += qL * dL;
      a += aL * dL;
      b += bL * dL;
      c += cL * dL;
      zu += zuL * dL;
      au += auL * dL;
      bu += buL * dL;
      cu += cuL * dL;
      lastPh = pH;
      slopesCurrent = false;
    }

    private void compute(double pH) {
      double aH = Math.exp(-LN10 * pH);
      double inverseAH = 1 / aH;
      mH = aH * inverseG1;
      mOH = kwPerG1 * inverseAH;
      q = mH - mOH + strongQ;
      qL = mH + mOH;
      a = mH * wa[H] + mOH * wa[OH] + strongA;
      aL = mH * wa[H] - mOH * wa[OH];
      b = mH * wb[H] + mOH * wb[OH] + strongB;
      bL = mH * wb[H] - mOH * wb[OH];
      c = mH + mOH + strongC;
      cL = mH - mOH;
      if (alkalizer) {
        alkalizer(aH);
      }
      if (carbonic) {
        carbonic(inverseAH);
      }
      if (phosphoric) {
        phosphoric(inverseAH);
      }
      lastPh = pH;
      slopesCurrent = true;
    }

    /** Adds the unit sums of weak group k times its amount; keeps them when k is the unknown. */
    private void add(
        int k,
        double amount,
        double z,
        double zL,
        double ua,
        double uaL,
        double ub,
        double ubL,
        double uc,
        double ucL) {
      q += amount * z;
      qL += amount * zL;
      a += amount * ua;
      aL += amount * uaL;
      b += amount * ub;
      bL += amount * ubL;
      c += amount * uc;
      cL += amount * ucL;
      if (k == u) {
        zu = z;
        zuL = zL;
        au = ua;
        auL = uaL;
        bu = ub;
        buL = ubL;
        cu = uc;
        cuL = ucL;
      }
    }

    /** The alkalizer mix at a(H⁺): BH⁺ fraction α of each base, d α/d ln a(H⁺) = α(1 − α). */
    private void alkalizer(double aH) {
      double z = 0;
      double zL = 0;
      double ua = 0;
      double uaL = 0;
      double ub = 0;
      double ubL = 0;
      for (int i = 0; i < baseKa.length; i++) {
        double al = aH / (aH + baseKa[i] * g1);
        double p = baseFraction[i] * al;
        double pL = p * (1 - al);
        z += p;
        zL += pL;
        ua += p * baseA[i];
        uaL += pL * baseA[i];
        ub += p * baseB[i];
        ubL += pL * baseB[i];
      }
      add(ALK, nAlk, z, zL, ua, uaL, ub, ubL, z, zL);
    }

    /** Carbonic acid at 1/a(H⁺). */
    private void carbonic(double inverseAH) {
      // fractions f1 (HCO3-), f2 (CO3-2); mean charge nc; df_j/dL = f_j (nc − j)
      double r1 = c1 * inverseAH;
      double r2 = c2 * inverseAH * inverseAH;
      double inverseD = 1 / (1 + r1 + r2);
      double fHco3 = r1 * inverseD;
      double fCo3 = r2 * inverseD;
      double nc = fHco3 + 2 * fCo3;
      double e1 = fHco3 * (nc - 1);
      double e2 = fCo3 * (nc - 2);
      add(
          CAR,
          nCar,
          -nc,
          -(e1 + 2 * e2),
          fHco3 * wa[HCO3] + fCo3 * wa[CO3],
          e1 * wa[HCO3] + e2 * wa[CO3],
          fHco3 * wb[HCO3] + fCo3 * wb[CO3],
          e1 * wb[HCO3] + e2 * wb[CO3],
          fHco3 + 4 * fCo3,
          e1 + 4 * e2);
    }

    /** Phosphoric acid at 1/a(H⁺): H2PO4-, HPO4-2, PO4-3. */
    private void phosphoric(double inverseAH) {
      double r1 = p1 * inverseAH;
      double r2 = p2 * inverseAH * inverseAH;
      double r3 = p3 * inverseAH * inverseAH * inverseAH;
      double inverseD = 1 / (1 + r1 + r2 + r3);
      double fH2po4 = r1 * inverseD;
      double fHpo4 = r2 * inverseD;
      double fPo4 = r3 * inverseD;
      double np = fH2po4 + 2 * fHpo4 + 3 * fPo4;
      double h1 = fH2po4 * (np - 1);
      double h2 = fHpo4 * (np - 2);
      double h3 = fPo4 * (np - 3);
      add(
          PHO,
          nPho,
          -np,
          -(h1 + 2 * h2 + 3 * h3),
          fH2po4 * wa[H2PO4] + fHpo4 * wa[HPO4] + fPo4 * wa[PO4],
          h1 * wa[H2PO4] + h2 * wa[HPO4] + h3 * wa[PO4],
          fH2po4 * wb[H2PO4] + fHpo4 * wb[HPO4] + fPo4 * wb[PO4],
          h1 * wb[H2PO4] + h2 * wb[HPO4] + h3 * wb[PO4],
          fH2po4 + 4 * fHpo4 + 9 * fPo4,
          h1 + 4 * h2 + 9 * h3);
    }

    /** Amount of the unknown that balances the charge of n at a trial pH. */
    double amountAt(double pH) {
      at(pH);
      return -q / zu;
    }

    /** Molal ionic strength of n plus x of the unknown at the current pH, mol/kg. */
    double ionicStrength(double x) {
      return 0.5 * (c + x * cu);
    }

    /** κ of n plus x of the unknown at a trial pH, µS/cm. */
    double kappa(double pH, double x) {
      at(pH);
      double sqrtI = Math.sqrt(halfRhoPerLiter * (c + x * cu));
      return rho * (a + x * au - sqrtI * (b + x * bu));
    }

    /** Sets f and df to the charge balance of n and its pH derivative. */
    void evalCharge(double pH) {
      atWithSlopes(pH);
      f = q;
      df = -LN10 * qL;
    }

    /**
     * Sets f to 2(κ − target)/(κ + target), with κ along the charge balance (the amount of the
     * unknown that balances n at pH), and df to its pH derivative.
     */
    void evalKappa(double pH, double target) {
      atWithSlopes(pH);
      double inverseZu = 1 / zu;
      double x = -q * inverseZu;
      double xL = -(qL + x * zuL) * inverseZu;
      double sa = a + x * au;
      double saL = aL + x * auL + xL * au;
      double sb = b + x * bu;
      double sbL = bL + x * buL + xL * bu;
      double sc = c + x * cu;
      double scL = cL + x * cuL + xL * cu;
      double sqrtI = Math.sqrt(halfRhoPerLiter * sc);
      double kappa = rho * (sa - sqrtI * sb);
      // d√I/dL = ½·(ρ/2000)·Σ z²m_L/√I, written with ρ/2000·Σ z²m = √I²
      double kappaL = rho * (saL - sqrtI * sbL - 0.5 * sb * sqrtI * scL / sc);
      // The search runs on h = 2(κ − target)/(κ + target), which has the sign and the root of
      // κ − target but follows ln(κ/target) to third order: κ of an acid or a base changes about
      // tenfold per pH unit, nearly linear in ln κ, so Newton steps on h land closer than on κ.
      double inverseSum = 1 / (kappa + target);
      f = 2 * (kappa - target) * inverseSum;
      df = -LN10 * 4 * target * kappaL * inverseSum * inverseSum;
    }

    /**
     * The pH of the charge balance of n, started from a guess (NaN: an estimate). With fully
     * dissociated solutes only, the balance is a quadratic in m(H⁺), solved in closed form.
     */
    double chargeRoot(double guess) {
      double lo = PH_MIN;
      double hi = water.pKw() - 1;
      if (strongOnly) {
        double pH = strongRoot(strongQ);
        if (pH > lo && pH < hi) {
          return pH;
        }
      }
      double start = guess;
      if (Double.isNaN(start)) {
        // strong-electrolyte estimate: mH − mOH + R = 0 with R the solutes' charge at neutrality
        at(water.pKw() / 2);
        start = strongRoot(q - (mH - mOH));
      }
      double pH = newton(false, 0, start, hi, lo);
      if (Double.isNaN(pH)) {
        pH = warmBrent(this::charge, guess, lo, hi);
      }
      return pH;
    }

    private double charge(double pH) {
      at(pH);
      return q;
    }

    /**
     * The pH at which m(H⁺) − m(OH⁻) + r = 0 at the current activity coefficients: m(H⁺)·m(OH⁻) =
     * Kw/γ₁², each root of the quadratic in the form free of cancellation.
     */
    private double strongRoot(double r) {
      double k = kw / (g1 * g1);
      double root = Math.sqrt(r * r + 4 * k);
      double mh = r > 0 ? 2 * k / (r + root) : (root - r) / 2;
      return -Math.log10(mh * g1);
    }

    /**
     * The pH at which κ along the charge balance meets the target, between pHbg (κ below target)
     * and end, started from a guess (NaN or outside that bracket: an estimate from the ion pair the
     * unknown forms).
     */
    double kappaRoot(double target, double guess, double pHbg, double end, boolean raises) {
      double start = guess;
      if (!(start > Math.min(pHbg, end) && start < Math.max(pHbg, end))) {
        double extra = (target - kappa(pHbg, 0)) / (rho * pairA[u]);
        start = raises ? -Math.log10(kw / (g1 * (mOH + extra))) : -Math.log10(g1 * (mH + extra));
      }
      double pH = newton(true, target, start, pHbg, end);
      if (Double.isNaN(pH)) {
        pH =
            warmBrent(
                p -> kappa(p, -charge(p) / zu) - target,
                guess,
                Math.min(pHbg, end),
                Math.max(pHbg, end));
      }
      return pH;
    }

    /**
     * Safeguarded Newton search (after Numerical Recipes' rtsafe) for the root of the charge
     * balance or of the κ function, on the bracket where f(neg) < 0 < f(pos). Returns NaN when it
     * does not converge or ends at a bracket end (the caller then runs Brent).
     */
    private double newton(boolean kappa, double target, double start, double neg, double pos) {
      double lo = Math.min(neg, pos);
      double hi = Math.max(neg, pos);
      double x = start > lo && start < hi ? start : 0.5 * (lo + hi);
      double stepBefore = hi - lo;
      double step = stepBefore;
      for (int i = 0; i < NEWTON_ITERATIONS; i++) {
        if (kappa) {
          evalKappa(x, target);
        } else {
          evalCharge(x);
        }
        if (f == 0) {
          return x;
        }
        if (f < 0) {
          neg = x;
        } else {
          pos = x;
        }
        double next = x - f / df;
        if (Math.abs(f / df) <= NEWTON_LAST_STEP && (next - neg) * (next - pos) <= 0) {
          // converged: the step is below the tolerance (possibly below one ulp of x); when it
          // is far below, x itself is as good a root and the species are already computed there
          if (Math.abs(f / df) <= NEGLIGIBLE_STEP) {
            return trusted(x, lo, hi);
          }
          double root = trusted(next, lo, hi);
          if (!Double.isNaN(root)) {
            // the caller reads the species at the root: step the sums there from x
            stepTo(root);
          }
          return root;
        }
        boolean useNewton =
            df != 0
                && (next - neg) * (next - pos) < 0
                && Math.abs(2 * f) <= Math.abs(stepBefore * df);
        stepBefore = step;
        if (useNewton) {
          step = f / df;
        } else {
          next = 0.5 * (neg + pos);
          step = x - next;
          if (Math.abs(pos - neg) <= PH_TOLERANCE) {
            return trusted(next, lo, hi);
          }
        }
        x = next;
      }
      return Double.NaN;
    }
  }
}
