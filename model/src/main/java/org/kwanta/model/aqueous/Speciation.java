package org.kwanta.model.aqueous;

import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Objects;
import java.util.Set;
import org.kwanta.model.OutOfValidityRangeException;
import org.kwanta.model.Reference;
import org.kwanta.model.Reference.Confidence;
import org.kwanta.model.ValidityRange;
import org.kwanta.model.water.IonizationFormulation;
import org.kwanta.model.water.Phase;
import org.kwanta.model.water.Water;
import org.kwanta.model.water.WaterState;

/**
 * The speciation facade: total molalities and a liquid water state in, pH at temperature, species
 * and every constant used out. Molal scale throughout; pH = −log10 a(H⁺).
 *
 * <p>Scope: liquid water 273.15-623.15 K (0-350 °C). The equilibrium fits are published to 250-300
 * °C; a fit evaluated beyond its stated range is marked extrapolated in the result, which is the
 * only extrapolation the engine performs.
 */
public final class Speciation {

  /** Temperature of the "pH at 25 °C" of a report, K. */
  public static final double REFERENCE_TEMPERATURE_K = 298.15;

  /**
   * Temperature range of the engine, K: liquid water to 623.15 K (the upper limit of IAPWS-IF97
   * region 1), over which the fits are evaluated or, beyond their stated ranges, flagged. The limit
   * is Kwanta's (the equilibrium-constant fits end at 250-300 °C); IF97 itself continues into
   * region 3.
   */
  public static final ValidityRange TEMPERATURE_RANGE =
      new ValidityRange(
          "temperature",
          273.15,
          623.15,
          "K",
          new Reference(
              "Kwanta speciation scope (liquid to 350 °C)",
              "The speciation engine's scope, Kwanta's limit: liquid water 273.15-623.15 K (the"
                  + " range of IAPWS-IF97 region 1, R7-97(2012)); equilibrium-constant fits are"
                  + " published to 250-300 °C and flagged as extrapolated beyond",
              Confidence.VERIFIED_BY_CHECK_TABLE));

  private Speciation() {}

  /** {@link #solve(Composition, WaterState, SpeciationOptions)} with default options. */
  public static SpeciationResult solve(Composition composition, WaterState water) {
    return solve(composition, water, SpeciationOptions.defaults());
  }

  /**
   * Solves the charge balance for a composition at a liquid water state.
   *
   * @param composition total molalities, mol/kg
   * @param water liquid water at (T, p): pKw, density, Debye–Hückel A and B
   * @param options constant set, activity model, sample origin
   * @return the speciation
   * @throws org.kwanta.model.OutOfValidityRangeException temperature outside 273.15-623.15 K (or
   *     outside 298.15-573.15 K with the B-dot model)
   * @throws IllegalArgumentException the water state is not liquid (IF97 region 1); speciate a
   *     steam sample as its condensate with {@link SampleOrigin#CONDENSED_STEAM}
   * @throws org.kwanta.model.NoConvergenceException never within the documented ranges (tests show
   *     it); carries the residual
   */
  public static SpeciationResult solve(
      Composition composition, WaterState water, SpeciationOptions options) {
    return solveFrom(composition, water, options, Double.NaN, 0);
  }

  /**
   * {@link #solve(Composition, WaterState, SpeciationOptions)} started from the pH and ionic
   * strength of a nearby solution, typically the same sample with slightly different totals at the
   * same water state. The start only sets where the search begins (the bracket is verified and the
   * ionic-strength iteration runs to the same tolerance), so the result agrees with the plain solve
   * within the solver tolerances; only {@link SpeciationResult#ionicStrengthIterations()} may
   * differ.
   *
   * @param near a result to start from (any water state; a distant one only costs iterations)
   * @throws org.kwanta.model.OutOfValidityRangeException as the plain solve
   * @throws IllegalArgumentException as the plain solve
   */
  public static SpeciationResult solve(
      Composition composition, WaterState water, SpeciationOptions options, SpeciationResult near) {
    Objects.requireNonNull(near, "near");
    return solveFrom(composition, water, options, -near.ph(), near.ionicStrengthMolPerKg());
  }

  /**
   * pH at temperature and ionic strength only: the same validation, constants and solver as {@link
   * #solve(Composition, WaterState, SpeciationOptions)}, without building the species list,
   * constants list and notices. For callers that need the pH of many compositions (e.g. a pH band
   * from perturbed totals); check the full result when the extrapolation notices matter.
   *
   * @throws org.kwanta.model.OutOfValidityRangeException as the plain solve
   * @throws IllegalArgumentException as the plain solve
   */
  public static PhSolution ph(
      Composition composition, WaterState water, SpeciationOptions options) {
    return phFrom(composition, water, options, Double.NaN, 0);
  }

