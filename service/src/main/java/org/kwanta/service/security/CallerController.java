package org.kwanta.service.security;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.tags.Tag;
import org.springframework.security.core.Authentication;
import org.springframework.security.core.context.SecurityContextHolder;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.RestController;

@RestController
@Tag(name = "Keys")
class CallerController {

  /**
   * The key of the request: its id, name (who holds it) and role, and what that role may do, so a
   * client shows "signed in as" and hides what the key cannot do (the rules still decide).
   *
   * @param acknowledge acknowledge excursions, record excursion events and their notes
   * @param setLimits set and withdraw a sample point's limits from now or later
   * @param backdateLimits set limits in force from a past time
   * @param ingest post readings
   * @param administer keys, plants, sample points
   */
  record CallerResponse(
      String keyId,
      String name,
      Role role,
      boolean read,
      boolean acknowledge,
      boolean setLimits,
      boolean backdateLimits,
      boolean ingest,
      boolean administer) {

    static CallerResponse of(ApiKeyFilter.KeyPrincipal p) {
      Role r = p.role();
      boolean chemist = r == Role.CHEMIST || r == Role.ADMIN;
      boolean admin = r == Role.ADMIN;
      return new CallerResponse(
          p.id(),
          p.name(),
          r,
          r != Role.INGEST,
          chemist,
          chemist,
          admin,
          r == Role.INGEST || admin,
          admin);
    }
  }

  @GetMapping("/api/v1/caller")
  @Operation(
      summary = "Who the key of this request is",
      description =
          "Key id, name and role, and what the role may do; any valid key (also an ingest key).")
  CallerResponse caller() {
    Authentication auth = SecurityContextHolder.getContext().getAuthentication();
    return CallerResponse.of((ApiKeyFilter.KeyPrincipal) auth.getPrincipal());
  }
}
