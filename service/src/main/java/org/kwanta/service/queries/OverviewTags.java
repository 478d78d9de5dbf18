package org.kwanta.service.queries;

import java.io.IOException;
import java.io.OutputStream;
import java.io.UncheckedIOException;
import java.security.DigestOutputStream;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.Arrays;
import java.util.Base64;
import tools.jackson.databind.json.JsonMapper;

/**
 * The weak entity tag of a plant's overview: a SHA-256 digest of its JSON without the fields that
 * only count time from the moment of the request ({@code asOf}, each {@code ageSeconds}, a point's
 * {@code levelsAsOf}). The tag thus changes with the data (a reading, an evaluation, a level, a
 * finding, a limit) and not with the clock, and a board asking again with {@code If-None-Match}
 * gets {@code 304 Not Modified} without a body while nothing changed. A client keeping its copy
 * counts the ages on from its own clock. Weak (RFC 9110 §8.8.1): the two answers are equivalent,
 * not byte for byte the same.
 */
final class OverviewTags {

  private OverviewTags() {}

  static String of(JsonMapper mapper, StateController.Overview overview) {
    StateController.Overview timeless =
        new StateController.Overview(
            overview.plant(),
            overview.name(),
            null,
            overview.samplePoints().stream().map(OverviewTags::timeless).toList());
    MessageDigest sha;
    try {
      sha = MessageDigest.getInstance("SHA-256");
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("every Java platform has SHA-256", e);
    }
    try (OutputStream out = new DigestOutputStream(OutputStream.nullOutputStream(), sha)) {
      mapper.writeValue(out, timeless);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return "W/\""
        + Base64.getUrlEncoder().withoutPadding().encodeToString(Arrays.copyOf(sha.digest(), 18))
        + "\"";
  }

  private static States.State timeless(States.State s) {
    return new States.State(
        s.samplePoint(),
        s.name(),
        s.cycleLocation(),
        s.treatmentRegime(),
        null,
        s.readings().stream()
            .map(
                r ->
                    new States.Latest(
                        r.parameter(),
                        r.unit(),
                        r.time(),
                        0,
                        r.value(),
                        r.quality(),
                        r.sampleTemperatureCel(),
                        r.compensated()))
            .toList(),
        s.levels(),
        null,
        s.evaluation() == null
            ? null
            : new States.LatestEvaluation(s.evaluation().time(), 0, s.evaluation().evaluation()),
        s.diagnosis());
  }
}
