package org.kwanta.model.evaluation;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.kwanta.model.Parameter;
import org.kwanta.model.aqueous.Component;
import org.kwanta.model.aqueous.Composition;
import org.kwanta.model.aqueous.Speciation;
import org.kwanta.model.aqueous.SpeciationOptions;
import org.kwanta.model.aqueous.SpeciationResult;
import org.kwanta.model.aqueous.Species;
import org.kwanta.model.conductivity.AlkalizerMix;
import org.kwanta.model.water.Distribution;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.model.water.VolatileSolute;
import org.kwanta.model.water.Water;
import org.kwanta.model.water.WaterState;

/**
 * Steam sample points: the 25 °C chemistry always stands, and the pH at temperature is that of the
 * first condensate. The distribution constants are checked against their sources in {@code
 * DistributionTest}; the checks here are of the engine against itself (mass balance of the
 * distribution) and of what is refused.
 */
class SteamEvaluationTest {

  /** Fictional Brackenmoor-style main steam: 2 mg/kg NH3, 3 µg/kg Cl, 40 µg/kg CO2. */
  private static Snapshot steamSample() {
    double[] v = Demo.readings(Demo.ammonia(2), 0, Demo.chloride(3), Demo.co2(40));
    Map<Parameter, List<Reading>> h = Demo.map();
    h.put(Parameter.SPECIFIC_CONDUCTIVITY, List.of(Reading.raw(Demo.NOW, v[0], Demo.T25)));
    h.put(Parameter.CATION_CONDUCTIVITY, List.of(Reading.raw(Demo.NOW, v[1], Demo.T25)));
    h.put(Parameter.DEGASSED_CATION_CONDUCTIVITY, List.of(Reading.raw(Demo.NOW, v[2], Demo.T25)));
    return new Snapshot(Demo.NOW, h);
  }

  private static SamplePointConfig steam(double celsius, double pressureMPa, AlkalizerMix mix) {
    return SamplePointConfig.of("U1-MS", Regime.AVT_O, mix, celsius + 273.15, pressureMPa * 1e6)
        .asSteam();
  }

  /** The case: main steam at 330 °C and 5 MPa was "internal error"; now it evaluates. */
  @Test
  void mainSteamAt5MPaIsEvaluatedAsItsFirstCondensate() {
    Evaluation e = Evaluator.DEFAULT.evaluate(steam(330, 5, AlkalizerMix.AMMONIA), steamSample());
    assertThat(e.calculatedPh()).isPresent();
    assertThat(e.composition()).isPresent();
    OperatingPh op = e.operatingPh().orElseThrow();
    assertThat(op.basis()).isEqualTo(OperatingPh.Basis.EARLY_CONDENSATE);
    assertThat(op.temperatureK()).isCloseTo(Water.saturationTemperatureK(5e6), within(1e-9));
    assertThat(op.notes()).anyMatch(n -> n.contains("IAPWS G7-04"));
    assertThat(op.notes()).anyMatch(n -> n.contains("estimated"));
    assertThat(op.low()).isLessThanOrEqualTo(op.ph());
    assertThat(e.notes()).isEmpty();
  }

  /** 540 °C steam at 16 MPa: accepted, condensing at T_s(16 MPa) ≈ 347 °C. */
  @Test
  void superheatedSteamAt540CIsAccepted() {
    Evaluation e = Evaluator.DEFAULT.evaluate(steam(540, 16, AlkalizerMix.AMMONIA), steamSample());
    assertThat(e.operatingPh().orElseThrow().temperatureK()).isCloseTo(620.5, within(0.1));
  }

  /**
   * The liquid found satisfies the distribution it was built from: m(NH3, steam) = K_D × m(NH3
   * neutral, liquid), likewise for CO2, with the non-volatile chloride unchanged.
   */
  @Test
  void firstCondensateSatisfiesTheDistribution() {
    WaterState w = Water.atSaturation(537.09, IonizationFormulation.R11_07);
    Composition steam =
        Composition.builder()
            .molal(Component.AMMONIA, Demo.ammonia(2))
            .molal(Component.CARBON_DIOXIDE, Demo.co2(40))
            .molal(Component.CHLORIDE, Demo.chloride(3))
            .build();
    SpeciationResult liquid =
        EarlyCondensate.of(steam, w, SpeciationOptions.defaults(), false).liquid();
    double kNh3 = Distribution.at(VolatileSolute.AMMONIA, w.temperatureK()).kD();
    double kCo2 = Distribution.at(VolatileSolute.CARBON_DIOXIDE, w.temperatureK()).kD();
    assertThat(kNh3 * liquid.molality(Species.AMMONIA))
        .isCloseTo(Demo.ammonia(2), within(Demo.ammonia(2) * 1e-8));
    assertThat(kCo2 * liquid.molality(Species.CARBON_DIOXIDE))
        .isCloseTo(Demo.co2(40), within(Demo.co2(40) * 1e-8));
    assertThat(liquid.molality(Species.CHLORIDE_ION))
        .isCloseTo(Demo.chloride(3), within(Demo.chloride(3) * 1e-12));
    // ammonia prefers the steam, so the condensate is less alkaline than the steam's 25 °C
    // composition would be at the same temperature
    double sameComposition = Speciation.solve(steam, w).ph();
    assertThat(liquid.ph()).isLessThan(sameComposition);
  }

