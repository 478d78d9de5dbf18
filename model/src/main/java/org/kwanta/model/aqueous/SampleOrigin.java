package org.kwanta.model.aqueous;

/**
 * What the liquid being speciated is. The engine treats liquid water only; a steam sample is
 * speciated as its condensate, a liquid at the stated temperature, and the result says so.
 */
public enum SampleOrigin {
  /** A liquid sample (feedwater, condensate, drum water). */
  LIQUID,
  /**
   * A steam sample taken as condensed liquid at the stated temperature: the pH is that of the
   * condensate, not of the vapour.
   */
  CONDENSED_STEAM
}
