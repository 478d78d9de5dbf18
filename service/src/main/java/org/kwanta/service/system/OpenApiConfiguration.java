package org.kwanta.service.system;

import io.swagger.v3.oas.models.Components;
import io.swagger.v3.oas.models.OpenAPI;
import io.swagger.v3.oas.models.Operation;
import io.swagger.v3.oas.models.info.Info;
import io.swagger.v3.oas.models.info.License;
import io.swagger.v3.oas.models.media.Content;
import io.swagger.v3.oas.models.media.IntegerSchema;
import io.swagger.v3.oas.models.media.MediaType;
import io.swagger.v3.oas.models.media.ObjectSchema;
import io.swagger.v3.oas.models.media.Schema;
import io.swagger.v3.oas.models.media.StringSchema;
import io.swagger.v3.oas.models.responses.ApiResponse;
import io.swagger.v3.oas.models.responses.ApiResponses;
import io.swagger.v3.oas.models.security.SecurityRequirement;
import io.swagger.v3.oas.models.security.SecurityScheme;
import java.util.LinkedHashMap;
import java.util.Map;
import org.springdoc.core.customizers.OpenApiCustomizer;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/**
 * The OpenAPI document: the API key as an HTTP bearer scheme (so "try it out" can authenticate),
 * required by every operation under {@code /api/}, and the problem-detail error responses as
 * reusable components that those operations reference.
 */
@Configuration(proxyBeanMethods = false)
class OpenApiConfiguration {

  static final String DESCRIPTION =
      """
      Kwanta computes the chemistry of steam-cycle water at operating temperature from the 25 °C readings of \
      online analysers, checks the instruments against each other and classifies values against limits.

      **Results are advisory.** Default limits are examples from published guidance; the plant's own chemistry \
      guidelines, local codes and qualified practice govern. Every number carries its unit and the \
      formulation that produced it.

      Everything under `/api/` needs an API key, sent as `Authorization: Bearer <key>` (or `X-API-Key`).

      Errors are `application/problem+json` (RFC 9457) with stable `type` URNs `urn:kwanta:problem:*`.""";

  /** The name of the security scheme in the document. */
  static final String API_KEY = "API key";

  /** The problem schema's name in the components. */
  static final String PROBLEM = "Problem";

  /** Error responses every operation under /api/ may give: status, component name, description. */
  static final Map<String, String[]> COMMON =
      ordered(
          "400",
          "BadRequest",
          "Malformed or invalid request (`bad-request`, `invalid-readings`)",
          "401",
          "Unauthorized",
          "No API key, or an unknown or revoked one (`unauthorized`)",
          "403",
          "Forbidden",
          "The key's role does not allow the request (`forbidden`)",
          "404",
          "NotFound",
          "Unknown path or resource (`not-found`)",
          "406",
          "NotAcceptable",
          "No representation matches `Accept` (`not-acceptable`)",
          "422",
          "Unprocessable",
          "Input outside a formulation's validity range, or a backfill reaching too many new"
              + " days (`out-of-validity-range`, `too-many-new-days`, `no-convergence`)",
          "503",
          "Unavailable",
          "Too many ingest requests at once, or the database unreachable; retry after"
              + " `Retry-After` (`service-unavailable`, `database-unavailable`)");

  /** Error responses of operations that take a request body. */
  static final Map<String, String[]> WITH_BODY =
      ordered(
          "413",
          "PayloadTooLarge",
          "Body or batch larger than allowed (`payload-too-large`)",
          "415",
          "UnsupportedMediaType",
          "Wrong `Content-Type` (`unsupported-media-type`)");

  @Bean
  OpenAPI kwantaOpenApi() {
    Components components =
        new Components()
            .addSecuritySchemes(
                API_KEY,
                new SecurityScheme()
                    .type(SecurityScheme.Type.HTTP)
                    .scheme("bearer")
                    .description(
                        "A Kwanta API key (roles ingest, read, admin), sent as `Authorization:"
                            + " Bearer <key>`"))
            .addSchemas(PROBLEM, problemSchema());
    Map<String, String[]> all = new LinkedHashMap<>(COMMON);
    all.putAll(WITH_BODY);
    all.values()
        .forEach(
            r ->
                components.addResponses(
                    r[0],
                    new ApiResponse()
                        .description(r[1])
                        .content(
                            new Content()
                                .addMediaType(
                                    "application/problem+json",
                                    new MediaType()
                                        .schema(
                                            new Schema<>()
                                                .$ref("#/components/schemas/" + PROBLEM))))));
    return new OpenAPI()
        .info(
            new Info()
                .title("Kwanta steam-cycle chemistry API")
                .version("v1")
                .description(DESCRIPTION)
                .license(new License().name("Apache-2.0")))
        .components(components);
  }

  /** Adds the API key requirement and the error responses to every operation under /api/. */
  @Bean
  OpenApiCustomizer apiKeyAndProblemResponses() {
    return api -> {
      if (api.getPaths() == null) {
        return;
      }
      api.getPaths()
          .forEach(
              (path, item) -> {
                if (!path.startsWith("/api/")) {
                  return;
                }
                for (Operation op : item.readOperations()) {
                  op.setSecurity(
                      new java.util.ArrayList<>(
                          java.util.List.of(new SecurityRequirement().addList(API_KEY))));
                  if (op.getResponses() == null) {
                    op.setResponses(new ApiResponses());
                  }
                  reference(op.getResponses(), COMMON);
                  if (op.getRequestBody() != null) {
                    reference(op.getResponses(), WITH_BODY);
                  }
                }
              });
    };
  }

  private static void reference(ApiResponses responses, Map<String, String[]> which) {
    which.forEach(
        (status, r) ->
            responses.addApiResponse(
                status, new ApiResponse().$ref("#/components/responses/" + r[0])));
  }

  private static Schema<?> problemSchema() {
    return new ObjectSchema()
        .description("RFC 9457 problem details")
        .addProperty("type", new StringSchema().example("urn:kwanta:problem:not-found"))
        .addProperty("title", new StringSchema().example("Not found"))
        .addProperty("status", new IntegerSchema().example(404))
        .addProperty("detail", new StringSchema().example("No plant with id 'nowhere'"))
        .addProperty("instance", new StringSchema().example("/api/v1/plants/nowhere"));
  }

  /** status, name, description, status, name, description... as status -> {name, description}. */
  private static Map<String, String[]> ordered(String... triples) {
    Map<String, String[]> out = new LinkedHashMap<>();
    for (int i = 0; i < triples.length; i += 3) {
      out.put(triples[i], new String[] {triples[i + 1], triples[i + 2]});
    }
    return out;
  }
}
