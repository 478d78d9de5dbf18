package org.kwanta.model;

import java.util.Arrays;
import java.util.EnumSet;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.stream.Collectors;

/**
 * The catalogue of measured parameters: the one list the engine, the limits and the service share.
 * Each parameter has its wire code, its canonical unit (a UCUM code: values in the engine, the
 * limits and the database are in it), the kind of quantity (which decides the units the service
 * converts from), the analyser that measures it, whether the evaluation engine and the limits use
 * it, and the bounds of a plausible value in the canonical unit.
 *
 * <p>Adding a parameter: one constant here; the limits' data and documentation if limits are set on
 * it; its tests. Conductivities and pH handed to the limits are at 25 °C.
 */
public enum Parameter {
  /** Specific (direct) conductivity. */
  SPECIFIC_CONDUCTIVITY(
      "uS/cm", Quantity.CONDUCTIVITY, Instrument.SPECIFIC_CONDUCTIVITY, true, true, 0, 20_000),
  /** Conductivity after a strong-acid (H-form) cation exchanger. */
  CATION_CONDUCTIVITY(
      "uS/cm", Quantity.CONDUCTIVITY, Instrument.CATION_CONDUCTIVITY, true, true, 0, 20_000),
  /** Cation conductivity after degassing (carbon dioxide removed). */
  DEGASSED_CATION_CONDUCTIVITY(
      "uS/cm",
      Quantity.CONDUCTIVITY,
      Instrument.DEGASSED_CATION_CONDUCTIVITY,
      true,
      true,
      0,
      20_000),
  /** pH as displayed by the analyser, at the sample temperature unless marked compensated. */
  PH("[pH]", Quantity.PH, Instrument.PH, true, true, 0, 14),
  /** Sodium. */
  SODIUM("ug/kg", Quantity.MASS_FRACTION, Instrument.SODIUM, true, true, 0, 1e7),
  /** Dissolved oxygen. */
  DISSOLVED_OXYGEN("ug/kg", Quantity.MASS_FRACTION, null, false, true, 0, 1e5),
  /** Silica as SiO2. */
  SILICA("ug/kg", Quantity.MASS_FRACTION, null, false, true, 0, 1e7),
  /** Chloride. */
  CHLORIDE("ug/kg", Quantity.MASS_FRACTION, null, false, true, 0, 1e7),
  /** Sulfate. */
  SULFATE("ug/kg", Quantity.MASS_FRACTION, null, false, true, 0, 1e7),
  /** Total iron. */
  IRON("ug/kg", Quantity.MASS_FRACTION, null, false, true, 0, 1e7),
  /** Total copper. */
  COPPER("ug/kg", Quantity.MASS_FRACTION, null, false, true, 0, 1e7),
  /** Dissolved iron (after filtration, as the lab method states); total iron is {@link #IRON}. */
  IRON_DISSOLVED("ug/kg", Quantity.MASS_FRACTION, null, false, false, 0, 1e7),
  /** Dissolved copper (after filtration); total copper is {@link #COPPER}. */
  COPPER_DISSOLVED("ug/kg", Quantity.MASS_FRACTION, null, false, false, 0, 1e7),
  /** Ammonia as NH3. */
  AMMONIA("ug/kg", Quantity.MASS_FRACTION, null, false, false, 0, 1e7),
  /** Amine (the treatment's amine; which one, the lab method says). */
  AMINE("ug/kg", Quantity.MASS_FRACTION, null, false, false, 0, 1e7),
  /** Reducing agent: hydrazine or carbohydrazide (which one, the lab method says). */
  REDUCING_AGENT("ug/kg", Quantity.MASS_FRACTION, null, false, false, 0, 1e7),
  /** Total organic carbon, as C. */
  TOC("ug/kg", Quantity.MASS_FRACTION, null, false, false, 0, 1e7),
  /** Acetate. */
  ACETATE("ug/kg", Quantity.MASS_FRACTION, null, false, false, 0, 1e7),
  /** Formate. */
  FORMATE("ug/kg", Quantity.MASS_FRACTION, null, false, false, 0, 1e7),
  /** Oxidation-reduction potential against the electrode's reference (the method says which). */
  ORP("mV", Quantity.POTENTIAL, null, false, false, -2000, 2000),
  /** Phosphate as PO4. */
  PHOSPHATE("ug/kg", Quantity.MASS_FRACTION, null, false, true, 0, 1e7),
  /** Sample temperature at the analysers (the evaluation compensates conductivities with it). */
  SAMPLE_TEMPERATURE("Cel", Quantity.TEMPERATURE, null, false, false, -10, 400),
  /**
   * Electrical load of the block (a process value from the historian), MW; negative while the block
   * draws its auxiliary power from the grid.
   */
  LOAD("MW", Quantity.POWER, null, false, false, -500, 5000),
  /**
   * Drum pressure, absolute (a process value from the historian), MPa. The evaluation of a
   * drum-water or saturated-steam sample point takes its recent value as the operating pressure
   * (saturation temperature by IAPWS-IF97). Gauge pressures are not accepted: UCUM has no gauge
   * unit, so a historian converts before sending.
   */
  DRUM_PRESSURE("MPa", Quantity.PRESSURE, null, false, false, 0, 30),
  /** Feedwater mass flow (a process value from the historian), kg/s. */
  FEEDWATER_FLOW("kg/s", Quantity.MASS_FLOW, null, false, false, -50, 5000),
  /** Main steam mass flow (a process value from the historian), kg/s. */
  STEAM_FLOW("kg/s", Quantity.MASS_FLOW, null, false, false, -50, 5000),
  /** Make-up water mass flow (a process value from the historian), kg/s. */
  MAKE_UP_FLOW("kg/s", Quantity.MASS_FLOW, null, false, false, -50, 5000),
  /**
   * The block's operating state as the historian reports it: a whole-number code ({@link
   * OperatingStateCode}: 1 in service, 2 start-up, 3 shut down, 4 layup wet, 5 layup dry). UCUM
   * writes a dimensionless code as an annotation, {@code {state}}.
   */
  OPERATING_STATE("{state}", Quantity.STATE_CODE, null, false, false, 1, 5);

