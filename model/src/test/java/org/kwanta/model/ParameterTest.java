package org.kwanta.model;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import org.junit.jupiter.api.Test;

/** The parameter catalogue: one list, one unit per parameter, and the subsets derived from it. */
class ParameterTest {

  @Test
  void engineReadsTheFiveAnalysersItJudges() {
    assertThat(Parameter.engine())
        .containsExactly(
            Parameter.SPECIFIC_CONDUCTIVITY,
            Parameter.CATION_CONDUCTIVITY,
            Parameter.DEGASSED_CATION_CONDUCTIVITY,
            Parameter.PH,
            Parameter.SODIUM);
    Parameter.engine().forEach(p -> assertThat(p.instrument()).isPresent());
  }

  @Test
  void limitsTakeTheAnalysedSpeciesButNotTheSampleTemperatureNorTheLabOnlyParameters() {
    assertThat(Parameter.limited()).hasSize(Parameter.values().length - 16);
    assertThat(Parameter.limited())
        .doesNotContain(
            Parameter.SAMPLE_TEMPERATURE,
            Parameter.AMMONIA,
            Parameter.REDUCING_AGENT,
            Parameter.TOC,
            Parameter.ORP,
            Parameter.IRON_DISSOLVED);
    assertThat(Parameter.limited()).noneMatch(Parameter::isProcessValue);
    assertThatThrownBy(() -> Parameter.limitedOfCode("sample_temperature"))
        .hasMessageContaining("Unknown parameter 'sample_temperature'");
  }

  @Test
  void unitsAreUcumCodes() {
    // UCUM writes pH as the arbitrary unit [pH] and degrees Celsius as Cel (UCUM, c.s. codes)
    assertThat(Parameter.PH.unit()).isEqualTo("[pH]");
    assertThat(Parameter.PH.symbol()).isEqualTo("pH");
    assertThat(Parameter.SAMPLE_TEMPERATURE.unit()).isEqualTo("Cel");
    assertThat(Parameter.CATION_CONDUCTIVITY.unit()).isEqualTo("uS/cm");
    // process values: UCUM MW, MPa, kg/s; a dimensionless code as the annotation {state}
    assertThat(Parameter.LOAD.unit()).isEqualTo("MW");
    assertThat(Parameter.DRUM_PRESSURE.unit()).isEqualTo("MPa");
    assertThat(Parameter.MAKE_UP_FLOW.unit()).isEqualTo("kg/s");
    assertThat(Parameter.OPERATING_STATE.unit()).isEqualTo("{state}");
  }

  @Test
  void codesAreLowerSnakeCaseAndRoundTrip() {
    for (Parameter p : Parameter.values()) {
      assertThat(p.code()).matches("[a-z_]+");
      assertThat(Parameter.ofCode(p.code())).isEqualTo(p);
      assertThat(p.min()).isLessThan(p.max());
    }
    assertThat(Parameter.byCode("turbidity")).isEmpty();
  }

  @Test
  void processValuesAreTheSixHistorianParameters() {
    assertThat(java.util.Arrays.stream(Parameter.values()).filter(Parameter::isProcessValue))
        .containsExactly(
            Parameter.LOAD,
            Parameter.DRUM_PRESSURE,
            Parameter.FEEDWATER_FLOW,
            Parameter.STEAM_FLOW,
            Parameter.MAKE_UP_FLOW,
            Parameter.OPERATING_STATE);
  }
}
