package org.kwanta.model;

/** What a consistency finding points at: an analyser, the sample conditioning, or the process. */
public enum Instrument {
  SPECIFIC_CONDUCTIVITY,
  CATION_CONDUCTIVITY,
  DEGASSED_CATION_CONDUCTIVITY,
  PH,
  SODIUM,
  /** Sample line: flow, cooling, temperature control. */
  SAMPLE_CONDITIONING,
  /** No instrument fault: the chemistry itself changed. */
  PROCESS
}
