package org.kwanta.model.evaluation;

/** A measured parameter at a sample point, with its unit and its analyser. */
public enum Parameter {
  /** Specific (direct) conductivity, µS/cm. */
  SPECIFIC_CONDUCTIVITY("uS/cm", Instrument.SPECIFIC_CONDUCTIVITY),
  /** Cation conductivity (after an H-form cation exchanger), µS/cm. */
  CATION_CONDUCTIVITY("uS/cm", Instrument.CATION_CONDUCTIVITY),
  /** Degassed cation conductivity, µS/cm. */
  DEGASSED_CATION_CONDUCTIVITY("uS/cm", Instrument.DEGASSED_CATION_CONDUCTIVITY),
  /** pH as displayed by the analyser, at the sample temperature unless marked compensated. */
  PH("pH", Instrument.PH),
  /** Sodium, µg/kg. */
  SODIUM("ug/kg", Instrument.SODIUM);

  private final String unit;
  private final Instrument instrument;

  Parameter(String unit, Instrument instrument) {
    this.unit = unit;
    this.instrument = instrument;
  }

  /** UCUM unit of the readings. */
  public String unit() {
    return unit;
  }

  /** The analyser that produces it. */
  public Instrument instrument() {
    return instrument;
  }

  /** True for the three conductivities. */
  public boolean isConductivity() {
    return this == SPECIFIC_CONDUCTIVITY
        || this == CATION_CONDUCTIVITY
        || this == DEGASSED_CATION_CONDUCTIVITY;
  }
}