  /**
   * {@link #ph(Composition, WaterState, SpeciationOptions)} started from a nearby solution (see
   * {@link #solve(Composition, WaterState, SpeciationOptions, SpeciationResult)}); agrees with the
   * plain solve within the solver tolerances.
   */
  public static PhSolution ph(
      Composition composition, WaterState water, SpeciationOptions options, PhSolution near) {
    Objects.requireNonNull(near, "near");
    return phFrom(composition, water, options, -near.ph(), near.ionicStrengthMolPerKg());
  }

  private static PhSolution phFrom(
      Composition composition,
      WaterState water,
      SpeciationOptions options,
      double startX,
      double startI) {
    double t = checkInputs(composition, water, options);
    ConstantsAtState k =
        ConstantsAtState.of(options.constants(), t, water.pKw(), composition.totals().keySet());
    ChargeBalanceSolver.Solution s =
        new ChargeBalanceSolver(
                composition.totals(),
                k.kaByEquilibrium(),
                carried(k, options),
                water,
                options.activityModel())
            .solve(startX, startI);
    checkIonicStrength(s.ionicStrength(), options);
    return new PhSolution(-s.log10ActivityH(), s.ionicStrength());
  }

  /**
   * The ionic strength of the whole solution, enforced: each total may lie within {@link
   * Composition#TOTAL_MOLALITY_RANGE} while their sum does not, so the limit of the activity model
   * is checked on the solved ionic strength.
   *
   * @throws OutOfValidityRangeException above the activity model's limit
   */
  static void checkIonicStrength(double ionicStrength, SpeciationOptions options) {
    double limit = options.activityModel().ionicStrengthLimitMolPerKg();
    if (ionicStrength > limit) {
      throw new OutOfValidityRangeException(
          new ValidityRange("ionic strength", 0, limit, "mol/kg", IONIC_STRENGTH_SOURCE),
          ionicStrength);
    }
  }

  /** Where the ionic-strength limit comes from. */
  static final Reference IONIC_STRENGTH_SOURCE =
      new Reference(
          "activity model limit (total ionic strength)",
          "Davies and B-dot equations customarily taken as adequate to I ≈ 0.1 mol/kg (common"
              + " practice); the limit is Kwanta's, enforced on the total ionic strength of the"
              + " solution",
          Confidence.RETRIEVED);

  static double checkInputs(Composition composition, WaterState water, SpeciationOptions options) {
    Objects.requireNonNull(composition, "composition");
    Objects.requireNonNull(water, "water");
    Objects.requireNonNull(options, "options");
    double t = TEMPERATURE_RANGE.check(water.temperatureK());
    if (water.phase() != Phase.LIQUID_REGION_1) {
      throw new IllegalArgumentException(
          "speciation needs liquid water; the state at "
              + t
              + " K and "
              + water.pressurePa()
              + " Pa is "
              + water.phase()
              + ". Speciate a steam sample as its condensate (liquid state at the stated"
              + " temperature) with SampleOrigin.CONDENSED_STEAM");
    }
    options.activityModel().checkTemperature(t);
    return t;
  }

  private static SpeciationResult solveFrom(
      Composition composition,
      WaterState water,
      SpeciationOptions options,
      double startX,
      double startI) {
    double t = checkInputs(composition, water, options);
    double pKw = water.pKw();
    ConstantsAtState k =
        ConstantsAtState.of(options.constants(), t, pKw, composition.totals().keySet());
    List<ConstantUsed> used = k.used;
    boolean extrapolated = k.extrapolated;

    ChargeBalanceSolver solver =
        new ChargeBalanceSolver(
            composition.totals(),
            k.kaByEquilibrium(),
            carried(k, options),
            water,
            options.activityModel());
    ChargeBalanceSolver.Solution s = solver.solve(startX, startI);
    double residual =
        Math.abs(solver.chargeBalance(s.log10ActivityH())) / solver.chargeScale(s.log10ActivityH());

    double ph = -s.log10ActivityH();
    double neutral = pKw / 2;
    double gammaH = s.gamma()[1];
    double mH = Math.pow(10, s.log10ActivityH()) / gammaH;
    double mOH = solver.kw() / (Math.pow(10, s.log10ActivityH()) * gammaH);

    Set<Notice> notices = EnumSet.noneOf(Notice.class);
    if (extrapolated) {
      notices.add(Notice.EXTRAPOLATED_CONSTANT);
    }
    List<AssociationUsed> associations = new ArrayList<>();
    for (AssociationUsed a : k.associations) {
      if (options.associations().contains(a.association())) {
        associations.add(a);
        if (a.extrapolated()) {
          notices.add(Notice.EXTRAPOLATED_ASSOCIATION_CONSTANT);
        }
      }
    }
    checkIonicStrength(s.ionicStrength(), options);
    if (options.sampleOrigin() == SampleOrigin.CONDENSED_STEAM) {
      notices.add(Notice.CONDENSED_LIQUID_AT_STATED_TEMPERATURE);
    }
    return new SpeciationResult(
        water,
        ph,
        pKw,
        neutral,
        ph - neutral,
        s.ionicStrength(),
        mH,
        mOH,
        solver.species(s),
        used,
        options.activityModel(),
        options.constants().id(),
        options.sampleOrigin(),
        residual,
        s.iterations(),
        notices,
        associations);
  }

