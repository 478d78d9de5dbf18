package org.kwanta.service.system;

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
 * Weak entity tags (RFC 9110 §8.8.1) over an answer's data: the first 144 bits of the SHA-256
 * digest of its JSON. The caller passes the answer without what moves with the clock alone (ages,
 * durations up to now), so that the tag changes with the data and not with the clock; a client
 * asking again with {@code If-None-Match} then gets {@code 304 Not Modified} without a body (Spring
 * answers so for a GET whose {@code ResponseEntity} carries the tag) and counts those on itself.
 */
public final class WeakTags {

  private WeakTags() {}

  /** The weak tag of a value's JSON, quoted as the ETag header carries it. */
  public static String of(JsonMapper mapper, Object value) {
    MessageDigest sha;
    try {
      sha = MessageDigest.getInstance("SHA-256");
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("every Java platform has SHA-256", e);
    }
    try (OutputStream out = new DigestOutputStream(OutputStream.nullOutputStream(), sha)) {
      mapper.writeValue(out, value);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return "W/\""
        + Base64.getUrlEncoder().withoutPadding().encodeToString(Arrays.copyOf(sha.digest(), 18))
        + "\"";
  }
}
