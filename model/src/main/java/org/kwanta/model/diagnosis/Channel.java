package org.kwanta.model.diagnosis;

/** The series the diagnosis follows at each point. */
enum Channel {
  SPECIFIC,
  CATION,
  DEGASSED,
  PH,
  PH_CALCULATED,
  SODIUM,
  /** Measured minus calculated pH. */
  PH_RESIDUAL
}
