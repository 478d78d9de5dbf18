package org.kwanta.model.water;

import org.kwanta.model.NoConvergenceException;
import org.kwanta.model.OutOfValidityRangeException;
import org.kwanta.model.Reference;
import org.kwanta.model.ValidityRange;

/**
 * IAPWS-IF97 region 3 (dense fluid near and above the critical point, liquid above 623.15 K):
 * pressure from density and temperature, and density from temperature and pressure.
 *
 * <p>Source: IAPWS R7-97(2012), <i>Revised Release on the IAPWS Industrial Formulation 1997 for the
 * Thermodynamic Properties of Water and Steam</i>, section 7: the dimensionless Helmholtz energy
 * (Eq. 28) φ(δ, τ) = n1 ln δ + Σ_{i=2..40} n_i δ^I_i τ^J_i, δ = ρ/ρ*, τ = T* / T, ρ* = ρc = 322
 * kg/m³, T* = Tc = 647.096 K, R = 0.461526 kJ kg⁻¹ K⁻¹; coefficients in Table 30; the pressure
 * (Table 31) p = ρ R T δ φ_δ. Check values: Table 33 (p at (T, ρ) = (650 K, 500 kg/m³), (650 K, 200
 * kg/m³), (750 K, 500 kg/m³)).
 *
 * <p>Density from (T, p) is found by Newton's method on p(ρ, T) − p = 0, ∂p/∂ρ = R T (2δφ_δ +
 * δ²φ_δδ), safeguarded by bisection. Below Tc the branch is chosen by region 4: p ≥ p_s(T) gives
 * the liquid root (the largest, searched from the dense side), p &lt; p_s(T) the vapour root (the
 * smallest, searched from the dilute side); at and above Tc the isotherm is monotonic. The backward
 * equations of IAPWS SR5-05 would give a starting value; they are not needed for convergence here
 * and are not implemented.
 *
 * <p>Coefficient provenance: Table 30 transcribed from two open implementations that agree digit
 * for digit (Debian {@code python3-iapws} 1.5.3, {@code _Region3}; the C library {@code
 * c4rnot/if97lib}, {@code IF97_Region3.c}); their reproduction of Table 33 is tested.
 *
 * <p>Validity: {@link #VALIDITY} on T (623.15 K to 863.15 K) with p_B23(T) ≤ p ≤ 100 MPa, where
 * p_B23 is {@link Boundary23}; equivalently T ≤ T_B23(p). Units: K, Pa, kg/m³.
 */
final class Region3 {

  /** IAPWS-IF97. */
  static final Reference REFERENCE = Region4.REFERENCE;

  /** Temperature range of region 3 (release section 4, Fig. 1), K. */
  static final ValidityRange VALIDITY =
      new ValidityRange("temperature", 623.15, 863.15, "K", REFERENCE);

  /** Specific gas constant, Eq. 1, J kg⁻¹ K⁻¹. */
  static final double R = 461.526;

  /** Critical density, the reducing density ρ* of Eq. 28, kg/m³. */
  static final double RHO_C = 322;

  /** Critical temperature, the reducing temperature T* of Eq. 28, K. */
  static final double T_C = 647.096;

  /** Critical pressure (release Eq. 2 and section 2), Pa. */
  static final double P_C = 22.064e6;

  /** Table 30: n1, the coefficient of ln δ. */
  static final double N1 = 0.10658070028513e1;

  /** Table 30: exponents I_i, i = 2 … 40, as printed. */
  static final int[] I = {
    0, 0, 0, 0, 0, 0, 0, 1, 1, 1, 1, 2, 2, 2, 2, 2, 2, 3, 3, 3, 3, 3, 4, 4, 4, 4, 5, 5, 5, 6, 6, 6,
    7, 8, 9, 9, 10, 10, 11
  };

  /** Table 30: exponents J_i, i = 2 … 40, as printed. */
  static final int[] J = {
    0, 1, 2, 7, 10, 12, 23, 2, 6, 15, 17, 0, 2, 6, 7, 22, 26, 0, 2, 4, 16, 26, 0, 2, 4, 26, 1, 3,
    26, 0, 2, 26, 2, 26, 2, 26, 0, 1, 26
  };

  /** Table 30: coefficients n_i, i = 2 … 40, as printed. */
  static final double[] N = {
    -0.15732845290239e2, 0.20944396974307e2, -0.76867707878716e1, 0.26185947787954e1,
    -0.28080781148620e1, 0.12053369696517e1, -0.84566812812502e-2, -0.12654315477714e1,
    -0.11524407806681e1, 0.88521043984318e0, -0.64207765181607e0, 0.38493460186671e0,
    -0.85214708824206e0, 0.48972281541877e1, -0.30502617256965e1, 0.39420536879154e-1,
    0.12558408424308e0, -0.27999329698710e0, 0.13899799569460e1, -0.20189915023570e1,
    -0.82147637173963e-2, -0.47596035734923e0, 0.43984074473500e-1, -0.44476435428739e0,
    0.90572070719733e0, 0.70522450087967e0, 0.10770512626332e0, -0.32913623258954e0,
    -0.50871062041158e0, -0.22175400873096e-1, 0.94260751665092e-1, 0.16436278447961e0,
    -0.13503372241348e-1, -0.14834345352472e-1, 0.57922953628084e-3, 0.32308904703711e-2,
    0.80964802996215e-4, -0.16557679795037e-3, -0.44923899061815e-4
  };

