package org.kwanta.model.aqueous;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.kwanta.model.NoConvergenceException;
import org.kwanta.model.water.WaterState;

/**
 * The speciation algorithm (the project's reference notes §8.1).
 *
 * <p>Unknowns x = log10 a(H⁺) and I. For fixed activity coefficients every weak acid/base fraction
 * is a closed-form function of a(H⁺): along a component's chain, m(i)/m(i−1) = Ka_i·γ(i−1)/(γ(i)·
 * a(H⁺)); m(OH⁻) = Kw/(γ(OH⁻)·a(H⁺)) with a(H2O) = 1. The charge balance f(x) = Σ z m is strictly
 * increasing in x: df/dx = ln 10·[m(H⁺) + m(OH⁻) + Σ_components total·Var(i)] &gt; 0, where Var(i)
 * is the variance of the number of protons lost over the component's species distribution. So it
 * has exactly one root. The root is found inside a bracket whose sign change is verified, by Newton
 * steps safeguarded by bisection (W. H. Press et al., <i>Numerical Recipes</i>, 3rd ed. 2007, §9.4
 * "rtsafe"): a Newton step that would leave the bracket or shrink it too slowly is replaced by a
 * bisection, so convergence is guaranteed like bisection and quadratic near the root. From a warm
 * start (the previous root, or a nearby solution's) one Newton step is tried first: when the step
 * from its end is already below the tolerance, that root is taken as the bracketed search would
 * take it, and otherwise the bracket is built from the nearer point. I is then recomputed from the
 * species and the solve repeated, with secant steps on I, until |ΔI| &lt; 1e-12 mol/kg and the
 * change in every log10 γ it implies is below 1e-11.
 *
 * <p>Associations (sodium ion pairs, polyborates; {@link Association}) couple components: when they
 * are carried, sodium with chloride and sulfate, and boron, are speciated by their mass balances
 * inside each evaluation of f (free Na⁺ and free B(OH)₃ by monotone Newton solves, {@link
 * #evaluateSodium}, {@link #evaluateBoron}); the other components keep their closed-form chains.
 *
 * <p>The I tolerance is absolute: it is always reachable in double precision for the accepted
 * totals (≤ 0.1 mol/kg per component, so I ≲ 2 mol/kg and ulp(I) ≤ 4e-16), and it is always small
 * enough, because d(log10 γ)/dI ≤ A·z²/(2√I) and I ≥ m(H⁺) + m(OH⁻) ≥ 2√Kw &gt; 1e-8 mol/kg in
 * 0-350 °C liquid water, so the error it leaves in log10 γ is below 1e-8·z².
 */
final class ChargeBalanceSolver {

  /** Stop the outer iteration when |ΔI| is below this, mol/kg. */
  static final double IONIC_STRENGTH_TOLERANCE = 1e-12;

  /**
   * Stop the outer iteration only when the last change in I also moves every log10 γ (|z| ≤ 3) by
   * less than this. At low ionic strength the absolute I tolerance alone leaves up to 1e-8 in log10
   * γ (class comment); this bound makes the root independent of where the iteration started, to
   * well below 1e-10 in pH.
   */
  static final double LOG_GAMMA_TOLERANCE = 1e-11;

  /** Tolerance on x = log10 a(H⁺) for the inner root find. */
  static final double LOG_ACTIVITY_TOLERANCE = 1e-14;

  /** Outer-iteration cap (convergence takes fewer than ten at cycle ionic strengths). */
  static final int MAX_OUTER_ITERATIONS = 200;

  /**
   * Inner-iteration cap. Bisection alone halves the bracket each step: from the widest bracket here
   * (under 40 log units) to 1e-14 takes 52 steps, so the cap is never reached.
   */
  static final int MAX_INNER_ITERATIONS = 300;

  /** Half-width of the first bracket around a warm start, in log10 a(H⁺). */
  static final double WARM_START_HALF_WIDTH = 0.05;

  private static final double LN10 = Math.log(10);

  /** Charges of each component's species chain, by component ordinal. */
  private static final int[][] CHAIN_CHARGES = new int[Component.values().length][];

  /** Equilibrium ordinals of each component's steps, by component ordinal. */
  private static final int[][] CHAIN_STEPS = new int[Component.values().length][];

  static {
    for (Component c : Component.values()) {
      List<Species> sp = c.species();
      List<Equilibrium> eq = c.equilibria();
      CHAIN_CHARGES[c.ordinal()] = sp.stream().mapToInt(Species::chargeNumber).toArray();
      CHAIN_STEPS[c.ordinal()] = eq.stream().mapToInt(Equilibrium::ordinal).toArray();
      for (int i = 0; i < eq.size(); i++) {
        // evaluate() relies on each step releasing exactly one H⁺ between neighbours.
        if (eq.get(i).acid() != sp.get(i)
            || eq.get(i).base() != sp.get(i + 1)
            || sp.get(i + 1).chargeNumber() != sp.get(i).chargeNumber() - 1) {
          throw new IllegalStateException("species chain of " + c + " is inconsistent");
        }
      }
    }
  }

  private final WaterState water;
  private final ActivityModel activityModel;
  private final double temperatureK;
  private final double kw;

