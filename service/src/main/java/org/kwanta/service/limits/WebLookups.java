package org.kwanta.service.limits;

import java.util.Map;
import org.kwanta.model.Parameter;
import org.kwanta.service.system.ProblemException;
import org.kwanta.service.system.ProblemTypes;
import org.springframework.http.HttpStatus;

/** Request-parameter lookups shared by the limits and excursions controllers. */
final class WebLookups {

  private WebLookups() {}

  static ProblemException notFound(String detail) {
    return new ProblemException(
        HttpStatus.NOT_FOUND, ProblemTypes.NOT_FOUND, "Not found", detail, Map.of());
  }

  static Limits.Point point(Limits limits, String id) {
    return limits.points(null, id).stream()
        .findFirst()
        .orElseThrow(() -> notFound("No sample point '" + id + "'"));
  }

  static Parameter parameter(String code) {
    try {
      return Parameter.limitedOfCode(code);
    } catch (IllegalArgumentException e) {
      throw ProblemException.of(e.getMessage());
    }
  }
}
