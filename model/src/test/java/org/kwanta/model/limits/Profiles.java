package org.kwanta.model.limits;

import java.time.Duration;
import java.util.List;
import java.util.OptionalDouble;
import org.kwanta.model.Parameter;

/**
 * Example profiles for the tests. The numbers are the IAPWS cation-conductivity action levels as
 * recalled (normal &lt; 0.2, AL1 &gt; 0.2, AL2 &gt; 0.35, AL3 &gt; 0.65 µS/cm; drum water pH at 25
 * °C &lt; 8.0 immediate shutdown): from memory — verify. The tests check the state machine, not the
 * numbers.
 */
final class Profiles {

  static final String FROM_MEMORY = "IAPWS TGD3-10/TGD5-13 as recalled (from memory — verify)";
  static final String ENGINEERING = "engineering choice (common practice, no source)";

  private Profiles() {}

  static LimitProfile cationConductivity(
      CycleLocation location, double deadband, Duration persistence) {
    return new LimitProfile(
        new LimitKey(TreatmentRegime.AVT_O, location, Parameter.CATION_CONDUCTIVITY),
        new NormalRange(OptionalDouble.empty(), OptionalDouble.of(0.2), FROM_MEMORY),
        List.of(
            new Threshold(Level.AL1, Side.HIGH, 0.2, FROM_MEMORY),
            new Threshold(Level.AL2, Side.HIGH, 0.35, FROM_MEMORY),
            new Threshold(Level.AL3, Side.HIGH, 0.65, FROM_MEMORY)),
        deadband,
        ENGINEERING,
        persistence,
        ENGINEERING);
  }

  static LimitProfile drumPh(Duration persistence) {
    return new LimitProfile(
        new LimitKey(TreatmentRegime.AVT_O, CycleLocation.DRUM_WATER, Parameter.PH),
        new NormalRange(OptionalDouble.of(9.0), OptionalDouble.of(9.7), FROM_MEMORY),
        List.of(new Threshold(Level.SHUTDOWN, Side.LOW, 8.0, FROM_MEMORY)),
        0.05,
        ENGINEERING,
        persistence,
        ENGINEERING);
  }
}