  private final Component[] components;
  private final double[] totals;
  private final int[][] charges;

  /** Equilibrium ordinals of each component's steps (shared, do not modify). */
  private final int[][] steps;

  /** Ka by equilibrium ordinal (shared, do not modify). */
  private final double[] ka;

  private final double cationCapacity;
  private final double anionCapacity;

  /** log10 γ and γ for |z| = 0..3 at the current ionic strength. */
  private final double[] logGamma = new double[4];

  private final double[] gamma = {1, 1, 1, 1};

  /** Conditional step constants Ka·γ(i−1)/γ(i) at the current ionic strength. */
  private final double[][] conditional;

  /** df/dx at the last {@link #evaluate} call. */
  private double derivative;

  /** Indices of sodium, chloride, sulfate and boron among the components, or −1. */
  private int na = -1;

  private int cl = -1;
  private int so4 = -1;
  private int po4 = -1;
  private int boron = -1;

  /** Association constants carried, by {@link Association#ordinal()} (0 = not carried). */
  private final double[] associationK;

  /** True when sodium is speciated with its ion pairs, boron with its polyborates. */
  private final boolean pairedSodium;

  /** True when phosphate is speciated with sodium (NaHPO₄⁻ carried, both present). */
  private final boolean pairedPhosphate;

  private final boolean polymerBoron;

  /** Conditional pair constants at the current γ: NaOH° per m(OH⁻), NaCl°, NaSO₄⁻, NaHPO₄⁻. */
  private double kHydroxide;

  private double kChloride;
  private double kSulfate;
  private double kPhosphate;

  /** Conditional polyborate coefficients at the current γ (see {@link #evaluateBoron}). */
  private double q2;

  private double q3;
  private double q4;

  /** Free and paired molalities at the last {@link #evaluate} call, mol/kg. */
  private double naFree;

  private double clFree;
  private double so4Free;
  private double hso4;
  private double naOHPair;
  private double naClPair;
  private double naSO4Pair;

  /** Phosphate species (H₃PO₄, H₂PO₄⁻, HPO₄²⁻, PO₄³⁻) and NaHPO₄⁻ when paired, mol/kg. */
  private final double[] phosphates = new double[4];

  private double naHPO4Pair;

  /** Free B(OH)₃ and the borate anions (monomer, B₂, B₃, B₄) at the last evaluation, mol/kg. */
  private double boricFree;

  private final double[] borates = new double[4];

  ChargeBalanceSolver(
      Map<Component, Double> composition,
      double[] kaByEquilibrium,
      WaterState water,
      ActivityModel activityModel) {
    this(
        composition,
        kaByEquilibrium,
        new double[Association.values().length],
        water,
        activityModel);
  }

  /**
   * A solver carrying association reactions: sodium ion pairs (NaOH°, NaCl°, NaSO₄⁻) and
   * polyborates, by the constants given (0 turns one off).
   *
   * @param associationK K (ion pairs) or Q (polyborates) by {@link Association#ordinal()}
   */
  ChargeBalanceSolver(
      Map<Component, Double> composition,
      double[] kaByEquilibrium,
      double[] associationK,
      WaterState water,
      ActivityModel activityModel) {
    this.water = water;
    this.activityModel = activityModel;
    this.temperatureK = water.temperatureK();
    this.kw = Math.exp(-LN10 * water.pKw());
    int n = composition.size();
    components = new Component[n];
    totals = new double[n];
    charges = new int[n][];
    steps = new int[n][];
    ka = kaByEquilibrium;
    conditional = new double[n][];
    double cations = 0;
    double anions = 0;
    int k = 0;
    for (Component c : composition.keySet()) {
      components[k] = c;
      totals[k] = composition.get(c);
      charges[k] = CHAIN_CHARGES[c.ordinal()];
      steps[k] = CHAIN_STEPS[c.ordinal()];
      conditional[k] = new double[steps[k].length];
      // Chains run from the highest charge (first) to the lowest (last).
      cations += totals[k] * Math.max(charges[k][0], 0);
      anions += totals[k] * Math.max(-charges[k][charges[k].length - 1], 0);
      switch (c) {
        case SODIUM -> na = k;
        case CHLORIDE -> cl = k;
        case SULFATE -> so4 = k;
        case PHOSPHATE -> po4 = k;
        case BORON -> boron = k;
        default -> {}
      }
      k++;
    }
    cationCapacity = cations;
    // polyborates carry at most one charge per boron, as the monomer does
    anionCapacity = anions;
    this.associationK = associationK;
    pairedSodium =
        na >= 0
            && totals[na] > 0
            && (associationK[Association.SODIUM_HYDROXIDE.ordinal()] > 0
                || (cl >= 0 && associationK[Association.SODIUM_CHLORIDE.ordinal()] > 0)
                || (so4 >= 0 && associationK[Association.SODIUM_SULFATE.ordinal()] > 0)
                || (po4 >= 0 && associationK[Association.SODIUM_HYDROGEN_PHOSPHATE.ordinal()] > 0));
    pairedPhosphate =
        pairedSodium
            && po4 >= 0
            && associationK[Association.SODIUM_HYDROGEN_PHOSPHATE.ordinal()] > 0;
    polymerBoron =
        boron >= 0
            && totals[boron] > 0
            && (associationK[Association.DIBORATE.ordinal()] > 0
                || associationK[Association.TRIBORATE.ordinal()] > 0
                || associationK[Association.TETRABORATE.ordinal()] > 0);
  }

