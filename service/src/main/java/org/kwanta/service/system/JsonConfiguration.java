package org.kwanta.service.system;

import java.util.List;
import org.springframework.boot.jackson.autoconfigure.JsonMapperBuilderCustomizer;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import org.springframework.context.annotation.Scope;
import tools.jackson.core.StreamReadConstraints;
import tools.jackson.core.json.JsonFactory;
import tools.jackson.databind.json.JsonMapper;

/**
 * The application's JSON mapper with tighter parser limits than Jackson's defaults (strings of 20
 * million characters, nesting 500 deep): {@code kwanta.limits.max-json-string-length} and {@code
 * max-json-nesting-depth}, numbers of at most 100 digits. Spring Boot's customizers ({@code
 * spring.jackson.*}, e.g. unknown fields rejected) still apply. Parsing fails with 400 past a
 * limit.
 */
@Configuration(proxyBeanMethods = false)
class JsonConfiguration {

  @Bean
  @Scope("prototype")
  JsonMapper.Builder kwantaJsonMapperBuilder(
      List<JsonMapperBuilderCustomizer> customizers, LimitsProperties limits) {
    JsonMapper.Builder builder =
        JsonMapper.builder(
            JsonFactory.builder().streamReadConstraints(streamReadConstraints(limits)).build());
    customizers.forEach(c -> c.customize(builder));
    return builder;
  }

  static StreamReadConstraints streamReadConstraints(LimitsProperties limits) {
    return StreamReadConstraints.builder()
        .maxStringLength(limits.maxJsonStringLength())
        .maxNestingDepth(limits.maxJsonNestingDepth())
        .maxNumberLength(100)
        .build();
  }
}