  /**
   * Densest start of the liquid-branch search, kg/m³: denser than any region-3 state up to 100 MPa
   * (p(800 kg/m³, T) ≥ 140 MPa over 623.15–863.15 K) and below the densities (about 850 kg/m³ and
   * up) at which Eq. 28, fitted to region 3 only, stops rising with density.
   */
  static final double RHO_DENSE = 800;

  /** Relative tolerance on pressure at which the density search stops. */
  static final double TOLERANCE = 1e-12;

  /** Largest number of iterations of the density search. */
  static final int MAX_ITERATIONS = 200;

  private Region3() {}

  /**
   * Pressure from density and temperature, Table 31.
   *
   * @param densityKgPerM3 ρ, kg/m³
   * @param temperatureK T, K
   * @return p, Pa
   */
  static double pressurePa(double densityKgPerM3, double temperatureK) {
    double delta = densityKgPerM3 / RHO_C;
    return densityKgPerM3 * R * temperatureK * delta * phiDelta(delta, T_C / temperatureK);
  }

  /**
   * Density from temperature and pressure.
   *
   * @param temperatureK T, K
   * @param pressurePa p, Pa
   * @return ρ, kg/m³
   * @throws OutOfValidityRangeException if (T, p) is not in region 3, or for NaN
   */
  static double density(double temperatureK, double pressurePa) {
    VALIDITY.check(temperatureK);
    double pB23 = Boundary23.pressurePaUnchecked(temperatureK);
    if (!(pressurePa >= pB23 && pressurePa <= 100e6)) {
      throw new OutOfValidityRangeException(
          new ValidityRange("pressure", pB23, 100e6, "Pa", REFERENCE), pressurePa);
    }
    return densityUnchecked(temperatureK, pressurePa);
  }

  /** Density, kg/m³, without range checks; the caller has checked that (T, p) is in region 3. */
  static double densityUnchecked(double t, double p) {
    double[] tauJ = tauPowers(T_C / t);
    if (t < T_C && p < Region4.saturationPressurePaUnchecked(t)) {
      // vapour branch: the smallest root, approached from the dilute side
      return newtonFrom(p / (R * t) * 0.5, t, tauJ, p, false);
    }
    // liquid branch below Tc (the largest root); above Tc the isotherm is monotonic
    return newtonFrom(RHO_DENSE, t, tauJ, p, true);
  }

  /**
   * Newton's method on p(ρ) − p from one side of the root, with bisection between the last point on
   * that side and the first point found beyond the root when a step overshoots or the slope is not
   * positive.
   */
  private static double newtonFrom(double start, double t, double[] tauJ, double p, boolean dense) {
    double rho = start;
    double lo = dense ? Double.NaN : start;
    double hi = dense ? start : Double.NaN;
    double residual = Double.NaN;
    for (int k = 0; k < MAX_ITERATIONS; k++) {
      double delta = rho / RHO_C;
      double[] d = derivatives(delta, tauJ);
      double pr = rho * R * t * delta * d[0];
      residual = pr - p;
      if (Math.abs(residual) <= TOLERANCE * p) {
        return rho;
      }
      if (residual > 0) {
        hi = Double.isNaN(hi) ? rho : Math.min(hi, rho);
      } else {
        lo = Double.isNaN(lo) ? rho : Math.max(lo, rho);
      }
      double slope = R * t * (2 * delta * d[0] + delta * delta * d[1]);
      double next = rho - residual / slope;
      boolean bracketed = !Double.isNaN(lo) && !Double.isNaN(hi);
      boolean wrongWay = dense ? next > rho && residual > 0 : next < rho && residual < 0;
      if (!(slope > 0) || wrongWay || !(next > 0) || (bracketed && !(next > lo && next < hi))) {
        if (bracketed) {
          next = 0.5 * (lo + hi);
        } else {
          // step further towards the root side without a bracket yet
          next = dense ? rho * 0.9 : rho * 1.1;
        }
      }
      rho = next;
    }
    throw new NoConvergenceException("IF97 region 3 density", MAX_ITERATIONS, residual / p);
  }

  /** φ_δ, Table 32. */
  static double phiDelta(double delta, double tau) {
    return derivatives(delta, tauPowers(tau))[0];
  }

  /** τ^J_i for each term. */
  private static double[] tauPowers(double tau) {
    double[] out = new double[J.length];
    for (int i = 0; i < J.length; i++) {
      out[i] = Region1.power(tau, J[i]);
    }
    return out;
  }

  /** {φ_δ, φ_δδ} at δ, with τ^J_i given. */
  private static double[] derivatives(double delta, double[] tauJ) {
    double phiD = N1 / delta;
    double phiDd = -N1 / (delta * delta);
    for (int i = 0; i < N.length; i++) {
      int ii = I[i];
      if (ii == 0) {
        continue;
      }
      double term = N[i] * ii * Region1.power(delta, ii - 1) * tauJ[i];
      phiD += term;
      phiDd += term * (ii - 1) / delta;
    }
    return new double[] {phiD, phiDd};
  }

  /** p from the table with {@code Math.pow}, term by term as printed: the oracle for tests. */
  static double pressurePaFromTable(double rho, double t) {
    double delta = rho / RHO_C;
    double tau = T_C / t;
    double phiD = N1 / delta;
    for (int i = 0; i < N.length; i++) {
      phiD += N[i] * I[i] * Math.pow(delta, I[i] - 1) * Math.pow(tau, J[i]);
    }
    return rho * R * t * delta * phiD;
  }
}
