package org.kwanta.model.conductivity;

import java.util.ArrayList;
import java.util.Collections;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;
import org.kwanta.model.aqueous.Component;
import org.kwanta.model.aqueous.Composition;
import org.kwanta.model.aqueous.Species;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.model.water.Water;
import org.kwanta.model.water.WaterState;

/**
 * The forward problem: the specific, cation and degassed cation conductivity a water of known
 * composition shows at a sample temperature (0–100 °C, 0.101325 MPa), with each ion's share. The
 * cation channel sees the water after a strong-acid cation exchanger in the H⁺ form (every cation
 * replaced by H⁺, hydroxide neutralised: the anions as their acids); the degassed cation channel
 * sees the same with the carbon dioxide removed completely (an ideal degasser). Solutions are those
 * of {@link SolutionModel} (charge balance with Davies activity coefficients, Debye–Hückel–Onsager
 * conductivities), so the channels are what {@code Evaluator} inverts.
 */
public final class ForwardConductivity {

  /** Largest number of cached models (one per temperature and alkalizer mix, a few kB each). */
  static final int CACHE_LIMIT = 512;

  private static final Map<Key, Model> MODELS = new ConcurrentHashMap<>();

  private ForwardConductivity() {}

  /**
   * One ion's share of a channel's conductivity.
   *
   * @param ion the ion
   * @param molality its molality, mol/kg
   * @param kappa its contribution, µS/cm at the channel's temperature (the shares add up to the
   *     channel's conductivity)
   */
  public record Contribution(Species ion, double molality, double kappa) {}

  /**
   * One channel.
   *
   * @param solution the solved water the channel sees (totals, pH, ionic strength, κ)
   * @param contributions each ion present, largest share first
   */
  public record Channel(Solution solution, List<Contribution> contributions) {

    /** Conductivity, µS/cm at the temperature. */
    public double kappa() {
      return solution.kappa();
    }
  }

  /**
   * The three channels at one temperature.
   *
   * @param temperatureK temperature, K
   * @param specific specific conductivity: the water itself
   * @param cation after the cation exchanger
   * @param degassedCation after the cation exchanger and an ideal degasser
   * @param molarIonicStrength molar ionic strength of the specific channel, mol/L (the
   *     conductivities follow the limiting law, {@link OnsagerCorrection#VALIDITY})
   */
  public record Channels(
      double temperatureK,
      Channel specific,
      Channel cation,
      Channel degassedCation,
      double molarIonicStrength) {}

  /**
   * The channels of a water at a temperature.
   *
   * @param solutes total amounts, mol/kg (alkalizer as the mix)
   * @param mix the alkalizer or mix {@link Solutes#alkalizer()} refers to
   * @param temperatureK sample temperature, K
   * @throws org.kwanta.model.OutOfValidityRangeException outside 0–100 °C
   */
  public static Channels of(Solutes solutes, AlkalizerMix mix, double temperatureK) {
    Model m = model(temperatureK, mix);
    Solutes acids = cationExchanged(solutes);
    Solutes degassed = acids.with(Solute.CARBON_DIOXIDE, 0);
    Solution sc = m.solution.solve(solutes);
    Solution cace = m.solution.solve(acids, sc);
    Solution dcace = degassed.equals(acids) ? cace : m.solution.solve(degassed, cace);
    Channel specific = m.channel(sc, mix);
    Channel cation = m.channel(cace, mix);
    Channel degassedCation = dcace == cace ? cation : m.channel(dcace, mix);
    return new Channels(
        temperatureK, specific, cation, degassedCation, m.molarIonicStrength(specific));
  }

  /**
   * The components the conductivity model knows: the alkalizers ({@link Component#isWeakBase()}),
   * sodium, chloride (strong-acid anions as chloride), sulfate, carbon dioxide and phosphate.
   */
  public static boolean isModelled(Component c) {
    return c.isWeakBase()
        || c == Component.SODIUM
        || c == Component.CHLORIDE
        || c == Component.SULFATE
        || c == Component.CARBON_DIOXIDE
        || c == Component.PHOSPHATE;
  }

  /**
   * A composition as the conductivity model's amounts.
   *
   * @param solutes the amounts, the alkalizers summed
   * @param mix the alkalizers' molar proportions (ammonia when there is none)
   */
  public record Input(Solutes solutes, AlkalizerMix mix) {

    /**
     * @throws IllegalArgumentException naming a component that is not {@link #isModelled}
     */
    public static Input of(Composition c) {
      Map<Component, Double> bases = new EnumMap<>(Component.class);
      double alkalizer = 0;
      for (Map.Entry<Component, Double> e : c.totals().entrySet()) {
        if (!isModelled(e.getKey())) {
          throw new IllegalArgumentException(e.getKey() + " is not in the conductivity model");
        }
        if (e.getKey().isWeakBase() && e.getValue() > 0) {
          bases.put(e.getKey(), e.getValue());
          alkalizer += e.getValue();
        }
      }
      AlkalizerMix mix = AlkalizerMix.AMMONIA;
      if (alkalizer > 0) {
        for (Map.Entry<Component, Double> e : bases.entrySet()) {
          e.setValue(e.getValue() / alkalizer);
        }
        if (bases.size() > 1) {
          // fractions that sum to 1 within rounding: give the last the remainder
          double rest = 1;
          Component last = null;
          for (Map.Entry<Component, Double> e : bases.entrySet()) {
            rest -= e.getValue();
            last = e.getKey();
          }
          bases.put(last, bases.get(last) + rest);
        }
        mix = new AlkalizerMix(bases);
      }
      Solutes s =
          new Solutes(
              alkalizer,
              c.molality(Component.SODIUM),
              c.molality(Component.CHLORIDE),
              c.molality(Component.SULFATE),
              c.molality(Component.CARBON_DIOXIDE),
              c.molality(Component.PHOSPHATE));
      return new Input(s, mix);
    }
  }