  /** True when component k is speciated by {@link #evaluateSodium} or {@link #evaluateBoron}. */
  private boolean coupled(int k) {
    return (pairedSodium && (k == na || k == cl || k == so4))
        || (pairedPhosphate && k == po4)
        || (polymerBoron && k == boron);
  }

  /** The solved state: x, I, γ for |z| = 0..3, and the outer iteration count. */
  record Solution(double log10ActivityH, double ionicStrength, double[] gamma, int iterations) {}

  Solution solve() {
    return solve(Double.NaN, 0);
  }

  /**
   * Solves from a starting point, typically the solution of a nearby composition at the same water
   * state. The start only sets where the search begins: the first bracket around it is verified
   * (and widened when it holds no sign change) and the ionic-strength iteration runs to the same
   * tolerance, so any start gives the same root within the solver tolerances.
   *
   * @param startLog10ActivityH starting x = log10 a(H⁺), or NaN for the cold bracket of the class
   *     comment
   * @param startIonicStrength starting I, mol/kg (0 for a cold start)
   */
  Solution solve(double startLog10ActivityH, double startIonicStrength) {
    double ionicStrength =
        Double.isFinite(startIonicStrength) && startIonicStrength > 0 ? startIonicStrength : 0;
    double x = Double.isFinite(startLog10ActivityH) ? startLog10ActivityH : Double.NaN;
    double previousIonicStrength = Double.NaN;
    double previousResidual = Double.NaN;
    for (int iteration = 1; iteration <= MAX_OUTER_ITERATIONS; iteration++) {
      double shift = setActivityCoefficients(ionicStrength);
      if (iteration == 1 && !Double.isNaN(x)) {
        // Warm start: the root lies within a few hundredths of a nearby solution's; the bracket
        // is verified and widened below when it does not.
        shift = WARM_START_HALF_WIDTH / 4;
      }
      // The root moves by about the change in log10 γ between outer iterations; the warm
      // bracket is a few times that, and is widened whenever it holds no sign change.
      x = solveForLogActivity(x, 4 * shift + 1e-12);
      double updated = ionicStrengthAt(x);
      double residual = updated - ionicStrength;
      if (Math.abs(residual) < IONIC_STRENGTH_TOLERANCE
          && activityShiftAt(updated) < LOG_GAMMA_TOLERANCE) {
        return new Solution(x, updated, gamma.clone(), iteration);
      }
      // Secant step on h(I) = I(species at I) − I from the last two iterates; the plain
      // fixed-point step I ← I(species) whenever the secant is undefined or lands outside a
      // factor of two of it.
      double next = updated;
      if (!Double.isNaN(previousResidual) && residual != previousResidual) {
        double secant =
            ionicStrength
                - residual
                    * (ionicStrength - previousIonicStrength)
                    / (residual - previousResidual);
        if (secant > 0.5 * updated && secant < 2 * updated) {
          next = secant;
        }
      }
      previousIonicStrength = ionicStrength;
      previousResidual = residual;
      ionicStrength = next;
    }
    throw new NoConvergenceException(
        "ionic-strength iteration of the speciation",
        MAX_OUTER_ITERATIONS,
        Math.abs(ionicStrengthAt(x) - ionicStrength));
  }

  /** The largest change in log10 γ that moving to an ionic strength would make. */
  private double activityShiftAt(double ionicStrength) {
    double a = water.debyeHuckelA();
    double b = water.debyeHuckelB();
    double shift = 0;
    for (int z = 1; z <= 3; z++) {
      double lg = activityModel.log10Gamma(z, ionicStrength, a, b, temperatureK);
      shift = Math.max(shift, Math.abs(lg - logGamma[z]));
    }
    return shift;
  }

