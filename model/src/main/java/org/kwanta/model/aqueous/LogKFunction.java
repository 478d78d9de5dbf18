package org.kwanta.model.aqueous;

import java.util.List;

/**
 * A temperature function log10 K(T) of one published fit, with its coefficients exactly as printed.
 * Each implementation evaluates the reaction <em>as its source writes it</em>; the direction (sign)
 * and any combination of printed reactions are expressed with {@link Sum}, so the printed numbers
 * stay untouched.
 *
 * <p>T is in kelvin. K is molal, infinite-dilution standard state. The only function that needs a
 * water property is {@link MesmerBoricQ11}, which is an OH⁻-based quotient converted with pKw.
 */
public sealed interface LogKFunction {

  /**
   * log10 K at a temperature.
   *
   * @param temperatureK temperature, K
   * @param pKw −log10 Kw of water at the same state (molal); ignored by all forms but {@link
   *     MesmerBoricQ11}
   * @return log10 K of the reaction as written by the source
   */
  double log10K(double temperatureK, double pKw);

  /** Gas constant, J/(mol·K) (CODATA 2018, exact as N_A·k). */
  double GAS_CONSTANT = 8.314_462_618;

  /**
   * The database "analytic" form used by llnl.dat, Thermoddem and phreeqc.dat: log10 K = A1 + A2·T
   * + A3/T + A4·log10 T + A5/T² + A6·T².
   *
   * @param a1 A1
   * @param a2 A2, 1/K
   * @param a3 A3, K
   * @param a4 A4
   * @param a5 A5, K²
   * @param a6 A6, 1/K²
   */
  record Analytic(double a1, double a2, double a3, double a4, double a5, double a6)
      implements LogKFunction {

    /** The five-term form (A6 = 0) used by llnl.dat and Thermoddem. */
    public static Analytic of(double a1, double a2, double a3, double a4, double a5) {
      return new Analytic(a1, a2, a3, a4, a5, 0);
    }

    @Override
    public double log10K(double temperatureK, double pKw) {
      double t = temperatureK;
      return a1 + a2 * t + a3 / t + a4 * Math.log10(t) + a5 / (t * t) + a6 * t * t;
    }
  }

  /**
   * Three-term (van 't Hoff with constant ΔCp) extrapolation from 25 °C: log10 K(T) = log10 K(Tr) −
   * ΔH/(R ln 10)·(1/T − 1/Tr) + ΔCp/(R ln 10)·[Tr/T − 1 + ln(T/Tr)], Tr = 298.15 K, ΔH and ΔCp
   * constant.
   *
   * @param log10KAtReference log10 K at 298.15 K
   * @param deltaHJPerMol standard enthalpy of reaction at 298.15 K, J/mol
   * @param deltaCpJPerMolK standard heat-capacity change, J/(mol·K), taken constant
   */
  record ThreeTerm(double log10KAtReference, double deltaHJPerMol, double deltaCpJPerMolK)
      implements LogKFunction {

    /** Reference temperature Tr, K. */
    public static final double REFERENCE_TEMPERATURE_K = 298.15;

    @Override
    public double log10K(double temperatureK, double pKw) {
      double tr = REFERENCE_TEMPERATURE_K;
      double t = temperatureK;
      double rLn10 = GAS_CONSTANT * Math.log(10);
      return log10KAtReference
          - deltaHJPerMol / rLn10 * (1 / t - 1 / tr)
          + deltaCpJPerMolK / rLn10 * (tr / t - 1 + Math.log(t / tr));
    }
  }

  /**
   * The bisulfate form of Dickson, Wesolowski, Palmer &amp; Mesmer (1990): log10 K = c0 + c1·ln T +
   * c2·T² + c3·T + c4/T (note the natural logarithm).
   */
  record DicksonBisulfate(double c0, double c1, double c2, double c3, double c4)
      implements LogKFunction {
    @Override
    public double log10K(double temperatureK, double pKw) {
      double t = temperatureK;
      return c0 + c1 * Math.log(t) + c2 * t * t + c3 * t + c4 / t;
    }
  }

  /** Harned-type form: log10 K = a/T + b + c·T. */
  record Harned(double a, double b, double c) implements LogKFunction {
    @Override
    public double log10K(double temperatureK, double pKw) {
      return a / temperatureK + b + c * temperatureK;
    }
  }

  /**
   * Mesmer, Baes &amp; Sweeton (1972) first boric-acid quotient at I = 0, B(OH)3 + OH⁻ = B(OH)4⁻:
   * log10 K11 = a/T + b + c·T + d·log10 T; evaluated here as the acid constant B(OH)3 + H2O =
   * B(OH)4⁻ + H⁺, log10 Ka = log10 K11 − pKw.
   */
  record MesmerBoricQ11(double a, double b, double c, double d) implements LogKFunction {

    /** log10 K11 of the OH⁻-based reaction, as printed. */
    public double log10K11(double temperatureK) {
      double t = temperatureK;
      return a / t + b + c * t + d * Math.log10(t);
    }

    @Override
    public double log10K(double temperatureK, double pKw) {
      return log10K11(temperatureK) - pKw;
    }
  }

  /**
   * Edwards, Maurer, Newman &amp; Prausnitz (1978) ammonia: the base constant ln Kb = kb0/T +
   * kb1·ln T + kb2·T + kb3 (NH3 + H2O = NH4⁺ + OH⁻) with their own water fit ln Kw = kw0/T + kw1·ln
   * T + kw2; evaluated as log10 Ka(NH4⁺) = (ln Kw − ln Kb)/ln 10.
   */
  record EdwardsAmmonia(
      double kb0, double kb1, double kb2, double kb3, double kw0, double kw1, double kw2)
      implements LogKFunction {
    @Override
    public double log10K(double temperatureK, double pKw) {
      double t = temperatureK;
      double lnT = Math.log(t);
      double lnKb = kb0 / t + kb1 * lnT + kb2 * t + kb3;
      double lnKw = kw0 / t + kw1 * lnT + kw2;
      return (lnKw - lnKb) / Math.log(10);
    }
  }

  /**
   * A signed combination of printed reactions, for example a dissociation constant from an
   * association reaction (factor −1) or by difference of two cumulative reactions.
   *
   * @param terms the printed reactions and their integer factors
   */
  record Sum(List<Term> terms) implements LogKFunction {

    /** One printed reaction and the factor it enters with. */
    public record Term(int factor, LogKFunction function) {}

    public Sum {
      terms = List.copyOf(terms);
    }

    /** The reverse of a printed reaction: log10 K = −log10 K(printed). */
    public static Sum reverse(LogKFunction printed) {
      return new Sum(List.of(new Term(-1, printed)));
    }

    /** The difference of two printed reactions: log10 K = log10 K(a) − log10 K(b). */
    public static Sum difference(LogKFunction a, LogKFunction b) {
      return new Sum(List.of(new Term(1, a), new Term(-1, b)));
    }

    @Override
    public double log10K(double temperatureK, double pKw) {
      double sum = 0;
      for (Term term : terms) {
        sum += term.factor() * term.function().log10K(temperatureK, pKw);
      }
      return sum;
    }
  }
}
