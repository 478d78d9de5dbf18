package org.kwanta.model.evaluation;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.kwanta.model.Parameter;
import org.kwanta.model.aqueous.Component;
import org.kwanta.model.aqueous.Composition;
import org.kwanta.model.aqueous.EquilibriumConstants;
import org.kwanta.model.aqueous.PhUncertainty;
import org.kwanta.model.aqueous.PhUncertainty.Kind;
import org.kwanta.model.aqueous.PhUncertainty.Part;
import org.kwanta.model.aqueous.Speciation;
import org.kwanta.model.aqueous.SpeciationOptions;
import org.kwanta.model.aqueous.SpeciationResult;
import org.kwanta.model.aqueous.Species;
import org.kwanta.model.conductivity.AlkalizerMix;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.model.water.Water;
import org.kwanta.model.water.WaterState;

/**
 * The itemised band of an evaluation's pH at temperature: the four parts, their combination into
 * the stored low and high, and part (d) against a hand calculation. Internal-consistency checks of
 * the engine; the hand calculation is written beside the test.
 */
class EvaluatorUncertaintyTest {

  /** Demo feedwater: 2 mg/kg NH₃ and 1 µg/kg Cl as measured at 25 °C. */
  private static Snapshot feedwater() {
    double[] v = Demo.readings(Demo.ammonia(2), 0, Demo.chloride(1), 0);
    Map<Parameter, List<Reading>> h = Demo.map();
    h.put(Parameter.SPECIFIC_CONDUCTIVITY, List.of(Reading.raw(Demo.NOW, v[0], Demo.T25)));
    h.put(Parameter.CATION_CONDUCTIVITY, List.of(Reading.raw(Demo.NOW, v[1], Demo.T25)));
    return new Snapshot(Demo.NOW, h);
  }

  /**
   * U1-ECO-IN (155 °C, 15 MPa): (a) instrument, (b) constant sets (the ammonium fits differ), (d)
   * ±2 K and ±5 % apply; (c) does not (every constant a retrieved fit inside its range). The stored
   * low and high are the parts combined by root-sum-square on each side.
   */
  @Test
  void storedBandIsTheRootSumSquareOfTheFourParts() {
    OperatingPh op =
        Evaluator.DEFAULT.evaluate(Demo.u1EcoIn(), feedwater()).operatingPh().orElseThrow();
    PhUncertainty u = op.uncertainty();
    assertThat(u.parts()).extracting(Part::kind).containsExactly(Kind.values());
    assertThat(u.part(Kind.INSTRUMENT_TOLERANCES).halfWidth()).isGreaterThan(0);
    Part sets = u.part(Kind.CONSTANT_SET_SPREAD);
    assertThat(sets.halfWidth()).isGreaterThan(0.001);
    assertThat(sets.lowConstantSet() + sets.highConstantSet()).contains("ammonium");
    assertThat(u.part(Kind.ESTIMATED_CONSTANTS).halfWidth()).isZero();
    assertThat(u.part(Kind.ESTIMATED_CONSTANTS).basis()).contains("retrieved fit");
    assertThat(u.part(Kind.OPERATING_CONDITIONS).contributions())
        .extracting(PhUncertainty.Contribution::source)
        .containsExactly("temperature", "pressure");
    double below = 0;
    double above = 0;
    for (Part p : u.parts()) {
      below += p.below() * p.below();
      above += p.above() * p.above();
    }
    assertThat(op.low()).isEqualTo(u.low()).isCloseTo(op.ph() - Math.sqrt(below), within(1e-12));
    assertThat(op.high()).isEqualTo(u.high()).isCloseTo(op.ph() + Math.sqrt(above), within(1e-12));
  }

