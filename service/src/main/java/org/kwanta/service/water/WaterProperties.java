package org.kwanta.service.water;

import org.kwanta.model.water.IonizationFormulation;
import org.springframework.boot.context.properties.ConfigurationProperties;

/**
 * Service settings for water properties.
 *
 * @param ionization default formulation of the ionization constant when a request names none
 */
@ConfigurationProperties("kwanta.water")
public record WaterProperties(IonizationFormulation ionization) {

  public WaterProperties {
    if (ionization == null) {
      ionization = IonizationFormulation.R11_07;
    }
  }
}
