package org.kwanta.service.system;

import java.io.IOException;

/** A request body longer than its limit ({@link HttpLimitsProperties}); answered 413. */
public class PayloadTooLargeException extends IOException {

  private static final long serialVersionUID = 1L;

  private final long limitBytes;

  public PayloadTooLargeException(long limitBytes) {
    super("The request body exceeds the limit of " + limitBytes + " bytes for this endpoint.");
    this.limitBytes = limitBytes;
  }

  public long limitBytes() {
    return limitBytes;
  }

  /** The first PayloadTooLargeException in the cause chain, or null. */
  static PayloadTooLargeException in(Throwable e) {
    for (Throwable t = e; t != null; t = t.getCause() == t ? null : t.getCause()) {
      if (t instanceof PayloadTooLargeException p) {
        return p;
      }
    }
    return null;
  }
}
