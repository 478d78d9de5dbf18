package org.kwanta.model.limits;

import java.util.Arrays;

/**
 * A parameter that limits are set on, with its wire code and its canonical unit (UCUM). Values
 * handed to the {@link Classifier} are in the canonical unit; conductivities and pH are at 25 °C.
 */
public enum Parameter {
  /** Specific (direct) conductivity at 25 °C. */
  SPECIFIC_CONDUCTIVITY("specific_conductivity", "uS/cm"),
  /** Conductivity after a strong-acid cation exchanger, at 25 °C. */
  CATION_CONDUCTIVITY("cation_conductivity", "uS/cm"),
  /** Cation conductivity after degassing (carbon dioxide removed), at 25 °C. */
  DEGASSED_CATION_CONDUCTIVITY("degassed_cation_conductivity", "uS/cm"),
  /** pH at 25 °C. */
  PH("ph", "[pH]"),
  /** Sodium. */
  SODIUM("sodium", "ug/kg"),
  /** Dissolved oxygen. */
  DISSOLVED_OXYGEN("dissolved_oxygen", "ug/kg"),
  /** Silica as SiO2. */
  SILICA("silica", "ug/kg"),
  /** Chloride. */
  CHLORIDE("chloride", "ug/kg"),
  /** Sulfate. */
  SULFATE("sulfate", "ug/kg"),
  /** Total iron. */
  IRON("iron", "ug/kg"),
  /** Total copper. */
  COPPER("copper", "ug/kg"),
  /** Phosphate as PO4. */
  PHOSPHATE("phosphate", "ug/kg");

  private final String code;
  private final String unit;

  Parameter(String code, String unit) {
    this.code = code;
    this.unit = unit;
  }

  /** Stable lower-case code used in data files, the HTTP API and metric labels. */
  public String code() {
    return code;
  }

  /** Canonical unit as a UCUM code. */
  public String unit() {
    return unit;
  }

  /**
   * The parameter with this code.
   *
   * @throws IllegalArgumentException naming the code and the known codes when there is none
   */
  public static Parameter ofCode(String code) {
    for (Parameter p : values()) {
      if (p.code.equals(code)) {
        return p;
      }
    }
    throw new IllegalArgumentException(
        "Unknown parameter '"
            + code
            + "'; known: "
            + Arrays.stream(values()).map(Parameter::code).toList());
  }
}
