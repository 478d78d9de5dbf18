package org.kwanta.service.system;

import io.swagger.v3.oas.models.OpenAPI;
import io.swagger.v3.oas.models.info.Info;
import io.swagger.v3.oas.models.info.License;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

@Configuration(proxyBeanMethods = false)
class OpenApiConfiguration {

  static final String DESCRIPTION =
      """
      Kwanta computes the chemistry of steam-cycle water at operating temperature from the 25 °C readings of \
      online analysers, checks the instruments against each other and classifies values against limits.

      **Results are advisory.** Default limits are examples from published guidance; the plant's own chemistry \
      guidelines, local codes and qualified practice govern. Every number carries its unit and the \
      formulation that produced it.

      Errors are `application/problem+json` (RFC 9457) with stable `type` URNs `urn:kwanta:problem:*`.""";

  @Bean
  OpenAPI kwantaOpenApi() {
    return new OpenAPI()
        .info(
            new Info()
                .title("Kwanta steam-cycle chemistry API")
                .version("v1")
                .description(DESCRIPTION)
                .license(new License().name("Apache-2.0")));
  }
}