  /** Sets γ at an ionic strength; returns the largest change in log10 γ. */
  private double setActivityCoefficients(double ionicStrength) {
    double a = water.debyeHuckelA();
    double b = water.debyeHuckelB();
    double shift = 0;
    for (int z = 1; z <= 3; z++) {
      double lg = activityModel.log10Gamma(z, ionicStrength, a, b, temperatureK);
      shift = Math.max(shift, Math.abs(lg - logGamma[z]));
      logGamma[z] = lg;
    }
    if (activityModel == ActivityModel.DAVIES) {
      // log10 γ is z² times that of a monovalent ion, so γ₂ = γ₁⁴ and γ₃ = γ₁⁹
      double g1 = Math.exp(LN10 * logGamma[1]);
      double g1Squared = g1 * g1;
      gamma[1] = g1;
      gamma[2] = g1Squared * g1Squared;
      gamma[3] = gamma[2] * gamma[2] * g1;
    } else {
      for (int z = 1; z <= 3; z++) {
        gamma[z] = Math.exp(LN10 * logGamma[z]);
      }
    }
    for (int k = 0; k < components.length; k++) {
      int[] z = charges[k];
      int[] step = steps[k];
      for (int i = 0; i < step.length; i++) {
        conditional[k][i] = ka[step[i]] * gamma[Math.abs(z[i])] / gamma[Math.abs(z[i + 1])];
      }
    }
    // m(NaOH°) = K·γ₁²·m(Na⁺)·m(OH⁻); m(NaCl°) = K·γ₁²·m(Na⁺)·m(Cl⁻);
    // m(NaSO₄⁻) = K·γ₁·γ₂/γ₁·m(Na⁺)·m(SO₄²⁻)
    kHydroxide = associationK[Association.SODIUM_HYDROXIDE.ordinal()] * gamma[1] * gamma[1];
    kChloride = associationK[Association.SODIUM_CHLORIDE.ordinal()] * gamma[1] * gamma[1];
    kSulfate = associationK[Association.SODIUM_SULFATE.ordinal()] * gamma[2];
    // m(NaHPO₄⁻) = K·γ₁·γ₂/γ₁·m(Na⁺)·m(HPO₄²⁻), as for NaSO₄⁻
    kPhosphate = associationK[Association.SODIUM_HYDROGEN_PHOSPHATE.ordinal()] * gamma[2];
    // m(B_x) = Q·b^x·a(OH⁻)^y/γ_y with a(OH⁻) = Kw/a(H⁺): per 1/a(H⁺)^y
    q2 = associationK[Association.DIBORATE.ordinal()] * kw / gamma[1];
    q3 = associationK[Association.TRIBORATE.ordinal()] * kw / gamma[1];
    q4 = associationK[Association.TETRABORATE.ordinal()] * kw * kw / gamma[2];
    return shift;
  }

  /** Σ z m at x, mol/kg; also sets {@link #derivative} to d(Σ z m)/dx. */
  double evaluate(double x) {
    double aH = Math.exp(LN10 * x);
    double inverse = 1 / aH;
    double mH = aH / gamma[1];
    double mOH = kw * inverse / gamma[1];
    double sum = mH - mOH;
    double slope = mH + mOH;
    for (int k = 0; k < components.length; k++) {
      double[] c = conditional[k];
      int[] z = charges[k];
      if (coupled(k)) {
        continue;
      }
      if (c.length == 0) {
        sum += totals[k] * z[0];
        continue;
      }
      double r = 1;
      double s = 1;
      double lost = 0;
      double lostSquared = 0;
      for (int i = 0; i < c.length; i++) {
        r *= c[i] * inverse;
        s += r;
        lost += (i + 1) * r;
        lostSquared += (i + 1) * (i + 1) * r;
      }
      double meanLost = lost / s;
      // Species charge is z[0] − (protons lost), so Σ z α = z[0] − mean lost.
      sum += totals[k] * (z[0] - meanLost);
      slope += totals[k] * (lostSquared / s - meanLost * meanLost);
    }
    if (pairedSodium) {
      double[] sumAndSlope = evaluateSodium(inverse, mOH);
      sum += sumAndSlope[0];
      slope += sumAndSlope[1];
    }
    if (polymerBoron) {
      double[] sumAndSlope = evaluateBoron(inverse);
      sum += sumAndSlope[0];
      slope += sumAndSlope[1];
    }
    derivative = LN10 * slope;
    return sum;
  }

  /**
   * Stop a free-molality Newton solve (sodium, boron) once a step is below this fraction of the
   * molality: both balances have |h''|·m/h' ≤ 3, so the error after that step is below about
   * 1.5·(1e-8)² = 1.5e-16 of m (quadratic convergence), at double-precision resolution.
   */
  static final double FREE_MOLALITY_STEP = 1e-8;

  /** Cap on the Newton steps of a free-molality solve (monotone convergence, a few steps). */
  static final int MAX_FREE_ITERATIONS = 100;

  private final double[] sumAndSlope = new double[2];

