package org.kwanta.service.system;

import io.micrometer.core.instrument.MeterRegistry;
import org.springframework.boot.security.autoconfigure.web.servlet.SecurityFilterProperties;
import org.springframework.boot.web.servlet.FilterRegistrationBean;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;

/**
 * The input and load limits as servlet filters, after the key check (so a caller without a valid
 * key never holds an ingest permit).
 */
@Configuration(proxyBeanMethods = false)
class LimitsConfiguration {

  private static final int AFTER_SECURITY = SecurityFilterProperties.DEFAULT_FILTER_ORDER + 10;

  /**
   * Before the access rules: they and the actuator see {@code /actuator/x/} as {@code /actuator/x}.
   */
  @Bean
  FilterRegistrationBean<ActuatorTrailingSlashFilter> actuatorTrailingSlashFilter() {
    FilterRegistrationBean<ActuatorTrailingSlashFilter> registration =
        new FilterRegistrationBean<>(new ActuatorTrailingSlashFilter());
    registration.setOrder(SecurityFilterProperties.DEFAULT_FILTER_ORDER - 10);
    registration.addUrlPatterns("/actuator/*");
    return registration;
  }

  @Bean
  FilterRegistrationBean<RequestBodyLimitFilter> requestBodyLimitFilter(
      HttpLimitsProperties limits, ProblemResponses problems) {
    FilterRegistrationBean<RequestBodyLimitFilter> registration =
        new FilterRegistrationBean<>(new RequestBodyLimitFilter(limits, problems));
    registration.setOrder(AFTER_SECURITY);
    return registration;
  }

  @Bean
  FilterRegistrationBean<IngestConcurrencyFilter> ingestConcurrencyFilter(
      HttpLimitsProperties limits, ProblemResponses problems, MeterRegistry meters) {
    FilterRegistrationBean<IngestConcurrencyFilter> registration =
        new FilterRegistrationBean<>(new IngestConcurrencyFilter(limits, problems, meters));
    registration.setOrder(AFTER_SECURITY + 1);
    return registration;
  }
}
