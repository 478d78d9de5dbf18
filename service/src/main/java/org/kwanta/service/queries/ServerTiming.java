package org.kwanta.service.queries;

import java.util.Locale;

/**
 * The stages of one request's server time, for the {@code Server-Timing} response header (W3C
 * Server Timing): each {@link #lap} closes a stage at the time since the previous one, in
 * milliseconds. The board's load script reads it (docs/page.md#performance); a browser's developer
 * tools show it beside the request. Not thread-safe: one request, one thread.
 */
final class ServerTiming {

  private final StringBuilder header = new StringBuilder();
  private long last = System.nanoTime();

  /** Closes the stage that ran since the previous lap (or the start). */
  void lap(String stage) {
    long now = System.nanoTime();
    if (!header.isEmpty()) {
      header.append(", ");
    }
    header
        .append(stage)
        .append(";dur=")
        .append(String.format(Locale.ROOT, "%.1f", (now - last) / 1e6));
    last = now;
  }

  /** The header's value. */
  String header() {
    return header.toString();
  }
}
