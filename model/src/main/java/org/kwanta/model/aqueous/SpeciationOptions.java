package org.kwanta.model.aqueous;

import java.util.Objects;

/**
 * Choices for one speciation.
 *
 * @param constants the equilibrium-constant set ({@link ConstantSets#DEFAULT} unless a study needs
 *     another)
 * @param activityModel the activity model ({@link ActivityModel#DAVIES} by default)
 * @param sampleOrigin liquid sample, or condensed steam at the stated temperature
 */
public record SpeciationOptions(
    ConstantSet constants, ActivityModel activityModel, SampleOrigin sampleOrigin) {

  public SpeciationOptions {
    Objects.requireNonNull(constants, "constants");
    Objects.requireNonNull(activityModel, "activityModel");
    Objects.requireNonNull(sampleOrigin, "sampleOrigin");
  }

  /** Default constants, Davies, liquid sample. */
  public static SpeciationOptions defaults() {
    return DEFAULTS;
  }

  private static final SpeciationOptions DEFAULTS =
      new SpeciationOptions(ConstantSets.DEFAULT, ActivityModel.DAVIES, SampleOrigin.LIQUID);

  /** A copy with another constant set. */
  public SpeciationOptions withConstants(ConstantSet set) {
    return new SpeciationOptions(set, activityModel, sampleOrigin);
  }

  /** A copy with another activity model. */
  public SpeciationOptions withActivityModel(ActivityModel model) {
    return new SpeciationOptions(constants, model, sampleOrigin);
  }

  /** A copy with another sample origin. */
  public SpeciationOptions withSampleOrigin(SampleOrigin origin) {
    return new SpeciationOptions(constants, activityModel, origin);
  }
}
