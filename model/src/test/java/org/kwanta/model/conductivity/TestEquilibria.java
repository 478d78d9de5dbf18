package org.kwanta.model.conductivity;

import java.util.EnumMap;
import java.util.Map;
import org.kwanta.model.aqueous.Component;
import org.kwanta.model.water.WaterState;

/**
 * Equilibrium constants at 25 °C for conductivity tests, from the database phreeqc.dat distributed
 * with PHREEQC 3 (retrieved; manual: Parkhurst &amp; Appelo 2013, USGS Techniques and Methods
 * 6-A43, citation from memory): pKa(NH₄⁺) 9.244 (Bates &amp; Pinching 1949), carbonic pK 6.352 /
 * 10.329 (Plummer &amp; Busenberg, Geochim. Cosmochim. Acta 46 (1982) 1011), phosphoric pK 2.168 /
 * 7.207 / 12.346; morpholinium 8.491 (Ridley et al. 2000) and ethanolammonium 9.498 (Bates and
 * Pinching, from memory).
 */
final class TestEquilibria {

  private TestEquilibria() {}

  static Equilibria at25(WaterState water) {
    Map<Component, Double> pka = new EnumMap<>(Component.class);
    pka.put(Component.AMMONIA, 9.244);
    pka.put(Component.MORPHOLINE, 8.491);
    pka.put(Component.ETHANOLAMINE, 9.498);
    return new Equilibria(water, pka, 6.352, 10.329, 2.168, 7.207, 12.346);
  }
}
