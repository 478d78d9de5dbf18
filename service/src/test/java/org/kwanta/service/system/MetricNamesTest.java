package org.kwanta.service.system;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.kwanta.model.Parameter;

/**
 * One unit per metric name, the unit in the name: the latest values and the limit thresholds are
 * split by the parameters' canonical units, every parameter of the catalogue has its metric, and no
 * metric carries parameters of two units.
 */
class MetricNamesTest {

  @Test
  void everyParameterHasTheValueMetricOfItsUnit() {
    for (Parameter p : Parameter.values()) {
      MetricNames.Metric metric = MetricNames.sampleValue(p);
      assertThat(metric.prometheusName())
          .as(p.code())
          .isEqualTo(MetricNames.SAMPLE_VALUE_PREFIX + MetricNames.UNIT_IN_NAME.get(p.unit()));
      assertThat(metric.labels()).as(p.code()).contains(MetricNames.PARAMETER);
    }
  }

  @Test
  void everyLimitedParameterHasTheThresholdMetricOfItsUnitAndNoOtherHasOne() {
    for (Parameter p : Parameter.values()) {
      if (p.usedByLimits()) {
        assertThat(MetricNames.limitThreshold(p).prometheusName())
            .as(p.code())
            .isEqualTo(MetricNames.LIMIT_THRESHOLD_PREFIX + MetricNames.UNIT_IN_NAME.get(p.unit()));
      } else {
        assertThatThrownBy(() -> MetricNames.limitThreshold(p))
            .as(p.code())
            .isInstanceOf(IllegalArgumentException.class);
      }
    }
  }

  @Test
  void eachMetricSplitByUnitCarriesParametersOfOneUnitOnly() {
    for (List<MetricNames.PerUnit> split :
        List.of(MetricNames.SAMPLE_VALUES, MetricNames.LIMIT_THRESHOLDS)) {
      Set<String> units = new HashSet<>();
      for (MetricNames.PerUnit m : split) {
        assertThat(m.parameters()).as(m.metric().prometheusName()).isNotEmpty();
        assertThat(m.parameters())
            .as(m.metric().prometheusName())
            .allSatisfy(p -> assertThat(p.unit()).isEqualTo(m.unit()));
        assertThat(units.add(m.unit())).as("one metric per unit: " + m.unit()).isTrue();
      }
    }
    // the same parameters, once each
    assertThat(MetricNames.SAMPLE_VALUES.stream().flatMap(m -> m.parameters().stream()).toList())
        .containsExactlyInAnyOrder(Parameter.values());
    assertThat(MetricNames.LIMIT_THRESHOLDS.stream().flatMap(m -> m.parameters().stream()).toList())
        .containsExactlyInAnyOrderElementsOf(Parameter.limited());
  }

  @Test
  void theUnitsInNamesAreDistinctAndSpelledAsPrometheusNamesAre() {
    assertThat(new HashSet<>(MetricNames.UNIT_IN_NAME.values()))
        .hasSameSizeAs(MetricNames.UNIT_IN_NAME.values());
    assertThat(MetricNames.UNIT_IN_NAME.values()).allMatch(w -> w.matches("[a-z]+(_[a-z]+)*"));
    // every unit listed is the canonical unit of some parameter (no stale entry)
    Set<String> canonical = new HashSet<>();
    for (Parameter p : Parameter.values()) {
      canonical.add(p.unit());
    }
    assertThat(canonical).containsExactlyInAnyOrderElementsOf(MetricNames.UNIT_IN_NAME.keySet());
  }

  @Test
  void theExpectedNamesOfTheCatalogueTodayAndNoOldName() {
    assertThat(MetricNames.exposedNames())
        .contains(
            "kwanta_sample_conductivity_microsiemens_per_centimetre",
            "kwanta_sample_concentration_micrograms_per_kilogram",
            "kwanta_sample_ph",
            "kwanta_sample_temperature_celsius",
            "kwanta_sample_potential_millivolts",
            "kwanta_sample_power_megawatts",
            "kwanta_sample_pressure_megapascals",
            "kwanta_sample_mass_flow_kilograms_per_second",
            "kwanta_sample_state_code",
            "kwanta_limit_threshold_conductivity_microsiemens_per_centimetre",
            "kwanta_limit_threshold_concentration_micrograms_per_kilogram",
            "kwanta_limit_threshold_ph")
        .doesNotContain("kwanta_sample_value", "kwanta_limit_threshold");
  }

  @Test
  void theMetricsSectionOfTheLimitsDocNamesEveryMetricAndNoRemovedOne() throws Exception {
    String doc =
        java.nio.file.Files.readString(
            java.nio.file.Path.of("..").toAbsolutePath().normalize().resolve("docs/limits.md"));
    for (MetricNames.Metric m : MetricNames.METRICS) {
      assertThat(doc).contains("`" + m.prometheusName() + "`");
    }
    // the removed names appear only where the doc says what replaced them
    assertThat(doc.split("`kwanta_sample_value`", -1)).hasSize(2);
    assertThat(doc.split("`kwanta_limit_threshold`", -1)).hasSize(2);
  }

  @Test
  void prometheusNamesAreUniqueAndMicrometerNamesMapToThem() {
    Set<String> names = new HashSet<>();
    for (MetricNames.Metric m : MetricNames.METRICS) {
      assertThat(names.add(m.prometheusName())).as(m.prometheusName()).isTrue();
      assertThat(m.prometheusName()).matches("kwanta_[a-z_]+");
      assertThat(m.labels()).allMatch(l -> l.matches("[a-z]+(_[a-z]+)*"));
    }
    for (List<MetricNames.PerUnit> split :
        List.of(MetricNames.SAMPLE_VALUES, MetricNames.LIMIT_THRESHOLDS)) {
      for (MetricNames.PerUnit m : split) {
        assertThat(m.metric().micrometerName().replace('.', '_'))
            .isEqualTo(m.metric().prometheusName());
        assertThat(m.metric().help()).contains(m.unit());
      }
    }
  }
}
