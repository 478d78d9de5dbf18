package org.kwanta.service.system;

import java.net.URI;

/**
 * Stable problem {@code type} URIs (RFC 9457). They are URNs: identifiers, not links; the README
 * lists them.
 */
public final class ProblemTypes {

  public static final URI BAD_REQUEST = of("bad-request");
  public static final URI UNAUTHORIZED = of("unauthorized");
  public static final URI FORBIDDEN = of("forbidden");
  public static final URI NOT_FOUND = of("not-found");
  public static final URI METHOD_NOT_ALLOWED = of("method-not-allowed");
  public static final URI NOT_ACCEPTABLE = of("not-acceptable");
  public static final URI UNSUPPORTED_MEDIA_TYPE = of("unsupported-media-type");
  public static final URI PAYLOAD_TOO_LARGE = of("payload-too-large");
  public static final URI OUT_OF_VALIDITY_RANGE = of("out-of-validity-range");
  public static final URI NO_CONVERGENCE = of("no-convergence");
  public static final URI VALIDATION = of("validation");
  public static final URI INVALID_READINGS = of("invalid-readings");
  public static final URI CONFLICT = of("conflict");
  public static final URI TOO_MANY_NEW_DAYS = of("too-many-new-days");
  public static final URI TOO_MANY_REQUESTS = of("too-many-requests");
  public static final URI REQUEST_TIMEOUT = of("request-timeout");
  public static final URI SERVICE_UNAVAILABLE = of("service-unavailable");
  public static final URI DATABASE_UNAVAILABLE = of("database-unavailable");
  public static final URI INTERNAL = of("internal-error");

  private ProblemTypes() {}

  private static URI of(String slug) {
    return URI.create("urn:kwanta:problem:" + slug);
  }

  /** The type for an HTTP status when no more specific type applies. */
  public static URI forStatus(int status) {
    return switch (status) {
      case 400 -> BAD_REQUEST;
      case 401 -> UNAUTHORIZED;
      case 403 -> FORBIDDEN;
      case 404 -> NOT_FOUND;
      case 405 -> METHOD_NOT_ALLOWED;
      case 406 -> NOT_ACCEPTABLE;
      case 409 -> CONFLICT;
      case 413 -> PAYLOAD_TOO_LARGE;
      case 415 -> UNSUPPORTED_MEDIA_TYPE;
      case 422 -> VALIDATION;
      case 429 -> TOO_MANY_REQUESTS;
      case 503 -> SERVICE_UNAVAILABLE;
      default -> status >= 500 ? INTERNAL : BAD_REQUEST;
    };
  }
}
