package org.kwanta.service.limits;

import java.io.IOException;
import java.io.InputStream;
import org.springframework.beans.factory.annotation.Value;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import org.springframework.core.io.ClassPathResource;

/** Loads the default limits at start; the file is chosen with {@code kwanta.limits.defaults}. */
@Configuration(proxyBeanMethods = false)
class DefaultLimitsConfiguration {

  /** The current version of the shipped defaults. */
  static final String DEFAULTS = "limits/defaults-v4.yaml";

  @Bean
  LimitCatalog defaultLimits(@Value("${kwanta.limits.defaults:" + DEFAULTS + "}") String resource)
      throws IOException {
    try (InputStream in = new ClassPathResource(resource).getInputStream()) {
      return LimitCatalog.read(in);
    }
  }
}
