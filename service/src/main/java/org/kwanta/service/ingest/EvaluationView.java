package org.kwanta.service.ingest;

import com.fasterxml.jackson.annotation.JsonAlias;
import io.swagger.v3.oas.annotations.media.Schema;
import java.util.List;
import org.kwanta.model.Instrument;
import org.kwanta.model.evaluation.Evaluation;
import org.kwanta.model.evaluation.OperatingPh;
import org.kwanta.service.chemistry.PhUncertaintyView;

/**
 * What the engine derived for one sample point at one time, units in the field names. Stored as
 * JSON beside the evaluation's indexed columns and returned by the API. Rows stored before the
 * names of issue 18 carry {@code suspect} and {@code rawUSPerCm}; they read back under the new
 * names.
 *
 * @param instrumentInDoubt whether a finding points at an instrument or the sample conditioning
 *     (not only at the process)
 */
public record EvaluationView(
    int configVersion,
    List<Compensated> compensated,
    Composition composition,
    CalculatedPh calculatedPh,
    PhAtTemperature phAtTemperature,
    List<FindingView> findings,
    @JsonAlias("suspect") boolean instrumentInDoubt,
    List<String> notes) {

  /** A conductivity referred to 25 °C. */
  public record Compensated(
      String parameter,
      @JsonAlias("rawUSPerCm") double asReadUSPerCm,
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
   * with the assumptions and distribution constants in {@code notes}. {@code low} and {@code high}
   * combine the parts of {@code uncertainty} (the same object as in the speciation API). Rows
   * stored before the itemised uncertainty have none, and their low/high are the instrument
   * tolerances alone; their formulation, which called that band the spread over the constant sets,
   * reads back corrected. {@code bandFrom} says which: COMBINED_PARTS, or INSTRUMENT_TOLERANCES for
   * those older rows. {@code operatingConditionSource}: MEASURED when a recent drum-pressure
   * reading of the point set the operating state (its value and time in {@code
   * measuredDrumPressureMPa} and {@code measuredAt}), CONFIGURED when the point's configured state
   * was used (null in evaluations stored before the field existed: configured).
   */
  @Schema(
      name = "EvaluationPhAtTemperature",
      description =
          "pH at the operating temperature with its band (bandFrom COMBINED_PARTS: the four parts of"
              + " uncertainty combined; INSTRUMENT_TOLERANCES in rows stored before them)")
  public record PhAtTemperature(
      double temperatureCel,
      double pressureMPa,
      double ph,
      double low,
      double high,
      String bandFrom,
      double neutralPh,
      String formulation,
      String basis,
      List<String> notes,
      String operatingConditionSource,
      Double measuredDrumPressureMPa,
      java.time.Instant measuredAt,
      PhUncertaintyView uncertainty) {

    /** The band of rows stored before the itemised uncertainty: the instruments' tolerances. */
    public static final String INSTRUMENT_TOLERANCES = "INSTRUMENT_TOLERANCES";

    /** The band combines the four parts of {@code uncertainty}. */
    public static final String COMBINED_PARTS = "COMBINED_PARTS";

    public PhAtTemperature {
      if (bandFrom == null) {
        bandFrom = uncertainty == null ? INSTRUMENT_TOLERANCES : COMBINED_PARTS;
      }
      if (uncertainty == null && formulation != null && formulation.endsWith(OLD_BAND_LABEL)) {
        formulation =
            formulation.substring(0, formulation.length() - OLD_BAND_LABEL.length())
                + STORED_BEFORE_ITEMISED;
      }
    }
  }

  /**
   * The form written to the database: the pH at temperature's uncertainty compact ({@link
   * PhUncertaintyView#compact()}); {@link #fromStorage()} restores what is not stored.
   */
  public EvaluationView forStorage() {
    return phAtTemperature == null || phAtTemperature.uncertainty() == null
        ? this
        : withUncertainty(phAtTemperature.uncertainty().compact());
  }

  /** A view read from the database, with the compact uncertainty filled in again. */
  public EvaluationView fromStorage() {
    return phAtTemperature == null || phAtTemperature.uncertainty() == null
        ? this
        : withUncertainty(phAtTemperature.uncertainty().filled());
  }

  private EvaluationView withUncertainty(PhUncertaintyView u) {
    PhAtTemperature t = phAtTemperature;
    return new EvaluationView(
        configVersion,
        compensated,
        composition,
        calculatedPh,
        new PhAtTemperature(
            t.temperatureCel(),
            t.pressureMPa(),
            t.ph(),
            t.low(),
            t.high(),
            t.bandFrom(),
            t.neutralPh(),
            t.formulation(),
            t.basis(),
            t.notes(),
            t.operatingConditionSource(),
            t.measuredDrumPressureMPa(),
            t.measuredAt(),
            u),
        findings,
        instrumentInDoubt,
        notes);
  }

  /** The formulation stored before the itemised uncertainty, as it was written (for tests). */
  static final String FORMULATION_BEFORE_ITEMISED =
      "Speciation (Davies activity, default constant set) with IAPWS-IF97 density and IAPWS R11-07 pKw;"
          + " band over the alternative constant sets";

  /** The label that rows stored before the itemised uncertainty carry (wrong: see below). */
  static final String OLD_BAND_LABEL = "; band over the alternative constant sets";

  /** What the low/high of those rows really are. */
  static final String STORED_BEFORE_ITEMISED =
      "; band from the instrument tolerances only (stored before the itemised uncertainty)";

  /**
   * A consistency-check result and what it points at (an instrument, the sample conditioning or the
   * process).
   */
  public record FindingView(
      String code, @JsonAlias("suspect") String pointsAt, String explanation) {}

  static final String FORMULATION =
      "Speciation (Davies activity, default constant set) with IAPWS-IF97 density and IAPWS R11-07 pKw;"
          + " band: (a) instrument tolerances, (b) constant-set spread, (c) estimated or"
          + " extrapolated constants and (d) operating temperature/pressure, combined by"
          + " root-sum-square (see uncertainty)";

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
                        c.parameter().code(),
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
                        o.uncertainty() == null
                            ? PhAtTemperature.INSTRUMENT_TOLERANCES
                            : PhAtTemperature.COMBINED_PARTS,
                        o.neutralPh(),
                        o.basis() == OperatingPh.Basis.EARLY_CONDENSATE
                            ? FORMULATION_EARLY_CONDENSATE
                            : FORMULATION,
                        o.basis().name(),
                        o.notes(),
                        condition.source().name(),
                        condition.drumPressureMPa(),
                        condition.measuredAt(),
                        PhUncertaintyView.from(o.uncertainty())))
            .orElse(null);
    List<FindingView> findings =
        e.findings().stream()
            .map(f -> new FindingView(f.code().name(), f.pointsAt().name(), f.explanation()))
            .toList();
    boolean instrumentInDoubt =
        e.findings().stream().anyMatch(f -> f.pointsAt() != Instrument.PROCESS);
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
        instrumentInDoubt,
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