  /**
   * Sodium with its pairs at a(H⁺) = 1/inverse: solves the sodium balance for m(Na⁺), sets the free
   * and paired molalities, and returns the charge of sodium, chloride and sulfate and its slope
   * (per ln 10). The balance h(n) = n·(1 + K'ₒₕ·m(OH⁻)) + Cl_T·K'꜀ₗ·n/(1 + K'꜀ₗ·n) + S_T·K'ₛ·n/(D +
   * K'ₛ·n) − Na_T, with D = 1 + m(HSO₄⁻)/m(SO₄²⁻), is increasing and concave in n, so Newton's
   * method from the lower bound n₀ = Na_T/h'(0) climbs monotonically to the root. By conservation
   * of charge, the charge of the three components is Na_T − Cl_T − 2·S_T + m(HSO₄⁻) − m(NaOH°):
   * pairing enters through NaOH° (a bound hydroxide) and through HSO₄⁻. The slope holds m(Na⁺)
   * fixed (the root finder is safeguarded, so an approximate slope only costs steps).
   *
   * <p>With NaHPO₄⁻ carried ({@link #pairedPhosphate}) the balance gains P_T·K'ₚ·n/(D_P + K'ₚ·n),
   * D_P = Σ m(phosphate chain)/m(HPO₄²⁻), of the same increasing concave form; phosphate adds the
   * charge −P_T·E[L] with L the protons lost from H₃PO₄ and the pair counted with HPO₄²⁻ (L = 2;
   * its −1 and the Na⁺ it binds make −2), and the slope P_T·Var[L] at fixed n.
   */
  private double[] evaluateSodium(double inverse, double mOH) {
    double naT = totals[na];
    double p = 1 + kHydroxide * mOH;
    boolean withCl = cl >= 0 && kChloride > 0;
    boolean withS = so4 >= 0;
    double kCl = kChloride;
    double aCl = withCl ? totals[cl] * kCl : 0;
    double sT = withS ? totals[so4] : 0;
    double kS = kSulfate;
    double aS = sT * kS;
    // m(HSO₄⁻)/m(SO₄²⁻) and D = 1 + m(HSO₄⁻)/m(SO₄²⁻)
    double invRS = withS ? 1 / (conditional[so4][0] * inverse) : 0;
    double d = 1 + invRS;
    double iCl = 1;
    double iS = withS ? 1 / d : 0;
    // Phosphate relative to H₃PO₄: w₁ = m(H₂PO₄⁻)/m(H₃PO₄), w₂ for HPO₄²⁻, w₃ for PO₄³⁻
    boolean withP = pairedPhosphate;
    double kP = kPhosphate;
    double pT = withP ? totals[po4] : 0;
    double aP = pT * kP;
    double w1 = 0;
    double w2 = 0;
    double w3 = 0;
    double dP = 1;
    if (withP) {
      double[] cP = conditional[po4];
      w1 = cP[0] * inverse;
      w2 = w1 * cP[1] * inverse;
      w3 = w2 * cP[2] * inverse;
      dP = (1 + w1 + w2 + w3) / w2;
    }
    double iP = withP ? 1 / dP : 0;
    double n = naT / (p + aCl + aS * iS + aP * iP);
    for (int i = 0; i < MAX_FREE_ITERATIONS && n > 0; i++) {
      if (withCl) {
        iCl = 1 / (1 + kCl * n);
      }
      if (withS) {
        iS = 1 / (d + kS * n);
      }
      if (withP) {
        iP = 1 / (dP + kP * n);
      }
      double h = n * (p + aCl * iCl + aS * iS + aP * iP) - naT;
      // the phosphate term's derivative aP·D_P·iP² written as aP·iP·(1 − K'ₚ·n·iP), finite when
      // m(HPO₄²⁻) underflows (D_P infinite, iP 0)
      double dh = p + aCl * iCl * iCl + aS * d * iS * iS + aP * iP * (1 - kP * n * iP);
      double step = h / dh;
      n -= step;
      if (Math.abs(step) <= FREE_MOLALITY_STEP * n) {
        break;
      }
    }
    if (withCl) {
      iCl = 1 / (1 + kCl * n);
    }
    if (withS) {
      iS = 1 / (d + kS * n);
    }
    naFree = n;
    naOHPair = (p - 1) * n;
    clFree = withCl ? totals[cl] * iCl : cl >= 0 ? totals[cl] : 0;
    naClPair = aCl * n * iCl;
    so4Free = sT * iS;
    hso4 = so4Free * invRS;
    naSO4Pair = kS * n * so4Free;
    double slope = naOHPair;
    if (sT > 0) {
      // w = m(SO₄²⁻ + NaSO₄⁻)/m(HSO₄⁻) ∝ 1/a(H⁺); d m(HSO₄⁻)/d ln a(H⁺) = S_T·w/(1 + w)²
      slope += hso4 * (so4Free + naSO4Pair) / sT;
    }
    double charge = naT - (cl >= 0 ? totals[cl] : 0) - 2 * sT + hso4 - naOHPair;
    if (withP) {
      // the chain with the pair in the L = 2 bin, at fixed n
      double w2p = w2 * (1 + kP * n);
      double s = 1 + w1 + w2p + w3;
      double meanLost = (w1 + 2 * w2p + 3 * w3) / s;
      double meanSquare = (w1 + 4 * w2p + 9 * w3) / s;
      charge -= pT * meanLost;
      slope += pT * (meanSquare - meanLost * meanLost);
      phosphates[0] = pT / s;
      phosphates[1] = pT * w1 / s;
      phosphates[2] = pT * w2 / s;
      phosphates[3] = pT * w3 / s;
      naHPO4Pair = pT * w2 * kP * n / s;
    } else {
      naHPO4Pair = 0;
    }
    sumAndSlope[0] = charge;
    sumAndSlope[1] = slope;
    return sumAndSlope;
  }

