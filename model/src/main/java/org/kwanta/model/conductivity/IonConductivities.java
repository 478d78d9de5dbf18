package org.kwanta.model.conductivity;

import org.kwanta.model.aqueous.Species;
import org.kwanta.model.water.WaterState;

/**
 * Ion conductivities at one temperature and density: λ°ᵢ(T), the Onsager coefficients and the sum κ
 * = Σ cᵢ|zᵢ|λᵢ. Build one with {@link Conductivity#at(WaterState)} and reuse it for every solution
 * at that temperature. Immutable.
 */
public final class IonConductivities {

  private static final Species[] IONS = Species.values();

  private final WaterState water;
  private final double viscosityPaS;
  private final double[] lambda0;
  private final double b1;
  private final double b2;

  /** κ of pure water at this state, µS/cm, computed once (see {@link #pureWater()}). */
  private final double pureWater;

  IonConductivities(WaterState water, double viscosityPaS, double viscosityRatio) {
    this.water = water;
    this.viscosityPaS = viscosityPaS;
    this.lambda0 = new double[IONS.length];
    for (Species ion : IONS) {
      lambda0[ion.ordinal()] = LimitingConductivity.at(ion, water.temperatureK(), viscosityRatio);
    }
    this.b1 = OnsagerCorrection.b1(water.relativePermittivity(), water.temperatureK());
    this.b2 =
        OnsagerCorrection.b2(water.relativePermittivity(), water.temperatureK(), viscosityPaS);
    this.pureWater = pureWaterKappa();
  }

  /** The water state these conductivities belong to. */
  public WaterState water() {
    return water;
  }

  /** Viscosity of water at this state, Pa·s (IAPWS R12-08). */
  public double viscosityPaS() {
    return viscosityPaS;
  }

  /** Limiting conductivity λ° of an ion per unit charge, S cm² mol⁻¹. */
  public double limiting(Species ion) {
    return lambda0[ion.ordinal()];
  }

  /** Onsager B1, (L/mol)^½. */
  public double onsagerB1() {
    return b1;
  }

  /** Onsager B2, S cm² mol⁻¹ (L/mol)^½. */
  public double onsagerB2() {
    return b2;
  }

  /**
   * Conductivity of a solution.
   *
   * @param molalities molality of each ion, mol/kg, indexed by {@link Species#ordinal()}; ions
   *     absent from a shorter array count as zero
   * @return κ, µS/cm
   */
  public double kappa(double[] molalities) {
    double rho = water.densityKgPerM3();
    double halfSumMz2 = 0;
    int n = Math.min(molalities.length, IONS.length);
    for (int i = 0; i < n; i++) {
      int z = IONS[i].chargeNumber();
      halfSumMz2 += molalities[i] * z * z;
    }
    double sqrtI = Math.sqrt(0.5 * halfSumMz2 * rho / 1000);
    double sum = 0;
    for (int i = 0; i < n; i++) {
      double m = molalities[i];
      if (m != 0) {
        int z = Math.abs(IONS[i].chargeNumber());
        double l0 = lambda0[i];
        sum += m * z * (l0 - (b1 * l0 + b2 / 2) * z * sqrtI);
      }
    }
    // κ(µS/cm) = 10³ Σ c|z|λ with c = m ρ/1000
    return rho * sum;
  }

  /**
   * Molar ionic strength, mol/L, of a set of molalities (for checks against {@link
   * OnsagerCorrection#VALIDITY}).
   */
  public double molarIonicStrength(double[] molalities) {
    double s = 0;
    int n = Math.min(molalities.length, IONS.length);
    for (int i = 0; i < n; i++) {
      int z = IONS[i].chargeNumber();
      s += molalities[i] * z * z;
    }
    return 0.5 * s * water.densityKgPerM3() / 1000;
  }

  /** Conductivity of pure water at this state, µS/cm (Kw from the water state, Davies γ). */
  public double pureWater() {
    return pureWater;
  }

  private double pureWaterKappa() {
    double kw = Math.pow(10, -water.pKw());
    double m = Math.sqrt(kw);
    for (int i = 0; i < 4; i++) {
      m = Math.sqrt(kw) / Davies.gamma(water.debyeHuckelA(), 1, m);
    }
    double[] mol = new double[IONS.length];
    mol[Species.HYDROGEN_ION.ordinal()] = m;
    mol[Species.HYDROXIDE.ordinal()] = m;
    return kappa(mol);
  }
}
