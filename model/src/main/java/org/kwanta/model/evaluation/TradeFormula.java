package org.kwanta.model.evaluation;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.kwanta.model.Parameter;
import org.kwanta.model.aqueous.Component;
import org.kwanta.model.aqueous.Species;

/**
 * The trade formula for calculated pH at 25 °C: pH ≈ log10(SC − CACE/3) + K, SC and CACE in µS/cm
 * at 25 °C. From the charge balance of an alkalizer with strong-acid contamination, K = pKw − 3 −
 * log10(λ°cation + λ°OH) − log10(ρ/1000 kg m⁻³); for ammonia the customary K = 8.57 is used (common
 * practice; the model gives 8.562), for other single alkalizers and sodium hydroxide the model
 * value. The /3 is the "acids are about three times as conductive" of ASTM D6504. Window (the
 * project's reference notes, a synthesis, no published range): a single known alkalizer or NaOH, no
 * phosphate, carbon dioxide small (CACE − DCACE ≤ 0.1 µS/cm), SC 0.3–40 µS/cm (about pH 8–10.5).
 */
final class TradeFormula {

  /** Largest CACE − DCACE for the window, µS/cm. */
  static final double CO2_WINDOW = 0.10;

  static final double SC_MIN = 0.3;
  static final double SC_MAX = 40;

  private TradeFormula() {}

  record Result(double value, double constant, boolean inWindow, String note) {}

  static Result evaluate(SamplePointConfig config, Map<Parameter, Double> at25) {
    Double sc = at25.get(Parameter.SPECIFIC_CONDUCTIVITY);
    Double cace = at25.get(Parameter.CATION_CONDUCTIVITY);
    Double dcace = at25.get(Parameter.DEGASSED_CATION_CONDUCTIVITY);
    List<String> why = new ArrayList<>();
    double k = Double.NaN;
    Regime regime = config.regime();
    if (regime == Regime.PHOSPHATE) {
      why.add("phosphate water");
    } else if (regime == Regime.MAKE_UP) {
      why.add("not an alkalized sample");
    } else if (regime == Regime.CAUSTIC) {
      k = constant(Species.SODIUM_ION);
    } else if (!config.alkalizer().isSingle()) {
      why.add("alkalizer mix");
    } else {
      Component a = config.alkalizer().molarFractions().keySet().iterator().next();
      k = a == Component.AMMONIA ? Evaluator.TRADE_CONSTANT_AMMONIA : constant(a.species().get(0));
    }
    if (sc == null || cace == null) {
      why.add("needs specific and cation conductivity");
      return new Result(Double.NaN, k, false, String.join("; ", why));
    }
    if (dcace != null && cace - dcace > CO2_WINDOW) {
      why.add("carbon dioxide present (CACE − DCACE > 0.1 µS/cm)");
    }
    if (sc < SC_MIN || sc > SC_MAX) {
      why.add("SC outside 0.3–40 µS/cm (about pH 8–10.5)");
    }
    double arg = sc - cace / 3;
    double value = arg > 0 && !Double.isNaN(k) ? Math.log10(arg) + k : Double.NaN;
    if (!(arg > 0)) {
      why.add("SC − CACE/3 is not positive");
    }
    return new Result(value, k, why.isEmpty(), String.join("; ", why));
  }

  /** K = pKw − 3 − log10(λ°cation + λ°OH) − log10(ρ/1000) at 25 °C. */
  static double constant(Species cation) {
    return Evaluator.WATER_25.pKw()
        - 3
        - Math.log10(Evaluator.lambda25(cation) + Evaluator.lambda25(Species.HYDROXIDE))
        - Math.log10(Evaluator.WATER_25.densityKgPerM3() / 1000);
  }
}
