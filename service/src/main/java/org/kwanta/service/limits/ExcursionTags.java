package org.kwanta.service.limits;

import java.util.List;
import org.kwanta.service.system.WeakTags;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.node.ObjectNode;

/**
 * The weak entity tag of an excursion list ({@link WeakTags}): its JSON without what a running
 * excursion counts up to now ({@code durationSeconds}, {@code timeRemainingSeconds}, {@code
 * inServiceSeconds}). Everything else changes the tag: a new sample in a running excursion, its
 * end, a new acknowledgement, the allowance passing ({@code allowanceExceeded}). A client keeping
 * its copy on 304 counts the duration up and the time remaining down on its own clock.
 */
final class ExcursionTags {

  /** The fields of an open excursion that move with the clock alone. */
  static final List<String> MOVING =
      List.of("durationSeconds", "timeRemainingSeconds", "inServiceSeconds");

  private ExcursionTags() {}

  static String of(JsonMapper mapper, List<ExcursionResponse> rows) {
    JsonNode tree = mapper.valueToTree(rows);
    for (JsonNode row : tree) {
      if (row.path("open").asBoolean(false)) {
        ((ObjectNode) row).remove(MOVING);
      }
    }
    return WeakTags.of(mapper, tree);
  }
}
