package org.kwanta.service.system;

import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import java.net.URI;
import java.time.Duration;
import org.springframework.http.HttpHeaders;
import org.springframework.http.HttpStatus;
import org.springframework.http.HttpStatusCode;
import org.springframework.http.MediaType;
import org.springframework.http.ProblemDetail;
import org.springframework.stereotype.Component;
import tools.jackson.databind.json.JsonMapper;

/**
 * Writes a problem-details body from a servlet filter, before Spring MVC is reached (keys,
 * concurrency and body-size limits), in the same form as {@link ProblemHandler}.
 */
@Component
public class ProblemResponses {

  private final JsonMapper json;

  ProblemResponses(JsonMapper json) {
    this.json = json;
  }

  /** A problem for this status, type, title and detail, with the request path as instance. */
  public static ProblemDetail problem(
      HttpStatus status, URI type, String title, String detail, HttpServletRequest request) {
    ProblemDetail problem = ProblemDetail.forStatusAndDetail(status, detail);
    problem.setType(type);
    problem.setTitle(title);
    if (request != null) {
      problem.setInstance(URI.create(request.getRequestURI().replace(" ", "%20")));
    }
    return problem;
  }

  /**
   * Writes the problem.
   *
   * @param retryAfter the Retry-After header in whole seconds, or null for none
   */
  public void write(HttpServletResponse response, ProblemDetail problem, Duration retryAfter)
      throws IOException {
    if (response.isCommitted()) {
      return;
    }
    response.resetBuffer();
    response.setStatus(problem.getStatus());
    response.setContentType(MediaType.APPLICATION_PROBLEM_JSON_VALUE);
    if (retryAfter != null) {
      response.setHeader(HttpHeaders.RETRY_AFTER, Long.toString(retryAfterSeconds(retryAfter)));
    }
    json.writeValue(response.getOutputStream(), problem);
  }

  /**
   * The title for a status in the house style, sentence case: "Not found", "Method not allowed"
   * (Spring's reason phrases are title case).
   */
  public static String title(HttpStatusCode status) {
    HttpStatus known = HttpStatus.resolve(status.value());
    if (known == null) {
      return "Error " + status.value();
    }
    String phrase = known.getReasonPhrase();
    return phrase.charAt(0) + phrase.substring(1).toLowerCase(java.util.Locale.ROOT);
  }

  static long retryAfterSeconds(Duration retryAfter) {
    return Math.max(1, (retryAfter.toMillis() + 999) / 1000);
  }
}