  /** The kind of quantity: it decides the units a value may be sent in. */
  public enum Quantity {
    /** Electrical conductivity (canonical µS/cm). */
    CONDUCTIVITY,
    /** pH (dimensionless). */
    PH,
    /** Mass fraction (canonical µg/kg); volumetric units are never guessed into it. */
    MASS_FRACTION,
    /** Temperature (canonical °C). */
    TEMPERATURE,
    /** Electrode potential (canonical mV). */
    POTENTIAL,
    /** Electrical power (canonical MW). */
    POWER,
    /** Absolute pressure (canonical MPa). */
    PRESSURE,
    /** Mass flow (canonical kg/s). */
    MASS_FLOW,
    /** A whole-number state code (canonical {@code {state}}; see {@link OperatingStateCode}). */
    STATE_CODE
  }

  private static final Map<String, Parameter> BY_CODE =
      Arrays.stream(values()).collect(Collectors.toUnmodifiableMap(Parameter::code, p -> p));

  private static final Set<Parameter> ENGINE = EnumSet.noneOf(Parameter.class);
  private static final Set<Parameter> LIMITED = EnumSet.noneOf(Parameter.class);

  static {
    for (Parameter p : values()) {
      if (p.usedByEngine) {
        ENGINE.add(p);
      }
      if (p.usedByLimits) {
        LIMITED.add(p);
      }
    }
  }

  private final String unit;
  private final Quantity quantity;
  private final Instrument instrument;
  private final boolean usedByEngine;
  private final boolean usedByLimits;
  private final double min;
  private final double max;

  /** The code, made once: a new string per call was hashed anew by every map it keyed. */
  private final String code = name().toLowerCase(Locale.ROOT);

  Parameter(
      String unit,
      Quantity quantity,
      Instrument instrument,
      boolean usedByEngine,
      boolean usedByLimits,
      double min,
      double max) {
    this.unit = unit;
    this.quantity = quantity;
    this.instrument = instrument;
    this.usedByEngine = usedByEngine;
    this.usedByLimits = usedByLimits;
    this.min = min;
    this.max = max;
  }

  /** Stable lower snake case code used in the HTTP API, data files and metric labels. */
  public String code() {
    return code;
  }

  /** Canonical unit as a UCUM code. */
  public String unit() {
    return unit;
  }

  /** The unit as printed in messages for people: the UCUM code without its brackets. */
  public String symbol() {
    return unit.replace("[", "").replace("]", "");
  }

  /** The kind of quantity. */
  public Quantity quantity() {
    return quantity;
  }

  /** The analyser that produces it, when the evaluation judges that analyser. */
  public Optional<Instrument> instrument() {
    return Optional.ofNullable(instrument);
  }

  /** Whether the evaluation engine reads it (the sample temperature is read beside them). */
  public boolean usedByEngine() {
    return usedByEngine;
  }

  /** Whether limits may be set on it. */
  public boolean usedByLimits() {
    return usedByLimits;
  }

  /** Lowest plausible value, canonical unit. */
  public double min() {
    return min;
  }

  /** Highest plausible value, canonical unit. */
  public double max() {
    return max;
  }

  /**
   * True for the process values a historian reports (load, drum pressure, flows, operating state):
   * online readings only, never grab or lab results.
   */
  public boolean isProcessValue() {
    return quantity == Quantity.POWER
        || quantity == Quantity.PRESSURE
        || quantity == Quantity.MASS_FLOW
        || quantity == Quantity.STATE_CODE;
  }

  /** True for the three conductivities. */
  public boolean isConductivity() {
    return quantity == Quantity.CONDUCTIVITY;
  }

  /** The parameters the evaluation engine reads, in catalogue order. */
  public static Set<Parameter> engine() {
    return java.util.Collections.unmodifiableSet(ENGINE);
  }

  /** The parameters limits may be set on, in catalogue order. */
  public static Set<Parameter> limited() {
    return java.util.Collections.unmodifiableSet(LIMITED);
  }

  /** The parameter with this code, if any. */
  public static Optional<Parameter> byCode(String code) {
    return Optional.ofNullable(code == null ? null : BY_CODE.get(code));
  }

  /**
   * The parameter with this code.
   *
   * @throws IllegalArgumentException naming the code and the known codes when there is none
   */
  public static Parameter ofCode(String code) {
    return byCode(code)
        .orElseThrow(
            () ->
                new IllegalArgumentException(
                    "Unknown parameter '"
                        + code
                        + "'; known: "
                        + Arrays.stream(values()).map(Parameter::code).toList()));
  }

  /**
   * The parameter with this code that limits may be set on.
   *
   * @throws IllegalArgumentException naming the code and the codes limits take when there is none
   */
  public static Parameter limitedOfCode(String code) {
    return byCode(code)
        .filter(Parameter::usedByLimits)
        .orElseThrow(
            () ->
                new IllegalArgumentException(
                    "Unknown parameter '"
                        + code
                        + "'; known: "
                        + limited().stream().map(Parameter::code).toList()));
  }

  /** Every parameter's code, in catalogue order (a new array each call). */
  public static String[] codeArray() {
    return Arrays.stream(values()).map(Parameter::code).toArray(String[]::new);
  }

  /** Every parameter's code, comma separated, for messages. */
  public static String codes() {
    return String.join(", ", codeArray());
  }
}