  /**
   * Part (d), temperature, by hand. Ammonia water with little chloride: m(NH₄⁺) + h ≈ Kw/h, m(NH₄⁺)
   * = C·f, f = h/(h + Ka). Differentiating in T (activity coefficients fixed): d ln h·[C·f·(1 − f)
   * + h + Kw/h] = C·f·(1 − f)·d ln Ka + (Kw/h)·d ln Kw, so over ΔT = 2 K ΔpH ≈ −[C·f·(1 − f)·Δlog
   * Ka + (Kw/h)·Δlog Kw]/[C·f·(1 − f) + h + Kw/h], with Δlog Ka from the llnl.dat ammonium fit and
   * Δlog Kw from IAPWS R11-07 between 155 and 157 °C at 15 MPa. Within 5 % (chloride and the change
   * of the activity coefficients neglected by hand).
   */
  @Test
  void temperaturePartMatchesAHandCalculation() {
    SamplePointConfig config = Demo.u1EcoIn();
    Evaluation e = Evaluator.DEFAULT.evaluate(config, feedwater());
    OperatingPh op = e.operatingPh().orElseThrow();
    double t = config.operatingTemperatureK();
    double p = config.operatingPressurePa();
    WaterState w = Water.at(t, p, IonizationFormulation.R11_07);
    WaterState w2 = Water.at(t + 2, p, IonizationFormulation.R11_07);
    Composition c = e.composition().orElseThrow().solutes().composition(AlkalizerMix.AMMONIA);
    SpeciationResult r = Speciation.solve(c, w, SpeciationOptions.defaults());
    double f = r.molality(Species.AMMONIUM) / c.molality(Component.AMMONIA);
    double cf1f = c.molality(Component.AMMONIA) * f * (1 - f);
    double h = r.hydrogenIonMolality();
    double kwOverH = r.hydroxideMolality();
    double dLogKa =
        EquilibriumConstants.AMMONIUM_LLNL.log10K(t + 2, w2.pKw())
            - EquilibriumConstants.AMMONIUM_LLNL.log10K(t, w.pKw());
    double dLogKw = -(w2.pKw() - w.pKw());
    double byHand = Math.abs((cf1f * dLogKa + kwOverH * dLogKw) / (cf1f + h + kwOverH));
    PhUncertainty.Contribution temperature =
        op.uncertainty().part(Kind.OPERATING_CONDITIONS).contributions().get(0);
    assertThat(temperature.source()).isEqualTo("temperature");
    assertThat(temperature.halfWidthPh()).isCloseTo(byHand, within(0.05 * byHand));
    assertThat(temperature.detail()).contains("±2.0 K");
  }

  /** Without operating tolerances part (d) says so and has no width. */
  @Test
  void withoutOperatingTolerancesPartDSaysSo() {
    SamplePointConfig base = Demo.u1EcoIn();
    SamplePointConfig exact =
        new SamplePointConfig(
            base.id(),
            base.regime(),
            base.alkalizer(),
            base.operatingTemperatureK(),
            base.operatingPressurePa(),
            false,
            Tolerances.defaults().withOperating(0, 0),
            base.checks());
    Part d =
        Evaluator.DEFAULT
            .evaluate(exact, feedwater())
            .operatingPh()
            .orElseThrow()
            .uncertainty()
            .part(Kind.OPERATING_CONDITIONS);
    assertThat(d.halfWidth()).isZero();
    assertThat(d.basis()).contains("no operating tolerance");
  }

  /**
   * A steam point (main steam, 5 MPa): the four parts are present for the first condensate; (d) is
   * the ±5 % of the pressure moving the condensation temperature.
   */
  @Test
  void steamPointHasTheFourParts() {
    SamplePointConfig steam =
        SamplePointConfig.of("U1-MS", Regime.AVT_O, AlkalizerMix.AMMONIA, 603.15, 5e6).asSteam();
    OperatingPh op = Evaluator.DEFAULT.evaluate(steam, feedwater()).operatingPh().orElseThrow();
    PhUncertainty u = op.uncertainty();
    assertThat(u.parts()).extracting(Part::kind).containsExactly(Kind.values());
    assertThat(u.part(Kind.OPERATING_CONDITIONS).contributions().get(0).source())
        .isEqualTo("pressure");
    assertThat(u.part(Kind.OPERATING_CONDITIONS).halfWidth()).isGreaterThan(0);
    assertThat(op.low()).isLessThan(op.ph());
    assertThat(op.high()).isGreaterThan(op.ph());
  }
}
