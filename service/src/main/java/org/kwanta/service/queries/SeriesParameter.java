package org.kwanta.service.queries;

import java.util.Arrays;
import java.util.Locale;
import java.util.Optional;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.kwanta.service.ingest.MeasuredParameter;

/**
 * A parameter a series can be asked for: a measured one (stored readings, canonical unit) or a
 * derived one (a column of the evaluations).
 *
 * @param code API code
 * @param unit UCUM unit of the values
 * @param table {@code reading} or {@code evaluation}
 * @param column the value column
 */
record SeriesParameter(String code, String unit, String table, String column) {

  enum Derived {
    SPECIFIC_CONDUCTIVITY_25("uS/cm"),
    CATION_CONDUCTIVITY_25("uS/cm"),
    DEGASSED_CATION_CONDUCTIVITY_25("uS/cm"),
    CALCULATED_PH_25("[pH]"),
    PH_AT_TEMPERATURE("[pH]"),
    PH_AT_TEMPERATURE_LOW("[pH]"),
    PH_AT_TEMPERATURE_HIGH("[pH]"),
    NEUTRAL_PH_AT_TEMPERATURE("[pH]");

    final String unit;

    Derived(String unit) {
      this.unit = unit;
    }

    String code() {
      return name().toLowerCase(Locale.ROOT);
    }
  }

  boolean measured() {
    return "reading".equals(table);
  }

  static Optional<SeriesParameter> byCode(String code) {
    Optional<MeasuredParameter> m = MeasuredParameter.byCode(code);
    if (m.isPresent()) {
      return Optional.of(new SeriesParameter(code, m.get().canonicalUnit(), "reading", "value"));
    }
    return Arrays.stream(Derived.values())
        .filter(d -> d.code().equals(code))
        .findFirst()
        .map(d -> new SeriesParameter(d.code(), d.unit, "evaluation", d.code()));
  }

  static String codes() {
    return Stream.concat(
            Arrays.stream(MeasuredParameter.values()).map(MeasuredParameter::code),
            Arrays.stream(Derived.values()).map(Derived::code))
        .collect(Collectors.joining(", "));
  }
}
