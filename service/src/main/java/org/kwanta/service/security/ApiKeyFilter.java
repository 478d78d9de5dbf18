package org.kwanta.service.security;

import jakarta.servlet.FilterChain;
import jakarta.servlet.ServletException;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import java.util.Optional;
import org.kwanta.service.system.DatabaseOutage;
import org.kwanta.service.system.ProblemResponses;
import org.springframework.http.HttpHeaders;
import org.springframework.security.authentication.UsernamePasswordAuthenticationToken;
import org.springframework.security.core.context.SecurityContext;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.web.filter.OncePerRequestFilter;

/**
 * Reads the key from {@code Authorization: Bearer <key>} or {@code X-API-Key: <key>}. No key: the
 * request goes on anonymously (open paths answer, the others 401). A key that is malformed,
 * unknown, wrong or revoked: 401 at once. The database unreachable: 503 with Retry-After, never a
 * 401 that would tell a historian its key is bad. Not a bean, so it runs only inside the security
 * chain.
 */
final class ApiKeyFilter extends OncePerRequestFilter {

  static final String API_KEY_HEADER = "X-API-Key";
  private static final String BEARER = "Bearer ";

  private final ApiKeys keys;
  private final ProblemResponses problems;
  private final ProblemEntryPoint entryPoint;
  private final DatabaseOutage outage;

  ApiKeyFilter(
      ApiKeys keys,
      ProblemResponses problems,
      ProblemEntryPoint entryPoint,
      DatabaseOutage outage) {
    this.keys = keys;
    this.problems = problems;
    this.entryPoint = entryPoint;
    this.outage = outage;
  }

  @Override
  protected void doFilterInternal(
      HttpServletRequest request, HttpServletResponse response, FilterChain chain)
      throws ServletException, IOException {
    String presented = presentedKey(request);
    if (presented == null) {
      chain.doFilter(request, response);
      return;
    }
    Optional<ApiKeys.ApiKey> key;
    try {
      key = keys.authenticate(presented);
    } catch (RuntimeException e) {
      if (!DatabaseOutage.isCause(e)) {
        throw e;
      }
      problems.write(response, outage.problem(request), outage.retryAfter());
      return;
    }
    if (key.isEmpty()) {
      entryPoint.write(request, response, "The API key is malformed, unknown or revoked.");
      return;
    }
    ApiKeys.ApiKey k = key.get();
    SecurityContext context = SecurityContextHolder.createEmptyContext();
    context.setAuthentication(
        UsernamePasswordAuthenticationToken.authenticated(
            new KeyPrincipal(k.id(), k.name(), k.role()), null, k.role().authorities()));
    SecurityContextHolder.setContext(context);
    try {
      chain.doFilter(request, response);
    } finally {
      SecurityContextHolder.clearContext();
    }
  }

  private static String presentedKey(HttpServletRequest request) {
    String authorization = request.getHeader(HttpHeaders.AUTHORIZATION);
    if (authorization != null && authorization.regionMatches(true, 0, BEARER, 0, BEARER.length())) {
      return authorization.substring(BEARER.length()).trim();
    }
    String header = request.getHeader(API_KEY_HEADER);
    return header == null || header.isBlank() ? null : header.trim();
  }

  /** The authenticated caller: a key, by id, name and role. */
  record KeyPrincipal(String id, String name, Role role) {
    @Override
    public String toString() {
      return "key " + id;
    }
  }
}
