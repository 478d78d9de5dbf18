package org.kwanta.service.operatingstate;

import org.springframework.boot.context.properties.ConfigurationProperties;

/**
 * Start-up settings ({@code kwanta.startup.*}).
 *
 * @param holdPoints the hold-point file (a resource location); empty: the shipped examples {@code
 *     classpath:startup/hold-points-v1.yaml}, recalled from IAPWS guidance (from memory — verify)
 */
@ConfigurationProperties("kwanta.startup")
public record StartupProperties(String holdPoints) {

  /** The shipped example file. */
  static final String SHIPPED = "classpath:startup/hold-points-v1.yaml";

  /** The file to read. */
  String location() {
    return holdPoints == null || holdPoints.isBlank() ? SHIPPED : holdPoints;
  }
}
