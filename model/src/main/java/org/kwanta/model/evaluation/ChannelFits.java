package org.kwanta.model.evaluation;

import java.util.EnumMap;
import java.util.Map;
import java.util.function.Function;
import org.kwanta.model.Parameter;
import org.kwanta.model.conductivity.Solute;
import org.kwanta.model.conductivity.Solutes;
import org.kwanta.model.conductivity.Solution;
import org.kwanta.model.conductivity.SolutionModel;

/**
 * The solute model of each conductivity channel per regime, fitted channel by channel: degassed
 * cation conductivity gives the strong-acid anions (as HCl), cation conductivity then carbon
 * dioxide (or, without a degassed channel, the strong acid; for phosphate treatment, phosphoric
 * acid), and specific conductivity the alkalizer (or sodium hydroxide, or for make-up water sodium
 * chloride) with the anions as its salts. Amounts are molal, so a channel fitted at its own sample
 * temperature hands its amounts on unchanged.
 */
final class ChannelFits {

  private ChannelFits() {}

  /**
   * The fitted amounts and the per-channel solutions (each channel's fitted amounts are its
   * solution's solutes).
   */
  record Result(
      Solutes all, Map<Parameter, Solution> channelSolutions, SodiumRoots.Choice sodiumChoice) {

    /** A fit with no choice between sodium roots. */
    Result(Solutes all, Map<Parameter, Solution> channelSolutions) {
      this(all, channelSolutions, null);
    }
  }

  /**
   * @param regime the treatment
   * @param sodiumMolal sodium from the sodium analyser, mol/kg (NaN or 0 when absent): a solute in
   *     volatile regimes; for phosphate and caustic water it chooses between the sodium amounts
   *     that fit specific conductivity when there are two ({@link SodiumRoots})
   * @param values conductivity per channel, µS/cm, at the temperature of its model
   * @param models the solution model each channel is fitted with
   */
  static Result fit(
      Regime regime,
      double sodiumMolal,
      Map<Parameter, Double> values,
      Map<Parameter, SolutionModel> models) {
    return fit(regime, sodiumMolal, values, models::get, null, null, Map.of());
  }

  /**
   * The fit of values that differ from those of a central fit in one channel only: the channels
   * fitted before it in the chain (DCACE, then CACE, then SC) keep the central amounts and
   * solutions, since their inputs are unchanged; the changed channel and those after it are
   * refitted with one model, each started from a nearby solution (speed only).
   *
   * @param values conductivity per channel, µS/cm, at the temperature of the model, with the
   *     unchanged channels' values giving the central amounts at that temperature
   * @param model the model of every refitted channel
   * @param central the central fit
   * @param changed the channel whose value differs
   * @param near a solution near each channel's refit, e.g. the central fit's solution of that
   *     channel at the model's temperature (absent: none)
   */
  static Result refit(
      Regime regime,
      double sodiumMolal,
      Map<Parameter, Double> values,
      SolutionModel model,
      Result central,
      Parameter changed,
      Map<Parameter, Solution> near) {
    return fit(regime, sodiumMolal, values, p -> model, central, changed, near);
  }

  private static Result fit(
      Regime regime,
      double sodiumMolal,
      Map<Parameter, Double> values,
      Function<Parameter, SolutionModel> models,
      Result central,
      Parameter changed,
      Map<Parameter, Solution> near) {
    Map<Parameter, Solution> solutions = new EnumMap<>(Parameter.class);
    // with a central fit, the channels before the changed one keep their results
    boolean reuseDegassed = central != null && changed != Parameter.DEGASSED_CATION_CONDUCTIVITY;
    boolean reuseCation = reuseDegassed && changed != Parameter.CATION_CONDUCTIVITY;
    double acid = 0;
    double co2 = 0;
    double phosphate = 0;
    Double d = values.get(Parameter.DEGASSED_CATION_CONDUCTIVITY);
    if (d != null) {
      Solution s =
          reuseDegassed
              ? central.channelSolutions().get(Parameter.DEGASSED_CATION_CONDUCTIVITY)
              : models
                  .apply(Parameter.DEGASSED_CATION_CONDUCTIVITY)
                  .fit(
                      Solutes.NONE,
                      Solute.HYDROCHLORIC_ACID,
                      d,
                      near.get(Parameter.DEGASSED_CATION_CONDUCTIVITY));
      acid = s.solutes().chloride();
      solutions.put(Parameter.DEGASSED_CATION_CONDUCTIVITY, s);
    }
    Double c = values.get(Parameter.CATION_CONDUCTIVITY);
    if (c != null) {
      SolutionModel m = models.apply(Parameter.CATION_CONDUCTIVITY);
      Solution hint = near.get(Parameter.CATION_CONDUCTIVITY);
      Solution s;
      if (reuseCation) {
        s = central.channelSolutions().get(Parameter.CATION_CONDUCTIVITY);
        if (regime == Regime.PHOSPHATE) {
          phosphate = s.solutes().phosphate();
        } else if (d != null) {
          co2 = s.solutes().carbonate();
        } else {
          acid = s.solutes().chloride();
        }
      } else if (regime == Regime.PHOSPHATE) {
        s =
            m.fit(
                Solutes.NONE.with(Solute.HYDROCHLORIC_ACID, acid), Solute.PHOSPHORIC_ACID, c, hint);
        phosphate = s.solutes().phosphate();
      } else if (d != null) {
        s =
            m.fit(
                Solutes.NONE.with(Solute.HYDROCHLORIC_ACID, acid), Solute.CARBON_DIOXIDE, c, hint);
        co2 = s.solutes().carbonate();
      } else {
        s = m.fit(Solutes.NONE, Solute.HYDROCHLORIC_ACID, c, hint);
        acid = s.solutes().chloride();
      }
      solutions.put(Parameter.CATION_CONDUCTIVITY, s);
    }
    double na = regime.isVolatile() && sodiumMolal > 0 ? sodiumMolal : 0;
    Solutes all = new Solutes(0, na, acid, 0, co2, phosphate);
    SodiumRoots.Choice choice = null;
    Double sc = values.get(Parameter.SPECIFIC_CONDUCTIVITY);
    if (sc != null) {
      SolutionModel m = models.apply(Parameter.SPECIFIC_CONDUCTIVITY);
      Solution hint = near.get(Parameter.SPECIFIC_CONDUCTIVITY);
      Solution s;
      switch (regime) {
        case AVT_R, AVT_O, OT -> s = m.fit(all, Solute.ALKALIZER, sc, hint);
        case PHOSPHATE, CAUSTIC -> {
          SodiumRoots.Fit f =
              SodiumRoots.fit(
                  m, all, sc, hint, sodiumMolal, central == null ? null : central.sodiumChoice());
          s = f.solution();
          choice = f.choice();
        }
        case MAKE_UP -> s = m.fit(Solutes.NONE, Solute.SODIUM_CHLORIDE, sc, hint);
        default -> throw new IllegalStateException(regime.name());
      }
      all = s.solutes();
      solutions.put(Parameter.SPECIFIC_CONDUCTIVITY, s);
    }
    return new Result(all, solutions, choice);
  }
}