  /**
   * Boron with its polyborates at a(H⁺) = 1/u: solves B_T = b(1 + a₁u) + 2q₂u·b² + 3q₃u·b³ +
   * 4q₄u²·b⁴ for free B(OH)₃ b (increasing and convex in b, so Newton's method from the upper bound
   * b₀ = B_T/(1 + a₁u) descends monotonically to the root), sets the borate molalities and returns
   * the boron charge −N = −(a₁u·b + q₂u·b² + q₃u·b³ + 2q₄u²·b⁴) and its exact slope u·dN/du (per ln
   * 10, b implicit).
   */
  private double[] evaluateBoron(double u) {
    double bT = totals[boron];
    double a1 = conditional[boron][0];
    double c2 = q2 * u;
    double c3 = q3 * u;
    double c4 = q4 * u * u;
    double b = bT / (1 + a1 * u);
    for (int i = 0; i < MAX_FREE_ITERATIONS && b > 0; i++) {
      double m = b * (1 + a1 * u + b * (2 * c2 + b * (3 * c3 + b * 4 * c4))) - bT;
      double dm = 1 + a1 * u + b * (4 * c2 + b * (9 * c3 + b * 16 * c4));
      double step = m / dm;
      b -= step;
      if (Math.abs(step) <= FREE_MOLALITY_STEP * b) {
        break;
      }
    }
    boricFree = b;
    borates[0] = a1 * u * b;
    borates[1] = c2 * b * b;
    borates[2] = c3 * b * b * b;
    borates[3] = c4 * b * b * b * b;
    double negative = borates[0] + borates[1] + borates[2] + 2 * borates[3];
    // partial derivatives in u (per u, i.e. u·∂/∂u) and in b
    double nU = borates[0] + borates[1] + borates[2] + 4 * borates[3];
    double mU = borates[0] + 2 * borates[1] + 3 * borates[2] + 8 * borates[3];
    double mB = 1 + a1 * u + b * (4 * c2 + b * (9 * c3 + b * 16 * c4));
    double nB = a1 * u + b * (2 * c2 + b * (3 * c3 + b * 8 * c4));
    sumAndSlope[0] = -negative;
    sumAndSlope[1] = nU - nB * mU / mB;
    return sumAndSlope;
  }

  /** Σ z m at x, mol/kg. */
  double chargeBalance(double x) {
    return evaluate(x);
  }

  /** Σ |z| m at x, mol/kg (the scale for the relative residual). */
  double chargeScale(double x) {
    return sumOverSpecies(x, false);
  }

  private double ionicStrengthAt(double x) {
    return sumOverSpecies(x, true) / 2;
  }

  /** Σ |z| m, or Σ z² m when {@code squared}, over all species at x, mol/kg. */
  private double sumOverSpecies(double x, boolean squared) {
    double aH = Math.exp(LN10 * x);
    double inverse = 1 / aH;
    double sum = aH / gamma[1] + kw * inverse / gamma[1];
    if (pairedSodium || polymerBoron) {
      // the free and paired molalities at x (the chains are summed below)
      if (pairedSodium) {
        evaluateSodium(inverse, kw * inverse / gamma[1]);
      }
      if (polymerBoron) {
        evaluateBoron(inverse);
      }
      int two = squared ? 4 : 2;
      if (pairedSodium) {
        sum += naFree + clFree + hso4 + two * so4Free + naSO4Pair;
      }
      if (pairedPhosphate) {
        int three = squared ? 9 : 3;
        sum += phosphates[1] + two * phosphates[2] + three * phosphates[3] + naHPO4Pair;
      }
      if (polymerBoron) {
        sum += borates[0] + borates[1] + borates[2] + two * borates[3];
      }
    }
    for (int k = 0; k < components.length; k++) {
      if (coupled(k)) {
        continue;
      }
      double[] c = conditional[k];
      int[] z = charges[k];
      double r = 1;
      double s = 1;
      double q = squared ? z[0] * z[0] : Math.abs(z[0]);
      for (int i = 0; i < c.length; i++) {
        r *= c[i] * inverse;
        s += r;
        int zi = z[i + 1];
        q += (squared ? zi * zi : Math.abs(zi)) * r;
      }
      sum += totals[k] * q / s;
    }
    return sum;
  }

