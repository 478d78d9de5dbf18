package org.kwanta.service.audit;

import java.util.Optional;
import org.springframework.security.core.Authentication;
import org.springframework.security.core.context.SecurityContextHolder;

/**
 * Who makes a change: the API key of the request (its id and name). Changes made by the service
 * itself (start-up bootstrap, declaration files) have no actor and are recorded as {@link #SYSTEM}.
 */
public interface Actor {

  /** The id recorded for changes without a request: start-up and configuration files. */
  String SYSTEM = "system";

  /** The key id. */
  String keyId();

  /** The key's name, as given when it was created. */
  String keyName();

  /** The authenticated caller of the current request, if any. */
  static Optional<Actor> current() {
    Authentication auth = SecurityContextHolder.getContext().getAuthentication();
    return auth != null && auth.getPrincipal() instanceof Actor a
        ? Optional.of(a)
        : Optional.empty();
  }

  /** The current caller's key id, or {@link #SYSTEM}. */
  static String currentId() {
    return current().map(Actor::keyId).orElse(SYSTEM);
  }
}
