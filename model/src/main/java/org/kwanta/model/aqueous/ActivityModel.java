package org.kwanta.model.aqueous;

import org.kwanta.model.Reference;
import org.kwanta.model.Reference.Confidence;
import org.kwanta.model.ValidityRange;

/**
 * Single-ion activity coefficients of charged species on the molal scale; neutral species have γ =
 * 1 in both models. The Debye–Hückel A (and B) come from the water state at (T, p).
 */
public enum ActivityModel {
  /**
   * Davies (1962): log10 γ = −A z² [√I/(1 + √I) − 0.3·I]. The default; adequate to I ≈ 0.1 mol/kg
   * at 25 °C and more restricted at high temperature.
   */
  DAVIES(Davies.REFERENCE, Davies.IONIC_STRENGTH_LIMIT_MOL_PER_KG),
  /**
   * Extended Debye–Hückel with the B-dot term (Helgeson 1969): log10 γ = −A z² √I/(1 + å B √I) +
   * Ḃ·I, with å = 4 Å for every ion and Ḃ(T) interpolated linearly in the llnl.dat table. Valid
   * 25-300 °C (the span of the retrieved Ḃ values).
   */
  B_DOT(BDot.REFERENCE, BDot.IONIC_STRENGTH_LIMIT_MOL_PER_KG);

  private final Reference reference;
  private final double ionicStrengthLimit;

  ActivityModel(Reference reference, double ionicStrengthLimit) {
    this.reference = reference;
    this.ionicStrengthLimit = ionicStrengthLimit;
  }

  /** The source of the equation. */
  public Reference reference() {
    return reference;
  }

  /**
   * The ionic strength, mol/kg, up to which the model is customarily adequate (at 25 °C); results
   * above it carry a notice.
   */
  public double ionicStrengthLimitMolPerKg() {
    return ionicStrengthLimit;
  }

  /**
   * log10 γ of an ion of charge z.
   *
   * @param charge charge number z
   * @param ionicStrength I, mol/kg
   * @param debyeHuckelA A, kg^½ mol^−½
   * @param debyeHuckelB B, Å⁻¹ kg^½ mol^−½
   * @param temperatureK temperature, K (B-dot only)
   * @throws org.kwanta.model.OutOfValidityRangeException B-dot outside 25-300 °C
   */
  public double log10Gamma(
      int charge,
      double ionicStrength,
      double debyeHuckelA,
      double debyeHuckelB,
      double temperatureK) {
    if (charge == 0) {
      return 0;
    }
    return switch (this) {
      case DAVIES -> Davies.log10Gamma(charge, ionicStrength, debyeHuckelA);
      case B_DOT ->
          BDot.log10Gamma(charge, ionicStrength, debyeHuckelA, debyeHuckelB, temperatureK);
    };
  }

  /** Checks that the model can be used at a temperature. */
  void checkTemperature(double temperatureK) {
    if (this == B_DOT) {
      BDot.VALIDITY.check(temperatureK);
    }
  }

  /** Davies equation with the 0.3 coefficient. */
  static final class Davies {
    static final Reference REFERENCE =
        new Reference(
            "Davies 1962",
            "C. W. Davies, Ion Association, Butterworths, London, 1962 (the 0.3 coefficient;"
                + " bibliographic detail from memory)",
            Confidence.FROM_MEMORY);

    /** Customary adequacy limit at 25 °C, mol/kg (the project's reference notes §2.3). */
    static final double IONIC_STRENGTH_LIMIT_MOL_PER_KG = 0.1;

    private Davies() {}

    static double log10Gamma(int z, double i, double a) {
      double s = Math.sqrt(i);
      return -a * z * z * (s / (1 + s) - 0.3 * i);
    }
  }

  /** Extended Debye–Hückel with Ḃ (Helgeson 1969), å = 4 Å. */
  static final class BDot {
    static final Reference REFERENCE =
        new Reference(
            "Helgeson 1969 B-dot",
            "H. C. Helgeson, Am. J. Sci. 267 (1969) 729; Ḃ values from llnl.dat (-bdot) at 25,"
                + " 100, 150, 200, 250 and 300 °C; ion size å = 4 Å for every ion",
            Confidence.RETRIEVED);

    static final ValidityRange VALIDITY =
        new ValidityRange("temperature", 298.15, 573.15, "K", REFERENCE);

    static final double IONIC_STRENGTH_LIMIT_MOL_PER_KG = 0.1;

    /** Ion-size parameter å, Å (one value for all ions). */
    static final double ION_SIZE_ANGSTROM = 4.0;

    /** Temperatures of the llnl.dat Ḃ table used here, °C. */
    static final double[] BDOT_T_CELSIUS = {25, 100, 150, 200, 250, 300};

    /** llnl.dat -bdot values at {@link #BDOT_T_CELSIUS}, kg/mol. */
    static final double[] BDOT_KG_PER_MOL = {0.041, 0.046, 0.047, 0.047, 0.034, 0};

    private BDot() {}

    static double bdot(double temperatureK) {
      double t = VALIDITY.check(temperatureK) - 273.15;
      for (int k = 1; k < BDOT_T_CELSIUS.length; k++) {
        if (t <= BDOT_T_CELSIUS[k]) {
          double f = (t - BDOT_T_CELSIUS[k - 1]) / (BDOT_T_CELSIUS[k] - BDOT_T_CELSIUS[k - 1]);
          return BDOT_KG_PER_MOL[k - 1] + f * (BDOT_KG_PER_MOL[k] - BDOT_KG_PER_MOL[k - 1]);
        }
      }
      return BDOT_KG_PER_MOL[BDOT_KG_PER_MOL.length - 1]; // t == 300 °C exactly
    }

    static double log10Gamma(int z, double i, double a, double b, double temperatureK) {
      double s = Math.sqrt(i);
      return -a * z * z * s / (1 + ION_SIZE_ANGSTROM * b * s) + bdot(temperatureK) * i;
    }
  }
}