  @Test
  void supercriticalSteamHasNoFirstCondensateButKeeps25CResults() {
    Evaluation e = Evaluator.DEFAULT.evaluate(steam(540, 25, AlkalizerMix.AMMONIA), steamSample());
    assertThat(e.operatingPh()).isEmpty();
    assertThat(e.calculatedPh()).isPresent();
    assertThat(e.notes()).singleElement().asString().contains("critical pressure");
  }

  @Test
  void steamAboveTheCriticalTemperatureNeedsItsPressure() {
    Evaluation e =
        Evaluator.DEFAULT.evaluate(steam(540, Double.NaN, AlkalizerMix.AMMONIA), steamSample());
    assertThat(e.operatingPh()).isEmpty();
    assertThat(e.calculatedPh()).isPresent();
    assertThat(e.notes()).singleElement().asString().contains("needs its operating pressure");
  }

  /**
   * By default the amine K_D estimates are off (no published amine K_D was retrieved, so none ships
   * as a default: our decision, steam-seawater-and-high-temperature.md in ../shared/reference): a
   * morpholine-dosed main steam keeps its 25 °C results, gets no pH at temperature, and the note
   * says why and how to opt in.
   */
  @Test
  void morpholineDosedSteamGetsNoPhAtTemperatureByDefault() {
    assertThat(Evaluator.DEFAULT.amineDistributionEstimates()).isFalse();
    assertThat(new Evaluator(IonizationFormulation.R11_24).amineDistributionEstimates()).isFalse();
    Evaluation e =
        Evaluator.DEFAULT.evaluate(
            steam(330, 5, AlkalizerMix.of(Component.MORPHOLINE)), steamSample());
    assertThat(e.operatingPh()).isEmpty();
    assertThat(e.calculatedPh()).isPresent();
    assertThat(e.notes())
        .singleElement()
        .asString()
        .contains("pH at temperature not evaluated")
        .contains("no published vapour-liquid distribution constant for morpholine retrieved")
        .contains("withAmineDistributionEstimates(true)")
        .contains("kwanta.evaluation.amine-distribution-estimates");
  }

  /** The opt-in is a copy: the default evaluator stays off, the formulation is kept. */
  @Test
  void optingInKeepsTheFormulationAndLeavesTheDefaultOff() {
    Evaluator on = new Evaluator(IonizationFormulation.R11_24).withAmineDistributionEstimates(true);
    assertThat(on.amineDistributionEstimates()).isTrue();
    assertThat(on.ionization()).isEqualTo(IonizationFormulation.R11_24);
    assertThat(on.withAmineDistributionEstimates(true)).isSameAs(on);
    assertThat(on.withAmineDistributionEstimates(false).amineDistributionEstimates()).isFalse();
    assertThat(Evaluator.DEFAULT.amineDistributionEstimates()).isFalse();
  }

  /**
   * Issue 16 item 3, opted in: a morpholine-dosed main steam gets the pH of its first condensate,
   * and the notes say that the amine's K_D is an estimate from memory (water.AmineDistribution,
   * shaped to Balakrishnan, Can. J. Chem. 56 (1978) 2620).
   */
  @Test
  void morpholineDosedSteamGetsAnEstimatedPhAtTemperatureWhenOptedIn() {
    Evaluation e =
        Evaluator.DEFAULT
            .withAmineDistributionEstimates(true)
            .evaluate(steam(330, 5, AlkalizerMix.of(Component.MORPHOLINE)), steamSample());
    assertThat(e.calculatedPh()).isPresent();
    assertThat(e.notes()).isEmpty();
    OperatingPh op = e.operatingPh().orElseThrow();
    assertThat(op.basis()).isEqualTo(OperatingPh.Basis.EARLY_CONDENSATE);
    assertThat(op.temperatureK()).isCloseTo(Water.saturationTemperatureK(5e6), within(1e-9));
    assertThat(op.ph()).isGreaterThan(op.neutralPh());
    assertThat(op.notes()).anyMatch(n -> n.contains("K_D(morpholine)") && n.contains("estimated"));
    assertThat(op.notes()).anyMatch(n -> n.contains("this pH at temperature is an estimate"));
    // the estimate's factor of two, carried through the distribution, is stated beside the pH
    String spread =
        op.notes().stream().filter(n -> n.contains("would lie between")).findFirst().orElseThrow();
    Matcher m = Pattern.compile("between (\\d+\\.\\d+) and (\\d+\\.\\d+)").matcher(spread);
    assertThat(m.find()).isTrue();
    assertThat(Double.parseDouble(m.group(1))).isLessThan(op.ph());
    assertThat(Double.parseDouble(m.group(2))).isGreaterThan(op.ph());
  }

