package org.kwanta.service.chemistry;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.kwanta.service.system.ProblemException;
import org.kwanta.service.system.ProblemTypes;
import org.springframework.http.HttpStatus;
import org.springframework.stereotype.Component;
import tools.jackson.core.JacksonException;
import tools.jackson.databind.DeserializationFeature;
import tools.jackson.databind.exc.UnrecognizedPropertyException;
import tools.jackson.databind.json.JsonMapper;

/**
 * Reads calculation requests with unknown fields refused: a misspelt option ({@code
 * "temperatureC"}, {@code "activitymodel"}) must not silently fall back to a default. The
 * application's mapper ignores unknown fields, so this reader is derived from it with that one
 * setting changed. Every parse error is a 400 naming the field.
 */
@Component
class StrictJson {

  private final JsonMapper mapper;

  StrictJson(JsonMapper json) {
    this.mapper =
        json.rebuild()
            .enable(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES)
            .enable(DeserializationFeature.FAIL_ON_TRAILING_TOKENS)
            .build();
  }

  <T> T read(String body, Class<T> type) {
    if (body == null || body.isBlank()) {
      throw ProblemException.of("request body is required (JSON)");
    }
    try {
      return mapper.readValue(body, type);
    } catch (UnrecognizedPropertyException e) {
      Map<String, Object> props = new LinkedHashMap<>();
      props.put("field", path(e));
      props.put(
          "knownFields",
          e.getKnownPropertyIds() == null
              ? List.of()
              : e.getKnownPropertyIds().stream().map(String::valueOf).sorted().toList());
      throw new ProblemException(
          HttpStatus.BAD_REQUEST,
          ProblemTypes.BAD_REQUEST,
          "Unknown field",
          "unknown field '" + path(e) + "'",
          props);
    } catch (JacksonException e) {
      String where = path(e);
      throw ProblemException.of(
          "malformed JSON"
              + (where.isEmpty() ? "" : " at '" + where + "'")
              + ": "
              + e.getOriginalMessage());
    }
  }

  private static String path(JacksonException e) {
    StringBuilder sb = new StringBuilder();
    for (JacksonException.Reference r : e.getPath()) {
      if (r.getPropertyName() != null) {
        if (!sb.isEmpty()) {
          sb.append('.');
        }
        sb.append(r.getPropertyName());
      } else if (r.getIndex() >= 0) {
        sb.append('[').append(r.getIndex()).append(']');
      }
    }
    return sb.toString();
  }
}
