package org.kwanta.model.aqueous;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;

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
