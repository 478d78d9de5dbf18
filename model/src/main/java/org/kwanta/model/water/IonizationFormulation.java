package org.kwanta.model.water;

/** Which IAPWS release gives the ionization constant of water. */
public enum IonizationFormulation {
  /** IAPWS R11-07 (Bandura &amp; Lvov 2006): the default. */
  R11_07,
  /** IAPWS R11-24, the 2024 revision (coefficients seen through two open implementations). */
  R11_24
}
