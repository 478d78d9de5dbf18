package org.kwanta.model.limits;

import static org.assertj.core.api.Assertions.assertThat;

import org.junit.jupiter.api.Test;

/** Regimes are written in their trade form; older spellings still find the same regime. */
class TreatmentRegimeTest {

  @Test
  void tradeFormIsTheCode() {
    assertThat(TreatmentRegime.AVT_R.code()).isEqualTo("AVT(R)");
    assertThat(TreatmentRegime.AVT_O.code()).isEqualTo("AVT(O)");
    assertThat(TreatmentRegime.OT.code()).isEqualTo("OT");
    assertThat(TreatmentRegime.PT.code()).isEqualTo("PT");
    assertThat(TreatmentRegime.CT.code()).isEqualTo("CT");
    assertThat(TreatmentRegime.MAKE_UP.code()).isEqualTo("MAKE_UP");
  }

  @Test
  void readsTheTradeFormAndTheOlderSpellings() {
    for (TreatmentRegime r : TreatmentRegime.values()) {
      assertThat(TreatmentRegime.ofCode(r.code())).contains(r);
      assertThat(TreatmentRegime.ofCode(r.name())).contains(r);
    }
    assertThat(TreatmentRegime.ofCode(" avt(o) ")).contains(TreatmentRegime.AVT_O);
    assertThat(TreatmentRegime.ofCode("PHOSPHATE")).contains(TreatmentRegime.PT);
    assertThat(TreatmentRegime.canonical("AVT_O")).isEqualTo("AVT(O)");
    assertThat(TreatmentRegime.ofCode("AVT")).isEmpty();
    assertThat(TreatmentRegime.ofCode(null)).isEmpty();
  }
}
