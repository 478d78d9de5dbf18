package org.kwanta.model.conductivity;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.kwanta.model.OutOfValidityRangeException;
import org.kwanta.model.aqueous.Component;
import org.kwanta.model.aqueous.Species;

/**
 * Forward conductivity: the ASTM tables (sources and tolerances in the CSV headers), and the shares
 * adding up to the channel (internal consistency).
 */
class ForwardConductivityTest {

  private static final double T25 = 298.15;

  /** Density of water at 25 °C, kg/L (IAPWS-IF97 region 1 at 0.101325 MPa), for mg/L → mol/kg. */
  private static final double RHO25 = 0.997047;

  private static final double NAOH_G_PER_MOL = 39.997;
  private static final double CO2_G_PER_MOL = 44.009;

  /** ASTM D5128 Table 1: NaOH in pure water, conductivity and pH at 25 °C. */
  @Test
  void sodiumHydroxideMatchesAstmD5128Table1() {
    for (double[] row : CsvRows.read("/conductivity/astm-d5128-table1-naoh.csv")) {
      double molal = row[0] / NAOH_G_PER_MOL / 1000 / RHO25;
      ForwardConductivity.Channels c =
          ForwardConductivity.of(new Solutes(0, molal, 0, 0, 0, 0), AlkalizerMix.AMMONIA, T25);
      double tol = Math.max(0.015 * row[1], 0.0005);
      assertThat(c.specific().kappa()).as("NaOH %s mg/L", row[0]).isCloseTo(row[1], within(tol));
      assertThat(c.specific().solution().pH())
          .as("pH, %s mg/L", row[0])
          .isCloseTo(row[2], within(0.02));
      // after the cation exchanger NaOH is water
      assertThat(c.cation().kappa()).isCloseTo(c.cation().solution().kappa(), within(0.0));
      assertThat(c.cation().kappa()).isCloseTo(0.0550, within(0.0005));
    }
  }

  /** ASTM D4519 Table 2: carbon dioxide after the cation column, 25 °C. */
  @Test
  void carbonDioxideMatchesAstmD4519Table2() {
    for (double[] row : CsvRows.read("/conductivity/astm-d4519-table2-co2.csv")) {
      double molal = row[0] / CO2_G_PER_MOL / 1000 / RHO25;
      // an ammonia-treated water with that CO2: the cation channel sees carbonic acid alone
      ForwardConductivity.Channels c =
          ForwardConductivity.of(new Solutes(1e-5, 0, 0, 0, molal, 0), AlkalizerMix.AMMONIA, T25);
      double tol = Math.max(0.01, 0.03 * row[1]);
      assertThat(c.cation().kappa()).as("CO2 %s mg/L", row[0]).isCloseTo(row[1], within(tol));
      // an ideal degasser removes it
      assertThat(c.degassedCation().kappa()).isCloseTo(0.0550, within(0.0005));
    }
  }

  /**
   * The ions' shares add up to the channel's conductivity, at 25 °C and at a sample temperature.
   */
  @ParameterizedTest
  @CsvSource({"298.15", "313.15", "283.15", "363.15"})
  void sharesAddUpToTheChannel(double tK) {
    AlkalizerMix mix =
        AlkalizerMix.byMass(java.util.Map.of(Component.AMMONIA, 0.7, Component.ETHANOLAMINE, 0.3));
    Solutes s = new Solutes(5e-5, 2e-7, 3e-7, 1e-7, 4e-7, 2e-7);
    ForwardConductivity.Channels c = ForwardConductivity.of(s, mix, tK);
    for (ForwardConductivity.Channel ch :
        new ForwardConductivity.Channel[] {c.specific(), c.cation(), c.degassedCation()}) {
      double sum =
          ch.contributions().stream().mapToDouble(ForwardConductivity.Contribution::kappa).sum();
      assertThat(sum).isCloseTo(ch.kappa(), within(ch.kappa() * 1e-8));
    }
    assertThat(c.specific().contributions().get(0).ion()).isIn(Species.AMMONIUM, Species.HYDROXIDE);
    assertThat(c.cation().contributions().get(0).ion()).isEqualTo(Species.HYDROGEN_ION);
    assertThat(c.cation().kappa()).isGreaterThan(c.degassedCation().kappa());
  }

  /** The channels are the solution model's solutions (what the evaluation inverts). */
  @Test
  void channelsAreTheSolutionModels() {
    Solutes s = new Solutes(1e-4, 0, 2e-7, 0, 5e-7, 0);
    ForwardConductivity.Channels c = ForwardConductivity.of(s, AlkalizerMix.AMMONIA, T25);
    var w =
        org.kwanta.model.water.Water.at(
            T25,
            org.kwanta.model.water.Water.ATMOSPHERIC_PRESSURE_PA,
            org.kwanta.model.water.IonizationFormulation.R11_07);
    SolutionModel m = new SolutionModel(Conductivity.at(w), Equilibria.of(w), AlkalizerMix.AMMONIA);
    assertThat(c.specific().kappa()).isCloseTo(m.solve(s).kappa(), within(1e-9));
    assertThat(c.cation().kappa())
        .isCloseTo(m.solve(new Solutes(0, 0, 2e-7, 0, 5e-7, 0)).kappa(), within(1e-9));
    assertThat(c.degassedCation().kappa())
        .isCloseTo(m.solve(new Solutes(0, 0, 2e-7, 0, 0, 0)).kappa(), within(1e-9));
  }

  @Test
  void rejectsTemperatureAboveTheModel() {
    assertThatThrownBy(() -> ForwardConductivity.of(Solutes.NONE, AlkalizerMix.AMMONIA, 380))
        .isInstanceOf(OutOfValidityRangeException.class);
  }
}
