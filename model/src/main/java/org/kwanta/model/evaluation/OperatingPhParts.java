package org.kwanta.model.evaluation;

import java.util.ArrayList;
import java.util.List;
import org.kwanta.model.Parameter;
import org.kwanta.model.aqueous.Composition;
import org.kwanta.model.aqueous.PhSolution;
import org.kwanta.model.aqueous.PhUncertainties;
import org.kwanta.model.aqueous.PhUncertainty.Contribution;
import org.kwanta.model.aqueous.PhUncertainty.Kind;
import org.kwanta.model.aqueous.PhUncertainty.Part;
import org.kwanta.model.aqueous.SpeciationOptions;
import org.kwanta.model.water.Distribution;
import org.kwanta.model.water.Water;
import org.kwanta.model.water.WaterState;

/**
 * The parts of an evaluation's pH-at-temperature band that the evaluator computes itself: (a)
 * instrument tolerances and (d) operating temperature and pressure ({@link
 * org.kwanta.model.aqueous.PhUncertainty}); (b) and (c) come from {@link PhUncertainties}.
 */
final class OperatingPhParts {

  private OperatingPhParts() {}

  /** What part (a) did. */
  static final String INSTRUMENT_BASIS =
      "each 25 °C conductivity moved by its tolerance, the composition refitted and the pH at"
          + " temperature re-solved; root-sum-square over the channels";

  /** Part (a): the pH shifts of the channels moved by their tolerances, root-sum-square. */
  static Part instrumentPart(Tolerances tol, List<Parameter> channels, double[] shifts) {
    if (shifts.length == 0) {
      return Part.notApplicable(Kind.INSTRUMENT_TOLERANCES, "no conductivity channel");
    }
    ToleranceTexts texts = ToleranceTexts.of(tol);
    List<Contribution> contributions = new ArrayList<>(shifts.length);
    double sum = 0;
    for (int i = 0; i < shifts.length; i++) {
      Parameter p = channels.get(i);
      double d = Math.abs(shifts[i]);
      sum += d * d;
      contributions.add(new Contribution(ToleranceTexts.channelName(p), d, texts.channel(p)));
    }
    return Part.symmetric(
        Kind.INSTRUMENT_TOLERANCES, Math.sqrt(sum), INSTRUMENT_BASIS, contributions);
  }

  /** What part (d) did. */
  static final String OPERATING_BASIS =
      "the operating temperature and pressure each moved by their configured tolerance (the other"
          + " way when the moved state leaves the liquid range), the pH moved to first order by"
          + " the changes of the constants and pKw; root-sum-square";

  /** What part (d) did for a steam point. */
  static final String CONDENSATE_OPERATING_BASIS =
      "the condensation temperature moved by the configured tolerance (pressure, or temperature"
          + " on the saturation line) and the first condensate recomputed there";

  /**
   * Part (d) for a liquid point: the pH moved to first order ({@link
   * PhUncertainties#phAtMovedState}) with the temperature moved by its tolerance, and with the
   * pressure moved by its tolerance (declared pressure only; at saturation the pressure follows the
   * temperature).
   */
  static Part liquidOperatingConditions(
      Evaluator evaluator,
      SamplePointConfig config,
      Composition composition,
      SpeciationOptions options,
      PhUncertainties.Central solved) {
    PhSolution central = solved.solution();
    Tolerances tol = config.tolerances();
    double t = config.operatingTemperatureK();
    double p = config.operatingPressurePa();
    List<Contribution> contributions = new ArrayList<>(2);
    double dT = tol.operatingTemperatureK();
    if (dT > 0) {
      double shifted = liquidPh(evaluator, composition, t + dT, p, options, solved);
      if (Double.isNaN(shifted)) {
        shifted = liquidPh(evaluator, composition, t - dT, p, options, solved);
      }
      if (!Double.isNaN(shifted)) {
        contributions.add(
            PhUncertainties.shifted(
                "temperature", ToleranceTexts.of(tol).temperature(), shifted, central.ph()));
      }
    }
    double rel = tol.operatingPressureRelative();
    if (rel > 0 && !Double.isNaN(p)) {
      double shifted = liquidPh(evaluator, composition, t, p * (1 + rel), options, solved);
      if (Double.isNaN(shifted)) {
        shifted = liquidPh(evaluator, composition, t, p * (1 - rel), options, solved);
      }
      if (!Double.isNaN(shifted)) {
        contributions.add(
            PhUncertainties.shifted(
                "pressure", ToleranceTexts.of(tol).pressure(), shifted, central.ph()));
      }
    }
    if (contributions.isEmpty()) {
      return Part.notApplicable(
          Kind.OPERATING_CONDITIONS,
          dT > 0 || rel > 0
              ? "the state moved by its tolerance leaves the liquid range either way"
              : "no operating tolerance configured");
    }
    return PhUncertainties.operatingConditions(contributions, OPERATING_BASIS);
  }

