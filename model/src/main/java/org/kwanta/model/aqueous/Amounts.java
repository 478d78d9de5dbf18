package org.kwanta.model.aqueous;

/**
 * Conversion between mass fractions (mg/kg, µg/kg of water) and molalities (mol/kg of water), each
 * component counted as the formula of {@link Component#countedAs()}.
 *
 * <p>Molar masses are sums of the IUPAC (CIAAW) standard atomic weights; for elements whose
 * standard atomic weight is an interval, the IUPAC conventional value is used: H 1.008, Li 6.94, B
 * 10.81, C 12.011, N 14.007, O 15.999, Na 22.98976928, P 30.973761998, S 32.06, Cl 35.45, K 39.0983
 * g/mol (values recalled from the IUPAC tables, not retrieved in this work).
 *
 * <p>Analyser readings per kg of solution are used as per kg of water: at cycle-chemistry levels
 * the difference is below 0.1 % (the project's reference notes §8.2).
 */
public final class Amounts {

  private Amounts() {}

  /** Standard atomic weight of H (conventional value), g/mol. */
  public static final double H = 1.008;

  /** Standard atomic weight of Li (conventional value), g/mol. */
  public static final double LI = 6.94;

  /** Standard atomic weight of B (conventional value), g/mol. */
  public static final double B = 10.81;

  /** Standard atomic weight of C (conventional value), g/mol. */
  public static final double C = 12.011;

  /** Standard atomic weight of N (conventional value), g/mol. */
  public static final double N = 14.007;

  /** Standard atomic weight of O (conventional value), g/mol. */
  public static final double O = 15.999;

  /** Standard atomic weight of Na, g/mol. */
  public static final double NA = 22.98976928;

  /** Standard atomic weight of P, g/mol. */
  public static final double P = 30.973761998;

  /** Standard atomic weight of S (conventional value), g/mol. */
  public static final double S = 32.06;

  /** Standard atomic weight of Cl (conventional value), g/mol. */
  public static final double CL = 35.45;

  /** Standard atomic weight of K, g/mol. */
  public static final double K = 39.0983;

  /** Molar mass of the formula a component is counted as, g/mol. */
  public static double molarMassGPerMol(Component component) {
    return component.molarMassGPerMol();
  }

  /** mg of the counted formula per kg of water → mol/kg. */
  public static double molalFromMilligramsPerKilogram(Component component, double mgPerKg) {
    return mgPerKg / (1000 * molarMassGPerMol(component));
  }

  /** mol/kg → mg of the counted formula per kg of water. */
  public static double milligramsPerKilogramFromMolal(Component component, double molPerKg) {
    return molPerKg * (1000 * molarMassGPerMol(component));
  }

  /** µg of the counted formula per kg of water → mol/kg. */
  public static double molalFromMicrogramsPerKilogram(Component component, double ugPerKg) {
    return ugPerKg / (1_000_000 * molarMassGPerMol(component));
  }

  /** mol/kg → µg of the counted formula per kg of water. */
  public static double microgramsPerKilogramFromMolal(Component component, double molPerKg) {
    return molPerKg * (1_000_000 * molarMassGPerMol(component));
  }
}
