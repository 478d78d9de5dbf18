package org.kwanta.model.evaluation;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.kwanta.model.Instrument;
import org.kwanta.model.Parameter;
import org.kwanta.model.conductivity.AlkalizerMix;
import org.kwanta.model.conductivity.Solutes;
import org.kwanta.model.conductivity.SolutionModel;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.model.water.Water;

/**
 * Internal-consistency checks of the evaluator (they test the engine against itself, not against an
 * outside source): the trade formula against the rigorous calculation, and exact compensation round
 * trips.
 */
class EvaluatorTest {

  private static Snapshot snapshotAt(double tK, double sc, double cace, double dcace) {
    Map<Parameter, List<Reading>> h = Demo.map();
    h.put(Parameter.SPECIFIC_CONDUCTIVITY, List.of(Reading.raw(Demo.NOW, sc, tK)));
    h.put(Parameter.CATION_CONDUCTIVITY, List.of(Reading.raw(Demo.NOW, cace, tK)));
    h.put(Parameter.DEGASSED_CATION_CONDUCTIVITY, List.of(Reading.raw(Demo.NOW, dcace, tK)));
    return new Snapshot(Demo.NOW, h);
  }

  /**
   * The evaluator carries its ionization formulation to the operating water: the neutral pH at the
   * operating point is half the pKw of that formulation (IAPWS R11-07 or R11-24), so the two
   * evaluators differ there.
   */
  @org.junit.jupiter.api.Test
  void operatingWaterUsesTheEvaluatorsFormulation() {
    double[] v = Demo.readings(Demo.ammonia(1), 0, Demo.chloride(2), 0);
    Snapshot snapshot = snapshotAt(Demo.T25, v[0], v[1], v[2]);
    SamplePointConfig config = Demo.u1EcoIn();
    for (IonizationFormulation f : IonizationFormulation.values()) {
      Evaluator evaluator = new Evaluator(f);
      assertThat(evaluator.ionization()).isEqualTo(f);
      OperatingPh ph = evaluator.evaluate(config, snapshot).operatingPh().orElseThrow();
      double pKw = Water.at(config.operatingTemperatureK(), config.operatingPressurePa(), f).pKw();
      assertThat(ph.neutralPh()).as(f.name()).isCloseTo(pKw / 2, within(0.01));
    }
    double neutral07 =
        new Evaluator(IonizationFormulation.R11_07)
            .evaluate(config, snapshot)
            .operatingPh()
            .orElseThrow()
            .neutralPh();
    double neutral24 =
        new Evaluator(IonizationFormulation.R11_24)
            .evaluate(config, snapshot)
            .operatingPh()
            .orElseThrow()
            .neutralPh();
    assertThat(neutral24).isNotEqualTo(neutral07);
  }

  /**
   * Inside its window (ammonia, strong-acid contamination, no CO₂, SC 0.3–40 µS/cm) the trade
   * formula log10(SC − CACE/3) + 8.57 agrees with the rigorous charge balance within 0.05 pH (the
   * acceptance bound we set; common practice, no source, puts the trade formula within 0.02–0.05).
   */
  @ParameterizedTest
  @CsvSource({"0.2,1", "0.5,2", "1,5", "2,10", "5,20", "10,50", "0.5,40", "3,0"})
  void tradeFormulaAgreesWithRigorousInsideItsWindow(double nh3MgPerKg, double clUgPerKg) {
    double[] v = Demo.readings(Demo.ammonia(nh3MgPerKg), 0, Demo.chloride(clUgPerKg), 0);
    Evaluation e =
        Evaluator.DEFAULT.evaluate(Demo.u1EcoIn(), snapshotAt(Demo.T25, v[0], v[1], v[2]));
    CalculatedPh ph = e.calculatedPh().orElseThrow();
    assertThat(ph.tradeFormulaInWindow()).as(ph.tradeFormulaNote()).isTrue();
    assertThat(ph.rigorous()).isCloseTo(v[3], within(1e-6));
    assertThat(ph.tradeFormula()).isCloseTo(ph.rigorous(), within(0.05));
  }

  /** Raw readings made by the model at a sample temperature compensate back exactly. */
  @ParameterizedTest
  @CsvSource({"10", "18", "35", "45", "60"})
  void compensationRoundTripIsExactWithinTheModel(double celsius) {
    double tK = 273.15 + celsius;
    Solutes truth = new Solutes(Demo.ammonia(1.2), 0, Demo.chloride(4), 0, Demo.co2(60), 0);
    SolutionModel atT = Evaluator.DEFAULT.modelAt(tK, AlkalizerMix.AMMONIA);
    double sc = atT.solve(truth).kappa();
    double cace = atT.solve(new Solutes(0, 0, truth.chloride(), 0, truth.carbonate(), 0)).kappa();
    double dcace = atT.solve(new Solutes(0, 0, truth.chloride(), 0, 0, 0)).kappa();
    Evaluation e = Evaluator.DEFAULT.evaluate(Demo.u1EcoIn(), snapshotAt(tK, sc, cace, dcace));
    Solutes got = e.composition().orElseThrow().solutes();
    assertThat(got.alkalizer()).isCloseTo(truth.alkalizer(), within(truth.alkalizer() * 1e-8));
    assertThat(got.chloride()).isCloseTo(truth.chloride(), within(truth.chloride() * 1e-8));
    assertThat(got.carbonate()).isCloseTo(truth.carbonate(), within(truth.carbonate() * 1e-8));
    double sc25 = Demo.MODEL_25.solve(truth).kappa();
    assertThat(e.compensated().get(Parameter.SPECIFIC_CONDUCTIVITY).at25())
        .isCloseTo(sc25, within(sc25 * 1e-9));
  }

  /** A reading below theoretical pure water is flagged and reported as pure water at 25 °C. */
  @Test
  void belowPureWaterIsFlaggedAgainstItsInstrument() {
    Evaluation e =
        Evaluator.DEFAULT.evaluate(Demo.u1EcoIn(), snapshotAt(Demo.T25, 3.0, 0.08, 0.050));
    assertThat(e.findings())
        .extracting(Finding::code, Finding::pointsAt)
        .contains(
            org.assertj.core.groups.Tuple.tuple(
                ReasonCode.BELOW_PURE_WATER, Instrument.DEGASSED_CATION_CONDUCTIVITY));
    assertThat(e.compensated().get(Parameter.DEGASSED_CATION_CONDUCTIVITY).at25())
        .isCloseTo(Evaluator.PURE_WATER_25, within(1e-12));
  }

  /** The same snapshot always gives the same evaluation. */
  @Test
  void evaluationIsDeterministic() {
    Snapshot s = snapshotAt(308.15, 5.0, 0.12, 0.09);
    assertThat(Evaluator.DEFAULT.evaluate(Demo.u1EcoIn(), s))
        .isEqualTo(Evaluator.DEFAULT.evaluate(Demo.u1EcoIn(), s));
  }

  /** Sample temperature outside the band is flagged against the sample conditioning. */
  @Test
  void warmSampleIsFlaggedAgainstSampleConditioning() {
    Evaluation e = Evaluator.DEFAULT.evaluate(Demo.u1EcoIn(), snapshotAt(308.15, 5.0, 0.12, 0.09));
    assertThat(e.findings())
        .extracting(Finding::code)
        .contains(ReasonCode.SAMPLE_TEMPERATURE_OUT_OF_BAND);
  }
}