  /**
   * The association constants a speciation carries: those that apply to the components and are
   * chosen in the options; 0 for the others.
   */
  static double[] carried(ConstantsAtState k, SpeciationOptions options) {
    double[] all = k.associationK();
    if (options.associations().size() == all.length) {
      return all;
    }
    double[] chosen = new double[all.length];
    for (Association a : options.associations()) {
      chosen[a.ordinal()] = all[a.ordinal()];
    }
    return chosen;
  }

  /**
   * The same composition at 298.15 K and 0.101325 MPa with IAPWS R11-07 pKw: the species molalities
   * and pH a 25 °C reading is compared with.
   */
  public static SpeciationResult solveAt25Celsius(
      Composition composition, SpeciationOptions options) {
    return solve(composition, water25(IonizationFormulation.R11_07), options);
  }

  /**
   * pH at temperature over every distinct constant set of {@link ConstantSets#all()} (the default
   * included). Sets that choose the same fits as an earlier set for the components present are
   * evaluated once.
   */
  public static PhBand band(Composition composition, WaterState water, SpeciationOptions options) {
    double t = checkInputs(composition, water, options);
    double startX = Double.NaN;
    double startI = 0;
    List<List<Fit>> seen = new ArrayList<>();
    List<PhBand.Member> members = new ArrayList<>();
    double min = Double.POSITIVE_INFINITY;
    double max = Double.NEGATIVE_INFINITY;
    String minSet = "";
    String maxSet = "";
    for (ConstantSet set : ConstantSets.all()) {
      List<Fit> selection = new ArrayList<>();
      for (Component c : composition.totals().keySet()) {
        for (Equilibrium e : c.equilibria()) {
          selection.add(set.fitAt(e, t));
        }
      }
      if (seen.contains(selection)) {
        continue;
      }
      seen.add(selection);
      // pH only, each set started from the first (default) set's solution: the same root as a
      // full solve within the solver tolerances.
      ConstantsAtState k = ConstantsAtState.of(set, t, water.pKw(), composition.totals().keySet());
      ChargeBalanceSolver.Solution s =
          new ChargeBalanceSolver(
                  composition.totals(),
                  k.kaByEquilibrium(),
                  carried(k, options),
                  water,
                  options.activityModel())
              .solve(startX, startI);
      if (Double.isNaN(startX)) {
        startX = s.log10ActivityH();
        startI = s.ionicStrength();
      }
      double ph = -s.log10ActivityH();
      members.add(new PhBand.Member(set.id(), ph, k.extrapolated));
      if (ph < min) {
        min = ph;
        minSet = set.id();
      }
      if (ph > max) {
        max = ph;
        maxSet = set.id();
      }
    }
    return new PhBand(min, minSet, max, maxSet, members);
  }

  /**
   * The speciation at temperature, the 25 °C speciation of the same water (298.15 K, 0.101325 MPa,
   * the same pKw formulation), the pH band over alternative constant sets and the itemised
   * uncertainty of the pH at temperature: (a) and (d) do not apply to given totals at a given
   * state; (b) is the exact band; (c) the estimated or extrapolated constants.
   */
  public static SpeciationReport report(
      Composition composition, WaterState water, SpeciationOptions options) {
    SpeciationResult atT = solve(composition, water, options);
    SpeciationResult at25 = solve(composition, water25(water.ionization()), options);
    PhBand band = band(composition, water, options);
    PhSolution central = new PhSolution(atT.ph(), atT.ionicStrengthMolPerKg());
    PhUncertainty uncertainty =
        PhUncertainty.combine(
            atT.ph(),
            List.of(
                PhUncertainty.Part.notApplicable(
                    PhUncertainty.Kind.INSTRUMENT_TOLERANCES,
                    "the totals are given, not inferred from instrument readings"),
                PhUncertainties.constantSetSpread(band, atT.ph(), options.constants().id()),
                PhUncertainties.estimatedConstants(composition, water, options, central),
                PhUncertainty.Part.notApplicable(
                    PhUncertainty.Kind.OPERATING_CONDITIONS,
                    "the temperature and pressure are given exactly")));
    return new SpeciationReport(atT, at25, band, uncertainty);
  }

  private static WaterState water25(IonizationFormulation ionization) {
    return Water.at(REFERENCE_TEMPERATURE_K, Water.ATMOSPHERIC_PRESSURE_PA, ionization);
  }
}
