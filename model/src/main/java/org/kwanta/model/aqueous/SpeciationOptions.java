package org.kwanta.model.aqueous;

import java.util.Collections;
import java.util.EnumSet;
import java.util.Objects;
import java.util.Set;

/**
 * Choices for one speciation.
 *
 * @param constants the equilibrium-constant set ({@link ConstantSets#DEFAULT} unless a study needs
 *     another)
 * @param activityModel the activity model ({@link ActivityModel#DAVIES} by default)
 * @param sampleOrigin liquid sample, or condensed steam at the stated temperature
 * @param associations the ion pairs and polyborates carried ({@link #DEFAULT_ASSOCIATIONS} by
 *     default: all but the low-confidence NaHPO₄⁻; an empty set gives the plain dissociation
 *     chains)
 */
public record SpeciationOptions(
    ConstantSet constants,
    ActivityModel activityModel,
    SampleOrigin sampleOrigin,
    Set<Association> associations) {

  public SpeciationOptions {
    Objects.requireNonNull(constants, "constants");
    Objects.requireNonNull(activityModel, "activityModel");
    Objects.requireNonNull(sampleOrigin, "sampleOrigin");
    Objects.requireNonNull(associations, "associations");
    associations =
        Collections.unmodifiableSet(
            associations.isEmpty()
                ? EnumSet.noneOf(Association.class)
                : EnumSet.copyOf(associations));
  }

  /** With the default associations carried ({@link #DEFAULT_ASSOCIATIONS}). */
  public SpeciationOptions(
      ConstantSet constants, ActivityModel activityModel, SampleOrigin sampleOrigin) {
    this(constants, activityModel, sampleOrigin, DEFAULT_ASSOCIATIONS);
  }

  /** Every association, the opt-in NaHPO₄⁻ included. */
  public static final Set<Association> ALL_ASSOCIATIONS =
      Collections.unmodifiableSet(EnumSet.allOf(Association.class));

  /**
   * The associations carried by default: all but {@link Association#SODIUM_HYDROGEN_PHOSPHATE},
   * whose only temperature function (Thermoddem) is an extrapolation from 25 °C data and implies
   * more pairing above about 150 °C than any measured 1:2 sodium pair ({@link SodiumIonPairs}).
   */
  public static final Set<Association> DEFAULT_ASSOCIATIONS =
      Collections.unmodifiableSet(
          EnumSet.complementOf(EnumSet.of(Association.SODIUM_HYDROGEN_PHOSPHATE)));

  /** Default constants, Davies, liquid sample. */
  public static SpeciationOptions defaults() {
    return DEFAULTS;
  }

  private static final SpeciationOptions DEFAULTS =
      new SpeciationOptions(ConstantSets.DEFAULT, ActivityModel.DAVIES, SampleOrigin.LIQUID);

  /** A copy with another constant set. */
  public SpeciationOptions withConstants(ConstantSet set) {
    return new SpeciationOptions(set, activityModel, sampleOrigin, associations);
  }

  /** A copy with another activity model. */
  public SpeciationOptions withActivityModel(ActivityModel model) {
    return new SpeciationOptions(constants, model, sampleOrigin, associations);
  }

  /** A copy with another sample origin. */
  public SpeciationOptions withSampleOrigin(SampleOrigin origin) {
    return new SpeciationOptions(constants, activityModel, origin, associations);
  }

  /**
   * A copy carrying only the given associations (an empty set turns ion pairs and polyborates off).
   */
  public SpeciationOptions withAssociations(Set<Association> carried) {
    return new SpeciationOptions(constants, activityModel, sampleOrigin, carried);
  }
}
