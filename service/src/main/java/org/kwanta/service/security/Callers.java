package org.kwanta.service.security;

import java.util.Optional;
import org.springframework.security.core.Authentication;
import org.springframework.security.core.context.SecurityContextHolder;

/** The role of the current request's key, for rules finer than the URL patterns. */
public final class Callers {

  private Callers() {}

  /** The role of the key of the current request, if a key was presented and accepted. */
  public static Optional<Role> role() {
    Authentication auth = SecurityContextHolder.getContext().getAuthentication();
    return auth != null && auth.getPrincipal() instanceof ApiKeyFilter.KeyPrincipal p
        ? Optional.of(p.role())
        : Optional.empty();
  }
}
