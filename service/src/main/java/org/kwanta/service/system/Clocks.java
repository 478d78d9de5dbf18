package org.kwanta.service.system;

import java.time.Clock;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import org.springframework.scheduling.annotation.EnableScheduling;

/** The service's clock (UTC) and scheduling. Tests may replace the clock. */
@Configuration(proxyBeanMethods = false)
@EnableScheduling
class Clocks {

  @Bean
  Clock clock() {
    return Clock.systemUTC();
  }
}
