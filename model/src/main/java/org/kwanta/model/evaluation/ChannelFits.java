package org.kwanta.model.evaluation;

import java.util.EnumMap;
import java.util.Map;
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

  /** The fitted amounts and the per-channel solutions. */
  record Result(
      Solutes all,
      Map<Parameter, Solution> channelSolutions,
      Map<Parameter, Solutes> channelSolutes) {}

  /**
   * @param regime the treatment
   * @param sodiumMolal sodium from the sodium analyser, mol/kg (used in volatile regimes; NaN or 0
   *     when absent)
   * @param values conductivity per channel, µS/cm, at the temperature of its model
   * @param models the solution model each channel is fitted with
   */
  static Result fit(
      Regime regime,
      double sodiumMolal,
      Map<Parameter, Double> values,
      Map<Parameter, SolutionModel> models) {
    Map<Parameter, Solution> solutions = new EnumMap<>(Parameter.class);
    Map<Parameter, Solutes> channelSolutes = new EnumMap<>(Parameter.class);
    double acid = 0;
    double co2 = 0;
    double phosphate = 0;
    Double d = values.get(Parameter.DEGASSED_CATION_CONDUCTIVITY);
    if (d != null) {
      Solution s =
          models
              .get(Parameter.DEGASSED_CATION_CONDUCTIVITY)
              .fit(Solutes.NONE, Solute.HYDROCHLORIC_ACID, d);
      acid = s.solutes().chloride();
      solutions.put(Parameter.DEGASSED_CATION_CONDUCTIVITY, s);
      channelSolutes.put(Parameter.DEGASSED_CATION_CONDUCTIVITY, s.solutes());
    }
    Double c = values.get(Parameter.CATION_CONDUCTIVITY);
    if (c != null) {
      SolutionModel m = models.get(Parameter.CATION_CONDUCTIVITY);
      Solution s;
      if (regime == Regime.PHOSPHATE) {
        s = m.fit(Solutes.NONE.with(Solute.HYDROCHLORIC_ACID, acid), Solute.PHOSPHORIC_ACID, c);
        phosphate = s.solutes().phosphate();
      } else if (d != null) {
        s = m.fit(Solutes.NONE.with(Solute.HYDROCHLORIC_ACID, acid), Solute.CARBON_DIOXIDE, c);
        co2 = s.solutes().carbonate();
      } else {
        s = m.fit(Solutes.NONE, Solute.HYDROCHLORIC_ACID, c);
        acid = s.solutes().chloride();
      }
      solutions.put(Parameter.CATION_CONDUCTIVITY, s);
      channelSolutes.put(Parameter.CATION_CONDUCTIVITY, s.solutes());
    }
    double na = regime.isVolatile() && sodiumMolal > 0 ? sodiumMolal : 0;
    Solutes all = new Solutes(0, na, acid, 0, co2, phosphate);
    Double sc = values.get(Parameter.SPECIFIC_CONDUCTIVITY);
    if (sc != null) {
      SolutionModel m = models.get(Parameter.SPECIFIC_CONDUCTIVITY);
      Solution s =
          switch (regime) {
            case AVT_R, AVT_O, OT -> m.fit(all, Solute.ALKALIZER, sc);
            case PHOSPHATE, CAUSTIC -> m.fit(all, Solute.SODIUM_HYDROXIDE, sc);
            case MAKE_UP -> m.fit(Solutes.NONE, Solute.SODIUM_CHLORIDE, sc);
          };
      all = s.solutes();
      solutions.put(Parameter.SPECIFIC_CONDUCTIVITY, s);
      channelSolutes.put(Parameter.SPECIFIC_CONDUCTIVITY, s.solutes());
    }
    return new Result(all, solutions, channelSolutes);
  }
}
