package org.kwanta.service.ingest;

import java.time.Duration;
import java.time.Instant;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import org.kwanta.model.OutOfValidityRangeException;
import org.kwanta.model.evaluation.SamplePointConfig;
import org.kwanta.model.water.Water;

/**
 * Which operating state the pH at temperature of one evaluation used: the sample point's configured
 * one, or the one measured by a recent {@code drum_pressure} reading of the same sample point.
 *
 * <p>Only a drum-water or saturated-steam point takes the measured drum pressure: both are at
 * saturation at the drum pressure p, so the operating temperature is the saturation temperature
 * T_s(p) of IAPWS-IF97 region 4 (Eq. 31, {@link Water#saturationTemperatureK}); drum water is
 * evaluated as saturated liquid at T_s, saturated steam as its first condensate at p. Other points
 * (feedwater, condensate, main steam) are not at drum conditions and keep their configured state.
 *
 * @param source MEASURED or CONFIGURED
 * @param drumPressureMPa the drum pressure used, MPa absolute (null when configured)
 * @param measuredAt the time of that reading (null when configured)
 */
public record OperatingCondition(Source source, Double drumPressureMPa, Instant measuredAt) {

  /** Where the operating state of the pH at temperature came from. */
  public enum Source {
    /** A recent drum-pressure reading of the sample point. */
    MEASURED,
    /** The sample point's configuration (operating temperature and pressure). */
    CONFIGURED
  }

  /** The configured operating state. */
  static final OperatingCondition CONFIGURED =
      new OperatingCondition(Source.CONFIGURED, null, null);

  /** The cycle locations at drum conditions. */
  static final Set<String> AT_DRUM = Set.of("DRUM_WATER", "SATURATED_STEAM");

  /** The configuration to evaluate with and the condition it stands for. */
  record Choice(SamplePointConfig config, OperatingCondition condition) {}

  /**
   * The operating state for an evaluation at {@code t}.
   *
   * @param config the configured sample point
   * @param cycleLocation its cycle location
   * @param pressureMPa the latest drum-pressure reading at or before {@code t}, MPa (NaN: none)
   * @param pressureTime its time (null: none)
   * @param t the evaluated time
   * @param maxAge how old the reading may be
   * @param notes where a reading that was not used is explained
   */
  static Choice choose(
      SamplePointConfig config,
      String cycleLocation,
      double pressureMPa,
      Instant pressureTime,
      Instant t,
      Duration maxAge,
      List<String> notes) {
    if (pressureTime == null
        || cycleLocation == null
        || !AT_DRUM.contains(cycleLocation.toUpperCase(Locale.ROOT))) {
      return new Choice(config, CONFIGURED);
    }
    if (pressureTime.isBefore(t.minus(maxAge))) {
      notes.add(
          String.format(
              Locale.ROOT,
              "drum_pressure %s MPa at %s is older than %s: the configured operating state used",
              pressureMPa,
              pressureTime,
              maxAge));
      return new Choice(config, CONFIGURED);
    }
    double pressurePa = pressureMPa * 1e6;
    double saturationK;
    try {
      saturationK = Water.saturationTemperatureK(pressurePa);
    } catch (OutOfValidityRangeException e) {
      notes.add(
          "drum_pressure "
              + pressureMPa
              + " MPa at "
              + pressureTime
              + " has no saturation temperature ("
              + e.getMessage()
              + "): the configured operating state used");
      return new Choice(config, CONFIGURED);
    }
    SamplePointConfig measured =
        new SamplePointConfig(
            config.id(),
            config.regime(),
            config.alkalizer(),
            saturationK,
            // saturated liquid at T_s (NaN: saturation); a steam point condenses at p
            config.steam() ? pressurePa : Double.NaN,
            config.steam(),
            config.tolerances(),
            config.checks());
    return new Choice(measured, new OperatingCondition(Source.MEASURED, pressureMPa, pressureTime));
  }
}
