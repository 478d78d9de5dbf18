package org.kwanta.service.ingest;

import java.util.List;
import org.kwanta.model.Instrument;
import org.kwanta.model.evaluation.Evaluation;
import org.kwanta.model.evaluation.OperatingPh;

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

  /**
   * pH at 25 °C calculated from the conductivities. The trade formula and its constant are null
   * when they cannot be computed; {@code tradeFormulaNote} says why. Never NaN (JSON has none; rows
   * stored before this rule with the string "NaN" read back as null).
   */
  public record CalculatedPh(
      double rigorous,
      double rigorousUncertainty,
      Double tradeFormula,
      Double tradeFormulaConstant,
      boolean tradeFormulaInWindow,
      String tradeFormulaNote) {

    public CalculatedPh {
      tradeFormula = tradeFormula == null ? null : finite(tradeFormula);
      tradeFormulaConstant = tradeFormulaConstant == null ? null : finite(tradeFormulaConstant);
    }
  }

  /**
   * pH at the sample point's operating temperature and pressure, with its band; for a steam sample
   * the pH of its first condensate at the saturation temperature ({@code basis} EARLY_CONDENSATE),
   * with the assumptions and distribution constants in {@code notes}. {@code
   * operatingConditionSource}: MEASURED when a recent drum-pressure reading of the point set the
   * operating state (its value and time in {@code measuredDrumPressureMPa} and {@code measuredAt}),
   * CONFIGURED when the point's configured state was used (null in evaluations stored before the
   * field existed: configured).
   */
  public record PhAtTemperature(
      double temperatureCel,
      double pressureMPa,
      double ph,
      double low,
      double high,
      double neutralPh,
      String formulation,
      String basis,
      List<String> notes,
      String operatingConditionSource,
      Double measuredDrumPressureMPa,
      java.time.Instant measuredAt) {}

  /** A consistency-check result. */
  public record FindingView(String code, String suspect, String explanation) {}

  static final String FORMULATION =
      "Speciation (Davies activity, default constant set) with IAPWS-IF97 density and IAPWS R11-07 pKw;"
          + " band over the alternative constant sets";

  static final String FORMULATION_EARLY_CONDENSATE =
      "First condensate of the steam at the saturation temperature: vapour-liquid distribution"
          + " constants (CO2: IAPWS G7-04; NH3: estimate from a Henry's-law fit; amines, only when"
          + " kwanta.evaluation.amine-distribution-estimates is on: order-of-magnitude estimates"
          + " from memory, about a factor of two) with the speciation above";

  public static EvaluationView from(int configVersion, Evaluation e, List<String> notes) {
    return from(configVersion, e, notes, OperatingCondition.CONFIGURED);
  }

  /** The view of an evaluation whose operating state came from {@code condition}. */
  public static EvaluationView from(
      int configVersion, Evaluation e, List<String> notes, OperatingCondition condition) {
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
                        finite(c.tradeFormula()),
                        finite(c.tradeFormulaConstant()),
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
                        o.basis() == OperatingPh.Basis.EARLY_CONDENSATE
                            ? FORMULATION_EARLY_CONDENSATE
                            : FORMULATION,
                        o.basis().name(),
                        o.notes(),
                        condition.source().name(),
                        condition.drumPressureMPa(),
                        condition.measuredAt()))
            .orElse(null);
    List<FindingView> findings =
        e.findings().stream()
            .map(f -> new FindingView(f.code().name(), f.suspect().name(), f.explanation()))
            .toList();
    boolean suspect = e.findings().stream().anyMatch(f -> f.suspect() != Instrument.PROCESS);
    List<String> allNotes = notes;
    if (!e.notes().isEmpty()) {
      allNotes = new java.util.ArrayList<>(notes);
      allNotes.addAll(e.notes());
    }
    return new EvaluationView(
        configVersion,
        compensated,
        composition,
        calculated,
        operating,
        findings,
        suspect,
        List.copyOf(allNotes));
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
