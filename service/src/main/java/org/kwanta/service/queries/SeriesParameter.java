package org.kwanta.service.queries;

import java.util.Arrays;
import java.util.Optional;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.kwanta.model.Parameter;
import org.kwanta.service.ingest.StoredSeries;

/**
 * A parameter a series can be asked for: a measured one (stored readings, canonical unit) or a
 * derived one (a column of the evaluations).
 *
 * @param code API code
 * @param unit UCUM unit of the values
 * @param source where the values are stored
 */
record SeriesParameter(String code, String unit, StoredSeries.Source source) {

  boolean measured() {
    return source.measured();
  }

  static Optional<SeriesParameter> byCode(String code) {
    Optional<Parameter> m = Parameter.byCode(code);
    if (m.isPresent()) {
      return Optional.of(
          new SeriesParameter(code, m.get().unit(), StoredSeries.Source.readings(code)));
    }
    return Arrays.stream(StoredSeries.DerivedColumn.values())
        .filter(d -> d.code().equals(code))
        .findFirst()
        .map(d -> new SeriesParameter(d.code(), d.unit(), StoredSeries.Source.evaluations(d)));
  }

  static String codes() {
    return Stream.concat(
            Arrays.stream(Parameter.values()).map(Parameter::code),
            Arrays.stream(StoredSeries.DerivedColumn.values())
                .map(StoredSeries.DerivedColumn::code))
        .collect(Collectors.joining(", "));
  }
}
