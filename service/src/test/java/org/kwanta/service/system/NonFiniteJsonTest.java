package org.kwanta.service.system;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Map;
import org.junit.jupiter.api.Test;
import tools.jackson.databind.json.JsonMapper;

/** The application's mapper writes every non-finite double as null: JSON has no NaN. */
class NonFiniteJsonTest {

  record Values(double a, Double b, double c, double d) {}

  @Test
  void nanAndInfinityAreWrittenAsNull() {
    JsonMapper json = JsonMapper.builder().addModule(JsonConfiguration.nonFiniteAsNull()).build();
    String out =
        json.writeValueAsString(new Values(Double.NaN, Double.NaN, Double.POSITIVE_INFINITY, 1.5));
    assertThat(out).isEqualTo("{\"a\":null,\"b\":null,\"c\":null,\"d\":1.5}");
    assertThat(json.writeValueAsString(Map.of("x", Double.NaN))).isEqualTo("{\"x\":null}");
  }
}
