package org.kwanta.model.evaluation;

import java.util.List;
import java.util.Locale;
import org.kwanta.model.Instrument;
import org.kwanta.model.conductivity.FitRoots;
import org.kwanta.model.conductivity.Solute;
import org.kwanta.model.conductivity.Solutes;
import org.kwanta.model.conductivity.Solution;
import org.kwanta.model.conductivity.SolutionModel;

/**
 * The sodium of phosphate and caustic water from specific conductivity, over all roots. Sodium
 * added to the acids the cation channel found first lowers κ (Na⁺ replaces H⁺) and raises it after
 * the first equivalence point, so a specific conductivity below the acids' own conductivity has two
 * sodium amounts, or none when it lies below the dip. The sodium reading, when there is one,
 * chooses the root nearer to it (on a log scale); without one the higher (alkaline) root is
 * reported, as a treated boiler water is alkaline (common practice, no source), and the choice is a
 * finding.
 */
final class SodiumRoots {

  /** Searched amounts go up to this multiple of the acids' equivalents (see {@link #upper}). */
  static final double UPPER_EQUIVALENTS = 4;

  /**
   * A chosen root farther than this (relative) from the sodium reading has every root refined
   * before the choice is final (below it only the chosen root is; the finding's threshold, three
   * sodium tolerances, is above it with the default ±10 %).
   */
  static final double RECHECK_RELATIVE = 0.1;

  /** Relative half-width of the first bracket of a refit around the central root. */
  static final double NEAR_BRACKET = 0.1;

  private SodiumRoots() {}

  /**
   * How the sodium was chosen when specific conductivity lay at or below the acids' conductivity.
   *
   * @param roots the sodium amounts that fit, by increasing amount (empty: none)
   * @param lowest the solution of least conductivity (the closest approach when none fits)
   * @param chosen index of the reported root (−1 when none fits)
   * @param bySodiumReading whether the sodium reading chose the root
   * @param sodiumReadingMolal the sodium reading, mol/kg (0 when absent)
   * @param background the acids' conductivity, µS/cm (the solution with no sodium)
   * @param rootCount how many sodium amounts fit (the roots list holds only the chosen one when the
   *     sodium reading chose and matched it, so the other was not refined)
   */
  record Choice(
      List<Solution> roots,
      Solution lowest,
      int chosen,
      boolean bySodiumReading,
      double sodiumReadingMolal,
      double background,
      int rootCount) {

    /** The reported solution: the chosen root, or the closest approach. */
    Solution reported() {
      return chosen < 0 ? lowest : roots.get(chosen);
    }

    /** Whether the chosen root is the higher one of two. */
    boolean upperBranch() {
      return chosen >= 0
          && rootCount > 1
          && reported().solutes().sodium() > lowest.solutes().sodium();
    }
  }

  /** A fit of the sodium, with the choice when more than one amount (or none) was possible. */
  record Fit(Solution solution, Choice choice) {}

  /**
   * Fits the sodium (as sodium hydroxide) to a specific conductivity.
   *
   * @param known the acids and other amounts, mol/kg
   * @param sodiumReadingMolal the sodium reading, mol/kg (0 or NaN when absent)
   * @param previous the central fit's choice (for a refit after a small change; null: none)
   */
  static Fit fit(
      SolutionModel model,
      Solutes known,
      double kappa,
      Solution hint,
      double sodiumReadingMolal,
      Choice previous) {
    double upper = upper(known);
    if (upper > 0 && previous != null && previous.chosen() >= 0 && previous.rootCount() == 2) {
      // refit on the branch the central fit chose (on the upper branch a target moved above the
      // acids' conductivity keeps its one root there)
      double dip = previous.lowest().solutes().sodium();
      double from = previous.upperBranch() ? dip : 0;
      double to = previous.upperBranch() ? upper : dip;
      // a small change moves the root a little: first a bracket of ±10 % around the central root
      double x0 = previous.reported().solutes().sodium();
      double[][] brackets = {
        {Math.max(from, (1 - NEAR_BRACKET) * x0), Math.min(to, (1 + NEAR_BRACKET) * x0)},
        {from, to}
      };
      for (double[] b : brackets) {
        try {
          Solution s =
              FitRoots.between(
                  model,
                  known,
                  Solute.SODIUM_HYDROXIDE,
                  kappa,
                  b[0],
                  b[1],
                  upper * FitRoots.AMOUNT_TOLERANCE);
          return new Fit(s, previous);
        } catch (IllegalArgumentException noSignChange) {
          // not in this bracket: the wider one, then afresh below
        }
      }
    }
    Solution single = model.fit(known, Solute.SODIUM_HYDROXIDE, kappa, hint);
    if (single.solutes().sodium() > 0 || !(single.kappa() > kappa) || upper <= 0) {
      // above the acids' conductivity κ rises with sodium: one root
      return new Fit(single, null);
    }
    double reading = sodiumReadingMolal > 0 ? sodiumReadingMolal : 0;
    double rising = upper / UPPER_EQUIVALENTS;
    // with a sodium reading only the root nearest to it is refined
    FitRoots.Result r =
        FitRoots.all(model, known, Solute.SODIUM_HYDROXIDE, kappa, upper, rising, reading);
    if (!r.complete()
        && Math.abs(r.roots().get(0).solutes().sodium() / reading - 1) > RECHECK_RELATIVE) {
      // the reading is far from the root it chose: refine all, for the choice and the finding
      r = FitRoots.all(model, known, Solute.SODIUM_HYDROXIDE, kappa, upper, rising);
    }
    int chosen = r.complete() ? choose(r.roots(), reading) : 0;
    Choice c =
        new Choice(r.roots(), r.lowest(), chosen, reading > 0, reading, single.kappa(), r.count());
    return new Fit(c.reported(), c);
  }

