package org.kwanta.service.limits;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.util.List;
import java.util.Map;
import org.kwanta.model.limits.LimitProfile;
import org.kwanta.model.limits.Parameter;
import org.kwanta.service.system.BadRequestException;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.DeleteMapping;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PutMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RestController;

@RestController
@RequestMapping("/api/v1")
@Tag(
    name = "Limits",
    description =
        "Normal ranges, action levels and shutdown limits. The shipped defaults are EXAMPLES"
            + " recalled from the IAPWS technical guidance documents (from memory — verify), not"
            + " the plant's limits: set the plant's own per sample point with PUT.")
class LimitsController {

  private final Limits limits;

  LimitsController(Limits limits) {
    this.limits = limits;
  }

  /** A profile as shown in the API, with where it comes from. */
  record ProfileResponse(
      String regime, String location, String origin, String direction, LimitDocument limits) {
    static ProfileResponse of(LimitProfile p, String origin) {
      return new ProfileResponse(
          p.key().regime().name(),
          p.key().location().name(),
          origin,
          p.direction().name(),
          LimitDocument.of(p));
    }
  }

  record DefaultsResponse(int version, String notice, List<ProfileResponse> profiles) {}

  @GetMapping("/limits/defaults")
  @Operation(summary = "The shipped example default limits (not the plant's limits)")
  DefaultsResponse defaults() {
    LimitCatalog catalog = limits.defaults();
    return new DefaultsResponse(
        catalog.version(),
        catalog.notice(),
        catalog.profiles().stream()
            .sorted(java.util.Comparator.comparing((LimitProfile p) -> p.key().toString()))
            .map(p -> ProfileResponse.of(p, "DEFAULT"))
            .toList());
  }

  @GetMapping("/sample-points/{id}/limits")
  @Operation(summary = "The limits in force at a sample point, per parameter (example: U2-CPD)")
  List<ProfileResponse> inForce(@PathVariable String id) {
    return limits.inForce(WebLookups.point(limits, id)).stream()
        .map(e -> ProfileResponse.of(e.profile(), e.origin().name()))
        .toList();
  }

  @PutMapping("/sample-points/{id}/limits/{parameter}")
  @Operation(
      summary = "Set the plant's own limits for a parameter at a sample point",
      description =
          "Body: the same form as a default entry (parameter, unit = the canonical unit,"
              + " normal, thresholds, deadband, persistence), each value with its source text.")
  ProfileResponse override(
      @PathVariable String id,
      @PathVariable String parameter,
      @RequestBody LimitDocument body,
      @org.springframework.web.bind.annotation.RequestHeader(
              value = "X-Changed-By",
              required = false,
              defaultValue = "api")
          String by) {
    Parameter p = WebLookups.parameter(parameter);
    if (body.parameter() != null && !body.parameter().equals(p.code())) {
      throw BadRequestException.of(
          "Body parameter '" + body.parameter() + "' differs from the path's '" + p.code() + "'");
    }
    try {
      return ProfileResponse.of(
          limits.override(WebLookups.point(limits, id), p, body, by), "OVERRIDE");
    } catch (IllegalArgumentException e) {
      throw BadRequestException.of(e.getMessage());
    }
  }

  @DeleteMapping("/sample-points/{id}/limits/{parameter}")
  @Operation(summary = "Remove the plant's own limits (the default applies again)")
  ResponseEntity<Map<String, Object>> remove(
      @PathVariable String id, @PathVariable String parameter) {
    boolean removed =
        limits.removeOverride(WebLookups.point(limits, id), WebLookups.parameter(parameter));
    return ResponseEntity.ok(Map.of("removed", removed));
  }
}