  private double solveForLogActivity(double previous, double halfWidth) {
    double lo;
    double hi;
    double fLo;
    double fHi;
    if (Double.isNaN(previous)) {
      // At the root m(H⁺) ≤ m(OH⁻) + anion capacity and m(OH⁻) ≤ m(H⁺) + cation capacity;
      // 2·√Kw covers the water contribution and ±1 the activity coefficients.
      double root = 2 * Math.sqrt(kw);
      hi = Math.log10(anionCapacity + root) + 1;
      lo = -water.pKw() - Math.log10(cationCapacity + root) - 1;
      previous = Math.max(lo, Math.min(hi, -water.pKw() / 2));
    } else {
      // Warm: the previous root is one end of the bracket (its sign says which), the other end
      // lies halfWidth away and is verified below like any other.
      double f = evaluate(previous);
      if (f == 0) {
        return previous;
      }
      double df = derivative;
      // Near the previous root, the Newton point from it is usually so close to the new root
      // that the next Newton step is below the tolerance: then no bracket end is needed.
      double newton = previous - f / df;
      if (df > 0 && Math.abs(newton - previous) <= halfWidth) {
        double fNewton = evaluate(newton);
        double dfNewton = derivative;
        if (fNewton == 0) {
          return newton;
        }
        double step = fNewton / dfNewton;
        if (dfNewton > 0 && Math.abs(step) < LOG_ACTIVITY_TOLERANCE) {
          return newton - step;
        }
        if (fNewton > 0 != f > 0) {
          return safeguardedNewton(
              Math.min(previous, newton), Math.max(previous, newton), newton, fNewton, dfNewton);
        }
        // the same sign: the Newton point is the nearer start
        previous = newton;
        f = fNewton;
        df = dfNewton;
      }
      if (f < 0) {
        lo = previous;
        fLo = f;
        hi = previous + halfWidth;
        fHi = widenHigh(lo, hi);
        hi = widenedEnd;
      } else {
        hi = previous;
        fHi = f;
        lo = previous - halfWidth;
        fLo = widenLow(lo, hi);
        lo = widenedEnd;
      }
      if (fLo == 0) {
        return lo;
      }
      if (fHi == 0) {
        return hi;
      }
      return safeguardedNewton(lo, hi, previous, f, df);
    }
    fLo = widenLow(lo, hi);
    lo = widenedEnd;
    if (fLo == 0) {
      return lo;
    }
    fHi = widenHigh(lo, hi);
    hi = widenedEnd;
    if (fHi == 0) {
      return hi;
    }
    double x = previous > lo && previous < hi ? previous : 0.5 * (lo + hi);
    double f = evaluate(x);
    return safeguardedNewton(lo, hi, x, f, derivative);
  }

  /** The end reached by the last {@link #widenLow} or {@link #widenHigh}. */
  private double widenedEnd;

  /** Moves lo down until f(lo) ≤ 0; returns f there and leaves the end in {@link #widenedEnd}. */
  private double widenLow(double lo, double hi) {
    double fLo = evaluate(lo);
    int widen = 0;
    while (!(fLo <= 0)) {
      lo -= Math.max(hi - lo, 0.01) * 4;
      fLo = evaluate(lo);
      if (++widen > 40) {
        throw new NoConvergenceException("charge-balance bracket (low side)", widen, fLo);
      }
    }
    widenedEnd = lo;
    return fLo;
  }

  /** Moves hi up until f(hi) ≥ 0; returns f there and leaves the end in {@link #widenedEnd}. */
  private double widenHigh(double lo, double hi) {
    double fHi = evaluate(hi);
    int widen = 0;
    while (!(fHi >= 0)) {
      hi += Math.max(hi - lo, 0.01) * 4;
      fHi = evaluate(hi);
      if (++widen > 40) {
        throw new NoConvergenceException("charge-balance bracket (high side)", widen, fHi);
      }
    }
    widenedEnd = hi;
    return fHi;
  }

  /**
   * Root of the increasing function {@link #evaluate} in [lo, hi] with f(lo) &lt; 0 &lt; f(hi),
   * starting from x in [lo, hi] with f = f(x) and df = f'(x): Newton steps, replaced by bisection
   * whenever the Newton step would leave the bracket or fail to halve the step before last (Press
   * et al., rtsafe).
   */
  private double safeguardedNewton(double lo, double hi, double x, double f, double df) {
    double stepBeforeLast = hi - lo;
    double step = stepBeforeLast;
    for (int i = 0; i < MAX_INNER_ITERATIONS; i++) {
      if (f == 0) {
        return x;
      }
      if (f < 0) {
        lo = x;
      } else {
        hi = x;
      }
      boolean newtonLeaves = ((x - hi) * df - f) * ((x - lo) * df - f) > 0;
      boolean newtonSlow = Math.abs(2 * f) > Math.abs(stepBeforeLast * df);
      stepBeforeLast = step;
      if (newtonLeaves || newtonSlow) {
        step = 0.5 * (hi - lo);
        x = lo + step;
      } else {
        step = f / df;
        x -= step;
      }
      if (Math.abs(step) < LOG_ACTIVITY_TOLERANCE || hi - lo < LOG_ACTIVITY_TOLERANCE) {
        return x;
      }
      f = evaluate(x);
      df = derivative;
    }
    throw new NoConvergenceException(
        "charge-balance root find", MAX_INNER_ITERATIONS, Math.abs(evaluate(x)));
  }

