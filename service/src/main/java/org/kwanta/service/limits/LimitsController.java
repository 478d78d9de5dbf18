package org.kwanta.service.limits;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.tags.Tag;
import java.time.Clock;
import java.time.Instant;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.kwanta.model.Parameter;
import org.kwanta.model.limits.LimitProfile;
import org.kwanta.service.audit.Actor;
import org.kwanta.service.security.Callers;
import org.kwanta.service.security.EffectiveTimes;
import org.kwanta.service.security.Role;
import org.kwanta.service.system.ProblemException;
import org.springframework.http.ResponseEntity;
import org.springframework.web.bind.annotation.DeleteMapping;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PutMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.RequestParam;
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
  private final Clock clock;

  LimitsController(Limits limits, Clock clock) {
    this.limits = limits;
    this.clock = clock;
  }

  /** A profile as shown in the API, with where it comes from and its version. */
  record ProfileResponse(
      String treatmentRegime,
      String cycleLocation,
      String origin,
      int version,
      Instant effectiveFrom,
      String direction,
      LimitDocument limits) {
    static ProfileResponse of(LimitProfile p, String origin, int version, Instant effectiveFrom) {
      return new ProfileResponse(
          p.key().regime().code(),
          p.key().location().name(),
          origin,
          version,
          effectiveFrom,
          p.direction().name(),
          LimitDocument.of(p));
    }

    static ProfileResponse of(Limits.Effective e) {
      return of(e.profile(), e.origin().name(), e.version(), e.effectiveFrom());
    }
  }

  /**
   * The shipped defaults: {@code profiles} apply to any plant type; {@code byPlantType} lists the
   * entries that apply only to plants of a type and win there over {@code profiles}; {@code
   * byCoolingWater} the entries that apply only to plants that declare that cooling water and win
   * there over every other entry.
   */
  record DefaultsResponse(
      int version,
      String notice,
      List<ProfileResponse> profiles,
      java.util.Map<String, List<ProfileResponse>> byPlantType,
      List<BandedResponse> byDrumPressure,
      java.util.Map<String, List<ProfileResponse>> byCoolingWater,
      List<LimitCatalog.Guidance> guidance) {}

  /**
   * An entry that applies only in a band of drum pressure ({@code aboveMPa} exclusive, {@code
   * upToMPa} inclusive, null: open), for the plant types named (empty: every type).
   */
  record BandedResponse(
      List<String> plantTypes, Double aboveMPa, Double upToMPa, ProfileResponse limits) {}

  @GetMapping("/limits/defaults")
  @Operation(summary = "The shipped example default limits (not the plant's limits)")
  DefaultsResponse defaults() {
    LimitCatalog catalog = limits.defaults();
    return new DefaultsResponse(
        catalog.version(),
        catalog.notice(),
        sorted(catalog.profiles(), catalog.version()),
        by(org.kwanta.model.limits.PlantType.values(), catalog::profiles, catalog.version()),
        catalog.banded().stream()
            .map(
                b ->
                    new BandedResponse(
                        b.plantTypes().stream().map(Enum::name).toList(),
                        b.band().above(),
                        b.band().upTo(),
                        ProfileResponse.of(b.profile(), "DEFAULT", catalog.version(), null)))
            .toList(),
        by(org.kwanta.model.diagnosis.CoolingWater.values(), catalog::profiles, catalog.version()),
        catalog.guidance());
  }

  /** The shipped profiles sorted by key, as the defaults response lists them. */
  private static List<ProfileResponse> sorted(
      java.util.Collection<LimitProfile> profiles, int version) {
    return profiles.stream()
        .sorted(java.util.Comparator.comparing((LimitProfile p) -> p.key().toString()))
        .map(p -> ProfileResponse.of(p, "DEFAULT", version, null))
        .toList();
  }

  /** The entries that apply only under each of some conditions (plant types, cooling waters). */
  private static <K extends Enum<K>> java.util.Map<String, List<ProfileResponse>> by(
      K[] conditions,
      java.util.function.Function<K, java.util.Collection<LimitProfile>> profiles,
      int version) {
    java.util.Map<String, List<ProfileResponse>> out = new java.util.LinkedHashMap<>();
    for (K condition : conditions) {
      List<ProfileResponse> list = sorted(profiles.apply(condition), version);
      if (!list.isEmpty()) {
        out.put(condition.name(), list);
      }
    }
    return out;
  }

  @GetMapping("/sample-points/{samplePoint}/limits")
  @Operation(summary = "The limits in force now at a sample point, per parameter (example: U2-CPD)")
  List<ProfileResponse> inForce(@PathVariable("samplePoint") String id) {
    return limits.inForce(WebLookups.point(limits, id)).stream().map(ProfileResponse::of).toList();
  }

  /** One period of the limits' history: from its start until the next, these limits or none. */
  record PeriodResponse(Instant from, ProfileResponse limits) {}

  /** One stored version of the plant's own limits; {@code limits} null: withdrawn. */
  record VersionResponse(
      int version,
      Instant effectiveFrom,
      LimitDocument limits,
      String reason,
      Instant recordedAt,
      String recordedBy) {}

  record HistoryResponse(
      String samplePoint,
      String parameter,
      List<PeriodResponse> periods,
      List<VersionResponse> versions) {}

  @GetMapping("/sample-points/{samplePoint}/limits/{parameter}/history")
  @Operation(
      summary = "The limits of a parameter at a sample point over time",
      description =
          "periods: which limits were in force from when (the plant's own version, or the"
              + " shipped defaults' version for the regime the point had then; from null ="
              + " always before); versions: every stored version of the plant's own limits.")
  HistoryResponse history(@PathVariable("samplePoint") String id, @PathVariable String parameter) {
    Limits.Point point = WebLookups.point(limits, id);
    Parameter p = WebLookups.parameter(parameter);
    return new HistoryResponse(
        point.id(),
        p.code(),
        limits.history(point, p).periods().stream()
            .map(
                x ->
                    new PeriodResponse(
                        x.from().equals(Instant.MIN) ? null : x.from(),
                        x.limits().map(ProfileResponse::of).orElse(null)))
            .toList(),
        limits.overrideVersions(point.id()).stream()
            .filter(v -> v.parameter().equals(p.code()))
            .map(
                v ->
                    new VersionResponse(
                        v.version(),
                        v.effectiveFrom(),
                        v.limits().orElse(null),
                        v.reason(),
                        v.recordedAt(),
                        v.recordedBy()))
            .toList());
  }

  @PutMapping("/sample-points/{samplePoint}/limits/{parameter}")
  @Operation(
      summary = "Set the plant's own limits for a parameter at a sample point (a new version)",
      description =
          "Body: the same form as a default entry (parameter, unit = the canonical unit,"
              + " normal, thresholds, deadband, persistence), each value with its source text."
              + " The new version is in force from effectiveFrom (default now); earlier versions"
              + " stay in force before it. A past effectiveFrom (more than a minute ago) needs an"
              + " admin key and a reason; a chemist key always gives a reason. Who set it is the"
              + " API key of the request.")
  ProfileResponse override(
      @PathVariable("samplePoint") String id,
      @PathVariable String parameter,
      @RequestBody LimitDocument body,
      @RequestParam(required = false) String effectiveFrom,
      @RequestParam(required = false) String reason) {
    Parameter p = WebLookups.parameter(parameter);
    if (body.parameter() != null && !body.parameter().equals(p.code())) {
      throw ProblemException.of(
          "Body parameter '" + body.parameter() + "' differs from the path's '" + p.code() + "'");
    }
    Instant from = effectiveFrom(effectiveFrom, reason);
    try {
      return ProfileResponse.of(
          limits.override(
              WebLookups.point(limits, id),
              p,
              body,
              from,
              EffectiveTimes.blankToNull(reason),
              Actor.currentId()));
    } catch (IllegalArgumentException e) {
      throw ProblemException.of(e.getMessage());
    }
  }

  @DeleteMapping("/sample-points/{samplePoint}/limits/{parameter}")
  @Operation(
      summary = "Withdraw the plant's own limits (the default applies again from then on)",
      description =
          "Adds a version that withdraws them from effectiveFrom (default now; a past time needs"
              + " an admin key and a reason); the earlier versions stay in force before it.")
  ResponseEntity<Map<String, Object>> remove(
      @PathVariable("samplePoint") String id,
      @PathVariable String parameter,
      @RequestParam(required = false) String effectiveFrom,
      @RequestParam(required = false) String reason) {
    Instant from = effectiveFrom(effectiveFrom, reason);
    Optional<Integer> version =
        limits.removeOverride(
            WebLookups.point(limits, id),
            WebLookups.parameter(parameter),
            from,
            EffectiveTimes.blankToNull(reason),
            Actor.currentId());
    Map<String, Object> body = new LinkedHashMap<>();
    body.put("removed", version.isPresent());
    version.ifPresent(v -> body.put("version", v));
    return ResponseEntity.ok(body);
  }

  /**
   * Past effective times are a correction of the record: admin keys only, with a reason. A chemist
   * key gives a reason for every change.
   */
  private Instant effectiveFrom(String value, String reason) {
    Instant now = clock.instant();
    if (Callers.role().orElse(null) == Role.CHEMIST && EffectiveTimes.blankToNull(reason) == null) {
      throw ProblemException.of(
          "A chemist key changes limits with a reason (query parameter reason)");
    }
    return EffectiveTimes.effectiveFrom(value, reason, now, "limits");
  }
}
