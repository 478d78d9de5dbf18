package org.kwanta.service.system;

import java.util.List;
import org.springframework.boot.jackson.autoconfigure.JsonMapperBuilderCustomizer;
import org.springframework.context.annotation.Bean;
import org.springframework.context.annotation.Configuration;
import org.springframework.context.annotation.Scope;
import tools.jackson.core.JsonGenerator;
import tools.jackson.core.StreamReadConstraints;
import tools.jackson.core.StreamReadFeature;
import tools.jackson.core.json.JsonFactory;
import tools.jackson.databind.SerializationContext;
import tools.jackson.databind.cfg.CoercionAction;
import tools.jackson.databind.cfg.CoercionInputShape;
import tools.jackson.databind.json.JsonMapper;
import tools.jackson.databind.module.SimpleModule;
import tools.jackson.databind.ser.std.StdSerializer;
import tools.jackson.databind.type.LogicalType;

/**
 * The application's JSON mapper with tighter parser limits than Jackson's defaults (strings of 20
 * million characters, nesting 500 deep): {@code kwanta.http.max-json-string-length} and {@code
 * max-json-nesting-depth}, numbers of at most 100 digits. Spring Boot's customizers ({@code
 * spring.jackson.*}, e.g. unknown fields rejected) still apply. Parsing fails with 400 past a
 * limit. Strict about types and repeated fields: {@link #strict}. JSON has no NaN or infinity: a
 * non-finite double is written as null ({@link #nonFiniteAsNull}), so no response ever carries the
 * string "NaN"; the field's documentation or a note beside it gives the reason.
 */
@Configuration(proxyBeanMethods = false)
class JsonConfiguration {

  @Bean
  @Scope("prototype")
  JsonMapper.Builder kwantaJsonMapperBuilder(
      List<JsonMapperBuilderCustomizer> customizers, HttpLimitsProperties limits) {
    JsonMapper.Builder builder =
        JsonMapper.builder(
            JsonFactory.builder().streamReadConstraints(streamReadConstraints(limits)).build());
    customizers.forEach(c -> c.customize(builder));
    return strict(builder).addModule(nonFiniteAsNull());
  }

  /** Writes NaN and ±infinity as JSON null (both {@code double} and {@code Double}). */
  static SimpleModule nonFiniteAsNull() {
    SimpleModule module = new SimpleModule("kwanta-non-finite-as-null");
    NonFiniteAsNull serializer = new NonFiniteAsNull();
    module.addSerializer(Double.class, serializer);
    module.addSerializer(double.class, serializer);
    return module;
  }

  /** A double, or null when it is not finite. */
  static final class NonFiniteAsNull extends StdSerializer<Double> {

    NonFiniteAsNull() {
      super(Double.class);
    }

    @Override
    public void serialize(Double value, JsonGenerator gen, SerializationContext context) {
      if (Double.isFinite(value)) {
        gen.writeNumber(value);
      } else {
        gen.writeNull();
      }
    }
  }

  /**
   * No lenient input: a repeated field is refused (it would silently replace the first), and a
   * number or boolean must be one in the JSON ({@code "value":"9.6"} and {@code "compensated":1}
   * are refused, not coerced). Each failure is a 400 naming the field.
   */
  static JsonMapper.Builder strict(JsonMapper.Builder builder) {
    return builder
        .enable(StreamReadFeature.STRICT_DUPLICATE_DETECTION)
        .withCoercionConfig(
            LogicalType.Float, c -> c.setCoercion(CoercionInputShape.String, CoercionAction.Fail))
        .withCoercionConfig(
            LogicalType.Integer,
            c ->
                c.setCoercion(CoercionInputShape.String, CoercionAction.Fail)
                    .setCoercion(CoercionInputShape.Float, CoercionAction.Fail))
        .withCoercionConfig(
            LogicalType.Boolean,
            c ->
                c.setCoercion(CoercionInputShape.String, CoercionAction.Fail)
                    .setCoercion(CoercionInputShape.Integer, CoercionAction.Fail));
  }

  static StreamReadConstraints streamReadConstraints(HttpLimitsProperties limits) {
    return StreamReadConstraints.builder()
        .maxStringLength(limits.maxJsonStringLength())
        .maxNestingDepth(limits.maxJsonNestingDepth())
        .maxNumberLength(100)
        .build();
  }
}
