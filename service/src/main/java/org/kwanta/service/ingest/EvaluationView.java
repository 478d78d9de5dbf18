package org.kwanta.service.ingest;

import java.util.List;
import org.kwanta.model.Instrument;
import org.kwanta.model.evaluation.Evaluation;

/**
 * What the engine derived for one sample point at one time, units in the field names. Stored as
 * JSON beside the evaluation's indexed columns and returned by the API.
 */
public record EvaluationView(
    int configVersion,
    List<Compensated> compensated,
    Composition composition,
    CalculatedPh calculatedPh,
    PhAtTemperature phAtTemperature,
    List<FindingView> findings,
    boolean suspect,
    List<String> notes) {

  /** A conductivity referred to 25 °C. */
  public record Compensated(
      String parameter,
      double rawUSPerCm,
      Double sampleTemperatureCel,
      double at25USPerCm,
      boolean compensatedByAnalyser,
      boolean belowPureWater) {}

  /** Composition inferred from the 25 °C readings. */
  public record Composition(
      Double alkalizerMgPerKg,
      Double chlorideEquivalentUgPerKg,
      Double carbonDioxideUgPerKg,
      Double sodiumUgPerKg,
      Double phosphateMgPerKg,
      Double sodiumToPhosphateMolarRatio) {}

  /** JSON has no NaN: a value the engine could not determine is null. */
  static Double finite(double v) {
    return Double.isFinite(v) ? v : null;
  }

  /** pH at 25 °C calculated from the conductivities. */
  public record CalculatedPh(
      double rigorous,
      double rigorousUncertainty,
      double tradeFormula,
      double tradeFormulaConstant,
      boolean tradeFormulaInWindow,
      String tradeFormulaNote) {}

  /**
   * pH at the sample point's operating temperature and pressure, with its band over alternative
   * constants.
   */
  public record PhAtTemperature(
      double temperatureCel,
      double pressureMPa,
      double ph,
      double low,
      double high,
      double neutralPh,
      String formulation) {}

  /** A consistency-check result. */
  public record FindingView(String code, String suspect, String explanation) {}

  static final String FORMULATION =
      "Speciation (Davies activity, default constant set) with IAPWS-IF97 density and IAPWS R11-07 pKw;"
          + " band over the alternative constant sets";

  public static EvaluationView from(int configVersion, Evaluation e, List<String> notes) {
    List<Compensated> compensated =
        e.compensated().values().stream()
            .sorted(java.util.Comparator.comparing(c -> c.parameter().ordinal()))
            .map(
                c ->
                    new Compensated(
                        c.parameter().name().toLowerCase(java.util.Locale.ROOT),
                        c.raw(),
                        Double.isFinite(c.sampleTemperatureK())
                            ? c.sampleTemperatureK() - 273.15
                            : null,
                        c.at25(),
                        c.compensatedByAnalyser(),
                        c.belowPureWater()))
            .toList();
    Composition composition =
        e.composition()
            .map(
                c ->
                    new Composition(
                        finite(c.alkalizerMgPerKg()),
                        finite(c.chlorideEquivalentUgPerKg()),
                        finite(c.carbonDioxideUgPerKg()),
                        finite(c.sodiumUgPerKg()),
                        finite(c.phosphateMgPerKg()),
                        finite(c.sodiumToPhosphateMolarRatio())))
            .orElse(null);
    CalculatedPh calculated =
        e.calculatedPh()
            .map(
                c ->
                    new CalculatedPh(
                        c.rigorous(),
                        c.rigorousUncertainty(),
                        c.tradeFormula(),
                        c.tradeFormulaConstant(),
                        c.tradeFormulaInWindow(),
                        c.tradeFormulaNote()))
            .orElse(null);
    PhAtTemperature operating =
        e.operatingPh()
            .map(
                o ->
                    new PhAtTemperature(
                        o.temperatureK() - 273.15,
                        o.pressurePa() / 1e6,
                        o.ph(),
                        o.low(),
                        o.high(),
                        o.neutralPh(),
                        FORMULATION))
            .orElse(null);
    List<FindingView> findings =
        e.findings().stream()
            .map(f -> new FindingView(f.code().name(), f.suspect().name(), f.explanation()))
            .toList();
    boolean suspect = e.findings().stream().anyMatch(f -> f.suspect() != Instrument.PROCESS);
    return new EvaluationView(
        configVersion, compensated, composition, calculated, operating, findings, suspect, notes);
  }

  /** The 25 °C value of a conductivity channel, or null. */
  public Double at25(String parameter) {
    return compensated.stream()
        .filter(c -> c.parameter().equals(parameter))
        .map(Compensated::at25USPerCm)
        .findFirst()
        .orElse(null);
  }
}
