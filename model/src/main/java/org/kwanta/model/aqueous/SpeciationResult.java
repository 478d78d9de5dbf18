package org.kwanta.model.aqueous;

import java.util.List;
import java.util.Optional;
import java.util.Set;
import org.kwanta.model.water.WaterState;

/**
 * The solved speciation of one composition at one water state. pH is on the molal activity scale:
 * pH = −log10 a(H⁺), a(H⁺) = γ(H⁺)·m(H⁺)/(1 mol/kg).
 *
 * @param water the water state used (T, p, density, pKw formulation, Debye–Hückel A and B)
 * @param ph pH at the temperature of {@code water}
 * @param pKw −log10 Kw used
 * @param neutralPh pKw/2, the pH where a(H⁺) = a(OH⁻)
 * @param phMinusNeutral {@code ph − neutralPh}
 * @param ionicStrengthMolPerKg ionic strength I = ½ Σ z² m, mol/kg
 * @param hydrogenIonMolality m(H⁺), mol/kg
 * @param hydroxideMolality m(OH⁻), mol/kg
 * @param species every species of every component present, in {@link Species} order
 * @param constants every equilibrium constant used (components present only)
 * @param activityModel the activity model used
 * @param constantSet name of the constant set used
 * @param sampleOrigin liquid sample or condensed steam
 * @param chargeBalanceRelativeResidual |Σ z m| / Σ |z| m at the solution
 * @param ionicStrengthIterations outer iterations on I
 * @param notices what the reader must see (extrapolated constants, activity-model range, condensed
 *     steam)
 * @param associations the ion pairs and polyborates carried, with their constants at the
 *     temperature (empty when none applies or the options turn them off)
 */
public record SpeciationResult(
    WaterState water,
    double ph,
    double pKw,
    double neutralPh,
    double phMinusNeutral,
    double ionicStrengthMolPerKg,
    double hydrogenIonMolality,
    double hydroxideMolality,
    List<SpeciesAmount> species,
    List<ConstantUsed> constants,
    ActivityModel activityModel,
    String constantSet,
    SampleOrigin sampleOrigin,
    double chargeBalanceRelativeResidual,
    int ionicStrengthIterations,
    Set<Notice> notices,
    List<AssociationUsed> associations) {

  public SpeciationResult {
    species = List.copyOf(species);
    constants = List.copyOf(constants);
    notices = Set.copyOf(notices);
    associations = List.copyOf(associations);
  }

  /** Temperature, K. */
  public double temperatureK() {
    return water.temperatureK();
  }

  /** Molality of a species, mol/kg (0 when its component is absent). */
  public double molality(Species s) {
    for (SpeciesAmount a : species) {
      if (a.species() == s) {
        return a.molalityMolPerKg();
      }
    }
    return 0;
  }

  /** Fraction of its component's total that a species holds (0 when the component is absent). */
  public double fraction(Species s) {
    for (SpeciesAmount a : species) {
      if (a.species() == s) {
        return a.fractionOfComponent();
      }
    }
    return 0;
  }

  /** The constant used for an equilibrium; empty when its component is absent. */
  public Optional<ConstantUsed> constant(Equilibrium e) {
    for (ConstantUsed c : constants) {
      if (c.equilibrium() == e) {
        return Optional.of(c);
      }
    }
    return Optional.empty();
  }

  /** True when any constant was extrapolated beyond its fit's stated range. */
  public boolean anyExtrapolated() {
    return notices.contains(Notice.EXTRAPOLATED_CONSTANT);
  }
}
