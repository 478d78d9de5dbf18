package org.kwanta.service.security;

import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import org.kwanta.service.system.DatabaseOutage;
import org.kwanta.service.system.ProblemResponses;
import org.kwanta.service.system.ProblemTypes;
import org.springframework.http.HttpHeaders;
import org.springframework.http.HttpStatus;
import org.springframework.security.access.AccessDeniedException;
import org.springframework.security.core.Authentication;
import org.springframework.security.core.AuthenticationException;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.security.web.AuthenticationEntryPoint;
import org.springframework.security.web.access.AccessDeniedHandler;

/**
 * 401 (no valid key) and 403 (the key's role does not allow this) as problem details; 503 when the
 * key could not be checked because the database is unreachable.
 */
final class ProblemEntryPoint implements AuthenticationEntryPoint, AccessDeniedHandler {

  private final ProblemResponses problems;
  private final DatabaseOutage outage;

  ProblemEntryPoint(ProblemResponses problems, DatabaseOutage outage) {
    this.problems = problems;
    this.outage = outage;
  }

  @Override
  public void commence(
      HttpServletRequest request, HttpServletResponse response, AuthenticationException e)
      throws IOException {
    if (request.getAttribute(ApiKeyFilter.KEY_CHECK_FAILED) != null) {
      problems.write(response, outage.problem(request), outage.retryAfter());
      return;
    }
    write(
        request,
        response,
        request.getAttribute(ApiKeyFilter.KEY_REJECTED) != null
            ? "The API key is malformed, unknown or revoked."
            : "This endpoint needs an API key: send 'Authorization: Bearer <key>' or"
                + " 'X-API-Key: <key>'.");
  }

  void write(HttpServletRequest request, HttpServletResponse response, String detail)
      throws IOException {
    response.setHeader(HttpHeaders.WWW_AUTHENTICATE, "Bearer realm=\"kwanta\"");
    problems.write(
        response,
        ProblemResponses.problem(
            HttpStatus.UNAUTHORIZED, ProblemTypes.UNAUTHORIZED, "Unauthorized", detail, request),
        null);
  }

  @Override
  public void handle(
      HttpServletRequest request, HttpServletResponse response, AccessDeniedException e)
      throws IOException {
    Authentication auth = SecurityContextHolder.getContext().getAuthentication();
    String role =
        auth != null && auth.getPrincipal() instanceof ApiKeyFilter.KeyPrincipal p
            ? p.role().code()
            : "none";
    problems.write(
        response,
        ProblemResponses.problem(
            HttpStatus.FORBIDDEN,
            ProblemTypes.FORBIDDEN,
            "Forbidden",
            "A key with role '"
                + role
                + "' may not "
                + request.getMethod()
                + " "
                + request.getRequestURI()
                + ".",
            request),
        null);
  }
}