  /**
   * pH of the composition at a moved liquid state to first order, or NaN when the state is not
   * liquid or in range.
   */
  private static double liquidPh(
      Evaluator evaluator,
      Composition composition,
      double temperatureK,
      double pressurePa,
      SpeciationOptions options,
      PhUncertainties.Central central) {
    try {
      WaterState w = evaluator.operatingWater(temperatureK, pressurePa);
      if (!w.liquidLike()) {
        return Double.NaN;
      }
      return PhUncertainties.phAtMovedState(central, composition, w, options);
    } catch (IllegalArgumentException e) {
      // outside the engine's range or not region-1 liquid (OutOfValidityRangeException is one)
      return Double.NaN;
    }
  }

  /**
   * Part (d) for a steam point: the condensation temperature moved by the tolerance of the
   * operating pressure (declared pressure), or by the temperature tolerance along the saturation
   * line (no pressure declared), and the first condensate recomputed there.
   */
  static Part condensateOperatingConditions(
      Evaluator evaluator,
      SamplePointConfig config,
      Composition steam,
      SpeciationOptions options,
      EarlyCondensate.Result central,
      double tSat) {
    Tolerances tol = config.tolerances();
    double p = config.operatingPressurePa();
    double ph = central.liquid().ph();
    double shifted = Double.NaN;
    String source;
    String tolerance;
    if (Double.isNaN(p)) {
      source = "temperature";
      tolerance = ToleranceTexts.of(tol).temperature();
      if (tol.operatingTemperatureK() > 0) {
        shifted =
            condensatePh(evaluator, steam, tSat - tol.operatingTemperatureK(), options, central);
        if (Double.isNaN(shifted)) {
          shifted =
              condensatePh(evaluator, steam, tSat + tol.operatingTemperatureK(), options, central);
        }
      }
    } else {
      source = "pressure";
      double rel = tol.operatingPressureRelative();
      tolerance = ToleranceTexts.of(tol).condensatePressure();
      if (rel > 0) {
        shifted =
            condensatePh(
                evaluator, steam, Water.saturationTemperatureK(p * (1 - rel)), options, central);
        if (Double.isNaN(shifted) && p * (1 + rel) < Evaluator.CRITICAL_PRESSURE_PA) {
          shifted =
              condensatePh(
                  evaluator, steam, Water.saturationTemperatureK(p * (1 + rel)), options, central);
        }
      }
    }
    if (Double.isNaN(shifted)) {
      return Part.notApplicable(
          Kind.OPERATING_CONDITIONS,
          "no operating tolerance configured, or the moved state leaves the engine's range");
    }
    return PhUncertainties.operatingConditions(
        List.of(PhUncertainties.shifted(source, tolerance, shifted, ph)),
        CONDENSATE_OPERATING_BASIS);
  }

  private static double condensatePh(
      Evaluator evaluator,
      Composition steam,
      double tSat,
      SpeciationOptions options,
      EarlyCondensate.Result near) {
    try {
      Distribution.ENGINE_LIMIT.check(tSat);
      return EarlyCondensate.of(
              steam,
              evaluator.operatingWater(tSat, Double.NaN),
              options,
              evaluator.amineDistributionEstimates(),
              near)
          .liquid()
          .ph();
    } catch (IllegalArgumentException e) {
      return Double.NaN;
    }
  }
}