  /** The morpholine liquid satisfies its distribution: m(steam) = K_D × m(neutral, liquid). */
  @Test
  void morpholineFirstCondensateSatisfiesTheDistribution() {
    WaterState w = Water.atSaturation(537.09, IonizationFormulation.R11_07);
    double morpholine = 5e-3 / Component.MORPHOLINE.molarMassGPerMol();
    Composition steam =
        Composition.builder()
            .molal(Component.MORPHOLINE, morpholine)
            .molal(Component.CARBON_DIOXIDE, Demo.co2(40))
            .build();
    SpeciationResult liquid =
        EarlyCondensate.of(steam, w, SpeciationOptions.defaults(), true).liquid();
    double k = Distribution.at(VolatileSolute.MORPHOLINE, w.temperatureK()).kD();
    assertThat(k * liquid.molality(Species.MORPHOLINE))
        .isCloseTo(morpholine, within(morpholine * 1e-8));
  }

  /** Without the opt-in the first condensate of an amine-dosed steam is refused. */
  @Test
  void morpholineFirstCondensateIsRefusedWithoutTheOptIn() {
    WaterState w = Water.atSaturation(537.09, IonizationFormulation.R11_07);
    Composition steam =
        Composition.builder()
            .molal(Component.MORPHOLINE, 5e-3 / Component.MORPHOLINE.molarMassGPerMol())
            .build();
    org.assertj.core.api.Assertions.assertThatThrownBy(
            () -> EarlyCondensate.of(steam, w, SpeciationOptions.defaults(), false))
        .isInstanceOf(EarlyCondensate.NoDistributionConstant.class)
        .hasMessageContaining("morpholine");
  }

  /**
   * No weak base is taken as non-volatile in silence: opted in to the estimates, each alkalizer
   * either distributes (its liquid total differs from its steam total and its K_D is in the notes)
   * or is refused with {@link EarlyCondensate.NoDistributionConstant} naming it. The loop covers an
   * amine added later with no distribution constant.
   */
  @Test
  void everyAlkalizerDistributesOrIsRefusedByName() {
    WaterState w = Water.atSaturation(473.15, IonizationFormulation.R11_07);
    for (Component c : AlkalizerMix.alkalizers()) {
      Composition steam = Composition.builder().molal(c, 2e-5).build();
      String name = c.name().toLowerCase(java.util.Locale.ROOT).replace('_', ' ');
      EarlyCondensate.Result r;
      try {
        r = EarlyCondensate.of(steam, w, SpeciationOptions.defaults(), true);
      } catch (EarlyCondensate.NoDistributionConstant e) {
        assertThat(e).as(name).hasMessageContaining(name).hasMessageContaining("published or");
        continue;
      }
      assertThat(r.liquidTotals().molality(c)).as(name).isNotCloseTo(2e-5, within(2e-5 * 1e-6));
      assertThat(r.notes()).as(name).anyMatch(n -> n.startsWith("K_D(" + name + ")"));
    }
  }

  /** Each solute with a distribution constant is named as its component. */
  @Test
  void everyVolatileSoluteIsAComponent() {
    for (VolatileSolute v : VolatileSolute.values()) {
      assertThat(Component.valueOf(v.name())).isNotNull();
    }
  }

  /** An ammonia-only steam says nothing about amine estimates, opted in or not, same pH. */
  @Test
  void ammoniaSteamCarriesNoAmineEstimateNote() {
    Evaluation off = Evaluator.DEFAULT.evaluate(steam(330, 5, AlkalizerMix.AMMONIA), steamSample());
    Evaluation on =
        Evaluator.DEFAULT
            .withAmineDistributionEstimates(true)
            .evaluate(steam(330, 5, AlkalizerMix.AMMONIA), steamSample());
    for (Evaluation e : List.of(off, on)) {
      assertThat(e.operatingPh().orElseThrow().notes())
          .noneMatch(n -> n.contains("this pH at temperature is an estimate"))
          .noneMatch(n -> n.contains("would lie between"));
    }
    assertThat(on.operatingPh().orElseThrow().ph()).isEqualTo(off.operatingPh().orElseThrow().ph());
  }

  /** A liquid point beyond the speciation engine keeps its 25 °C results and says whose limit. */
  @Test
  void liquidBeyondTheEngineKeeps25CResults() {
    SamplePointConfig c =
        SamplePointConfig.of("U1-ECO-IN", Regime.AVT_O, AlkalizerMix.AMMONIA, 673.15, 30e6);
    Evaluation e = Evaluator.DEFAULT.evaluate(c, steamSample());
    assertThat(e.operatingPh()).isEmpty();
    assertThat(e.calculatedPh()).isPresent();
    assertThat(e.notes()).singleElement().asString().contains("673.15 K");
  }
}
