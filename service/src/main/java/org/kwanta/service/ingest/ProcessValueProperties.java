package org.kwanta.service.ingest;

import java.time.Duration;
import org.springframework.boot.context.properties.ConfigurationProperties;

/**
 * How the evaluation uses the historian's process values ({@code kwanta.process.*}).
 *
 * @param drumPressureMaxAge how old the latest {@code drum_pressure} reading of a drum-water or
 *     saturated-steam sample point may be, before the evaluated time, for the pH at temperature to
 *     use it instead of the configured operating state (default 10 minutes, the same as {@code
 *     kwanta.ingest.max-age}; an engineering choice, no source)
 */
@ConfigurationProperties("kwanta.process")
public record ProcessValueProperties(Duration drumPressureMaxAge) {

  /** The default maximum age of a drum-pressure reading. */
  public static final Duration DEFAULT_DRUM_PRESSURE_MAX_AGE = Duration.ofMinutes(10);

  public ProcessValueProperties {
    if (drumPressureMaxAge == null) {
      drumPressureMaxAge = DEFAULT_DRUM_PRESSURE_MAX_AGE;
    }
    if (drumPressureMaxAge.isNegative()) {
      throw new IllegalArgumentException(
          "kwanta.process.drum-pressure-max-age " + drumPressureMaxAge + " is negative");
    }
  }
}
