package org.kwanta.model.limits;

import java.util.Locale;
import java.util.Optional;

/**
 * Chemical treatment of a water/steam circuit (trade terms). On the wire a regime is written only
 * in its trade form, {@link #code()}: {@code AVT(R)}, {@code AVT(O)}, {@code OT}, {@code PT},
 * {@code CT}, and {@code MAKE_UP} for make-up water.
 */
public enum TreatmentRegime {
  /** All-volatile treatment, reducing (with a reducing agent; mixed-metallurgy systems). */
  AVT_R("AVT(R)"),
  /** All-volatile treatment, oxidizing (no reducing agent; all-ferrous systems). */
  AVT_O("AVT(O)"),
  /** Oxygenated treatment. */
  OT("OT"),
  /** Phosphate treatment (drum water). */
  PT("PT"),
  /** Caustic (sodium hydroxide) treatment (drum water). */
  CT("CT"),
  /** Make-up water after the demineralisation plant (no conditioning). */
  MAKE_UP("MAKE_UP");

  private final String code;

  TreatmentRegime(String code) {
    this.code = code;
  }

  /** The trade form, the only one written on the wire. */
  public String code() {
    return code;
  }

  /**
   * The regime a name denotes: the trade form ({@code AVT(O)}), case and surrounding blanks aside;
   * the constant's name ({@code AVT_O}, as stored before the trade form was the one form) and the
   * spelled-out {@code PHOSPHATE}, {@code CAUSTIC} are read too, so old records keep their limits.
   *
   * @return empty for null or an unknown name
   */
  public static Optional<TreatmentRegime> ofCode(String name) {
    if (name == null) {
      return Optional.empty();
    }
    String n = name.trim().toUpperCase(Locale.ROOT);
    for (TreatmentRegime r : values()) {
      if (r.code.equals(n) || r.name().equals(n)) {
        return Optional.of(r);
      }
    }
    return switch (n.replace("(", "").replace(")", "").replace("_", "").replace("-", "")) {
      case "AVTR" -> Optional.of(AVT_R);
      case "AVTO" -> Optional.of(AVT_O);
      case "PHOSPHATE" -> Optional.of(PT);
      case "CAUSTIC" -> Optional.of(CT);
      case "MAKEUP" -> Optional.of(MAKE_UP);
      default -> Optional.empty();
    };
  }

  /** The trade form of a name {@link #ofCode} knows; the name unchanged otherwise. */
  public static String canonical(String name) {
    return ofCode(name).map(TreatmentRegime::code).orElse(name);
  }
}
