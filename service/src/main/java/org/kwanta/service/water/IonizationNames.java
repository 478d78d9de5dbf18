package org.kwanta.service.water;

import java.util.Locale;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.service.system.ProblemException;

/** The API names of the pKw formulations: as accepted in requests and as shown in results. */
public final class IonizationNames {

  private IonizationNames() {}

  /**
   * The formulation a request names ({@code R11-07} or {@code R11-24}, case and separator free).
   *
   * @param name the name given, may be null or blank
   * @param fallback the formulation when no name is given
   * @throws ProblemException an unknown name
   */
  public static IonizationFormulation parse(String name, IonizationFormulation fallback) {
    if (name == null || name.isBlank()) {
      return fallback;
    }
    return switch (name.trim().toUpperCase(Locale.ROOT).replace('-', '_')) {
      case "R11_07" -> IonizationFormulation.R11_07;
      case "R11_24" -> IonizationFormulation.R11_24;
      default ->
          throw ProblemException.of("ionization must be R11-07 or R11-24, not '" + name + "'");
    };
  }

  /** The release id shown in results, e.g. {@code IAPWS R11-07}. */
  public static String label(IonizationFormulation f) {
    return switch (f) {
      case R11_07 -> "IAPWS R11-07";
      case R11_24 -> "IAPWS R11-24";
    };
  }
}
