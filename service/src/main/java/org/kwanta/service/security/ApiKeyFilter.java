package org.kwanta.service.security;

import jakarta.servlet.FilterChain;
import jakarta.servlet.ServletException;
import jakarta.servlet.http.HttpServletRequest;
import jakarta.servlet.http.HttpServletResponse;
import java.io.IOException;
import java.util.Optional;
import org.kwanta.service.audit.Actor;
import org.kwanta.service.system.DatabaseOutage;
import org.springframework.http.HttpHeaders;
import org.springframework.security.authentication.UsernamePasswordAuthenticationToken;
import org.springframework.security.core.context.SecurityContext;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.web.filter.OncePerRequestFilter;

/**
 * Reads the key from {@code Authorization: Bearer <key>} or {@code X-API-Key: <key>}. No valid key:
 * the request goes on anonymously, so open paths (health, API docs) answer whatever header a probe
 * sends, and the others get 401 from {@link ProblemEntryPoint}, which says why the key was refused.
 * When the database is unreachable the key cannot be checked: those requests get 503 with
 * Retry-After, never a 401 that would tell a historian its key is bad. Not a bean, so it runs only
 * inside the security chain.
 */
final class ApiKeyFilter extends OncePerRequestFilter {

  static final String API_KEY_HEADER = "X-API-Key";

  /** Request attribute: a key was presented and is malformed, unknown, wrong or revoked. */
  static final String KEY_REJECTED = ApiKeyFilter.class.getName() + ".rejected";

  /** Request attribute: the key could not be checked because the database is unreachable. */
  static final String KEY_CHECK_FAILED = ApiKeyFilter.class.getName() + ".checkFailed";

  private static final String BEARER = "Bearer ";

  private final ApiKeys keys;

  ApiKeyFilter(ApiKeys keys) {
    this.keys = keys;
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
      request.setAttribute(KEY_CHECK_FAILED, Boolean.TRUE);
      key = Optional.empty();
    }
    if (key.isEmpty()) {
      request.setAttribute(KEY_REJECTED, Boolean.TRUE);
      chain.doFilter(request, response); // as anonymous: open paths answer, others 401 or 503
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
  record KeyPrincipal(String id, String name, Role role) implements Actor {
    @Override
    public String keyId() {
      return id;
    }

    @Override
    public String keyName() {
      return name;
    }

    @Override
    public String toString() {
      return "key " + id;
    }
  }
}
