package org.kwanta.service.instruments;

import java.util.Set;
import org.kwanta.model.Parameter;

/** The calibrations and checks of online instruments that the log records, and what each is for. */
public enum CheckKind {
  /** Conductivity cell: cell constant checked against a reference (cell or solution). */
  CELL_CONSTANT_CHECK(
      Set.of(
          Parameter.SPECIFIC_CONDUCTIVITY,
          Parameter.CATION_CONDUCTIVITY,
          Parameter.DEGASSED_CATION_CONDUCTIVITY)),
  /** pH electrode: calibration in buffer solutions. */
  BUFFER_CALIBRATION(Set.of(Parameter.PH)),
  /** Sodium electrode: calibration in standard solutions. */
  SODIUM_CALIBRATION(Set.of(Parameter.SODIUM)),
  /** The cation exchange column ahead of a cation conductivity cell: resin changed. */
  CATION_RESIN_CHANGE(
      Set.of(Parameter.CATION_CONDUCTIVITY, Parameter.DEGASSED_CATION_CONDUCTIVITY)),
  /** Dissolved-oxygen sensor: zero and span. */
  DISSOLVED_OXYGEN_ZERO_SPAN(Set.of(Parameter.DISSOLVED_OXYGEN)),
  /**
   * The online value compared with a grab or lab result at the same point (logged by the service,
   * {@link GrabComparisons}); not a scheduled check, so never due.
   */
  GRAB_COMPARISON(GrabComparisons.TOLERANCES.keySet());

  private final Set<Parameter> parameters;

  CheckKind(Set<Parameter> parameters) {
    this.parameters = parameters;
  }

  /** Whether the check has an interval and is due (every kind but the grab comparison). */
  public boolean scheduled() {
    return this != GRAB_COMPARISON;
  }

  /** Whether this check is made on an instrument of the parameter. */
  public boolean appliesTo(Parameter p) {
    return parameters.contains(p);
  }
}
