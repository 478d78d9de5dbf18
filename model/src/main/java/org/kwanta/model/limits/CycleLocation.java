package org.kwanta.model.limits;

/** Kind of sample point: its place in the water/steam cycle. */
public enum CycleLocation {
  /** Condensate pump discharge. */
  CONDENSATE,
  /** Final feedwater / economizer inlet. */
  FEEDWATER,
  /** Drum (evaporator) water. */
  DRUM_WATER,
  /** Saturated steam leaving a drum. */
  SATURATED_STEAM,
  /** Main (superheated) steam. */
  MAIN_STEAM,
  /** Hot reheat steam. */
  REHEAT_STEAM,
  /** Make-up water. */
  MAKE_UP
}