  /**
   * The findings of a choice: {@link ReasonCode#TWO_COMPOSITIONS_FIT} when two sodium amounts fit
   * and no sodium reading chose, {@link ReasonCode#NO_CONSISTENT_COMPOSITION} when none fits or the
   * sodium reading matches neither within three times its tolerance.
   *
   * @param choice the choice (null: one root, nothing to report)
   * @param specificConductivity the specific conductivity fitted, µS/cm at the model's temperature
   */
  static void findings(
      Choice choice, double specificConductivity, Tolerances tol, List<Finding> out) {
    if (choice == null) {
      return;
    }
    List<Solution> roots = choice.roots();
    if (roots.isEmpty()) {
      Solution low = choice.lowest();
      out.add(
          finding(
              ReasonCode.NO_CONSISTENT_COMPOSITION,
              Instrument.SPECIFIC_CONDUCTIVITY,
              "SC %s µS/cm is below the least conductivity %s µS/cm any sodium gives with the acids"
                  + " of CACE (%s µS/cm without sodium); reported: the closest approach, Na %s"
                  + " µg/kg, pH25 %s.",
              num(specificConductivity),
              num(low.kappa()),
              num(choice.background()),
              num(ugPerKg(low)),
              String.format(Locale.ROOT, "%.2f", low.pH()),
              null));
      return;
    }
    if (choice.rootCount() < 2) {
      return;
    }
    StringBuilder both = new StringBuilder();
    for (Solution r : roots) {
      if (both.length() > 0) {
        both.append(" or ");
      }
      both.append(String.format(Locale.ROOT, "Na %s µg/kg (pH25 %.2f)", num(ugPerKg(r)), r.pH()));
    }
    if (roots.size() < choice.rootCount()) {
      both.append(
          String.format(
              Locale.ROOT,
              " or an amount across the dip at Na %s µg/kg",
              num(ugPerKg(choice.lowest()))));
    }
    if (!choice.bySodiumReading()) {
      out.add(
          finding(
              ReasonCode.TWO_COMPOSITIONS_FIT,
              Instrument.PROCESS,
              "SC %s µS/cm is below the conductivity of the acids of CACE (%s µS/cm): %s fit;"
                  + " reported: the alkaline one; a sodium reading would decide.",
              num(specificConductivity),
              num(choice.background()),
              both.toString(),
              null));
      return;
    }
    double reading = choice.sodiumReadingMolal();
    double na = choice.reported().solutes().sodium();
    if (Math.abs(na / reading - 1) > 3 * tol.sodiumRelative()) {
      out.add(
          finding(
              ReasonCode.NO_CONSISTENT_COMPOSITION,
              Instrument.SODIUM,
              "Sodium %s µg/kg matches neither composition that fits SC %s µS/cm below the"
                  + " acids' %s µS/cm: %s; reported: the nearer.",
              num(reading * Evaluator.NA_G_PER_MOL * 1e6),
              num(specificConductivity),
              num(choice.background()),
              both.toString(),
              new Finding.Evidence(
                  "sodium",
                  "ug/kg",
                  na * Evaluator.NA_G_PER_MOL * 1e6,
                  reading * Evaluator.NA_G_PER_MOL * 1e6,
                  3 * tol.sodiumRelative() * na * Evaluator.NA_G_PER_MOL * 1e6)));
    }
  }

  private static double ugPerKg(Solution s) {
    return s.solutes().sodium() * Evaluator.NA_G_PER_MOL * 1e6;
  }

  private static String num(double v) {
    return String.format(Locale.ROOT, "%.3g", v);
  }

  private static Finding finding(ReasonCode code, Instrument pointsAt, String fmt, Object... args) {
    Finding.Evidence evidence = (Finding.Evidence) args[args.length - 1];
    Object[] shown = java.util.Arrays.copyOf(args, args.length - 1);
    return new Finding(code, pointsAt, String.format(Locale.ROOT, fmt, shown), evidence);
  }

  /** Index of the root nearest the reading on a log scale, or of the highest root without one. */
  static int choose(List<Solution> roots, double readingMolal) {
    if (roots.isEmpty()) {
      return -1;
    }
    if (!(readingMolal > 0)) {
      return roots.size() - 1;
    }
    int best = 0;
    double bestDistance = Double.POSITIVE_INFINITY;
    for (int i = 0; i < roots.size(); i++) {
      double na = roots.get(i).solutes().sodium();
      double d = na > 0 ? Math.abs(Math.log(na / readingMolal)) : Double.MAX_VALUE;
      if (d < bestDistance) {
        bestDistance = d;
        best = i;
      }
    }
    return best;
  }

  /**
   * Upper end of the sodium searched: {@value #UPPER_EQUIVALENTS} times the acids' equivalents
   * (Cl⁻, 2 SO₄²⁻, 3 PO₄³⁻, 2 CO₂). Beyond the equivalents the excess hydroxide alone (λ°(Na⁺) +
   * λ°(OH⁻) ≈ 248 S·cm²/mol at 25 °C) outweighs the most the acids could conduct (≈ 426 per
   * equivalent as fully dissociated HCl), so the higher root lies below the end.
   */
  static double upper(Solutes known) {
    double eq =
        known.chloride() + 2 * known.sulfate() + 3 * known.phosphate() + 2 * known.carbonate();
    return UPPER_EQUIVALENTS * eq;
  }
}
