package org.kwanta.service.system;

import java.net.URI;
import java.util.Map;
import org.springframework.http.HttpStatus;

/**
 * A request the service refuses, answered as a problem detail (RFC 9457) of any 4xx status (400,
 * 403, 404, 409, 422...), with the problem type, title and any extra properties for the body.
 */
public class ProblemException extends RuntimeException {

  private static final long serialVersionUID = 1L;

  private final HttpStatus status;
  private final URI type;
  private final String title;
  private final transient Map<String, Object> properties;

  public ProblemException(
      HttpStatus status, URI type, String title, String detail, Map<String, Object> properties) {
    super(detail);
    this.status = status;
    this.type = type;
    this.title = title;
    this.properties = Map.copyOf(properties);
  }

  /** 404: no {@code what} (e.g. "sample point") with that id. */
  public static ProblemException notFound(String what, String id) {
    return new ProblemException(
        HttpStatus.NOT_FOUND,
        ProblemTypes.NOT_FOUND,
        "Not found",
        "No " + what + " with id '" + id + "'",
        Map.of());
  }

  /** 400 with the generic bad-request type. */
  public static ProblemException of(String detail) {
    return new ProblemException(
        HttpStatus.BAD_REQUEST, ProblemTypes.BAD_REQUEST, "Bad request", detail, Map.of());
  }

  public HttpStatus status() {
    return status;
  }

  public URI type() {
    return type;
  }

  public String title() {
    return title;
  }

  public Map<String, Object> properties() {
    return properties;
  }
}