  /** The water after a strong-acid cation exchanger in the H⁺ form: the anions as their acids. */
  public static Solutes cationExchanged(Solutes s) {
    return new Solutes(0, 0, s.chloride(), s.sulfate(), s.carbonate(), s.phosphate());
  }

  private static Model model(double temperatureK, AlkalizerMix mix) {
    Key key = new Key(temperatureK, mix);
    Model m = MODELS.get(key);
    if (m != null) {
      return m;
    }
    Conductivity.TEMPERATURE_VALIDITY.check(temperatureK);
    WaterState w =
        Water.at(temperatureK, Water.ATMOSPHERIC_PRESSURE_PA, IonizationFormulation.R11_07);
    m = new Model(Conductivity.at(w), Equilibria.of(w), mix);
    if (MODELS.size() < CACHE_LIMIT) {
      MODELS.putIfAbsent(key, m);
    }
    return m;
  }

  private record Key(double temperatureK, AlkalizerMix mix) {}

  /** A solution model with what the shares need: the constants and conductivities. */
  private static final class Model {
    private final SolutionModel solution;
    private final IonConductivities ions;
    private final Equilibria equilibria;
    private final double dhA;
    private final double kw;

    Model(IonConductivities ions, Equilibria equilibria, AlkalizerMix mix) {
      this.solution = new SolutionModel(ions, equilibria, mix);
      this.ions = ions;
      this.equilibria = equilibria;
      this.dhA = ions.water().debyeHuckelA();
      this.kw = Math.pow(10, -ions.water().pKw());
    }

    /**
     * The ions of a solved water at its pH and ionic strength (the species fractions of {@link
     * SolutionModel}: Davies γ with γ₂ = γ₁⁴, γ₃ = γ₁⁹) and their shares of κ.
     */
    Channel channel(Solution s, AlkalizerMix mix) {
      double[] m = new double[Species.values().length];
      double g1 = Davies.gamma(dhA, 1, s.ionicStrength());
      double g2 = Math.pow(g1, 4);
      double g3 = Math.pow(g1, 9);
      double aH = Math.pow(10, -s.pH());
      Solutes t = s.solutes();
      m[Species.HYDROGEN_ION.ordinal()] = aH / g1;
      m[Species.HYDROXIDE.ordinal()] = kw / g1 / aH;
      for (Map.Entry<Component, Double> e : mix.molarFractions().entrySet()) {
        double ka = Math.pow(10, -equilibria.basePKa().get(e.getKey()));
        double alpha = aH / (aH + ka * g1);
        m[e.getKey().species().get(0).ordinal()] += t.alkalizer() * e.getValue() * alpha;
      }
      m[Species.SODIUM_ION.ordinal()] = t.sodium();
      m[Species.CHLORIDE_ION.ordinal()] = t.chloride();
      m[Species.SULFATE.ordinal()] = t.sulfate();
      if (t.carbonate() > 0) {
        double r1 = Math.pow(10, -equilibria.carbonicPK1()) / g1 / aH;
        double r2 =
            Math.pow(10, -equilibria.carbonicPK1() - equilibria.carbonicPK2()) / g2 / (aH * aH);
        double d = 1 + r1 + r2;
        m[Species.BICARBONATE.ordinal()] = t.carbonate() * r1 / d;
        m[Species.CARBONATE.ordinal()] = t.carbonate() * r2 / d;
      }
      if (t.phosphate() > 0) {
        double k1 = Math.pow(10, -equilibria.phosphoricPK1());
        double k2 = Math.pow(10, -equilibria.phosphoricPK2());
        double k3 = Math.pow(10, -equilibria.phosphoricPK3());
        double r1 = k1 / g1 / aH;
        double r2 = k1 * k2 / g2 / (aH * aH);
        double r3 = k1 * k2 * k3 / g3 / (aH * aH * aH);
        double d = 1 + r1 + r2 + r3;
        m[Species.DIHYDROGEN_PHOSPHATE.ordinal()] = t.phosphate() * r1 / d;
        m[Species.HYDROGEN_PHOSPHATE.ordinal()] = t.phosphate() * r2 / d;
        m[Species.PHOSPHATE.ordinal()] = t.phosphate() * r3 / d;
      }
      double rho = ions.water().densityKgPerM3();
      double sumMz2 = 0;
      Species[] all = Species.values();
      for (int i = 0; i < m.length; i++) {
        sumMz2 += m[i] * all[i].chargeNumber() * all[i].chargeNumber();
      }
      double sqrtI = Math.sqrt(0.5 * sumMz2 * rho / 1000);
      List<Contribution> shares = new ArrayList<>();
      for (int i = 0; i < m.length; i++) {
        if (m[i] > 0 && all[i].chargeNumber() != 0) {
          int z = Math.abs(all[i].chargeNumber());
          double l0 = ions.limiting(all[i]);
          double k =
              rho * m[i] * z * (l0 - (ions.onsagerB1() * l0 + ions.onsagerB2() / 2) * z * sqrtI);
          shares.add(new Contribution(all[i], m[i], k));
        }
      }
      shares.sort((a, b) -> Double.compare(b.kappa(), a.kappa()));
      return new Channel(s, Collections.unmodifiableList(shares));
    }

    double molarIonicStrength(Channel c) {
      double[] m = new double[Species.values().length];
      for (Contribution x : c.contributions()) {
        m[x.ion().ordinal()] = x.molality();
      }
      return ions.molarIonicStrength(m);
    }
  }
}