  /** Builds the species list at a solution (γ of the solution must be current). */
  List<SpeciesAmount> species(Solution solution) {
    double inverse = Math.exp(-LN10 * solution.log10ActivityH());
    List<SpeciesAmount> out = new ArrayList<>(2 * components.length);
    if (pairedSodium || polymerBoron) {
      evaluate(solution.log10ActivityH());
    }
    double[] g = solution.gamma();
    for (int k = 0; k < components.length; k++) {
      if (pairedSodium && k == na) {
        double t = totals[k];
        out.add(amount(Species.SODIUM_ION, naFree, t, g[1]));
        if (associationK[Association.SODIUM_HYDROXIDE.ordinal()] > 0) {
          out.add(amount(Species.SODIUM_HYDROXIDE_PAIR, naOHPair, t, 1));
        }
        if (cl >= 0 && associationK[Association.SODIUM_CHLORIDE.ordinal()] > 0) {
          out.add(amount(Species.SODIUM_CHLORIDE_PAIR, naClPair, t, 1));
        }
        if (so4 >= 0 && associationK[Association.SODIUM_SULFATE.ordinal()] > 0) {
          out.add(amount(Species.SODIUM_SULFATE_PAIR, naSO4Pair, t, g[1]));
        }
        if (pairedPhosphate) {
          out.add(amount(Species.SODIUM_HYDROGEN_PHOSPHATE_PAIR, naHPO4Pair, t, g[1]));
        }
        continue;
      }
      if (pairedPhosphate && k == po4) {
        List<Species> sp = components[k].species();
        for (int j = 0; j < 4; j++) {
          out.add(amount(sp.get(j), phosphates[j], totals[k], g[j]));
        }
        continue;
      }
      if (pairedSodium && k == cl) {
        out.add(amount(Species.CHLORIDE_ION, clFree, totals[k], g[1]));
        continue;
      }
      if (pairedSodium && k == so4) {
        out.add(amount(Species.BISULFATE, hso4, totals[k], g[1]));
        out.add(amount(Species.SULFATE, so4Free, totals[k], g[2]));
        continue;
      }
      if (polymerBoron && k == boron) {
        double t = totals[k];
        out.add(amount(Species.BORIC_ACID, boricFree, t, 1));
        out.add(amount(Species.BORATE, borates[0], t, g[1]));
        for (int i = 0; i < 3; i++) {
          if (associationK[POLYBORATES[i].ordinal()] > 0) {
            Species sp = POLYBORATES[i].formed();
            double m = borates[i + 1];
            out.add(
                new SpeciesAmount(
                    sp,
                    m,
                    t > 0 ? POLYBORATES[i].boronAtoms() * m / t : 0,
                    g[Math.abs(sp.chargeNumber())]));
          }
        }
        continue;
      }
      double[] cc = conditional[k];
      int[] z = charges[k];
      double[] r = new double[z.length];
      r[0] = 1;
      double s = 1;
      for (int i = 0; i < cc.length; i++) {
        r[i + 1] = r[i] * cc[i] * inverse;
        s += r[i + 1];
      }
      List<Species> sp = components[k].species();
      for (int j = 0; j < z.length; j++) {
        double fraction = r[j] / s;
        out.add(
            new SpeciesAmount(
                sp.get(j), totals[k] * fraction, fraction, solution.gamma()[Math.abs(z[j])]));
      }
    }
    return out;
  }

  /** The polyborates in the order of {@link #borates} (after the monomer). */
  private static final Association[] POLYBORATES = {
    Association.DIBORATE, Association.TRIBORATE, Association.TETRABORATE
  };

  /** A species amount whose fraction is of the component total t (0 when t is 0). */
  private static SpeciesAmount amount(Species s, double m, double t, double gamma) {
    return new SpeciesAmount(s, m, t > 0 ? m / t : 0, gamma);
  }

  double kw() {
    return kw;
  }

  /**
   * dpH/d(log10 Ka) of every equilibrium at a root x, with the activity coefficients of the last
   * solve held fixed, by the implicit-function theorem on the charge balance f(x, log10 K) = 0:
   * dx/d(log10 Ka) = −(∂f/∂log10 Ka)/(∂f/∂x). For step i of a component's chain, ∂f/∂log10 Ka = −ln
   * 10·total·Cov(n, [n &gt; i]) over the distribution of the number n of protons lost, and ∂f/∂x =
   * ln 10·slope (class comment), so dpH/d(log10 Ka) = −total·Cov(n, [n &gt; i])/slope. The
   * ionic-strength feedback is left out (it changes the result by the relative change of γ, well
   * below 1 % at cycle ionic strengths).
   *
   * <p>The last element is dpH/d(log10 Kw) = −m(OH⁻)/slope (from ∂f/∂log10 Kw = −ln 10·m(OH⁻));
   * −1/2 for pure water.
   *
   * @param x log10 a(H⁺) at the solution (γ of that solution current)
   * @return by equilibrium ordinal, then dpH/d(log10 Kw); 0 for equilibria of components not
   *     present
   */
  double[] phSensitivities(double x) {
    evaluate(x);
    double slope = derivative / LN10;
    double inverse = Math.exp(-LN10 * x);
    double[] out = new double[Equilibrium.values().length + 1];
    out[out.length - 1] = -(kw * inverse / gamma[1]) / slope;
    for (int k = 0; k < components.length; k++) {
      double[] c = conditional[k];
      int n = c.length;
      if (n == 0) {
        continue;
      }
      double[] r = new double[n + 1];
      r[0] = 1;
      double s = 1;
      for (int i = 0; i < n; i++) {
        r[i + 1] = r[i] * c[i] * inverse;
        s += r[i + 1];
      }
      double mean = 0;
      for (int j = 1; j <= n; j++) {
        mean += j * r[j] / s;
      }
      for (int i = 0; i < n; i++) {
        double tail = 0;
        double tailLost = 0;
        for (int j = i + 1; j <= n; j++) {
          tail += r[j] / s;
          tailLost += j * r[j] / s;
        }
        out[steps[k][i]] = -totals[k] * (tailLost - mean * tail) / slope;
      }
    }
    return out;
  }
}
