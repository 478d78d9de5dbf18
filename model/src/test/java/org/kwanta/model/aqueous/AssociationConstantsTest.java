package org.kwanta.model.aqueous;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.kwanta.model.Reference;

/**
 * The association constants against values computed from the published coefficients (Mesmer, Baes &
 * Sweeton 1972, Inorg. Chem. 11, 537, Table VI; llnl.dat; Thermoddem V1.10; see the CSV headers):
 * checks of the printed coefficients, not independent published values.
 */
class AssociationConstantsTest {

  @Test
  void polyborateQuotientsMatchMesmer1972AsTabulatedInTheReferenceNotes() {
    for (String[] row : ReferenceCsv.rows("/aqueous/polyborate-quotients.csv")) {
      double t = Double.parseDouble(row[0]) + 273.15;
      assertThat(Association.DIBORATE.log10K(t))
          .isCloseTo(Double.parseDouble(row[1]), within(5e-4));
      assertThat(Association.TRIBORATE.log10K(t))
          .isCloseTo(Double.parseDouble(row[2]), within(5e-4));
      assertThat(Association.TETRABORATE.log10K(t))
          .isCloseTo(Double.parseDouble(row[3]), within(5e-4));
    }
  }

  /**
   * The notes round some values away from the computed ones (NaCl° at 100 °C is −0.4847 here,
   * printed −0.49; NaOH° at 350 °C 2.2349, printed 2.24): 0.006 allows that rounding.
   */
  @Test
  void sodiumPairsMatchLlnlAndThermoddemAsTabulatedInTheReferenceNotes() {
    for (String[] row : ReferenceCsv.rows("/aqueous/sodium-ion-pairs.csv")) {
      double t = Double.parseDouble(row[0]) + 273.15;
      assertThat(Association.SODIUM_HYDROXIDE.log10K(t))
          .as("NaOH° at %s °C", row[0])
          .isCloseTo(Double.parseDouble(row[1]), within(0.006));
      assertThat(Association.SODIUM_CHLORIDE.log10K(t))
          .as("NaCl° at %s °C", row[0])
          .isCloseTo(Double.parseDouble(row[2]), within(0.006));
      assertThat(Association.SODIUM_SULFATE.log10K(t))
          .as("NaSO4- at %s °C", row[0])
          .isCloseTo(Double.parseDouble(row[3]), within(0.006));
    }
  }

  /**
   * NaHPO₄⁻ against the two Thermoddem V1.10 records it is built from (CSV header): the transcribed
   * analytic coefficients reproduce the records' printed 25 °C log_k (−6.340 and −7.212, printed to
   * 3 decimals, so ±0.0006) and the table computed from them.
   */
  @Test
  void sodiumHydrogenPhosphateMatchesTheThermoddemRecords() {
    double t25 = 298.15;
    assertThat(SodiumIonPairs.THERMODDEM_NAHPO4_FORMATION.log10K(t25, Double.NaN))
        .isCloseTo(-6.340, within(6e-4));
    assertThat(SodiumIonPairs.THERMODDEM_DIHYDROGEN_PHOSPHATE.log10K(t25, Double.NaN))
        .isCloseTo(-7.212, within(6e-4));
    for (String[] row : ReferenceCsv.rows("/aqueous/sodium-phosphate-pair.csv")) {
      double t = Double.parseDouble(row[0]) + 273.15;
      assertThat(SodiumIonPairs.THERMODDEM_NAHPO4_FORMATION.log10K(t, Double.NaN))
          .as("formation at %s °C", row[0])
          .isCloseTo(Double.parseDouble(row[1]), within(1e-4));
      assertThat(Association.SODIUM_HYDROGEN_PHOSPHATE.log10K(t))
          .as("NaHPO4- at %s °C", row[0])
          .isCloseTo(Double.parseDouble(row[3]), within(1e-4));
    }
  }

  /**
   * NaHPO₄⁻ is opt-in and says why: estimated confidence, and a stated range of 0-100 °C beyond
   * which it is marked extrapolated.
   */
  @Test
  void sodiumHydrogenPhosphateIsOptInWithItsConfidenceStated() {
    Association a = Association.SODIUM_HYDROGEN_PHOSPHATE;
    assertThat(SpeciationOptions.DEFAULT_ASSOCIATIONS).doesNotContain(a);
    assertThat(SpeciationOptions.ALL_ASSOCIATIONS).contains(a);
    assertThat(SpeciationOptions.defaults().associations()).doesNotContain(a);
    assertThat(a.reference().confidence()).isEqualTo(Reference.Confidence.ESTIMATED);
    assertThat(a.validity().min()).isEqualTo(273.15);
    assertThat(a.validity().max()).isEqualTo(373.15);
    assertThat(a.formed().countOf(Component.PHOSPHATE)).isEqualTo(1);
    assertThat(a.formed().countOf(Component.SODIUM)).isEqualTo(1);
    assertThat(a.formed().chargeNumber()).isEqualTo(-1);
  }

  @Test
  void statesEachFitsRangeAndSource() {
    assertThat(Association.DIBORATE.validity().min()).isEqualTo(323.15);
    assertThat(Association.DIBORATE.validity().max()).isEqualTo(473.15);
    assertThat(Association.SODIUM_CHLORIDE.validity().max()).isEqualTo(573.15);
    for (Association a : Association.values()) {
      assertThat(a.reference().citation()).isNotBlank();
      assertThat(a.formed().isAssociated()).isTrue();
      assertThat(a.formed().component().species()).doesNotContain(a.formed());
    }
  }
}
