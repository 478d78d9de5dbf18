package org.kwanta.service.security;

import io.swagger.v3.oas.annotations.Operation;
import io.swagger.v3.oas.annotations.Parameter;
import io.swagger.v3.oas.annotations.tags.Tag;
import jakarta.validation.Valid;
import jakarta.validation.constraints.NotBlank;
import jakarta.validation.constraints.NotNull;
import jakarta.validation.constraints.Pattern;
import jakarta.validation.constraints.Size;
import java.time.Instant;
import java.util.List;
import java.util.Map;
import org.kwanta.service.system.ProblemException;
import org.kwanta.service.system.ProblemTypes;
import org.springframework.http.HttpStatus;
import org.springframework.web.bind.annotation.DeleteMapping;
import org.springframework.web.bind.annotation.GetMapping;
import org.springframework.web.bind.annotation.PathVariable;
import org.springframework.web.bind.annotation.PostMapping;
import org.springframework.web.bind.annotation.RequestBody;
import org.springframework.web.bind.annotation.RequestMapping;
import org.springframework.web.bind.annotation.ResponseStatus;
import org.springframework.web.bind.annotation.RestController;

@RestController
@RequestMapping("/api/v1/keys")
@Tag(name = "Keys", description = "API keys and their roles (admin only)")
class KeysController {

  private final ApiKeys keys;

  KeysController(ApiKeys keys) {
    this.keys = keys;
  }

  @PostMapping
  @ResponseStatus(HttpStatus.CREATED)
  @Operation(
      summary = "Create a key",
      description =
          "The response carries the key itself, once: only a salted hash is stored. Roles: ingest"
              + " (post readings), read (queries, calculations, metrics), chemist (read, acknowledge"
              + " excursions, set limits with a reason, read the audit log), admin (everything).")
  CreatedKeyResponse create(@Valid @RequestBody CreateKeyRequest request) {
    return CreatedKeyResponse.from(keys.create(request.name(), request.role()));
  }

  @GetMapping
  @Operation(summary = "List keys, without their secrets, revoked ones included")
  List<ApiKeys.ApiKey> list() {
    return keys.list();
  }

  @DeleteMapping("/{key}")
  @Operation(
      summary = "Revoke a key",
      description =
          "The key stops working at once; its record stays. The last active admin key cannot be"
              + " revoked (409).")
  ApiKeys.ApiKey revoke(
      @Parameter(
              description =
                  "The key's id (the id in the list of keys), never the key's secret itself")
          @PathVariable("key")
          String keyId) {
    try {
      return keys.revoke(keyId).orElseThrow(() -> notFound(keyId));
    } catch (ApiKeys.LastAdminKeyException e) {
      throw new ProblemException(
          HttpStatus.CONFLICT, ProblemTypes.CONFLICT, "Conflict", e.getMessage(), Map.of());
    }
  }

  private static ProblemException notFound(String keyId) {
    return ProblemException.notFound("key", keyId);
  }

  /**
   * @param name what the key is for, e.g. "unit 1 historian"
   * @param role ingest, read, chemist or admin
   */
  record CreateKeyRequest(
      @NotBlank @Size(max = 200) @Pattern(regexp = "[^\\p{Cntrl}]*") String name,
      @NotNull Role role) {}

  /**
   * @param key the key to send as {@code Authorization: Bearer <key>}; shown only in this response
   */
  record CreatedKeyResponse(String id, String name, Role role, Instant createdAt, String key) {
    static CreatedKeyResponse from(ApiKeys.Created created) {
      ApiKeys.ApiKey k = created.stored();
      return new CreatedKeyResponse(k.id(), k.name(), k.role(), k.createdAt(), created.key());
    }
  }
}
