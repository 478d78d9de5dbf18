package org.kwanta.model.aqueous;

import org.kwanta.model.Reference;
import org.kwanta.model.Reference.Confidence;
import org.kwanta.model.ValidityRange;

/**
 * Polyborate formation quotients of Mesmer, Baes &amp; Sweeton (1972), written as the paper writes
 * them: x B(OH)₃ + y OH⁻ ⇌ B_x(OH)_(3x+y)^(y−), with
 *
 * <pre>log10 Q_xy = a/T + b + c·log10 T      (T in K)</pre>
 *
 * <p>Source: R. E. Mesmer, C. F. Baes, F. H. Sweeton, "Acidity measurements at elevated
 * temperatures. VI. Boric acid equilibria", <i>Inorg. Chem.</i> 11 (1972) 537, Table VI p. 542 (Q21
 * and Q31 of the paper's scheme II, Q42 of scheme I), as quoted by a public script and transcribed
 * in the project's reference notes (water-and-equilibria.md §7). Species: B₂(OH)₇⁻ (Q21), B₃(OH)₁₀⁻
 * ≡ B₃O₃(OH)₄⁻ + 3 H₂O (Q31), B₄(OH)₁₄²⁻ ≡ B₄O₅(OH)₄²⁻ + 5 H₂O (Q42); with a(H₂O) = 1 the hydrated
 * and condensed formulas have the same constant. The paper's B₅ quotient (Q53) is not carried: its
 * species' charge could not be confirmed.
 *
 * <p>Validity: fitted in 1 m KCl at 50-200 °C ({@link #VALIDITY}); outside, the engine still
 * evaluates them and marks them extrapolated. The quotients are used at the solution's ionic
 * strength with the engine's activity model applied (Davies), i.e. as if they were I = 0 constants
 * — an assumption of Kwanta's, not the paper's. Check values: the computed table of the reference
 * notes (a check of the coefficients as printed in Mesmer, Baes & Sweeton 1972, Table VI, not a
 * published check table).
 */
final class MesmerPolyborates {

  private MesmerPolyborates() {}

  /** The paper, with the caveats of its use here. */
  static final Reference REFERENCE =
      new Reference(
          "Mesmer 1972 polyborates",
          "R. E. Mesmer, C. F. Baes, F. H. Sweeton, Inorg. Chem. 11 (1972) 537, Table VI p. 542:"
              + " polyborate quotients fitted in 1 m KCl, 50-200 °C; used here with Davies"
              + " activity coefficients as if at I = 0 (Kwanta's assumption)",
          Confidence.RETRIEVED);

  /** The fitted temperature range, K (50-200 °C). */
  static final ValidityRange VALIDITY =
      new ValidityRange("temperature", 323.15, 473.15, "K", REFERENCE);

  /** Table VI, coefficient a (K) of Q21, Q31, Q42, in that order. */
  static final double[] A = {2756.1, 3339.5, 12820};

  /** Table VI, coefficient b of Q21, Q31, Q42. */
  static final double[] B = {-18.966, -8.084, -134.56};

  /** Table VI, coefficient c (of log10 T) of Q21, Q31, Q42. */
  static final double[] C = {5.835, 1.497, 42.105};

  /**
   * log10 Q_xy of one polyborate.
   *
   * @param index 0 for Q21 (B₂(OH)₇⁻), 1 for Q31 (B₃O₃(OH)₄⁻), 2 for Q42 (B₄O₅(OH)₄²⁻)
   * @param temperatureK temperature, K; evaluated also outside {@link #VALIDITY} (NaN in, NaN out)
   * @return log10 Q, molal, OH⁻-based as printed
   */
  static double log10Q(int index, double temperatureK) {
    double t = temperatureK;
    return A[index] / t + B[index] + C[index] * Math.log10(t);
  }
}
